/**
 * Recognising one heading line and forming its display title.
 *
 * Styles recognised (case-insensitive keywords):
 * - keyword units: "CHAPTER I.", "Chapter 1", "CHAPTER XII.—A TITLE",
 *   "Chapter II: A Title", "Chapter the First", "CHAPTER TWENTY-THREE", and
 *   the same with the other unit words of printed books: "STAVE ONE",
 *   "Letter IV", "CANTO 3", "Section 2";
 * - the ordinal first: "The Sixth Chapter", "THE SECOND BOOK";
 * - keyword parts: "BOOK ONE", "PART II", "Book the Second", "VOLUME 2";
 * - extras, unnumbered: "PROLOGUE", "Epilogue: A Title", "INTERLUDE";
 * - bare numerals: "III." or "12" alone, or "VI. A Title" / "12. A Title"
 *   (a numeral and a short Title-Case or ALL-CAPS title). Bare numerals are
 *   only candidates: the structure step keeps them when they form a plausible
 *   sequence.
 */

import { parseLeadingNumber, parseNumberWords, romanValue, type ParsedNumber } from './numbers.ts';
import { cleanTitle, isAllCaps, isTitleCase, titleCase } from './titles.ts';

export type HeadingKind = 'chapter' | 'part' | 'extra' | 'bare';

export interface HeadingLine {
  kind: HeadingKind;
  /** Display keyword: "Chapter", "Stave", "Book", "Part", "Volume", "Prologue", …; null for bare numerals. */
  keyword: string | null;
  /** Whether the ordinal came before the keyword ("The Sixth Chapter"). */
  ordinalFirst?: boolean;
  number: ParsedNumber | null;
  /** The number as written in the line, e.g. "XII", "Twenty-Three", "the First". */
  numberText: string;
  /** The title written on the heading line itself, cleaned; null when none. */
  title: string | null;
}

/** Longest line considered as a heading at all. */
export const MAX_HEADING_LINE = 150;
/** Longest line for a heading whose title follows the number after a space only. */
const MAX_LOOSE_HEADING_LINE = 80;
/** Longest line for a bare Roman numeral with a title ("VI. A Title"). */
const MAX_BARE_TITLED_LINE = 70;

const KEYWORDS: Record<string, { kind: 'chapter' | 'part'; display: string }> = {
  chapter: { kind: 'chapter', display: 'Chapter' },
  'chap.': { kind: 'chapter', display: 'Chapter' },
  stave: { kind: 'chapter', display: 'Stave' },
  letter: { kind: 'chapter', display: 'Letter' },
  canto: { kind: 'chapter', display: 'Canto' },
  section: { kind: 'chapter', display: 'Section' },
  book: { kind: 'part', display: 'Book' },
  part: { kind: 'part', display: 'Part' },
  volume: { kind: 'part', display: 'Volume' },
  'vol.': { kind: 'part', display: 'Volume' },
};
const KEYWORD_LINE = /^(chapter|chap\.|stave|letter|canto|section|book|part|volume|vol\.)[ \t]+(.+)$/i;
/** "The Sixth Chapter", "THE SECOND BOOK.—A TITLE": an ordinal, then the unit word. */
const ORDINAL_FIRST_LINE = /^the[ \t]+(.+?)[ \t]+(chapter|stave|letter|canto|section|book|part|volume)(?![\p{L}\p{N}])(.*)$/iu;
const EXTRA_LINE = /^(prologue|epilogue|interlude)(?![\p{L}\p{N}])(.*)$/iu;
/** After the number: optional full stop, optional colon/dash(es), spaces. */
const SEPARATOR = /^[ \t]*(\.)?[ \t]*([:\u2012-\u2015]+|-{1,3})?[ \t]*/;
const BARE_ROMAN = /^([IVXLC]+)\.?$/;
const BARE_ARABIC = /^(\d{1,3})\.?$/;
const BARE_ROMAN_TITLED = /^([IVXLC]+)(?:\.[ \t]*[\u2012-\u2015]+[ \t]*|\.[ \t]+|[ \t]*[:\u2012-\u2015][ \t]*|[ \t]+-{1,2}[ \t]+)(\S.*)$/;
/** "12. A Title", "12: A Title", "12 — A Title": a bare number needs a stop, colon or dash before its title. */
const BARE_ARABIC_TITLED = /^(\d{1,3})(?:\.[ \t]*[\u2012-\u2015]+[ \t]*|\.[ \t]+|[ \t]*[:\u2012-\u2015][ \t]*|[ \t]+-{1,2}[ \t]+)(\S.*)$/;

function titleAfterNumber(after: string, allowLoose: boolean, lineLength: number): { title: string | null } | null {
  const sep = SEPARATOR.exec(after)!;
  const rest = after.slice(sep[0].length);
  if (rest.length === 0) return { title: null };
  const punctuated = sep[1] !== undefined || sep[2] !== undefined;
  if (!punctuated) {
    if (!allowLoose || sep[0].length === 0 || lineLength > MAX_LOOSE_HEADING_LINE) return null;
    const t = cleanTitle(rest);
    if (!(isAllCaps(t) || isTitleCase(t))) return null;
    return { title: t };
  }
  const t = cleanTitle(rest);
  return { title: t.length > 0 ? t : null };
}

function parseKeywordLine(line: string): HeadingLine | null {
  const m = KEYWORD_LINE.exec(line);
  if (!m) return null;
  const kw = KEYWORDS[m[1].toLowerCase()];
  const rest = m[2];
  const num = parseLeadingNumber(rest, true);
  if (!num) return null;
  const t = titleAfterNumber(rest.slice(num.length), true, line.length);
  if (!t) return null;
  return { kind: kw.kind, keyword: kw.display, number: num, numberText: rest.slice(0, num.length), title: t.title };
}

function parseOrdinalFirstLine(line: string): HeadingLine | null {
  const m = ORDINAL_FIRST_LINE.exec(line);
  if (!m) return null;
  const w = parseNumberWords(m[1]);
  if (!w || !w.ordinal || w.length !== m[1].length) return null;
  const kw = KEYWORDS[m[2].toLowerCase()];
  const t = titleAfterNumber(m[3], false, line.length);
  if (!t) return null;
  return {
    kind: kw.kind,
    keyword: kw.display,
    number: { value: w.value, style: 'ordinal', length: m[1].length, withThe: true },
    numberText: `the ${m[1]}`,
    title: t.title,
    ordinalFirst: true,
  };
}

function parseExtraLine(line: string): HeadingLine | null {
  const m = EXTRA_LINE.exec(line);
  if (!m) return null;
  const t = titleAfterNumber(m[2], false, line.length);
  if (!t) return null;
  const keyword = m[1][0].toUpperCase() + m[1].slice(1).toLowerCase();
  return { kind: 'extra', keyword, number: null, numberText: '', title: t.title };
}

function parseBareLine(line: string): HeadingLine | null {
  let m = BARE_ROMAN.exec(line);
  if (m) {
    const v = romanValue(m[1]);
    if (v === null) return null;
    return { kind: 'bare', keyword: null, number: { value: v, style: 'roman', length: m[1].length, withThe: false }, numberText: m[1], title: null };
  }
  m = BARE_ARABIC.exec(line);
  if (m) {
    const v = Number(m[1]);
    if (v === 0) return null;
    return { kind: 'bare', keyword: null, number: { value: v, style: 'arabic', length: m[1].length, withThe: false }, numberText: m[1], title: null };
  }
  if (line.length > MAX_BARE_TITLED_LINE) return null;
  for (const [re, style] of [[BARE_ROMAN_TITLED, 'roman'], [BARE_ARABIC_TITLED, 'arabic']] as const) {
    m = re.exec(line);
    if (!m) continue;
    const v = style === 'roman' ? romanValue(m[1]) : Number(m[1]);
    const title = cleanTitle(m[2]);
    if (v === null || v === 0 || title.length === 0) return null;
    if (!isBareTitle(title)) return null;
    return { kind: 'bare', keyword: null, number: { value: v, style, length: m[1].length, withThe: false }, numberText: m[1], title };
  }
  return null;
}

/** A title after a bare numeral: Title Case or ALL CAPS, not opening with a quotation mark, not ending as a clause does. */
function isBareTitle(title: string): boolean {
  if (/[,;:]$/.test(title) || /^["'“‘«„]/u.test(title)) return false;
  return isAllCaps(title) || isTitleCase(title);
}

/** Recognise a heading line (already trimmed of surrounding white space). */
export function parseHeadingLine(line: string): HeadingLine | null {
  if (line.length === 0 || line.length > MAX_HEADING_LINE) return null;
  const c = line.charCodeAt(0);
  // Quick reject: every style starts with a Latin letter or a digit.
  if (!((c >= 65 && c <= 90) || (c >= 97 && c <= 122) || (c >= 48 && c <= 57))) return null;
  return parseKeywordLine(line) ?? parseOrdinalFirstLine(line) ?? parseExtraLine(line) ?? parseBareLine(line);
}

/**
 * Why a line that starts like a heading is not one, or null when it does not
 * start like one: a unit word and a number followed by words that read as a
 * sentence ("Chapter one was the dullest, she thought."), or a numeral
 * followed by a sentence ("12. Rope, two coils."). Only for lines that
 * `parseHeadingLine` turned down.
 */
export function nearMissReason(line: string): string | null {
  if (line.length === 0 || line.length > MAX_HEADING_LINE) return null;
  const m = KEYWORD_LINE.exec(line);
  if (m && parseLeadingNumber(m[2], true)) return `starts with “${m[1]}” and a number, but what follows reads as a sentence, not a title`;
  if (/^(?:\d{1,3}|[IVXLC]+)\.[ \t]+\S/.test(line) && line.length <= MAX_BARE_TITLED_LINE) return 'a numeral followed by a sentence (a list item?), not by a title';
  return null;
}

function numberDisplay(h: HeadingLine): string {
  const n = h.number;
  if (!n) return '';
  if (n.style === 'roman') return h.numberText.toUpperCase();
  if (n.style === 'arabic') return h.numberText;
  // Words and ordinals: capitalise each word, keep "the" lower case, keep the hyphens as written.
  return h.numberText
    .toLowerCase()
    .replace(/(^|[\s\-\u2010\u2011]+)(\p{L})/gu, (_m, sep: string, ch: string) => sep + ch.toUpperCase())
    .replace(/^The(?=\s)/, 'the')
    .replace(/\sAnd\s/, ' and ');
}

/**
 * Display title of a heading.
 * - keyword headings: "Chapter XII: A Title", "Chapter the First", "Book Two";
 * - extras: "Prologue", "Epilogue: A Title";
 * - bare numerals: "VI. A Title" with a title, else "Chapter 6".
 * An ALL-CAPS title is put into title case; `titleLine` is a title taken from
 * the line below the heading.
 */
export function displayTitle(h: HeadingLine, titleLine: string | null): string {
  const rawTitle = h.title ?? (titleLine !== null ? cleanTitle(titleLine) : null);
  const title = rawTitle !== null ? titleCase(rawTitle) : null;
  if (h.kind === 'bare') {
    if (title === null) return `Chapter ${h.number!.value}`;
    return `${h.numberText}. ${title}`;
  }
  const head =
    h.kind === 'extra' ? h.keyword! : h.ordinalFirst ? `The ${numberDisplay(h).replace(/^the\s+/, '')} ${h.keyword}` : `${h.keyword} ${numberDisplay(h)}`;
  return title === null ? head : `${head}: ${title}`;
}

/**
 * Display title for a heading found by a curator's pattern: the heading line
 * itself (ALL CAPS put into title case, a final full stop dropped), then
 * ": " and the title line if there is one. A heading with no letters becomes
 * "Chapter N" (N = position among the chapters, from 1).
 */
export function displayCustomTitle(heading: string, titleLine: string | null, position: number): string {
  const parsed = parseHeadingLine(heading);
  if (parsed && parsed.kind !== 'bare') return displayTitle(parsed, titleLine);
  const title = titleLine !== null ? titleCase(cleanTitle(titleLine)) : null;
  const head = /\p{L}/u.test(heading) ? titleCase(cleanTitle(heading)) : `Chapter ${position}`;
  return title === null ? head : `${head}: ${title}`;
}
