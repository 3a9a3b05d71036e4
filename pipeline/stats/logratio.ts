/**
 * Log Ratio (Hardie 2014): the binary log of the ratio of a word's relative
 * frequencies in two corpora, log₂((a / c) / (b / d)). Each unit is a doubling:
 * 1 means twice as frequent in corpus 1, −1 half as frequent.
 *
 * A zero count would make the ratio 0 or infinite, so a count of 0 is replaced
 * by `zero` (0.5 by convention) before dividing.
 */
export function logRatio(a: number, sizeA: number, b: number, sizeB: number, zero = 0.5): number {
  const fa = a === 0 ? zero : a;
  const fb = b === 0 ? zero : b;
  return Math.log2(fa / sizeA / (fb / sizeB));
}
