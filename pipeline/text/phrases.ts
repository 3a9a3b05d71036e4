/** A word or phrase a plan names, found in the text model's vocabulary (shared by the measures that look one up). */
import type { TextModel } from './model.ts';
import { tokenise, vocabForm } from './tokens.ts';

const indexes = new WeakMap<TextModel, Map<string, number>>();

/** The model's vocabulary as word → type id (built once per model). */
export function vocabIndex(model: TextModel): Map<string, number> {
  let index = indexes.get(model);
  if (!index) {
    index = new Map(model.vocab.map((w, t) => [w, t]));
    indexes.set(model, index);
  }
  return index;
}

/** The words of a word or phrase as the text model splits and lower-cases them. */
export function phraseWords(phrase: string): string[] {
  return tokenise(phrase).map((s) => vocabForm(phrase.slice(s.start, s.end)));
}

/**
 * The type ids of a word or phrase, or null when one of its words never
 * occurs in the text. Throws when the phrase holds no word at all.
 */
export function phraseTypes(model: TextModel, phrase: string): number[] | null {
  const words = phraseWords(phrase);
  if (words.length === 0) {
    throw new RangeError(`"${phrase}" holds no word to look for: give a word or a phrase of letters or digits`);
  }
  const index = vocabIndex(model);
  const ids: number[] = [];
  for (const w of words) {
    const t = index.get(w);
    if (t === undefined) return null;
    ids.push(t);
  }
  return ids;
}
