import { describe, it, expect } from 'vitest';
import { fraction, log } from 'mathjs';
import { logRatio } from '../../pipeline/stats/logratio.ts';

describe('Log Ratio', () => {
  it('regression value: 52 in 50,000 against 57 in 75,000 gives 0.4525', () => {
    // Regression value, recomputed from Hardie 2014's definition log₂((a/c)/(b/d)); not a printed figure.
    expect(logRatio(52, 50_000, 57, 75_000)).toBeCloseTo(0.4525, 4);
  });

  it('counts doublings: twice as frequent is +1, half as frequent −1', () => {
    // Source: Hardie 2014 (each unit of Log Ratio is a doubling of the ratio of relative frequencies).
    expect(logRatio(20, 1000, 10, 1000)).toBeCloseTo(1, 12);
    expect(logRatio(10, 1000, 20, 1000)).toBeCloseTo(-1, 12);
    expect(logRatio(80, 1000, 10, 1000)).toBeCloseTo(3, 12);
  });

  it('agrees with exact rational arithmetic in mathjs', () => {
    // Source: mathjs 15, run here as the reference: the ratio (a·d)/(b·c) as an exact fraction, then its log₂.
    const cases: [number, number, number, number][] = [
      [52, 50_000, 57, 75_000],
      [3, 1_234, 17, 98_765],
      [999, 10_000, 1, 2_000_000],
      [7, 7_000, 7, 70],
    ];
    for (const [a, c, b, d] of cases) {
      const ratio = fraction(a * d, b * c);
      expect(logRatio(a, c, b, d)).toBeCloseTo(log(ratio.valueOf() as number, 2) as number, 12);
    }
  });

  it('replaces a zero count by 0.5, or by the half count asked for', () => {
    // Our convention, stated on the keyness method card: a zero count becomes half a count, less than any
    // observed one, so that a word missing from one side still gets a finite ratio (common practice, no source).
    expect(logRatio(4, 1000, 0, 1000)).toBeCloseTo(Math.log2(4 / 0.5), 12);
    expect(logRatio(0, 1000, 4, 1000)).toBeCloseTo(-3, 12);
    expect(logRatio(4, 1000, 0, 1000, 1)).toBeCloseTo(2, 12);
  });
});
