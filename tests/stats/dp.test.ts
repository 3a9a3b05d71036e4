import { describe, it, expect } from 'vitest';
import { norm, subtract } from 'mathjs';
import { griesDP, griesDPnorm } from '../../pipeline/stats/dp.ts';

describe("Gries' DP and DPnorm", () => {
  it('reproduces Gries’ toy corpus: "a" in five parts of ten words, 1–5 times', () => {
    // Regression values: Gries 2008 (IJCL 13(4)) builds a toy corpus of five parts; with parts of ten words each
    // DP = 0.2 and DPnorm = 0.25 are recomputed from the formulas, not printed figures.
    expect(griesDP([1, 2, 3, 4, 5], [10, 10, 10, 10, 10])).toBeCloseTo(0.2, 12);
    expect(griesDPnorm([1, 2, 3, 4, 5], [10, 10, 10, 10, 10])).toBeCloseTo(0.25, 12);
  });

  it('reproduces Lijffijt & Gries 2012, Table 1: 2/3, 1/3 and 0 of a word in three equal parts', () => {
    // Source: Lijffijt & Gries 2012 (IJCL 17(1)), Table 1: DP 0.333, DPnorm 0.5 (as listed in the project's
    // reference notes; the outside check below does not rest on it).
    expect(griesDP([2, 1, 0], [100, 100, 100])).toBeCloseTo(0.333, 3);
    expect(griesDPnorm([2, 1, 0], [100, 100, 100])).toBeCloseTo(0.5, 12);
  });

  it('is half the L1 distance between the spread of the word and of the parts, as mathjs computes it', () => {
    // Source: mathjs 15 `norm(x, 1)` and `subtract`, run here as the reference: DP = ½ Σ |vᵢ − sᵢ| (Gries 2008),
    // the L1 norm of v − s halved; DPnorm divides by 1 − min sᵢ (Lijffijt & Gries 2012).
    const cases: [number[], number[]][] = [
      [[1, 2, 3, 4, 5], [9, 10, 10, 10, 11]],
      [[7, 0, 0, 2], [1000, 250, 4000, 120]],
      [[3, 3, 3], [10, 20, 30]],
    ];
    for (const [f, size] of cases) {
      const total = f.reduce((a, b) => a + b, 0);
      const words = size.reduce((a, b) => a + b, 0);
      const v = f.map((x) => x / total);
      const s = size.map((x) => x / words);
      const dp = (norm(subtract(v, s) as number[], 1) as number) / 2;
      expect(griesDP(f, size)).toBeCloseTo(dp, 12);
      expect(griesDPnorm(f, size)).toBeCloseTo(dp / (1 - Math.min(...s)), 12);
    }
  });

  it('is 0 for a spread proportional to the parts, and DPnorm reaches 1 when all is in the smallest part', () => {
    // Properties stated by Gries 2008 and Lijffijt & Gries 2012.
    expect(griesDP([1, 2, 7], [10, 20, 70])).toBeCloseTo(0, 12);
    expect(griesDPnorm([4, 0, 0], [10, 20, 70])).toBeCloseTo(1, 12);
    expect(griesDP([4, 0, 0], [10, 20, 70])).toBeCloseTo(0.9, 12);
  });

  it('has no value for a word that does not occur, and DPnorm none for a single part', () => {
    expect(griesDP([0, 0], [5, 5])).toBeNull();
    expect(griesDPnorm([3], [10])).toBeNull();
    expect(() => griesDP([1, 2], [10])).toThrow(/2 frequencies were given for 1 parts/);
  });
});
