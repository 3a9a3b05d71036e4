/**
 * The contract every chart kind fulfils, and the pieces they share: the id
 * option, stable ids, the SVG root and the "No data to draw" panel.
 *
 * Ids. The root's `<title>` and `<desc>` need ids that are unique on a page
 * yet the same on every build. By default a chart's id is "vt-<kind>-<hash>",
 * the hash (FNV-1a, 32 bit) taken over the dataset, the options and the
 * notes; the narrow layout appends "-n". Two identical charts on one page
 * would share ids: give one of them an `id` option.
 */

import { z } from 'zod';
import type { ChartData, ChartOutput, PinnedNote } from './types.ts';
import type { Theme } from './theme.ts';
import { el, escapeXml, hashString, textEl, truncateText } from './svg.ts';
import { upperFirst } from './format.ts';

export interface Chart<D extends ChartData, S extends z.ZodType> {
  /** The chart kind, equal to the dataset's `kind`. */
  name: D['kind'];
  /** Options: a strict object; every field documented and defaulted. */
  options: S;
  /**
   * Draws `data`. `options` are parsed with `options` (defaults filled,
   * unknown keys rejected); notes whose target is not in the data are skipped
   * and listed in `skippedNotes`.
   */
  render(data: D, options?: z.input<S>, theme?: Theme, notes?: readonly PinnedNote[]): ChartOutput;
}

/** The `id` option every chart kind takes. */
export const idOption = z
  .string()
  .regex(/^[A-Za-z][A-Za-z0-9_-]*$/, 'an id starts with a letter and holds only letters, digits, "-" and "_"')
  .optional()
  .describe('Base of the ids of the chart\'s <title> and <desc> ("<id>-title", "<id>-desc"). Default: "vt-<kind>-<hash of data, options and notes>".');

/** The base id of a chart: the `id` option, or a hash of everything that shapes the drawing. */
export function chartId(kind: string, explicit: string | undefined, ...inputs: unknown[]): string {
  if (explicit) return explicit;
  return `vt-${kind}-${hashString(JSON.stringify([kind, ...inputs]))}`;
}

export interface FrameArgs {
  kind: string;
  id: string;
  width: number;
  height: number;
  title: string;
  desc: string;
  theme: Theme;
  /** Markup of the drawing, placed inside the root `<g>` after the paper. */
  body: string;
}

/** The SVG root: `<title>`, `<desc>`, then one root `<g>` holding the paper and the drawing. */
export function frame(a: FrameArgs): string {
  const { id, theme } = a;
  const root = el(
    'g',
    {
      class: 'vt-chart-body',
      fill: theme.ink,
      style: `font-family:${theme.fonts.sans};font-size:${theme.sizes.label}px`,
    },
    [el('rect', { class: 'vt-paper', width: a.width, height: a.height, fill: theme.paper }), a.body],
  );
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${a.width} ${a.height}" role="img"` +
    ` aria-labelledby="${escapeXml(id)}-title ${escapeXml(id)}-desc" data-chart="${escapeXml(a.kind)}" class="vt-chart">` +
    `<title id="${escapeXml(id)}-title">${escapeXml(a.title)}</title>` +
    `<desc id="${escapeXml(id)}-desc">${escapeXml(a.desc)}</desc>` +
    root +
    `</svg>`
  );
}

/** Style attribute for serif text (axis titles, notes, messages). */
export function serifStyle(theme: Theme, italic = false): string {
  return `font-family:${theme.fonts.serif}${italic ? ';font-style:italic' : ''}`;
}

/** A panel that says there is nothing to draw, and why, instead of a chart. */
export function emptyChart(kind: string, id: string, title: string, reason: string, theme: Theme, width: number): string {
  const height = Math.round(width / 4);
  const body = el('g', { class: 'vt-empty' }, [
    el('rect', {
      x: 8,
      y: 8,
      width: width - 16,
      height: height - 16,
      fill: 'none',
      stroke: theme.rule,
      'stroke-width': 1,
    }),
    textEl('No data to draw', {
      x: width / 2,
      y: height / 2 - 4,
      'text-anchor': 'middle',
      'font-size': theme.sizes.axisTitle + 2,
      style: serifStyle(theme, true),
      fill: theme.ink,
    }),
    textEl(truncateText(upperFirst(reason), width - 40, theme.sizes.small), {
      x: width / 2,
      y: height / 2 + theme.sizes.small + 8,
      'text-anchor': 'middle',
      'font-size': theme.sizes.small,
      fill: theme.inkMuted,
    }),
  ]);
  return frame({ kind, id, width, height, title, desc: `No data to draw: ${reason}`, theme, body });
}
