/**
 * Did-you-mean suggestions for misspelt names in a plan (measure, chart, text
 * and cast ids, option keys).
 */
import { distance } from 'fastest-levenshtein';

/**
 * Largest edit distance still taken for a slip of the keyboard: a third of the
 * longer name, and at least one edit. Above that the names merely look alike.
 */
export function maxSuggestDistance(name: string, candidate: string): number {
  return Math.max(1, Math.floor(Math.max(name.length, candidate.length) / 3));
}

/**
 * Levenshtein distance in which one swap of neighbouring letters also counts
 * as a single slip ("titel" → "title"), the commonest misspelling besides a
 * letter added, dropped or changed (Damerau 1964). Plain Levenshtein counts
 * a swap as two edits.
 */
export function slipDistance(a: string, b: string): number {
  let best = distance(a, b);
  for (let i = 0; i + 1 < a.length && best > 1; i++) {
    if (a[i] === a[i + 1]) continue;
    const swapped = a.slice(0, i) + a[i + 1] + a[i] + a.slice(i + 2);
    best = Math.min(best, 1 + distance(swapped, b));
  }
  return best;
}

/**
 * The candidate closest to `name` by `slipDistance` (ignoring case), or
 * undefined when none is close enough to be a likely misspelling. Ties go to
 * the earlier candidate.
 */
export function nearest(name: string, candidates: Iterable<string>): string | undefined {
  const wanted = name.toLowerCase();
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const candidate of candidates) {
    if (candidate === name) continue;
    const d = slipDistance(wanted, candidate.toLowerCase());
    if (d <= maxSuggestDistance(name, candidate) && d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  return best;
}

/**
 * The hint for an unknown name: "did you mean "x"?" when a close name exists,
 * otherwise the list of valid names (or a note that there are none).
 */
export function suggestionHint(name: string, candidates: readonly string[], kind: string): string {
  const close = nearest(name, candidates);
  if (close !== undefined) return `did you mean "${close}"?`;
  if (candidates.length === 0) return `there are no ${kind}`;
  return `the ${kind} are: ${candidates.map((c) => `"${c}"`).join(', ')}`;
}
