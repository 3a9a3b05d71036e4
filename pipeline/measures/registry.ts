import type { Measure } from './types.ts';
import { structure } from './structure.ts';
import { frequency } from './frequency.ts';
import { presence } from './presence.ts';
import { network } from './network.ts';
import { keyness } from './keyness.ts';
import { dispersion } from './dispersion.ts';
import { collocates } from './collocates.ts';
import { concordance } from './concordance.ts';
import { continuations } from './continuations.ts';
import { speech } from './speech.ts';
import { conversation } from './conversation.ts';
import { readability } from './readability.ts';
import { diversity } from './diversity.ts';
import { sentiment } from './sentiment.ts';
import { emotion } from './emotion.ts';

import { surroundings } from './surroundings.ts';
import { repetition } from './repetition.ts';
/** Every measure a plan can name, keyed by name. */
export const measures: Record<string, Measure> = Object.freeze({
  structure,
  frequency,
  presence,
  network,
  keyness,
  dispersion,
  collocates,
  concordance,
  continuations,
  speech,
  conversation,
  readability,
  diversity,
  sentiment,
  emotion,
  surroundings,
  repetition,
});
