/**
 * Sliding windows and equal segments over a sequence of n items (word
 * positions), as half-open [start, end) ranges.
 */

/**
 * Start offsets of windows of `width` items taken every `step` items. Windows
 * start at 0, step, 2·step, … while they fit; when the last one stops short
 * of the end, one more window is aligned to the end, so every item is covered.
 * A sequence no longer than `width` is a single window [0, n).
 */
export function windowStarts(n: number, width: number, step: number): number[] {
  if (n <= 0) return [];
  if (n <= width) return [0];
  const starts: number[] = [];
  let s = 0;
  for (; s + width <= n; s += step) starts.push(s);
  const last = starts[starts.length - 1]!;
  if (last + width < n) starts.push(n - width);
  return starts;
}

/** [start, end) of S equal segments of n items: segment k holds ⌊kn/S⌋ … ⌊(k+1)n/S⌋ − 1. */
export function equalSegments(n: number, s: number): [number, number][] {
  const out: [number, number][] = [];
  for (let k = 0; k < s; k++) out.push([Math.floor((k * n) / s), Math.floor(((k + 1) * n) / s)]);
  return out;
}

/** Cumulative sums: out[i] = Σ values[0..i−1], so the sum over [a, b) is out[b] − out[a]. */
export function prefixSums(values: ArrayLike<number>): Float64Array {
  const out = new Float64Array(values.length + 1);
  for (let i = 0; i < values.length; i++) out[i + 1] = out[i]! + values[i]!;
  return out;
}

/** Mean and population standard deviation of some numbers; null for none. */
export function meanAndSd(values: ArrayLike<number>): { mean: number; sd: number } | null {
  const n = values.length;
  if (n === 0) return null;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i]!;
  const mean = sum / n;
  let sq = 0;
  for (let i = 0; i < n; i++) sq += (values[i]! - mean) ** 2;
  return { mean, sd: Math.sqrt(sq / n) };
}

/**
 * The [start, end) token ranges a measure reports on: each chapter, or S equal
 * segments of the whole text (S capped at the number of tokens, at least 1).
 */
export function positionRanges(
  chapters: readonly { firstToken: number; tokenCount: number }[],
  total: number,
  by: 'chapter' | 'segment',
  segments: number,
): [number, number][] {
  if (by === 'chapter') return chapters.map((c) => [c.firstToken, c.firstToken + c.tokenCount]);
  return equalSegments(total, Math.max(1, Math.min(segments, total)));
}

/** Index of the range in sorted, contiguous `ranges` that holds position p (binary search); -1 when none does. */
export function rangeOf(ranges: readonly [number, number][], p: number): number {
  let lo = 0;
  let hi = ranges.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const [a, b] = ranges[mid]!;
    if (p < a) hi = mid - 1;
    else if (p >= b) lo = mid + 1;
    else return mid;
  }
  return -1;
}

/** [first, end) token bounds of S equal segments of N tokens. */
export function segmentBounds(n: number, s: number): [number, number][] {
  const out: [number, number][] = [];
  for (let k = 0; k < s; k++) out.push([Math.floor((k * n) / s), Math.floor(((k + 1) * n) / s)]);
  return out;
}

/** The segment that token t falls in, consistent with segmentBounds. */
export function segmentOf(t: number, n: number, s: number): number {
  return Math.min(s - 1, Math.floor(((t + 1) * s - 1) / n));
}
