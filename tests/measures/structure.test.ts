import { describe, it, expect } from 'vitest';
import { structure } from '../../pipeline/measures/structure.ts';
import { readFileSync } from 'node:fs';
import { context, TALE } from './fixture.ts';
import { drawPanel, exactTarget } from '../../pipeline/stages/notes.ts';
import { charts } from '../../pipeline/charts/index.ts';
import { noteAnchorSchema } from '../../pipeline/plan/schema.ts';

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

  it('has no parts for a one-level text', () => {
    expect(result.parts).toBeUndefined();
    expect(result.chapters.every((c) => c.partNumber === null && c.numberInPart === null)).toBe(true);
  });

  it('adds the parts of a two-level text, with each chapter numbered in its part and through the text', () => {
    // Fixture and counts: tests/text/books.test.ts (two-level.txt, words by `wc -w` over each chapter's lines).
    const text = readFileSync(new URL('../fixtures/headings/two-level.txt', import.meta.url), 'utf8');
    const r = structure.compute(context(text), structure.params.parse({}));
    expect(r.chapters.map((c) => [c.number, c.partNumber, c.numberInPart])).toEqual([
      [1, null, null], [2, 1, 1], [3, 1, 2], [4, 1, 3], [5, 2, 1], [6, 2, 2], [7, 3, 1], [8, null, null],
    ]);
    expect(r.parts!.map((p) => [p.number, p.title, p.firstChapter, p.chapters, p.words])).toEqual([
      [1, 'Book One: The Mill', 2, 3, 39 + 48 + 8],
      [2, 'Book Two: The Miller', 5, 2, 82 + 11],
      [3, 'Book Three', 7, 1, 50],
    ]);
    const table = structure.table(r, { unit: 'words' });
    expect(table.columns.map((c) => c.key)).toEqual(['number', 'title', 'part', 'words', 'paragraphs', 'sentences', 'meanSentence']);
    expect(table.rows[5]!.slice(0, 4)).toEqual([6, 'Book Two, Chapter II', 'Book Two: The Miller', 11]);
  });

  it('rejects unknown parameters', () => {
    expect(structure.params.safeParse({ units: 'words' }).success).toBe(false);
  });
});

describe('curator notes on a two-level text', () => {
  const text = readFileSync(new URL('../fixtures/headings/two-level.txt', import.meta.url), 'utf8');
  const r = structure.compute(context(text), structure.params.parse({}));
  const bars = structure.views.bars!(r, { unit: 'words' });
  const facts = { chapters: r.chapters, parts: r.parts, cast: [] };
  const where = { file: 'exhibit.yaml', line: 1, column: 1, path: 'rooms[0].panels[0].notes[0]' };

  it('finds { part: 2, chapter: 2 } as the sixth chapter, and { chapter: 6 } as the same one', () => {
    expect(exactTarget({ part: 2, chapter: 2 }, facts)).toEqual({ at: { chapter: 6, title: 'Book Two, Chapter II' }, target: 'Book Two, Chapter II', passage: { chapter: 6, paragraph: null } });
    expect(exactTarget({ chapter: 6 }, facts)).toEqual(exactTarget({ part: 2, chapter: 2 }, facts));
    const drawn = drawPanel(charts.bars, bars, {}, [{ at: { part: 2, chapter: 2 }, text: 'The miller’s chapter.', where }], facts);
    expect(drawn.problems).toEqual([]);
    expect(drawn.out.svg).toMatch(/data-category="Book Two, Chapter II">(?:(?!vt-bar-group).)*data-note="1"/);
  });

  it('says what is wrong with a part or chapter the text does not have', () => {
    expect(exactTarget({ part: 4, chapter: 1 }, facts)).toMatchObject({ problem: 'the note points at part 4, but the text has 3 parts' });
    expect(exactTarget({ part: 3, chapter: 2 }, facts)).toMatchObject({ problem: 'the note points at chapter 2 of Book Three, which has 1 chapter' });
    const flat = structure.compute(context(TALE), structure.params.parse({}));
    expect(exactTarget({ part: 1, chapter: 1 }, { chapters: flat.chapters, parts: flat.parts, cast: [] })).toMatchObject({ problem: 'the note points at part 1, but the text has no parts' });
  });

  it('takes a part only together with a chapter in the plan', () => {
    expect(noteAnchorSchema.safeParse({ part: 2, chapter: 3 }).success).toBe(true);
    expect(noteAnchorSchema.safeParse({ part: 2 }).success).toBe(false);
    expect(noteAnchorSchema.safeParse({ part: 2, chapter: 3, word: 'mill' }).success).toBe(false);
  });
});
