import { describe, it, expect } from 'vitest';
import { frequency } from '../../pipeline/measures/frequency.ts';
import { context, TALE } from './fixture.ts';
import lists from 'stopwords-iso/stopwords-iso.json' with { type: 'json' };

describe('frequency', () => {
  const ctx = context(TALE);

  it('ranks content words by count, leaving out the stopwords of stopwords-iso (en)', () => {
    const r = frequency.compute(ctx, frequency.params.parse({ top: 5 }));
    // Source: stopwords-iso's English list contains "the", "and", "at" (checked against the package data below).
    const en = new Set((lists as Record<string, string[]>).en);
    for (const w of ['the', 'and', 'at']) expect(en.has(w)).toBe(true);
    expect(r.words.every((w) => !en.has(w.word))).toBe(true);
    // Counted by hand: "barges" 4, "estuary" 4 (tie broken alphabetically), "milo" 3 ("lock-keeper" is one word, not "lock").
    expect(r.words.slice(0, 3).map((w) => [w.word, w.count])).toEqual([
      ['barges', 4],
      ['estuary', 4],
      ['milo', 3],
    ]);
  });

  it('gives rates per 10,000 words and per-chapter counts that add up', () => {
    const r = frequency.compute(ctx, frequency.params.parse({ top: 3 }));
    for (const w of r.words) {
      // Relative frequency per 10,000 tokens (common practice, no source).
      expect(w.per10k).toBeCloseTo((w.count / r.tokens) * 10000, 2);
      expect(w.perChapter.reduce((a, b) => a + b, 0)).toBe(w.count);
    }
  });

  it('counts one chapter when asked, and says so when the chapter does not exist', () => {
    const r = frequency.compute(ctx, frequency.params.parse({ top: 3, chapter: 2 }));
    expect(r.scope.chapter).toBe(2);
    expect(r.words[0]).toMatchObject({ word: 'barges', count: 4 });
    expect(() => frequency.compute(ctx, frequency.params.parse({ chapter: 9 }))).toThrow(/chapter 9/);
  });

  it('keeps stopwords when asked', () => {
    const r = frequency.compute(ctx, frequency.params.parse({ top: 1, stopwords: false, minLength: 1 }));
    expect(r.words[0]!.word).toBe('the');
  });
});
