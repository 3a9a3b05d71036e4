/**
 * Word tokens: runs of letters, marks and digits. An apostrophe (' or ’) or a
 * hyphen between two such characters stays inside the word ("don't",
 * "o’clock", "well-kept"); a full stop or comma between two digits too
 * ("3.5", "1,000"). Leading and trailing apostrophes are not part of a word.
 */

import { TOKEN_FLAGS } from './model.ts';

const LETTER = 1;
const MARK = 2;
const NUMBER = 3;
const OTHER = 4;

/** Character class per BMP code unit, filled lazily (0 = not yet known). */
const CLASS = new Uint8Array(65536);
for (let c = 0; c < 128; c++) {
  CLASS[c] = (c >= 65 && c <= 90) || (c >= 97 && c <= 122) ? LETTER : c >= 48 && c <= 57 ? NUMBER : OTHER;
}
for (let c = 0xd800; c <= 0xdfff; c++) CLASS[c] = OTHER; // surrogates are classified by code point

function classifyChar(ch: string): number {
  if (/^\p{L}/u.test(ch)) return LETTER;
  if (/^\p{N}/u.test(ch)) return NUMBER;
  if (/^\p{M}/u.test(ch)) return MARK;
  return OTHER;
}

/** Class of the character at i and its length in code units (2 for a surrogate pair). */
let charLength = 1;
function classAt(text: string, i: number): number {
  const c = text.charCodeAt(i);
  charLength = 1;
  let k = CLASS[c];
  if (k !== 0 && (c < 0xd800 || c > 0xdbff)) return k;
  if (c >= 0xd800 && c <= 0xdbff) {
    const d = text.charCodeAt(i + 1);
    if (d >= 0xdc00 && d <= 0xdfff) {
      charLength = 2;
      return classifyChar(text.slice(i, i + 2));
    }
    return OTHER;
  }
  k = classifyChar(text[i]);
  CLASS[c] = k;
  return k;
}

/** Apostrophes and hyphens that join two word characters: ' ’ - ‐ ‑. */
function isJoiner(c: number): boolean {
  return c === 39 || c === 0x2019 || c === 45 || c === 0x2010 || c === 0x2011;
}

export interface Span {
  start: number;
  end: number;
}

/**
 * Find the next word token in `text[from, end)` and put it in `out`.
 * Returns false when there is none.
 */
export function nextWord(text: string, from: number, end: number, out: Span): boolean {
  let i = from;
  while (i < end) {
    const k = classAt(text, i);
    if (k === LETTER || k === NUMBER) break;
    i += charLength;
  }
  if (i >= end) return false;
  out.start = i;
  let prev = classAt(text, i);
  i += charLength;
  while (i < end) {
    const k = classAt(text, i);
    if (k === LETTER || k === NUMBER || k === MARK) {
      prev = k === MARK ? prev : k;
      i += charLength;
      continue;
    }
    const c = text.charCodeAt(i);
    if (i + 1 < end) {
      const joins = isJoiner(c) || ((c === 46 || c === 44) && prev === NUMBER);
      if (joins) {
        const n = classAt(text, i + 1);
        if ((n === LETTER || n === NUMBER) && (isJoiner(c) || n === NUMBER)) {
          prev = n;
          i += 1 + charLength;
          continue;
        }
      }
    }
    break;
  }
  out.end = i;
  return true;
}

/** The word tokens of a string (names, tests, small inputs; the model uses the same scanner). */
export function tokenise(s: string): Span[] {
  const out: Span[] = [];
  const span: Span = { start: 0, end: 0 };
  while (nextWord(s, span.end, s.length, span)) out.push({ start: span.start, end: span.end });
  return out;
}

/** The vocabulary form of a token: lower case, typographic apostrophe and hyphens made ASCII. */
export function vocabForm(word: string): string {
  const lower = word.toLowerCase();
  return /[\u2019\u2010\u2011]/.test(lower) ? lower.replace(/\u2019/g, "'").replace(/[\u2010\u2011]/g, '-') : lower;
}

const CAPITAL = /^[\p{Lu}\p{Lt}]/u;
const NUMERIC = /^\p{N}[\p{N}.,]*$/u;

/** TOKEN_FLAGS bits that depend on the word alone (capitalised, numeric). */
export function wordFlags(word: string): number {
  const c = word.charCodeAt(0);
  let flags = 0;
  if (c < 128) {
    if (c >= 65 && c <= 90) flags |= TOKEN_FLAGS.capitalised;
  } else if (CAPITAL.test(word)) {
    flags |= TOKEN_FLAGS.capitalised;
  }
  if (((c >= 48 && c <= 57) || c >= 128) && NUMERIC.test(word)) flags |= TOKEN_FLAGS.numeric;
  return flags;
}
