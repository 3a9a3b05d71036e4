import { describe, it, expect } from 'vitest';
import { logDice } from '../../pipeline/stats/logdice.ts';
import { pmi } from '../../pipeline/stats/pmi.ts';
import { tScore } from '../../pipeline/stats/tscore.ts';

describe('logDice', () => {
  it('reproduces the published values', () => {
    // Source: Rychlý 2008 (RASLAN), logDice = 14 + log₂(2 f(xy) / (f(x) + f(y))); values recomputed.
    expect(logDice(8, 389, 230)).toBeCloseTo(8.726204, 6);
    expect(logDice(300, 300, 300)).toBe(14);
    expect(logDice(3, 3000, 3000)).toBeCloseTo(4.034216, 6);
    expect(logDice(300, 3000, 3000)).toBeCloseTo(10.67807, 5);
  });

  it('has no value without a co-occurrence', () => {
    expect(logDice(0, 10, 10)).toBeNull();
  });
});

describe('PMI and t-score', () => {
  // Source: Manning & Schütze 1999, Foundations of Statistical NLP, ch. 5 (from memory, recomputed): N = 14,307,668 bigrams.
  const N = 14_307_668;

  it('reproduces the t-score of "new companies"', () => {
    // f(new) = 15,828, f(companies) = 4,675, f(new companies) = 8 → t ≈ 0.999932.
    expect(tScore(8, 15_828, 4_675, N)).toBeCloseTo(0.999932, 6);
  });

  it('reproduces the PMI of a pair seen 20 times each and always together', () => {
    // f(x) = 42, f(y) = 20, f(xy) = 20 → PMI ≈ 18.38.
    expect(pmi(20, 42, 20, N)).toBeCloseTo(18.38, 2);
  });

  it('is 0 at chance level (PMI) and 0 when O equals E (t-score)', () => {
    // O = E = f(x) f(y) / N (common practice, no source).
    expect(pmi(10, 100, 1000, 10_000)).toBeCloseTo(0, 12);
    expect(tScore(10, 100, 1000, 10_000)).toBeCloseTo(0, 12);
  });

  it('has no value without a co-occurrence', () => {
    expect(pmi(0, 10, 10, 100)).toBeNull();
    expect(tScore(0, 10, 10, 100)).toBeNull();
  });
});
