/**
 * The block structure of a normalised text: blank-line separated blocks become
 * paragraphs or headings. A heading is the first line of a block; what follows
 * it in the same block is split off (a title line, or the body). Bare numerals
 * ("III.", "VI. A Title") are kept as headings only when they form a plausible
 * sequence and the text has no keyword chapter headings.
 */

import { isSpace } from './chars.ts';
import { displayCustomTitle, displayTitle, parseHeadingLine, type HeadingLine } from './headings.ts';
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
  /** The heading line, trimmed of surrounding white space. */
  heading: string;
  /** Display title. */
  title: string;
  /** Offset of the heading line's first character. */
  start: number;
  /** Offset just past the heading (and its title line, if one was taken). */
  end: number;
}

export type Unit = ParagraphUnit | HeadingUnit;

export interface StructureOptions {
  /** Curator's heading pattern (replaces automatic chapter detection). Default: none. */
  chapterPattern?: RegExp;
}

interface Lines {
  count: number;
  start: Uint32Array;
  end: Uint32Array;
  blank: Uint8Array;
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
}

export function findStructure(text: string, options: StructureOptions = {}): Structure {
  const lines = splitLines(text);
  const custom = options.chapterPattern;
  const lineText = (i: number): string => text.slice(lines.start[i], lines.end[i]).trim();

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
  const accepted = new Uint8Array(items.length);
  let numbered = 0;
  items.forEach((it, i) => {
    if (it.t !== 'head') return;
    if (it.c.kind === 'custom' || it.c.kind === 'chapter' || it.c.kind === 'part') accepted[i] = 1;
    if (it.c.kind === 'custom' || it.c.kind === 'chapter') numbered++;
  });
  let chapterHeads = numbered;
  if (numbered === 0 && !custom) chapterHeads += acceptBareHeadings(items, accepted);
  if (chapterHeads > 0) {
    items.forEach((it, i) => {
      if (it.t === 'head' && it.c.kind === 'extra') accepted[i] = 1;
    });
  }
  items.forEach((it) => {
    if (it.t === 'para' && it.titleOf >= 0 && accepted[it.titleOf]) (items[it.titleOf] as HeadItem).titleBlockLine = it.f;
  });
  const partsAsChapters = chapterHeads === 0;

  // Pass 3: units in text order.
  const units: Unit[] = [];
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
      units.push(paraUnit(it.f, it.l));
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
      heading,
      title,
      start: hp.start,
      end: paraUnit(lastLine, lastLine).end,
    });
  });
  const patternMatches = items.filter((it) => it.t === 'head' && it.c.kind === 'custom').length;
  return { units, patternMatches };
}

/** Mark the bare-numeral headings that form a plausible sequence; returns how many were kept. */
function acceptBareHeadings(items: Item[], accepted: Uint8Array): number {
  let best: number[] = [];
  for (const style of ['roman', 'arabic'] as const) {
    const idx: number[] = [];
    const values: number[] = [];
    const segment: number[] = [];
    let seg = 0;
    items.forEach((it, i) => {
      if (it.t !== 'head') return;
      if (it.c.kind === 'part') seg++;
      if (it.c.kind === 'bare' && it.c.number?.style === style) {
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
