/**
 * A text map: the running text set as type, wrapped to the width, each span
 * that carries a value marked by a tint laid behind it (and, if asked, by its
 * type size or weight). Words stay in the ink colour and the tints are kept
 * light enough that ink on them reaches 4.5:1 (WCAG 2.2, SC 1.4.3); see
 * diverging.ts for the scale. A legend of the scale heads the panel.
 */

import { z } from 'zod';
import type { NoteAt, PinnedNote, Table, TextmapData } from './types.ts';
import { serifStyle } from './theme.ts';
import type { Theme } from './theme.ts';
import type { Miss, Placed } from './chart.ts';
import { defineChart, holdsWord, isDataAt, idOption } from './chart.ts';
import { el, textEl, textWidth, titleEl, truncateText, wrapText } from './svg.ts';
import { decimalsFor, formatNumber, joinWords, sentence } from './format.ts';
import { BOLD_FACTOR, collapseSpace } from './clip.ts';
import { valueScale } from './diverging.ts';
import type { ValueScale } from './diverging.ts';
import { flowLines } from './flow.ts';
import type { FlowItem } from './flow.ts';
import { markerHeight, markerWidth, noteInline } from './furniture.ts';

export const textmapOptions = z.strictObject({
  encode: z
    .enum(['colour', 'size', 'weight'])
    .default('colour')
    .describe(
      'How a value shows: "colour" lays a tint behind the span (blue above 0, vermillion below, stronger further from 0); "size" adds type that grows with the distance from 0; "weight" adds bold type for values in the outer half of the scale. Default: "colour".',
    ),
  maxWords: z
    .number()
    .int()
    .min(10)
    .max(5000)
    .default(400)
    .describe('Most words set, to keep the panel legible; a longer text is cut there with an ellipsis, and the table still lists every span with a value. Default: 400.'),
  id: idOption,
});

export type TextmapOptions = z.output<typeof textmapOptions>;

interface Span {
  text: string;
  value: number | null;
  /** Paragraph number, from 1. */
  paragraph: number;
}

const HAS_WORD = /[\p{L}\p{N}]/u;

function clean(data: TextmapData): Span[] {
  const breaks = new Set((data.breaks ?? []).filter((b) => Number.isInteger(b) && b > 0));
  let paragraph = 1;
  return data.spans.map((s, i) => {
    if (breaks.has(i)) paragraph++;
    const v = s.value;
    return { text: String(s.text ?? ''), value: typeof v === 'number' && Number.isFinite(v) ? v : null, paragraph };
  });
}

/** The dataset's domain when it is two finite numbers, else the range of the values (or 0..1). */
function domainOf(data: TextmapData, values: number[]): [number, number] {
  const d = data.domain;
  if (Array.isArray(d) && d.length === 2 && d.every(Number.isFinite) && d[0] !== d[1]) return [d[0], d[1]];
  if (values.length === 0) return [0, 1];
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  return lo === hi ? [Math.min(0, lo), Math.max(0, hi, lo === 0 ? 1 : 0)] : [lo, hi];
}

/* ---------- pieces of type ---------- */

type Atom =
  | { kind: 'word'; text: string; span: number; value: number | null; breakBefore: boolean; paragraph: boolean }
  | { kind: 'note'; note: PinnedNote; span: number }
  | { kind: 'more' };

interface Pieces {
  atoms: Atom[];
  /** Words set, and in the whole text. */
  wordsSet: number;
  wordsTotal: number;
  /** Spans set in full: every span with an index below this. */
  spansSet: number;
}

/** A note points at a span by its index (at.x); it is drawn when that span is set in full. */
interface Target {
  span: number;
}

/** The text cut into pieces at white space, up to `maxWords` words, with note markers after their spans. */
function pieces(spans: Span[], maxWords: number, notes: readonly Placed<Target>[]): Pieces {
  const atoms: Atom[] = [];
  let words = 0;
  let total = 0;
  let spansSet = spans.length;
  let space = false;
  let cut = false;
  /** Whether the run of pieces since the last white space has been counted as a word. */
  let counted = false;
  spans.forEach((s, i) => {
    const parts = s.text.split(/(\s+)/).filter((p) => p !== '');
    const paraStart = i > 0 && s.paragraph !== spans[i - 1].paragraph;
    let firstOfSpan = true;
    for (const p of parts) {
      if (/^\s+$/.test(p)) {
        space = true;
        continue;
      }
      // A word is a run of pieces between white space that holds a letter or digit.
      if (space || (firstOfSpan && paraStart)) counted = false;
      const newWord = !counted && HAS_WORD.test(p);
      if (newWord) {
        total++;
        counted = true;
      }
      if (!cut && newWord && words === maxWords) {
        cut = true;
        spansSet = Math.min(spansSet, i);
      }
      if (cut) {
        space = false;
        continue;
      }
      if (newWord) words++;
      const paragraph = firstOfSpan && paraStart && atoms.length > 0;
      const prev = atoms[atoms.length - 1];
      // Plain pieces with no space between them are set as one ("almanac" + "," → "almanac,"), so
      // their letters keep the font's own spacing.
      if (!space && !paragraph && s.value === null && prev?.kind === 'word' && prev.value === null) prev.text += p;
      else atoms.push({ kind: 'word', text: p, span: i, value: s.value, breakBefore: space || paragraph, paragraph });
      space = false;
      firstOfSpan = false;
    }
    if (!cut) for (const n of notes.filter((t) => t.span === i)) atoms.push({ kind: 'note', note: n.note, span: i });
  });
  if (cut) atoms.push({ kind: 'more' });
  return { atoms, wordsSet: words, wordsTotal: total, spansSet };
}

/* ---------- table and alt text ---------- */

function textmapTable(data: TextmapData, spans: Span[]): Table {
  return {
    columns: [
      { key: 'span', label: 'Span', numeric: true },
      { key: 'paragraph', label: 'Paragraph', numeric: true },
      { key: 'text', label: 'Text', numeric: false },
      { key: 'value', label: data.valueLabel, numeric: true },
    ],
    rows: spans.flatMap((s, i) => (s.value === null ? [] : [[i + 1, s.paragraph, collapseSpace(s.text), s.value]])),
  };
}

function quoted(s: string): string {
  return `\u201C${collapseSpace(s)}\u201D`;
}

/** "“glad”", "“glad” and “eager”", with at most three distinct texts named. */
function namedSpans(spans: Span[]): string {
  const distinct = [...new Set(spans.map((s) => collapseSpace(s.text)))];
  return distinct.length > 3 ? `${joinWords(distinct.slice(0, 3).map(quoted))} and ${distinct.length - 3} more` : joinWords(distinct.map(quoted));
}

function textmapAlt(data: TextmapData, spans: Span[], p: Pieces, scale: ValueScale, fmt: (v: number) => string): string {
  const valued = spans.filter((s) => s.value !== null);
  const words = (n: number) => `${formatNumber(n, 0)} ${n === 1 ? 'word' : 'words'}`;
  let main: string;
  if (valued.length === 0) main = `${data.valueLabel}: no span of the ${words(p.wordsTotal)} carries a value`;
  else {
    const values = valued.map((s) => s.value as number);
    const max = Math.max(...values);
    const min = Math.min(...values);
    const top = valued.filter((s) => s.value === max);
    const bottom = valued.filter((s) => s.value === min);
    const count = `${formatNumber(valued.length, 0)} of ${formatNumber(spans.length, 0)} spans carry a value`;
    if (max === min) main = `${data.valueLabel}: ${count}, all ${fmt(max)}`;
    else if (scale.diverging && max > 0 && min < 0)
      main = `${data.valueLabel}: ${count}; the most positive is ${namedSpans(top)} (${fmt(max)}), the most negative ${namedSpans(bottom)} (${fmt(min)})`;
    else main = `${data.valueLabel}: ${count}; the highest is ${namedSpans(top)} (${fmt(max)}), the lowest ${namedSpans(bottom)} (${fmt(min)})`;
  }
  const parts = [sentence(main)];
  if (p.wordsSet < p.wordsTotal) parts.push(`The panel sets the first ${words(p.wordsSet)} of ${formatNumber(p.wordsTotal, 0)}; the table lists every span with a value.`);
  return parts.join(' ');
}

/* ---------- notes ---------- */

/** A note points at a span by its index (at.x), or a word at the first span that holds it. */
function place(at: NoteAt, spans: readonly Span[], spansSet: number): Target | Miss {
  const x = isDataAt(at) ? at.x : 'word' in at ? spans.findIndex((s) => holdsWord(s.text, at.word)) : undefined;
  if (x === undefined || !Number.isInteger(x) || x < 0 || x >= spans.length) return 'absent';
  return x < spansSet ? { span: x } : 'beside';
}

/* ---------- drawing ---------- */

const PAD = 12;
/** Room between a word and the edge of its tint. */
const PAD_X = 2.5;

interface Ctx {
  data: TextmapData;
  spans: Span[];
  pieces: Pieces;
  opts: TextmapOptions;
  scale: ValueScale;
  fmt: (v: number) => string;
  theme: Theme;
  width: number;
  narrow: boolean;
}

interface Look {
  size: number;
  bold: boolean;
}

/** Type size and weight of a word carrying `value`, by the chosen encoding. */
function lookOf(value: number | null, ctx: Ctx, base: number): Look {
  if (value === null) return { size: base, bold: false };
  const s = ctx.scale.strength(value);
  if (ctx.opts.encode === 'size') return { size: Math.round(base * (1 + 0.5 * s) * 2) / 2, bold: false };
  if (ctx.opts.encode === 'weight') return { size: base, bold: s >= 0.5 };
  return { size: base, bold: false };
}

function legendBlock(ctx: Ctx, y0: number, base: number): { markup: string; height: number } {
  const { theme, scale, narrow } = ctx;
  const small = theme.sizes.small;
  const parts: string[] = [];
  let y = y0 + theme.sizes.axisTitle;
  parts.push(
    textEl(truncateText(ctx.data.valueLabel, ctx.width - 2 * PAD, theme.sizes.axisTitle, 'serif'), {
      class: 'vt-axis-title',
      x: PAD,
      y,
      'font-size': theme.sizes.axisTitle,
      style: serifStyle(theme, true),
      fill: theme.inkMuted,
    }),
  );
  const [lo, hi] = scale.domain;
  const barW = narrow ? 200 : 280;
  const x0 = PAD + small; // room for a tick label centred on the left end
  const at = (v: number) => (hi === lo ? x0 + barW / 2 : x0 + ((v - lo) / (hi - lo)) * barW);
  const stops = scale.diverging ? [lo, lo / 2, 0, hi / 2, hi] : [lo, (lo + hi) / 2, hi];

  // Samples of the type, above the bar, when size or weight carries the value too.
  if (ctx.opts.encode !== 'colour') {
    const looks = stops.map((v) => lookOf(v, ctx, base));
    const tallest = Math.max(...looks.map((l) => l.size));
    y += 8 + tallest * 0.95;
    parts.push(
      el(
        'g',
        { class: 'vt-legend-samples', 'text-anchor': 'middle', style: serifStyle(theme) },
        stops.map((v, i) => textEl('Aa', { x: at(v), y, 'font-size': looks[i].size, 'font-weight': looks[i].bold ? 700 : undefined })),
      ),
    );
  }
  const barY = y + 8;
  const steps = 40;
  const cells: string[] = [];
  for (let k = 0; k < steps; k++) {
    const v = lo + ((k + 0.5) / steps) * (hi - lo);
    cells.push(el('rect', { x: x0 + (k * barW) / steps, y: barY, width: barW / steps + 0.3, height: 12, fill: scale.fill(v) }));
  }
  parts.push(el('g', { class: 'vt-legend-bar' }, cells));
  parts.push(el('rect', { x: x0, y: barY, width: barW, height: 12, fill: 'none', stroke: theme.axis, 'stroke-width': 1 }));
  const tickY = barY + 12 + 6 + small;
  const tickStops = scale.diverging ? [lo, 0, hi] : [lo, hi];
  parts.push(
    el(
      'g',
      { class: 'vt-ticks', 'font-size': small, fill: theme.inkMuted, 'text-anchor': 'middle' },
      tickStops.map((v) => el('line', { x1: at(v), x2: at(v), y1: barY + 12, y2: barY + 16, stroke: theme.axis, 'stroke-width': 1 }) + textEl(ctx.fmt(v), { x: at(v), y: tickY })),
    ),
  );
  return { markup: el('g', { class: 'vt-legend' }, parts), height: tickY - y0 };
}

function drawTextmap(ctx: Ctx): { body: string; height: number } {
  const { theme, width: W, narrow, pieces: p, spans } = ctx;
  const base = narrow ? 15 : 16;
  const parts: string[] = [];
  let y = PAD;
  const lg = legendBlock(ctx, y, base);
  parts.push(lg.markup);
  y += lg.height + 16;

  // Sizes and widths of the pieces, then the lines.
  const looks = p.atoms.map((a) => (a.kind === 'word' ? lookOf(a.value, ctx, base) : { size: base, bold: false }));
  const space = textWidth(' ', base, 'serif');
  const items: FlowItem[] = p.atoms.map((a, i) => {
    if (a.kind === 'note') return { width: markerWidth(a.note.label, theme), breakBefore: false, spaceBefore: 4, paragraph: false };
    if (a.kind === 'more') return { width: textWidth('\u2026', base, 'serif'), breakBefore: true, spaceBefore: space, paragraph: false };
    const w = textWidth(a.text, looks[i].size, 'serif') * (looks[i].bold ? BOLD_FACTOR : 1);
    const tinted = a.value !== null;
    const prev = p.atoms[i - 1];
    // Two tinted pieces glued together share an edge; a plain one after a tint keeps a hair of room.
    const glueGap = prev && prev.kind === 'word' && (prev.value !== null) !== tinted ? 1 : 0;
    return { width: w + (tinted ? 2 * PAD_X : 0), breakBefore: a.breakBefore, spaceBefore: a.breakBefore ? space : glueGap, paragraph: a.paragraph };
  });
  const left = PAD;
  const lines = flowLines(items, W - 2 * PAD);

  const lineMarkup: string[] = [];
  for (const line of lines) {
    if (line.paragraph && lineMarkup.length) y += base * 0.7;
    const tallest = Math.max(base, ...line.items.map((it) => looks[it.index].size));
    const baseline = y + 5 + tallest * 0.92;
    const g: string[] = [];
    for (const it of line.items) {
      const a = p.atoms[it.index];
      const w = items[it.index].width;
      const cx = left + it.x + w / 2;
      if (a.kind === 'note') {
        g.push(noteInline(a.note, cx, baseline - base * 0.32, theme));
        continue;
      }
      if (a.kind === 'more') {
        g.push(textEl('\u2026', { x: cx, y: baseline, fill: theme.inkMuted }));
        continue;
      }
      const look = looks[it.index];
      // Widths are estimated at build time; the reader's font may run wider or narrower. Holding
      // each word to its estimated length keeps the spaces between words whatever font is used.
      const glyphs = a.value === null ? w : w - 2 * PAD_X;
      const attrs = {
        x: cx,
        y: baseline,
        'font-size': look.size === base ? undefined : look.size,
        'font-weight': look.bold ? 700 : undefined,
        textLength: glyphs > 0 ? Math.round(glyphs * 100) / 100 : undefined,
        lengthAdjust: glyphs > 0 ? 'spacingAndGlyphs' : undefined,
      };
      if (a.value === null) {
        g.push(textEl(a.text, attrs));
        continue;
      }
      const s = spans[a.span];
      g.push(
        el('g', { class: 'vt-span', 'data-span': a.span }, [
          titleEl(`${collapseSpace(s.text)}: ${ctx.fmt(a.value)}`),
          el('rect', { x: left + it.x, y: baseline - look.size * 0.8 - 1, width: w, height: look.size * 1.1 + 2, rx: 2, fill: ctx.scale.fill(a.value) }),
          textEl(a.text, { ...attrs, fill: theme.ink }),
        ]),
      );
    }
    lineMarkup.push(el('g', { class: 'vt-line-of-text' }, g));
    y = baseline + tallest * 0.3 + Math.max(5, (markerHeight(theme) - tallest * 1.2) / 2);
  }
  parts.push(el('g', { class: 'vt-text', 'text-anchor': 'middle', 'font-size': base, style: serifStyle(theme) }, lineMarkup));

  if (p.wordsSet < p.wordsTotal) {
    const small = theme.sizes.small;
    const said = `First ${formatNumber(p.wordsSet, 0)} of ${formatNumber(p.wordsTotal, 0)} words; the table lists every span with a value.`;
    const wrapped = wrapText(said, W - 2 * PAD, small, 2).lines;
    y += 6;
    parts.push(
      el(
        'g',
        { class: 'vt-more', 'font-size': small, fill: theme.inkMuted },
        wrapped.map((line) => textEl(line, { x: PAD, y: (y += small + 4) })),
      ),
    );
  }
  return { body: parts.join(''), height: Math.ceil(y + PAD) };
}

export const textmap = defineChart({
  name: 'textmap',
  options: textmapOptions,
  prepare: (data: TextmapData, opts, theme) => {
    const spans = clean(data);
    const values = spans.flatMap((s) => (s.value === null ? [] : [s.value]));
    const scale = valueScale(domainOf(data, values), theme);
    const decimals = decimalsFor([...values, ...scale.domain]);
    // The pieces with the notes drawn, made once for the alt text and both layouts.
    const set = new WeakMap<readonly Placed<Target>[], Pieces>();
    const piecesWith = (notes: readonly Placed<Target>[]): Pieces => {
      if (!set.has(notes)) set.set(notes, pieces(spans, opts.maxWords, notes));
      return set.get(notes)!;
    };
    return { spans, spansSet: piecesWith([]).spansSet, piecesWith, scale, fmt: (v: number) => formatNumber(v, decimals) };
  },
  empty: ({ prep }) => (prep.spans.every((s) => s.text.trim() === '') ? 'the dataset has no text.' : null),
  table: ({ data, prep }) => textmapTable(data, prep.spans),
  place: (at, { prep }) => place(at, prep.spans, prep.spansSet),
  alt: ({ data, prep }, notes) => textmapAlt(data, prep.spans, prep.piecesWith(notes), prep.scale, prep.fmt),
  draw: ({ data, opts, theme, prep }, notes, { width, narrow }) =>
    drawTextmap({ data, spans: prep.spans, pieces: prep.piecesWith(notes), opts, scale: prep.scale, fmt: prep.fmt, theme, width, narrow }),
});
