/**
 * Lines over narrative time: one or several series across the positions of
 * a text (chapters or equal segments), labelled directly at their ends. A
 * series may carry a band (a range around it, such as the spread behind a
 * smoothed arc), shaded lightly in its colour behind the lines.
 */

import { z } from 'zod';
import type { DataAt, LinesData, NoteAt, Table, TextAt } from './types.ts';
import { seriesColour, serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, num, polylinePath, textEl, textWidth, titleEl, truncateText } from './svg.ts';
import { columnKeys, decimalsFor, formatValue, sentence } from './format.ts';
import { tickFormatter, valueAxis } from './scale.ts';
import { baseline, grid, valueTicks } from './axes.ts';
import { spreadApart, thinEvenly } from './place.ts';
import { markerHeight, notesInLane } from './furniture.ts';
import type { NoteAnchor } from './furniture.ts';

export const linesOptions = z.strictObject({
  markers: z
    .boolean()
    .default(true)
    .describe('Mark every position with a point, each series in its own shape (circle, square, diamond, triangle…); left out when positions are under 10 units apart, except for isolated points. Default: true.'),
  area: z
    .boolean()
    .default(false)
    .describe('Shade the area between each line and the baseline, lightly; clearest with a single series. Default: false.'),
  zero: z
    .boolean()
    .default(true)
    .describe('Start the value axis at zero; false fits the axis to the data. Default: true.'),
  id: idOption,
});

export type LinesOptions = z.output<typeof linesOptions>;

type Values = (number | null)[][];

function clean(data: LinesData): Values {
  return data.series.map((s) =>
    data.points.map((_, i) => {
      const v = s.values[i];
      return typeof v === 'number' && Number.isFinite(v) ? v : null;
    }),
  );
}

/** A band made safe to draw: its series' index, and low/high per position (null where either is missing). */
interface Band {
  s: number;
  low: (number | null)[];
  high: (number | null)[];
}

/** The bands whose series is in the data; at most one per series (the first). */
function cleanBands(data: LinesData): Band[] {
  const out: Band[] = [];
  for (const b of data.bands ?? []) {
    const s = data.series.findIndex((x) => x.id === b.series);
    if (s === -1 || out.some((o) => o.s === s)) continue;
    const low: (number | null)[] = [];
    const high: (number | null)[] = [];
    data.points.forEach((_, i) => {
      const lo = b.low?.[i];
      const hi = b.high?.[i];
      const ok = typeof lo === 'number' && typeof hi === 'number' && Number.isFinite(lo) && Number.isFinite(hi);
      low.push(ok ? Math.min(lo, hi) : null);
      high.push(ok ? Math.max(lo, hi) : null);
    });
    out.push({ s, low, high });
  }
  return out;
}

function emptyReason(data: LinesData, values: Values): string | null {
  if (data.points.length === 0) return 'the dataset has no positions along the text.';
  if (data.series.length === 0) return 'the dataset has no series.';
  if (values.every((vs) => vs.every((v) => v === null || v === 0))) return 'every value is zero or missing.';
  return null;
}

/* ---------- table and alt text ---------- */

function linesTable(data: LinesData, values: Values, bands: readonly Band[] = []): Table {
  const keys = columnKeys(
    data.series.map((s) => s.id),
    'position',
    'series',
  );
  return {
    columns: [
      { key: 'position', label: data.xLabel, numeric: false },
      ...data.series.map((s, i) => ({ key: keys[i], label: s.name, numeric: true })),
      ...bands.flatMap((b) => [
        { key: `${keys[b.s]}-low`, label: `${data.series[b.s].name} (band, low)`, numeric: true },
        { key: `${keys[b.s]}-high`, label: `${data.series[b.s].name} (band, high)`, numeric: true },
      ]),
    ],
    rows: data.points.map((p, i) => [p, ...values.map((vs) => vs[i]), ...bands.flatMap((b) => [b.low[i], b.high[i]])]),
  };
}

function extreme(vs: (number | null)[], pick: 'max' | 'min'): { i: number; v: number } | null {
  let best: { i: number; v: number } | null = null;
  vs.forEach((v, i) => {
    if (v === null) return;
    if (!best || (pick === 'max' ? v > best.v : v < best.v)) best = { i, v };
  });
  return best;
}

const MAX_SERIES_IN_ALT = 5;

function linesAlt(data: LinesData, values: Values, fmt: (v: number) => string): string {
  const peaks = data.series
    .map((s, si) => ({ name: s.name, peak: extreme(values[si], 'max'), low: extreme(values[si], 'min') }))
    .filter((p): p is { name: string; peak: { i: number; v: number }; low: { i: number; v: number } } => p.peak !== null && p.low !== null);
  let main: string;
  if (peaks.length === 1) {
    const { name, peak, low } = peaks[0];
    main =
      peak.v === low.v
        ? `${data.yLabel}: ${name} stays at ${fmt(peak.v)} throughout`
        : `${data.yLabel}: ${name} peaks at ${data.points[peak.i]}, ${fmt(peak.v)}, and is lowest at ${data.points[low.i]}, ${fmt(low.v)}`;
  } else {
    const ranked = [...peaks].sort((a, b) => b.peak.v - a.peak.v);
    const listed = ranked.slice(0, MAX_SERIES_IN_ALT).map((p, k) => `${p.name}${k === 0 ? ' peaks' : ''} at ${data.points[p.peak.i]}, ${fmt(p.peak.v)}`);
    const rest = ranked.length - listed.length;
    if (rest > 0) listed.push(`${rest} more series in the table`);
    main = `${data.yLabel}: ${listed.join('; ')}`;
  }
  return sentence(main);
}

/* ---------- notes ---------- */

/** Where a note points: a position index (maybe fractional) and maybe a series. */
interface Target {
  x: number;
  s: number | null;
}

/** A chapter is its position when the positions are the chapters; a segment, its position; a character or word, the series named after it. */
function inData(at: TextAt, data: LinesData): DataAt | Miss {
  if ('chapter' in at) return data.points[at.chapter - 1] === at.title ? { x: at.chapter - 1 } : 'absent';
  if ('segment' in at) return at.segment <= data.points.length ? { x: at.segment - 1 } : 'absent';
  const s = findNamed(at, data.series, (x) => [x.id, x.name]);
  return s ? { series: s.id } : 'absent';
}

function place(note: NoteAt, data: LinesData, values: Values): Target | Miss {
  const at = isDataAt(note) ? note : inData(note, data);
  if (typeof at === 'string') return at;
  const s = at.series === undefined ? null : data.series.findIndex((x) => x.id === at.series);
  if (s === -1) return 'absent';
  let x = at.x;
  if (x === undefined) {
    if (s === null) return 'absent';
    // A note on a series alone points at its last value.
    const last = values[s].map((v, i) => (v === null ? -1 : i)).filter((i) => i >= 0).pop();
    if (last === undefined) return 'beside';
    x = last;
  }
  if (!Number.isFinite(x) || x < 0 || x > data.points.length - 1) return 'absent';
  // A note on a series where it has no value: the series is shown, the point is not.
  if (s !== null && valueAt(values[s], x) === null) return 'beside';
  return { x, s };
}

/** The value of a series at a (possibly fractional) position, linearly interpolated; null over a gap. */
function valueAt(vs: (number | null)[], x: number): number | null {
  const a = Math.floor(x);
  const b = Math.ceil(x);
  const va = vs[a];
  const vb = vs[b];
  if (va === null || vb === null || va === undefined || vb === undefined) return null;
  return a === b ? va : va + (vb - va) * (x - a);
}

/* ---------- drawing ---------- */

const PAD = 12;
const MIN_MARKER_PITCH = 10;

/** A small point marker: shape by series index. */
function markerPath(shape: number, x: number, y: number, r: number): { tag: string; attrs: Record<string, number | string> } {
  switch (shape % 5) {
    case 0:
      return { tag: 'circle', attrs: { cx: x, cy: y, r } };
    case 1:
      return { tag: 'rect', attrs: { x: x - r * 0.9, y: y - r * 0.9, width: r * 1.8, height: r * 1.8 } };
    case 2:
      return { tag: 'path', attrs: { d: `M${num(x)},${num(y - r * 1.25)}L${num(x + r * 1.25)},${num(y)}L${num(x)},${num(y + r * 1.25)}L${num(x - r * 1.25)},${num(y)}Z` } };
    case 3:
      return { tag: 'path', attrs: { d: `M${num(x)},${num(y - r * 1.2)}L${num(x + r * 1.15)},${num(y + r * 0.8)}L${num(x - r * 1.15)},${num(y + r * 0.8)}Z` } };
    default:
      return { tag: 'path', attrs: { d: `M${num(x)},${num(y + r * 1.2)}L${num(x + r * 1.15)},${num(y - r * 0.8)}L${num(x - r * 1.15)},${num(y - r * 0.8)}Z` } };
  }
}

/** Runs of consecutive present values: the pieces a line is drawn in. */
export function runs(vs: (number | null)[]): number[][] {
  const out: number[][] = [];
  let cur: number[] = [];
  vs.forEach((v, i) => {
    if (v === null) {
      if (cur.length) out.push(cur);
      cur = [];
    } else cur.push(i);
  });
  if (cur.length) out.push(cur);
  return out;
}

/** One piece of a series' line through `points`, in its colour; small multiples draw their lines with it too. */
export function linePath(points: readonly (readonly [number, number])[], colour: string, width: number): string {
  return el('path', {
    class: 'vt-line',
    d: polylinePath(points),
    fill: 'none',
    stroke: colour,
    'stroke-width': width,
    'stroke-linejoin': 'round',
    'stroke-linecap': 'round',
  });
}

/** A series' marks as one group, named by its tooltip. */
export function seriesGroup(series: { id: string; name: string }, marks: readonly string[]): string {
  return el('g', { class: 'vt-series', 'data-series': series.id }, [titleEl(series.name), ...marks]);
}

interface Ctx {
  data: LinesData;
  values: Values;
  bands: readonly Band[];
  opts: LinesOptions;
  theme: Theme;
  notes: readonly Placed<Target>[];
  /** A value as written in this chart. */
  fmt: (v: number) => string;
  width: number;
  narrow: boolean;
}

function drawLines(ctx: Ctx): { body: string; height: number } {
  const { data, values, opts, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const n = data.points.length;
  const parts: string[] = [];
  let y = PAD;

  const headStyle = { style: serifStyle(theme, true), fill: theme.inkMuted, 'font-size': theme.sizes.axisTitle };
  const headY = y + theme.sizes.axisTitle;
  parts.push(textEl(truncateText(data.yLabel, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), { ...headStyle, x: PAD, y: headY, class: 'vt-axis-title' }));
  y = headY + 10;

  const mh = markerHeight(theme);
  const laneY = y + mh / 2;
  if (ctx.notes.length) y += mh + 12;

  const plotTop = y + 6;
  const plotH = narrow ? 200 : 260;
  const plotBottom = plotTop + plotH;
  const bandValues = ctx.bands.flatMap((b) => [...b.low, ...b.high]).filter((v): v is number => v !== null);
  const axis = valueAxis([...values.flat().filter((v): v is number => v !== null), ...bandValues], [plotBottom, plotTop], data.format, narrow ? 4 : 5, opts.zero);
  const tickTexts = axis.ticks.map(tickFormatter(axis.ticks, data.format));
  const tickW = Math.max(...tickTexts.map((t) => textWidth(t, small)));

  // Direct labels at line ends need room on the right.
  const nameMax = narrow ? W * 0.28 : W * 0.22;
  const names = data.series.map((s) => truncateText(s.name, nameMax, fs));
  const nameW = Math.max(...names.map((t) => textWidth(t, fs)));
  const plotLeft = PAD + tickW + 8;
  const plotRight = W - PAD - nameW - 14;
  const xAt = (i: number) => (n === 1 ? (plotLeft + plotRight) / 2 : plotLeft + (i * (plotRight - plotLeft)) / (n - 1));

  // Grid and value ticks.
  const tickYs = axis.ticks.map((t) => axis.at(t));
  parts.push(grid(tickYs.map((y) => ({ x1: plotLeft, x2: plotRight, y1: y, y2: y })), theme));
  parts.push(valueTicks(tickTexts, tickYs, plotLeft - 8, theme));

  // Position ticks, thinned evenly when crowded.
  const keep = thinEvenly(
    data.ticks.slice(0, n).map((t, i) => ({ at: xAt(i), width: textWidth(t ?? '', small) })),
    10,
  );
  parts.push(baseline({ x1: plotLeft, x2: plotRight, y1: plotBottom, y2: plotBottom }, theme));
  parts.push(
    el(
      'g',
      { class: 'vt-x-ticks', fill: theme.inkMuted, 'font-size': small, 'text-anchor': 'middle' },
      keep.map(
        (i) =>
          el('line', { x1: xAt(i), x2: xAt(i), y1: plotBottom, y2: plotBottom + 4, stroke: theme.axis, 'stroke-width': 1 }) +
          textEl(data.ticks[i] ?? '', { x: xAt(i), y: plotBottom + 8 + small }),
      ),
    ),
  );
  const xTitleY = plotBottom + 8 + small + 10 + theme.sizes.axisTitle;
  parts.push(
    textEl(truncateText(data.xLabel, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), {
      ...headStyle,
      x: (plotLeft + plotRight) / 2,
      y: xTitleY,
      'text-anchor': 'middle',
      class: 'vt-axis-title',
    }),
  );

  // Series. Point markers need room: below MIN_MARKER_PITCH units between positions they would merge into a band.
  const markersFit = opts.markers && (n === 1 || (plotRight - plotLeft) / (n - 1) >= MIN_MARKER_PITCH);
  const zeroY = Math.min(plotBottom, Math.max(plotTop, axis.at(Math.max(axis.domain[0], Math.min(0, axis.domain[1])))));
  const seriesMarkup = data.series.map((s, si) => {
    const colour = seriesColour(theme, si);
    const vs = values[si];
    const g: string[] = [];
    for (const run of runs(vs)) {
      const pts = run.map((i) => [xAt(i), axis.at(vs[i] as number)] as [number, number]);
      if (opts.area && pts.length > 1) {
        const d = `${polylinePath(pts)}L${num(pts[pts.length - 1][0])},${num(zeroY)}L${num(pts[0][0])},${num(zeroY)}Z`;
        g.push(el('path', { class: 'vt-area', d, fill: colour.mark, 'fill-opacity': 0.12, stroke: 'none' }));
      }
      if (pts.length > 1) g.push(linePath(pts, colour.mark, 2));
    }
    const showMarkers = markersFit || runs(vs).some((r) => r.length === 1);
    if (showMarkers) {
      const marks = vs.flatMap((v, i) => {
        if (v === null) return [];
        const isolated = (vs[i - 1] ?? null) === null && (vs[i + 1] ?? null) === null;
        if (!markersFit && !isolated) return [];
        const m = markerPath(si, xAt(i), axis.at(v), 3.5);
        return [el(m.tag, m.attrs, titleEl(`${s.name}, ${data.points[i]}: ${ctx.fmt(v)}`))];
      });
      g.push(el('g', { class: 'vt-markers', fill: colour.mark, stroke: theme.paper, 'stroke-width': 1 }, marks));
    }
    return seriesGroup(s, g);
  });
  if (ctx.bands.length) {
    const bandMarkup = ctx.bands.map((b) => {
      const pieces = runs(b.low).filter((run) => run.length > 1);
      const d = pieces
        .map((run) => {
          const top = run.map((i) => [xAt(i), axis.at(b.high[i] as number)] as [number, number]);
          const bottom = run.map((i) => [xAt(i), axis.at(b.low[i] as number)] as [number, number]).reverse();
          return `${polylinePath([...top, ...bottom])}Z`;
        })
        .join('');
      const s = data.series[b.s];
      return d
        ? el('path', { class: 'vt-band', 'data-series': s.id, d, fill: seriesColour(theme, b.s).mark, 'fill-opacity': 0.16, stroke: 'none' }, titleEl(`${s.name}: band`))
        : '';
    });
    parts.push(el('g', { class: 'vt-bands' }, bandMarkup));
  }
  parts.push(el('g', { class: 'vt-lines' }, seriesMarkup));

  // Direct labels at line ends, nudged apart vertically.
  const ends = data.series.map((_, si) => {
    const vs = values[si];
    let last = -1;
    vs.forEach((v, i) => {
      if (v !== null) last = i;
    });
    return last < 0 ? null : { i: last, y: axis.at(vs[last] as number) };
  });
  const labelled = data.series.map((_, si) => si).filter((si) => ends[si] !== null);
  const placed = spreadApart(
    labelled.map((si) => ends[si]!.y),
    fs * 1.2,
    plotTop - 4,
    plotBottom + 4,
  );
  parts.push(
    el(
      'g',
      { class: 'vt-end-labels', 'font-size': fs },
      labelled.map((si, k) => {
        const end = ends[si]!;
        const ly = placed[k];
        const colour = seriesColour(theme, si);
        const lx = plotRight + 10;
        const leader =
          Math.abs(ly - end.y) > 3 || xAt(end.i) < plotRight - 1
            ? el('path', {
                d: `M${num(xAt(end.i) + 5)},${num(end.y)}L${num(lx - 3)},${num(ly)}`,
                fill: 'none',
                stroke: colour.mark,
                'stroke-width': 1,
              })
            : '';
        return leader + textEl(names[si], { x: lx, y: ly + fs * 0.35, fill: colour.text });
      }),
    ),
  );

  // Notes: in a lane above the plot, with leaders to their targets.
  const anchors: NoteAnchor[] = ctx.notes.map(({ note, x, s }) => {
    const px = n === 1 ? xAt(0) : plotLeft + (x * (plotRight - plotLeft)) / (n - 1);
    if (s === null) return { note, x: px, y: plotTop, ruleTo: plotBottom };
    return { note, x: px, y: axis.at(valueAt(values[s], x) as number) };
  });
  parts.push(notesInLane(anchors, laneY, plotLeft, plotRight, theme));

  return { body: parts.join(''), height: Math.ceil(xTitleY + PAD) };
}

export const lines = defineChart({
  name: 'lines',
  options: linesOptions,
  prepare: (data: LinesData) => {
    const values = clean(data);
    const decimals = decimalsFor(values.flat().filter((v): v is number => v !== null));
    return { values, bands: cleanBands(data), fmt: (v: number) => formatValue(v, data.format, decimals) };
  },
  empty: ({ data, prep }) => emptyReason(data, prep.values),
  table: ({ data, prep }) => linesTable(data, prep.values, prep.bands),
  place: (at, { data, prep }) => place(at, data, prep.values),
  // A segment is named by its position's own label ("Segment 3 (words 1201–1800)").
  words: (at, { data }) => ('segment' in at ? data.points[at.segment - 1] : undefined),
  alt: ({ data, prep }) => linesAlt(data, prep.values, prep.fmt),
  draw: ({ data, prep, opts, theme }, notes, { width, narrow }) =>
    drawLines({ data, values: prep.values, bands: prep.bands, opts, theme, notes, fmt: prep.fmt, width, narrow }),
});
