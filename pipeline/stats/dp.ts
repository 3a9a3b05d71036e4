/**
 * Gries' DP ("deviation of proportions", Gries 2008) and its normalised form
 * DPnorm (Lijffijt & Gries 2012).
 *
 *   sᵢ = size of part i / corpus size      vᵢ = frequency in part i / total frequency
 *   DP = ½ Σ |vᵢ − sᵢ|                     DPnorm = DP / (1 − min sᵢ)
 *
 * DP is 0 when the word is spread exactly as the parts' sizes predict, and
 * approaches 1 when it is packed into one small part. DPnorm rescales DP so
 * that its maximum, reached when every occurrence is in the smallest part, is 1.
 */

/** DP of a word from its frequency in each part and the parts' sizes; null when the word does not occur or the parts are empty. */
export function griesDP(frequencies: ArrayLike<number>, sizes: ArrayLike<number>): number | null {
  if (frequencies.length !== sizes.length) throw new RangeError(`${frequencies.length} frequencies were given for ${sizes.length} parts`);
  let f = 0;
  let n = 0;
  for (let i = 0; i < sizes.length; i++) {
    f += frequencies[i]!;
    n += sizes[i]!;
  }
  if (f === 0 || n === 0) return null;
  let sum = 0;
  for (let i = 0; i < sizes.length; i++) sum += Math.abs(frequencies[i]! / f - sizes[i]! / n);
  return sum / 2;
}

/** DPnorm = DP / (1 − min sᵢ); null when DP is, or when there is a single part (no spread is possible). */
export function griesDPnorm(frequencies: ArrayLike<number>, sizes: ArrayLike<number>): number | null {
  const dp = griesDP(frequencies, sizes);
  if (dp === null) return null;
  let n = 0;
  let min = Infinity;
  for (let i = 0; i < sizes.length; i++) {
    n += sizes[i]!;
    if (sizes[i]! < min) min = sizes[i]!;
  }
  const room = 1 - min / n;
  return room > 0 ? dp / room : null;
}
