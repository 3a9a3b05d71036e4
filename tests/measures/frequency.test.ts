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

describe('frequency by lemma, part of speech and chapter', () => {
  const WALKS = [
    'CHAPTER I.',
    '',
    'Ysolde walks to the weir. Yesterday she walked to the granary, and tomorrow she is walking to the ferry.',
    '',
    'CHAPTER II.',
    '',
    'The ferry waited. The ferries of Brackenmouth wait for nobody, and the ferryman waits for nothing.',
    '',
  ].join('\n');
  const ctx = context(WALKS);

  it('counts "walks, walked, walking" as one lemma "walk"', () => {
    // Inflections of one verb share its lemma: common grammar-handbook fact, no source.
    const forms = frequency.compute(ctx, frequency.params.parse({ top: 50 }));
    expect(forms.words.filter((w) => w.word.startsWith('walk')).map((w) => w.count)).toEqual([1, 1, 1]);
    const lemmas = frequency.compute(ctx, frequency.params.parse({ top: 50, unit: 'lemma' }));
    const walk = lemmas.words.find((w) => w.word === 'walk')!;
    expect(walk.count).toBe(3);
    expect(walk.perChapter).toEqual([3, 0]);
    expect(walk.forms!.map((f) => f.form).sort()).toEqual(['walked', 'walking', 'walks']);
    // "wait" (waited, wait, waits) and "ferry" (ferry ×2, ferries) are counted together too.
    expect(lemmas.words.find((w) => w.word === 'wait')!.count).toBe(3);
    expect(lemmas.words.find((w) => w.word === 'ferry')!.count).toBe(3);
    expect(lemmas.unit).toBe('lemma');
  });

  it('keeps only the parts of speech asked for', () => {
    // "weir", "granary", "ferry", "ferries", "ferryman" are common nouns; "walks", "waited" are verbs (common grammar-handbook facts, no source).
    const nouns = frequency.compute(ctx, frequency.params.parse({ top: 50, pos: ['NOUN'] }));
    const words = nouns.words.map((w) => w.word);
    expect(words).toEqual(expect.arrayContaining(['weir', 'granary', 'ferry', 'ferries', 'ferryman']));
    expect(words).not.toContain('walks');
    expect(words).not.toContain('waited');
    expect(nouns.pos).toEqual(['NOUN']);
    for (const w of nouns.words) expect(w.perChapter.reduce((a, b) => a + b, 0)).toBe(w.count);
  });

  it('lists the top words of each chapter when `by` is "chapter", and draws them as small multiples', () => {
    const params = frequency.params.parse({ top: 2, by: 'chapter', unit: 'lemma' });
    const r = frequency.compute(ctx, params);
    expect(r.byChapter!.map((c) => c.number)).toEqual([1, 2]);
    // Counted by hand: chapter I "walk" 3; chapter II "ferry" 2 ("ferry", "ferries") and "wait" 3 ("waited", "wait", "waits").
    expect(r.byChapter![0]!.words[0]).toMatchObject({ word: 'walk', count: 3 });
    expect(r.byChapter![1]!.words.map((w) => [w.word, w.count])).toEqual([
      ['wait', 3],
      ['ferry', 2],
    ]);
    const multiples = frequency.views.multiples!(r, params);
    if (multiples.kind !== 'multiples') throw new Error('wrong view kind');
    expect(multiples.panels.map((p) => p.data.kind === 'bars' && p.data.categories)).toEqual([
      ['walk', r.byChapter![0]!.words[1]!.word],
      ['wait', 'ferry'],
    ]);
  });

  it('without `by: "chapter"`, small multiples show the top words counted in each chapter', () => {
    const params = frequency.params.parse({ top: 3 });
    const r = frequency.compute(ctx, params);
    expect(r.byChapter).toBeUndefined();
    const multiples = frequency.views.multiples!(r, params);
    if (multiples.kind !== 'multiples') throw new Error('wrong view kind');
    expect(multiples.panels).toHaveLength(2);
    const sums = r.words.map((_, k) =>
      multiples.panels.reduce((s, p) => s + (p.data.kind === 'bars' ? p.data.series[0]!.values[k]! : 0), 0),
    );
    expect(sums).toEqual(r.words.map((w) => w.count));
  });

  it('stops with a clear message when lemmas or parts of speech are asked of a text that is not English', () => {
    const german = context(
      ['KAPITEL I.', '', 'Die Fährfrau wartete am Wehr, und die Fähren warteten auf niemanden.', ''].join('\n'),
      [],
      'de',
    );
    expect(() => frequency.compute(german, frequency.params.parse({ unit: 'lemma' }))).toThrow(
      /needs an English language model.*"de".*unit: "form"/,
    );
    expect(() => frequency.compute(german, frequency.params.parse({ pos: ['NOUN'] }))).toThrow(/needs an English language model/);
    // Forms need no language model.
    expect(frequency.compute(german, frequency.params.parse({})).words[0]!.count).toBeGreaterThan(0);
  });
});

describe('frequency by speaker', () => {
  const TALK = [
    'CHAPTER I.',
    '',
    '“The herring run early this year,” said Osric. “Herring and more herring.”',
    '',
    '“The nets are torn,” Tamsin answered. “Mend the nets, mend the nets.”',
    '',
    'The gulls cried over the harbour, and the herring boats came home.',
    '',
  ].join('\n');
  const cast = [
    { id: 'osric', name: 'Osric', aliases: [], pronoun: 'he' as const },
    { id: 'tamsin', name: 'Tamsin', aliases: [], pronoun: 'she' as const },
  ];

  it('counts the words inside each character’s quotations, not the narrative', () => {
    const params = frequency.params.parse({ by: 'speaker', top: 2 });
    const r = frequency.compute(context(TALK, cast), params);
    // Counted by hand: Osric speaks 6 + 4 = 10 words ("herring" ×3), Tamsin 4 + 6 = 10 ("nets" ×3, "mend" ×2);
    // the narrative "herring" (last paragraph) belongs to nobody.
    expect(r.bySpeaker!.map((s) => [s.id, s.tokens, s.words.map((w) => `${w.word}:${w.count}`)[0]])).toEqual([
      ['osric', 10, 'herring:3'],
      ['tamsin', 10, 'nets:3'],
    ]);
    expect(r.bySpeaker![1]!.words[1]).toMatchObject({ word: 'mend', count: 2 });
    expect(r.words.find((w) => w.word === 'herring')!.count).toBe(4);
    const multiples = frequency.views.multiples!(r, params);
    if (multiples.kind !== 'multiples') throw new Error('wrong view kind');
    expect(multiples.panels.map((p) => p.title)).toEqual(['Osric', 'Tamsin']);
  });

  it('needs a cast, and says so', () => {
    expect(() => frequency.compute(context(TALK), frequency.params.parse({ by: 'speaker' }))).toThrow(/needs a cast/);
  });
});
