import type { Measure } from './types.ts';
import { structure } from './structure.ts';
import { frequency } from './frequency.ts';
import { presence } from './presence.ts';

/** Every measure a plan can name, keyed by name. */
export const measures: Record<string, Measure> = Object.freeze({
  structure,
  frequency,
  presence,
});
