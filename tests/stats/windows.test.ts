import { describe, it, expect } from 'vitest';
import { jStat } from 'jstat';
import { equalSegments, meanAndSd, positionRanges, prefixSums, rangeOf, windowStarts } from '../../pipeline/stats/windows.ts';

describe('windowStarts', () => {
  it('steps through the text and aligns a last window to the end', () => {
    // By hand: 1,000 words, windows of 200 every 100 → starts 0, 100, …, 800 (⌊(1000 − 200)/100⌋ + 1 = 9).
    const a = windowStarts(1000, 200, 100);
    expect(a).toHaveLength(9);
    expect(a.at(-1)).toBe(800);
    // 1,050 words: the ninth window ends at 1,000, so a tenth starts at 850 to reach the end.
    expect(windowStarts(1050, 200, 100).slice(-2)).toEqual([800, 850]);
    // A text no longer than one window is one window.
    expect(windowStarts(150, 200, 100)).toEqual([0]);
    expect(windowStarts(0, 200, 100)).toEqual([]);
  });
});

describe('equal segments and ranges', () => {
  it('splits n items into S segments of ⌊n/S⌋ or ⌈n/S⌉', () => {
    expect(equalSegments(10, 3)).toEqual([
      [0, 3],
      [3, 6],
      [6, 10],
    ]);
    const chapters = [
      { firstToken: 0, tokenCount: 4 },
      { firstToken: 4, tokenCount: 6 },
    ];
    expect(positionRanges(chapters, 10, 'chapter', 5)).toEqual([
      [0, 4],
      [4, 10],
    ]);
    expect(positionRanges(chapters, 3, 'segment', 5)).toHaveLength(3);
    const r = equalSegments(10, 3);
    expect([0, 2, 3, 9, 10].map((p) => rangeOf(r, p))).toEqual([0, 0, 1, 2, -1]);
  });

  it('sums ranges through prefix sums and gives the population SD', () => {
    const p = prefixSums([1, 2, 3, 4]);
    expect(p[3]! - p[1]!).toBe(5);
    // Population SD of 2, 4, 4, 4, 5, 5, 7, 9 is 2 (textbook example, common practice, no source).
    expect(meanAndSd([2, 4, 4, 4, 5, 5, 7, 9])).toEqual({ mean: 5, sd: 2 });
    expect(meanAndSd([])).toBeNull();
  });

  it('agrees with the mean and population standard deviation of jStat', () => {
    // Source: jStat 1.9 `mean` and `stdev` (population), run here as the reference.
    const series = [
      [3.5, -1.25, 0, 12, 7.75],
      Array.from({ length: 200 }, (_, i) => Math.sin(i / 7) * 4 + (i % 13)),
      [42],
    ];
    for (const v of series) {
      const r = meanAndSd(v)!;
      expect(r.mean).toBeCloseTo(jStat.mean(v), 12);
      expect(r.sd).toBeCloseTo(jStat.stdev(v), 12);
    }
  });
});
