import { describe, it, expect } from 'vitest';
import { flesch } from 'flesch';
import { fleschKincaid } from 'flesch-kincaid';
import { fleschKincaidGrade, fleschReadingEase, lengthHistogram, nearestRank } from '../../pipeline/stats/readability.ts';

describe('Flesch formulas', () => {
  it('regression values: one sentence of 13 words and 24 syllables gives FKGL 11.265, FRE 37.455', () => {
    // Regression values, recomputed from the formulas of Flesch 1948 (Reading Ease) and Kincaid et al. 1975 (grade):
    // FKGL = 0.39×13 + 11.8×24/13 − 15.59 = 11.265; FRE = 206.835 − 1.015×13 − 84.6×24/13 = 37.455.
    expect(fleschKincaidGrade(13, 1, 24)).toBeCloseTo(11.265, 3);
    expect(fleschReadingEase(13, 1, 24)).toBeCloseTo(37.455, 3);
  });

  it('Reading Ease tops out at 121.22 for one-word, one-syllable sentences', () => {
    // Regression value: the formula's upper bound 206.835 − 1.015 − 84.6 = 121.22, worked by hand.
    expect(fleschReadingEase(4, 4, 4)).toBeCloseTo(121.22, 2);
    expect(fleschReadingEase(40, 4, 44)!).toBeLessThan(121.22);
  });

  it('agrees with the npm packages flesch and flesch-kincaid', () => {
    // Source: flesch 2 and flesch-kincaid 2 (npm), run here as the reference implementations of the two formulas.
    const counts: [number, number, number][] = [
      [13, 1, 24],
      [100, 5, 130],
      [2_431, 118, 3_302],
      [9, 9, 9],
      [57, 2, 101],
    ];
    for (const [word, sentence, syllable] of counts) {
      expect(fleschReadingEase(word, sentence, syllable)).toBeCloseTo(flesch({ word, sentence, syllable }), 10);
      expect(fleschKincaidGrade(word, sentence, syllable)).toBeCloseTo(fleschKincaid({ word, sentence, syllable }), 10);
    }
  });

  it('is undefined without words or sentences', () => {
    expect(fleschReadingEase(0, 0, 0)).toBeNull();
    expect(fleschKincaidGrade(5, 0, 7)).toBeNull();
  });
});

describe('lengthHistogram', () => {
  it('puts lengths in bins of the given width and an open bin above the maximum', () => {
    // Counted by hand: 1–5: [1, 5], 6–10: [6], 11–12: [12], 13+: [13, 40].
    const bins = lengthHistogram([1, 5, 6, 12, 13, 40, 0], 5, 12);
    expect(bins).toEqual([
      { from: 1, to: 5, count: 2 },
      { from: 6, to: 10, count: 1 },
      { from: 11, to: 12, count: 1 },
      { from: 13, to: null, count: 2 },
    ]);
  });
});

describe('nearestRank', () => {
  it('takes the value at rank ⌈q·n⌉', () => {
    // Nearest-rank percentile, common practice, no source.
    expect(nearestRank([3, 5, 8, 13, 21], 0.5)).toBe(8);
    expect(nearestRank([3, 5, 8, 13, 21], 0.9)).toBe(21);
    expect(nearestRank([], 0.5)).toBeNull();
  });
});
