import { describe, it, expect } from 'vitest';
import { repetition, phraseFamilies, familyPlaces, type Phrase } from '../../pipeline/measures/repetition.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
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
