import { describe, it, expect } from 'vitest';
import { structure } from '../../pipeline/measures/structure.ts';
import { context, TALE } from './fixture.ts';

/** Word count by ICU's UAX #29 word boundaries (isWordLike segments). */
function icuWords(s: string): number {
  // Source: Unicode UAX #29 word boundaries, as implemented by ICU behind Intl.Segmenter.
  return [...new Intl.Segmenter('en', { granularity: 'word' }).segment(s)].filter((x) => x.isWordLike).length;
}

describe('structure', () => {
  const ctx = context(TALE);
  const result = structure.compute(ctx, structure.params.parse({}));

  it('finds the three chapters with their titles', () => {
    expect(result.chapters.map((c) => c.number)).toEqual([1, 2, 3]);
    expect(result.chapters[0]!.title).toMatch(/^Chapter (I|1)\b/);
  });

  it('counts words per chapter as UAX #29 does on text without hyphenated compounds', () => {
    const bodies = TALE.split(/CHAPTER [IV]+\.\n/).slice(1);
    // Chapter II holds "lock-keeper": our convention counts one word where UAX #29 counts two (common practice, no source).
    const expected = bodies.map((b, i) => icuWords(b) - (i === 1 ? 1 : 0));
    expect(result.chapters.map((c) => c.words)).toEqual(expected);
    expect(result.words).toBe(expected.reduce((a, b) => a + b, 0));
  });

  it('counts paragraphs and sentences per chapter', () => {
    expect(result.chapters.map((c) => c.paragraphs)).toEqual([2, 1, 1]);
    // Counted by hand: chapter II has three sentences (a semicolon does not end one).
    expect(result.chapters[1]!.sentences).toBe(3);
    expect(result.chapters[2]!.sentences).toBe(1);
  });

  it('gives a table with one row per chapter and a bars view of the chosen unit', () => {
    expect(structure.table(result, { unit: 'words' }).rows).toHaveLength(3);
    const bars = structure.views.bars!(result, { unit: 'sentences' });
    expect(bars.kind).toBe('bars');
    if (bars.kind === 'bars') expect(bars.series[0]!.values).toEqual(result.chapters.map((c) => c.sentences));
  });

  it('rejects unknown parameters', () => {
    expect(structure.params.safeParse({ units: 'words' }).success).toBe(false);
  });
});
