/**
 * One paragraph's quotation marks, paired, for the marks conventions
 * (conventions.ts; dash dialogue is read by dashes.ts).
 *
 * Double convention: “ „ and a straight " before a non-space open; ” and a
 * straight " close. Single marks inside are quotations within the speech and
 * are left alone. A closing ” with no opening mark is reported; an opening “
 * inside an open quotation ends the open one there (reported too).
 *
 * Guillemets: « opens and » closes (» opens and « closes when the stretch is
 * printed the German way, »…«); low-high marks: „ opens and “ or ” closes.
 * Every other mark inside is a quotation within the speech. An opening mark
 * inside an open quotation ends the open one there (reported); a closing mark
 * with no opening mark is reported.
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
} from './marks.ts';
import type { Convention } from './conventions.ts';

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

/** The first offset at or after i in [i, b) that is not white space. */
function skipSpace(text: string, i: number, b: number): number {
  while (i < b && /\s/.test(text[i])) i++;
  return i;
}

/**
 * Scan text[a, b) for quotation marks of a marks convention (not "dash").
 * `forced` lists right single marks to read as closing marks; `reversed`
 * reads guillemets as »…«; `continuing` says the paragraph goes on with the
 * speech of the paragraph before (a guillemets paragraph may then open with
 * the closing mark, as French printing does).
 */
export function scanParagraph(
  text: string,
  a: number,
  b: number,
  convention: Convention,
  forced: ReadonlySet<number> = new Set(),
  reversed = false,
  continuing = false,
): ParagraphMarks {
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
    cur = { open: i, start: skipSpace(text, i + 1, b), ambiguous: [] };
    nested = false;
  };
  // Guillemets and low-high marks: one opening and one closing character (or two, for „…“ and „…”).
  const paired = convention === 'guillemets' || convention === 'low';
  const opener = convention === 'low' ? LOW_DQ : reversed ? RAQUO : LAQUO;
  const closers = convention === 'low' ? [LDQ, RDQ] : [reversed ? LAQUO : RAQUO];

  for (let i = a; i < b; i++) {
    const c = text.charCodeAt(i);
    if (paired) {
      if (c !== opener && !closers.includes(c)) continue;
      if (cur === null) {
        if (c === opener || (continuing && i === a)) openAt(i);
        else problems.push({ at: i, message: 'a closing quotation mark has no opening mark before it' });
      } else if (closers.includes(c)) {
        closeAt(i);
      } else {
        problems.push({ at: cur.open, message: 'a quotation is not closed before the next one opens; it was taken to end there' });
        closeAt(i);
        openAt(i);
      }
      continue;
    }
    if (convention === 'double') {
      if (c !== LDQ && c !== RDQ && c !== DQ && c !== LOW_DQ) continue;
      if (cur === null) {
        if (c === LDQ || c === LOW_DQ) openAt(i);
        else if (c === DQ && opensBefore(text, i, a, b) && !isWordCharAt(text, i - 1)) openAt(i);
        else if (c === RDQ || c === DQ) problems.push({ at: i, message: 'a closing quotation mark has no opening mark before it' });
      } else if (c === RDQ || c === DQ) {
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
      // "Mornin’, ma’am": a dropped letter before a comma, with the speech going on after it, is ambiguous too.
      if (/^[,;]\s+\S/.test(text.slice(i + 1, i + 4)) && elided(wordEndingAt(text, i, a))) {
        open.ambiguous.push(i);
        continue;
      }
      closeAt(i);
      continue;
    }
    const word = wordEndingAt(text, i, a);
    if (elided(word) || (word.length > 1 && word.endsWith('s'))) {
      open.ambiguous.push(i);
      continue;
    }
    closeAt(i);
  }
  return { spans, open: cur, problems };
}

/** A word that may end in an apostrophe for a dropped letter: goin’, o’, th’ (a short list as fallback). */
function elided(word: string): boolean {
  return TRAILING_ELISIONS.has(word) || (word.length >= 4 && word.endsWith('in'));
}

function lastNonSpace(text: string, i: number, a: number): number {
  let k = i - 1;
  while (k >= a && /\s/.test(text[k])) k--;
  return k;
}

/**
 * Whether a paragraph starting at `a` opens with the convention's opening mark
 * (a speech that goes on from the paragraph before). Guillemets: French and
 * Spanish printing open such a paragraph with the closing mark » instead
 * (« when reversed), which counts too.
 */
export function opensParagraph(text: string, a: number, b: number, convention: Convention): boolean {
  const c = text.charCodeAt(a);
  if (a + 1 >= b) return false;
  if (convention === 'guillemets') return c === LAQUO || c === RAQUO;
  if (isSpaceAt(text, a + 1, a, b)) return false;
  if (convention === 'double') return c === LDQ || c === DQ || c === LOW_DQ;
  if (convention === 'low') return c === LOW_DQ;
  if (convention === 'single') return c === LSQ || c === SQ;
  return false;
}
