/**
 * Sentence boundaries inside one paragraph.
 *
 * A sentence ends after a run of . ! ? … and any closing quotation marks or
 * brackets that follow it, when white space comes next and the next word could
 * begin a sentence (upper case, uncased letter or digit, possibly after an
 * opening quotation mark). So `"Go!" she said.` stays one sentence, and an
 * ellipsis followed by a lower-case word does not end one. A single full stop
 * after a title abbreviation (Mr., Dr., St., …), after e.g./i.e./vs./cf./viz.,
 * after an initial ("J. R. Tolley"), or after No./p. before a number does not
 * end a sentence.
 */

import { isCloser, isLetterAt, isOpener, isSpace, isTerminal, startsSentenceChar } from './chars.ts';

/**
 * Abbreviations after which a full stop never ends a sentence: titles and
 * forms always followed by more of the sentence. Lower-case, without the
 * final full stop. common practice, no source.
 */
export const NON_FINAL_ABBREVIATIONS: ReadonlySet<string> = new Set([
  'mr', 'mrs', 'ms', 'messrs', 'mme', 'mmes', 'mlle', 'dr', 'st', 'prof', 'rev', 'revd', 'capt', 'col', 'gen',
  'lt', 'sgt', 'maj', 'cpl', 'hon', 'vs', 'cf', 'viz', 'e.g', 'i.e',
]);

/**
 * Abbreviations that end a sentence when a capitalised word follows, since
 * they so often close one ("pears, plums, etc. Then…"); before a lower-case
 * word nothing ends anyway. Listed to make the convention explicit.
 * common practice, no source.
 */
export const FINAL_ABBREVIATIONS: ReadonlySet<string> = new Set(['etc', 'jr', 'sr', 'esq', 'ltd', 'inc', 'co']);

/** Abbreviations that do not end a sentence when a number follows ("No. 4", "p. 12"). common practice, no source. */
export const NUMBER_ABBREVIATIONS: ReadonlySet<string> = new Set(['no', 'nos', 'p', 'pp', 'vol', 'ch', 'fig', 'art']);

/** Word (letters and inner full stops) ending just before offset `dot`. */
function wordBefore(text: string, from: number, dot: number): string {
  let a = dot;
  while (a > from && (isLetterAt(text, a - 1) || text.charCodeAt(a - 1) === 46)) a--;
  return text.slice(a, dot);
}

const INITIALS = /^(?:\p{Lu}\.)*\p{Lu}$/u;

/**
 * Whether a single full stop at `dot` closes an abbreviation or an initial
 * rather than the sentence.
 */
export function isAbbreviationStop(text: string, from: number, dot: number, next: number): boolean {
  const word = wordBefore(text, from, dot);
  if (word.length === 0) return false;
  if (INITIALS.test(word)) return word !== 'I'; // "J. R. Tolley"; the pronoun "I." ends sentences
  const lower = word.toLowerCase();
  if (NON_FINAL_ABBREVIATIONS.has(lower)) return true;
  const n = text.charCodeAt(next);
  return NUMBER_ABBREVIATIONS.has(lower) && n >= 48 && n <= 57;
}

/**
 * Split `text[start, end)` (a paragraph, trimmed) into sentences; calls
 * `emit(s, e)` for each, in order. Sentences are trimmed and never empty.
 */
export function splitSentences(text: string, start: number, end: number, emit: (s: number, e: number) => void): void {
  let s = start;
  let i = start;
  while (i < end) {
    const c = text.charCodeAt(i);
    if (!isTerminal(c)) {
      i++;
      continue;
    }
    let j = i;
    while (j < end && isTerminal(text.charCodeAt(j))) j++;
    let k = j;
    while (k < end && isCloser(text.charCodeAt(k))) k++;
    if (k >= end) break;
    if (!isSpace(text.charCodeAt(k))) {
      i = k > i ? k : i + 1;
      continue;
    }
    let m = k;
    while (m < end && isSpace(text.charCodeAt(m))) m++;
    if (m >= end) break;
    let w = m;
    while (w < end && isOpener(text.charCodeAt(w))) w++;
    const single = j === i + 1 && c === 46;
    if (w >= end || !startsSentenceChar(text, w) || (single && isAbbreviationStop(text, s, i, w))) {
      i = m;
      continue;
    }
    emit(s, k);
    s = m;
    i = m;
  }
  let e = end;
  while (e > s && isSpace(text.charCodeAt(e - 1))) e--;
  if (e > s) emit(s, e);
}
