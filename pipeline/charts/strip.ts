/**
 * A dispersion strip: one row per term or character, a thin tick at every
 * occurrence along the text, chapter boundaries as light rules.
 */

import { z } from 'zod';
import type { DataAt, NoteAt, StripData, Table, TextAt } from './types.ts';
import { serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, findNamed, isDataAt, idOption } from './chart.ts';
import { el, num, textEl, textWidth, titleEl, truncateText } from './svg.ts';
import { formatNumber, formatPercent, joinWords, sentence } from './format.ts';
import { thinEvenly, thinGreedy } from './place.ts';
import { markerHeight, markerWidth, noteInline, notesInLane } from './furniture.ts';
import type { NoteAnchor } from './furniture.ts';

export const stripOptions = z.strictObject({
  counts: z
    .boolean()
    .default(true)
    .describe("Write each row's number of occurrences at its right end. Default: true."),
  id: idOption,
});

export type StripOptions = z.output<typeof stripOptions>;

interface Row {
  id: string;
  name: string;
  /** Finite positions clamped to 0..1, ascending. */
  positions: number[];
}

function clean(data: StripData): Row[] {
  return data.rows.map((r) => ({
    id: r.id,
    name: r.name,
    positions: r.positions.filter(Number.isFinite).map((p) => Math.min(1, Math.max(0, p))).sort((a, b) => a - b),
  }));
}

function boundariesOf(data: StripData): StripData['boundaries'] {
  return data.boundaries.filter((b) => Number.isFinite(b.at) && b.at >= 0 && b.at <= 1).sort((a, b) => a.at - b.at);
}

function emptyReason(rows: Row[]): string | null {
  if (rows.length === 0) return 'the dataset has no rows.';
  if (rows.every((r) => r.positions.length === 0)) return 'no row occurs anywhere in the text.';
  return null;
}

/* ---------- table and alt text ---------- */

const pct1 = (p: number) => Math.round(p * 1000) / 10;

function stripTable(data: StripData, rows: Row[]): Table {
  const bounds = boundariesOf(data);
  const before = bounds.length > 0 && bounds[0].at > 0;
  const spans = bounds.map((b, i) => [b.at, i + 1 < bounds.length ? bounds[i + 1].at : Infinity] as const);
  return {
    columns: [
      { key: 'name', label: 'Name', numeric: false },
      { key: 'occurrences', label: 'Occurrences', numeric: true },
      { key: 'first', label: 'First (% of text)', numeric: true },
      { key: 'last', label: 'Last (% of text)', numeric: true },
      ...(before ? [{ key: 'before', label: `Before ${bounds[0].title}`, numeric: true }] : []),
      ...bounds.map((b, i) => ({ key: `chapter-${i + 1}`, label: b.title, numeric: true })),
    ],
    rows: rows.map((r) => {
      const ps = r.positions;
      const cells: (string | number | null)[] = [r.name, ps.length, ps.length ? pct1(ps[0]) : null, ps.length ? pct1(ps[ps.length - 1]) : null];
      if (before) cells.push(ps.filter((p) => p < bounds[0].at).length);
      for (const [a, b] of spans) cells.push(ps.filter((p) => p >= a && p < b).length);
      return cells;
    }),
  };
}

const pct0 = (p: number) => formatPercent(Math.round(p * 100) / 100);

function spread(r: Row, withText: boolean): string {
  const ps = r.positions;
  if (ps.length === 0) return 'not at all';
  const times = ps.length === 1 ? 'once' : ps.length === 2 ? 'twice' : `${formatNumber(ps.length, 0)} times`;
  const where = ps.length === 1 || pct0(ps[0]) === pct0(ps[ps.length - 1]) ? `at ${pct0(ps[0])}` : `between ${pct0(ps[0])} and ${pct0(ps[ps.length - 1])}`;
  return `${times}, ${where}${withText ? ' of the text' : ''}`;
}

function stripAlt(rows: Row[]): string {
  const counts = rows.map((r) => r.positions.length);
  const max = Math.max(...counts);
  const min = Math.min(...counts);
  const top = rows.filter((r) => r.positions.length === max);
  const bottom = rows.filter((r) => r.positions.length === min);
  let main: string;
  if (rows.length === 1) main = `${rows[0].name} occurs ${spread(rows[0], true)}`;
  else if (max === min) main = `All ${rows.length} rows occur equally often, ${formatNumber(max, 0)} times each`;
  else {
    const names = (rs: Row[]) => (rs.length > 3 ? `${joinWords(rs.slice(0, 3).map((r) => r.name))} and ${rs.length - 3} more` : joinWords(rs.map((r) => r.name)));
    const mostLead = top.length === 1 ? `${top[0].name} occurs most often, ${spread(top[0], true)}` : `${names(top)} occur most often, ${formatNumber(max, 0)} times each`;
    const least = bottom.length === 1 ? `${bottom[0].name} least often, ${spread(bottom[0], false)}` : `${names(bottom)} least often, ${min === 0 ? 'not at all' : `${formatNumber(min, 0)} times each`}`;
    main = `${mostLead}; ${least}`;
  }
  return sentence(main);
}

/* ---------- notes ---------- */

/** A note on a row (by id, then name), at a position 0..1, or both. */
interface Target {
  row: number | null;
  x: number | null;
}

/** A chapter is its boundary; a segment, its middle (when the measure counted by segments); a character or word, its row. */
function inData(at: TextAt, data: StripData): DataAt | Miss {
  if ('chapter' in at) return { x: data.boundaries[at.chapter - 1]?.at ?? 0 };
  if ('segment' in at) return at.of && at.segment <= at.of ? { x: (at.segment - 0.5) / at.of } : 'absent';
  const r = findNamed(at, data.rows, (x) => [x.id, x.name]);
  return r ? { category: r.id } : 'absent';
}

function place(note: NoteAt, data: StripData, rows: Row[]): Target | Miss {
  const at = isDataAt(note) ? note : inData(note, data);
  if (typeof at === 'string') return at;
  let row: number | null = null;
  if (at.category !== undefined) {
    row = rows.findIndex((r) => r.id === at.category);
    if (row === -1) row = rows.findIndex((r) => r.name === at.category);
    if (row === -1) return 'absent';
  }
  const x = at.x ?? null;
  if (x !== null && (!Number.isFinite(x) || x < 0 || x > 1)) return 'absent';
  if (row === null && x === null) return 'absent';
  return { row, x };
}

/* ---------- drawing ---------- */

const PAD = 12;

interface Ctx {
  data: StripData;
  rows: Row[];
  opts: StripOptions;
  theme: Theme;
  targets: readonly Placed<Target>[];
  width: number;
  narrow: boolean;
}

function drawStrip(ctx: Ctx): { body: string; height: number } {
  const { data, rows, opts, theme, width: W, narrow } = ctx;
  const fs = theme.sizes.label;
  const small = theme.sizes.small;
  const parts: string[] = [];
  let y = PAD;

  const laneTargets = ctx.targets.filter((t) => t.x !== null);
  const inlineTargets = ctx.targets.filter((t) => t.x === null);
  const mh = markerHeight(theme);
  const laneY = y + mh / 2;
  if (laneTargets.length) y += mh + 12;

  // Columns: row labels | strip | counts | inline notes.
  const countTexts = rows.map((r) => formatNumber(r.positions.length, 0));
  const countW = opts.counts ? Math.max(...countTexts.map((t) => textWidth(t, small))) + 10 : 0;
  const noteSpace = Math.max(
    0,
    ...rows.map((_, ri) => inlineTargets.filter((t) => t.row === ri).reduce((s, t) => s + markerWidth(t.note.label, theme) + 4, 0)),
  );
  const labelMax = W * (narrow ? 0.3 : 0.24);
  const labels = rows.map((r) => truncateText(r.name, labelMax, fs));
  const labelW = Math.min(labelMax, Math.max(...labels.map((l) => textWidth(l, fs))));
  const plotLeft = PAD + labelW + 10;
  const plotRight = W - PAD - countW - (noteSpace ? noteSpace + 4 : 0);
  const xAt = (p: number) => plotLeft + p * (plotRight - plotLeft);

  // Chapter labels, centred on their chapters, thinned when crowded.
  const bounds = boundariesOf(data);
  const labelY = y + small;
  const plotTop = labelY + 8;
  const rowH = narrow ? 22 : 24;
  const plotBottom = plotTop + rows.length * rowH;
  const mids = bounds.map((b, i) => (b.at + (i + 1 < bounds.length ? bounds[i + 1].at : 1)) / 2);
  const keep = new Set(
    thinGreedy(
      bounds.map((b, i) => ({ at: xAt(mids[i]), width: textWidth(b.label, small) })),
      6,
    ),
  );
  parts.push(
    el(
      'g',
      { class: 'vt-chapters', 'font-size': small, fill: theme.inkMuted, 'text-anchor': 'middle' },
      bounds.map((b, i) =>
        el('g', { class: 'vt-chapter' }, [
          titleEl(b.title),
          b.at > 0 && b.at < 1 ? el('line', { x1: xAt(b.at), x2: xAt(b.at), y1: plotTop - 6, y2: plotBottom, stroke: theme.rule, 'stroke-width': 1 }) : '',
          keep.has(i) ? textEl(b.label, { x: xAt(mids[i]), y: labelY }) : '',
        ]),
      ),
    ),
  );
  // Start and end of the text.
  parts.push(
    el('g', { class: 'vt-edges', stroke: theme.axis, 'stroke-width': 1 }, [
      el('line', { x1: plotLeft, x2: plotLeft, y1: plotTop - 6, y2: plotBottom }),
      el('line', { x1: plotRight, x2: plotRight, y1: plotTop - 6, y2: plotBottom }),
    ]),
  );

  // Rows.
  const half = narrow ? 6 : 7;
  const mark = theme.series[0].mark;
  const rowMarkup = rows.map((r, ri) => {
    const cy = plotTop + ri * rowH + rowH / 2;
    const seen = new Set<string>();
    let d = '';
    for (const p of r.positions) {
      const x = num(xAt(p));
      if (seen.has(x)) continue;
      seen.add(x);
      d += `M${x},${num(cy - half)}V${num(cy + half)}`;
    }
    const g: string[] = [titleEl(`${r.name}: ${spread(r, true)}`)];
    g.push(textEl(labels[ri], { x: plotLeft - 10, y: cy + fs * 0.35, 'text-anchor': 'end' }));
    g.push(el('line', { x1: plotLeft, x2: plotRight, y1: cy, y2: cy, stroke: theme.rule, 'stroke-width': 1 }));
    if (d) g.push(el('path', { d, fill: 'none', stroke: mark, 'stroke-width': narrow ? 1 : 1.25 }));
    let nx = plotRight + 10;
    if (opts.counts) {
      g.push(textEl(countTexts[ri], { x: nx, y: cy + small * 0.35, 'font-size': small, fill: theme.inkMuted }));
      nx += countW;
    }
    for (const t of inlineTargets.filter((tt) => tt.row === ri)) {
      const w = markerWidth(t.note.label, theme);
      g.push(noteInline(t.note, nx + w / 2, cy, theme));
      nx += w + 4;
    }
    return el('g', { class: 'vt-strip-row', 'data-row': r.id }, g);
  });
  parts.push(el('g', { class: 'vt-rows' }, rowMarkup));

  // Position axis: share of the text.
  const stops = narrow ? [0, 0.5, 1] : [0, 0.25, 0.5, 0.75, 1];
  const keepStops = thinEvenly(
    stops.map((s) => ({ at: xAt(s), width: textWidth(formatPercent(s), small) })),
    8,
  );
  parts.push(
    el(
      'g',
      { class: 'vt-ticks', 'font-size': small, fill: theme.inkMuted, 'text-anchor': 'middle' },
      keepStops.map((i) => textEl(formatPercent(stops[i]), { x: xAt(stops[i]), y: plotBottom + 6 + small })),
    ),
  );
  const titleY = plotBottom + 6 + small + 8 + theme.sizes.axisTitle;
  parts.push(
    textEl(truncateText(`Position in the text (% of ${formatNumber(data.totalTokens, 0)} words)`, W - 2 * PAD, theme.sizes.axisTitle, 'serif'), {
      x: (plotLeft + plotRight) / 2,
      y: titleY,
      'text-anchor': 'middle',
      'font-size': theme.sizes.axisTitle,
      style: serifStyle(theme, true),
      fill: theme.inkMuted,
      class: 'vt-axis-title',
    }),
  );

  // Notes with a position: in the lane above, leaders down to their row or across all rows.
  const anchors: NoteAnchor[] = laneTargets.map((t) =>
    t.row === null
      ? { note: t.note, x: xAt(t.x as number), y: plotTop, ruleTo: plotBottom }
      : { note: t.note, x: xAt(t.x as number), y: plotTop + t.row * rowH + rowH / 2 },
  );
  parts.push(notesInLane(anchors, laneY, plotLeft, plotRight, theme));

  return { body: parts.join(''), height: Math.ceil(titleY + PAD) };
}

export const strip = defineChart({
  name: 'strip',
  options: stripOptions,
  prepare: (data: StripData) => clean(data),
  empty: ({ prep }) => emptyReason(prep),
  table: ({ data, prep }) => stripTable(data, prep),
  place: (at, { data, prep }) => place(at, data, prep),
  alt: ({ prep }) => stripAlt(prep),
  draw: ({ data, prep, opts, theme }, targets, { width, narrow }) => drawStrip({ data, rows: prep, opts, theme, targets, width, narrow }),
});
