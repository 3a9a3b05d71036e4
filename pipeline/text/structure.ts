/**
 * The block structure of a normalised text: blank-line separated blocks become
 * paragraphs or headings. A heading is the first line of a block; what follows
 * it in the same block is split off (a title line, or the body).
 *
 * Candidates are then judged the way a reader of a printed book would:
 * - a table of contents (a run of heading lines with next to no text between
 *   them, under a "Contents" line or repeated by the headings that follow) is
 *   front matter, not chapters;
 * - bare numerals ("III.", "VI. A Title") stand only in a text with no keyword
 *   chapter headings, and only when they form a plausible sequence, are not a
 *   run with nothing between them (a list), and do not number stanzas of verse;
 * - "Section" headings inside a text that has chapters (or letters, staves,
 *   cantos) are subdivisions, not units;
 * - a closing "THE END" or "FINIS" is back matter.
 * Every candidate turned down is reported with the reason.
 */

import { isSpace } from './chars.ts';
import { displayCustomTitle, displayTitle, nearMissReason, parseHeadingLine, type HeadingLine } from './headings.ts';
import { isTitleLine } from './titles.ts';

export interface ParagraphUnit {
  t: 'para';
  /** Offsets in the text: first and just past the last non-space character. */
  start: number;
  end: number;
}

export interface HeadingUnit {
  t: 'heading';
  kind: 'chapter' | 'part';
  /** An unnumbered unit (prologue, epilogue, interlude): outside any part. */
  extra: boolean;
  /** The heading line, trimmed of surrounding white space. */
  heading: string;
  /** Display title. */
  title: string;
  /** Offset of the heading line's first character. */
  start: number;
  /** Offset just past the heading (and its title line, if one was taken). */
  end: number;
}

/** Text outside every chapter that is not a paragraph of one: a closing "THE END". */
export interface MatterUnit {
  t: 'matter';
  start: number;
  end: number;
}

export type Unit = ParagraphUnit | HeadingUnit | MatterUnit;

/** A heading line that was taken, at its offset in the text. */
export interface TakenHeading {
  at: number;
  text: string;
  title: string;
  level: 'part' | 'chapter';
}

/** A line that looked like a heading and was turned down, with why. */
export interface RejectedHeading {
  at: number;
  text: string;
  reason: string;
}

export interface StructureOptions {
  /** Curator's heading pattern (replaces automatic chapter detection). Default: none. */
  chapterPattern?: RegExp;
}

interface Lines {
  count: number;
  start: Uint32Array;
  end: Uint32Array;
  blank: Uint8Array;
  /** Wrap width, once measured (see wrapWidth). */
  wrap?: number;
}

function splitLines(text: string): Lines {
  let count = 1;
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) count++;
  const start = new Uint32Array(count);
  const end = new Uint32Array(count);
  const blank = new Uint8Array(count);
  let s = 0;
  for (let k = 0; k < count; k++) {
    let e = text.indexOf('\n', s);
    if (e === -1) e = text.length;
    start[k] = s;
    end[k] = e;
    let b = 1;
    for (let i = s; i < e; i++) {
      if (!isSpace(text.charCodeAt(i))) {
        b = 0;
        break;
      }
    }
    blank[k] = b;
    s = e + 1;
  }
  return { count, start, end, blank };
}

type Classified = { kind: 'custom' } | HeadingLine;

interface HeadItem {
  t: 'head';
  c: Classified;
  /** First and last line of the heading (the last is the title line when one was taken from the same block). */
  f: number;
  l: number;
  titleLine: number;
  /** Line index of a title taken from the next block (set when that block is consumed), or -1. */
  titleBlockLine: number;
}

interface ParaItem {
  t: 'para';
  f: number;
  l: number;
  /** Index of the heading item this single-line block may be the title of, or -1. */
  titleOf: number;
}

type Item = HeadItem | ParaItem;

function isStrong(c: Classified): boolean {
  return c.kind !== 'bare';
}

/**
 * Keep the bare-numeral headings that form the longest run of consecutive
 * numbers (n, n+1, n+2, …) in each stretch between part headings. A run
 * starts at 1 or 2, or continues the numbering of the previous part.
 */
export function plausibleSequence(values: number[], segment: number[]): boolean[] {
  const keep = new Array<boolean>(values.length).fill(false);
  let lastValue = 0;
  let k = 0;
  while (k < values.length) {
    let e = k;
    while (e < values.length && segment[e] === segment[k]) e++;
    const starts = new Set([1, 2]);
    if (lastValue > 0) {
      starts.add(lastValue + 1);
      starts.add(lastValue + 2);
    }
    const bestEnd = new Map<number, { len: number; idx: number }>();
    const prev = new Int32Array(e - k).fill(-1);
    let best = { len: 0, idx: -1 };
    for (let i = k; i < e; i++) {
      const v = values[i];
      const ext = bestEnd.get(v - 1);
      let len = 0;
      if (ext) {
        len = ext.len + 1;
        prev[i - k] = ext.idx;
      } else if (starts.has(v)) {
        len = 1;
      }
      if (len === 0) continue;
      const cur = bestEnd.get(v);
      if (!cur || len > cur.len) bestEnd.set(v, { len, idx: i });
      if (len > best.len) best = { len, idx: i };
    }
    for (let i = best.idx; i >= 0; i = prev[i - k]) keep[i] = true;
    if (best.idx >= 0) lastValue = values[best.idx];
    k = e;
  }
  return keep;
}

export interface Structure {
  units: Unit[];
  /** How many lines matched the curator's chapter pattern (0 without one). */
  patternMatches: number;
  taken: TakenHeading[];
  rejected: RejectedHeading[];
}

export function findStructure(text: string, options: StructureOptions = {}): Structure {
  const lines = splitLines(text);
  const custom = options.chapterPattern;
  const lineText = (i: number): string => text.slice(lines.start[i], lines.end[i]).trim();
  /** Offset of the first non-space character of line i. */
  const lineAt = (i: number): number => {
    let o = lines.start[i];
    while (o < lines.end[i] && isSpace(text.charCodeAt(o))) o++;
    return o;
  };

  const classify = (i: number): Classified | null => {
    const s = lineText(i);
    if (custom) {
      if (custom.test(s)) return { kind: 'custom' };
      const p = parseHeadingLine(s);
      return p && p.kind === 'part' ? p : null;
    }
    return parseHeadingLine(s);
  };
  const isTitleCandidate = (i: number): boolean => isTitleLine(lineText(i)) && classify(i) === null;

  // Pass 1: blocks into items.
  const items: Item[] = [];
  const rejected: RejectedHeading[] = [];
  /** A heading that ended its block without a title: the next block may be its title line. */
  let pendingTitleFor = -1;

  /** Items for the non-blank lines a..b: a heading and its title line split off, the rest a paragraph. */
  const splitStretch = (a: number, b: number): void => {
    let cur = a;
    while (cur <= b) {
      const c = classify(cur);
      const inlineTitle = c !== null && c.kind !== 'custom' && c.title !== null;
      if (c && isStrong(c)) {
        const tl = !inlineTitle && cur + 1 <= b && isTitleCandidate(cur + 1) ? cur + 1 : -1;
        const last = tl >= 0 ? tl : cur;
        items.push({ t: 'head', c, f: cur, l: last, titleLine: tl, titleBlockLine: -1 });
        if (last === b && tl < 0 && !inlineTitle) pendingTitleFor = items.length - 1;
        cur = last + 1;
        continue;
      }
      if (c && (b === cur || (b === cur + 1 && !inlineTitle && isTitleCandidate(cur + 1)))) {
        items.push({ t: 'head', c, f: cur, l: b, titleLine: b > cur ? b : -1, titleBlockLine: -1 });
        if (b === cur && !inlineTitle) pendingTitleFor = items.length - 1;
        cur = b + 1;
        continue;
      }
      items.push({ t: 'para', f: cur, l: b, titleOf: -1 });
      cur = b + 1;
    }
  };

  let f = 0;
  while (f < lines.count) {
    if (lines.blank[f]) {
      f++;
      continue;
    }
    let l = f;
    while (l + 1 < lines.count && !lines.blank[l + 1]) l++;
    const waiting = pendingTitleFor;
    pendingTitleFor = -1;
    if (l === f && classify(f) === null) {
      const why = nearMissReason(lineText(f));
      if (why) rejected.push({ at: lineAt(f), text: lineText(f), reason: why });
    }
    if (waiting >= 0 && l === f && isTitleCandidate(f)) {
      items.push({ t: 'para', f, l, titleOf: waiting });
      f = l + 1;
      continue;
    }
    // With a curator's pattern, a matching line inside a block starts a new stretch there.
    let from = f;
    while (from <= l) {
      let to = l;
      if (custom) {
        for (let j = from + 1; j <= l; j++) {
          if (custom.test(lineText(j))) {
            to = j - 1;
            break;
          }
        }
      }
      splitStretch(from, to);
      from = to + 1;
    }
    f = l + 1;
  }

  // Pass 2: decide which headings stand.
  const judged = judgeHeadings(items, {
    words: (it) => countWords(text.slice(lines.start[it.f], lines.end[it.l])),
    verse: (it) => isVerse(it, lineText, wrapWidth(lines, lineText)),
    text: (it) => lineText(it.f),
    custom: custom !== undefined,
  });
  const { accepted, reasons, partsAsChapters } = judged;
  items.forEach((it, i) => {
    if (it.t === 'head' && reasons[i]) rejected.push({ at: lineAt(it.f), text: lineText(it.f), reason: reasons[i]! });
  });
  items.forEach((it) => {
    if (it.t === 'para' && it.titleOf >= 0 && accepted[it.titleOf]) (items[it.titleOf] as HeadItem).titleBlockLine = it.f;
  });
  // A closing "THE END" after the last heading is back matter.
  let closing = -1;
  for (let i = items.length - 1; i >= 0 && accepted.some((x) => x === 1); i--) {
    const it = items[i]!;
    if (it.t === 'head' && accepted[i]) break;
    if (it.t === 'para' && it.titleOf < 0) {
      if (it.f === it.l && CLOSING_LINE.test(lineText(it.f))) closing = i;
      break;
    }
  }

  // Pass 3: units in text order.
  const units: Unit[] = [];
  const taken: TakenHeading[] = [];
  const paraUnit = (a: number, b: number): ParagraphUnit => {
    let s = lines.start[a];
    while (isSpace(text.charCodeAt(s))) s++;
    let e = lines.end[b];
    while (e > s && isSpace(text.charCodeAt(e - 1))) e--;
    return { t: 'para', start: s, end: e };
  };
  let chapterPosition = 0;
  items.forEach((it, i) => {
    if (it.t === 'para') {
      if (it.titleOf >= 0 && accepted[it.titleOf]) return;
      const unit = paraUnit(it.f, it.l);
      units.push(i === closing ? { t: 'matter', start: unit.start, end: unit.end } : unit);
      return;
    }
    if (!accepted[i]) {
      units.push(paraUnit(it.f, it.l));
      return;
    }
    const heading = lineText(it.f);
    const lastLine = it.titleBlockLine >= 0 ? it.titleBlockLine : it.l;
    const titleLine = it.titleLine >= 0 ? lineText(it.titleLine) : it.titleBlockLine >= 0 ? lineText(it.titleBlockLine) : null;
    const isPart = it.c.kind === 'part' && !partsAsChapters;
    if (!isPart) chapterPosition++;
    const title = it.c.kind === 'custom' ? displayCustomTitle(heading, titleLine, chapterPosition) : displayTitle(it.c, titleLine);
    const hp = paraUnit(it.f, it.f);
    units.push({
      t: 'heading',
      kind: isPart ? 'part' : 'chapter',
      extra: it.c.kind === 'extra',
      heading,
      title,
      start: hp.start,
      end: paraUnit(lastLine, lastLine).end,
    });
    taken.push({ at: hp.start, text: heading, title, level: isPart ? 'part' : 'chapter' });
  });
  const patternMatches = items.filter((it) => it.t === 'head' && it.c.kind === 'custom').length;
  rejected.sort((x, y) => x.at - y.at);
  return { units, patternMatches, taken, rejected };
}

/** A closing line of back matter. common practice, no source. */
const CLOSING_LINE = /^(?:the end|finis)\.?$/i;
/** A line introducing a table of contents. common practice, no source. */
const CONTENTS_LABEL = /^(?:table of )?contents\.?$|^list of (?:chapters|contents)\.?$/i;
const CONTENTS_REPEATED = 'an entry of the table of contents (heading lines with next to no text between them, listed again by the headings that follow)';
const CONTENTS_LABELLED = 'an entry of the table of contents (heading lines with next to no text between them, under a “Contents” line)';
/** Most words a stretch may hold between two entries of a table of contents (page numbers, a short gloss). */
const CONTENTS_FILLER = 12;

function countWords(s: string): number {
  const m = s.match(/[\p{L}\p{N}]+(?:['’\-][\p{L}\p{N}]+)*/gu);
  return m ? m.length : 0;
}

/**
 * The width a text's prose is wrapped at: the 90th percentile of the lengths
 * of lines in blocks of two or more lines, or Infinity when every block is one
 * line (unwrapped paragraphs).
 */
function wrapWidth(lines: Lines, lineText: (i: number) => string): number {
  if (lines.wrap !== undefined) return lines.wrap;
  const lengths: number[] = [];
  for (let i = 0; i < lines.count; i++) {
    if (lines.blank[i]) continue;
    const inBlock = (i > 0 && !lines.blank[i - 1]) || (i + 1 < lines.count && !lines.blank[i + 1]);
    if (inBlock) lengths.push(lineText(i).length);
  }
  lines.wrap = wrapOfLengths(lengths);
  return lines.wrap;
}

/**
 * The wrap width from the lengths of the lines of blocks of two or more lines
 * (trimmed): their 90th percentile, or Infinity when there are fewer than ten
 * such lines (a text of unwrapped paragraphs). common practice, no source.
 */
export function wrapOfLengths(lengths: readonly number[]): number {
  if (lengths.length < 10) return Infinity;
  const sorted = [...lengths].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length * 0.9)]!;
}

/**
 * Lines of verse: two or more lines (trimmed), each opening with a capital
 * letter, none reaching as far as wrapped prose does (three quarters of the
 * wrap width). common practice, no source.
 */
export function isVerseLines(lines: readonly string[], wrap: number): boolean {
  if (lines.length < 2) return false;
  for (const line of lines) {
    if (!/^[^\p{L}\p{N}]*\p{Lu}/u.test(line)) return false;
    if (line.length >= 0.75 * wrap) return false;
  }
  return true;
}

/** A block of verse (see isVerseLines). */
function isVerse(it: ParaItem, lineText: (i: number) => string, wrap: number): boolean {
  const lines: string[] = [];
  for (let i = it.f; i <= it.l; i++) lines.push(lineText(i));
  return isVerseLines(lines, wrap);
}

interface Judge {
  words(it: ParaItem): number;
  verse(it: ParaItem): boolean;
  text(it: Item): string;
  custom: boolean;
}

interface Judged {
  accepted: Uint8Array;
  /** Why each turned-down heading item was turned down (undefined for accepted items and paragraphs). */
  reasons: (string | undefined)[];
  /** No chapter-level heading stands, so part headings are the units. */
  partsAsChapters: boolean;
}

/** An identity for a heading, to find a contents entry again among the headings that follow it. */
function headingKey(c: Classified): string {
  if (c.kind === 'custom') return 'custom';
  const n = c.number ? String(c.number.value) : '';
  return `${c.kind}:${(c.keyword ?? '').toLowerCase()}:${n}`;
}

function judgeHeadings(items: Item[], judge: Judge): Judged {
  const accepted = new Uint8Array(items.length);
  const reasons: (string | undefined)[] = new Array(items.length);
  const heads: number[] = [];
  items.forEach((it, i) => {
    if (it.t === 'head') heads.push(i);
  });
  /** Position of an item among the headings. */
  const headPos = new Map<number, number>(heads.map((h, p) => [h, p]));
  // What stands between each heading and the next: words and blocks of body text (title lines left out).
  const gapWords = new Map<number, number>();
  const gapParas = new Map<number, ParaItem[]>();
  for (let h = 0; h < heads.length; h++) {
    const end = h + 1 < heads.length ? heads[h + 1]! : items.length;
    let words = 0;
    const paras: ParaItem[] = [];
    for (let i = heads[h]! + 1; i < end; i++) {
      const it = items[i]!;
      if (it.t !== 'para' || it.titleOf === heads[h]) continue;
      words += judge.words(it);
      paras.push(it);
    }
    gapWords.set(heads[h]!, words);
    gapParas.set(heads[h]!, paras);
  }

  // A table of contents: a run of headings with next to no text between them, before any heading has a body,
  // under a "Contents" line or followed later by the same headings.
  const contents = new Set<number>();
  let k = 0;
  while (k < heads.length) {
    let e = k;
    while (e + 1 < heads.length && gapWords.get(heads[e]!)! <= CONTENTS_FILLER) e++;
    if (e > k) {
      const first = heads[k]!;
      let label = false;
      for (let i = first - 1; i >= 0 && i >= first - 3; i--) {
        const it = items[i]!;
        if (it.t === 'para' && it.f === it.l && CONTENTS_LABEL.test(judge.text(it))) label = true;
        if (it.t === 'head') break;
      }
      // The headings listed again: the first two entries' keys, in order, at some later heading j. The entries
      // are then the headings from k up to j − 1 (the run may end with the first real heading itself).
      const keyOf = (h: number): string => headingKey((items[heads[h]!] as HeadItem).c);
      // The entries must be far shorter than the chapters they list (a quarter of their words at most), so that
      // a run of very short numbered sections that restarts its numbering is not taken for a contents page.
      const wordsOf = (from: number, to: number): number => {
        let w = 0;
        for (let h = from; h < to && h < heads.length; h++) w += gapWords.get(heads[h]!)!;
        return w;
      };
      let repeatAt = -1;
      for (let j = k + 2; j + 1 < heads.length && repeatAt < 0; j++) {
        if (keyOf(j) !== keyOf(k) || keyOf(j + 1) !== keyOf(k + 1)) continue;
        const entries = Math.min(j, e + 1) - k;
        if (wordsOf(k, k + entries) <= 0.25 * wordsOf(j, j + entries)) repeatAt = j;
      }
      const last = repeatAt >= 0 ? Math.min(repeatAt - 1, e) : label ? (gapWords.get(heads[e]!)! <= CONTENTS_FILLER ? e : e - 1) : -1;
      if (last > k) {
        for (let j = k; j <= last; j++) {
          contents.add(heads[j]!);
          reasons[heads[j]!] = repeatAt >= 0 ? CONTENTS_REPEATED : CONTENTS_LABELLED;
        }
      }
    }
    if (gapWords.get(heads[e]!)! > CONTENTS_FILLER && !contents.has(heads[e]!)) break; // the body has begun
    k = e + 1;
  }

  let numbered = 0;
  const unitWords = new Set<string>();
  for (const i of heads) {
    const c = (items[i] as HeadItem).c;
    if (contents.has(i)) continue;
    if (c.kind === 'custom' || c.kind === 'part') accepted[i] = 1;
    if (c.kind === 'chapter') {
      accepted[i] = 1;
      unitWords.add(c.keyword!);
    }
    if (c.kind === 'custom' || c.kind === 'chapter') numbered++;
  }
  // "Section" under chapters (letters, staves, cantos) is a subdivision of them.
  if (unitWords.has('Section') && unitWords.size > 1) {
    for (const i of heads) {
      const c = (items[i] as HeadItem).c;
      if (c.kind === 'chapter' && c.keyword === 'Section' && accepted[i]) {
        accepted[i] = 0;
        numbered--;
        reasons[i] = 'a section inside a chapter (the text’s units are headed with another word)';
      }
    }
  }
  let chapterHeads = numbered;
  const bare = heads.filter((i) => (items[i] as HeadItem).c.kind === 'bare' && !contents.has(i));
  if (numbered > 0 || judge.custom) {
    for (const i of bare) {
      reasons[i] = judge.custom
        ? 'a bare numeral; the plan gives a chapter pattern'
        : 'a bare numeral in a text whose chapters are headed with a word (Chapter, Letter, Stave…)';
    }
  } else {
    const eligible = new Set<number>();
    // A run of three or more bare numerals with nothing between them is a list (or a contents page).
    const list = new Set<number>();
    for (let b = 0; b < bare.length; ) {
      let e = b;
      const style = (i: number): string | undefined => (items[i] as HeadItem & { c: HeadingLine }).c.number?.style;
      while (
        e + 1 < bare.length &&
        headPos.get(bare[e + 1]!) === headPos.get(bare[e]!)! + 1 &&
        gapParas.get(bare[e]!)!.length === 0 &&
        style(bare[e + 1]!) === style(bare[e]!)
      ) e++;
      if (e - b >= 2) for (let j = b; j <= e; j++) list.add(bare[j]!);
      b = e + 1;
    }
    for (const i of bare) {
      const paras = gapParas.get(i)!;
      if (list.has(i)) {
        reasons[i] = 'one of a run of numbered lines with no text between them (a list)';
        continue;
      }
      const verse = paras.filter((p) => judge.verse(p)).length;
      const prose = paras.filter((p) => !judge.verse(p) && judge.words(p) > CONTENTS_FILLER).length;
      if (verse > 0 && prose === 0) {
        reasons[i] = 'numbers a stanza of verse, not a chapter';
        continue;
      }
      eligible.add(i);
    }
    chapterHeads += acceptBareHeadings(items, accepted, eligible);
    for (const i of eligible) if (!accepted[i]) reasons[i] = 'a bare numeral out of sequence with the numbered headings around it';
  }
  for (const i of heads) {
    const c = (items[i] as HeadItem).c;
    if (c.kind !== 'extra' || contents.has(i)) continue;
    if (chapterHeads > 0) accepted[i] = 1;
    else reasons[i] = 'an unnumbered unit (prologue, epilogue, interlude) in a text with no numbered chapters';
  }
  return { accepted, reasons, partsAsChapters: chapterHeads === 0 };
}

/** Mark the bare-numeral headings that form a plausible sequence; returns how many were kept. */
function acceptBareHeadings(items: Item[], accepted: Uint8Array, eligible: Set<number>): number {
  let best: number[] = [];
  for (const style of ['roman', 'arabic'] as const) {
    const idx: number[] = [];
    const values: number[] = [];
    const segment: number[] = [];
    let seg = 0;
    items.forEach((it, i) => {
      if (it.t !== 'head') return;
      if (it.c.kind === 'part') seg++;
      if (it.c.kind === 'bare' && it.c.number?.style === style && eligible.has(i)) {
        idx.push(i);
        values.push(it.c.number.value);
        segment.push(seg);
      }
    });
    const keep = plausibleSequence(values, segment);
    const kept = idx.filter((_, k) => keep[k]);
    if (kept.length > best.length) best = kept;
  }
  if (best.length < 2) return 0;
  for (const i of best) accepted[i] = 1;
  return best.length;
}
