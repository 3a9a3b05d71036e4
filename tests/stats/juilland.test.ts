import { describe, it, expect } from 'vitest';
import { juillandD } from '../../pipeline/stats/juilland.ts';

describe("Juilland's D", () => {
  it('reproduces the ETS usage-coefficient report, 1970: [0, 4, 3, 2, 1] → 0.6464', () => {
    // Source: the ETS usage-coefficient report, 1970, Juilland's D over five parts (recomputed: μ = 2, σ = √2, D = 1 − 0.7071/2).
    expect(juillandD([0, 4, 3, 2, 1])).toBeCloseTo(0.6464, 4);
  });

  it('gives 0.6838 for [2, 1, 1, 1, 0] (0.8277, also quoted for this vector, is the entropy-based D₂)', () => {
    // Recomputed from the formula: μ = 1, σ = √0.4, D = 1 − 0.6325/2 = 0.6838. The 0.8277 quoted with the ETS usage-coefficient report, 1970
    // for this vector is his entropy measure D₂ (tests/stats/entropy-d2.test.ts), not Juilland's D.
    expect(juillandD([2, 1, 1, 1, 0])).toBeCloseTo(0.6838, 4);
  });

  it('is 1 for a perfectly even spread and 0 when everything is in one part', () => {
    // Bounds of D (Juilland & Chang-Rodríguez 1964; common practice, no source).
    expect(juillandD([3, 3, 3, 3])).toBeCloseTo(1, 12);
    expect(juillandD([0, 0, 0, 8])).toBeCloseTo(0, 12);
  });

  it('does not depend on the scale of the values (rates or counts of equal parts agree)', () => {
    expect(juillandD([0, 0.4, 0.3, 0.2, 0.1])).toBeCloseTo(juillandD([0, 4, 3, 2, 1])!, 12);
  });

  it('has no value for fewer than two parts or a word that does not occur', () => {
    expect(juillandD([5])).toBeNull();
    expect(juillandD([0, 0, 0])).toBeNull();
  });
});
