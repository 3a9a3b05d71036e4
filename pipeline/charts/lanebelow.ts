/**
 * Note markers in a lane under a drawing, each joined by a dotted leader up
 * to its target: the counterpart of `notesInLane` (notes.ts) for targets that
 * sit low in a chart, so leaders stay short and never cross the whole plot.
 */

import type { Theme } from './theme.ts';
import type { NoteAnchor } from './notes.ts';
import { markerHeight, markerWidth, noteInline } from './notes.ts';
import { el, num } from './svg.ts';
import { spreadApart } from './place.ts';

/** Markers centred on `laneY`, spread apart within [lo, hi], leaders running up to each target. */
export function notesBelow(anchors: readonly NoteAnchor[], laneY: number, lo: number, hi: number, theme: Theme): string {
  if (anchors.length === 0) return '';
  const widths = anchors.map((a) => markerWidth(a.note.label, theme));
  const xs = spreadApart(
    anchors.map((a) => a.x),
    Math.max(...widths) + 4,
    lo + widths[0] / 2,
    hi - widths[widths.length - 1] / 2,
  );
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
