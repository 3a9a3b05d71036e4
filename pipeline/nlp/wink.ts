/**
 * wink-nlp with the wink-eng-lite-web-model English model, loaded on first use
 * and then kept for the life of the process (loading takes a few hundred
 * milliseconds; tagging a text never loads it again). Loaded through
 * `require` so that importing a measure does not load the model.
 *
 * Note: wink remembers, for the whole process, words it has not met before;
 * a later document may then tokenise such a word differently (a possessive
 * "father's" read as one token instead of "father" + "'s"). Tagging aligns
 * by character offsets, so our tokens are unchanged; their tags rarely change.
 */
import { createRequire } from 'node:module';
import type WinkFn from 'wink-nlp';
import type { ItsHelpers, WinkMethods } from 'wink-nlp';

/** The wink pipeline used: sentence boundaries (the tagger works sentence by sentence) and part-of-speech tags. */
export const WINK_PIPE: readonly string[] = Object.freeze(['sbd', 'pos']);

let instance: WinkMethods | null = null;
let loadCount = 0;

/** The process-wide wink instance, loaded on the first call. */
export function wink(): { nlp: WinkMethods; its: ItsHelpers } {
  if (!instance) {
    const require = createRequire(import.meta.url);
    const winkNLP = require('wink-nlp') as typeof WinkFn;
    const model = require('wink-eng-lite-web-model') as Parameters<typeof WinkFn>[0];
    instance = winkNLP(model, [...WINK_PIPE]);
    loadCount++;
  }
  return { nlp: instance, its: instance.its };
}

/** How many times the model has been loaded in this process (0 or 1). */
export function winkLoadCount(): number {
  return loadCount;
}
