/**
 * Small multiples: a grid of small bars or lines charts, one per chapter or
 * per character, all on one value scale, so a glance across the grid
 * compares them fairly. Series keep one colour in every panel; the value
 * ticks (lines) or category names (bars shared by every panel) are written
 * once, beside the first column.
 */

import { z } from 'zod';
import type { BarsData, DataAt, LinesData, MultiplesData, NoteAt, Table, TextAt } from './types.ts';
import { seriesColour, serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, textEl, textWidth, titleEl, truncateText, wrapText } from './svg.ts';
import { BOLD_FACTOR } from './clip.ts';
import { decimalsFor, formatValue, joinWords, sentence } from './format.ts';
import type { ValueFormat } from './format.ts';
import { tickFormatter, valueAxis } from './scale.ts';
import { baseline, grid, valueTicks } from './axes.ts';
import { legend, markerWidth, noteInline } from './furniture.ts';
import { barGroup } from './bars.ts';
import type { Bar, BarValue } from './bars.ts';
import { linePath, runs, seriesGroup } from './lines.ts';

export const multiplesOptions = z.strictObject({
  columns: z
    .union([z.literal('auto'), z.number().int().min(1).max(4)])
    .default('auto')
    .describe(
      'Columns of panels in the wide layout, 1 to 4, or "auto": 2 for up to 4 panels, 3 for up to 9, 4 beyond, never more than there are panels. The narrow layout uses at most 2 (1 when bars panels each need their own category names). Default: "auto".',
    ),
  zero: z
    .boolean()
    .default(true)
    .describe('Start the shared value axis of lines panels at zero; false fits it to the data. Bars always start at zero. Default: true.'),
  id: idOption,
});

export type MultiplesOptions = z.output<typeof multiplesOptions>;

type Values = (number | null)[][];

interface Panel {
  id: string;
  title: string;
  data: BarsData | LinesData;
  /** Category names (bars) or position labels (lines). */
  labels: string[];
  /** values[s][i]: series s at category or position i. */
  values: Values;
}

function cleanValues(series: { values: number[] }[], n: number): Values {
  return series.map((s) =>
    Array.from({ length: n }, (_, i) => {
      const v = s.values[i];
      return typeof v === 'number' && Number.isFinite(v) ? v : null;
    }),
  );
}

function preparePanels(data: MultiplesData): Panel[] {
  return data.panels.map((p) => {
    const labels = p.data.kind === 'bars' ? p.data.categories : p.data.points;
    return { id: p.id, title: p.title, data: p.data, labels, values: cleanValues(p.data.series, labels.length) };
  });
}

function present(panels: Panel[], kind: 'bars' | 'lines'): number[] {
  return panels.filter((p) => p.data.kind === kind).flatMap((p) => p.values.flat().filter((v): v is number => v !== null));
}

function emptyReason(panels: Panel[]): string | null {
  if (panels.length === 0) return 'the dataset has no panels.';
  if (panels.every((p) => p.values.every((vs) => vs.every((v) => v === null || v === 0)))) return 'every value in every panel is zero or missing.';
  return null;
}

/** Series ids across all panels, in order of first appearance: one colour each, the same in every panel. */
function seriesIndex(panels: Panel[]): { index: Map<string, number>; names: string[] } {
  const index = new Map<string, number>();
  const names: string[] = [];
  for (const p of panels)
    for (const s of p.data.series) {
      if (!index.has(s.id)) {
        index.set(s.id, names.length);
        names.push(s.name);
      }
    }
  return { index, names };
}

/** The format of the first panel of a kind (panels of a kind share one). */
function formatOf(panels: Panel[], kind: 'bars' | 'lines'): ValueFormat {
  return panels.find((p) => p.data.kind === kind)?.data.format ?? 'count';
}

/* ---------- table and alt text ---------- */

function positionLabel(panels: Panel[]): string {
  const names = new Set(panels.map((p) => (p.data.kind === 'bars' ? p.data.categoryLabel : p.data.xLabel)));
  return names.size === 1 ? [...names][0] : 'Category or position';
}

function multiplesTable(panels: Panel[]): Table {
  return {
    columns: [
      { key: 'panel', label: 'Panel', numeric: false },
      { key: 'position', label: positionLabel(panels), numeric: false },
      { key: 'series', label: 'Series', numeric: false },
      { key: 'value', label: valueLabel(panels), numeric: true },
    ],
    rows: panels.flatMap((p) => p.data.series.flatMap((s, si) => p.labels.map((l, i) => [p.title, l, s.name, p.values[si][i]]))),
  };
}

function valueLabel(panels: Panel[]): string {
  const first = panels[0]?.data;
  if (!first) return 'Value';
  return first.kind === 'bars' ? first.valueLabel : first.yLabel;
}

interface Peak {
  panel: Panel;
  v: number;
  s: number;
  i: number;
}

function peakOf(p: Panel): Peak | null {
  let best: Peak | null = null;
  p.values.forEach((vs, s) =>
    vs.forEach((v, i) => {
      if (v !== null && (best === null || v > best.v)) best = { panel: p, v, s, i };
    }),
  );
  return best;
}

function peakWords(k: Peak, fmt: (p: Panel, v: number) => string): string {
  const p = k.panel;
  const series = p.data.series.length > 1 ? ` (${p.data.series[k.s].name})` : '';
  const where = p.data.kind === 'bars' ? `with ${p.labels[k.i]}${series}` : `at ${p.labels[k.i]}${series}`;
  return `${where}, ${fmt(p, k.v)}`;
}

function multiplesAlt(panels: Panel[], fmt: (p: Panel, v: number) => string): string {
  const peaks = panels.map(peakOf).filter((k): k is Peak => k !== null);
  const lead = `${valueLabel(panels)}, on one scale across ${panels.length} ${panels.length === 1 ? 'panel' : 'panels'}`;
  const max = Math.max(...peaks.map((k) => k.v));
  const min = Math.min(...peaks.map((k) => k.v));
  const top = peaks.filter((k) => k.v === max);
  const bottom = peaks.filter((k) => k.v === min);
  let main: string;
  if (top.length === 1) main = `${lead}: ${top[0].panel.title} peaks highest, ${peakWords(top[0], fmt)}`;
  else {
    const names = top.slice(0, 3).map((k) => k.panel.title);
    const more = top.length > 3 ? ` and ${top.length - 3} more` : '';
    main = `${lead}: ${joinWords(names)}${more} peak equally high, ${fmt(top[0].panel, max)}`;
  }
  if (peaks.length > 1 && max !== min) {
    main += bottom.length === 1 ? `; ${bottom[0].panel.title} has the lowest peak, ${fmt(bottom[0].panel, min)}` : `; the lowest peak is ${fmt(bottom[0].panel, min)}, in ${bottom.length} panels`;
  }
  return sentence(main);
}

/* ---------- notes ---------- */

/** A note goes on a panel, by the panel's id, as a marker beside its title. */
interface Target {
  panel: string;
}

/** A chapter is the panel drawn for it; a character or word, the panel drawn for it, else the first panel that shows it. */
function inData(at: TextAt, data: MultiplesData): DataAt | Miss {
  if ('chapter' in at) {
    const panel = data.panels.find((p) => p.title === at.title);
    return panel ? { category: panel.id } : 'absent';
  }
  const own = findNamed(at, data.panels, (p) => [p.id, p.title]);
  if (own) return { category: own.id };
  const showing = data.panels.find((p) =>
    p.data.kind === 'bars'
      ? findNamed(at, p.data.categories, (c) => [c, c.toLowerCase()]) !== undefined
      : findNamed(at, p.data.series, (x) => [x.id, x.name]) !== undefined,
  );
  return showing ? { category: showing.id } : 'absent';
}

function place(note: NoteAt, data: MultiplesData, panels: readonly Panel[]): Target | Miss {
  const at = isDataAt(note) ? note : inData(note, data);
  if (typeof at === 'string') return at;
  const id = at.category;
  return id !== undefined && panels.some((p) => p.id === id) ? { panel: id } : 'absent';
}

/* ---------- layout ---------- */

const PAD = 12;

/** Columns in the wide layout. */
export function wideColumns(n: number, option: MultiplesOptions['columns']): number {
  const auto = n <= 2 ? n : n <= 4 ? 2 : n <= 9 ? 3 : 4;
  return Math.max(1, Math.min(n, option === 'auto' ? auto : option));
}

/** Bars panels whose categories are the same, in the same order, in every one: their names are written once. */
function sharedCategories(panels: Panel[]): string[] | null {
  const bars = panels.filter((p) => p.data.kind === 'bars');
  if (bars.length === 0) return null;
  const first = bars[0].labels;
  return bars.every((p) => p.labels.length === first.length && p.labels.every((l, i) => l === first[i])) ? first : null;
}

interface Ctx {
  panels: Panel[];
  opts: MultiplesOptions;
  theme: Theme;
  notes: readonly Placed<Target>[];
  colourOf: Map<string, number>;
  seriesNames: string[];
  fmt: (p: Panel, v: number) => string;
  width: number;
  narrow: boolean;
}

interface Geometry {
  x: number;
  y: number;
  w: number;
  col: number;
}

function drawMultiples(ctx: Ctx): { body: string; height: number } {
  const { panels, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const n = panels.length;
  const parts: string[] = [];
  let y = PAD;

  const shared = sharedCategories(panels);
  const hasBars = panels.some((p) => p.data.kind === 'bars');
  const hasLines = panels.some((p) => p.data.kind === 'lines');
  const wide = wideColumns(n, ctx.opts.columns);
  const cols = narrow ? Math.min(wide, n === 1 || (hasBars && !shared) ? 1 : 2) : wide;
  const rows = Math.ceil(n / cols);

  // Legend, when there is more than one series, and the value label for the whole grid.
  if (ctx.seriesNames.length > 1) {
    const lg = legend(
      ctx.seriesNames.map((name, i) => ({ name, colour: seriesColour(theme, i).mark })),
      PAD,
      y,
      W - 2 * PAD,
      theme,
    );
    parts.push(lg.markup);
    y += lg.height + 4;
  }
  const headStyle = { style: serifStyle(theme, true), fill: theme.inkMuted, 'font-size': theme.sizes.axisTitle };
  y += theme.sizes.axisTitle;
  parts.push(
    textEl(truncateText(`${valueLabel(panels)}, on one scale in every panel`, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), {
      ...headStyle,
      x: PAD,
      y,
      class: 'vt-axis-title',
    }),
  );
  y += 12;

  // Shared axes. Lines: one value axis for all lines panels. Bars: one for all bars panels, from zero.
  const linesFormat = formatOf(panels, 'lines');
  const barsFormat = formatOf(panels, 'bars');
  const linesAxis = valueAxis(present(panels, 'lines'), [1, 0], linesFormat, 3, ctx.opts.zero);
  const barsAxis = valueAxis(present(panels, 'bars'), [0, 1], barsFormat, 4, true, false);
  const tickTexts = linesAxis.ticks.map(tickFormatter(linesAxis.ticks, linesFormat));

  // The gutter left of the first column: value ticks of lines panels, shared category names of bars panels.
  const tickW = hasLines ? Math.max(...tickTexts.map((t) => textWidth(t, small))) + 8 : 0;
  const catMax = W * (narrow ? 0.26 : 0.2);
  const sharedNames = shared ? shared.map((c) => truncateText(c, catMax, fs)) : [];
  const catW = shared ? Math.min(catMax, Math.max(...sharedNames.map((c) => textWidth(c, fs)))) + 8 : 0;
  const gutter = Math.max(tickW, catW);
  const gapX = narrow ? 14 : 24;
  const gapY = 20;
  const panelW = (W - 2 * PAD - gutter - (cols - 1) * gapX) / cols;

  // Panel heights: one for all, so lines panels share their vertical scale on the page too.
  // Panel titles: bold, on up to two lines, the same room above every panel.
  const noteRoom = (p: Panel) => {
    const note = ctx.notes.find((nt) => nt.panel === p.id)?.note;
    return note ? markerWidth(note.label, theme) + 6 : 0;
  };
  const titles = panels.map((p) => wrapText(p.title, (panelW - noteRoom(p)) / BOLD_FACTOR, fs, 2).lines);
  const titleLines = Math.max(1, ...titles.map((l) => l.length));
  const titleH = titleLines * (fs + 3) + 5;
  const maxSeries = Math.max(1, ...panels.map((p) => p.data.series.length));
  const barRow = maxSeries > 1 ? maxSeries * 8 + 8 : 18;
  const maxCats = Math.max(0, ...panels.filter((p) => p.data.kind === 'bars').map((p) => p.labels.length));
  const linesH = hasLines ? (narrow ? 80 : 96) + 6 + small : 0;
  const barsH = hasBars ? maxCats * barRow : 0;
  const bodyH = Math.max(linesH, barsH);
  const panelH = titleH + bodyH;

  const room = barsRoom(ctx, panelW, shared !== null);
  const gridTop = y;
  panels.forEach((p, k) => {
    const col = k % cols;
    const row = Math.floor(k / cols);
    const g: Geometry = { x: PAD + gutter + col * (panelW + gapX), y: gridTop + row * (panelH + gapY), w: panelW, col };
    const note = ctx.notes.find((nt) => nt.panel === p.id)?.note;
    const inner: string[] = [titleEl(p.title)];
    titles[k].forEach((line, li) =>
      inner.push(textEl(line, { x: g.x, y: g.y + fs + li * (fs + 3), 'font-weight': 600, class: 'vt-panel-title' })),
    );
    if (note) inner.push(noteInline(note, g.x + panelW - markerWidth(note.label, theme) / 2, g.y + fs * 0.65, theme));
    const top = g.y + titleH;
    if (p.data.kind === 'lines') inner.push(drawLinesPanel(ctx, p, g, top, top + linesH - 6 - small, linesAxis, tickTexts));
    else inner.push(drawBarsPanel(ctx, p, g, top, barRow, barsAxis.domain, shared ? sharedNames : null, room));
    parts.push(el('g', { class: 'vt-panel', 'data-panel': p.id }, inner));
  });
  y = gridTop + rows * panelH + (rows - 1) * gapY;

  // What runs along the lines panels.
  const firstLines = panels.find((p) => p.data.kind === 'lines');
  if (firstLines && firstLines.data.kind === 'lines') {
    y += 10 + theme.sizes.axisTitle;
    parts.push(
      textEl(truncateText(`${firstLines.data.xLabel}: first and last marked under each panel`, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), {
        ...headStyle,
        x: PAD + gutter,
        y,
        class: 'vt-axis-title',
      }),
    );
  }
  return { body: parts.join(''), height: Math.ceil(y + PAD) };
}

function drawLinesPanel(
  ctx: Ctx,
  p: Panel,
  g: Geometry,
  top: number,
  bottom: number,
  axis: { ticks: number[]; domain: [number, number] },
  tickTexts: string[],
): string {
  const { theme } = ctx;
  const small = theme.sizes.small;
  const data = p.data as LinesData;
  const [d0, d1] = axis.domain;
  const yAt = (v: number) => bottom - ((v - d0) / (d1 - d0 || 1)) * (bottom - top);
  const left = g.x + 3;
  const right = g.x + g.w - 3;
  const n = p.labels.length;
  const xAt = (i: number) => (n === 1 ? (left + right) / 2 : left + (i * (right - left)) / (n - 1));
  const out: string[] = [];
  const tickYs = axis.ticks.map(yAt);
  out.push(grid(tickYs.map((y) => ({ x1: g.x, x2: g.x + g.w, y1: y, y2: y })), theme));
  if (g.col === 0) out.push(valueTicks(tickTexts, tickYs, g.x - 6, theme));
  out.push(baseline({ x1: g.x, x2: g.x + g.w, y1: bottom, y2: bottom }, theme));

  // First and last position under the panel.
  const ticks = data.ticks ?? [];
  const firstTick = ticks[0] ?? '';
  const lastTick = n > 1 ? (ticks[n - 1] ?? '') : '';
  const tickY = bottom + 4 + small;
  const half = g.w / 2 - 4;
  out.push(
    el('g', { class: 'vt-x-ticks', fill: theme.inkMuted, 'font-size': small }, [
      textEl(truncateText(firstTick, half, small), { x: n === 1 ? (left + right) / 2 : g.x, y: tickY, 'text-anchor': n === 1 ? 'middle' : 'start' }),
      lastTick ? textEl(truncateText(lastTick, half, small), { x: g.x + g.w, y: tickY, 'text-anchor': 'end' }) : '',
    ]),
  );

  const peak = peakOf(p);
  data.series.forEach((s, si) => {
    const colour = seriesColour(theme, ctx.colourOf.get(s.id) ?? 0).mark;
    const vs = p.values[si];
    const marks: string[] = [];
    for (const run of runs(vs)) {
      if (run.length > 1) marks.push(linePath(run.map((i) => [xAt(i), yAt(vs[i] as number)] as [number, number]), colour, 1.75));
      else marks.push(el('circle', { cx: xAt(run[0]), cy: yAt(vs[run[0]] as number), r: 2.5, fill: colour }));
    }
    if (peak && peak.s === si) {
      marks.push(
        el('circle', { class: 'vt-peak', cx: xAt(peak.i), cy: yAt(peak.v), r: 3.5, fill: colour, stroke: theme.paper, 'stroke-width': 1 }, titleEl(`${p.title}: highest ${peakWords(peak, ctx.fmt)}`)),
      );
    }
    out.push(seriesGroup(s, marks));
  });
  return out.join('');
}

/** Room every bars panel keeps for its own category names (none when shared) and for value labels, so all draw bars alike. */
interface BarsRoom {
  names: number;
  values: number;
}

function barsRoom(ctx: Ctx, panelW: number, shared: boolean): BarsRoom {
  const { theme } = ctx;
  const bars = ctx.panels.filter((p) => p.data.kind === 'bars');
  const ownMax = panelW * 0.42;
  const names = shared ? 0 : Math.min(ownMax, Math.max(0, ...bars.flatMap((p) => p.labels.map((c) => textWidth(truncateText(c, ownMax, theme.sizes.label), theme.sizes.label))))) + 6;
  const single = bars.filter((p) => p.data.series.length === 1);
  const texts = single.flatMap((p) => p.values.flatMap((vs) => vs.filter((v): v is number => v !== null).map((v) => ctx.fmt(p, v))));
  const values = texts.length ? Math.max(...texts.map((t) => textWidth(t, theme.sizes.small))) + 6 : 0;
  return { names, values };
}

function drawBarsPanel(ctx: Ctx, p: Panel, g: Geometry, top: number, rowH: number, domain: [number, number], sharedNames: string[] | null, room: BarsRoom): string {
  const { theme } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const data = p.data as BarsData;
  const k = data.series.length;
  const out: string[] = [];

  // Own category names when panels differ; else the shared names, beside the first column only.
  const own = sharedNames ? null : p.labels.map((c) => truncateText(c, g.w * 0.42, fs));
  const x0 = g.x + room.names;
  const x1 = g.x + g.w - room.values;
  const [d0, d1] = domain;
  const xAt = (v: number) => x0 + ((v - d0) / (d1 - d0 || 1)) * (x1 - x0);
  const t = k > 1 ? 7 : 12;

  p.labels.forEach((c, i) => {
    const rowTop = top + i * rowH;
    const cy = rowTop + rowH / 2;
    const texts = data.series.map((s, si) => `${k > 1 ? `${s.name}: ` : ''}${p.values[si][i] === null ? 'no value' : ctx.fmt(p, p.values[si][i] as number)}`);
    const name = own
      ? [textEl(own[i], { x: x0 - 6, y: cy + fs * 0.35, 'text-anchor': 'end' })]
      : sharedNames && g.col === 0
        ? [textEl(sharedNames[i], { x: g.x - 8, y: cy + fs * 0.35, 'text-anchor': 'end' })]
        : [];
    const bars: Bar[] = [];
    const values: BarValue[] = [];
    data.series.forEach((s, si) => {
      const v = p.values[si][i];
      if (v === null) return;
      const by = k > 1 ? cy - (k * (t + 1)) / 2 + si * (t + 1) : cy - t / 2;
      const a = xAt(Math.min(0, v));
      const b = xAt(Math.max(0, v));
      bars.push({ x: a, y: by, width: Math.max(0, b - a), height: t, fill: seriesColour(theme, ctx.colourOf.get(s.id) ?? 0).mark });
      if (k === 1) values.push({ text: ctx.fmt(p, v), x: Math.max(b, xAt(0)) + 4, y: cy + small * 0.35, fill: theme.inkMuted });
    });
    out.push(barGroup(c, `${p.title}, ${c}: ${texts.join('; ')}`, bars, values, name, [], theme));
  });
  out.push(baseline({ x1: xAt(0), x2: xAt(0), y1: top - 2, y2: top + p.labels.length * rowH }, theme));
  return out.join('');
}

export const multiples = defineChart({
  name: 'multiples',
  options: multiplesOptions,
  prepare: (data: MultiplesData) => {
    const panels = preparePanels(data);
    // Values written with the same decimals across panels of a kind.
    const decimals = { bars: decimalsFor(present(panels, 'bars')), lines: decimalsFor(present(panels, 'lines')) };
    const fmt = (p: Panel, v: number) => formatValue(v, p.data.format, decimals[p.data.kind]);
    return { panels, fmt, ...seriesIndex(panels) };
  },
  empty: ({ prep }) => emptyReason(prep.panels),
  table: ({ prep }) => multiplesTable(prep.panels),
  place: (at, { data, prep }) => place(at, data, prep.panels),
  // One marker per panel: the first note on it.
  slot: (t) => t.panel,
  alt: ({ prep }) => multiplesAlt(prep.panels, prep.fmt),
  draw: ({ prep, opts, theme }, notes, { width, narrow }) =>
    drawMultiples({ panels: prep.panels, opts, theme, notes, colourOf: prep.index, seriesNames: prep.names, fmt: prep.fmt, width, narrow }),
});
