import { describe, it, expect } from 'vitest';
import { jStat } from 'jstat';
import { kldivergence } from 'mathjs';
import { keyness } from '../../pipeline/stats/keyness.ts';

describe('keyness over two frequency lists', () => {
  // Source: Rayson 2002, the forms of KEEP in two corpora of 1,000,000 words each, as listed in the project's
  // reference notes: keep 348/99 (G² 146.953), keeping 9/32 (13.682), keeps 15/14 (0.034), kept 21/25 (0.348).
  const a = [348, 9, 15, 21];
  const b = [99, 32, 14, 25];
  const size = 1_000_000;

  it('keeps the significant words with their G², band and Log Ratio', () => {
    const out = keyness(a, size, b, size, { direction: 'both', p: 0.05 });
    expect(out.tested).toBe(4);
    expect(out.significant).toBe(2);
    expect(out.rows.map((r) => [r.type, r.direction, r.band])).toEqual([
      [0, 'positive', 'p < 0.0001'],
      [1, 'negative', 'p < 0.001'],
    ]);
    expect(out.rows[0]!.g2).toBeCloseTo(146.953, 3);
    expect(out.rows[1]!.g2).toBeCloseTo(13.682, 3);
    // Log Ratio (Hardie 2014): equal corpus sizes, so log₂(348/99) and log₂(9/32).
    expect(out.rows[0]!.logRatio).toBeCloseTo(Math.log2(348 / 99), 12);
    expect(out.rows[1]!.logRatio).toBeCloseTo(Math.log2(9 / 32), 12);
  });

  it('filters by direction, level, minimum frequency and an include test', () => {
    expect(keyness(a, size, b, size).rows.map((r) => r.type)).toEqual([0]); // default: positive, p < 0.01
    expect(keyness(a, size, b, size, { direction: 'negative' }).rows.map((r) => r.type)).toEqual([1]);
    // p = 1 keeps all: positive first (keep, keeps), then negative (keeping, kept), each by G².
    expect(keyness(a, size, b, size, { direction: 'both', p: 1 }).rows.map((r) => r.type)).toEqual([0, 2, 1, 3]);
    // "keeping" is over-used in B with b = 32: a minimum of 33 drops it.
    expect(keyness(a, size, b, size, { direction: 'negative', minFrequency: 33 }).tested).toBe(0);
    expect(keyness(a, size, b, size, { direction: 'both', include: (t) => t !== 0 }).rows.map((r) => r.type)).toEqual([1]);
  });

  it('ranks by Log Ratio when asked and cuts each direction to `top`', () => {
    // Regression values, hand-worked with the formulas (sizes 1,000 each): type 0, 400 vs 200: G² ≈ 67.96, Log Ratio 1;
    // type 1, 12 vs 1: G² ≈ 10.97, Log Ratio ≈ 3.58; type 2, 30 vs 30: G² 0; type 3, 0 vs 9: G² ≈ 12.48, Log Ratio log₂(0.5/9).
    const counts = [400, 12, 30, 0];
    const ref = [200, 1, 30, 9];
    const byG2 = keyness(counts, 1000, ref, 1000, { direction: 'both', p: 1 });
    expect(byG2.rows.map((r) => r.type)).toEqual([0, 1, 2, 3]);
    expect(byG2.rows.map((r) => r.g2)).toEqual([
      expect.closeTo(67.96, 2),
      expect.closeTo(10.97, 2),
      0,
      expect.closeTo(12.48, 2),
    ]);
    const byRatio = keyness(counts, 1000, ref, 1000, { direction: 'both', p: 1, sort: 'logRatio' });
    expect(byRatio.rows.map((r) => r.type)).toEqual([1, 0, 2, 3]);
    expect(byRatio.rows[3]!.logRatio).toBeCloseTo(Math.log2(0.5 / 9), 12);
    expect(keyness(counts, 1000, ref, 1000, { direction: 'both', p: 1, top: 1 }).rows.map((r) => r.type)).toEqual([0, 3]);
  });

  it('keeps exactly the words a general-purpose library finds significant, with the same G²', () => {
    // Source: mathjs 15 `kldivergence` (G² = 2n·KL, see loglikelihood.test.ts) and jStat 1.9 `chisquare.cdf`, run
    // here as the reference: a word is kept at p < 0.01 when its G² has a χ²(1) upper tail below 0.01.
    // Invented counts, chosen away from the band edges (where the tabled 6.63 and the exact 6.6349 could differ).
    // No zero counts: mathjs gives NaN for 0·ln 0 (the zero case is tested in loglikelihood.test.ts).
    const counts = [400, 12, 30, 1, 55, 9, 140, 2];
    const ref = [200, 1, 30, 9, 20, 30, 150, 40];
    const size = 5000;
    const out = keyness(counts, size, ref, 8000, { direction: 'both', p: 0.01 });
    const expected: number[] = [];
    counts.forEach((a, t) => {
      const b = ref[t]!;
      const n = a + b;
      const g2 = 2 * n * (kldivergence([a / n, b / n], [size / (size + 8000), 8000 / (size + 8000)]) as number);
      const row = out.rows.find((r) => r.type === t);
      if (1 - jStat.chisquare.cdf(g2, 1) < 0.01) {
        expected.push(t);
        expect(row!.g2).toBeCloseTo(g2, 6);
      } else {
        expect(row).toBeUndefined();
      }
    });
    expect(out.rows.map((r) => r.type).sort((x, y) => x - y)).toEqual(expected);
    expect(expected.length).toBeGreaterThan(2);
  });

  it('says what is wrong with its input', () => {
    expect(() => keyness([1, 2], 10, [1], 10)).toThrow(/differ in length/);
    expect(() => keyness([1], 0, [1], 10)).toThrow(/must hold words/);
  });
});
