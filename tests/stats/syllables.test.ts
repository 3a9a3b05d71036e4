import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { syllable } from 'syllable';
import lists from 'stopwords-iso/stopwords-iso.json' with { type: 'json' };
import { countSyllables, syllablesPerType } from '../../pipeline/stats/syllables.ts';
import { buildTextModel } from '../../pipeline/text/build.ts';

describe('countSyllables: words checked by hand', () => {
  // Source: dictionary syllabification (Merriam-Webster / Oxford style division), from memory.
  const DICTIONARY: Record<string, number> = {
    the: 1,
    eye: 1,
    table: 2, // ta·ble: syllabic -le
    little: 2, // lit·tle
    centre: 2, // cen·tre: syllabic -re
    beautiful: 3, // beau·ti·ful
    walked: 1, // -ed silent after k
    wanted: 2, // want·ed: -ed spoken after t
    hundred: 2, // hun·dred
    naked: 2, // na·ked (adjective)
    horses: 2, // hors·es: -es spoken after a sibilant
    judges: 2,
    makes: 1, // -es silent
    clothes: 1,
    going: 2, // go·ing
    being: 2,
    flying: 2, // fly·ing
    player: 2, // play·er: y as a consonant between vowels
    quiet: 2, // qui·et
    question: 2, // ques·tion
    lion: 2, // li·on
    curious: 3, // cu·ri·ous
    nation: 2, // na·tion
    million: 2, // mil·lion
    poem: 2, // po·em
    idea: 3, // i·de·a
    area: 3, // ar·e·a
    museum: 3, // mu·se·um
    actual: 3, // ac·tu·al
    continuous: 4, // con·tin·u·ous
    society: 4, // so·ci·e·ty
    science: 2, // sci·ence
    happier: 3, // hap·pi·er
    create: 2, // cre·ate
    tongue: 1,
    league: 1,
    argue: 2, // ar·gue
    unique: 2, // u·nique
    evening: 2, // eve·ning
    wednesday: 2, // Wednes·day
    everything: 3, // ev·ery·thing
    someone: 2, // some·one
    therefore: 2, // there·fore
    lovely: 2, // love·ly
    completely: 3, // com·plete·ly
    rhythm: 2,
    lamplighter: 3, // lamp·light·er
    ferryman: 3, // fer·ry·man
    almanac: 3, // al·ma·nac
    "isn't": 2,
    "don't": 1,
    'café': 2, // ca·fé: the accented final e is spoken
    'well-being': 3, // hyphenated: each part counted
  };
  for (const [word, n] of Object.entries(DICTIONARY)) {
    it(`${word} → ${n}`, () => expect(countSyllables(word)).toBe(n));
  }

  it('counts one syllable per digit for a numeral, and at least one for any word', () => {
    // Our convention for numerals (an approximation of the spoken form), no source.
    expect(countSyllables('1848')).toBe(4);
    expect(countSyllables('hm')).toBe(1);
    expect(countSyllables('Tamsin')).toBe(countSyllables('tamsin'));
  });
});

describe('countSyllables against the reference library syllable (npm)', () => {
  // Word list: the vocabulary of the demo text plus the English stopwords of stopwords-iso,
  // plain a–z words only (about 2,000 words).
  const source = readFileSync(new URL('../../content/texts/the-lamps-of-wendle-staithe.txt', import.meta.url), 'utf8');
  const model = buildTextModel(source, { id: 'demo', start: 'BEGIN TEXT', end: 'END TEXT' });
  const words = new Set(model.vocab.filter((w) => /^[a-z]+$/.test(w)));
  for (const w of (lists as Record<string, string[]>).en!) if (/^[a-z]+$/.test(w)) words.add(w);

  it('agrees on at least 95% of a list of about 2,000 words', () => {
    // Source: npm package syllable 5 (a rule-and-exception counter), run here as the reference.
    const list = [...words];
    const agree = list.filter((w) => countSyllables(w) === syllable(w)).length;
    const rate = agree / list.length;
    expect(list.length).toBeGreaterThan(1500);
    // Observed when written: 2,009 of 2,057 (97.7%).
    expect(rate).toBeGreaterThanOrEqual(0.95);
  });

  it('keeps the dictionary count where the two were found to disagree', () => {
    // The disagreements were reviewed word by word. On these the reference library's count
    // (in brackets) differs from a dictionary's division, and the counter follows the
    // dictionary (from memory). The counter's own known misses in the list: "that've" and
    // "what've" (1, should be 2), and the letter pairs "ao", "io", "ua" of the stopword list,
    // which are not words.
    const reviewed: [string, number][] = [
      ['walked', 1], // [2]
      ['climbed', 1], // [2]
      ['large', 1], // [2]
      ['proud', 1], // [2]
      ['else', 1], // [2]
      ['owe', 1], // [2]
      ['going', 2], // [1]
      ['doing', 2], // [1]
      ['seeing', 2], // [3]
      ['crooked', 2], // [1]
      ['tongue', 1], // [2]
      ['billion', 2], // [3]
      ['evening', 2], // [3]
      ['everybody', 4], // [5]
      ['moreover', 3], // [4]
      ['consequently', 4], // [5]
      ['likewise', 2], // [3]
      ['thereby', 2], // [3]
    ];
    for (const [w, n] of reviewed) expect(countSyllables(w), w).toBe(n);
  });
});

describe('syllablesPerType', () => {
  it('computes one count per vocabulary entry, in vocabulary order', () => {
    // Counts from the dictionary list above.
    expect(Array.from(syllablesPerType(['the', 'table', 'beautiful']))).toEqual([1, 2, 3]);
  });
});
