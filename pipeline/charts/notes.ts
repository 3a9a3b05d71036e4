/**
 * Curators' notes drawn on a chart: a small numbered marker at the note's
 * target, either right beside it (when there is room in its row) or in a lane
 * above the plot joined to the target by a thin leader line, so markers never
 * sit on top of the data. The note's words go into the alt text and the
 * marker's `<title>`.
 */

import type { DataAt, NoteAt, PinnedNote, TextAt } from './types.ts';
import type { Theme } from './theme.ts';
import { el, num, textEl, textWidth, titleEl } from './svg.ts';
import { serifStyle } from './theme.ts';
import { sentence } from './format.ts';
import { spreadApart } from './place.ts';

/* ---------- reading a note's target ---------- */

/** Whether a target is in the dataset's own terms (rather than a chapter, character, word or segment). */
export function isDataAt(at: NoteAt): at is DataAt {
  return !('chapter' in at || 'character' in at || 'word' in at || 'segment' in at);
}

/**
 * Whether a string is one of the names a target goes by, for kinds that find
 * things by name: a character's cast id and name; a word in lower case and as
 * typed. Null for chapters and segments, which are not found by name.
 */
export function namedAs(at: TextAt): ((s: string | undefined) => boolean) | null {
  const names = 'character' in at ? [at.character, at.name] : 'word' in at ? [at.word.toLowerCase(), at.word] : null;
  return names && ((s) => s !== undefined && names.includes(s));
}

/** Whether `text` holds `word` (a word or phrase) as a whole word, ignoring case. */
export function holdsWord(text: string, word: string): boolean {
  const w = word.toLowerCase().replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  return new RegExp(`(^|[^\\p{L}])${w}($|[^\\p{L}])`, 'iu').test(text);
}

/* ---------- markers ---------- */

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

export interface NoteAnchor {
  note: PinnedNote;
  /** Target point in chart coordinates. */
  x: number;
  y: number;
  /** When set, the leader runs down to this y instead of stopping at `y` (a rule across the plot). */
  ruleTo?: number;
}

/**
 * Markers in a lane centred on `laneY`, spread apart horizontally within
 * [lo, hi], each joined to its target by a dotted leader and a small dot.
 */
export function notesInLane(anchors: readonly NoteAnchor[], laneY: number, lo: number, hi: number, theme: Theme): string {
  if (anchors.length === 0) return '';
  const widths = anchors.map((a) => markerWidth(a.note.label, theme));
  const gap = Math.max(...widths) + 4;
  const xs = spreadApart(
    anchors.map((a) => a.x),
    gap,
    lo + widths[0] / 2,
    hi - widths[widths.length - 1] / 2,
  );
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
