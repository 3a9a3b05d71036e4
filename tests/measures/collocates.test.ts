import { describe, it, expect } from 'vitest';
import { collocates } from '../../pipeline/measures/collocates.ts';
import { context } from './fixture.ts';
import lists from 'stopwords-iso/stopwords-iso.json' with { type: 'json' };

// Tokens (counted by hand): the(0) heron(1) waited(2) by(3) the(4) weir(5) | a(6) grey(7) heron(8) stood(9) still(10) |
// the(11) weir(12) was(13) loud(14); three sentences, one paragraph, N = 15.
const WEIR = 'CHAPTER 1.\n\nThe heron waited by the weir. A grey heron stood still. The weir was loud.\n';

describe('collocates', () => {
  const ctx = context(WEIR);
  const base = { node: 'heron', left: 2, right: 4, stopwords: false, minFrequency: 1, top: 50 };

  it('counts the words in the window, cut at the sentence end', () => {
    const r = collocates.compute(ctx, collocates.params.parse(base));
    expect(r.nodeFrequency).toBe(2);
    const co = Object.fromEntries(r.collocates.map((c) => [c.word, [c.cooccurrences, c.left, c.right]]));
    // heron(1): the(0) | waited by the weir; heron(8): a grey | stood still (the sentence ends there).
    expect(co).toEqual({
      the: [2, 1, 1],
      waited: [1, 0, 1],
      by: [1, 0, 1],
      weir: [1, 0, 1],
      a: [1, 1, 0],
      grey: [1, 1, 0],
      stood: [1, 0, 1],
      still: [1, 0, 1],
    });
  });

  it('runs on across sentences when the boundary is the paragraph, and scores by the formulas', () => {
    const r = collocates.compute(ctx, collocates.params.parse({ ...base, boundary: 'paragraph' }));
    const weir = r.collocates.find((c) => c.word === 'weir')!;
    expect(weir.cooccurrences).toBe(2);
    // Regression values worked by hand from the formulas (no published example uses these counts): N = 15,
    // f(heron) = 2, f(weir) = 2, O = 2. Slots: heron(1) has one word to its left (the text starts) and
    // four to its right, 5; heron(8) has a grey | stood still the weir, 6 — S = 11, not 2·(2 + 4) = 12.
    // E = 11·2/15 ≈ 1.4667, PMI = log₂(2/1.4667) ≈ 0.4475 (Church & Hanks 1990), t = (2 − 1.4667)/√2 ≈ 0.3771
    // (Church et al. 1991), logDice = 14 + log₂(2·2/(2 + 2)) = 14 (Rychlý 2008).
    expect(r.slots).toBe(11);
    expect(weir.expected).toBeCloseTo(1.4667, 4);
    expect(weir.pmi).toBeCloseTo(0.4475, 4);
    expect(weir.tScore).toBeCloseTo(0.3771, 4);
    expect(weir.logDice).toBe(14);
    expect(r.collocates.find((c) => c.word === 'the')!.cooccurrences).toBe(3);
  });

  it('counts the window slots actually open in short sentences, and scores E, PMI and t from them', () => {
    // Regression value counted by hand (no published worked example of the slot count was found).
    // heron(0) waits(1) | rain(2) falls(3) on(4) the(5) heron(6) | the(7) heron(8) and(9) the(10) heron(11) fish(12).
    // Window 2 + 2, cut at sentence ends. heron(0): waits — 1 slot. heron(6): on the — 2. heron(8): the | and the — 3.
    // heron(11): its left words "and the" are already counted by heron(8) — fish, 1. S = 7, against 4·4 = 16 assumed
    // by f(n)·W. f(the) = 3, O(the) = 3, N = 13: E = 7·3/13 ≈ 1.6154, PMI = log₂(3/1.6154) ≈ 0.8931,
    // t = (3 − 1.6154)/√3 ≈ 0.7994. With 16 slots E would be 3.6923 and PMI −0.2996.
    const text = 'Heron waits. Rain falls on the heron. The heron and the heron fish.\n';
    const r = collocates.compute(context(text), collocates.params.parse({ ...base, left: 2, right: 2 }));
    expect(r.tokens).toBe(13);
    expect(r.nodeFrequency).toBe(4);
    expect(r.slots).toBe(7);
    const co = Object.fromEntries(r.collocates.map((c) => [c.word, c.cooccurrences]));
    expect(co).toEqual({ waits: 1, on: 1, the: 3, and: 1, fish: 1 });
    const the = r.collocates.find((c) => c.word === 'the')!;
    expect(the.expected).toBeCloseTo(1.6154, 4);
    expect(the.pmi).toBeCloseTo(0.8931, 4);
    expect(the.tScore).toBeCloseTo(0.7994, 4);
  });

  it('has S = f(n)·W when no window is cut or overlaps, so E is the usual f(n)·W·f(c)/N', () => {
    // Two occurrences with two words on each side inside one long sentence: S = 2·4 = 8 (by hand).
    const text = 'One two heron three four five six seven eight nine ten heron eleven twelve thirteen.\n';
    const r = collocates.compute(context(text), collocates.params.parse({ ...base, left: 2, right: 2 }));
    expect(r.slots).toBe(2 * 4);
    const two = r.collocates.find((c) => c.word === 'two')!;
    // f(two) = 1, N = 15: E = 8·1/15 = f(n)·W·f(c)/N with f(n) = 2, W = 4.
    expect(two.expected).toBeCloseTo((2 * 4 * 1) / 15, 4);
  });

  it('counts a position once when two windows overlap, and never the node itself', () => {
    // the(0) heron(1) and(2) the(3) heron(4) stood(5): windows [0, 3] and [2, 5] share "and the".
    const r = collocates.compute(context('The heron and the heron stood.\n'), collocates.params.parse({ ...base, right: 2 }));
    const co = Object.fromEntries(r.collocates.map((c) => [c.word, c.cooccurrences]));
    expect(co).toEqual({ the: 2, and: 1, stood: 1 });
  });

  it('takes a phrase as node, matched on consecutive words', () => {
    const r = collocates.compute(ctx, collocates.params.parse({ ...base, node: 'Grey Heron', left: 2, right: 2 }));
    expect(r.words).toEqual(['grey', 'heron']);
    expect(r.nodeFrequency).toBe(1);
    // Left: a (the sentence starts there); right: stood still.
    expect(r.collocates.map((c) => c.word).sort()).toEqual(['a', 'still', 'stood']);
  });

  it('leaves out stopwords and rare pairs, and sorts as asked', () => {
    const r = collocates.compute(ctx, collocates.params.parse({ ...base, stopwords: true }));
    const en = new Set((lists as Record<string, string[]>).en);
    expect(r.collocates.length).toBeGreaterThan(0);
    expect(r.collocates.every((c) => !en.has(c.word))).toBe(true);
    expect(collocates.compute(ctx, collocates.params.parse({ ...base, minFrequency: 2 })).collocates.map((c) => c.word)).toEqual(['the']);
    for (const sort of ['logDice', 'pmi', 'tScore', 'frequency'] as const) {
      const s = collocates.compute(ctx, collocates.params.parse({ ...base, sort }));
      const key = sort === 'frequency' ? 'cooccurrences' : sort;
      for (let i = 1; i < s.collocates.length; i++) expect(s.collocates[i - 1]![key]).toBeGreaterThanOrEqual(s.collocates[i]![key]);
    }
  });

  it('finds nothing for a word the text does not hold, and refuses an empty window', () => {
    expect(collocates.compute(ctx, collocates.params.parse({ node: 'otter' })).collocates).toEqual([]);
    expect(collocates.params.safeParse({ node: 'heron', left: 0, right: 0 }).success).toBe(false);
    expect(() => collocates.compute(ctx, collocates.params.parse({ node: '—' }))).toThrow(/holds no word/);
  });

  it('draws bars of the chosen score and logDice against co-occurrences', () => {
    const params = collocates.params.parse({ ...base, boundary: 'paragraph' });
    const r = collocates.compute(ctx, params);
    const bars = collocates.views.bars!(r, params);
    expect(bars.kind === 'bars' && bars.categories).toEqual(r.collocates.map((c) => c.word));
    expect(bars.kind === 'bars' && bars.series[0]!.values).toEqual(r.collocates.map((c) => c.logDice));
    const scatter = collocates.views.scatter!(r, params);
    expect(scatter.kind === 'scatter' && scatter.points.find((p) => p.id === 'weir')).toMatchObject({ x: 2, y: 14 });
  });
});
