import { describe, it, expect } from 'vitest';
import { kldivergence } from 'mathjs';
import { entropyD2 } from '../../pipeline/stats/entropy-d2.ts';

describe("entropy-based D₂", () => {
  it('regression values: [2, 1, 1, 1, 0] gives 0.8277 and [0, 4, 3, 2, 1] 0.7952', () => {
    // Regression values, recomputed from the formula as given in the 1970 ETS report "An alternative to Juilland's
    // usage coefficient for lexical frequencies" (H(0.4, 0.2, 0.2, 0.2, 0) / log₂ 5 = 1.92193 / 2.32193); not printed figures.
    expect(entropyD2([2, 1, 1, 1, 0])).toBeCloseTo(0.8277, 4);
    expect(entropyD2([0, 4, 3, 2, 1])).toBeCloseTo(0.7952, 4);
  });

  it('agrees with the Kullback–Leibler divergence from the even spread in mathjs: D₂ = 1 − KL(p ‖ u) / ln n', () => {
    // Source: mathjs 15 `kldivergence`, run here as the reference. With u the even spread over n parts,
    // KL(p ‖ u) = ln n − H(p) (H in nats), so H/ln n = 1 − KL/ln n (information theory, common practice, no source).
    // Vectors without zeros: mathjs gives NaN for 0·ln 0, which the formula takes as 0.
    const vectors = [
      [1, 2, 3, 4, 5],
      [40, 1, 1],
      [0.013, 0.002, 0.0075, 0.02],
      [9, 9, 8],
    ];
    for (const v of vectors) {
      const n = v.length;
      const kl = kldivergence(v, new Array(n).fill(1)) as number;
      expect(entropyD2(v)).toBeCloseTo(1 - kl / Math.log(n), 12);
    }
  });

  it('is 1 for a perfectly even spread and 0 when everything is in one part', () => {
    // Bounds of a normalised entropy (common practice, no source).
    expect(entropyD2([2, 2, 2])).toBeCloseTo(1, 12);
    expect(entropyD2([0, 7, 0])).toBe(0);
  });

  it('has no value for fewer than two parts or a word that does not occur', () => {
    expect(entropyD2([4])).toBeNull();
    expect(entropyD2([0, 0])).toBeNull();
  });
});
