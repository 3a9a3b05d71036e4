/**
 * A heatmap: rows × columns of values, each cell shaded by its value on a
 * light-to-dark ramp of one hue and, when cells are big enough, labelled
 * with the value itself.
 *
 * Colour. Values fall into at most seven equal-interval classes with round
 * limits; each class takes a step of a ramp in the hue of the theme's first
 * series colour, its lightness L* stepped evenly (see ramp.ts). The order
 * is carried by lightness alone, so it survives colour-vision deficiencies
 * and greyscale printing; a legend gives the class limits. When no value is
 * negative, cells holding exactly zero are left blank, so absence stands
 * apart from small values; a missing value is blank and crossed by a thin
 * diagonal.
 *
 * Labels. Row labels sit left of the grid, truncated to a share of the
 * width. Column labels sit above it: level when every one fits its column,
 * otherwise slanted at 45°, and thinned to every k-th column when even the
 * slant has no room (every name stays in the cells' tooltips and the table).
 */

import { z } from 'zod';
import type { DataAt, MatrixData, NoteAt, Table, TextAt } from './types.ts';
import { serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, num, textEl, textWidth, titleEl, truncateText, wrapText } from './svg.ts';
import { columnKeys, decimalsFor, formatValue, joinWords, sentence } from './format.ts';
import { equalClasses } from './classes.ts';
import type { Classes } from './classes.ts';
import { lightnessRamp, pickSteps, textOn } from './ramp.ts';
import { seriate } from './seriate.ts';
import { thinEvenly } from './place.ts';
import { markerHeight, markerWidth, noteInline, notesBelow } from './furniture.ts';

export const matrixOptions = z.strictObject({
  order: z
    .enum(['given', 'total', 'cluster'])
    .default('given')
    .describe(
      'Order of the rows and columns: "given" keeps the order of the data; "total" puts the largest row (and column) totals first; "cluster" puts rows with similar profiles next to each other (average-linkage clustering, leaves flipped so that neighbours are alike), and columns likewise. When rows and columns are the same items (the same ids), one order serves both. Default: "given".',
    ),
  values: z
    .boolean()
    .default(true)
    .describe('Write each value in its cell, when every value fits its cell. Default: true.'),
  diagonal: z
    .boolean()
    .default(true)
    .describe(
      'Draw the cells where a row meets the column with the same id; false leaves them blank and out of the colour scale, the table and the alt text (for diagonals that hold self-counts). Default: true.',
    ),
  id: idOption,
});

export type MatrixOptions = z.output<typeof matrixOptions>;

/** Most colour classes; the ramp has this many steps. */
const MAX_CLASSES = 7;

interface Prepared {
  /** values[r][c] in data order; null when missing or a hidden diagonal cell. */
  values: (number | null)[][];
  rowOrder: number[];
  colOrder: number[];
  /** Rows and columns are the same items (same set of ids). */
  square: boolean;
  /** Square, and values[r][c] equals the value at the mirrored cell everywhere. */
  symmetric: boolean;
  classes: Classes;
  colours: string[];
  /** No value is negative and some are zero: zero cells are left blank. */
  zeroBlank: boolean;
  /** Some cell has no value (missing, or a hidden diagonal). */
  hasMissing: boolean;
  fmt: (v: number) => string;
}

function cleanValues(data: MatrixData, opts: MatrixOptions): (number | null)[][] {
  return data.rows.map((row, r) =>
    data.columns.map((col, c) => {
      if (!opts.diagonal && row.id === col.id) return null;
      const v = data.values[r]?.[c];
      return typeof v === 'number' && Number.isFinite(v) ? v : null;
    }),
  );
}

function sameItems(data: MatrixData): boolean {
  if (data.rows.length !== data.columns.length) return false;
  const cols = new Set(data.columns.map((c) => c.id));
  return cols.size === data.columns.length && data.rows.every((r) => cols.has(r.id));
}

const rowTotal = (vs: (number | null)[]) => vs.reduce<number>((s, v) => s + (v ?? 0), 0);

function ordered(n: number, score: (i: number) => number): number[] {
  return Array.from({ length: n }, (_, i) => i).sort((a, b) => score(b) - score(a) || a - b);
}

function orders(data: MatrixData, values: (number | null)[][], opts: MatrixOptions, square: boolean): [number[], number[]] {
  const nr = data.rows.length;
  const nc = data.columns.length;
  const identity = (n: number) => Array.from({ length: n }, (_, i) => i);
  if (opts.order === 'given') return [identity(nr), identity(nc)];
  const zero = values.map((vs) => vs.map((v) => v ?? 0));
  const cols = Array.from({ length: nc }, (_, c) => zero.map((vs) => vs[c]));
  if (square) {
    // One order for both: row r's item is column colOf[r].
    const colAt = new Map(data.columns.map((c, i) => [c.id, i]));
    const colOf = data.rows.map((r) => colAt.get(r.id)!);
    const rowOrder =
      opts.order === 'total'
        ? ordered(nr, (r) => rowTotal(zero[r]) + rowTotal(cols[colOf[r]]))
        : seriate(zero.map((vs, r) => [...data.rows.map((_, k) => vs[colOf[k]]), ...data.rows.map((_, k) => cols[colOf[r]][k])]));
    return [rowOrder, rowOrder.map((r) => colOf[r])];
  }
  if (opts.order === 'total') return [ordered(nr, (r) => rowTotal(zero[r])), ordered(nc, (c) => rowTotal(cols[c]))];
  return [seriate(zero), seriate(cols)];
}

function prepare(data: MatrixData, opts: MatrixOptions, theme: Theme): Prepared {
  const values = cleanValues(data, opts);
  const square = sameItems(data);
  const colAt = new Map(data.columns.map((c, i) => [c.id, i]));
  const rowAt = new Map(data.rows.map((r, i) => [r.id, i]));
  const symmetric =
    square &&
    values.every((vs, r) => vs.every((v, c) => v === values[rowAt.get(data.columns[c].id)!][colAt.get(data.rows[r].id)!]));
  const [rowOrder, colOrder] = orders(data, values, opts, square);
  const present = values.flat().filter((v): v is number => v !== null);
  const classes = equalClasses(present, MAX_CLASSES, data.format === 'count');
  const colours = pickSteps(lightnessRamp(theme.series[0].source), classes.limits.length - 1);
  const decimals = decimalsFor(present);
  const fmt = (v: number) => formatValue(v, data.format, decimals);
  const zeroBlank = present.every((v) => v >= 0) && present.some((v) => v === 0);
  const hasMissing = values.some((vs) => vs.some((v) => v === null));
  return { values, rowOrder, colOrder, square, symmetric, classes, colours, zeroBlank, hasMissing, fmt };
}

function emptyReason(data: MatrixData, prep: Prepared): string | null {
  if (data.rows.length === 0) return 'the dataset has no rows.';
  if (data.columns.length === 0) return 'the dataset has no columns.';
  if (prep.values.every((vs) => vs.every((v) => v === null || v === 0))) return 'every value is zero or missing.';
  return null;
}

/* ---------- table and alt text ---------- */

function matrixTable(data: MatrixData, prep: Prepared): Table {
  const keys = columnKeys(
    prep.colOrder.map((c) => data.columns[c].id),
    'row',
    'column',
  );
  return {
    columns: [
      { key: 'row', label: data.rowLabel, numeric: false },
      ...prep.colOrder.map((c, i) => ({ key: keys[i], label: data.columns[c].name, numeric: true })),
    ],
    rows: prep.rowOrder.map((r) => [data.rows[r].name, ...prep.colOrder.map((c) => prep.values[r][c])]),
  };
}

function matrixAlt(data: MatrixData, prep: Prepared): string {
  const cells: { r: number; c: number; v: number }[] = [];
  for (const r of prep.rowOrder) for (const c of prep.colOrder) if (prep.values[r][c] !== null) cells.push({ r, c, v: prep.values[r][c]! });
  const max = Math.max(...cells.map((x) => x.v));
  const min = Math.min(...cells.map((x) => x.v));
  let top = cells.filter((x) => x.v === max);
  if (prep.symmetric) {
    // Each pair once: keep the cell whose row comes first in the display order.
    const seen = new Set<string>();
    top = top.filter((x) => {
      const key = [data.rows[x.r].id, data.columns[x.c].id].sort().join('\u0000');
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    });
  }
  const where = (x: { r: number; c: number }) =>
    prep.symmetric
      ? data.rows[x.r].id === data.columns[x.c].id
        ? `for ${data.rows[x.r].name} with itself`
        : `between ${data.rows[x.r].name} and ${data.columns[x.c].name}`
      : `in row ${data.rows[x.r].name}, column ${data.columns[x.c].name}`;
  const shown = top.slice(0, 3).map(where);
  if (top.length > 3) shown.push(`${top.length - 3} more cells`);
  const each = top.length > 1 ? ' each' : '';
  const main =
    max === min
      ? `${data.valueLabel}: every cell holds ${prep.fmt(max)}`
      : `${data.valueLabel}: highest ${joinWords(shown)}, ${prep.fmt(max)}${each}; lowest ${prep.fmt(min)}`;
  return sentence(main);
}

/* ---------- notes ---------- */

/** A note on a row (looked up first) or a column, by id or name. */
interface Target {
  axis: 'row' | 'column';
  index: number;
}

/** A chapter, character or word is the row (or failing that the column) named after it. */
function inData(at: TextAt, data: MatrixData): DataAt | Miss {
  const items = [...data.rows, ...data.columns];
  if ('chapter' in at) {
    const row = items.find((r) => r.name === at.title);
    return row ? { category: row.name } : 'absent';
  }
  const r = findNamed(at, items, (x) => [x.id, x.name]);
  return r ? { category: r.name } : 'absent';
}

function place(note: NoteAt, data: MatrixData): Target | Miss {
  const d = isDataAt(note) ? note : inData(note, data);
  if (typeof d === 'string') return d;
  const at = d.category;
  if (at === undefined) return 'absent';
  const find = (items: { id: string; name: string }[]) => {
    const byId = items.findIndex((x) => x.id === at);
    return byId >= 0 ? byId : items.findIndex((x) => x.name === at);
  };
  const r = find(data.rows);
  if (r >= 0) return { axis: 'row', index: r };
  const c = find(data.columns);
  if (c >= 0) return { axis: 'column', index: c };
  return 'absent';
}

/* ---------- drawing ---------- */

const PAD = 12;
/** Widest cell, in viewBox units, per layout. */
const CELL_MAX = { wide: 64, narrow: 40 };
/** Tallest row: cells are square up to this size. */
const ROW_MAX = { wide: 48, narrow: 36 };
/** Least row height: row labels need their type size plus a little air. */
const MIN_ROW = 18;
/** Columns this far apart leave slanted labels (type size 14) about 17 units apart, enough not to touch. */
const SLANT_PITCH = 24;
/** Columns this far apart leave upright labels room between them. */
const UPRIGHT_PITCH = 17;

interface Ctx {
  data: MatrixData;
  prep: Prepared;
  opts: MatrixOptions;
  theme: Theme;
  targets: readonly Placed<Target>[];
  width: number;
  narrow: boolean;
}

function cellTitle(ctx: Ctx, r: number, c: number): string {
  const v = ctx.prep.values[r][c];
  return `${ctx.data.rows[r].name} \u00D7 ${ctx.data.columns[c].name}: ${v === null ? 'no value' : ctx.prep.fmt(v)}`;
}

interface Heads {
  cellW: number;
  /** Height the labels take above the grid. */
  height: number;
  /** The labels, their baseline (or foot) at `bottom`. */
  markup: (bottom: number) => string;
}

/**
 * Column labels and the cell width they allow. In order of preference:
 * level (up to two lines) when each fits its column; slanted at 45° when the
 * columns are at least SLANT_PITCH apart once narrowed so the last labels
 * stay inside the chart; upright (turned 90°) when at least UPRIGHT_PITCH
 * apart; otherwise upright and thinned to every k-th column.
 */
function columnHeads(ctx: Ctx, gridLeft: number, cellW: number): Heads {
  const { data, prep, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const cols = prep.colOrder;
  const lineGap = fs + 3;
  const cx = (w: number, j: number) => gridLeft + (j + 0.5) * w;
  const wrapped = cols.map((c) => wrapText(data.columns[c].name, cellW - 6, fs, 2));
  if (wrapped.every((w) => w.complete)) {
    const lines = Math.max(...wrapped.map((w) => w.lines.length));
    return {
      cellW,
      height: fs + (lines - 1) * lineGap,
      markup: (bottom) =>
        el(
          'g',
          { class: 'vt-column-labels', 'text-anchor': 'middle' },
          wrapped.map((w, j) =>
            w.lines.map((line, li) => textEl(line, { x: cx(cellW, j), y: bottom - (w.lines.length - 1 - li) * lineGap })).join(''),
          ),
        ),
    };
  }
  const labelMax = narrow ? 96 : 150;
  const names = cols.map((c) => truncateText(data.columns[c].name, labelMax, fs));
  const widths = names.map((n) => textWidth(n, fs));
  const dx = fs * 0.3;
  // A slanted label runs up and to the right of its column: narrow the cells so the last ones end inside the chart.
  const slantW = Math.min(cellW, ...cols.map((_, j) => (W - PAD - gridLeft - dx - widths[j] * Math.SQRT1_2) / (j + 0.5)));
  if (slantW >= SLANT_PITCH) {
    return {
      cellW: slantW,
      height: Math.max(...widths) * Math.SQRT1_2 + fs * 0.7,
      markup: (bottom) =>
        el(
          'g',
          { class: 'vt-column-labels' },
          names.map((n, j) => {
            const x = cx(slantW, j) + dx;
            return textEl(n, { x, y: bottom, transform: `rotate(-45 ${num(x)} ${num(bottom)})` });
          }),
        ),
    };
  }
  const keep = cellW >= UPRIGHT_PITCH ? cols.map((_, j) => j) : thinEvenly(cols.map((_, j) => ({ at: cx(cellW, j), width: fs })), UPRIGHT_PITCH - fs);
  return {
    cellW,
    height: Math.max(...keep.map((j) => widths[j])),
    markup: (bottom) =>
      el(
        'g',
        { class: 'vt-column-labels' },
        keep.map((j) => {
          const x = cx(cellW, j) + fs * 0.35;
          return textEl(names[j], { x, y: bottom, transform: `rotate(-90 ${num(x)} ${num(bottom)})` });
        }),
      ),
  };
}

function drawMatrix(ctx: Ctx): { body: string; height: number } {
  const { data, prep, opts, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const nr = prep.rowOrder.length;
  const nc = prep.colOrder.length;
  const parts: string[] = [];
  const headStyle = { style: serifStyle(theme, true), fill: theme.inkMuted, 'font-size': theme.sizes.axisTitle };

  // Row labels and the room kept right of the grid for notes on rows.
  const rowNotes = (r: number) => ctx.targets.filter((t) => t.axis === 'row' && t.index === r);
  const colNotes = ctx.targets.filter((t) => t.axis === 'column');
  const rowLabelMax = narrow ? 104 : 170;
  const rowLabels = data.rows.map((r) => truncateText(r.name, rowLabelMax, fs));
  const labelW = Math.max(...prep.rowOrder.map((r) => textWidth(rowLabels[r], fs)));
  const noteSpace = Math.max(0, ...prep.rowOrder.map((r) => rowNotes(r).reduce((s, t) => s + markerWidth(t.note.label, theme) + 4, 0)));
  const gridLeft = PAD + labelW + 8;
  const rightEdge = W - PAD - (noteSpace ? noteSpace + 6 : 0);

  // Cell width: as wide as fits, up to the layout's maximum; column labels may narrow it.
  const cellMax = narrow ? CELL_MAX.narrow : CELL_MAX.wide;
  const heads = columnHeads(ctx, gridLeft, Math.min(cellMax, (rightEdge - gridLeft) / nc));
  const cellW = heads.cellW;
  const cellH = Math.max(MIN_ROW, Math.min(cellW, narrow ? ROW_MAX.narrow : ROW_MAX.wide));
  const gridW = cellW * nc;
  const gridH = cellH * nr;
  const cx = (j: number) => gridLeft + (j + 0.5) * cellW;

  let y = PAD;
  const colTitleY = y + theme.sizes.axisTitle;
  parts.push(
    textEl(truncateText(data.columnLabel, W - PAD - gridLeft, theme.sizes.axisTitle, 'serif'), {
      ...headStyle,
      x: gridLeft,
      y: colTitleY,
      class: 'vt-axis-title',
    }),
  );
  y = colTitleY + 8;
  const gridTop = Math.ceil(y + heads.height + 6);
  parts.push(heads.markup(gridTop - 6));
  // The row axis title sits in the corner above the row labels.
  parts.push(
    textEl(truncateText(data.rowLabel, labelW + PAD - 4, theme.sizes.axisTitle, 'serif'), {
      ...headStyle,
      x: gridLeft - 8,
      y: gridTop - 6,
      'text-anchor': 'end',
      class: 'vt-axis-title',
    }),
  );

  // Cells: values written when every value fits its cell.
  const texts = prep.values.flat().filter((v): v is number => v !== null).map(prep.fmt);
  const showValues = opts.values && cellH >= small + 4 && Math.max(...texts.map((t) => textWidth(t, small))) <= cellW - 4;
  const rowsMarkup = prep.rowOrder.map((r, i) => {
    const y0 = gridTop + i * cellH;
    const cy = y0 + cellH / 2;
    const g: string[] = [textEl(rowLabels[r], { x: gridLeft - 8, y: cy + fs * 0.35, 'text-anchor': 'end' })];
    prep.colOrder.forEach((c, j) => {
      const v = prep.values[r][c];
      const x0 = gridLeft + j * cellW;
      if (v === null) {
        g.push(missingCell(x0, y0, cellW, cellH, theme, cellTitle(ctx, r, c)));
        return;
      }
      if (v === 0 && prep.zeroBlank) {
        g.push(el('rect', { x: x0, y: y0, width: cellW, height: cellH, fill: theme.paper, stroke: theme.rule, 'stroke-width': 1 }, titleEl(cellTitle(ctx, r, c))));
        return;
      }
      const fill = prep.colours[prep.classes.classOf(v)];
      g.push(el('rect', { x: x0, y: y0, width: cellW, height: cellH, fill, stroke: theme.paper, 'stroke-width': 1 }, titleEl(cellTitle(ctx, r, c))));
      if (showValues) g.push(textEl(prep.fmt(v), { x: x0 + cellW / 2, y: cy + small * 0.35, 'font-size': small, 'text-anchor': 'middle', fill: textOn(fill, theme) }));
    });
    let nx = gridLeft + gridW + 6;
    for (const t of rowNotes(r)) {
      const w = markerWidth(t.note.label, theme);
      g.push(noteInline(t.note, nx + w / 2, cy, theme));
      nx += w + 4;
    }
    return el('g', { class: 'vt-matrix-row', 'data-row': data.rows[r].id }, g);
  });
  parts.push(el('g', { class: 'vt-cells' }, rowsMarkup));
  parts.push(el('rect', { class: 'vt-frame', x: gridLeft, y: gridTop, width: gridW, height: gridH, fill: 'none', stroke: theme.axis, 'stroke-width': 1 }));
  y = gridTop + gridH;

  // Notes on columns: a lane under the grid, each marker joined to the foot of its column.
  if (colNotes.length) {
    const mh = markerHeight(theme);
    const laneY = y + 14 + mh / 2;
    const anchors = colNotes.map((t) => ({ note: t.note, x: cx(prep.colOrder.indexOf(t.index)), y }));
    parts.push(notesBelow(anchors, laneY, PAD, W - PAD, theme));
    y = laneY + mh / 2;
  }

  // Legend: a blank key for zero, the classes light to dark with their limits, a key for missing values.
  y += 14;
  const legendTitleY = y + theme.sizes.axisTitle;
  parts.push(textEl(truncateText(data.valueLabel, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), { ...headStyle, x: PAD, y: legendTitleY, class: 'vt-axis-title' }));
  const legend = classLegend(ctx, legendTitleY + 8);
  parts.push(legend.markup);
  return { body: parts.join(''), height: Math.ceil(legend.bottom + PAD) };
}

const SWATCH_H = 14;

/** A cell (or key swatch) with no value: blank, outlined, crossed by one thin diagonal. */
function missingCell(x: number, y: number, w: number, h: number, theme: Theme, title?: string): string {
  return el('g', { class: 'vt-missing' }, [
    title ? titleEl(title) : '',
    el('rect', { x: x + 0.5, y: y + 0.5, width: w - 1, height: h - 1, fill: theme.paper, stroke: theme.rule, 'stroke-width': 1 }),
    el('path', { d: `M${num(x + 1)},${num(y + h - 1)}L${num(x + w - 1)},${num(y + 1)}`, stroke: theme.axis, 'stroke-width': 1 }),
  ]);
}

function classLegend(ctx: Ctx, top: number): { markup: string; bottom: number } {
  const { prep, theme, width: W, narrow } = ctx;
  const small = theme.sizes.small;
  const out: string[] = [];
  let x = PAD;
  const labelY = top + SWATCH_H + 4 + small;
  if (prep.zeroBlank) {
    out.push(el('rect', { x: x + 0.5, y: top + 0.5, width: 27, height: SWATCH_H - 1, fill: theme.paper, stroke: theme.axis, 'stroke-width': 1 }, titleEl(`${prep.fmt(0)}: blank`)));
    out.push(textEl(prep.fmt(0), { x: x + 14, y: labelY, 'font-size': small, 'text-anchor': 'middle', fill: theme.inkMuted }));
    x += 28 + 12;
  } else x += 8;
  const k = prep.colours.length;
  const limits = prep.classes.limits;
  const texts = limits.map(prep.fmt);
  const swatchW = Math.min(narrow ? 44 : 56, (W - PAD - x - 8) / k);
  const lx = (i: number) => x + i * swatchW;
  prep.colours.forEach((colour, i) => {
    const what = i === k - 1 ? `${texts[i]} to ${texts[i + 1]}` : `${texts[i]} to under ${texts[i + 1]}`;
    out.push(el('rect', { x: lx(i), y: top, width: swatchW, height: SWATCH_H, fill: colour, stroke: theme.axis, 'stroke-width': 0.5 }, titleEl(what)));
  });
  // Limits, thinned evenly; the top one always shown. With zero blank, the ramp's own "0" is left to the blank key.
  const spans = limits.map((_, i) => ({ at: lx(i), width: textWidth(texts[i], small) }));
  const last = limits.length - 1;
  const keep = thinEvenly(spans, 6).filter((i) => i === last || Math.abs(spans[last].at - spans[i].at) >= (spans[i].width + spans[last].width) / 2 + 6);
  if (!keep.includes(last)) keep.push(last);
  for (const i of keep) {
    if (i === 0 && prep.zeroBlank && limits[0] === 0) continue;
    out.push(el('line', { x1: lx(i), x2: lx(i), y1: top + SWATCH_H, y2: top + SWATCH_H + 4, stroke: theme.axis, 'stroke-width': 1 }));
    out.push(textEl(texts[i], { x: lx(i), y: labelY, 'font-size': small, 'text-anchor': 'middle', fill: theme.inkMuted }));
  }
  let bottom = labelY;
  if (prep.hasMissing) {
    const label = 'no value';
    let mx = lx(k) + textWidth(texts[last], small) / 2 + 18;
    let my = top;
    if (mx + SWATCH_H + 6 + textWidth(label, small) > W - PAD) {
      mx = PAD;
      my = labelY + 10;
      bottom = my + SWATCH_H;
    }
    out.push(missingCell(mx, my, SWATCH_H + 6, SWATCH_H, theme));
    out.push(textEl(label, { x: mx + SWATCH_H + 12, y: my + SWATCH_H - 2, 'font-size': small, fill: theme.inkMuted }));
  }
  return { markup: el('g', { class: 'vt-legend' }, out), bottom };
}

export const matrix = defineChart({
  name: 'matrix',
  options: matrixOptions,
  prepare: (data: MatrixData, opts, theme) => prepare(data, opts, theme),
  empty: ({ data, prep }) => emptyReason(data, prep),
  table: ({ data, prep }) => matrixTable(data, prep),
  place: (at, { data }) => place(at, data),
  alt: ({ data, prep }) => matrixAlt(data, prep),
  draw: ({ data, prep, opts, theme }, targets, { width, narrow }) => drawMatrix({ data, prep, opts, theme, targets, width, narrow }),
});
