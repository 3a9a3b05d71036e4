/**
 * Character classes used by the scanners, on UTF-16 code units (fast paths for
 * ASCII, Unicode property tests otherwise).
 */

/** White space other than LF is `isSpace`; LF is tested separately where it matters. */
export function isSpace(c: number): boolean {
  if (c <= 32) return c === 32 || c === 9 || c === 10 || c === 11 || c === 12 || c === 13;
  if (c < 160) return false;
  return c === 160 || c === 0x1680 || (c >= 0x2000 && c <= 0x200a) || c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff;
}

const UPPER_OR_UNCASED = /^[\p{Lu}\p{Lt}\p{Lo}\p{N}]/u;
const LETTER = /^\p{L}/u;

/** Could this character begin a sentence: an upper-case or uncased letter, or a digit. */
export function startsSentenceChar(text: string, i: number): boolean {
  const c = text.charCodeAt(i);
  if (c < 128) return (c >= 65 && c <= 90) || (c >= 48 && c <= 57);
  return UPPER_OR_UNCASED.test(text.slice(i, i + 2));
}

export function isLetterAt(text: string, i: number): boolean {
  const c = text.charCodeAt(i);
  if (c < 128) return (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
  if (c >= 0xdc00 && c <= 0xdfff) return LETTER.test(text.slice(i - 1, i + 1)); // low surrogate: test the pair
  return LETTER.test(text.slice(i, i + 2));
}

/** Sentence-ending punctuation: . ! ? … and the doubled forms ‼ ⁇ ⁈ ⁉. */
export function isTerminal(c: number): boolean {
  return c === 46 || c === 33 || c === 63 || c === 0x2026 || c === 0x203c || c === 0x2047 || c === 0x2048 || c === 0x2049;
}

/** Closing quotation marks and brackets that belong to the sentence they follow. */
export function isCloser(c: number): boolean {
  return c === 34 || c === 39 || c === 41 || c === 93 || c === 125 || c === 0x2019 || c === 0x201d || c === 0xbb || c === 0x203a;
}

/** Opening quotation marks, brackets, inverted marks, emphasis marks and dialogue dashes that may precede a sentence's first word. */
export function isOpener(c: number): boolean {
  return c === 34 || c === 39 || c === 40 || c === 91 || c === 123 || c === 0x2018 || c === 0x201c || c === 0x201e || c === 0x201a || c === 0xab || c === 0x2039 || c === 0xbf || c === 0xa1 || c === 95 || c === 42 || c === 0x2014 || c === 0x2013;
}
