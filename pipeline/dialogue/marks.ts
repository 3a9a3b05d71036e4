/**
 * Quotation marks as UTF-16 code units, and the words that tell an apostrophe
 * from a single quotation mark. The right single mark ’ (and the straight ')
 * doubles as the apostrophe, so wherever single marks set off speech, or a
 * quotation inside it, a right mark has to be told apart from a closing mark
 * by general typographic rules (scan.ts): a mark between two letters is an
 * apostrophe (don’t, o’er); a mark before a letter opens or elides (’tis);
 * only a mark after a letter and before a space is ambiguous (runnin’, the
 * boys’). The short word lists below are the fallback for that last case and
 * for a mark at a paragraph's start; they are not the main rule.
 */

export const LDQ = 0x201c; // “
export const RDQ = 0x201d; // ”
export const LOW_DQ = 0x201e; // „
export const DQ = 0x22; // "
export const LSQ = 0x2018; // ‘
export const RSQ = 0x2019; // ’
export const SQ = 0x27; // '
export const LAQUO = 0xab; // «
export const RAQUO = 0xbb; // »
export const LOW_SQ = 0x201a; // ‚
export const LSAQUO = 0x2039; // ‹
export const RSAQUO = 0x203a; // ›

export function isDoubleMark(c: number): boolean {
  return c === LDQ || c === RDQ || c === LOW_DQ || c === DQ || c === LAQUO || c === RAQUO;
}

export function isSingleMark(c: number): boolean {
  return c === LSQ || c === RSQ || c === SQ;
}

export function isQuoteMark(c: number): boolean {
  return isDoubleMark(c) || isSingleMark(c);
}

const WORD_CHAR = /[\p{L}\p{N}]/u;

/** Whether the character at i is a letter or digit (false out of range). */
export function isWordCharAt(text: string, i: number): boolean {
  if (i < 0 || i >= text.length) return false;
  const c = text.charCodeAt(i);
  if (c < 128) return (c >= 48 && c <= 57) || (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
  return WORD_CHAR.test(text[i]);
}

/** White space, or out of range (a paragraph edge counts as space). */
export function isSpaceAt(text: string, i: number, from: number, to: number): boolean {
  if (i < from || i >= to) return true;
  return /\s/.test(text[i]);
}

/**
 * Words that begin with an elided letter written with an apostrophe (’twas,
 * ’em, ’tis). A single mark before one of these is an apostrophe, not an
 * opening quotation mark, inside speech. common practice, no source.
 */
export const LEADING_ELISIONS: ReadonlySet<string> = new Set([
  'twas', 'tis', 'twere', 'twill', 'twould', 'twixt', 'tween', 'em', 'im', 'er', 'ere', 'ow', 'alf', 'appen',
  'cause', 'cos', 'bout', 'nuff', 'neath', 'gainst', 'ome', 'ouse', 'ead', 'eart', 'ope', 'ard', 'scuse', 'fraid',
  'spect', 'prentice',
]);

/**
 * Words that end in an apostrophe standing for a dropped letter (goin’, o’,
 * an’, wi’, th’). Together with plural possessives (the Rooks’) they make a
 * right single mark after a letter ambiguous. common practice, no source.
 */
export const TRAILING_ELISIONS: ReadonlySet<string> = new Set([
  'o', 'th', 'an', 'wi', 'ol', 'fo', 'ha', 'gi', 'i', 'e', 'ma', 'pa', 't', 'y', 'yo', 'jes', 'jus', 'las', 'tha',
  'fer', 'ov', 'nex', 'fro', 'lil', 'po', 'mo', 'ter', 'ta', 'ne', 'tho',
]);

/** The word made of letters ending just before offset i (lower-cased). */
export function wordEndingAt(text: string, i: number, from: number): string {
  let a = i;
  while (a > from && /\p{L}/u.test(text[a - 1])) a--;
  return text.slice(a, i).toLowerCase();
}

/** The word made of letters starting at offset i (lower-cased). */
export function wordStartingAt(text: string, i: number, to: number): string {
  let b = i;
  while (b < to && /\p{L}/u.test(text[b])) b++;
  return text.slice(i, b).toLowerCase();
}
