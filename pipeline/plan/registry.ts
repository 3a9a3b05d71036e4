/**
 * What the plan loader needs to know about the measures and charts on offer.
 * The pipeline builds it from the real measures and charts; the loader only
 * reads names, schemas and which charts a measure can be drawn as.
 */
import type { z } from 'zod';

export interface RegistryMeasure {
  /** Parameters of the measure (defaults filled in by parsing). */
  params: z.ZodType;
  /** Whether the measure needs a cast in the plan. */
  needsCast: boolean;
  /** Chart kinds the measure can be drawn as. */
  charts: string[];
}

export interface RegistryChart {
  /** Options of the chart (defaults filled in by parsing). */
  options: z.ZodType;
}

export interface Registry {
  measures: Record<string, RegistryMeasure>;
  charts: Record<string, RegistryChart>;
}

/** Names of a registry record, sorted, for hints. */
export function registryNames(record: Record<string, unknown>): string[] {
  return Object.keys(record).sort();
}
