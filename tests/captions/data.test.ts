/**
 * Caption figures against the panel's data: `<Value>` lookups, written figures held
 * against the data, and the words for what a chart draws. These are the project's own
 * rules for reading its data (common practice, no source); the data are invented, or
 * computed by the speech measure on an invented text.
 */
import { describe, expect, it } from 'vitest';
import { dataSets, formatValue, lookUpValue } from '../../pipeline/captions/values.ts';
import { figureMatches, knownValues, writtenFigures } from '../../pipeline/captions/figures.ts';
import { KIND_MARKS, strayMarks } from '../../pipeline/captions/marks.ts';
import { charts } from '../../pipeline/charts/index.ts';
import { speech } from '../../pipeline/measures/speech.ts';
import { CAST, context } from '../dialogue/helpers.ts';
import type { Table } from '../../pipeline/charts/types.ts';

const table: Table = {
  columns: [
    { key: 'rank', label: 'Rank', numeric: true },
    { key: 'word', label: 'Word', numeric: false },
    { key: 'count', label: 'Count', numeric: true },
    { key: 'per10k', label: 'Per 10,000 words', numeric: true },
    { key: 'offset', label: 'Character offset', numeric: true },
  ],
  rows: [
    [1, 'weir', 35, 48.05, 120],
    [2, 'ledger', 21, 28.8, 900],
  ],
};
const result = {
  total: 7284,
  totals: { words: 2245, turns: 112 },
  speakers: [
    { id: 'ada', name: 'Ada Fenn', turns: 28, words: 310, share: 0.1381 },
    { id: 'osric', name: 'Osric Dunn', turns: 20, words: 402, share: 0.179 },
  ],
  quotes: [
    { speaker: 'ada', words: 3, token: 10 },
    { speaker: 'ada', words: 7, token: 40 },
  ],
};
const sets = dataSets(table, result);

describe('<Value>: a figure from the panel’s data', () => {
  it('finds a field of a record by its name, in the table or in the result', () => {
    expect(lookUpValue(sets, { of: 'count', for: 'ledger' })).toMatchObject({ found: true, value: 21, set: 'table' });
    expect(lookUpValue(sets, { of: 'Per 10,000 words', for: 'WEIR' })).toMatchObject({ found: true, value: 48.05 });
    expect(lookUpValue(sets, { of: 'turns', for: 'ada' })).toMatchObject({ found: true, value: 28, set: 'speakers' });
    expect(lookUpValue(sets, { of: 'turns', for: 'Osric Dunn' })).toMatchObject({ found: true, value: 20 });
    expect(lookUpValue(sets, { of: 'totals.words' })).toMatchObject({ found: true, value: 2245, set: 'totals' });
    expect(lookUpValue(sets, { of: 'total' })).toMatchObject({ found: true, value: 7284, set: '' });
    expect(lookUpValue(sets, { of: 'count', for: '2' })).toMatchObject({ found: true, value: 21 });
  });

  it('passes over a set in which the name fits several records, and says when the answer is still not one figure', () => {
    // "words" of "ada": two quotations, one speaker record: the speaker's.
    expect(lookUpValue(sets, { of: 'words', for: 'ada' })).toMatchObject({ found: true, value: 310, set: 'speakers' });
    const two = dataSets(table, { ...result, readers: [{ id: 'ada', words: 12 }] });
    expect(lookUpValue(two, { of: 'words', for: 'ada' })).toEqual({ found: false, why: 'ambiguous', name: 'ada', choices: ['in="speakers"', 'in="readers"'] });
    expect(lookUpValue(two, { of: 'words', for: 'ada', in: 'readers' })).toMatchObject({ found: true, value: 12 });
  });

  it('says what is wrong, with the nearest name: a field, a record, a set, a record left out', () => {
    expect(lookUpValue(sets, { of: 'turn', for: 'ada' })).toMatchObject({ found: false, why: 'field', suggestion: 'turns' });
    expect(lookUpValue(sets, { of: 'turns', for: 'adda' })).toMatchObject({ found: false, why: 'record', suggestion: 'ada' });
    expect(lookUpValue(sets, { of: 'turns', for: 'ada', in: 'speaker' })).toMatchObject({ found: false, why: 'set', suggestion: 'speakers' });
    expect(lookUpValue(sets, { of: 'share' })).toMatchObject({ found: false, why: 'needs-record' });
    // Positions in the text are not figures.
    expect(lookUpValue(sets, { of: 'offset', for: 'weir' })).toMatchObject({ found: false, why: 'field' });
  });

  it('reads the speech measure’s own result: a speaker’s turns are the turns the measure counted', () => {
    const ctx = context(['CHAPTER I.', '', '“Well,” said Ada.', '', '“Since noon,” said Osric.', '', '“And the sluice?” said Ada.'].join('\n'), CAST);
    const params = speech.params.parse({});
    const r = speech.compute(ctx, params);
    const ada = r.speakers.find((s) => s.id === 'ada')!;
    expect(lookUpValue(dataSets(speech.table(r, params), r), { of: 'turns', for: 'ada' })).toMatchObject({ found: true, value: ada.turns });
  });

  it('shows a figure as printed: grouped thousands, a minus sign, decimals and percentages on request', () => {
    expect(formatValue(2245)).toBe('2,245');
    expect(formatValue(-0.878, { digits: 2 })).toBe('−0.88');
    expect(formatValue(0.1381, { percent: true, digits: 1 })).toBe('13.8%');
    expect(formatValue('weir')).toBe('weir');
    expect(formatValue(48.05)).toBe('48.05');
  });
});

describe('figures written in a caption', () => {
  const known = knownValues(table, result, { segments: 30 });
  const check = (prose: string) => writtenFigures(prose).map((f) => [f.text, figureMatches(f, known)]);

  it('matches a figure to the precision it is written in, or loosely after “about”', () => {
    expect(check('the speakers take 28 turns, in 2,245 words')).toEqual([['28', true], ['2,245', true]]);
    expect(check('Ada takes 31 turns')).toEqual([['31', false]]);
    // 29 is what 28.8 rounds to.
    expect(check('a rate of 29 in ten thousand')).toEqual([['29', true]]);
    expect(check('a rate of 48.1 per ten thousand, or 48')).toEqual([['48.1', true], ['48', true]]);
    expect(check('about 7,300 words, about 2,200 spoken')).toEqual([['7,300', true], ['2,200', true]]);
    expect(check('7,300 words')).toEqual([['7,300', false]]);
    expect(check('a share of 13.8%')).toEqual([['13.8', true]]);
    expect(check('cut into 30 slices')).toEqual([['30', true]]);
  });

  it('leaves out ordinals, years, chapter and paragraph numbers, and numbers joined to a name', () => {
    expect(writtenFigures('the 1st of May 2026, chapter 4, chapters 2 and 3, ¶ 33, paragraph 12, AFINN-165, G²')).toEqual([]);
    expect(writtenFigures('−0.88 and +5').map((f) => f.value)).toEqual([-0.88, 5]);
  });

  it('does not read positions in the text as figures of the data', () => {
    expect(check('120 and 900')).toEqual([['120', false], ['900', false]]);
  });
});

describe('the words for what a chart draws', () => {
  it('has a vocabulary for every chart kind', () => {
    expect(Object.keys(KIND_MARKS).sort()).toEqual(Object.keys(charts).sort());
  });

  it('finds cells on a strip and bars on a line chart, not the words each draws', () => {
    expect(strayMarks('Each row is a character; each cell is shaded by how often.', 'strip').map((m) => m.text)).toEqual(['cell', 'shaded']);
    expect(strayMarks('Each stroke is one occurrence, a tick mark.', 'strip')).toEqual([]);
    expect(strayMarks('The taller bars are the later chapters.', 'lines').map((m) => m.text)).toEqual(['bars']);
    expect(strayMarks('Each bar is a chapter.', 'bars')).toEqual([]);
    expect(strayMarks('The bar of the river, the barge and the barrel.', 'lines').map((m) => m.text)).toEqual(['bar']);
  });
});
