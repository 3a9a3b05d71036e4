/**
 * The Flesch readability formulas, from counts of words, sentences and
 * syllables. Flesch Reading Ease (Flesch 1948): higher is easier, about 0–100
 * for ordinary prose. Flesch–Kincaid Grade Level (Kincaid et al. 1975): a US
 * school grade.
 */

/** FRE = 206.835 − 1.015 × (words ÷ sentences) − 84.6 × (syllables ÷ words); null without words or sentences. */
export function fleschReadingEase(words: number, sentences: number, syllables: number): number | null {
  if (words <= 0 || sentences <= 0) return null;
  return 206.835 - 1.015 * (words / sentences) - 84.6 * (syllables / words);
}

/** FKGL = 0.39 × (words ÷ sentences) + 11.8 × (syllables ÷ words) − 15.59; null without words or sentences. */
export function fleschKincaidGrade(words: number, sentences: number, syllables: number): number | null {
  if (words <= 0 || sentences <= 0) return null;
  return 0.39 * (words / sentences) + 11.8 * (syllables / words) - 15.59;
}

/**
 * A histogram of positive lengths: bins of `width` from 1 up to `max`
 * (1–width, width+1–2·width, …, the last regular bin ending at `max`), then
 * one open bin for lengths above `max` (`to` null). Zero lengths are skipped.
 */
export function lengthHistogram(lengths: ArrayLike<number>, width: number, max: number): { from: number; to: number | null; count: number }[] {
  const regular = Math.max(1, Math.ceil(max / width));
  const counts = new Array<number>(regular + 1).fill(0);
  for (let i = 0; i < lengths.length; i++) {
    const n = lengths[i]!;
    if (n <= 0) continue;
    counts[n > max ? regular : Math.floor((n - 1) / width)]!++;
  }
  return counts.map((count, k) => ({
    from: k < regular ? k * width + 1 : max + 1,
    to: k < regular ? Math.min(max, (k + 1) * width) : null,
    count,
  }));
}

/** The value at quantile q (0..1) of sorted numbers, by the nearest-rank method; null when empty. */
export function nearestRank(sorted: ArrayLike<number>, q: number): number | null {
  if (sorted.length === 0) return null;
  const rank = Math.max(1, Math.ceil(q * sorted.length));
  return sorted[Math.min(sorted.length, rank) - 1]!;
}
