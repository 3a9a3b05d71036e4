import { describe, it, expect } from 'vitest';
import { buildTextModel } from '../../pipeline/text/build.ts';
import type { TextModel } from '../../pipeline/text/model.ts';
import { tagModel, sentenceChunks } from '../../pipeline/nlp/tag.ts';
import { UPOS } from '../../pipeline/nlp/upos.ts';
import { winkLoadCount } from '../../pipeline/nlp/wink.ts';

/** Each token of a one-sentence text as [surface, UPOS, lemma]. */
function tagged(sentence: string): [string, string, string][] {
  const model = buildTextModel(sentence, { id: 'fixture' });
  const tags = tagModel(model);
  return Array.from({ length: model.tokens.count }, (_, i) => [
    model.text.slice(model.tokens.start[i], model.tokens.end[i]),
    UPOS[tags.pos[i]!]!,
    tags.lemmas[tags.lemma[i]!]!,
  ]);
}

const posOf = (sentence: string): string[] => tagged(sentence).map(([, p]) => p);
const lemmaOf = (sentence: string): Record<string, string> => Object.fromEntries(tagged(sentence).map(([w, , l]) => [w, l]));

describe('part-of-speech tags from wink-nlp, on sentences a grammar handbook settles', () => {
  // Tag names and definitions: Universal Dependencies v2 UPOS (universaldependencies.org/u/pos, from memory).
  // The word classes are common grammar-handbook facts, no source: articles are determiners, "tall"/"heavy" qualify a noun (adjectives),
  // a finite lexical verb follows the subject, "-ly" words modifying a verb are manner adverbs.

  it('reads determiner + adjective + noun + verb', () => {
    expect(posOf('The tall miller sold a heavy sack.')).toEqual(['DET', 'ADJ', 'NOUN', 'VERB', 'DET', 'ADJ', 'NOUN']);
  });

  it('reads a manner adverb in -ly after a speech verb and a name', () => {
    expect(posOf('“Leave the lantern,” said Osric gloomily.').slice(-3)).toEqual(['VERB', 'PROPN', 'ADV']);
    expect(posOf('“Not yet,” Wenna answered softly.').slice(-3)).toEqual(['PROPN', 'VERB', 'ADV']);
  });

  it('reads coordinated adverbs and a conjunction', () => {
    expect(posOf('Bryn quickly and quietly closed the heavy door.')).toEqual([
      'PROPN',
      'ADV',
      'CCONJ',
      'ADV',
      'VERB',
      'DET',
      'ADJ',
      'NOUN',
    ]);
  });

  it('reads the copula as an auxiliary and a predicative adjective after it', () => {
    // UD tags copular "be" AUX (universaldependencies.org/u/pos/AUX, from memory).
    expect(posOf('Tamsin is happy.')).toEqual(['PROPN', 'AUX', 'ADJ']);
  });
});

describe('lemmas from wink-nlp', () => {
  it('gives the dictionary forms of regular and irregular inflections', () => {
    // Irregular plurals and past tenses: common grammar-handbook facts (e.g. the irregular noun and verb tables of any English grammar), no source.
    expect(lemmaOf('She walks to the weir; he walked home; they are walking now.')).toMatchObject({
      walks: 'walk',
      walked: 'walk',
      walking: 'walk',
      are: 'be',
    });
    expect(lemmaOf('The geese and the children sang while the mice ate.')).toMatchObject({
      geese: 'goose',
      children: 'child',
      sang: 'sing',
      mice: 'mouse',
      ate: 'eat',
    });
    expect(lemmaOf('Her feet were sore and his teeth ached.')).toMatchObject({ feet: 'foot', teeth: 'tooth', were: 'be' });
  });
});

describe('alignment with our tokens', () => {
  it('keeps our tokens: a contraction wink splits takes its first part’s tag and lemma', () => {
    const words = tagged("Don't fret: the ferry can't sink and it isn't deep.");
    expect(words.map(([w]) => w)).toEqual(["Don't", 'fret', 'the', 'ferry', "can't", 'sink', 'and', 'it', "isn't", 'deep']);
    // wink reads "Do" + "n't", "ca" + "n't", "is" + "n't": the first part is the auxiliary.
    expect(words[0]).toEqual(["Don't", 'AUX', 'do']);
    expect(words[4]).toEqual(["can't", 'AUX', 'can']);
    expect(words[8]).toEqual(["isn't", 'AUX', 'be']);
  });

  it('does the same with typographic apostrophes and possessives', () => {
    const words = tagged('Nan’s ferry won’t wait for Pell’s barge.');
    expect(words.map(([w]) => w)).toEqual(['Nan’s', 'ferry', 'won’t', 'wait', 'for', 'Pell’s', 'barge']);
    expect(words[0]).toEqual(['Nan’s', 'PROPN', 'nan']);
    expect(words[2]![1]).toBe('AUX');
    expect(words[5]).toEqual(['Pell’s', 'PROPN', 'pell']);
  });

  it('keeps a hyphenated word whole: first part’s tag, the whole form as lemma', () => {
    const words = tagged('The mill-race ran past a well-kept garden.');
    expect(words.map(([w]) => w)).toEqual(['The', 'mill-race', 'ran', 'past', 'a', 'well-kept', 'garden']);
    // wink splits "mill" + "-" + "race" and "well" + "-" + "kept".
    expect(words[1]).toEqual(['mill-race', 'NOUN', 'mill-race']);
    expect(words[5]).toEqual(['well-kept', 'ADV', 'well-kept']);
  });

  it('tags our word "Mrs" inside wink’s token "Mrs." and keeps its form as lemma', () => {
    const words = tagged('Mrs. Pell rowed.');
    expect(words[0]).toEqual(['Mrs', 'PROPN', 'mrs']);
    expect(words.length).toBe(3);
  });
});

describe('tagModel', () => {
  const text = ['CHAPTER I.', '', 'Ada rowed the boat. Ada sang.', '', 'CHAPTER II.', '', 'The boats drifted home.', ''].join('\n');

  it('covers every token of a model with chapters, and memoises per model', () => {
    const model: TextModel = buildTextModel(text, { id: 'fixture' });
    const tags = tagModel(model);
    expect(tags.pos.length).toBe(model.tokens.count);
    expect(tags.lemma.length).toBe(model.tokens.count);
    expect(tagModel(model)).toBe(tags);
    const boats = model.vocab.indexOf('boats');
    const i = Array.from(model.tokens.type).indexOf(boats);
    expect(tags.lemmas[tags.lemma[i]!]).toBe('boat');
  });

  it('loads the language model once per process, whatever the number of texts', () => {
    tagModel(buildTextModel(text, { id: 'one' }));
    tagModel(buildTextModel('Another text, another model.', { id: 'two' }));
    expect(winkLoadCount()).toBe(1);
  });

  it('reads whole sentences in chunks that never cross a chapter', () => {
    const model = buildTextModel(text, { id: 'fixture' });
    const chunks = sentenceChunks(model, 10);
    expect(chunks.map((c) => [c.firstToken, c.endToken])).toEqual([
      [0, 4],
      [4, 6],
      [6, 10],
    ]);
    const oneChunk = sentenceChunks(model, 1_000_000);
    // Chapter I in one chunk, chapter II in another.
    expect(oneChunk.length).toBe(2);
    expect(model.text.slice(oneChunk[0]!.start, oneChunk[0]!.end)).toBe('Ada rowed the boat. Ada sang.');
  });
});
