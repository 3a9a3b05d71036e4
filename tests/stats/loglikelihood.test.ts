import { describe, it, expect } from 'vitest';
import { kldivergence } from 'mathjs';
import { jStat } from 'jstat';
import { logLikelihood } from '../../pipeline/stats/loglikelihood.ts';
import { CHI2_1DF_CRITICAL, criticalValue, significanceBand } from '../../pipeline/stats/chisquare.ts';

describe('log-likelihood G² (two-cell form)', () => {
  it('regression value: 52 in 50,000 words against 57 in 75,000 gives 2.6517, not significant', () => {
    // Regression value, recomputed from the two-cell formula of Rayson & Garside 2000 (not a printed figure): below 3.84.
    const g2 = logLikelihood(52, 50_000, 57, 75_000);
    expect(g2).toBeCloseTo(2.6517, 4);
    expect(significanceBand(g2)).toBe('n.s.');
  });

  it('gives the values listed for the forms of KEEP in two corpora of 1,000,000 words (Rayson 2002)', () => {
    // Source: Rayson 2002 (PhD thesis, Lancaster University), the forms of KEEP, both corpora 1,000,000 words, as
    // listed in the project's reference notes; the thesis was not at hand to name the page, so the outside check
    // below (a general-purpose library) is what this file leans on.
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

  it('agrees with the Kullback–Leibler divergence of mathjs: G² = 2n·KL(observed ‖ expected)', () => {
    // Source: mathjs 15 `kldivergence` (natural log), run here as the reference. The two-cell G² is the G-test of
    // the split (a, b) of a word's n = a + b occurrences against the split expected from the corpus sizes
    // (c, d): G² = 2 Σ O ln(O/E) = 2n · KL(O/n ‖ E/n) (Sokal & Rohlf's G-test; common practice, no source).
    const cases: [number, number, number, number][] = [
      [52, 50_000, 57, 75_000],
      [348, 1_000_000, 99, 1_000_000],
      [1, 1200, 40, 90_000],
      [700, 5_000, 3, 800_000],
      [12, 3_000, 12, 3_000],
    ];
    // (A zero count is left out: mathjs gives NaN for 0·ln 0, which the formula takes as 0 — tested above.)
    for (const [a, c, b, d] of cases) {
      const n = a + b;
      const kl = kldivergence([a / n, b / n], [c / (c + d), d / (c + d)]) as number;
      expect(logLikelihood(a, c, b, d)).toBeCloseTo(2 * n * kl, 9);
    }
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

  it('agrees with the χ²(1) quantiles of jStat within the table’s two decimals', () => {
    // Source: jStat 1.9 `chisquare.inv(1 − p, 1)`, run here as the reference: 3.8415, 6.6349, 10.8276, 15.1367
    // (the table prints the last as 15.13, so the check allows 0.01).
    for (const row of CHI2_1DF_CRITICAL) {
      expect(Math.abs(row.critical - jStat.chisquare.inv(1 - row.p, 1))).toBeLessThan(0.01);
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
