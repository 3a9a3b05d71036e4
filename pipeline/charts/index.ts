/**
 * The chart kinds by name (registered in kinds.ts), and the types other
 * stages use to pick one.
 */

import type { z } from 'zod';
import type { Chart, DataOf } from './chart.ts';
import * as kinds from './kinds.ts';

/** Any chart kind, as seen by code that picks one by name. */
export type AnyChart = Chart<{ kind: string; title: string }, z.ZodObject>;

/** Names of the chart kinds. */
export type ChartKind = keyof typeof kinds;

/** The data that the kind `K` draws. */
export type ChartDataOf<K extends ChartKind> = DataOf<(typeof kinds)[K]>;

/**
 * A registry of chart kinds keyed by name, frozen. Each kind must be
 * registered under its own name, once.
 */
export function registry<K extends Record<string, AnyChart>>(list: K): Readonly<K & Record<string, AnyChart>> {
  const out: Record<string, AnyChart> = {};
  for (const [key, chart] of Object.entries(list)) {
    if (chart.name !== key) throw new Error(`the chart kind "${chart.name}" is registered as "${key}": register it under its own name`);
    out[key] = chart;
  }
  return Object.freeze(out) as K & Record<string, AnyChart>;
}

/** Every chart kind by name. Indexing with an unknown name gives undefined. */
export const charts = registry(kinds);
