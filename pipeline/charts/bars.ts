/**
 * Bars: one bar per category per series, horizontal (default) or vertical,
 * grouped or stacked when there are several series.
 */

import { z } from 'zod';
import type { BarsData, DataAt, NoteAt, Table, TextAt } from './types.ts';
import { seriesColour, serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, num, textEl, textWidth, titleEl, truncateText, wrapText } from './svg.ts';
import { columnKeys, decimalsFor, formatPercent, formatValue, joinWords, sentence } from './format.ts';
import { tickFormatter, valueAxis } from './scale.ts';
import { baseline, grid, valueTicks } from './axes.ts';
import type { ValueAxis } from './scale.ts';
import { thinEvenly } from './place.ts';
import { legend, markerHeight, markerWidth, noteInline, notesInLane } from './furniture.ts';
import type { NoteAnchor } from './furniture.ts';

export const barsOptions = z.strictObject({
  orientation: z
    .enum(['horizontal', 'vertical'])
    .default('horizontal')
    .describe(
      'Direction of the bars: "horizontal" lists categories down the left, "vertical" along the bottom (drawn horizontally after all when the layout leaves under 22 units per category). Default: "horizontal".',
    ),
  layout: z
    .enum(['grouped', 'stacked'])
    .default('grouped')
    .describe('With several series: "grouped" sets their bars side by side, "stacked" end to end. Default: "grouped".'),
  sort: z
    .enum(['none', 'descending', 'ascending'])
    .default('none')
    .describe('Order of the categories by their total over all series; "none" keeps the order of the data. Default: "none".'),
  labels: z
    .boolean()
    .default(true)
    .describe("Write each bar's value at its end (a stack's total, when stacked). Default: true."),
  limit: z
    .number()
    .int()
    .min(1)
    .max(500)
    .default(30)
    .describe('Most categories drawn, after sorting; the table keeps them all. Default: 30.'),
  id: idOption,
});

export type BarsOptions = z.output<typeof barsOptions>;

/** The data made safe to draw: missing or non-finite values become null, categories ordered. */
interface Prepared {
  /** values[s][c]: series s, category c (data order). */
  values: (number | null)[][];
  totals: number[];
  /** Category indices in display order (all of them). */
  order: number[];
  /** The first `limit` of `order`: the categories drawn. */
  shown: number[];
  /** A value as written in this chart (decimals kept equal across the chart). */
  fmt: (v: number) => string;
}

function prepare(data: BarsData, opts: BarsOptions): Prepared {
  const values = data.series.map((s) =>
    data.categories.map((_, c) => {
      const v = s.values[c];
      return typeof v === 'number' && Number.isFinite(v) ? v : null;
    }),
  );
  const totals = data.categories.map((_, c) => values.reduce((sum, vs) => sum + (vs[c] ?? 0), 0));
  const order = data.categories.map((_, c) => c);
  if (opts.sort === 'descending') order.sort((a, b) => totals[b] - totals[a] || a - b);
  if (opts.sort === 'ascending') order.sort((a, b) => totals[a] - totals[b] || a - b);
  const decimals = decimalsFor([...values.flat().filter((v): v is number => v !== null), ...totals]);
  const fmt = (v: number) => formatValue(v, data.format, decimals);
  return { values, totals, order, shown: order.slice(0, opts.limit), fmt };
}

function emptyReason(data: BarsData, prep: Prepared): string | null {
  if (data.categories.length === 0) return 'the dataset has no categories.';
  if (data.series.length === 0) return 'the dataset has no series.';
  if (prep.values.every((vs) => vs.every((v) => v === null || v === 0))) return 'every value is zero or missing.';
  return null;
}

/* ---------- table and alt text ---------- */

function barsTable(data: BarsData, prep: Prepared): Table {
  const keys = columnKeys(
    data.series.map((s) => s.id),
    'category',
    'series',
  );
  return {
    columns: [
      { key: 'category', label: data.categoryLabel, numeric: false },
      ...data.series.map((s, i) => ({ key: keys[i], label: data.series.length > 1 ? s.name : data.valueLabel, numeric: true })),
    ],
    rows: prep.order.map((c) => [data.categories[c], ...prep.values.map((vs) => vs[c])]),
  };
}

interface Item {
  name: string;
  value: number;
}

/** "Ada is highest, 142 (31% of the total); Bram lowest, 12." for a list of named values. */
function extremesSentence(items: Item[], data: BarsData, fmt: (v: number) => string, totalNote: boolean): string {
  const max = Math.max(...items.map((i) => i.value));
  const min = Math.min(...items.map((i) => i.value));
  const top = items.filter((i) => i.value === max).map((i) => i.name);
  const bottom = items.filter((i) => i.value === min).map((i) => i.name);
  const sum = items.reduce((s, i) => s + i.value, 0);
  const share = (v: number) =>
    totalNote && data.format === 'count' && min >= 0 && sum > 0 ? ` (${formatPercent(v / sum)} of the total)` : '';
  const lead = `${data.valueLabel}: `;
  if (items.length === 1) return sentence(`${lead}${items[0].name}, ${fmt(items[0].value)}`);
  if (max === min) return sentence(`${lead}all ${items.length} are equal, ${fmt(max)} each`);
  const name = (names: string[]) => (names.length > 3 ? `${joinWords(names.slice(0, 3))} and ${names.length - 3} more` : joinWords(names));
  const each = (names: string[]) => (names.length > 1 ? ' each' : '');
  const verb = top.length > 1 ? 'are' : 'is';
  return sentence(
    `${lead}${name(top)} ${verb} highest, ${fmt(max)}${each(top)}${share(max)}; ${name(bottom)} lowest, ${fmt(min)}${each(bottom)}`,
  );
}

function barsAlt(data: BarsData, prep: Prepared, opts: BarsOptions): string {
  const multi = data.series.length > 1;
  let main: string;
  if (!multi || data.format === 'count') {
    const items = data.categories.map((name, c) => ({ name, value: prep.totals[c] }));
    main = extremesSentence(items, data, prep.fmt, true);
    if (multi) {
      const together = data.series.length === 2 ? 'both series together' : `all ${data.series.length} series together`;
      main = `${data.valueLabel}, ${together}: ${main.slice(data.valueLabel.length + 2)}`;
    }
  } else {
    const items: Item[] = [];
    data.series.forEach((s, si) =>
      data.categories.forEach((cat, c) => {
        const v = prep.values[si][c];
        if (v !== null) items.push({ name: `${cat} (${s.name})`, value: v });
      }),
    );
    main = extremesSentence(items, data, prep.fmt, false);
  }
  const parts = [main];
  if (prep.shown.length < data.categories.length) {
    const which = opts.sort === 'descending' ? 'highest' : opts.sort === 'ascending' ? 'lowest' : 'first';
    parts.push(`The chart shows the ${which} ${prep.shown.length} of ${data.categories.length} categories; the table lists all.`);
  }
  return parts.join(' ');
}

/* ---------- notes ---------- */

/** A note goes on a category, by its name: beside the chart when the category is not among those drawn. */
interface Target {
  category: string;
}

/** A chapter is its bar when the bars are the chapters; a character or word, the bar named after it. */
function inData(at: TextAt, data: BarsData): DataAt | Miss {
  if ('chapter' in at) return data.categories.includes(at.title) ? { category: at.title } : 'absent';
  const c = findNamed(at, data.categories, (x) => [x, x.toLowerCase()]);
  return c !== undefined ? { category: c } : 'absent';
}

function place(note: NoteAt, data: BarsData, prep: Prepared): Target | Miss {
  const at = isDataAt(note) ? note : inData(note, data);
  if (typeof at === 'string') return at;
  const c = at.category;
  if (c === undefined || !data.categories.includes(c)) return 'absent';
  return prep.shown.some((i) => data.categories[i] === c) ? { category: c } : 'beside';
}

/* ---------- drawing ---------- */

interface Ctx {
  data: BarsData;
  prep: Prepared;
  opts: BarsOptions;
  theme: Theme;
  notes: readonly Placed<Target>[];
  width: number;
  narrow: boolean;
}

const PAD = 12;
/** Narrowest room per category (viewBox units) for vertical bars; below it the chart is drawn horizontally. */
const MIN_BAND = 22;

function groupTitle(ctx: Ctx, c: number): string {
  const { data, prep } = ctx;
  const fmt = (v: number | null) => (v === null ? 'no value' : prep.fmt(v));
  if (data.series.length === 1) return `${data.categories[c]}: ${fmt(prep.values[0][c])}`;
  const parts = data.series.map((s, si) => `${s.name}: ${fmt(prep.values[si][c])}`);
  const total = ctx.opts.layout === 'stacked' ? ` (total ${fmt(prep.totals[c])})` : '';
  return `${data.categories[c]} \u2014 ${parts.join('; ')}${total}`;
}

/** The bars of one category along the value axis: [series index, start value, end value]. */
function segments(ctx: Ctx, c: number): { s: number; from: number; to: number }[] {
  const stacked = ctx.opts.layout === 'stacked' && ctx.data.series.length > 1;
  const out: { s: number; from: number; to: number }[] = [];
  let pos = 0;
  let neg = 0;
  ctx.prep.values.forEach((vs, s) => {
    const v = vs[c];
    if (v === null) return;
    if (!stacked) out.push({ s, from: 0, to: v });
    else if (v >= 0) out.push({ s, from: pos, to: (pos += v) });
    else out.push({ s, from: neg, to: (neg += v) });
  });
  return out;
}

/** The numbers written at bar ends: [value, series index or -1 for a stack total]. */
function valueLabels(ctx: Ctx, c: number): { v: number; s: number }[] {
  const stacked = ctx.opts.layout === 'stacked' && ctx.data.series.length > 1;
  if (!ctx.opts.labels) return [];
  if (stacked) return [{ v: ctx.prep.totals[c], s: -1 }];
  return ctx.prep.values.map((vs, s) => ({ v: vs[c], s })).filter((x): x is { v: number; s: number } => x.v !== null);
}

function axisValues(ctx: Ctx): number[] {
  const out: number[] = [];
  for (const c of ctx.prep.shown) for (const seg of segments(ctx, c)) out.push(seg.from, seg.to);
  return out;
}

function notesFor(ctx: Ctx, c: number): Placed<Target>[] {
  return ctx.notes.filter((n) => n.category === ctx.data.categories[c]);
}

function legendBlock(ctx: Ctx, y: number) {
  if (ctx.data.series.length < 2) return { markup: '', height: 0 };
  const items = ctx.data.series.map((s, i) => ({ name: s.name, colour: seriesColour(ctx.theme, i).mark }));
  return legend(items, PAD, y, ctx.width - 2 * PAD, ctx.theme);
}

function tickLabels(axis: ValueAxis, ctx: Ctx, horizontalAxis: boolean, base: number): string {
  const { theme } = ctx;
  const tickText = tickFormatter(axis.ticks, ctx.data.format);
  const texts = axis.ticks.map(tickText);
  const keep = horizontalAxis
    ? thinEvenly(
        axis.ticks.map((t, i) => ({ at: axis.at(t), width: textWidth(texts[i], theme.sizes.small) })),
        8,
      )
    : axis.ticks.map((_, i) => i);
  if (!horizontalAxis) return valueTicks(texts, axis.ticks.map((t) => axis.at(t)), base, theme);
  return el(
    'g',
    { class: 'vt-ticks', fill: theme.inkMuted, 'font-size': theme.sizes.small, 'text-anchor': 'middle' },
    keep.map((i) => textEl(texts[i], { x: axis.at(axis.ticks[i]), y: base })),
  );
}

function drawHorizontal(ctx: Ctx): { body: string; height: number } {
  const { data, prep, opts, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const k = data.series.length;
  const stacked = opts.layout === 'stacked' && k > 1;
  const parts: string[] = [];
  let y = PAD;

  const lg = legendBlock(ctx, y);
  parts.push(lg.markup);
  if (lg.height) y += lg.height + 6;

  // Widths: value labels, notes, category labels.
  const valueTexts = prep.shown.flatMap((c) => valueLabels(ctx, c).map((l) => prep.fmt(l.v)));
  const valueW = valueTexts.length ? Math.max(...valueTexts.map((t) => textWidth(t, small))) + 6 : 0;
  const hasNeg = axisValues(ctx).some((v) => v < 0);
  const noteSpace = Math.max(0, ...prep.shown.map((c) => notesFor(ctx, c).reduce((s, n) => s + markerWidth(n.note.label, theme) + 4, 0)));
  const reserved = valueW + (noteSpace ? noteSpace + 6 : 0) + (hasNeg ? valueW + 6 : 0);
  const labelMax = Math.max(48, Math.min(W * (narrow ? 0.36 : 0.3), W - 2 * PAD - reserved - W * 0.4 - 10));
  const labels = prep.shown.map((c) => truncateText(data.categories[c], labelMax, fs));
  const labelW = Math.min(labelMax, Math.max(...labels.map((l) => textWidth(l, fs))));
  const labelRight = PAD + labelW;
  const plotLeft = labelRight + 10 + (hasNeg ? valueW + 6 : 0);
  const plotRight = W - PAD - valueW - (noteSpace ? noteSpace + 6 : 0);

  // Header: the two axis titles, as the heads of a table.
  const headY = y + theme.sizes.axisTitle;
  const headStyle = { style: serifStyle(theme, true), fill: theme.inkMuted, 'font-size': theme.sizes.axisTitle };
  parts.push(
    el('g', { class: 'vt-axis-titles' }, [
      textEl(truncateText(data.categoryLabel, labelW + PAD - 4, theme.sizes.axisTitle, 'serif'), {
        ...headStyle,
        x: labelRight,
        y: headY,
        'text-anchor': 'end',
      }),
      textEl(truncateText(data.valueLabel, W - PAD - plotLeft, theme.sizes.axisTitle, 'serif'), { ...headStyle, x: plotLeft, y: headY }),
    ]),
  );
  y = headY + 10;

  // Rows.
  const t = k > 1 && !stacked ? 15 : 20;
  const inner = k > 1 && !stacked ? k * t + (k - 1) * 2 : t;
  const rowH = inner + (k > 1 && !stacked ? 14 : 12);
  const plotTop = y;
  const plotBottom = plotTop + rowH * prep.shown.length;
  const axis = valueAxis(axisValues(ctx), [plotLeft, plotRight], data.format, narrow ? 3 : 5, true, false);

  parts.push(grid(axis.ticks.filter((v) => v !== 0).map((v) => ({ x1: axis.at(v), x2: axis.at(v), y1: plotTop, y2: plotBottom })), theme));

  const groups = prep.shown.map((c, r) => {
    const cy = plotTop + r * rowH + rowH / 2;
    let reach = axis.at(0);
    const bars: Bar[] = segments(ctx, c).map((seg) => {
      const by = stacked || k === 1 ? cy - t / 2 : cy - inner / 2 + seg.s * (t + 2);
      const x0 = axis.at(Math.min(seg.from, seg.to));
      const x1 = axis.at(Math.max(seg.from, seg.to));
      reach = Math.max(reach, x1);
      return { x: x0, y: by, width: x1 - x0, height: t, fill: seriesColour(theme, seg.s).mark, outline: stacked ? theme.paper : undefined };
    });
    const values: BarValue[] = valueLabels(ctx, c).map((l) => {
      const by = l.s < 0 || k === 1 ? cy - t / 2 : cy - inner / 2 + l.s * (t + 2);
      const x = axis.at(l.s < 0 ? (l.v >= 0 ? segEnd(ctx, c, 1) : segEnd(ctx, c, -1)) : l.v);
      const text = prep.fmt(l.v);
      const right = l.v >= 0;
      if (right) reach = Math.max(reach, x + 4 + textWidth(text, small));
      return { text, x: right ? x + 4 : x - 4, y: by + t / 2 + small * 0.35, anchor: right ? 'start' : 'end' };
    });
    const notes: string[] = [];
    let nx = reach + 6;
    for (const n of notesFor(ctx, c)) {
      const w = markerWidth(n.note.label, theme);
      notes.push(noteInline(n.note, nx + w / 2, cy, theme));
      nx += w + 4;
    }
    const label = textEl(labels[r], { x: labelRight, y: cy + fs * 0.35, 'text-anchor': 'end' });
    return barGroup(data.categories[c], groupTitle(ctx, c), bars, values, [label], notes, theme);
  });
  parts.push(el('g', { class: 'vt-bars' }, groups));

  // Axis: zero line and ticks.
  parts.push(baseline({ x1: axis.at(0), x2: axis.at(0), y1: plotTop - 2, y2: plotBottom }, theme));
  parts.push(tickLabels(axis, ctx, true, plotBottom + 6 + small));
  return { body: parts.join(''), height: plotBottom + 6 + small + PAD };
}

/** A bar as drawn: its box and colour, outlined in paper when it is one piece of a stack. */
export interface Bar {
  x: number;
  y: number;
  width: number;
  height: number;
  fill: string;
  outline?: string;
}

/** A value written by its bar. */
export interface BarValue {
  text: string;
  x: number;
  y: number;
  anchor?: 'start' | 'middle' | 'end';
  fill?: string;
}

/**
 * The marks of one category as one group, its tooltip first: `before` (the
 * category's name, where it leads), the bars, the values written by them,
 * then `after` (the name set under vertical bars, note markers). Small
 * multiples draw their bars panels with it too.
 */
export function barGroup(category: string, title: string, bars: readonly Bar[], values: readonly BarValue[], before: readonly string[], after: readonly string[], theme: Theme): string {
  return el('g', { class: 'vt-bar-group', 'data-category': category }, [
    titleEl(title),
    ...before,
    ...bars.map((b) => el('rect', { x: b.x, y: b.y, width: b.width, height: b.height, fill: b.fill, stroke: b.outline, 'stroke-width': b.outline ? 1 : undefined })),
    ...values.map((v) => textEl(v.text, { x: v.x, y: v.y, 'font-size': theme.sizes.small, 'text-anchor': v.anchor, fill: v.fill })),
    ...after,
  ]);
}

/** End of a stack on one side of zero (sign 1: positive values, -1: negative). */
function segEnd(ctx: Ctx, c: number, sign: 1 | -1): number {
  return ctx.prep.values.reduce((s, vs) => {
    const v = vs[c];
    return v !== null && Math.sign(v) === sign ? s + v : s;
  }, 0);
}

function drawVertical(ctx: Ctx): { body: string; height: number } {
  const { data, prep, opts, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const k = data.series.length;
  const stacked = opts.layout === 'stacked' && k > 1;
  const n = prep.shown.length;
  const parts: string[] = [];
  let y = PAD;

  const lg = legendBlock(ctx, y);
  parts.push(lg.markup);
  if (lg.height) y += lg.height + 6;

  const headStyle = { style: serifStyle(theme, true), fill: theme.inkMuted, 'font-size': theme.sizes.axisTitle };
  const headY = y + theme.sizes.axisTitle;
  parts.push(textEl(truncateText(data.valueLabel, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), { ...headStyle, x: PAD, y: headY, class: 'vt-axis-title' }));
  y = headY + 8;

  const drawnNotes = ctx.notes.filter((nt) => prep.shown.some((c) => data.categories[c] === nt.category));
  const mh = markerHeight(theme);
  const laneY = y + mh / 2;
  if (drawnNotes.length) y += mh + 10;

  const hasNeg = axisValues(ctx).some((v) => v < 0);
  const labelRoom = opts.labels ? small + 6 : 0;
  const plotTop = y + labelRoom;
  const plotH = narrow ? 220 : 280;
  const plotBottom = plotTop + plotH;
  const axis = valueAxis(axisValues(ctx), [plotBottom - (hasNeg ? labelRoom : 0), plotTop], data.format, narrow ? 4 : 5);
  const tickW = Math.max(...axis.ticks.map((t) => textWidth(tickFormatter(axis.ticks, data.format)(t), small)));
  const plotLeft = PAD + tickW + 8;
  const plotRight = W - PAD;
  const band = (plotRight - plotLeft) / n;
  const bw = stacked || k === 1 ? Math.min(band * 0.7, 64) : Math.min((band * 0.8 - (k - 1) * 2) / k, 40);
  const inner = stacked || k === 1 ? bw : k * bw + (k - 1) * 2;

  // Value labels only when they fit their bar's slot.
  const pitch = stacked || k === 1 ? band : bw + 2;
  const valueTexts = prep.shown.flatMap((c) => valueLabels(ctx, c).map((l) => prep.fmt(l.v)));
  const showValues = valueTexts.length > 0 && Math.max(...valueTexts.map((t) => textWidth(t, small))) <= pitch - 2;

  parts.push(grid(axis.ticks.filter((v) => v !== 0).map((v) => ({ x1: plotLeft, x2: plotRight, y1: axis.at(v), y2: axis.at(v) })), theme));
  parts.push(tickLabels(axis, ctx, false, plotLeft - 6));

  // Category labels: level (on up to two lines) when they all fit their band, otherwise slanted.
  const wrapped = prep.shown.map((c) => wrapText(data.categories[c], band - 6, fs, 2).lines);
  const level = prep.shown.every((c) => wrapText(data.categories[c], band - 6, fs, 2).complete);
  const slantMax = narrow ? 110 : 150;
  // A slanted label runs down-left from its bar: keep the first ones inside the left edge.
  const slanted = prep.shown.map((c, i) => truncateText(data.categories[c], Math.min(slantMax, (plotLeft + band * (i + 0.5) + fs * 0.3 - PAD) / 0.75), fs));
  const lineGap = fs + 3;
  const levelLines = Math.max(...wrapped.map((w) => w.length));
  const slantW = level ? 0 : Math.max(...slanted.map((l) => textWidth(l, fs)));
  const labelsBottom = level ? plotBottom + 6 + fs + (levelLines - 1) * lineGap : plotBottom + 10 + slantW * 0.71 + fs * 0.7;

  const anchors: NoteAnchor[] = [];
  const groups = prep.shown.map((c, i) => {
    const cx = plotLeft + band * (i + 0.5);
    let top = axis.at(0);
    const bars: Bar[] = segments(ctx, c).map((seg) => {
      const bx = stacked || k === 1 ? cx - bw / 2 : cx - inner / 2 + seg.s * (bw + 2);
      const y0 = axis.at(Math.max(seg.from, seg.to));
      const y1 = axis.at(Math.min(seg.from, seg.to));
      top = Math.min(top, y0);
      return { x: bx, y: y0, width: bw, height: y1 - y0, fill: seriesColour(theme, seg.s).mark, outline: stacked ? theme.paper : undefined };
    });
    const values: BarValue[] = (showValues ? valueLabels(ctx, c) : []).map((l) => {
      const x = l.s < 0 || k === 1 ? cx : cx - inner / 2 + l.s * (bw + 2) + bw / 2;
      const end = axis.at(l.s < 0 ? segEnd(ctx, c, l.v >= 0 ? 1 : -1) : l.v);
      const ly = l.v >= 0 ? end - 5 : end + small + 2;
      if (l.v >= 0) top = Math.min(top, ly - small);
      return { text: prep.fmt(l.v), x, y: ly, anchor: 'middle' };
    });
    const name =
      level
        ? wrapped[i].map((line, li) => textEl(line, { x: cx, y: plotBottom + 6 + fs + li * lineGap, 'text-anchor': 'middle' })).join('')
        : textEl(slanted[i], {
            x: cx + fs * 0.3,
            y: plotBottom + 10,
            'text-anchor': 'end',
            transform: `rotate(-45 ${num(cx + fs * 0.3)} ${num(plotBottom + 10)})`,
          });
    for (const nt of notesFor(ctx, c)) anchors.push({ note: nt.note, x: cx, y: top - 4 });
    return barGroup(data.categories[c], groupTitle(ctx, c), bars, values, [], [name], theme);
  });
  parts.push(el('g', { class: 'vt-bars' }, groups));
  parts.push(baseline({ x1: plotLeft, x2: plotRight, y1: axis.at(0), y2: axis.at(0) }, theme));
  parts.push(notesInLane(anchors, laneY, plotLeft, plotRight, theme));

  const catY = labelsBottom + 10 + theme.sizes.axisTitle;
  parts.push(
    textEl(truncateText(data.categoryLabel, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), {
      ...headStyle,
      x: (plotLeft + plotRight) / 2,
      y: catY,
      'text-anchor': 'middle',
      class: 'vt-axis-title',
    }),
  );
  return { body: parts.join(''), height: Math.ceil(catY + PAD) };
}

export const bars = defineChart({
  name: 'bars',
  options: barsOptions,
  prepare: (data: BarsData, opts) => prepare(data, opts),
  empty: ({ data, prep }) => emptyReason(data, prep),
  table: ({ data, prep }) => barsTable(data, prep),
  place: (at, { data, prep }) => place(at, data, prep),
  alt: ({ data, prep, opts }) => barsAlt(data, prep, opts),
  draw: ({ data, prep, opts, theme }, notes, { width, narrow }) => {
    const ctx: Ctx = { data, prep, opts, theme, notes, width, narrow };
    const vertical = opts.orientation === 'vertical' && (width - 2 * PAD - 48) / prep.shown.length >= MIN_BAND;
    return vertical ? drawVertical(ctx) : drawHorizontal(ctx);
  },
});
