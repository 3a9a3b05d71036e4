/**
 * The parts of a value axis that the charts draw alike: light rules across
 * the plot at the ticks, the tick values beside the axis, and the baseline
 * (the zero line, or the foot of the plot). The scale itself is in scale.ts.
 */

import type { Theme } from './theme.ts';
import { el, textEl } from './svg.ts';

/** A rule from (x1, y1) to (x2, y2). */
export interface Rule {
  x1: number;
  x2: number;
  y1: number;
  y2: number;
}

/** Gridlines: light rules in the theme's rule colour, behind the data. */
export function grid(rules: readonly Rule[], theme: Theme): string {
  return el(
    'g',
    { class: 'vt-grid', stroke: theme.rule, 'stroke-width': 1 },
    rules.map((r) => el('line', { x1: r.x1, x2: r.x2, y1: r.y1, y2: r.y2 })),
  );
}

/** Tick values of a vertical axis, right-aligned at `x`, each centred on its `y`. */
export function valueTicks(texts: readonly string[], ys: readonly number[], x: number, theme: Theme): string {
  const small = theme.sizes.small;
  return el(
    'g',
    { class: 'vt-ticks', fill: theme.inkMuted, 'font-size': small, 'text-anchor': 'end' },
    texts.map((t, i) => textEl(t, { x, y: ys[i] + small * 0.35 })),
  );
}

/** The baseline: the zero line of a value axis, or the foot of a plot, in the axis colour. */
export function baseline(r: Rule, theme: Theme): string {
  return el('line', { class: 'vt-baseline', x1: r.x1, x2: r.x2, y1: r.y1, y2: r.y2, stroke: theme.axis, 'stroke-width': 1 });
}
