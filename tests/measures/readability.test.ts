import { describe, it, expect } from 'vitest';
import { paramDocs } from '../../pipeline/stages/param-docs.ts';
import { readability } from '../../pipeline/measures/readability.ts';
import { context } from './fixture.ts';

// Invented text. Sentence 1: 13 words, 24 syllables by dictionary division (from memory):
// The(1) fer·ry·man(3) con·sid·ered(3) the(1) al·ma·nac(3) care·ful·ly(3) be·fore(2)
// eve·ning(2) tide(1) came(1) o·ver(2) the(1) quay(1) = 24.
const LONG = 'The ferryman considered the almanac carefully before evening tide came over the quay.';
const SHORT = 'Go. Run. Sit. Eat.';

const TEXT = ['CHAPTER I.', '', LONG, '', 'CHAPTER II.', '', SHORT, ''].join('\n');

describe('readability', () => {
  const ctx = context(TEXT);
  const run = (p: object = {}) => readability.compute(ctx, readability.params.parse(p));

  it('scores a 13-word, 24-syllable sentence at FKGL 11.265 and FRE 37.455', () => {
    // Source: Flesch 1948; Kincaid et al. 1975 — worked example recomputed (see tests/stats/readability.test.ts).
    const ch1 = run().positions[0]!;
    expect(ch1).toMatchObject({ words: 13, sentences: 1, syllables: 24 });
    expect(ch1.grade).toBeCloseTo(11.265, 3);
    expect(ch1.ease).toBeCloseTo(37.455, 3);
  });

  it('gives the Reading Ease upper bound 121.22 for one-word, one-syllable sentences', () => {
    // Source: Flesch 1948 formula, 206.835 − 1.015 − 84.6 = 121.22 (recomputed).
    const ch2 = run().positions[1]!;
    expect(ch2).toMatchObject({ words: 4, sentences: 4, syllables: 4, medianSentence: 1, longestSentence: 1 });
    expect(ch2.ease).toBeCloseTo(121.22, 2);
  });

  it('scores the whole text from its pooled counts', () => {
    const whole = run().whole;
    expect(whole).toMatchObject({ words: 17, sentences: 5, syllables: 28 });
    // FKGL = 0.39×17/5 + 11.8×28/17 − 15.59, by hand.
    expect(whole.grade).toBeCloseTo(0.39 * 3.4 + (11.8 * 28) / 17 - 15.59, 3);
  });

  it('draws grades per chapter as bars and lines, and ease on request', () => {
    const params = readability.params.parse({});
    const r = readability.compute(ctx, params);
    const bars = readability.views.bars!(r, params);
    expect(bars.kind).toBe('bars');
    if (bars.kind !== 'bars') return;
    expect(bars.categories).toEqual(['Chapter I', 'Chapter II']);
    expect(bars.series[0]!.values[0]).toBeCloseTo(11.265, 3);
    const easeParams = readability.params.parse({ score: 'ease' });
    const lines = readability.views.lines!(readability.compute(ctx, easeParams), easeParams);
    if (lines.kind !== 'lines') throw new Error('lines expected');
    expect(lines.series[0]!.values[1]).toBeCloseTo(121.22, 2);
    expect(lines.ticks).toEqual(['1', '2']);
  });

  it('bins sentence lengths for a histogram', () => {
    const params = readability.params.parse({ bars: 'lengths', binWidth: 5, maxLength: 10 });
    const r = readability.compute(ctx, params);
    // Four one-word sentences in 1–5, the 13-word sentence in 11+.
    expect(r.histogram.map((b) => [b.label, b.count])).toEqual([
      ['1–5', 4],
      ['6–10', 0],
      ['11+', 1],
    ]);
    const table = readability.table(r, params);
    expect(table.rows).toEqual([
      ['1–5', 4],
      ['6–10', 0],
      ['11+', 1],
    ]);
  });

  it('scores equal segments, a sentence counted where it starts', () => {
    const r = run({ by: 'segment', segments: 2 });
    // 17 words → segments of words 1–8 and 9–17; the long sentence starts in the first.
    expect(r.positions.map((p) => p.sentences)).toEqual([1, 4]);
    expect(r.positions[0]!.label).toBe('Segment 1 (words 1–8)');
  });

  it('keeps every option documented with its default', () => {
    expect(paramDocs(readability.params).length).toBeGreaterThan(4);
    for (const { key, description } of paramDocs(readability.params)) expect(description, key).toMatch(/Default/);
  });
});
