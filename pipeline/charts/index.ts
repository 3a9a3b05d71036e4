/**
 * The chart kinds, keyed by name, and the helpers other stages may need.
 */

import type { ChartData } from './types.ts';
import type { Chart } from './chart.ts';
import type { z } from 'zod';
import { bars } from './bars.ts';
import { lines } from './lines.ts';
import { strip } from './strip.ts';
import { matrix } from './matrix.ts';
import { network } from './network.ts';
import { tree } from './tree.ts';
import { treemap } from './treemap.ts';
import { kwic } from './kwic.ts';
import { textmap } from './textmap.ts';
import { multiples } from './multiples.ts';
import { scatter } from './scatter.ts';

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
export { matrix, matrixOptions } from './matrix.ts';
export type { MatrixOptions, MatrixOptionsInput } from './matrix.ts';
export { network, networkOptions } from './network.ts';
export type { NetworkOptions, NetworkOptionsInput } from './network.ts';
export { tree, treeOptions } from './tree.ts';
export type { TreeOptions, TreeOptionsInput } from './tree.ts';
export { treemap, treemapOptions } from './treemap.ts';
export type { TreemapOptions, TreemapOptionsInput } from './treemap.ts';
export { kwic, kwicOptions } from './kwic.ts';
export type { KwicOptions, KwicOptionsInput } from './kwic.ts';
export { textmap, textmapOptions } from './textmap.ts';
export type { TextmapOptions, TextmapOptionsInput } from './textmap.ts';
export { multiples, multiplesOptions } from './multiples.ts';
export type { MultiplesOptions, MultiplesOptionsInput } from './multiples.ts';
export { scatter, scatterOptions } from './scatter.ts';
export type { ScatterOptions, ScatterOptionsInput } from './scatter.ts';

/** Any chart kind, as seen by code that picks one by name. */
export type AnyChart = Chart<ChartData, z.ZodType>;

/** Every chart kind by name. Indexing with an unknown name gives undefined. */
export const charts: Readonly<{ bars: typeof bars; lines: typeof lines; strip: typeof strip; matrix: typeof matrix; network: typeof network; tree: typeof tree; treemap: typeof treemap; kwic: typeof kwic; textmap: typeof textmap; multiples: typeof multiples; scatter: typeof scatter } & Record<string, AnyChart>> = Object.freeze({
  bars,
  lines,
  strip,
  matrix,
  network,
  tree,
  treemap,
  kwic,
  textmap,
  multiples,
  scatter,
});

/** Names of the chart kinds. */
export type ChartKind = 'bars' | 'lines' | 'strip' | 'matrix' | 'network' | 'tree' | 'treemap' | 'kwic' | 'textmap' | 'multiples' | 'scatter';
