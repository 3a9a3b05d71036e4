import { describe, it, expect } from 'vitest';
import { griesDP, griesDPnorm } from '../../pipeline/stats/dp.ts';

describe("Gries' DP and DPnorm", () => {
  it('reproduces Gries’ toy corpus: "a" in five parts of ten words, 1–5 times', () => {
    // Source: Gries 2008 (IJCL 13(4)), the five-part toy corpus; DP 0.2 (recomputed), DPnorm 0.25 (Lijffijt & Gries 2012, recomputed).
    expect(griesDP([1, 2, 3, 4, 5], [10, 10, 10, 10, 10])).toBeCloseTo(0.2, 12);
    expect(griesDPnorm([1, 2, 3, 4, 5], [10, 10, 10, 10, 10])).toBeCloseTo(0.25, 12);
  });

  it('reproduces Lijffijt & Gries 2012, Table 1: 2/3, 1/3 and 0 of a word in three equal parts', () => {
    // Source: Lijffijt & Gries 2012 (IJCL 17(1)), Table 1: DP 0.333, DPnorm 0.5.
    expect(griesDP([2, 1, 0], [100, 100, 100])).toBeCloseTo(0.333, 3);
    expect(griesDPnorm([2, 1, 0], [100, 100, 100])).toBeCloseTo(0.5, 12);
  });

  it('is 0 for a spread proportional to the parts, and DPnorm reaches 1 when all is in the smallest part', () => {
    // Properties stated by Gries 2008 and Lijffijt & Gries 2012.
    expect(griesDP([1, 2, 7], [10, 20, 70])).toBeCloseTo(0, 12);
    expect(griesDPnorm([4, 0, 0], [10, 20, 70])).toBeCloseTo(1, 12);
    expect(griesDP([4, 0, 0], [10, 20, 70])).toBeCloseTo(0.9, 12);
  });

  it('has no value for a word that does not occur, and DPnorm none for a single part', () => {
    expect(griesDP([0, 0], [5, 5])).toBeNull();
    expect(griesDPnorm([3], [10])).toBeNull();
    expect(() => griesDP([1, 2], [10])).toThrow(/2 frequencies were given for 1 parts/);
  });
});
