/**
 * A scatter plot of labelled points: two value axes with round ("nice")
 * ends from d3-scale, groups told apart by colour and shape with a legend,
 * and names set beside the points where they fit without touching a point
 * or another name (greedy, most extreme points first; see labels.ts).
 */

import { z } from 'zod';
import type { NoteAt, ScatterData, Table } from './types.ts';
import { seriesColour, serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, num, textEl, textWidth, titleEl, truncateText } from './svg.ts';
import { decimalsFor, formatNumber, joinWords, sentence } from './format.ts';
import { tickFormatter, valueAxis } from './scale.ts';
import { grid, valueTicks } from './axes.ts';
import { thinEvenly } from './place.ts';
import { placeInRings } from './labels.ts';
import { clipEnd } from './clip.ts';
import type { Box, Disc, RingRequest, Segment } from './labels.ts';
import { legend, markerHeight, markerWidth, noteInline, notesInLane } from './furniture.ts';
import type { Block, LegendItem, NoteAnchor } from './furniture.ts';

export const scatterOptions = z.strictObject({
  labels: z
    .enum(['all', 'extremes', 'none'])
    .default('all')
    .describe(
      'Which points are named beside them: "all" (a name that would touch a point or another name is left out, the most extreme points named first), "extremes" (only the lowest and highest on each axis and the points farthest from the middle of the cloud), "none". Every point keeps its tooltip and its row in the table. Default: "all".',
    ),
  zero: z
    .boolean()
    .default(false)
    .describe('Include zero on both axes; false fits each axis to the data, with round ends. Default: false.'),
  id: idOption,
});

export type ScatterOptions = z.output<typeof scatterOptions>;

interface Point {
  /** Index in the data. */
  index: number;
  id: string;
  label: string;
  x: number;
  y: number;
  /** Index into the groups; 0 when there are none. */
  group: number;
}

interface Prepared {
  points: Point[];
  /** Group names in order of first appearance; empty when no point has a group. */
  groups: string[];
  /** Values as written on each axis (decimals kept equal along it). */
  fx: (v: number) => string;
  fy: (v: number) => string;
}

const UNGROUPED = 'Other';

function prepare(data: ScatterData): Prepared {
  const valid = data.points.map((p, index) => ({ p, index })).filter(({ p }) => Number.isFinite(p.x) && Number.isFinite(p.y));
  const anyGroup = valid.some(({ p }) => p.group !== undefined && p.group !== '');
  const groups: string[] = [];
  const points = valid.map(({ p, index }) => {
    const name = anyGroup ? (p.group === undefined || p.group === '' ? UNGROUPED : p.group) : '';
    let group = 0;
    if (anyGroup) {
      group = groups.indexOf(name);
      if (group === -1) group = groups.push(name) - 1;
    }
    return { index, id: p.id, label: p.label, x: p.x, y: p.y, group };
  });
  const dx = decimalsFor(points.map((p) => p.x));
  const dy = decimalsFor(points.map((p) => p.y));
  return { points, groups, fx: (v) => formatNumber(v, dx), fy: (v) => formatNumber(v, dy) };
}

/* ---------- table and alt text ---------- */

function scatterTable(data: ScatterData, prep: Prepared): Table {
  const grouped = prep.groups.length > 0;
  const value = (v: number) => (Number.isFinite(v) ? v : null);
  return {
    columns: [
      { key: 'label', label: 'Point', numeric: false },
      ...(grouped ? [{ key: 'group', label: 'Group', numeric: false }] : []),
      { key: 'x', label: data.xLabel, numeric: true },
      { key: 'y', label: data.yLabel, numeric: true },
    ],
    rows: data.points.map((p) => [p.label, ...(grouped ? [p.group ?? ''] : []), value(p.x), value(p.y)]),
  };
}

/** "Ada Vell", "Hob and Mab Sallow"-style lists of the points at an extreme, at most three named. */
function names(points: Point[]): string {
  const ls = points.map((p) => p.label);
  return ls.length > 3 ? `${joinWords(ls.slice(0, 3))} and ${ls.length - 3} more` : joinWords(ls);
}

function axisSentence(label: string, points: Point[], get: (p: Point) => number, fmt: (v: number) => string): string {
  const vs = points.map(get);
  const max = Math.max(...vs);
  const min = Math.min(...vs);
  if (max === min) return sentence(`${label}: all ${fmt(max)}`);
  const top = points.filter((p) => get(p) === max);
  const bottom = points.filter((p) => get(p) === min);
  return sentence(`${label}: highest ${names(top)} (${fmt(max)}), lowest ${names(bottom)} (${fmt(min)})`);
}

function scatterAlt(data: ScatterData, prep: Prepared, fx: (v: number) => string, fy: (v: number) => string): string {
  const n = prep.points.length;
  const parts = [
    `${formatNumber(n, 0)} ${n === 1 ? 'point' : 'points'}${prep.groups.length > 1 ? ` in ${prep.groups.length} groups` : ''}.`,
    axisSentence(data.xLabel, prep.points, (p) => p.x, fx),
    axisSentence(data.yLabel, prep.points, (p) => p.y, fy),
  ];
  const skipped = data.points.length - n;
  if (skipped > 0) parts.push(`${formatNumber(skipped, 0)} ${skipped === 1 ? 'point lacks' : 'points lack'} a value and ${skipped === 1 ? 'is' : 'are'} left out.`);
  return parts.join(' ');
}

/* ---------- notes ---------- */

/**
 * A note points at a point by its id, or failing that its label; a character
 * or word, at the point named after it. A point without both values is not
 * drawn: its note goes beside the chart. Chapters have no place here.
 */
function place(note: NoteAt, data: ScatterData, prep: Prepared): { point: Point } | Miss {
  const c = isDataAt(note) ? note.category : findNamed(note, data.points, (x) => [x.id, x.label, x.label.toLowerCase()])?.id;
  if (c === undefined) return 'absent';
  const point = prep.points.find((p) => p.id === c) ?? prep.points.find((p) => p.label === c);
  if (point) return { point };
  return data.points.some((p) => p.id === c || p.label === c) ? 'beside' : 'absent';
}

/* ---------- which points to name ---------- */

function median(vs: number[]): number {
  const s = [...vs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Points in order of how much they stand out: the highest and lowest on
 * each axis first, then by distance from the median point (each axis scaled
 * by its range), ties in data order.
 */
export function byProminence(points: readonly { x: number; y: number }[]): number[] {
  if (points.length === 0) return [];
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  const rx = Math.max(...xs) - Math.min(...xs) || 1;
  const ry = Math.max(...ys) - Math.min(...ys) || 1;
  const mx = median(xs);
  const my = median(ys);
  const far = points.map((p) => Math.hypot((p.x - mx) / rx, (p.y - my) / ry));
  const argBy = (f: (i: number) => number) => points.reduce((best, _, i) => (f(i) > f(best) ? i : best), 0);
  const ends = [argBy((i) => ys[i]), argBy((i) => xs[i]), argBy((i) => -ys[i]), argBy((i) => -xs[i])];
  const rest = points.map((_, i) => i).sort((a, b) => far[b] - far[a] || a - b);
  return [...new Set([...ends, ...rest])];
}

/** How many of the most prominent points "extremes" names, beyond the four axis ends. */
const EXTRA_EXTREMES = 3;

/* ---------- drawing ---------- */

const PAD = 12;

/** A point symbol of about equal area for each group: circle, square, diamond, triangles. */
function symbol(group: number, x: number, y: number, r: number): { tag: string; attrs: Record<string, number | string> } {
  switch (group % 5) {
    case 0:
      return { tag: 'circle', attrs: { cx: x, cy: y, r } };
    case 1: {
      const h = r * 0.886; // half-side of a square with the circle's area: r·√π / 2
      return { tag: 'rect', attrs: { x: x - h, y: y - h, width: 2 * h, height: 2 * h } };
    }
    case 2: {
      const d = r * 1.253; // half-diagonal of the same square
      return { tag: 'path', attrs: { d: `M${num(x)},${num(y - d)}L${num(x + d)},${num(y)}L${num(x)},${num(y + d)}L${num(x - d)},${num(y)}Z` } };
    }
    default: {
      const s = r * 1.347; // circumradius of an equilateral triangle with the circle's area
      const up = group % 5 === 3 ? 1 : -1;
      const a = y - up * s;
      const b = y + up * s * 0.5;
      return { tag: 'path', attrs: { d: `M${num(x)},${num(a)}L${num(x + s * 0.866)},${num(b)}L${num(x - s * 0.866)},${num(b)}Z` } };
    }
  }
}

/** Group names, each after its symbol in its colour, wrapped into rows within the width. */
function symbolLegend(groups: readonly string[], y: number, W: number, theme: Theme): Block {
  const items: LegendItem[] = groups.map((name, i) => ({ name, colour: seriesColour(theme, i).mark, symbol: (cx, cy) => symbol(i, cx, cy, 5) }));
  return legend(items, PAD, y, W - 2 * PAD, theme);
}

interface Ctx {
  data: ScatterData;
  prep: Prepared;
  opts: ScatterOptions;
  theme: Theme;
  notes: readonly Placed<{ point: Point }>[];
  fx: (v: number) => string;
  fy: (v: number) => string;
  width: number;
  narrow: boolean;
}

function drawScatter(ctx: Ctx, lane: boolean): { body: string; height: number; unplaced: number } {
  const { data, prep, opts, theme, width: W, narrow } = ctx;
  const small = theme.sizes.small;
  const parts: string[] = [];
  let y = PAD;
  const grouped = prep.groups.length > 1;
  const colourOf = (p: Point) => seriesColour(theme, p.group);

  if (grouped) {
    const lg = symbolLegend(prep.groups, y, W, theme);
    parts.push(lg.markup);
    y += lg.height + 4;
  }

  const headStyle = { style: serifStyle(theme, true), fill: theme.inkMuted, 'font-size': theme.sizes.axisTitle };
  const headY = y + theme.sizes.axisTitle;
  parts.push(textEl(truncateText(data.yLabel, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), { ...headStyle, x: PAD, y: headY, class: 'vt-axis-title' }));
  y = headY + 10;

  const mh = markerHeight(theme);
  const laneY = y + mh / 2;
  if (lane) y += mh + 10;

  const plotTop = y + 6;
  const plotH = narrow ? 250 : 320;
  const plotBottom = plotTop + plotH;
  const ys = prep.points.map((p) => p.y);
  const xs = prep.points.map((p) => p.x);
  const yAxis = valueAxis(ys, [plotBottom, plotTop], 'decimal', narrow ? 4 : 5, opts.zero);
  const yTicks = yAxis.ticks.map(tickFormatter(yAxis.ticks, 'decimal'));
  const tickW = Math.max(...yTicks.map((t) => textWidth(t, small)));
  const plotLeft = PAD + tickW + 8;
  const plotRight = W - PAD - 4;
  const xAxis = valueAxis(xs, [plotLeft, plotRight], 'decimal', narrow ? 4 : 6, opts.zero);
  const xTicks = xAxis.ticks.map(tickFormatter(xAxis.ticks, 'decimal'));

  const yTickYs = yAxis.ticks.map((t) => yAxis.at(t));
  parts.push(
    grid(
      [
        ...yTickYs.map((y) => ({ x1: plotLeft, x2: plotRight, y1: y, y2: y })),
        ...xAxis.ticks.map((t) => ({ x1: xAxis.at(t), x2: xAxis.at(t), y1: plotTop, y2: plotBottom })),
      ],
      theme,
    ),
  );
  parts.push(valueTicks(yTicks, yTickYs, plotLeft - 8, theme));
  const keep = thinEvenly(
    xAxis.ticks.map((t, i) => ({ at: xAxis.at(t), width: textWidth(xTicks[i], small) })),
    10,
  );
  parts.push(
    el(
      'g',
      { class: 'vt-x-ticks', fill: theme.inkMuted, 'font-size': small, 'text-anchor': 'middle' },
      keep.map((i) => textEl(xTicks[i], { x: xAxis.at(xAxis.ticks[i]), y: plotBottom + 8 + small })),
    ),
  );
  parts.push(
    el('g', { class: 'vt-axes', stroke: theme.axis, 'stroke-width': 1 }, [
      el('line', { x1: plotLeft, x2: plotRight, y1: plotBottom, y2: plotBottom }),
      el('line', { x1: plotLeft, x2: plotLeft, y1: plotTop, y2: plotBottom }),
    ]),
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

  // Points, then their names where they fit.
  const r = narrow ? 4 : 4.5;
  const at = (p: Point) => [xAxis.at(p.x), yAxis.at(p.y)] as const;
  const pointMarkup = prep.points.map((p) => {
    const [px, py] = at(p);
    const s = symbol(p.group, px, py, r);
    const group = grouped ? ` (${prep.groups[p.group]})` : '';
    return el(s.tag, { ...s.attrs, fill: colourOf(p).mark }, titleEl(`${p.label}${group}: ${data.xLabel} ${ctx.fx(p.x)}, ${data.yLabel} ${ctx.fy(p.y)}`));
  });
  parts.push(el('g', { class: 'vt-points', stroke: theme.paper, 'stroke-width': 1 }, pointMarkup));

  // Notes first, as markers beside their points where there is room; the rest in the lane above.
  const discs: Disc[] = prep.points.map((p) => {
    const [px, py] = at(p);
    return { x: px, y: py, r: r + 1 };
  });
  // Points drawn on the same spot share one name ("churchyard, night") and count as one obstacle.
  const spot = (i: number) => `${Math.round(discs[i].x)},${Math.round(discs[i].y)}`;
  const firstAt = new Map<string, number>();
  const rep = prep.points.map((_, i) => {
    if (!firstAt.has(spot(i))) firstAt.set(spot(i), i);
    return firstAt.get(spot(i))!;
  });
  const obstacles = discs.filter((_, i) => rep[i] === i);
  const bounds: Box = { x0: plotLeft + 2, y0: plotTop - small, x1: W - PAD, y1: plotBottom + 4 };
  const noteRequests: RingRequest[] = ctx.notes.map(({ note, point }) => ({ point: discs[rep[prep.points.indexOf(point)]], width: markerWidth(note.label, theme), height: mh }));
  const notePlaces = placeInRings(
    noteRequests,
    noteRequests.map((_, i) => i),
    obstacles,
    bounds,
  );
  const inline: string[] = [];
  const anchors: NoteAnchor[] = [];
  const lines: Segment[] = [];
  ctx.notes.forEach(({ note }, i) => {
    const pl = notePlaces[i];
    const d = noteRequests[i].point;
    if (pl) {
      if (pl.leaderTo) {
        inline.push(leaderLine(d, pl.leaderTo, theme));
        lines.push({ a: d, b: pl.leaderTo });
      }
      inline.push(noteInline(note, (pl.box.x0 + pl.box.x1) / 2, (pl.box.y0 + pl.box.y1) / 2, theme));
    } else {
      anchors.push({ note, x: d.x, y: d.y - r - 1 });
      lines.push({ a: { x: d.x, y: plotTop - 20 }, b: { x: d.x, y: d.y } });
    }
  });
  const unplaced = anchors.length;

  if (opts.labels !== 'none') {
    const prominence = byProminence(prep.points);
    const wanted = opts.labels === 'all' ? prominence : prominence.slice(0, 4 + EXTRA_EXTREMES);
    const order = [...new Set(wanted.map((i) => rep[i]))];
    const maxW = narrow ? 110 : 160;
    const texts = prep.points.map((_, i) =>
      rep[i] === i
        ? clipEnd(
            prep.points.filter((_, k) => rep[k] === i).map((p) => p.label).join(', '),
            maxW,
            small,
          )
        : '',
    );
    const requests: RingRequest[] = prep.points.map((_, i) => ({ point: discs[i], width: textWidth(texts[i], small), height: small + 2 }));
    const taken = notePlaces.flatMap((pl) => (pl ? [pl.box] : []));
    const placed = placeInRings(requests, order, obstacles, bounds, { taken, lines });
    parts.push(
      el(
        'g',
        { class: 'vt-point-labels', 'font-size': small },
        placed.flatMap((pl, i) => {
          if (pl === null) return [];
          const fill = grouped ? colourOf(prep.points[i]).text : theme.ink;
          return [
            pl.leaderTo ? leaderLine(discs[i], pl.leaderTo, theme) : '',
            textEl(texts[i], {
              x: pl.textX,
              y: pl.box.y0 + small * 0.85,
              'text-anchor': pl.anchor === 'start' ? undefined : pl.anchor,
              fill,
            }),
          ];
        }),
      ),
    );
  }
  if (inline.length) parts.push(el('g', { class: 'vt-notes' }, inline));
  if (lane) parts.push(notesInLane(anchors, laneY, plotLeft, plotRight, theme));

  return { body: parts.join(''), height: Math.ceil(xTitleY + PAD), unplaced };
}

/** A thin leader from the edge of a point towards a name or marker set away from it, stopping just short. */
function leaderLine(d: Disc, to: { x: number; y: number }, theme: Theme): string {
  const dx = to.x - d.x;
  const dy = to.y - d.y;
  const len = Math.hypot(dx, dy) || 1;
  return el('line', {
    class: 'vt-leader',
    x1: d.x + (dx / len) * d.r,
    y1: d.y + (dy / len) * d.r,
    x2: to.x - (dx / len) * 2,
    y2: to.y - (dy / len) * 2,
    stroke: theme.axis,
    'stroke-width': 0.75,
  });
}

export const scatter = defineChart({
  name: 'scatter',
  options: scatterOptions,
  prepare: (data: ScatterData) => prepare(data),
  empty: ({ data, prep }) => (prep.points.length > 0 ? null : data.points.length === 0 ? 'the dataset has no points.' : 'no point has both of its values.'),
  table: ({ data, prep }) => scatterTable(data, prep),
  place: (at, { data, prep }) => place(at, data, prep),
  alt: ({ data, prep }) => scatterAlt(data, prep, prep.fx, prep.fy),
  draw: ({ data, prep, opts, theme }, notes, { width, narrow }) => {
    const ctx: Ctx = { data, prep, opts, theme, notes, fx: prep.fx, fy: prep.fy, width, narrow };
    // Notes beside their points when they all fit there; a lane above the plot for those that do not.
    const out = drawScatter(ctx, false);
    return out.unplaced > 0 ? drawScatter(ctx, true) : out;
  },
});
