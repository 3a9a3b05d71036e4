/**
 * Pointwise mutual information (Church & Hanks 1990):
 *
 *   PMI = log₂(O / E),   E = f(x) f(y) / N
 *
 * O: how often x and y occur together; f(x), f(y): their frequencies; N: the
 * corpus size. To score co-occurrence in a window of W words, pass f(x)·W as
 * `fx` (the node offers W slots per occurrence). Null when O is 0.
 */
export function pmi(o: number, fx: number, fy: number, n: number): number | null {
  if (o <= 0 || fx <= 0 || fy <= 0 || n <= 0) return null;
  return Math.log2((o * n) / (fx * fy));
}
