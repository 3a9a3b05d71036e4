import { describe, it, expect } from 'vitest';
import { model, sentences } from './helpers.ts';

/** Sentences by Intl.Segmenter (ICU's implementation of UAX #29 sentence boundaries), trimmed. */
function icuSentences(text: string): string[] {
  const seg = new Intl.Segmenter('en', { granularity: 'sentence' });
  return [...seg.segment(text)].map((s) => s.segment.trim()).filter((s) => s.length > 0);
}

describe('sentence boundaries against UAX #29', () => {
  // Source: Unicode Standard Annex #29, "Sentence Boundaries", via ICU's Intl.Segmenter.
  // On these inputs (no abbreviations, no quotation followed by a lower-case word) the two conventions agree.
  it.each([
    'The weir was loud. Ada listened! Did Tom hear it? Nobody knew.',
    'He waited... Then the bell rang.',
    'She said "Stop." He stopped.',
    'It cost 3.5 shillings. Cheap (or so she thought.) The end.',
    'It was late. “Come in,” said Ada. The door opened?! It did.',
    'The river rose in 1887. In 1888 it fell.',
    '«Non», dit-elle. Puis elle partit.',
  ])('%s', (text) => {
    expect(sentences(model(text))).toEqual(icuSentences(text));
  });
});

describe('where the project convention differs from UAX #29', () => {
  it('a quotation ending in ! or ? followed by a lower-case tag word stays one sentence', () => {
    const text = '"Go!" she said. "Why?" asked Tom, and he waited.';
    // UAX #29 (rule SB11) breaks after "Go!"; a tag such as "she said" belongs to the quotation's sentence.
    expect(icuSentences(text)[0]).toBe('"Go!"');
    expect(sentences(model(text))).toEqual(['"Go!" she said.', '"Why?" asked Tom, and he waited.']);
  });

  it('a quotation followed by a capitalised word is a sentence of its own', () => {
    expect(sentences(model('"Go!" Ada said.'))).toEqual(['"Go!"', 'Ada said.']);
  });

  it('abbreviations and initials do not end sentences', () => {
    // common practice, no source: titles and e.g./i.e./vs. are followed by more of the sentence.
    const text =
      'Mr. Fenwick met Mrs. Hale and Dr. Orme at St. Anne\'s Row. Messrs. Dalby and Cobb, Mme. Lorel, Prof. Vane, Rev. Abbot, ' +
      'Capt. Rook, Col. Ash, Gen. Pike, Lt. Moss, Sgt. Fell and Tom Brack Jr. all came. They argued, e.g. about the weir, i.e. the old one. ' +
      'It was Lannock vs. the river, etc. and so on.';
    expect(sentences(model(text))).toEqual([
      "Mr. Fenwick met Mrs. Hale and Dr. Orme at St. Anne's Row.",
      'Messrs. Dalby and Cobb, Mme. Lorel, Prof. Vane, Rev. Abbot, Capt. Rook, Col. Ash, Gen. Pike, Lt. Moss, Sgt. Fell and Tom Brack Jr. all came.',
      'They argued, e.g. about the weir, i.e. the old one.',
      'It was Lannock vs. the river, etc. and so on.',
    ]);
    // UAX #29 without abbreviation data breaks after "Mr.".
    expect(icuSentences(text)[0]).toBe('Mr.');
  });

  it('initials, including run-together ones, stay in the sentence; "I." ends one', () => {
    expect(sentences(model('The letter was for J. R. Tolley. He read it. A letter came for J.R. Tolley too.'))).toEqual([
      'The letter was for J. R. Tolley.',
      'He read it.',
      'A letter came for J.R. Tolley too.',
    ]);
    expect(sentences(model('It was I. Nobody else came.'))).toEqual(['It was I.', 'Nobody else came.']);
  });

  it('etc., Jr. and Sr. end a sentence before a capitalised word', () => {
    expect(sentences(model('Pears, plums, etc. Then the cart left.'))).toEqual(['Pears, plums, etc.', 'Then the cart left.']);
  });

  it('No. and p. before a number do not end a sentence', () => {
    expect(sentences(model('She lived at No. 4 Mill Lane. See p. 12 for more.'))).toEqual(['She lived at No. 4 Mill Lane.', 'See p. 12 for more.']);
  });

  it('an ellipsis before a lower-case word does not end a sentence', () => {
    expect(sentences(model('He waited… and waited. The bell rang … once.'))).toEqual(['He waited… and waited.', 'The bell rang … once.']);
  });

  it('closing quotes and brackets belong to the sentence they close', () => {
    expect(sentences(model('“Wait here.” She went in. (He waited.) Nothing happened.'))).toEqual([
      '“Wait here.”',
      'She went in.',
      '(He waited.)',
      'Nothing happened.',
    ]);
  });

  it('a sentence holds at least one word', () => {
    const m = model('* * *\n\nThe end.');
    expect(sentences(m)).toEqual(['The end.']);
    expect(m.paragraphs.count).toBe(2);
  });

  it('sentence columns point at their tokens', () => {
    const m = model('One two. Three four five! Six?');
    expect(Array.from(m.sentences.firstToken)).toEqual([0, 2, 5]);
    expect(Array.from(m.sentences.tokenCount)).toEqual([2, 3, 1]);
    expect(Array.from(m.tokens.sentence)).toEqual([0, 0, 1, 1, 1, 2]);
  });
});
