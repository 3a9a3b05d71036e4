/**
 * t-score of a co-occurrence (Church, Gale, Hanks & Hindle 1991):
 *
 *   t = (O − E) / √O,   E = f(x) f(y) / N
 *
 * the observed count's distance from chance in (approximate) standard errors.
 * As with PMI, pass f(x)·W as `fx` to score a window of W words. Null when O is 0.
 */
export function tScore(o: number, fx: number, fy: number, n: number): number | null {
  if (o <= 0 || n <= 0) return null;
  return (o - (fx * fy) / n) / Math.sqrt(o);
}
