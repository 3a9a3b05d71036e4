import { describe, it, expect } from 'vitest';
import { model, words } from './helpers.ts';
import { TOKEN_FLAGS } from '../../pipeline/text/model.ts';
import { tokenise } from '../../pipeline/text/tokens.ts';

/** Word-like segments by Intl.Segmenter (ICU's implementation of UAX #29 word boundaries). */
function icuWords(text: string, locale = 'en'): string[] {
  const seg = new Intl.Segmenter(locale, { granularity: 'word' });
  return [...seg.segment(text)].filter((s) => s.isWordLike).map((s) => s.segment);
}
const ours = (text: string): string[] => tokenise(text).map((t) => text.slice(t.start, t.end));

describe('word tokens against UAX #29', () => {
  // Source: Unicode Standard Annex #29, "Word Boundaries", via ICU's Intl.Segmenter (isWordLike).
  // On these sentences the two conventions agree word for word.
  it.each([
    ['en', "Ada didn't know it was five o’clock; the weir's roar (louder now) drowned the bells."],
    ['en', 'In 1887 the toll was 3.5 pence, and 1,000 carts crossed the bridge.'],
    ['en', '“Rock'+"'n'"+'roll?” asked the naïve café owner, aged 42.'],
    ['fr', 'L’eau montait déjà ; aujourd’hui, la digue d’été a cédé.'],
    ['de', 'Die Straße am Fluss war naß, und die Mühle stand still.'],
    ['en', "The boys' boat — their 'best' one — sank."],
  ])('%s: %s', (locale, text) => {
    expect(ours(text)).toEqual(icuWords(text, locale));
  });

  it('hyphenated compounds are one token by our convention, two or more by UAX #29', () => {
    const text = 'A well-kept garden and a brother-in-law.';
    expect(ours(text)).toEqual(['A', 'well-kept', 'garden', 'and', 'a', 'brother-in-law']);
    expect(icuWords(text)).toEqual(['A', 'well', 'kept', 'garden', 'and', 'a', 'brother', 'in', 'law']);
  });

  it('abbreviations with inner full stops split by our convention (UAX #29 keeps "e.g" whole)', () => {
    expect(ours('e.g. this')).toEqual(['e', 'g', 'this']);
    expect(icuWords('e.g. this')).toEqual(['e.g', 'this']);
  });

  it('dashes made of hyphens and en dashes separate words', () => {
    expect(ours('wait--no 1914–1918 well- kept')).toEqual(['wait', 'no', '1914', '1918', 'well', 'kept']);
  });
});

describe('token columns', () => {
  it('types index a lower-cased vocabulary with apostrophes made plain', () => {
    const m = model('Don’t go. Don\'t! THE the The');
    const types = Array.from(m.tokens.type, (t) => m.vocab[t]);
    expect(types).toEqual(["don't", 'go', "don't", 'the', 'the', 'the']);
    expect(m.vocab).toEqual(["don't", 'go', 'the']);
  });

  it('flags capitalised, numeric and sentence-initial words', () => {
    const m = model('Émile saw 1,200 geese. then 7 more. Ölmühle 3.5');
    const f = Array.from(m.tokens.flags);
    const { capitalised: C, numeric: N, sentenceInitial: S } = TOKEN_FLAGS;
    expect(words(m)).toEqual(['Émile', 'saw', '1,200', 'geese', 'then', '7', 'more', 'Ölmühle', '3.5']);
    // "then" follows a full stop but is lower case, so no sentence starts there.
    expect(f).toEqual([C | S, 0, N, 0, 0, N, 0, C | S, N]);
  });

  it('tokens carry their sentence, paragraph and chapter', () => {
    const m = model('CHAPTER I.\n\nOne two.\n\nThree.\n\nCHAPTER II.\n\nFour.');
    expect(Array.from(m.tokens.paragraph)).toEqual([0, 0, 1, 2]);
    expect(Array.from(m.tokens.chapter)).toEqual([0, 0, 0, 1]);
    expect(Array.from(m.tokens.sentence)).toEqual([0, 0, 1, 2]);
  });

  it('handles letters outside the Basic Multilingual Plane', () => {
    const text = 'The 𝔣𝔞𝔯𝔪 was old.';
    expect(ours(text)).toEqual(icuWords(text));
  });
});
