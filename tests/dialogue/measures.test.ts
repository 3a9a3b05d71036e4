import { describe, it, expect } from 'vitest';
import { speech } from '../../pipeline/measures/speech.ts';
import { conversation, OUTSIDE_ID, UNKNOWN_ID } from '../../pipeline/measures/conversation.ts';
import { measures } from '../../pipeline/measures/registry.ts';
import { tableToCsv } from '../../pipeline/stages/csv.ts';
import { CAST, context } from './helpers.ts';

const TEXT = [
  'CHAPTER I.',
  '',
  'Ada Fenn came down to the landing, where Osric Dunn was bailing his boat.',
  '',
  '“Well,” said Ada, “is the weir   shut?”',
  '',
  '“Since noon, Miss Fenn.”',
  '',
  '“And the sluice?”',
  '',
  '“Open,” said Osric.',
  '',
  'CHAPTER II.',
  '',
  'The board over the lock read “NO MOORING”, which nobody heeded.',
  '',
  '“It stood by the weir,” said Osric, “a great',
  'brick cone.',
  '',
  '“It stood there when I was a boy.',
  '',
  '“Then the gale came.”',
  '',
  '“Row on,” said Captain Marr from the bank.',
].join('\n');

// Counts are checked against the quotation list itself (words = word tokens inside the marks, share = a
// speaker's words ÷ all words of speech): definitions of the measure, common practice, no source.
describe('speech measure', () => {
  const ctx = context(TEXT, CAST);
  const params = speech.params.parse({});
  const r = speech.compute(ctx, params);

  it('is registered, needs a cast, and documents every parameter with its default', () => {
    expect(measures.speech).toBe(speech);
    expect(measures.conversation).toBe(conversation);
    expect(speech.needsCast).toBe(true);
    expect(params).toEqual({ includeText: true, maxQuotes: 20000 });
    for (const key of ['top', 'includeText', 'maxQuotes']) expect(speech.params.toJSONSchema().properties?.[key]).toMatchObject({ description: expect.stringMatching(/Default/) });
    expect(() => speech.params.parse({ unknown: 1 })).toThrow();
  });

  it('lists one entry per quoted span in text order, in the published shape', () => {
    expect(r.quotes.map((q) => q.text)).toEqual([
      'Well,',
      'is the weir shut?',
      'Since noon, Miss Fenn.',
      'And the sluice?',
      'Open,',
      'NO MOORING',
      'It stood by the weir,',
      'a great brick cone.',
      'It stood there when I was a boy.',
      'Then the gale came.',
      'Row on,',
    ]);
    for (const q of r.quotes) {
      expect(Object.keys(q)).toEqual(expect.arrayContaining(['text', 'speaker', 'addressee', 'chapter', 'turn', 'rule', 'confidence']));
    }
    expect(r.quotes[0]).toMatchObject({ text: 'Well,', speaker: 'ada', addressee: 'osric', chapter: 1, turn: 1, rule: 'tag', confidence: 0.95, kind: 'speech' });
    expect(r.quotes[1].turn).toBe(1);
    expect(r.quotes[2]).toMatchObject({ speaker: 'osric', addressee: 'ada', chapter: 1, turn: 2 });
    expect(r.quotes[5]).toMatchObject({ kind: 'text', speaker: null, turn: null, chapter: 2 });
    // A long speech: one entry per paragraph, one turn.
    expect(new Set(r.quotes.slice(6, 10).map((q) => q.turn)).size).toBe(1);
    expect(r.quotes[8]).toMatchObject({ speaker: 'osric', rule: 'tag' });
    expect(r.quotes[10]).toMatchObject({ speaker: null, rule: 'outsider' });
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it('counts turns and words per speaker, per chapter, and shares of all dialogue words', () => {
    const ada = r.speakers.find((s) => s.id === 'ada')!;
    expect(ada).toMatchObject({ turns: 2, words: 8, turnsPerChapter: [2, 0], wordsPerChapter: [8, 0] });
    const words = r.quotes.filter((q) => q.kind === 'speech').reduce((s, q) => s + q.words, 0);
    expect(r.totals.words).toBe(words);
    const shares = r.speakers.reduce((s, x) => s + x.share, 0) + r.unattributed.share;
    expect(shares).toBeCloseTo(1, 3);
    expect(r.speakers.map((s) => s.id)).toEqual(['osric', 'ada']);
    expect(r.totals).toMatchObject({ quotes: 11, speech: 10, text: 1, turns: 6 });
  });

  it('leaves written words out of the list when asked, and caps the list', () => {
    const only = speech.compute(ctx, speech.params.parse({ includeText: false }));
    expect(only.quotes.every((q) => q.kind === 'speech')).toBe(true);
    expect(only.omitted).toBe(1);
    const capped = speech.compute(ctx, speech.params.parse({ maxQuotes: 3, top: 1 }));
    expect(capped.quotes).toHaveLength(3);
    expect(capped.speakers).toHaveLength(1);
    expect(capped.totals.words).toBe(r.totals.words);
  });

  it('gives one table row per quotation (so one CSV line each) and bars and lines views', () => {
    const table = speech.table(r, params);
    expect(table.rows).toHaveLength(r.quotes.length);
    expect(tableToCsv(table).trimEnd().split('\r\n')).toHaveLength(r.quotes.length + 1);
    const bars = speech.views.bars!(r, params);
    const lines = speech.views.lines!(r, params);
    if (bars.kind !== 'bars' || lines.kind !== 'lines') throw new Error('wrong view kind');
    expect(bars.series[0].values.reduce((a, b) => a + b, 0)).toBe(r.totals.words);
    expect(lines.points).toHaveLength(2);
    expect(lines.series.map((s) => s.values.reduce((a, b) => a + b, 0)).reduce((a, b) => a + b, 0)).toBe(r.totals.words);
  });

  it('places each quotation at its first word, so that the table can link it to its paragraph', () => {
    const table = speech.table(r, params);
    const { tokens, text } = ctx.model;
    expect(table.places).toHaveLength(r.quotes.length);
    r.quotes.forEach((q, i) => {
      const [t] = table.places![i]!;
      expect(text.slice(tokens.start[t!], tokens.end[t!])).toBe(q.text.match(/[\p{L}\p{N}]+/u)![0]);
      expect(tokens.chapter[t!]! + 1).toBe(q.chapter);
    });
  });

  it('returns empty measures and a note for a text without quotations', () => {
    const none = speech.compute(context('CHAPTER I.\n\nThe river rose in the night.', CAST), params);
    expect(none.quotes).toEqual([]);
    expect(none.speakers).toEqual([]);
    expect(none.totals).toEqual({ quotes: 0, speech: 0, text: 0, turns: 0, words: 0 });
    expect(none.note).toMatch(/No speech was found/);
    expect(speech.table(none, params).rows).toEqual([]);
    const c = conversation.compute(context('The river rose.', CAST), conversation.params.parse({}));
    expect(c.rows).toEqual([]);
    expect(c.note).toMatch(/No dialogue/);
  });

  it('reports unbalanced marks with chapter and paragraph, and still counts the rest', () => {
    const bad = speech.compute(context('CHAPTER I.\n\n“Go,” said Ada.\n\nCHAPTER II.\n\nThe weir held.\n\n“Never closed, said Osric.\n\nRain.\n\n“Closed,” said Osric.', CAST), params);
    expect(bad.problems).toHaveLength(1);
    expect(bad.problems[0]).toMatchObject({ chapter: 2, paragraph: 2 });
    expect(bad.quotes.map((q) => q.speaker)).toEqual(['ada', null, 'osric']);
  });
});

describe('conversation measure', () => {
  const ctx = context(TEXT, CAST);
  const params = conversation.params.parse({});
  const r = conversation.compute(ctx, params);
  const s = speech.compute(ctx, speech.params.parse({}));
  const sum = (m: number[][]) => m.flat().reduce((a, b) => a + b, 0);

  it('adds up to the quotation list: every turn and every word of speech', () => {
    const spoken = s.quotes.filter((q) => q.kind === 'speech');
    expect(sum(r.turns)).toBe(new Set(spoken.map((q) => q.turn)).size);
    expect(sum(r.words)).toBe(spoken.reduce((a, q) => a + q.words, 0));
    expect(r.totals).toEqual({ turns: sum(r.turns), words: sum(r.words) });
    for (const ch of r.chapters) {
      const inCh = spoken.filter((q) => q.chapter === ch.number);
      expect(ch.pairs.reduce((a, p) => a + p.words, 0)).toBe(inCh.reduce((a, q) => a + q.words, 0));
    }
  });

  it('counts each speaker–addressee pair from the quotation list', () => {
    const cell = (from: string, to: string) => {
      const i = r.rows.findIndex((x) => x.id === from);
      const j = r.columns.findIndex((x) => x.id === to);
      return i < 0 || j < 0 ? 0 : r.words[i][j];
    };
    const spoken = s.quotes.filter((q) => q.kind === 'speech');
    for (const from of [...r.rows.map((x) => x.id)]) {
      for (const to of r.columns.map((x) => x.id)) {
        const row = (q: (typeof spoken)[number]) => q.speaker ?? (q.rule === 'outsider' ? OUTSIDE_ID : UNKNOWN_ID);
        const want = spoken.filter((q) => row(q) === from && (q.addressee ?? UNKNOWN_ID) === to).reduce((a, q) => a + q.words, 0);
        expect(cell(from, to)).toBe(want);
      }
    }
  });

  it('orders rows and columns by their totals, speakers outside the cast and unknown ones last', () => {
    const totals = r.rows.map((x) => x.words);
    const known = r.rows.filter((x) => x.id !== UNKNOWN_ID && x.id !== OUTSIDE_ID).map((x) => x.words);
    expect(known).toEqual([...known].sort((a, b) => b - a));
    // "Row on," said Captain Marr: a name outside the cast has its own row, after the cast.
    expect(r.rows.at(-1)!).toMatchObject({ id: OUTSIDE_ID, name: 'Outside the cast' });
    expect(totals.reduce((a, b) => a + b, 0)).toBe(r.totals.words);
    const withoutUnknown = conversation.compute(ctx, conversation.params.parse({ unknown: false }));
    expect(withoutUnknown.rows.some((x) => x.id === UNKNOWN_ID || x.id === OUTSIDE_ID)).toBe(false);
  });

  it('offers matrix and bars views of the same counts', () => {
    const m = conversation.views.matrix!(r, params);
    const b = conversation.views.bars!(r, params);
    if (m.kind !== 'matrix' || b.kind !== 'bars') throw new Error('wrong view kind');
    expect(m.values).toEqual(r.words);
    expect(m.rows.map((x) => x.id)).toEqual(r.rows.map((x) => x.id));
    expect(sum(b.series.map((x) => x.values))).toBe(r.totals.words);
    const byTurns = conversation.views.matrix!(conversation.compute(ctx, conversation.params.parse({ value: 'turns' })), conversation.params.parse({ value: 'turns' }));
    if (byTurns.kind !== 'matrix') throw new Error('wrong view kind');
    expect(sum(byTurns.values)).toBe(r.totals.turns);
  });
});
