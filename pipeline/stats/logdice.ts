/**
 * logDice (Rychlý 2008): 14 + log₂(2 f(xy) / (f(x) + f(y))), the Dice
 * coefficient on a log scale. 14 is the maximum for adjacent pairs (x and y
 * always together); each unit less halves the association. It does not depend
 * on the corpus size. Null when f(xy) is 0.
 */
export function logDice(fxy: number, fx: number, fy: number): number | null {
  if (fxy <= 0 || fx + fy <= 0) return null;
  return 14 + Math.log2((2 * fxy) / (fx + fy));
}
