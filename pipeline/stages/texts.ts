/**
 * Stage 2 of pipeline/exhibit.ts, texts and pins: read each text the plan names
 * (decoding checked; the model is built only when something needs it), its
 * chapter structure and its reading edition (each cached like a measure) and what was found in reading it,
 * the plan's word lists, and the curator's dialogue pins, which must each match
 * a quotation.
 */
import { z } from 'zod';
import type { Problem } from '../problems/problem.ts';
import type { CacheCheck, ResultCache } from '../cache/cache.ts';
import { cacheKey } from '../cache/cache.ts';
import { measures } from '../measures/registry.ts';
import type { StructureResult } from '../measures/structure.ts';
import type { WordCategories } from '../measures/types.ts';
import { checkPins } from '../dialogue/pins.ts';
import type { PinProblem } from '../dialogue/pins.ts';
import { readText } from './read-text.ts';
import type { ReadText } from './read-text.ts';
import { readLexicons } from './read-lexicons.ts';
import type { ExhibitJobs, TextJob } from './jobs.ts';
import { atWhere } from './where.ts';
import { measure } from './measures.ts';
import { READING_VERSION, readingProblems, readingReport, readingReportSchema } from './reading.ts';
import { editionOf } from './edition.ts';
import type { Edition } from '../edition/edition.ts';

export interface TextState {
  job: TextJob;
  read: ReadText;
  structure: StructureResult;
  /** The reading edition (cached like a measure). */
  edition: Edition;
}

export interface ReadTexts {
  states: Map<string, TextState>;
  lexicons: Record<string, WordCategories>;
}

/** What stage 2 and the notes read of a cached structure result; anything else there is computed again. */
const structureShape = z.object({
  words: z.number(),
  chapters: z.array(z.object({ number: z.number(), title: z.string(), part: z.string().nullable(), words: z.number() })),
});

/** What a cached pin check must hold. */
const pinsShape = z.array(
  z.object({ pin: z.number(), chapter: z.number(), startsWith: z.string(), reason: z.enum(['no-match', 'several', 'unknown-speaker', 'unknown-addressee']), message: z.string() }),
);

/** A cache check from a schema: null when the value fits, otherwise where and how it does not. */
export function shapeCheck(schema: z.ZodType): CacheCheck {
  return (value) => {
    const r = schema.safeParse(value);
    if (r.success) return null;
    const issue = r.error.issues[0]!;
    return `${issue.path.join('.') || 'the value'}: ${issue.message}`;
  };
}

const PIN_CODES = {
  'no-match': 'dialogue/pin-no-match',
  several: 'dialogue/pin-several',
  'unknown-speaker': 'dialogue/pin-unknown-speaker',
  'unknown-addressee': 'dialogue/pin-unknown-addressee',
} as const;

/** Version of the pin check below: part of its cache key. */
const PIN_CHECK_VERSION = 1;

export function readTexts(jobs: ExhibitJobs, cache: ResultCache, problems: Problem[]): ReadTexts {
  const language = jobs.exhibit.language;
  const states = new Map<string, TextState>();
  for (const t of jobs.texts) {
    const { text, problems: textProblems } = readText(t.file, t.display, t.options, jobs.cast);
    problems.push(...textProblems.map((p) => ({ ...p, path: p.path ?? t.where.path })));
    if (!text) continue;
    const inputs = { text, job: t, cast: jobs.cast, language, lexicons: {} };
    const structure = measure(measures.structure!, {}, inputs, cache, shapeCheck(structureShape)) as StructureResult;
    const report = cache.get(
      cacheKey({ textHash: text.hash, textOptions: t.options, measure: 'reading', version: READING_VERSION, params: {}, cast: jobs.cast, language }),
      () => {
        const { model, mentions } = text.open();
        return readingReport(model, mentions, jobs.cast);
      },
      shapeCheck(readingReportSchema),
    );
    problems.push(
      ...readingProblems(report, {
        id: t.id,
        display: t.display,
        where: t.where,
        trimmed: t.options.start !== undefined || t.options.end !== undefined,
        pattern: t.options.chapterPattern !== undefined,
        cast: jobs.cast,
        castPlaces: jobs.castPlaces,
        language,
      }),
    );
    // An empty text has nothing to check further: its pins and panels would only repeat the fault.
    if (report.words === 0) continue;
    states.set(t.id, { job: t, read: text, structure, edition: editionOf(text, t.options, cache) });
  }
  const lexicons = readLexicons(jobs.lexicons, problems);
  // A word list a panel names must be one of the plan's: each measure says which it reads.
  for (const room of jobs.rooms) {
    for (const p of room.panels) {
      const named = measures[p.measure]?.reads.lexicon?.(p.params as never);
      if (typeof named === 'string' && !lexicons[named] && !jobs.lexicons.some((l) => l.id === named)) {
        problems.push(atWhere({ ...p.where, path: `${p.where.path}.params.lexicon` }, 'plan/unknown-lexicon', { name: named, ids: jobs.lexicons.map((l) => l.id) }));
      }
    }
  }
  // Chapters named in dialogue.marks that the text does not have would silently set nothing.
  for (const s of states.values()) {
    const marks = s.job.dialogue.marks;
    if (marks === undefined || typeof marks === 'string') continue;
    const count = s.structure.chapters.length;
    for (const key of Object.keys(marks.chapters ?? {})) {
      if (Number(key) <= count) continue;
      problems.push(
        atWhere(
          { ...s.job.where, path: `${s.job.where.path}.dialogue.marks.chapters["${key}"]` },
          'dialogue/marks-chapter',
          { chapter: key, text: s.job.display, count },
        ),
      );
    }
  }
  // Curator pins that match no quotation would silently correct nothing. The check reads
  // the whole text, so what it finds is cached with the text, the pins and the cast.
  for (const s of states.values()) {
    if (s.job.dialogue.pins.length === 0) continue;
    const key = cacheKey({ textHash: s.read.hash, textOptions: s.job.options, measure: 'pins', version: PIN_CHECK_VERSION, params: s.job.dialogue, cast: jobs.cast, language });
    const found = cache.get(key, () => checkPins(s.read.open().model, s.job.dialogue, jobs.cast), shapeCheck(pinsShape)) as PinProblem[];
    for (const p of found) {
      problems.push(atWhere({ ...s.job.where, path: `${s.job.where.path}.dialogue.pins[${p.pin}]` }, PIN_CODES[p.reason], { detail: p.message }));
    }
  }
  return { states, lexicons };
}
