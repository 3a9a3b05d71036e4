/**
 * The entropy-based D₂ (the ETS usage-coefficient report, 1970): the entropy of a word's distribution over n
 * parts, relative to the largest entropy possible,
 *
 *   pᵢ = xᵢ / Σ x      D₂ = −Σ pᵢ log₂ pᵢ / log₂ n      (0 · log 0 taken as 0)
 *
 * 1 means perfectly even, 0 all in one part. As with Juilland's D, pass rates
 * (frequency ÷ part size) when the parts differ in size.
 */
export function entropyD2(values: ArrayLike<number>): number | null {
  const n = values.length;
  if (n < 2) return null;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i]!;
  if (sum === 0) return null;
  let h = 0;
  for (let i = 0; i < n; i++) {
    const p = values[i]! / sum;
    if (p > 0) h -= p * Math.log2(p);
  }
  return h / Math.log2(n);
}
