/**
 * The chart kinds, keyed by name, and the helpers other stages may need.
 */

import type { ChartData } from './types.ts';
import type { Chart } from './chart.ts';
import type { z } from 'zod';
import { bars } from './bars.ts';
import { lines } from './lines.ts';
import { strip } from './strip.ts';

export type * from './types.ts';
export type { Chart } from './chart.ts';
export type { Theme, SeriesColour } from './theme.ts';
export { defaultTheme, contrastRatio, relativeLuminance, seriesColour } from './theme.ts';
export { escapeXml } from './svg.ts';
export { bars, barsOptions } from './bars.ts';
export type { BarsOptions, BarsOptionsInput } from './bars.ts';
export { lines, linesOptions } from './lines.ts';
export type { LinesOptions, LinesOptionsInput } from './lines.ts';
export { strip, stripOptions } from './strip.ts';
export type { StripOptions, StripOptionsInput } from './strip.ts';

/** Any chart kind, as seen by code that picks one by name. */
export type AnyChart = Chart<ChartData, z.ZodType>;

/** Every chart kind by name. Indexing with an unknown name gives undefined. */
export const charts: Readonly<{ bars: typeof bars; lines: typeof lines; strip: typeof strip } & Record<string, AnyChart>> = Object.freeze({
  bars,
  lines,
  strip,
});

/** Names of the chart kinds. */
export type ChartKind = 'bars' | 'lines' | 'strip';
