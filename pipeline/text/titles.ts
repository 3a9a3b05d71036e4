/**
 * Typography of heading titles: recognising a title line and putting an
 * ALL-CAPS heading into title case for display.
 */

/** Words that stay lower case inside a title (unless first or last). common practice, no source. */
const SMALL_WORDS = new Set([
  'a', 'an', 'the', 'and', 'but', 'or', 'nor', 'for', 'so', 'yet', 'of', 'in', 'on', 'at', 'to', 'by',
  'up', 'as', 'with', 'from', 'into', 'upon', 'over', 'than', 'via', 'off', 'out', 'onto', 'unto',
]);

const HAS_LOWER = /\p{Ll}/u;
const LETTER = /\p{L}/gu;
const OPENING_QUOTE = /^["'“‘«„‚]/u;

/** At least two letters and no lower-case letter. */
export function isAllCaps(s: string): boolean {
  if (HAS_LOWER.test(s)) return false;
  const letters = s.match(LETTER);
  return letters !== null && letters.length >= 2;
}

/** First word capitalised; every later word capitalised, a small word, or not a word. */
export function isTitleCase(s: string): boolean {
  const words = s.split(/\s+/).filter((w) => w.length > 0);
  if (words.length === 0) return false;
  for (let i = 0; i < words.length; i++) {
    const w = words[i].replace(/^[^\p{L}\p{N}]+/u, '');
    if (w.length === 0 || /^\p{N}/u.test(w)) continue;
    if (/^\p{Lu}|^\p{Lt}/u.test(w)) continue;
    if (i > 0 && SMALL_WORDS.has(w.replace(/[^\p{L}]+$/u, '').toLowerCase())) continue;
    return false;
  }
  return /^[^\p{L}]*[\p{Lu}\p{Lt}]/u.test(s);
}

/** Maximum length of a title line under a heading. */
export const MAX_TITLE_LINE = 60;

/**
 * Whether a line (trimmed) reads as a chapter title on its own: at most 60
 * characters, ALL CAPS or Title Case, not opening with a quotation mark, and
 * not ending with a full stop, comma, colon or semicolon as a sentence would.
 */
export function isTitleLine(line: string): boolean {
  if (line.length === 0 || line.length > MAX_TITLE_LINE) return false;
  if (!/\p{L}/u.test(line)) return false;
  if (/[.,;:]$/.test(line) && !/\.\.\.$|…$/.test(line)) return false;
  if (/[.,;:]["'”’)\]]$/u.test(line)) return false;
  const caps = isAllCaps(line);
  if (OPENING_QUOTE.test(line) && !caps) return false;
  return caps || isTitleCase(line);
}

function capitaliseWord(word: string, force: boolean): string {
  const lower = word.toLowerCase();
  if (/^[IVX]{2,}$/.test(word)) return word; // Roman numerals inside titles stay upper case
  if (!force && SMALL_WORDS.has(lower)) return lower;
  // Capitalise after hyphens too ("Well-Kept"), not after apostrophes ("Miller's").
  return lower.replace(/(^|[-\u2010\u2011])([^\p{L}]*)(\p{L})/gu, (_m, sep: string, pre: string, ch: string) => sep + pre + ch.toUpperCase());
}

/** "THE MILLER'S DAUGHTER" → "The Miller's Daughter". Only ALL-CAPS input is changed. */
export function titleCase(s: string): string {
  if (!isAllCaps(s)) return s;
  const parts = s.split(/(\s+)/);
  const wordIdx = parts.map((p, i) => (/\S/.test(p) ? i : -1)).filter((i) => i >= 0);
  const firstWord = wordIdx[0];
  const lastWord = wordIdx[wordIdx.length - 1];
  return parts
    .map((p, i) => (/\S/.test(p) ? capitaliseWord(p, i === firstWord || i === lastWord || /[:.—–-]$/.test(parts[i - 2] ?? '')) : p))
    .join('');
}

/** Trim a title and drop one trailing full stop (not an ellipsis). */
export function cleanTitle(s: string): string {
  let t = s.trim();
  if (t.endsWith('.') && !t.endsWith('..')) t = t.slice(0, -1).trimEnd();
  return t;
}
