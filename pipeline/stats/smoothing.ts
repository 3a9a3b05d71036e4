/**
 * Smoothing a series of values taken at equal steps (e.g. sentiment scores of
 * successive windows of a text): a centred moving average, and a low-pass
 * filter that keeps the slowest cosines of the discrete cosine transform.
 */

/**
 * Centred moving average over `width` points (an even width is widened by one
 * so the window stays centred). Near the ends the window is cut to the points
 * that exist, so the first value is the mean of the first ⌈width/2⌉ points.
 */
export function movingAverage(values: ArrayLike<number>, width: number): number[] {
  const n = values.length;
  const half = Math.max(0, Math.floor(width / 2));
  const prefix = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) prefix[i + 1] = prefix[i]! + values[i]!;
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    const a = Math.max(0, i - half);
    const b = Math.min(n, i + half + 1);
    out[i] = (prefix[b]! - prefix[a]!) / (b - a);
  }
  return out;
}

/**
 * The DCT-II coefficients X_k = Σ_n x_n cos(π k (n + ½) / N) for k < `count`.
 */
export function dctCoefficients(values: ArrayLike<number>, count: number): Float64Array {
  const n = values.length;
  const k = Math.min(count, n);
  const out = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    let sum = 0;
    for (let i = 0; i < n; i++) sum += values[i]! * Math.cos((Math.PI * j * (i + 0.5)) / n);
    out[j] = sum;
  }
  return out;
}

/**
 * Low-pass filter: keep the first `keep` coefficients of the DCT-II of the
 * series and transform back (DCT-III, scaled so that keeping every
 * coefficient returns the input): x̂_n = X_0/N + (2/N) Σ_{k=1}^{keep−1} X_k cos(π k (n + ½) / N).
 * The cosine transform treats the series as mirrored at its ends, so the ends
 * are not pulled towards each other as with a Fourier transform. A constant
 * passes unchanged; a component of frequency k/2N cycles per point passes
 * only when k < keep.
 */
export function lowPass(values: ArrayLike<number>, keep: number): number[] {
  const n = values.length;
  if (n === 0) return [];
  const k = Math.max(1, Math.min(keep, n));
  const coeffs = dctCoefficients(values, k);
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    let sum = coeffs[0]! / n;
    for (let j = 1; j < k; j++) sum += ((2 / n) * coeffs[j]!) * Math.cos((Math.PI * j * (i + 0.5)) / n);
    out[i] = sum;
  }
  return out;
}
