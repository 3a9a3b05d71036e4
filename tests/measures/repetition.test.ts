import { describe, it, expect } from 'vitest';
import {
  repetition,
  phraseFamilies,
  familyPlaces,
  recurringPhrases,
  findPhrases,
  familiesOf,
  phraseSet,
  phraseList,
  placesOf,
  placeCounter,
  type Phrase,
} from '../../pipeline/measures/repetition.ts';
import { gapHasher, tupleHash, tupleTable } from '../../pipeline/measures/repetition/tuples.ts';
import { stopwords } from '../../pipeline/text/stopwords.ts';
import { TOKEN_FLAGS, type CastMember, type TextModel } from '../../pipeline/text/model.ts';
import { context } from './fixture.ts';

// Invented text with planted repeats and variants.
const TEXT = [
  'CHAPTER I.',
  '',
  '“Mark my words, girl,” said Osric. “The river takes what it is owed.”',
  '',
  'Tamsin walked down to the boats. The boats rocked on the grey water, and the grey water slapped the boats.',
  '',
  '“You mark my words,” Osric said again. “Mend the net by dawn, and mend the sail by dawn.”',
  '',
  'CHAPTER II.',
  '',
  '“Mark my words, girl,” Tamsin told the gulls. “You mark my words.” The river takes what it is owed.',
  '',
  'And then there was rain. And then there was wind.',
  '',
  '“Mend the net by dawn,” said Tamsin, “or mend the sail by dawn.”',
  '',
].join('\n');
const CAST: CastMember[] = [
  { id: 'osric', name: 'Osric', aliases: [], pronoun: 'he' },
  { id: 'tamsin', name: 'Tamsin', aliases: [], pronoun: 'she' },
];

describe('repetition: recurring phrases', () => {
  const ctx = context(TEXT, CAST);
  const r = repetition.compute(ctx, repetition.params.parse({}));
  const family = (label: string) => r.families.find((f) => f.label === label)!;

  it('keeps maximal phrases of 3+ words that hold a content word', () => {
    // By hand: "mark my words" (4), "mark my words girl" (2), "you mark my words" (2), "the river takes what it is owed" (2),
    // "the grey water" (2), "mend the net by dawn" (2), "mend the sail by dawn" (2). The 3- to 6-word pieces of
    // "the river takes what it is owed" always come with it, so they are dropped; "and then there was" (2) is all stopwords
    // in stopwords-iso's English list, so it is left out.
    expect(r.phrases).toBe(7);
    const members = r.families.flatMap((f) => f.members.map((m) => `${m.phrase}:${m.count}`)).sort();
    expect(members).toEqual([
      'mark my words girl:2',
      'mark my words:4',
      'mend the net by dawn:2',
      'mend the sail by dawn:2',
      'the grey water:2',
      'the river takes what it is owed:2',
      'you mark my words:2',
    ]);
  });

  it('groups variants around a shared core, and variants one word apart', () => {
    const marks = family('mark my words');
    expect(marks.core).toBe('mark my words');
    expect(marks.members.map((m) => m.phrase).sort()).toEqual(['mark my words', 'mark my words girl', 'you mark my words']);
    // Four places: "mark my words" never stands alone, it is always inside a longer member.
    expect(marks.count).toBe(4);
    const mend = family('mend the net by dawn');
    expect(mend.members.map((m) => m.phrase)).toEqual(['mend the net by dawn', 'mend the sail by dawn']);
    expect(mend.core).toBeNull();
    expect(mend.count).toBe(4);
    // Ranked by occurrences, ties alphabetical.
    expect(r.families.map((f) => [f.label, f.count])).toEqual([
      ['mark my words', 4],
      ['mend the net by dawn', 4],
      ['the grey water', 2],
      ['the river takes what it is owed', 2],
    ]);
  });

  it('says where each occurrence stands and who says it', () => {
    const { model } = ctx;
    const marks = family('mark my words');
    const first = model.text.indexOf('Mark my words, girl');
    const second = model.text.indexOf('You mark my words');
    expect(marks.occurrences.map((o) => [o.chapter, o.paragraph, o.offset, o.text, o.speaker])).toEqual([
      [1, 1, first, 'Mark my words, girl', 'osric'],
      [1, 3, second, 'You mark my words', 'osric'],
      [2, 1, model.text.indexOf('Mark my words, girl', first + 1), 'Mark my words, girl', 'tamsin'],
      [2, 1, model.text.indexOf('You mark my words', second + 1), 'You mark my words', 'tamsin'],
    ]);
    // Inside Osric's quotation in chapter I, in the narrative in chapter II.
    expect(family('the river takes what it is owed').occurrences.map((o) => o.speaker)).toEqual(['osric', null]);
    expect(marks.occurrences[0]).toMatchObject({ left: '', right: ',” said Osric. “The river takes what it is' });
  });

  it('leaves speakers empty without a cast', () => {
    const bare = repetition.compute(context(TEXT), repetition.params.parse({}));
    expect(bare.speakers).toBe(false);
    expect(bare.families.flatMap((f) => f.occurrences).every((o) => o.speaker === null)).toBe(true);
  });

  it('offers bars by family, kwic of a family and a textmap of the passage', () => {
    const params = repetition.params.parse({ family: 2 });
    const bars = repetition.views.bars!(r, params);
    if (bars.kind !== 'bars') throw new Error('wrong view kind');
    expect(bars.categories[0]).toBe('mark my words (+2)');
    expect(bars.series[0]!.values).toEqual([4, 4, 2, 2]);
    const kwic = repetition.views.kwic!(r, params);
    if (kwic.kind !== 'kwic') throw new Error('wrong view kind');
    expect(kwic.keyword).toBe('mend the net by dawn');
    expect(kwic.lines.map((l) => l.where)).toEqual([
      'Ch. 1, ¶ 3 · Osric',
      'Ch. 1, ¶ 3 · Osric',
      'Ch. 2, ¶ 3 · Tamsin',
      'Ch. 2, ¶ 3 · Tamsin',
    ]);
    const map = repetition.views.textmap!(r, params);
    if (map.kind !== 'textmap') throw new Error('wrong view kind');
    // Default passage: the paragraph of the top family's first occurrence.
    expect(r.passage.where).toBe('Ch. 1, ¶ 1');
  });
});

describe('repetition: repeated words in a passage', () => {
  const ctx = context(TEXT, CAST);

  it('marks each repeated content word with its count and links each occurrence to the next', () => {
    const r = repetition.compute(ctx, repetition.params.parse({ passage: { chapter: 1, paragraph: 2 } }));
    const p = r.passage;
    // The spans give back the paragraph exactly.
    expect(p.spans.map((s) => s.text).join('')).toBe(
      'Tamsin walked down to the boats. The boats rocked on the grey water, and the grey water slapped the boats.',
    );
    // By hand: boats ×3, grey ×2, water ×2; "the", "and", "on" are stopwords.
    expect(p.words.map((w) => [w.word, w.count])).toEqual([
      ['boats', 3],
      ['grey', 2],
      ['water', 2],
    ]);
    expect(p.spans.filter((s) => s.value !== null).map((s) => `${s.text}:${s.value}`)).toEqual([
      'boats:3',
      'boats:3',
      'grey:2',
      'water:2',
      'grey:2',
      'water:2',
      'boats:3',
    ]);
    const text = (i: number) => p.spans[i]!.text;
    expect(p.links.map((l) => [l.word, text(l.from), text(l.to)])).toEqual([
      ['boats', 'boats', 'boats'],
      ['boats', 'boats', 'boats'],
      ['grey', 'grey', 'grey'],
      ['water', 'water', 'water'],
    ]);
    expect(p.links.every((l) => l.from < l.to)).toBe(true);
  });

  it('spans several paragraphs with breaks, and cuts a long passage at a sentence end', () => {
    const two = repetition.compute(ctx, repetition.params.parse({ passage: { chapter: 1, paragraph: 2, paragraphs: 2 } })).passage;
    expect(two.where).toBe('Ch. 1, ¶ 2–3');
    expect(two.breaks.length).toBe(1);
    expect(two.spans[two.breaks[0]!]!.text.startsWith('“You')).toBe(true);
    const cut = repetition.compute(ctx, repetition.params.parse({ passage: { chapter: 1, paragraph: 2 }, passageWords: 10 })).passage;
    // The paragraph has 6 + 14 = 20 words: 10 end inside the second sentence, so the cut falls back to the end of the first.
    expect(cut.cut).toBe(true);
    expect(cut.shownWords).toBe(6);
    expect(cut.spans.map((s) => s.text).join('')).toBe('Tamsin walked down to the boats.');
  });

  it('matches by lemma when asked', () => {
    const lemmas = context(['CHAPTER I.', '', 'Osric walked to the weir, and Tamsin walks to the weirs.', ''].join('\n'), CAST);
    const byForm = repetition.compute(lemmas, repetition.params.parse({ passage: { chapter: 1, paragraph: 1 } })).passage;
    expect(byForm.words).toEqual([]);
    const byLemma = repetition.compute(lemmas, repetition.params.parse({ passage: { chapter: 1, paragraph: 1 }, unit: 'lemma' })).passage;
    // Inflections of one lemma: common grammar-handbook fact, no source.
    expect(byLemma.words.map((w) => [w.word, w.count])).toEqual([
      ['walk', 2],
      ['weir', 2],
    ]);
  });

  it('refuses a passage that does not exist', () => {
    expect(() => repetition.compute(ctx, repetition.params.parse({ passage: { chapter: 5, paragraph: 1 } }))).toThrow(
      /chapter 5 does not exist/,
    );
    expect(() => repetition.compute(ctx, repetition.params.parse({ passage: { chapter: 1, paragraph: 9 } }))).toThrow(
      /chapter 1 has 3 paragraph/,
    );
    expect(repetition.params.safeParse({ minN: 5, maxN: 4 }).success).toBe(false);
  });

  it('finds phrases in any language with a stopword list, but needs English for lemmas', () => {
    const german = context(
      [
        'KAPITEL I.',
        '',
        '„Merk dir meine Worte“, sagte Osric. Der Fluss nimmt, was ihm gehört.',
        '',
        'Der Fluss nimmt, was ihm gehört, und Tamsin lachte.',
        '',
      ].join('\n'),
      [],
      'de',
    );
    const r = repetition.compute(german, repetition.params.parse({}));
    expect(r.families.map((f) => f.label)).toEqual(['der fluss nimmt was ihm gehört']);
    expect(() => repetition.compute(german, repetition.params.parse({ unit: 'lemma' }))).toThrow(/needs an English language model.*"de"/);
  });
});

describe('phraseFamilies', () => {
  // Word ids: a small invented vocabulary; stopwords as in stopwords-iso's English list.
  const vocab = [
    'mark',
    'my',
    'words',
    'girl',
    'you',
    'the',
    'old',
    'mill',
    'barn',
    'mend',
    'net',
    'sail',
    'by',
    'dawn',
    'one',
    'of',
    'boats',
    'ropes',
    'row',
    'boat',
    'home',
    'w1',
    'w2',
    'w3',
    'w4',
    'w5',
    'w6',
  ];
  const stop = new Set(['my', 'words', 'you', 'the', 'old', 'by', 'one', 'of', 'home']);
  const id = (s: string) => s.split(' ').map((w) => vocab.indexOf(w));
  const phrase = (s: string): Phrase => ({ types: id(s), positions: [0, 100] });
  const isContent = (t: number) => !stop.has(vocab[t]!);
  const familiesOf = (list: string[]) => {
    const { family } = phraseFamilies(list.map(phrase), isContent);
    const groups = new Map<number, string[]>();
    list.forEach((s, i) => groups.set(family[i]!, [...(groups.get(family[i]!) ?? []), s]));
    return [...groups.values()];
  };

  it('groups phrases around their most widely shared 3-word run', () => {
    expect(familiesOf(['mark my words girl', 'you mark my words', 'mark my words'])).toEqual([
      ['mark my words girl', 'you mark my words', 'mark my words'],
    ]);
  });

  it('groups phrases of 4+ words one word apart, but not 3-word ones, nor when the shared words are all stopwords', () => {
    expect(familiesOf(['mend the net by dawn', 'mend the sail by dawn'])).toEqual([['mend the net by dawn', 'mend the sail by dawn']]);
    expect(familiesOf(['row the boat home', 'row the old boat home'])).toEqual([['row the boat home', 'row the old boat home']]);
    expect(familiesOf(['the old mill', 'the old barn'])).toEqual([['the old mill'], ['the old barn']]);
    expect(familiesOf(['one of the boats', 'one of the ropes'])).toEqual([['one of the boats'], ['one of the ropes']]);
  });

  it('does not chain: A and B share one run, B and C another, C stays apart', () => {
    // w1 w2 w3 w4 and w2 w3 w4 w5 share "w2 w3 w4"; w2 w3 w4 w5 and w4 w5 w6 share "w4 w5"… and "w3 w4 w5" with the second only.
    expect(familiesOf(['w1 w2 w3 w4', 'w2 w3 w4 w5', 'w3 w4 w5 w6'])).toEqual([['w1 w2 w3 w4', 'w2 w3 w4 w5'], ['w3 w4 w5 w6']]);
  });

  it('joins a lone phrase to the largest family holding a variant, ties to the family named first', () => {
    // "w1 w2 w3 w4" shares no 3-word run with anyone; it is one word away from "w1 w2 w6 w4" and from "w1 w5 w3 w4".
    const lone = 'w1 w2 w3 w4';
    const y = ['mill w2 w6 w4', 'w1 w2 w6 w4'];
    const x = ['mark w5 w3 w4', 'w1 w5 w3 w4'];
    expect(familiesOf([...y, ...x, lone])).toEqual([[...y, lone], x]);
    expect(familiesOf([...y, ...x, 'barn w5 w3 w4', lone])).toEqual([y, [...x, 'barn w5 w3 w4', lone]]);
  });

  it('counts a place once when members overlap there', () => {
    const phrases: Phrase[] = [
      { types: id('mark my words'), positions: [0, 10, 21] },
      { types: id('mark my words girl'), positions: [0, 21] },
      { types: id('you mark my words'), positions: [9] },
      // Two overlapping pieces of one longer repeat: w1 w2 w3 w4 w5 at 40.
      { types: id('w1 w2 w3 w4'), positions: [40] },
      { types: id('w2 w3 w4 w5'), positions: [41] },
    ];
    expect(familyPlaces(phrases, [0, 1, 2, 3, 4])).toEqual([
      [0, 4, 1],
      [9, 13, 2],
      [21, 25, 1],
      [40, 45, 3],
    ]);
  });
});

// The fast paths (level-by-level pairing in hash tables of integers, variant
// keys looked up by hash, places merged through a heap) checked against
// brute-force readings of the method card's own definitions, on invented
// texts made from a small invented vocabulary so that phrases recur often.
// common practice, no source: a slow, obviously correct reference beside a fast algorithm.

/** A small seeded generator (mulberry32), so each generated text is the same on every run. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** An invented text: sentences of invented words and stopwords, with stock phrases that recur, overlap and run on. */
function inventedText(seed: number, sentences: number): string {
  const next = random(seed);
  const pick = <T,>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)]!;
  const words = ['osric', 'tamsin', 'weir', 'skiff', 'gull', 'net', 'sail', 'dawn', 'mend', 'rows', 'brack', 'eel', 'reed', 'the', 'of', 'and', 'to', 'a', 'by', 'my', 'was', 'it', '7'];
  // Stock phrases: variants one word apart (substituted, inserted, deleted), cores shared, runs on, overlaps.
  const stock = [
    'mend the net by dawn',
    'mend the sail by dawn',
    'mend the reed by dawn',
    'row the boat home',
    'row the old boat home',
    'the river takes what it is owed',
    'mark my words',
    'you mark my words girl',
    'tamsin mark my words',
    'tamsin heed my words',
    'tamsin mark my own words',
    'and then there was',
    'net net net net net',
    'the grey water slapped the grey water',
    'osric rows the skiff to the weir and back to the reeds again',
  ];
  const chapters: string[] = [];
  let paragraph: string[] = [];
  let chapter: string[] = [];
  for (let i = 0; i < sentences; i++) {
    const parts: string[] = [];
    const pieces = 1 + Math.floor(next() * 3);
    for (let k = 0; k < pieces; k++) {
      if (next() < 0.45) parts.push(pick(stock));
      else parts.push(Array.from({ length: 1 + Math.floor(next() * 4) }, () => pick(words)).join(' '));
    }
    const sentence = parts.join(next() < 0.3 ? ', ' : ' ');
    paragraph.push(sentence.charAt(0).toUpperCase() + sentence.slice(1) + '.');
    if (next() < 0.25) {
      chapter.push(paragraph.join(' '));
      paragraph = [];
    }
    if (next() < 0.05 && chapter.length) {
      chapters.push(chapter.join('\n\n'));
      chapter = [];
    }
  }
  if (paragraph.length) chapter.push(paragraph.join(' '));
  if (chapter.length) chapters.push(chapter.join('\n\n'));
  return chapters.map((c, i) => `CHAPTER ${i + 1}.\n\n${c}\n`).join('\n');
}

/** Content tokens as the measure takes them: not a stopword, not a numeral. */
function contentOf(model: TextModel): { content: Uint8Array; isContent: (type: number) => boolean } {
  const stop = stopwords('en');
  const numeric = new Uint8Array(model.vocab.length);
  for (let i = 0; i < model.tokens.count; i++) if (model.tokens.flags[i]! & TOKEN_FLAGS.numeric) numeric[model.tokens.type[i]!] = 1;
  const isContent = (t: number): boolean => !stop.has(model.vocab[t]!) && numeric[t] === 0;
  const content = new Uint8Array(model.tokens.count);
  for (let i = 0; i < model.tokens.count; i++) content[i] = isContent(model.tokens.type[i]!) ? 1 : 0;
  return { content, isContent };
}

/** The method card's phrases, by brute force: every run of words inside a sentence, counted by its words. */
function phrasesByBruteForce(model: TextModel, isContent: (type: number) => boolean, minN: number, maxN: number, minCount: number): Phrase[] {
  const { type, sentence, count } = model.tokens;
  const at = (len: number): Map<string, number[]> => {
    const runs = new Map<string, number[]>();
    for (let p = 0; p + len <= count; p++) {
      if (sentence[p] !== sentence[p + len - 1]) continue;
      const key = Array.from(type.subarray(p, p + len)).join(' ');
      runs.set(key, [...(runs.get(key) ?? []), p]);
    }
    return runs;
  };
  const out: Phrase[] = [];
  for (let len = minN; len <= maxN; len++) {
    const here = at(len);
    const longer = len < maxN ? at(len + 1) : new Map<string, number[]>();
    const found: Phrase[] = [];
    for (const [key, positions] of here) {
      if (positions.length < minCount) continue;
      const types = key.split(' ').map(Number);
      if (!types.some(isContent)) continue;
      // Dropped when one phrase a word longer, to the right or the left, has as many occurrences.
      const coveredBy = [...longer].some(([k, ps]) => ps.length === positions.length && (k.startsWith(key + ' ') || k.endsWith(' ' + key)));
      if (!coveredBy) found.push({ types, positions });
    }
    out.push(...found.sort((a, b) => a.positions[0]! - b.positions[0]!));
  }
  return out;
}

/** The method card's families, by brute force: cores by support, then variants one word apart compared pair by pair. */
function familiesByBruteForce(phrases: Phrase[], isContent: (type: number) => boolean): { groups: number[][]; joined: number[] } {
  const n = phrases.length;
  const runs = phrases.map(({ types }) => {
    const list: string[] = [];
    for (let s = 0; s + 3 <= types.length; s++) {
      const run = types.slice(s, s + 3);
      if (run.some(isContent) && !list.includes(run.join(' '))) list.push(run.join(' '));
    }
    return list;
  });
  const support = new Map<string, number>();
  for (const list of runs) for (const r of list) support.set(r, (support.get(r) ?? 0) + 1);
  const family: number[] = [];
  const firstWith = new Map<string, number>();
  runs.forEach((list, i) => {
    let best: string | null = null;
    for (const r of list) if (best === null || support.get(r)! > support.get(best)!) best = r;
    if (best === null) family.push(i);
    else {
      if (!firstWith.has(best)) firstWith.set(best, i);
      family.push(firstWith.get(best)!);
    }
  });
  const size = new Map<number, number>();
  for (const f of family) size.set(f, (size.get(f) ?? 0) + 1);
  const same = (a: number[], b: number[]): boolean => a.length === b.length && a.every((t, k) => t === b[k]);
  const oneApart = (a: number[], b: number[]): boolean => {
    if (a.length < 4 || b.length < 4) return false;
    if (a.length === b.length) {
      const diff = a.flatMap((t, k) => (t === b[k] ? [] : [k]));
      return diff.length === 1 && a.some((t, k) => k !== diff[0] && isContent(t));
    }
    const [long, short] = a.length > b.length ? [a, b] : [b, a];
    if (long.length !== short.length + 1 || !short.some(isContent)) return false;
    return long.some((_, s) => same([...long.slice(0, s), ...long.slice(s + 1)], short));
  };
  const variants = (i: number): number[] =>
    phrases.flatMap((p, j) => (j !== i && oneApart(phrases[i]!.types, p.types) ? [j] : []));
  const joined: number[] = [];
  const alone: number[] = [];
  for (let i = 0; i < n; i++) {
    if (size.get(family[i]!) !== 1 || phrases[i]!.types.length < 4) continue;
    let target = -1;
    for (const j of variants(i)) {
      const f = family[j]!;
      if (size.get(f)! < 2) continue;
      if (target < 0 || size.get(f)! > size.get(target)! || (size.get(f) === size.get(target) && f < target)) target = f;
    }
    if (target >= 0) {
      family[i] = target;
      joined.push(i);
    } else alone.push(i);
  }
  // Lone phrases linked to lone variants, transitively.
  const root = (x: number): number => (family[x] === x ? x : root(family[x]!));
  for (const i of alone) family[i] = i;
  for (const i of alone) {
    for (const j of variants(i)) {
      if (!alone.includes(j)) continue;
      const [a, b] = [root(i), root(j)];
      if (a !== b) family[Math.max(a, b)] = Math.min(a, b);
    }
  }
  for (const i of alone) family[i] = root(i);
  const groups = new Map<number, number[]>();
  family.forEach((f, i) => groups.set(f, [...(groups.get(f) ?? []), i]));
  return { groups: [...groups.values()], joined };
}

const partition = (family: Int32Array): number[][] => {
  const groups = new Map<number, number[]>();
  family.forEach((f, i) => groups.set(f, [...(groups.get(f) ?? []), i]));
  return [...groups.values()];
};

describe('repetition: fast paths against brute force', () => {
  const cases = [
    { seed: 1, sentences: 160, minN: 3, maxN: 8, minCount: 2 },
    { seed: 2, sentences: 220, minN: 2, maxN: 12, minCount: 2 },
    { seed: 3, sentences: 260, minN: 4, maxN: 5, minCount: 3 },
  ];

  for (const c of cases) {
    const { model } = context(inventedText(c.seed, c.sentences));
    const { content, isContent } = contentOf(model);
    const phrases = recurringPhrases(model, content, c);

    it(`finds the maximal recurring phrases (seed ${c.seed}, ${c.minN}–${c.maxN} words, ${c.minCount}+ times)`, () => {
      const expected = phrasesByBruteForce(model, isContent, c.minN, c.maxN, c.minCount);
      expect(expected.length).toBeGreaterThan(20);
      expect(phrases).toEqual(expected);
    });

    it(`groups them into the same families (seed ${c.seed})`, () => {
      const brute = familiesByBruteForce(phrases, isContent);
      const { family, joined } = phraseFamilies(phrases, isContent);
      expect(partition(family)).toEqual(brute.groups);
      expect([...joined.keys()].filter((i) => joined[i])).toEqual(brute.joined);
      // Runs known from the text give the same families as runs interned from the phrases.
      const set = findPhrases(model, content, c);
      expect(set.runs).not.toBeNull();
      expect(Array.from(familiesOf(set, isContent).family)).toEqual(Array.from(family));
      expect(phraseList(phraseSet(phrases))).toEqual(phrases);
    });

    it(`counts each family's places as listing them does, and lists the first ones alike (seed ${c.seed})`, () => {
      const set = findPhrases(model, content, c);
      const { family } = familiesOf(set, isContent);
      const count = placeCounter(set);
      for (const members of partition(family)) {
        const places = placesOf(set, members);
        expect(count(Int32Array.from(members), 0, members.length)).toBe(places.length);
        expect(placesOf(set, members, 2)).toEqual(places.slice(0, 2));
        expect(familyPlaces(phrases, members)).toEqual(places);
        // Places in text order, apart, each starting where its member does.
        places.forEach(([p, end, m], k) => {
          expect(set.positions.subarray(set.positionStart[m]!, set.positionStart[m + 1]!)).toContain(p);
          if (k > 0) expect(p).toBeGreaterThanOrEqual(places[k - 1]![1]);
          expect(end).toBeGreaterThan(p);
        });
      }
    });
  }

  it('lists every place of a family when asked for as many, and gives the same result twice', () => {
    const ctx = context(inventedText(4, 200));
    const params = repetition.params.parse({ top: 200, occurrences: 500 });
    const r = repetition.compute(ctx, params);
    expect(r.families.length).toBeGreaterThan(5);
    for (const f of r.families) expect(f.occurrences.length).toBe(Math.min(f.count, 500));
    // Ranked by places, ties alphabetical.
    r.families.forEach((f, k) => {
      const prev = r.families[k - 1];
      if (prev) expect(prev.count > f.count || (prev.count === f.count && prev.label < f.label)).toBe(true);
    });
    expect(JSON.stringify(repetition.compute(ctx, params))).toBe(JSON.stringify(r));
    // The top families are the top of the longer list.
    const top = repetition.compute(ctx, repetition.params.parse({ top: 5, occurrences: 500 }));
    expect(top.families).toEqual(r.families.slice(0, 5));
    expect(top.familyCount).toBe(r.familyCount);
  });
});

describe('tuple keys', () => {
  // common practice, no source: an interning table must agree with a Map keyed by the tuple written out.
  it('gives one id per distinct tuple, whole, starred or less one item', () => {
    const next = random(7);
    const table = tupleTable(8);
    const ids = new Map<string, number>();
    for (let r = 0; r < 20000; r++) {
      const len = 1 + Math.floor(next() * 6);
      const items = Array.from({ length: len + 2 }, () => Math.floor(next() * 6));
      const at = Math.floor(next() * (len + 1)); // len: the whole tuple
      const gap = next() < 0.5 ? 'star' : 'omit';
      const tuple = items.slice(1, 1 + len);
      const key = at === len ? tuple.join(',') : gap === 'star' ? tuple.map((t, k) => (k === at ? '*' : t)).join(',') : tuple.filter((_, k) => k !== at).join(',');
      const found = table.find(items, 1, 1 + len, 1 + at, gap);
      const id = table.add(items, 1, 1 + len, 1 + at, gap);
      expect(found).toBe(ids.has(key) ? id : -1);
      expect(table.mayHold(tupleHash(items, 1, 1 + len, 1 + at, gap))).toBe(true);
      if (!ids.has(key)) ids.set(key, id);
      expect(id).toBe(ids.get(key));
    }
    expect(table.size).toBe(ids.size);
  });

  it('hashes every one-gap key of a tuple in one pass as it hashes each alone', () => {
    const next = random(11);
    const hashes = gapHasher();
    for (let r = 0; r < 2000; r++) {
      const len = 1 + Math.floor(next() * 12);
      const items = Array.from({ length: len + 3 }, () => Math.floor(next() * 1e6));
      const star = new Int32Array(len);
      const omit = new Int32Array(len);
      expect(hashes(items, 2, 2 + len, star, omit)).toBe(tupleHash(items, 2, 2 + len));
      for (let s = 0; s < len; s++) {
        expect(star[s]).toBe(tupleHash(items, 2, 2 + len, 2 + s, 'star'));
        expect(omit[s]).toBe(tupleHash(items, 2, 2 + len, 2 + s, 'omit'));
        // Leaving an item out hashes as the shorter tuple does.
        const shorter = [...items.slice(0, 2 + s), ...items.slice(3 + s)];
        expect(omit[s]).toBe(tupleHash(shorter, 2, 1 + len));
      }
    }
  });
});
