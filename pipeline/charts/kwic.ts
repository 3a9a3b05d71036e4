/**
 * Keyword in context: concordance lines with the keyword set in bold serif on
 * a centre axis, the words before it right-aligned against it and the words
 * after it left-aligned, both cut with an ellipsis at the panel edge. A small
 * column on the left says where each line comes from; every other row is
 * lightly shaded to lead the eye along the line.
 */

import { z } from 'zod';
import type { KwicData, NoteAt, Table } from './types.ts';
import { serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, holdsWord, isDataAt, idOption } from './chart.ts';
import { el, textEl, textWidth, titleEl, truncateText, wrapText } from './svg.ts';
import { formatNumber, joinWords, sentence } from './format.ts';
import { boldWidth, clipEnd, clipStart, collapseSpace } from './clip.ts';
import { mixColour } from './colour.ts';
import { markerWidth, noteInline } from './furniture.ts';

export const kwicOptions = z.strictObject({
  limit: z
    .number()
    .int()
    .min(1)
    .max(500)
    .default(25)
    .describe('Most lines drawn, after sorting; the table keeps them all. Default: 25.'),
  sort: z
    .enum(['text', 'right', 'left'])
    .default('text')
    .describe(
      'Order of the lines: "text" keeps the order of the data (reading order), "right" sorts by the words after the keyword (first word, then second…), "left" by the words before it, read outwards from the keyword. Default: "text".',
    ),
  id: idOption,
});

export type KwicOptions = z.output<typeof kwicOptions>;

interface Line {
  /** Index in the data. */
  index: number;
  left: string;
  keyword: string;
  right: string;
  where: string;
}

/** A word: letters or digits, with inner apostrophes or hyphens ("don’t", "eel-trap"). */
const WORD = /[\p{L}\p{N}]+(?:['’\-][\p{L}\p{N}]+)*/gu;

function wordsOf(s: string): string[] {
  return Array.from(s.toLowerCase().matchAll(WORD), (m) => m[0]);
}

/** Compares word lists word by word; plain code-unit order, so every machine sorts alike. */
function compareWords(a: readonly string[], b: readonly string[]): number {
  for (let i = 0; i < Math.min(a.length, b.length); i++) {
    if (a[i] !== b[i]) return a[i] < b[i] ? -1 : 1;
  }
  return a.length - b.length;
}

function prepare(data: KwicData, opts: KwicOptions): { lines: Line[]; order: Line[]; shown: Line[] } {
  const lines = data.lines.map((l, index) => ({
    index,
    left: collapseSpace(l.left ?? ''),
    keyword: collapseSpace(l.keyword ?? ''),
    right: collapseSpace(l.right ?? ''),
    where: collapseSpace(l.where ?? ''),
  }));
  const order = [...lines];
  if (opts.sort !== 'text') {
    const key = (l: Line) => (opts.sort === 'right' ? wordsOf(l.right) : wordsOf(l.left).reverse());
    const keys = new Map(lines.map((l) => [l.index, key(l)]));
    order.sort((a, b) => compareWords(keys.get(a.index)!, keys.get(b.index)!) || a.index - b.index);
  }
  return { lines, order, shown: order.slice(0, opts.limit) };
}

/* ---------- table and alt text ---------- */

function kwicTable(prepared: Line[]): Table {
  return {
    columns: [
      { key: 'line', label: 'Line', numeric: true },
      { key: 'where', label: 'Where', numeric: false },
      { key: 'left', label: 'Before', numeric: false },
      { key: 'keyword', label: 'Keyword', numeric: false },
      { key: 'right', label: 'After', numeric: false },
    ],
    rows: prepared.map((l) => [l.index + 1, l.where, l.left, l.keyword, l.right]),
  };
}

/** The commonest first word after the keyword, with ties, and how many lines it opens. */
function commonestRight(lines: readonly Line[]): { words: string[]; count: number } {
  const counts = new Map<string, number>();
  for (const l of lines) {
    const w = wordsOf(l.right)[0];
    if (w !== undefined) counts.set(w, (counts.get(w) ?? 0) + 1);
  }
  let best = 0;
  for (const c of counts.values()) best = Math.max(best, c);
  const words = [...counts.entries()].filter(([, c]) => c === best).map(([w]) => w);
  return { words: best > 0 ? words : [], count: best };
}

function quoted(s: string): string {
  return `\u201C${s}\u201D`;
}

function kwicAlt(data: KwicData, lines: Line[], shown: number): string {
  const n = lines.length;
  const what = `Concordance of ${quoted(collapseSpace(data.keyword))}: ${formatNumber(n, 0)} ${n === 1 ? 'line' : 'lines'}`;
  const { words, count } = commonestRight(lines);
  let next: string;
  if (words.length === 0) next = 'no word follows the keyword in any line';
  else if (count === 1 && n > 1) next = 'no word follows the keyword more than once';
  else {
    const listed = words.length > 3 ? `${joinWords(words.slice(0, 3).map(quoted))} and ${words.length - 3} more` : joinWords(words.map(quoted));
    const each = words.length > 1 ? ' each' : '';
    next = `the commonest word after it is ${listed} (${formatNumber(count, 0)} of ${formatNumber(n, 0)} lines${each})`;
    if (words.length > 1) next = next.replace('the commonest word after it is', 'the commonest words after it are');
  }
  const parts = [sentence(`${what}; ${next}`)];
  if (shown < n) parts.push(`The chart shows ${formatNumber(shown, 0)} of them; the table lists all.`);
  return parts.join(' ');
}

/* ---------- notes ---------- */

/** A note points at a line by its index in the data (at.x), or a word at the first line that holds it; it is drawn when the line is. */
interface Target {
  line: number;
}

function place(at: NoteAt, lines: readonly Line[], shown: readonly Line[]): Target | Miss {
  const x = isDataAt(at) ? at.x : 'word' in at ? lines.findIndex((l) => holdsWord(`${l.left} ${l.keyword} ${l.right}`, at.word)) : undefined;
  if (x === undefined || !Number.isInteger(x) || x < 0 || x >= lines.length) return 'absent';
  return shown.some((l) => l.index === x) ? { line: x } : 'beside';
}

/* ---------- drawing ---------- */

const PAD = 12;
/** Space between a context and the keyword column. */
const GAP = 7;

interface Ctx {
  data: KwicData;
  lines: Line[];
  shown: Line[];
  theme: Theme;
  notes: readonly Placed<Target>[];
  width: number;
  narrow: boolean;
}

function drawKwic(ctx: Ctx): { body: string; height: number } {
  const { shown, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const serif = serifStyle(theme);
  const parts: string[] = [];

  // Columns: notes | where | before | keyword | after.
  const noteW = ctx.notes.length ? Math.max(...ctx.notes.map((n) => markerWidth(n.note.label, theme))) + 6 : 0;
  const whereMax = narrow ? 58 : 112;
  const hasWhere = shown.some((l) => l.where !== '');
  const wheres = shown.map((l) => truncateText(l.where, whereMax, small));
  const whereW = hasWhere ? Math.min(whereMax, Math.max(textWidth('Where', theme.sizes.axisTitle, 'serif'), ...wheres.map((w) => textWidth(w, small)))) : 0;
  const whereX = PAD + noteW;
  const textLeft = whereX + (hasWhere ? whereW + (narrow ? 8 : 12) : 0);
  const textRight = W - PAD;
  const kwMax = (textRight - textLeft) * (narrow ? 0.3 : 0.26);
  const keywords = shown.map((l) => (boldWidth(l.keyword, fs, 'serif') <= kwMax ? l.keyword : truncateText(l.keyword, kwMax / 1.12, fs, 'serif')));
  const kwW = Math.min(kwMax, Math.max(...keywords.map((k) => boldWidth(k, fs, 'serif'))));
  const side = (textRight - textLeft - kwW - 2 * GAP) / 2;
  const axis = textLeft + side + GAP + kwW / 2;
  const leftEnd = axis - kwW / 2 - GAP;
  const rightStart = axis + kwW / 2 + GAP;

  // Header: the columns named like the heads of a table.
  let y = PAD;
  const headY = y + theme.sizes.axisTitle;
  const head = { style: serifStyle(theme, true), fill: theme.inkMuted, 'font-size': theme.sizes.axisTitle };
  parts.push(
    el('g', { class: 'vt-axis-titles' }, [
      hasWhere ? textEl('Where', { ...head, x: whereX, y: headY }) : '',
      textEl('Before', { ...head, x: leftEnd, y: headY, 'text-anchor': 'end' }),
      textEl('After', { ...head, x: rightStart, y: headY }),
    ]),
  );
  y = headY + 8;

  const rowH = narrow ? 24 : 26;
  const shade = mixColour(theme.paper, theme.rule, 0.55);
  const rows = shown.map((l, r) => {
    const top = y + r * rowH;
    const base = top + rowH / 2 + fs * 0.35;
    const g: string[] = [titleEl(`${l.where ? `${l.where}: ` : ''}${[l.left, l.keyword, l.right].filter(Boolean).join(' ')}`)];
    if (r % 2 === 1) g.push(el('rect', { class: 'vt-shade', x: PAD, y: top, width: W - 2 * PAD, height: rowH, fill: shade }));
    if (hasWhere) g.push(textEl(wheres[r], { x: whereX, y: top + rowH / 2 + small * 0.35, 'font-size': small, fill: theme.inkMuted }));
    const style = serif;
    if (l.left) g.push(textEl(clipStart(l.left, leftEnd - textLeft, fs, 'serif'), { x: leftEnd, y: base, 'text-anchor': 'end', style }));
    g.push(textEl(keywords[r], { x: axis, y: base, 'text-anchor': 'middle', 'font-weight': 700, style }));
    if (l.right) g.push(textEl(clipEnd(l.right, textRight - rightStart, fs, 'serif'), { x: rightStart, y: base, style }));
    const note = ctx.notes.find((n) => n.line === l.index)?.note;
    if (note) g.push(noteInline(note, PAD + markerWidth(note.label, theme) / 2, top + rowH / 2, theme));
    return el('g', { class: 'vt-kwic-line', 'data-line': l.index }, g);
  });
  parts.push(el('g', { class: 'vt-kwic-lines' }, rows));
  y += rowH * shown.length;

  if (shown.length < ctx.lines.length) {
    const said = `${formatNumber(shown.length, 0)} of ${formatNumber(ctx.lines.length, 0)} lines shown; the table lists all.`;
    y += 4;
    parts.push(
      el(
        'g',
        { class: 'vt-more', 'font-size': small, fill: theme.inkMuted },
        wrapText(said, W - 2 * PAD, small, 2).lines.map((line) => textEl(line, { x: PAD, y: (y += small + 4) })),
      ),
    );
  }
  return { body: parts.join(''), height: Math.ceil(y + PAD) };
}

export const kwic = defineChart({
  name: 'kwic',
  options: kwicOptions,
  prepare: (data: KwicData, opts) => prepare(data, opts),
  empty: ({ prep }) => (prep.lines.length === 0 ? 'the dataset has no concordance lines.' : null),
  table: ({ prep }) => kwicTable(prep.lines),
  place: (at, { prep }) => place(at, prep.lines, prep.shown),
  // One marker per line: the first note on it.
  slot: (t) => t.line,
  alt: ({ data, prep }) => kwicAlt(data, prep.lines, prep.shown.length),
  draw: ({ data, prep, theme }, notes, { width, narrow }) => drawKwic({ data, lines: prep.lines, shown: prep.shown, theme, notes, width, narrow }),
});
