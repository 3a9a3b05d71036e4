import { describe, it, expect } from 'vitest';
import { jStat } from 'jstat';
import { juillandD } from '../../pipeline/stats/juilland.ts';

describe("Juilland's D", () => {
  it('regression value: [0, 4, 3, 2, 1] gives 0.6464', () => {
    // Regression value, recomputed from the formula as given in the 1970 ETS report "An alternative to Juilland's
    // usage coefficient for lexical frequencies" (μ = 2, σ = √2, D = 1 − 0.7071/2); not a printed figure.
    expect(juillandD([0, 4, 3, 2, 1])).toBeCloseTo(0.6464, 4);
  });

  it('regression value: 0.6838 for [2, 1, 1, 1, 0] (0.8277, also quoted for this vector, is the entropy-based D₂)', () => {
    // Regression value, recomputed from the formula: μ = 1, σ = √0.4, D = 1 − 0.6325/2 = 0.6838. The 0.8277 quoted with the ETS usage-coefficient report, 1970
    // for this vector is his entropy measure D₂ (tests/stats/entropy-d2.test.ts), not Juilland's D.
    expect(juillandD([2, 1, 1, 1, 0])).toBeCloseTo(0.6838, 4);
  });

  it('agrees with the mean and population standard deviation of jStat', () => {
    // Source: jStat 1.9 `mean` and `stdev` (population), run here as the reference for μ and σ in D = 1 − (σ/μ)/√(n − 1).
    const vectors = [
      [0, 4, 3, 2, 1],
      [2, 1, 1, 1, 0],
      [17, 0, 3, 9, 9, 41, 2],
      [0.013, 0.002, 0.0075],
      [5, 5, 5, 6],
    ];
    for (const v of vectors) {
      const d = 1 - jStat.stdev(v) / jStat.mean(v) / Math.sqrt(v.length - 1);
      expect(juillandD(v)).toBeCloseTo(d, 12);
    }
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
