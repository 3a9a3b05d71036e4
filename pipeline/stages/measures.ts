/**
 * Stage 3 of pipeline/exhibit.ts, measures and cache: each panel's measure is
 * computed, or recalled from the cache. A measure declares what it reads
 * (measures/types.ts, `reads`); it is given exactly that, and the cache key
 * holds exactly that, so editing what a measure does not read recomputes nothing.
 */
import { readFileSync } from 'node:fs';
import type { CacheCheck, ResultCache } from '../cache/cache.ts';
import { cacheKey } from '../cache/cache.ts';
import type { Measure, MeasureContext, WordCategories } from '../measures/types.ts';
import { reads } from '../measures/types.ts';
import type { CastMember } from '../text/model.ts';
import type { ReadText } from './read-text.ts';
import type { TextJob } from './jobs.ts';

/** What a panel's measure may be given: the text, and the plan's cast, dialogue settings and word lists. */
export interface MeasureInputs {
  text: ReadText;
  job: TextJob;
  cast: CastMember[];
  language: string;
  lexicons: Record<string, WordCategories>;
}

/** The context a measure is given: only what it declares it reads. */
export function contextFor(m: Measure, params: unknown, inputs: MeasureInputs): MeasureContext {
  const { model, mentions } = inputs.text.open();
  const lexicon = m.reads.lexicon?.(params);
  return {
    model,
    mentions,
    cast: reads(m.reads.cast, params) ? inputs.cast : [],
    language: inputs.language,
    lexicons: lexicon !== undefined && inputs.lexicons[lexicon] ? { [lexicon]: inputs.lexicons[lexicon] } : {},
    ...(reads(m.reads.dialogue, params) ? { dialogue: inputs.job.dialogue } : {}),
  };
}

/** The cache key of a measure's result: the text, the measure, its parameters, and what it declares it reads. */
export function measureKey(m: Measure, params: unknown, inputs: MeasureInputs): string {
  const lexicon = m.reads.lexicon?.(params);
  return cacheKey({
    textHash: inputs.text.hash,
    textOptions: inputs.job.options,
    measure: m.name,
    version: m.version,
    params,
    cast: reads(m.reads.cast, params) ? inputs.cast : null,
    language: inputs.language,
    ...(reads(m.reads.dialogue, params) ? { dialogue: inputs.job.dialogue } : {}),
    ...(lexicon !== undefined ? { lexicon: inputs.lexicons[lexicon] ?? null } : {}),
    ...(m.reads.data?.length ? { data: Object.fromEntries(m.reads.data.map((name) => [name, packageVersion(name)])) } : {}),
  });
}

/** Computes a panel's measure, or recalls it. */
export function measure(m: Measure, params: unknown, inputs: MeasureInputs, cache: ResultCache, check?: CacheCheck): unknown {
  return cache.get(measureKey(m, params, inputs), () => m.compute(contextFor(m, params, inputs), params), check);
}

/** Computes a measure again and replaces its cache entry: for a recalled result that turned out unusable. */
export function remeasure(m: Measure, params: unknown, inputs: MeasureInputs, cache: ResultCache, reason: string): unknown {
  return cache.refresh(measureKey(m, params, inputs), () => m.compute(contextFor(m, params, inputs), params), reason);
}

const versions = new Map<string, string>();

/** The installed version of an npm package the project depends on. */
function packageVersion(name: string): string {
  let v = versions.get(name);
  if (v === undefined) {
    const file = new URL(`../../node_modules/${name}/package.json`, import.meta.url);
    v = String((JSON.parse(readFileSync(file, 'utf8')) as { version?: unknown }).version ?? 'unknown');
    versions.set(name, v);
  }
  return v;
}
