import { describe, it, expect } from 'vitest';
import { isEnglish, requireEnglish, NeedsEnglishModelError } from '../../pipeline/nlp/english.ts';
import { UPOS, uposId, uposMask } from '../../pipeline/nlp/upos.ts';

describe('the English-model guard', () => {
  it('knows English by its ISO 639-1 code, with or without a region', () => {
    // ISO 639-1: "en" English, "de" German, "fr" French (common practice, no source).
    expect(['en', 'EN', 'en-GB', 'en_US'].every(isEnglish)).toBe(true);
    expect(['de', 'fr', 'eng', 'ne'].some(isEnglish)).toBe(false);
  });

  it('says what needs the model, the language found, and what to do', () => {
    expect(() => requireEnglish('en', 'Counting lemmas', 'Use unit: "form"')).not.toThrow();
    let error: unknown;
    try {
      requireEnglish('fr', 'Counting lemmas', 'Use unit: "form"');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(NeedsEnglishModelError);
    const message = (error as Error).message;
    expect(message).toMatch(/^Counting lemmas needs an English language model/);
    expect(message).toContain('"fr"');
    expect(message).toContain('Use unit: "form"');
  });
});

describe('UPOS', () => {
  it('holds the 17 tags of Universal Dependencies v2', () => {
    // Source: Universal Dependencies v2 guidelines, universaldependencies.org/u/pos (17 tags; from memory).
    expect(UPOS.length).toBe(17);
    expect([...UPOS].sort()).toEqual([
      'ADJ',
      'ADP',
      'ADV',
      'AUX',
      'CCONJ',
      'DET',
      'INTJ',
      'NOUN',
      'NUM',
      'PART',
      'PRON',
      'PROPN',
      'PUNCT',
      'SCONJ',
      'SYM',
      'VERB',
      'X',
    ]);
  });

  it('maps a tagger’s own tags (e.g. SPACE) to X, and builds masks', () => {
    expect(UPOS[uposId('SPACE')]).toBe('X');
    expect(UPOS[uposId('NOUN')]).toBe('NOUN');
    const mask = uposMask(['NOUN', 'ADJ']);
    expect(UPOS.filter((_, i) => mask[i])).toEqual(['ADJ', 'NOUN']);
  });
});
