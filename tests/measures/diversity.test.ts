import { describe, it, expect } from 'vitest';
import { paramDocs } from '../../pipeline/stages/param-docs.ts';
import { diversity } from '../../pipeline/measures/diversity.ts';
import { context } from './fixture.ts';

// Invented text. Chapter I repeats the pattern of McCarthy & Jarvis's nine-word MTLD hand example
// with our own noun; chapter II has a numeral, which is left out by default.
const TEXT = ['CHAPTER I.', '', 'Of the river, by the river, for the river.', '', 'CHAPTER II.', '', 'Tide rose, tide fell; rose 1848 tide.', ''].join('\n');

describe('diversity', () => {
  const ctx = context(TEXT);
  const run = (p: object = {}) => diversity.compute(ctx, diversity.params.parse(p));

  it('gives MTLD 9 for the nine-word hand example, both ways', () => {
    // Source: McCarthy & Jarvis 2010 (threshold 0.72, partial factor); hand example recomputed.
    const ch1 = run().positions[0]!;
    expect(ch1).toMatchObject({ tokens: 9, types: 5, mtld: 9, mtldForward: 9, mtldBackward: 9 });
    expect(ch1.ttr).toBeCloseTo(5 / 9, 4);
  });

  it('computes MATTR by hand, and falls back to TTR (flagged) for a chapter shorter than the window', () => {
    // By hand, window 3 over "tide rose tide fell rose tide": (2/3 + 1 + 1 + 1) / 4 = 11/12.
    const ch2 = run({ window: 3 }).positions[1]!;
    expect(ch2).toMatchObject({ tokens: 6, types: 3, mattrWindows: 4, mattrFallback: false });
    expect(ch2.mattr).toBeCloseTo(11 / 12, 4);
    // Default window 500 (the measure's own default, stated on its method card) is longer than the chapter.
    const fallback = run().positions[1]!;
    expect(fallback).toMatchObject({ mattr: 0.5, mattrWindows: 0, mattrFallback: true });
    expect(diversity.table(run(), diversity.params.parse({})).rows[1]![5]).toMatch(/shorter than the window/);
  });

  it('counts numerals when asked', () => {
    expect(run({ numbers: true }).positions[1]).toMatchObject({ tokens: 7, types: 4 });
  });

  it('measures the whole text as one sequence', () => {
    const whole = run({ window: 5 }).whole;
    expect(whole).toMatchObject({ tokens: 15, types: 8 });
    expect(whole.ttr).toBeCloseTo(8 / 15, 4);
  });

  it('draws the chosen score per chapter', () => {
    const params = diversity.params.parse({ score: 'mtld' });
    const bars = diversity.views.bars!(diversity.compute(ctx, params), params);
    if (bars.kind !== 'bars') throw new Error('bars expected');
    expect(bars.categories).toEqual(['Chapter I', 'Chapter II']);
    expect(bars.series[0]!.values[0]).toBe(9);
    const lines = diversity.views.lines!(diversity.compute(ctx, diversity.params.parse({})), diversity.params.parse({}));
    if (lines.kind !== 'lines') throw new Error('lines expected');
    expect(lines.series[0]!.id).toBe('mattr');
  });

  it('keeps every option documented with its default', () => {
    expect(paramDocs(diversity.params).length).toBeGreaterThan(4);
    for (const { key, description } of paramDocs(diversity.params)) expect(description, key).toMatch(/Default/);
  });
});
