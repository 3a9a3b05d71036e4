/**
 * Juilland's D (Juilland & Chang-Rodríguez 1964), as given by the 1970 ETS report "An alternative to Juilland's usage coefficient for lexical frequencies":
 *
 *   D = 1 − V / √(n − 1),   V = σ / μ
 *
 * over the values of n equal parts (σ the population standard deviation).
 * 1 means perfectly even, 0 all in one part. For parts of unequal size pass
 * the word's relative frequency in each part (frequency ÷ part size), so that
 * a long part is not mistaken for a preference.
 */
export function juillandD(values: ArrayLike<number>): number | null {
  const n = values.length;
  if (n < 2) return null;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i]!;
  const mean = sum / n;
  if (mean === 0) return null;
  let sq = 0;
  for (let i = 0; i < n; i++) sq += (values[i]! - mean) ** 2;
  const sd = Math.sqrt(sq / n);
  return 1 - sd / mean / Math.sqrt(n - 1);
}
