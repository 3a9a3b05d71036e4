import { describe, it, expect } from 'vitest';
import { logRatio } from '../../pipeline/stats/logratio.ts';

describe('Log Ratio', () => {
  it('reproduces 52 in 50,000 against 57 in 75,000', () => {
    // Source: Hardie 2014, Log Ratio = log₂((a/c)/(b/d)); value recomputed: 0.4525.
    expect(logRatio(52, 50_000, 57, 75_000)).toBeCloseTo(0.4525, 4);
  });

  it('counts doublings: twice as frequent is +1, half as frequent −1', () => {
    // Source: Hardie 2014 (each unit of Log Ratio is a doubling).
    expect(logRatio(20, 1000, 10, 1000)).toBeCloseTo(1, 12);
    expect(logRatio(10, 1000, 20, 1000)).toBeCloseTo(-1, 12);
  });

  it('replaces a zero count by 0.5', () => {
    // Convention for zero frequencies in Log Ratio (Hardie 2014, from memory).
    expect(logRatio(4, 1000, 0, 1000)).toBeCloseTo(Math.log2(4 / 0.5), 12);
    expect(logRatio(0, 1000, 4, 1000)).toBeCloseTo(-3, 12);
    expect(logRatio(4, 1000, 0, 1000, 1)).toBeCloseTo(2, 12);
  });
});
