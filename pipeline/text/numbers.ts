/**
 * Chapter numbers as headings write them: Roman numerals, Arabic digits,
 * English number words ("Twenty-Three", "One Hundred and Two") and ordinal
 * words ("the Twenty-First").
 */

export type NumberStyle = 'roman' | 'arabic' | 'words' | 'ordinal';

export interface ParsedNumber {
  value: number;
  style: NumberStyle;
  /** How many characters of the input the number takes. */
  length: number;
  /** Whether an ordinal was written with a leading "the" ("Chapter the First"). */
  withThe: boolean;
}

const ROMAN_FORM = /^M{0,3}(?:CM|CD|D?C{0,3})(?:XC|XL|L?X{0,3})(?:IX|IV|V?I{0,3})$/;
const ROMAN_DIGITS: Record<string, number> = { I: 1, V: 5, X: 10, L: 50, C: 100, D: 500, M: 1000 };

/** The value of a well-formed upper-case Roman numeral, or null. */
export function romanValue(s: string): number | null {
  if (s.length === 0 || !ROMAN_FORM.test(s)) return null;
  let total = 0;
  for (let i = 0; i < s.length; i++) {
    const v = ROMAN_DIGITS[s[i]];
    const next = i + 1 < s.length ? ROMAN_DIGITS[s[i + 1]] : 0;
    total += v < next ? -v : v;
  }
  return total;
}

/** Convert 1..3999 to an upper-case Roman numeral. */
export function toRoman(n: number): string {
  const table: Array<[number, string]> = [
    [1000, 'M'], [900, 'CM'], [500, 'D'], [400, 'CD'], [100, 'C'], [90, 'XC'],
    [50, 'L'], [40, 'XL'], [10, 'X'], [9, 'IX'], [5, 'V'], [4, 'IV'], [1, 'I'],
  ];
  let out = '';
  let rest = n;
  for (const [v, sym] of table) {
    while (rest >= v) {
      out += sym;
      rest -= v;
    }
  }
  return out;
}

const UNITS = ['one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine'];
const TEENS = ['ten', 'eleven', 'twelve', 'thirteen', 'fourteen', 'fifteen', 'sixteen', 'seventeen', 'eighteen', 'nineteen'];
const TENS = ['twenty', 'thirty', 'forty', 'fifty', 'sixty', 'seventy', 'eighty', 'ninety'];
const ORD_UNITS = ['first', 'second', 'third', 'fourth', 'fifth', 'sixth', 'seventh', 'eighth', 'ninth'];
const ORD_TEENS = ['tenth', 'eleventh', 'twelfth', 'thirteenth', 'fourteenth', 'fifteenth', 'sixteenth', 'seventeenth', 'eighteenth', 'nineteenth'];
const ORD_TENS = ['twentieth', 'thirtieth', 'fortieth', 'fiftieth', 'sixtieth', 'seventieth', 'eightieth', 'ninetieth'];

interface WordValue {
  value: number;
  kind: 'unit' | 'teen' | 'tens' | 'hundred';
  ordinal: boolean;
}

const WORD_VALUES = new Map<string, WordValue>();
UNITS.forEach((w, i) => WORD_VALUES.set(w, { value: i + 1, kind: 'unit', ordinal: false }));
TEENS.forEach((w, i) => WORD_VALUES.set(w, { value: i + 10, kind: 'teen', ordinal: false }));
TENS.forEach((w, i) => WORD_VALUES.set(w, { value: (i + 2) * 10, kind: 'tens', ordinal: false }));
ORD_UNITS.forEach((w, i) => WORD_VALUES.set(w, { value: i + 1, kind: 'unit', ordinal: true }));
ORD_TEENS.forEach((w, i) => WORD_VALUES.set(w, { value: i + 10, kind: 'teen', ordinal: true }));
ORD_TENS.forEach((w, i) => WORD_VALUES.set(w, { value: (i + 2) * 10, kind: 'tens', ordinal: true }));
WORD_VALUES.set('hundred', { value: 100, kind: 'hundred', ordinal: false });
WORD_VALUES.set('hundredth', { value: 100, kind: 'hundred', ordinal: true });

interface Word {
  word: string;
  start: number;
  end: number;
}

/** Split the start of `s` into words joined by spaces or hyphens (at most `max`). */
function leadingWords(s: string, max: number): Word[] {
  const words: Word[] = [];
  const re = /[A-Za-z]+/y;
  let pos = 0;
  while (words.length < max) {
    re.lastIndex = pos;
    const m = re.exec(s);
    if (!m) break;
    words.push({ word: m[0].toLowerCase(), start: pos, end: pos + m[0].length });
    let next = pos + m[0].length;
    const sep = /[ \t]*[-\u2010\u2011][ \t]*|[ \t]+/y;
    sep.lastIndex = next;
    const sm = sep.exec(s);
    if (!sm) break;
    next += sm[0].length;
    pos = next;
  }
  return words;
}

/**
 * Parse English number words at the start of `s`: cardinals ("Twenty-Three",
 * "One Hundred and Two") and ordinals ("Twenty-First", "Fiftieth"). Only the
 * words that form a number are consumed.
 */
export function parseNumberWords(s: string): { value: number; ordinal: boolean; length: number } | null {
  const words = leadingWords(s, 6);
  let i = 0;
  let value = 0;
  let end = 0;
  let ordinal = false;
  const at = (k: number): WordValue | undefined => (k < words.length ? WORD_VALUES.get(words[k].word) : undefined);

  // [unit "hundred" ["and"]]
  const first = at(0);
  if (!first) return null;
  if (first.kind === 'unit' && !first.ordinal && at(1)?.kind === 'hundred') {
    const h = at(1)!;
    value = first.value * 100;
    end = words[1].end;
    i = 2;
    if (h.ordinal) return { value, ordinal: true, length: end };
    if (i < words.length && words[i].word === 'and' && at(i + 1)) i++;
  }
  // below one hundred
  const w = at(i);
  if (w && w.kind !== 'hundred') {
    value += w.value;
    end = words[i].end;
    ordinal = w.ordinal;
    if (w.kind === 'tens' && !w.ordinal) {
      const u = at(i + 1);
      if (u && u.kind === 'unit') {
        value += u.value;
        end = words[i + 1].end;
        ordinal = u.ordinal;
      }
    }
  } else if (value === 0) {
    return null;
  }
  return { value, ordinal, length: end };
}

/**
 * Parse a chapter number at the start of `s` (which has no leading space).
 * `romanAnyCase` lets "iv" count as a Roman numeral (after a keyword such as
 * "Chapter"); bare numerals must be upper case.
 */
export function parseLeadingNumber(s: string, romanAnyCase: boolean): ParsedNumber | null {
  const the = /^the[ \t]+/i.exec(s);
  if (the) {
    const w = parseNumberWords(s.slice(the[0].length));
    if (w && w.ordinal) return { value: w.value, style: 'ordinal', length: the[0].length + w.length, withThe: true };
    return null;
  }
  const digits = /^\d{1,4}(?![\p{L}\p{N}])/u.exec(s);
  if (digits) return { value: Number(digits[0]), style: 'arabic', length: digits[0].length, withThe: false };
  const roman = (romanAnyCase ? /^[ivxlcdm]+(?![\p{L}\p{N}])/iu : /^[IVXLCDM]+(?![\p{L}\p{N}])/u).exec(s);
  if (roman) {
    const v = romanValue(roman[0].toUpperCase());
    if (v !== null) return { value: v, style: 'roman', length: roman[0].length, withThe: false };
  }
  const w = parseNumberWords(s);
  if (w && !/^[\p{L}\p{N}]/u.test(s.slice(w.length))) {
    return { value: w.value, style: w.ordinal ? 'ordinal' : 'words', length: w.length, withThe: false };
  }
  return null;
}
