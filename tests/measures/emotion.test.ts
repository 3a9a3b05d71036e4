import { describe, it, expect } from 'vitest';
import { paramDocs } from '../../pipeline/stages/param-docs.ts';
import { readFileSync } from 'node:fs';
import { emotion } from '../../pipeline/measures/emotion.ts';
import { parseCategoryLexicon } from '../../pipeline/lexicons/categories.ts';
import { context } from './fixture.ts';

// An invented text and an invented word list (tests/fixtures/lexicons/moods-pairs.tsv):
// brightness = lamp, lamps, light; gloom = dusk, dark, mud; water = mud, river, tide.
const TEXT = [
  'CHAPTER I.',
  '',
  'At dusk the lamps were lit along the river.',
  '',
  'CHAPTER II.',
  '',
  'The tide left mud, dark mud, under the lamp light.',
  '',
].join('\n');

const lexicon = parseCategoryLexicon(
  readFileSync(new URL('../fixtures/lexicons/moods-pairs.tsv', import.meta.url), 'utf8'),
  'moods-pairs.tsv',
  'moods',
).lexicon!;

describe('emotion', () => {
  const ctx = { ...context(TEXT), lexicons: { moods: lexicon } };
  const run = (p: object = {}) => emotion.compute(ctx, emotion.params.parse({ lexicon: 'moods', ...p }));

  it('counts the words of each category per chapter, per 1,000 words', () => {
    const r = run();
    expect(r.categories).toEqual(['brightness', 'gloom', 'water']);
    // Counted by hand. Chapter I (9 words): lamps → brightness 1; dusk → gloom 1; river → water 1.
    expect(r.chapters[0]).toMatchObject({ tokens: 9, counts: [1, 1, 1] });
    expect(r.chapters[0]!.per1000[0]).toBeCloseTo(1000 / 9, 3);
    // Chapter II (10 words): lamp, light → 2; mud ×2, dark → gloom 3; tide, mud ×2 → water 3.
    expect(r.chapters[1]).toMatchObject({ tokens: 10, counts: [2, 3, 3], per1000: [200, 300, 300] });
    expect(r.whole.counts).toEqual([3, 4, 4]);
    expect(r.matchedTypes).toBe(8);
    expect(r.words.find((w) => w.category === 'gloom')!.words[0]).toEqual({ word: 'mud', count: 2 });
  });

  it('counts equal segments of narrative time', () => {
    // 19 words in 2 segments: words 1–9 (chapter I exactly) and 10–19.
    const r = run({ segments: 2 });
    expect(r.segments.map((s) => s.counts)).toEqual([
      [1, 1, 1],
      [2, 3, 3],
    ]);
    expect(r.segments[1]!.label).toBe('Segment 2 (words 10–19)');
  });

  it('keeps only the categories asked for, in that order, and names a missing one', () => {
    expect(run({ categories: ['water', 'gloom'] }).whole.counts).toEqual([4, 4]);
    expect(() => run({ categories: ['joy'] })).toThrow(/"joy", not in the word list "moods"/);
  });

  it('says clearly when the word list is not loaded', () => {
    const bare = context(TEXT);
    expect(() => emotion.compute(bare, emotion.params.parse({ lexicon: 'moods' }))).toThrow(/word list "moods" is not loaded.*lexicons/);
    expect(() => emotion.compute(ctx, emotion.params.parse({ lexicon: 'feelings' }))).toThrow(/"feelings" is not among the plan's word lists \(moods\)/);
    expect(emotion.params.safeParse({}).success).toBe(false);
  });

  it('draws lines, bars and small multiples', () => {
    const params = emotion.params.parse({ lexicon: 'moods', by: 'chapter' });
    const r = emotion.compute(ctx, params);
    const lines = emotion.views.lines!(r, params);
    if (lines.kind !== 'lines') throw new Error('lines expected');
    expect(lines.series.map((s) => s.id)).toEqual(['brightness', 'gloom', 'water']);
    expect(lines.points).toEqual(['Chapter I', 'Chapter II']);
    const bars = emotion.views.bars!(r, params);
    if (bars.kind !== 'bars') throw new Error('bars expected');
    expect(bars.categories).toEqual(['brightness', 'gloom', 'water']);
    expect(bars.series[0]!.values[1]).toBeCloseTo((4 / 19) * 1000, 3);
    const grouped = emotion.views.bars!(r, { ...params, bars: 'positions' });
    if (grouped.kind !== 'bars') throw new Error('bars expected');
    expect(grouped.categories).toEqual(['Chapter I', 'Chapter II']);
    const multiples = emotion.views.multiples!(r, params);
    if (multiples.kind !== 'multiples') throw new Error('multiples expected');
    expect(multiples.panels.map((p) => p.id)).toEqual(['brightness', 'gloom', 'water']);
    expect(multiples.panels[2]!.data.kind).toBe('lines');
    expect(emotion.table(r, params).columns.map((c) => c.key).slice(0, 4)).toEqual(['position', 'words', 'brightness-count', 'brightness-rate']);
  });

  it('keeps every option documented', () => {
    expect(paramDocs(emotion.params).length).toBeGreaterThan(4);
    for (const { key, description } of paramDocs(emotion.params)) expect(description, key).toMatch(/Default|Required/);
  });
});
