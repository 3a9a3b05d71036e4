import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseCategoryLexicon } from '../../pipeline/lexicons/categories.ts';

// The word-list layouts (word–category pairs, pairs with a 0/1 flag, a 0/1 matrix under a
// header) are the usual shapes of word–category association lists: common practice, no source.
// Fixtures are invented words sorted into invented categories.
const fixture = (name: string): string => readFileSync(new URL(`../fixtures/lexicons/${name}`, import.meta.url), 'utf8');

describe('parseCategoryLexicon: the three layouts', () => {
  it('reads word<TAB>category pairs, with a header, comments, and a word in two categories', () => {
    const { lexicon, problems } = parseCategoryLexicon(fixture('moods-pairs.tsv'), 'moods-pairs.tsv', 'moods');
    expect(problems).toEqual([]);
    expect(lexicon!.id).toBe('moods');
    expect(lexicon!.categories).toEqual(['brightness', 'gloom', 'water']);
    expect(lexicon!.entries.mud).toEqual(['gloom', 'water']);
    expect(lexicon!.entries.lamps).toEqual(['brightness']);
    expect(Object.keys(lexicon!.entries)).toHaveLength(8);
  });

  it('reads word<TAB>category<TAB>0/1 rows, keeping only the 1s but every category named', () => {
    const { lexicon, problems } = parseCategoryLexicon(fixture('moods-flagged.tsv'), 'moods-flagged.tsv', 'moods');
    expect(problems).toEqual([]);
    expect(lexicon!.categories).toEqual(['brightness', 'gloom', 'water']);
    expect(lexicon!.entries).toEqual({ lamp: ['brightness'], dusk: ['gloom'], mud: ['gloom', 'water'] });
  });

  it('reads a header row word,<categories…> with 0/1 columns, quoted cells and typographic apostrophes', () => {
    const { lexicon, problems } = parseCategoryLexicon(fixture('moods-matrix.csv'), 'moods-matrix.csv', 'moods');
    expect(problems).toEqual([]);
    expect(lexicon!.categories).toEqual(['brightness', 'gloom', 'water']);
    expect(lexicon!.entries).toEqual({ lamp: ['brightness'], dusk: ['gloom'], mud: ['gloom', 'water'], "river's": ['water'] });
  });

  it('reads comma-separated pairs without a header, and a byte-order mark', () => {
    const { lexicon } = parseCategoryLexicon('\uFEFFLamp,brightness\nweir , water\n', 'x.csv', 'x');
    expect(lexicon!.entries).toEqual({ lamp: ['brightness'], weir: ['water'] });
  });

  it('does not let a word such as "constructor" reach the object prototype', () => {
    const { lexicon } = parseCategoryLexicon('lamp\tbrightness\n', 'x.tsv', 'x');
    expect(Object.hasOwn(lexicon!.entries, 'constructor')).toBe(false);
  });
});

describe('parseCategoryLexicon: problems name the line, the column and what to do', () => {
  it('an empty file', () => {
    const r = parseCategoryLexicon('\n# only a comment\n\n', 'empty.tsv', 'moods');
    expect(r.lexicon).toBeNull();
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ line: 1, column: 1 });
    expect(r.problems[0]!.message).toMatch(/"moods".*empty\.tsv.*no rows/);
    expect(r.problems[0]!.hint).toMatch(/word<TAB>category/);
  });

  it('a row with the wrong number of cells', () => {
    const r = parseCategoryLexicon('lamp\tbrightness\ndusk\tgloom\textra\nmud\n', 'ragged.tsv', 'moods');
    expect(r.lexicon).toBeNull();
    expect(r.problems.map((p) => [p.line, p.column])).toEqual([
      [2, 12],
      [3, 1],
    ]);
    expect(r.problems[0]!.message).toMatch(/3 cells but 2 are expected/);
    expect(r.problems[0]!.hint).toMatch(/word, category/);
  });

  it('a flag that is not 0 or 1, and a matrix cell that is not 0 or 1', () => {
    const flagged = parseCategoryLexicon('lamp\tbrightness\t1\ndusk\tgloom\tyes\n', 'f.tsv', 'm');
    expect(flagged.problems).toHaveLength(1);
    expect(flagged.problems[0]).toMatchObject({ line: 2, column: 12 });
    expect(flagged.problems[0]!.message).toMatch(/"yes", not 0 or 1/);
    const matrix = parseCategoryLexicon('word,gloom,water\nmud,1,2\n', 'm.csv', 'm');
    expect(matrix.problems[0]).toMatchObject({ line: 2, column: 7 });
    expect(matrix.problems[0]!.message).toMatch(/under "water" is "2"/);
  });

  it('a header with no categories, a blank or repeated category name', () => {
    expect(parseCategoryLexicon('word\nlamp\n', 'h.csv', 'm').problems[0]!.message).toMatch(/names no categories/);
    const blank = parseCategoryLexicon('word,gloom,,water\nmud,1,0,1\n', 'h.csv', 'm');
    expect(blank.problems[0]).toMatchObject({ line: 1, column: 12 });
    const twice = parseCategoryLexicon('word,gloom,gloom\nmud,1,0\n', 'h.csv', 'm');
    expect(twice.problems[0]!.message).toMatch(/named twice/);
  });

  it('no word in any category', () => {
    const r = parseCategoryLexicon('lamp\tgloom\t0\n', 'z.tsv', 'm');
    expect(r.lexicon).toBeNull();
    expect(r.problems[0]!.message).toMatch(/no word is marked/);
  });

  it('an empty word or category, a phrase, an unclosed quote, a one-cell first row', () => {
    const r = parseCategoryLexicon('lamp,brightness\n,gloom\nmud,\nhigh water,water\n"weir,water\n', 'p.csv', 'm');
    expect(r.problems.map((p) => p.line)).toEqual([2, 3, 4, 5]);
    expect(r.problems[1]!.column).toBe(5);
    expect(r.problems[2]!.message).toMatch(/more than one word/);
    expect(r.problems[3]!.message).toMatch(/quoted cell is not closed/);
    const one = parseCategoryLexicon('lamp brightness\n', 'o.txt', 'm');
    expect(one.problems[0]!.message).toMatch(/first row has 1 cell/);
    expect(one.problems[0]!.hint).toMatch(/separate the word and its category/);
  });
});
