import { describe, it, expect } from 'vitest';
import { entropyD2 } from '../../pipeline/stats/entropy-d2.ts';

describe("entropy-based D₂", () => {
  it('reproduces the ETS usage-coefficient report, 1970: [2, 1, 1, 1, 0] → 0.8277', () => {
    // Source: the ETS usage-coefficient report, 1970, entropy-based D₂ (recomputed: H(0.4, 0.2, 0.2, 0.2, 0) / log₂ 5 = 1.92193 / 2.32193).
    expect(entropyD2([2, 1, 1, 1, 0])).toBeCloseTo(0.8277, 4);
    // Recomputed from the same formula for the other five-part example.
    expect(entropyD2([0, 4, 3, 2, 1])).toBeCloseTo(0.7952, 4);
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
