/**
 * One paragraph's quotation marks, paired.
 *
 * Double convention: “ „ « and a straight " before a non-space open; ” » and a
 * straight " close. Single marks inside are quotations within the speech and
 * are left alone. A closing ” with no opening mark is reported; an opening “
 * inside an open quotation ends the open one there (reported too).
 *
 * Single convention: ‘ or ' after a space (or the paragraph edge) and before a
 * non-space opens, except a straight or left mark before an elided word
 * ('twas) in mid-sentence. Inside a quotation:
 *   - a mark between two letters is an apostrophe (don’t, o’er, miller’s);
 *   - a mark before a letter is an elision (’twas, ’em);
 *   - a mark after punctuation (, . ! ? — …) closes;
 *   - a mark after a letter and before punctuation or the paragraph's end
 *     closes, unless another single mark follows the punctuation (goin’.’);
 *   - a mark after a letter and before a space closes, unless the word is a
 *     trailing elision (goin’, o’, th’) or ends in s (the Rooks’): then it is
 *     an ambiguous candidate, read as an apostrophe unless the quotation is
 *     left open at the paragraph's end (see quotes.ts);
 *   - double marks open and close a quotation within the speech.
 */

import {
  DQ, LAQUO, LDQ, LOW_DQ, LSQ, RAQUO, RDQ, SQ,
  LEADING_ELISIONS, TRAILING_ELISIONS, isSingleMark, isSpaceAt, isWordCharAt, wordEndingAt, wordStartingAt,
  type Convention,
} from './marks.ts';

export interface Span {
  /** Offset of the opening mark. */
  open: number;
  /** Offset of the first character inside the marks. */
  start: number;
  /** Offset just past the last character inside the marks (white space trimmed). */
  end: number;
  /** Offset of the closing mark, or -1 when the quotation reaches the paragraph's end without one. */
  close: number;
  /** Single convention: right marks inside read as apostrophes that could have been closing marks. */
  ambiguous: number[];
}

export interface OpenSpan {
  open: number;
  start: number;
  /** Single convention: offsets of right marks read as apostrophes that could have been closing marks. */
  ambiguous: number[];
}

export interface ParagraphMarks {
  spans: Span[];
  /** The quotation still open at the paragraph's end, if any. */
  open: OpenSpan | null;
  /** Marks that could not be paired, with their offsets. */
  problems: { at: number; message: string }[];
}

const CLOSING_PUNCT = /[.,;:!?\u2014\u2013\u2026)\]-]/;

function trimEnd(text: string, from: number, to: number): number {
  let e = to;
  while (e > from && /\s/.test(text[e - 1])) e--;
  return e;
}

function opensBefore(text: string, i: number, a: number, b: number): boolean {
  // The mark sits at a word's start: space, paragraph edge, bracket or dash before; something other than space after.
  const before = i === a || isSpaceAt(text, i - 1, a, b) || /[([{\u2014\u2013-]/.test(text[i - 1]) || text.charCodeAt(i - 1) === LDQ || text.charCodeAt(i - 1) === LSQ;
  return before && i + 1 < b && !isSpaceAt(text, i + 1, a, b);
}

/** Scan text[a, b) for quotation marks. `forced` lists right single marks to read as closing marks. */
export function scanParagraph(text: string, a: number, b: number, convention: Convention, forced: ReadonlySet<number> = new Set()): ParagraphMarks {
  const spans: Span[] = [];
  const problems: { at: number; message: string }[] = [];
  let cur = null as OpenSpan | null;
  let nested = false;
  const closeAt = (i: number): void => {
    spans.push({ open: cur!.open, start: cur!.start, end: trimEnd(text, cur!.start, i), close: i, ambiguous: cur!.ambiguous });
    cur = null;
    nested = false;
  };
  const openAt = (i: number): void => {
    cur = { open: i, start: i + 1, ambiguous: [] };
    nested = false;
  };

  for (let i = a; i < b; i++) {
    const c = text.charCodeAt(i);
    if (convention === 'double') {
      if (c !== LDQ && c !== RDQ && c !== DQ && c !== LOW_DQ && c !== LAQUO && c !== RAQUO) continue;
      if (cur === null) {
        if (c === LDQ || c === LOW_DQ || c === LAQUO) openAt(i);
        else if (c === DQ && opensBefore(text, i, a, b) && !isWordCharAt(text, i - 1)) openAt(i);
        else if (c === RDQ || c === DQ) problems.push({ at: i, message: 'a closing quotation mark has no opening mark before it' });
      } else if (c === RDQ || c === RAQUO || c === DQ) {
        closeAt(i);
      } else if (c === LDQ || c === LOW_DQ) {
        problems.push({ at: cur.open, message: 'a quotation is not closed before the next one opens; it was taken to end there' });
        closeAt(i);
        openAt(i);
      }
      continue;
    }

    // Single convention.
    if (cur === null) {
      if ((c === LSQ || c === SQ) && opensBefore(text, i, a, b)) {
        const midSentence = i > a && /\p{L}/u.test(text[lastNonSpace(text, i, a)] ?? '');
        if (midSentence && LEADING_ELISIONS.has(wordStartingAt(text, i + 1, b))) continue; // 'twas in narrative
        openAt(i);
      }
      continue;
    }
    if (c === LDQ || c === LOW_DQ) {
      nested = true;
      continue;
    }
    if (c === RDQ) {
      nested = false;
      continue;
    }
    if (c === DQ) {
      nested = !nested;
      continue;
    }
    if (!isSingleMark(c)) continue;
    if (forced.has(i)) {
      closeAt(i);
      continue;
    }
    const open: OpenSpan = cur;
    const prevWord = i > a && isWordCharAt(text, i - 1);
    const nextWord = i + 1 < b && isWordCharAt(text, i + 1);
    if (nextWord) continue; // don’t, o’er, ’twas
    if (i === a || isSpaceAt(text, i - 1, a, b)) continue; // a stray mark between spaces
    if (!prevWord) {
      closeAt(i); // after punctuation or a closing double mark
      continue;
    }
    if (nested) continue; // a possessive or elision inside the quotation within the speech
    // After a letter.
    const nextIsSpace = i + 1 < b && /\s/.test(text[i + 1]);
    if (!nextIsSpace) {
      let k = i + 1;
      while (k < b && CLOSING_PUNCT.test(text[k])) k++;
      if (k > i + 1 && k < b && isSingleMark(text.charCodeAt(k)) && !isWordCharAt(text, k + 1)) continue; // goin’.’
      closeAt(i);
      continue;
    }
    const word = wordEndingAt(text, i, a);
    if (TRAILING_ELISIONS.has(word) || (word.length > 1 && word.endsWith('s')) || (word.length >= 4 && word.endsWith('in'))) {
      open.ambiguous.push(i);
      continue;
    }
    closeAt(i);
  }
  return { spans, open: cur, problems };
}

function lastNonSpace(text: string, i: number, a: number): number {
  let k = i - 1;
  while (k >= a && /\s/.test(text[k])) k--;
  return k;
}

/** Whether a paragraph starting at `a` opens with the convention's opening mark (a speech that goes on). */
export function opensParagraph(text: string, a: number, b: number, convention: Convention): boolean {
  const c = text.charCodeAt(a);
  if (a + 1 >= b || isSpaceAt(text, a + 1, a, b)) return false;
  return convention === 'double' ? c === LDQ || c === DQ || c === LOW_DQ || c === LAQUO : c === LSQ || c === SQ;
}
