import { describe, it, expect } from 'vitest';
import { carrollD2 } from '../../pipeline/stats/carroll.ts';

describe("Carroll's D₂", () => {
  it('reproduces Carroll 1970: [2, 1, 1, 1, 0] → 0.8277', () => {
    // Source: Carroll 1970, entropy-based D₂ (recomputed: H(0.4, 0.2, 0.2, 0.2, 0) / log₂ 5 = 1.92193 / 2.32193).
    expect(carrollD2([2, 1, 1, 1, 0])).toBeCloseTo(0.8277, 4);
    // Recomputed from the same formula for the other five-part example.
    expect(carrollD2([0, 4, 3, 2, 1])).toBeCloseTo(0.7952, 4);
  });

  it('is 1 for a perfectly even spread and 0 when everything is in one part', () => {
    // Bounds of a normalised entropy (common practice, no source).
    expect(carrollD2([2, 2, 2])).toBeCloseTo(1, 12);
    expect(carrollD2([0, 7, 0])).toBe(0);
  });

  it('has no value for fewer than two parts or a word that does not occur', () => {
    expect(carrollD2([4])).toBeNull();
    expect(carrollD2([0, 0])).toBeNull();
  });
});
