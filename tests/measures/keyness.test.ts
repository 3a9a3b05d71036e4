import { describe, it, expect } from 'vitest';
import { keyness } from '../../pipeline/measures/keyness.ts';
import { context } from './fixture.ts';

/** A text of numbered chapters, each body given as its words (sentences of ten words). */
function chaptersOf(bodies: string[][]): string {
  return bodies
    .map((words, i) => {
      const sentences: string[] = [];
      for (let k = 0; k < words.length; k += 10) sentences.push(words.slice(k, k + 10).join(' ') + '.');
      return `CHAPTER ${i + 1}.\n\n${sentences.join(' ')}\n`;
    })
    .join('\n');
}

function repeat(word: string, n: number): string[] {
  return new Array<string>(n).fill(word);
}

describe('keyness', () => {
  // Two invented chapters of 1,000 words each carrying the frequencies of Rayson 2002 (two corpora of
  // 1,000,000 words): "brine" 348 vs 99 (G² 146.953), "tern" 9 vs 32 (13.682). With equal sizes G² depends
  // only on the two counts, so the published figures carry over. "gull" fills each chapter up to 1,000 words.
  const text = chaptersOf([
    [...repeat('brine', 348), ...repeat('tern', 9), ...repeat('gull', 643)],
    [...repeat('brine', 99), ...repeat('tern', 32), ...repeat('gull', 869)],
  ]);
  const ctx = context(text);

  it('reproduces Rayson 2002 through the measure: chapter 1 against the rest', () => {
    const r = keyness.compute(ctx, keyness.params.parse({ target: { chapter: 1 }, direction: 'both', p: 0.05 }));
    expect(r.comparisons).toHaveLength(1);
    const c = r.comparisons[0]!;
    expect([c.sizeA, c.sizeB]).toEqual([1000, 1000]);
    const brine = c.keywords.find((k) => k.word === 'brine')!;
    const tern = c.keywords.find((k) => k.word === 'tern')!;
    // Source: Rayson 2002 (keep 348 vs 99 → 146.953; keeping 9 vs 32 → 13.682).
    expect(brine).toMatchObject({ a: 348, b: 99, direction: 'positive', pBand: 'p < 0.0001', per10kA: 3480, per10kB: 990 });
    expect(brine.g2).toBeCloseTo(146.953, 3);
    expect(tern).toMatchObject({ a: 9, b: 32, direction: 'negative', pBand: 'p < 0.001' });
    expect(tern.g2).toBeCloseTo(13.682, 3);
    // Log Ratio (Hardie 2014) with equal sizes: log₂(348/99).
    expect(brine.logRatio).toBeCloseTo(Math.log2(348 / 99), 4);
    // Positive keywords come first, then negative ones.
    expect(c.keywords.map((k) => k.direction)).toEqual(['positive', 'negative', 'negative']);
    expect(c.referenceLabel).toBe('the rest of the text (chapter 2)');
  });

  it('compares each chapter with the rest, the mirror image for two chapters', () => {
    const r = keyness.compute(ctx, keyness.params.parse({ direction: 'both' }));
    expect(r.target).toBe('each-chapter');
    expect(r.comparisons.map((c) => c.chapter)).toEqual([1, 2]);
    const second = r.comparisons[1]!;
    expect(second.keywords.find((k) => k.word === 'brine')).toMatchObject({ a: 99, b: 348, direction: 'negative' });
    expect(second.keywords.find((k) => k.word === 'brine')!.g2).toBeCloseTo(146.953, 3);
  });

  it('keeps positive keywords at the chosen level by default and leaves stopwords out', () => {
    const withStop = context(
      chaptersOf([
        [...repeat('the', 60), ...repeat('heron', 20), ...repeat('gull', 20)],
        [...repeat('the', 10), ...repeat('heron', 2), ...repeat('gull', 88)],
      ]),
    );
    const r = keyness.compute(withStop, keyness.params.parse({ target: { chapter: 1 } }));
    // "the" is an English stopword in stopwords-iso: left out of the list, but counted in the sizes.
    expect(r.comparisons[0]!.keywords.map((k) => k.word)).toEqual(['heron']);
    expect(r.comparisons[0]!.sizeA).toBe(100);
    // Hand-worked: a = 20, b = 2, c = d = 100: E = 11 each, G² = 2[20 ln(20/11) + 2 ln(2/11)] ≈ 17.10.
    expect(r.comparisons[0]!.keywords[0]!.g2).toBeCloseTo(2 * (20 * Math.log(20 / 11) + 2 * Math.log(2 / 11)), 3);
    const all = keyness.compute(withStop, keyness.params.parse({ target: { chapter: 1 }, stopwords: false }));
    expect(all.comparisons[0]!.keywords.map((k) => k.word)).toEqual(['the', 'heron']);
    const strict = keyness.compute(withStop, keyness.params.parse({ target: { chapter: 1 }, p: 0.0001, stopwords: false }));
    // G²(the: 60 vs 10) ≈ 39.6 passes 15.13; G²(heron) ≈ 17.1 too. A minimum frequency of 21 leaves "the" alone.
    expect(strict.comparisons[0]!.keywords.map((k) => k.word)).toEqual(['the', 'heron']);
    const frequent = keyness.compute(withStop, keyness.params.parse({ target: { chapter: 1 }, stopwords: false, minFrequency: 21 }));
    expect(frequent.comparisons[0]!.keywords.map((k) => k.word)).toEqual(['the']);
  });

  it('says when the chapter does not exist or the text has one chapter', () => {
    expect(() => keyness.compute(ctx, keyness.params.parse({ target: { chapter: 3 } }))).toThrow(/chapter 3 does not exist/);
    const single = context('The heron waited by the weir, and the weir was loud.\n');
    expect(() => keyness.compute(single, keyness.params.parse({}))).toThrow(/single chapter/);
  });

  it('rejects unknown options and targets', () => {
    expect(keyness.params.safeParse({ target: 'chapter 1' }).success).toBe(false);
    expect(keyness.params.safeParse({ p: 0.02 }).success).toBe(false);
    expect(keyness.params.safeParse({ topN: 5 }).success).toBe(false);
  });

  it('draws signed G² bars, one panel per chapter, and Log Ratio against G²', () => {
    const params = keyness.params.parse({ target: { chapter: 1 }, direction: 'both', p: 0.05 });
    const r = keyness.compute(ctx, params);
    const bars = keyness.views.bars!(r, params);
    expect(bars.kind).toBe('bars');
    if (bars.kind !== 'bars') return;
    expect(bars.categories).toEqual(['brine', 'gull', 'tern']);
    expect(bars.series[0]!.values[0]).toBeCloseTo(146.953, 3);
    expect(bars.series[0]!.values[2]).toBeCloseTo(-13.682, 3);

    const eachParams = keyness.params.parse({ value: 'logRatio' });
    const each = keyness.compute(ctx, eachParams);
    const multiples = keyness.views.multiples!(each, eachParams);
    expect(multiples.kind === 'multiples' && multiples.panels.map((p) => p.id)).toEqual(['ch1', 'ch2']);
    const best = keyness.views.bars!(each, eachParams);
    expect(best.kind === 'bars' && best.categories).toEqual(['Ch. 1: brine', 'Ch. 2: gull']);

    const scatter = keyness.views.scatter!(r, params);
    expect(scatter.kind === 'scatter' && scatter.points.find((p) => p.label === 'brine')).toMatchObject({ x: expect.closeTo(Math.log2(348 / 99), 4), y: expect.closeTo(146.953, 3) });
  });

  it('lists one table row per keyword', () => {
    const params = keyness.params.parse({ direction: 'both' });
    const r = keyness.compute(ctx, params);
    const table = keyness.table(r, params);
    expect(table.rows).toHaveLength(r.comparisons.reduce((s, c) => s + c.keywords.length, 0));
    expect(table.columns.map((c) => c.key)).toContain('g2');
  });
});
