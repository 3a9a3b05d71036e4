import { describe, it, expect } from 'vitest';
import dct from 'dct';
import { dctCoefficients, lowPass, movingAverage } from '../../pipeline/stats/smoothing.ts';

const N = 200;
const sine = (cycles: number): number[] => Array.from({ length: N }, (_, i) => Math.sin((2 * Math.PI * cycles * i) / N));
const maxAbs = (xs: number[]): number => Math.max(...xs.map(Math.abs));
/** Root mean square; a full-cycle sine of amplitude 1 has RMS 1/√2 ≈ 0.707. */
const rms = (xs: number[]): number => Math.sqrt(xs.reduce((a, b) => a + b * b, 0) / xs.length);

describe('moving average', () => {
  it('keeps a constant, averages a centred window and shrinks it at the ends', () => {
    expect(movingAverage([4, 4, 4, 4], 3)).toEqual([4, 4, 4, 4]);
    // By hand: width 3 over [0, 3, 6, 9] → [1.5, 3, 6, 7.5].
    expect(movingAverage([0, 3, 6, 9], 3)).toEqual([1.5, 3, 6, 7.5]);
    // An even width is widened by one to stay centred.
    expect(movingAverage([0, 3, 6, 9], 2)).toEqual(movingAverage([0, 3, 6, 9], 3));
  });

  it('flattens a fast oscillation', () => {
    // A period-2 alternation averaged over 2k+1 points leaves ±1/(2k+1) (common practice, no source).
    const alt = Array.from({ length: 50 }, (_, i) => (i % 2 ? 1 : -1));
    expect(maxAbs(movingAverage(alt, 5).slice(2, -2))).toBeCloseTo(0.2, 12);
  });
});

describe('low-pass (discrete cosine transform)', () => {
  it('passes a constant unchanged', () => {
    // DCT-II of a constant has only the k = 0 term (DCT definition, no source).
    const out = lowPass(new Array(N).fill(2.5), 5);
    for (const v of out) expect(v).toBeCloseTo(2.5, 10);
  });

  it('returns the input when every coefficient is kept', () => {
    const x = sine(3).map((v, i) => v + (i % 7) / 10);
    const out = lowPass(x, N);
    for (let i = 0; i < N; i++) expect(out[i]).toBeCloseTo(x[i]!, 9);
  });

  it('passes a slow cosine exactly and a slow sine nearly', () => {
    // cos(π·3·(n+½)/N) is the DCT basis vector k = 3: kept whole when keep > 3.
    const basis = Array.from({ length: N }, (_, i) => Math.cos((Math.PI * 3 * (i + 0.5)) / N));
    const out = lowPass(basis, 10);
    for (let i = 0; i < N; i++) expect(out[i]).toBeCloseTo(basis[i]!, 10);
    // One full sine cycle over the series: its DCT energy sits mostly in k ≤ 12, so what is
    // lost is small (RMS error under 0.03 against the sine's RMS of 0.707).
    const slow = sine(1);
    const smooth = lowPass(slow, 12);
    expect(rms(smooth.map((v, i) => v - slow[i]!))).toBeLessThan(0.03);
  });

  it('removes a fast sine', () => {
    // 40 cycles in 200 points is DCT frequency k ≈ 80, far above keep = 12: what is left is
    // leakage from the series' ends, under 0.03 RMS against the sine's 0.707.
    expect(rms(lowPass(sine(40), 12))).toBeLessThan(0.03);
    // Mixed: slow + fast → about the slow part alone.
    const mixed = sine(1).map((v, i) => v + sine(40)[i]!);
    const out = lowPass(mixed, 12);
    expect(rms(out.map((v, i) => v - sine(1)[i]!))).toBeLessThan(0.05);
  });

  it('agrees with the DCT-II of the npm package dct', () => {
    // Source: dct 0.1 (npm), run here as the reference; it computes scale · Σ xₙ cos(π k (n + ½)/N), so scale 1.
    const x = sine(2).map((v, i) => v + ((i * 37) % 11) / 10);
    const ref = dct(x, 1);
    const ours = dctCoefficients(x, 20);
    for (let k = 0; k < 20; k++) expect(ours[k]).toBeCloseTo(ref[k]!, 8);
  });

  it('computes the DCT-II coefficients of a short series', () => {
    // By the definition X_k = Σ x_n cos(π k (n + ½)/N), N = 2: X_0 = 1 + 3, X_1 = cos(π/4) + 3cos(3π/4).
    const c = dctCoefficients([1, 3], 2);
    expect(c[0]).toBeCloseTo(4, 12);
    expect(c[1]).toBeCloseTo(Math.SQRT1_2 - 3 * Math.SQRT1_2, 12);
  });
});
