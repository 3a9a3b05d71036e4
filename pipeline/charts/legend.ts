/**
 * A legend of swatches and names, wrapped into rows within a width. Used when
 * a chart has several series and cannot label them directly.
 */

import { el, textEl, textWidth, truncateText } from './svg.ts';
import type { Theme } from './theme.ts';

export interface LegendItem {
  name: string;
  /** Swatch colour (a `mark` colour). */
  colour: string;
}

export interface Block {
  markup: string;
  height: number;
}

/** Swatches and names from (x, y) (top-left), wrapping at `maxWidth`. */
export function legend(items: readonly LegendItem[], x: number, y: number, maxWidth: number, theme: Theme): Block {
  const fs = theme.sizes.label;
  const swatch = 12;
  const lineHeight = fs + 8;
  const parts: string[] = [];
  let cx = x;
  let row = 0;
  for (const item of items) {
    const name = truncateText(item.name, Math.max(60, maxWidth * 0.5), fs);
    const w = swatch + 6 + textWidth(name, fs);
    if (cx > x && cx + w > x + maxWidth) {
      row++;
      cx = x;
    }
    const baseline = y + row * lineHeight + fs;
    parts.push(
      el('g', { class: 'vt-legend-item' }, [
        el('rect', { x: cx, y: baseline - swatch + 1, width: swatch, height: swatch, fill: item.colour }),
        textEl(name, { x: cx + swatch + 6, y: baseline }),
      ]),
    );
    cx += w + 18;
  }
  return {
    markup: items.length ? el('g', { class: 'vt-legend' }, parts) : '',
    height: items.length ? (row + 1) * lineHeight : 0,
  };
}
