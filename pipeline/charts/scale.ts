/**
 * Value axes: a linear scale over the data (with zero when asked), "nice"
 * round ends and ticks from d3-scale, and tick labels in the dataset's format.
 */

import { scaleLinear } from 'd3-scale';
import type { ValueFormat } from './format.ts';
import { decimalsFor, formatValue } from './format.ts';

export interface ValueAxis {
  /** Maps a value to a coordinate in the range. */
  at: (v: number) => number;
  /** Tick values, ascending. */
  ticks: number[];
  /** The rounded ("nice") domain. */
  domain: [number, number];
}

/**
 * A linear axis over `values` mapped onto `range`. Counts get whole-number
 * ticks only. A flat domain (one value) is widened so the scale stays usable.
 * With `nice` the ends are rounded out to tick values; without it the axis
 * ends at the data, so the longest bar fills the plot.
 */
export function valueAxis(
  values: readonly number[],
  range: [number, number],
  format: ValueFormat,
  tickCount: number,
  includeZero = true,
  nice = true,
): ValueAxis {
  const finite = values.filter(Number.isFinite);
  let lo = finite.length ? Math.min(...finite) : 0;
  let hi = finite.length ? Math.max(...finite) : 1;
  if (includeZero) {
    lo = Math.min(0, lo);
    hi = Math.max(0, hi);
  }
  if (lo === hi) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= lo === 0 ? 0 : pad;
    hi += pad;
  }
  const scale = scaleLinear().domain([lo, hi]).range(range);
  if (nice) scale.nice(tickCount);
  let ticks = scale.ticks(tickCount);
  if (format === 'count') ticks = ticks.filter((t) => Number.isInteger(t));
  const [d0, d1] = scale.domain();
  return { at: (v: number) => scale(v), ticks, domain: [d0, d1] };
}

/** Tick labels in the dataset's format, decimals kept equal across the ticks ("0.5", "1.0", "1.5"). */
export function tickFormatter(ticks: readonly number[], format: ValueFormat): (v: number) => string {
  const decimals = decimalsFor(ticks);
  return (v: number) => formatValue(v, format, decimals);
}
