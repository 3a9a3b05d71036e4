import { describe, it, expect } from 'vitest';
import { logLikelihood } from '../../pipeline/stats/loglikelihood.ts';
import { CHI2_1DF_CRITICAL, criticalValue, significanceBand } from '../../pipeline/stats/chisquare.ts';

describe('log-likelihood G² (two-cell form)', () => {
  it('reproduces the worked example 52 in 50,000 words against 57 in 75,000', () => {
    // Source: Rayson & Garside 2000 two-cell G²; value recomputed from the formula: 2.6517, below 3.84, not significant.
    const g2 = logLikelihood(52, 50_000, 57, 75_000);
    expect(g2).toBeCloseTo(2.6517, 4);
    expect(significanceBand(g2)).toBe('n.s.');
  });

  it('reproduces Rayson 2002 (two corpora of 1,000,000 words each)', () => {
    // Source: Rayson 2002 (PhD thesis, Lancaster University), the forms of KEEP, both corpora 1,000,000 words.
    expect(logLikelihood(348, 1_000_000, 99, 1_000_000)).toBeCloseTo(146.953, 3); // keep
    expect(logLikelihood(9, 1_000_000, 32, 1_000_000)).toBeCloseTo(13.682, 3); // keeping
    expect(logLikelihood(15, 1_000_000, 14, 1_000_000)).toBeCloseTo(0.034, 3); // keeps
    expect(logLikelihood(21, 1_000_000, 25, 1_000_000)).toBeCloseTo(0.348, 3); // kept
  });

  it('is symmetric in its two corpora, 0 for equal rates, and takes 0·ln 0 as 0', () => {
    // Properties of the formula (common practice, no source).
    expect(logLikelihood(52, 50_000, 57, 75_000)).toBeCloseTo(logLikelihood(57, 75_000, 52, 50_000), 12);
    expect(logLikelihood(10, 1000, 20, 2000)).toBe(0);
    // a = 0: G² = 2 b ln(b / E₂), E₂ = d·b/(c+d); 0 in 1,000 vs 6 in 2,000 → 2·6·ln(3000/2000).
    expect(logLikelihood(0, 1000, 6, 2000)).toBeCloseTo(12 * Math.log(1.5), 12);
    expect(logLikelihood(0, 1000, 0, 2000)).toBe(0);
  });
});

describe('χ²(1) critical values and significance bands', () => {
  it('uses the tabled critical values 3.84, 6.63, 10.83, 15.13', () => {
    // Source: χ² table, 1 degree of freedom, as quoted by Rayson & Garside 2000 for G².
    expect(criticalValue(0.05)).toBe(3.84);
    expect(criticalValue(0.01)).toBe(6.63);
    expect(criticalValue(0.001)).toBe(10.83);
    expect(criticalValue(0.0001)).toBe(15.13);
    expect(criticalValue(1)).toBe(0);
  });

  it('agrees with the squared two-sided normal quantiles (χ²(1) = Z²)', () => {
    // Source: standard normal quantiles z(0.975) = 1.959964, z(0.995) = 2.575829, z(0.9995) = 3.290527,
    // z(0.99995) = 3.890592 (handbook values, from memory); the tabled values keep two decimals.
    const z: Record<number, number> = { 0.05: 1.959964, 0.01: 2.575829, 0.001: 3.290527, 0.0001: 3.890592 };
    for (const row of CHI2_1DF_CRITICAL) {
      expect(Math.abs(z[row.p]! ** 2 - row.critical)).toBeLessThan(0.01);
    }
  });

  it('puts a statistic in the strictest band it reaches', () => {
    expect(significanceBand(146.953)).toBe('p < 0.0001');
    expect(significanceBand(13.682)).toBe('p < 0.001');
    expect(significanceBand(6.63)).toBe('p < 0.01');
    expect(significanceBand(3.9)).toBe('p < 0.05');
    expect(significanceBand(3.83)).toBe('n.s.');
  });
});
