/**
 * The furniture of a chart, as maps and printed figures call what frames the
 * data: the legend (key) of the series or groups, and the curators' notes.
 *
 * Legends. Swatches (or symbols) and names, set in rows within a width and
 * wrapped when a row is full. Used when a chart has several series or groups
 * and cannot name them directly.
 *
 * Notes. A small numbered marker at the note's target, either right beside
 * it (when there is room in its row) or in a lane above or below the plot,
 * joined to the target by a thin dotted leader, so markers never sit on top
 * of the data. The note's words go into the alt text and the marker's
 * `<title>`.
 */

import type { PinnedNote } from './types.ts';
import type { Theme } from './theme.ts';
import { serifStyle } from './theme.ts';
import { el, num, textEl, textWidth, titleEl, truncateText } from './svg.ts';
import { sentence } from './format.ts';
import { spreadApart } from './place.ts';

/** Markup and the height it takes. */
export interface Block {
  markup: string;
  height: number;
}

/* ---------- legends ---------- */

export interface LegendItem {
  name: string;
  /** Colour of the swatch or symbol (a `mark` colour). */
  colour: string;
  /** A symbol instead of the square swatch: its element centred on (cx, cy). */
  symbol?: (cx: number, cy: number) => { tag: string; attrs: Record<string, number | string> };
  /** Tooltip of the item. */
  title?: string;
}

export interface LegendStyle {
  /** Width kept for the swatch or symbol, before the name. Default 12. */
  swatch?: number;
  /** Height of a row. Default: the label size + 8. */
  lineHeight?: number;
  /** "baseline": names on a baseline one type size below the row's top, symbols centred on the x-height; "middle": names and symbols centred in the row. Default "baseline". */
  align?: 'baseline' | 'middle';
  /** Cut long names to half the width (at least 60 units). Default true. */
  truncate?: boolean;
}

/** Swatches and names from (x, y) (top-left), wrapping at `maxWidth`. */
export function legend(items: readonly LegendItem[], x: number, y: number, maxWidth: number, theme: Theme, style: LegendStyle = {}): Block {
  const fs = theme.sizes.label;
  const swatch = style.swatch ?? 12;
  const lineHeight = style.lineHeight ?? fs + 8;
  const middle = style.align === 'middle';
  const parts: string[] = [];
  let cx = x;
  let row = 0;
  for (const item of items) {
    const name = style.truncate === false ? item.name : truncateText(item.name, Math.max(60, maxWidth * 0.5), fs);
    const w = swatch + 6 + textWidth(name, fs);
    if (cx > x && cx + w > x + maxWidth) {
      row++;
      cx = x;
    }
    const top = y + row * lineHeight;
    const baseline = middle ? top + lineHeight / 2 + fs * 0.35 : top + fs;
    const cy = middle ? top + lineHeight / 2 : baseline - fs * 0.35;
    let mark: string;
    if (item.symbol) {
      const s = item.symbol(cx + swatch / 2, cy);
      mark = el(s.tag, { ...s.attrs, fill: item.colour });
    } else mark = el('rect', { x: cx, y: baseline - swatch + 1, width: swatch, height: swatch, fill: item.colour });
    parts.push(el('g', { class: 'vt-legend-item' }, [item.title ? titleEl(item.title) : '', mark, textEl(name, { x: cx + (swatch + 6), y: baseline })]));
    cx += w + 18;
  }
  return {
    markup: items.length ? el('g', { class: 'vt-legend' }, parts) : '',
    height: items.length ? (row + 1) * lineHeight : 0,
  };
}

/* ---------- note markers ---------- */

/** Height of a marker; also the height of the lane that holds markers above a plot. */
export function markerHeight(theme: Theme): number {
  return theme.sizes.note + 8;
}

/** Width of the marker for `label`: a circle for one or two characters, a pill beyond. */
export function markerWidth(label: string, theme: Theme): number {
  return Math.max(markerHeight(theme), textWidth(label, theme.sizes.note, 'serif') + 10);
}

/** "Note 1: …" for the alt text and tooltips. */
export function noteSentence(note: PinnedNote): string {
  return sentence(`Note ${note.label}: ${note.text}`);
}

/** All notes as sentences, in order, separated by spaces. */
export function noteSentences(notes: readonly PinnedNote[]): string {
  return notes.map(noteSentence).join(' ');
}

/** The marker itself, centred on (cx, cy). */
function markerShape(note: PinnedNote, cx: number, cy: number, theme: Theme): string {
  const h = markerHeight(theme);
  const w = markerWidth(note.label, theme);
  return (
    el('rect', { x: cx - w / 2, y: cy - h / 2, width: w, height: h, rx: h / 2, fill: theme.ink }) +
    textEl(note.label, {
      x: cx,
      y: cy + theme.sizes.note * 0.35,
      'text-anchor': 'middle',
      'font-size': theme.sizes.note,
      'font-weight': 600,
      style: serifStyle(theme),
      fill: theme.paper,
    })
  );
}

/** A marker placed directly at (cx, cy): for targets with free room beside them. */
export function noteInline(note: PinnedNote, cx: number, cy: number, theme: Theme): string {
  return el('g', { class: 'vt-note', 'data-note': note.label }, [titleEl(noteSentence(note)), markerShape(note, cx, cy, theme)]);
}

/* ---------- lanes of notes ---------- */

export interface NoteAnchor {
  note: PinnedNote;
  /** Target point in chart coordinates. */
  x: number;
  y: number;
  /** When set, the leader runs down to this y instead of stopping at `y` (a rule across the plot). */
  ruleTo?: number;
}

/** Where the markers of a lane go across: as near their targets as they can, apart by the widest marker, within [lo, hi]. */
function laneXs(anchors: readonly NoteAnchor[], lo: number, hi: number, theme: Theme): number[] {
  const widths = anchors.map((a) => markerWidth(a.note.label, theme));
  return spreadApart(
    anchors.map((a) => a.x),
    Math.max(...widths) + 4,
    lo + widths[0] / 2,
    hi - widths[widths.length - 1] / 2,
  );
}

/**
 * Markers in a lane centred on `laneY` above their targets, spread apart
 * within [lo, hi], each joined to its target by a dotted leader and a small
 * dot (or a rule down across the plot).
 */
export function notesInLane(anchors: readonly NoteAnchor[], laneY: number, lo: number, hi: number, theme: Theme): string {
  if (anchors.length === 0) return '';
  const xs = laneXs(anchors, lo, hi, theme);
  const h = markerHeight(theme);
  return el(
    'g',
    { class: 'vt-notes' },
    anchors.map((a, i) => {
      const cx = xs[i];
      const end = a.ruleTo ?? a.y;
      const leader =
        el('path', {
          d: `M${num(cx)},${num(laneY + h / 2)}L${num(a.x)},${num(laneY + h / 2 + 6)}L${num(a.x)},${num(end)}`,
          fill: 'none',
          stroke: theme.axis,
          'stroke-width': 1,
          'stroke-dasharray': '2 3',
        }) + (a.ruleTo === undefined ? el('circle', { cx: a.x, cy: a.y, r: 2.5, fill: theme.ink }) : '');
      return el('g', { class: 'vt-note', 'data-note': a.note.label }, [titleEl(noteSentence(a.note)), leader, markerShape(a.note, cx, laneY, theme)]);
    }),
  );
}

/**
 * Markers in a lane centred on `laneY` under their targets, for targets that
 * sit low in a chart, so leaders stay short and never cross the whole plot;
 * leaders run up to each target.
 */
export function notesBelow(anchors: readonly NoteAnchor[], laneY: number, lo: number, hi: number, theme: Theme): string {
  if (anchors.length === 0) return '';
  const xs = laneXs(anchors, lo, hi, theme);
  const top = laneY - markerHeight(theme) / 2;
  return el(
    'g',
    { class: 'vt-notes' },
    anchors.map(
      (a, i) =>
        el('path', {
          class: 'vt-note-leader',
          d: `M${num(xs[i])},${num(top)}L${num(a.x)},${num(top - 6)}L${num(a.x)},${num(a.y)}`,
          fill: 'none',
          stroke: theme.axis,
          'stroke-width': 1,
          'stroke-dasharray': '2 3',
        }) +
        el('circle', { class: 'vt-note-dot', cx: a.x, cy: a.y, r: 2.5, fill: theme.ink }) +
        noteInline(a.note, xs[i], laneY, theme),
    ),
  );
}
