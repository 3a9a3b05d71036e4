import { describe, it, expect } from 'vitest';
import { dispersion } from '../../pipeline/measures/dispersion.ts';
import { context } from './fixture.ts';
import lists from 'stopwords-iso/stopwords-iso.json' with { type: 'json' };

/** A text whose chapters hold the given bodies. */
function chaptersOf(bodies: string[]): string {
  return bodies.map((body, i) => `CHAPTER ${i + 1}.\n\n${body}\n`).join('\n');
}

// Source: Gries 2008 (IJCL 13(4)), the toy corpus of five parts of ten tokens each.
const TOY = chaptersOf([
  'b a m n i b e u p k',
  'b a s a t b e w q n',
  'b c a g a b e s t a',
  'b a g h a b e a a t',
  'b a h a a b e a x a',
]);

describe('dispersion', () => {
  const toy = context(TOY);

  it('reproduces Gries’ toy corpus through the measure: "a" has DP 0.2 and DPnorm 0.25', () => {
    const r = dispersion.compute(toy, dispersion.params.parse({ words: ['a'] }));
    expect(r.parts.map((p) => p.tokens)).toEqual([10, 10, 10, 10, 10]);
    const a = r.words[0]!;
    expect(a.frequency).toBe(15);
    expect(a.perPart).toEqual([1, 2, 3, 4, 5]);
    // Source: Gries 2008 (DP 0.2); Lijffijt & Gries 2012 (DPnorm = DP / (1 − 0.2) = 0.25); recomputed.
    expect(a.dp).toBeCloseTo(0.2, 4);
    expect(a.dpNorm).toBeCloseTo(0.25, 4);
    // Juilland's D over the rates 0.1 … 0.5: μ = 0.3, σ = √0.02, D = 1 − (√0.02/0.3)/2 ≈ 0.7643 (recomputed by hand).
    expect(a.juillandD).toBeCloseTo(0.7643, 4);
  });

  it('gives the same parts when the toy corpus is cut into five equal segments', () => {
    const r = dispersion.compute(toy, dispersion.params.parse({ words: ['a'], by: 'segment', segments: 5 }));
    expect(r.parts.map((p) => p.tokens)).toEqual([10, 10, 10, 10, 10]);
    expect(r.words[0]!.perPart).toEqual([1, 2, 3, 4, 5]);
    expect(r.words[0]!.dp).toBeCloseTo(0.2, 4);
  });

  it('reproduces Lijffijt & Gries 2012, Table 1 through the measure', () => {
    // Three equal chapters holding 2/3, 1/3 and 0 of "heron" → DP 0.333, DPnorm 0.5 (Lijffijt & Gries 2012, Table 1).
    const ctx = context(chaptersOf(['heron heron gull gull gull gull', 'heron gull gull gull gull gull', 'gull gull gull gull gull gull']));
    const w = dispersion.compute(ctx, dispersion.params.parse({ words: ['heron'] })).words[0]!;
    expect(w.dp).toBeCloseTo(0.333, 3);
    expect(w.dpNorm).toBeCloseTo(0.5, 4);
  });

  it("reproduces the 1970 usage-coefficient report's five-part examples through the measure", () => {
    // Five chapters of ten words; "heron" 0, 4, 3, 2, 1 times → Juilland's D 0.6464 (the ETS usage-coefficient report, 1970, recomputed);
    // "tern" 2, 1, 1, 1, 0 times → the entropy-based D₂ 0.8277 (the ETS usage-coefficient report, 1970, recomputed).
    const fill = (heron: number, tern: number) =>
      [...new Array<string>(heron).fill('heron'), ...new Array<string>(tern).fill('tern'), ...new Array<string>(10 - heron - tern).fill('gull')].join(' ');
    const ctx = context(chaptersOf([fill(0, 2), fill(4, 1), fill(3, 1), fill(2, 1), fill(1, 0)]));
    const [heron, tern] = dispersion.compute(ctx, dispersion.params.parse({ words: ['heron', 'tern'] })).words;
    expect(heron!.perPart).toEqual([0, 4, 3, 2, 1]);
    expect(heron!.juillandD).toBeCloseTo(0.6464, 4);
    expect(tern!.entropyD2).toBeCloseTo(0.8277, 4);
  });

  it('measures the most frequent words when none are named, stopwords left out unless asked', () => {
    const all = dispersion.compute(toy, dispersion.params.parse({ top: 2, stopwords: false }));
    expect(all.words.map((w) => [w.word, w.frequency])).toEqual([
      ['a', 15],
      ['b', 10],
    ]);
    const en = new Set((lists as Record<string, string[]>).en);
    const filtered = dispersion.compute(toy, dispersion.params.parse({ top: 5 }));
    expect(filtered.words.every((w) => !en.has(w.word))).toBe(true);
    expect(filtered.stopwordList).toBe('stopwords-iso (en)');
  });

  it('lists every position, or an evenly spaced sample beyond maxPositions', () => {
    const full = dispersion.compute(toy, dispersion.params.parse({ words: ['a'] })).words[0]!;
    expect(full.positions).toHaveLength(15);
    expect(full.positionsSampled).toBe(false);
    // Counted by hand: "a" is token 1 of part 1 (tokens 0–9), tokens 11 and 13 of part 2, …
    expect(full.positions.slice(0, 3)).toEqual([1, 11, 13]);
    for (const t of full.positions) expect(toy.model.vocab[toy.model.tokens.type[t]!]).toBe('a');
    const capped = dispersion.compute(toy, dispersion.params.parse({ words: ['a'], maxPositions: 5 })).words[0]!;
    expect(capped.positionsSampled).toBe(true);
    expect(capped.positions).toEqual([0, 3, 6, 9, 12].map((k) => full.positions[k]));
    expect(capped.dp).toBe(full.dp);
  });

  it('matches phrases within a sentence, and gives no score to an absent word', () => {
    const r = dispersion.compute(toy, dispersion.params.parse({ words: ['b a', 'k b', 'heron'] }));
    // "b a" opens parts 1, 2, 4 and 5; "k b" would run across the end of part 1 into part 2.
    expect(r.words[0]!.perPart).toEqual([1, 1, 0, 1, 1]);
    expect(r.words[1]!.frequency).toBe(0);
    expect(r.words[2]).toMatchObject({ word: 'heron', frequency: 0, dp: null, dpNorm: null, juillandD: null, positions: [] });
  });

  it('draws a strip with chapter boundaries and DP bars', () => {
    const params = dispersion.params.parse({ words: ['a', 'heron'] });
    const r = dispersion.compute(toy, params);
    const strip = dispersion.views.strip!(r, params);
    expect(strip.kind === 'strip' && strip.boundaries.map((b) => b.at)).toEqual([0, 0.2, 0.4, 0.6, 0.8]);
    expect(strip.kind === 'strip' && strip.rows[0]!.positions[0]).toBeCloseTo(1 / 50, 12);
    const bars = dispersion.views.bars!(r, params);
    // An absent word has no DP and no bar.
    expect(bars.kind === 'bars' && bars.categories).toEqual(['a']);
    expect(bars.kind === 'bars' && bars.series[0]!.values).toEqual([0.2]);
  });
});
