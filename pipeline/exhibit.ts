/**
 * Preparing an exhibit, in numbered stages:
 *
 *   1. plan      load and validate the YAML plan (every problem, with file:line:col)
 *   2. texts     read each text (UTF-8 check); models are built lazily, only on a cache miss
 *   3. measures  compute each panel's measure, or take it from the cache (key: text hash,
 *                reading options, measure name + version + params, cast, language)
 *   4. notes     make each curator note exact against the text (pipeline/stages/notes.ts)
 *   5. charts    draw each panel as SVG in both layouts, with alt text and data table; the
 *                chart kind places each note once, and what it cannot draw is reported
 *   6. assemble  the PreparedExhibit the site renders (pipeline/stages/prepared.ts)
 *
 * Nothing here writes outside the cache folder; the site build is Astro's job.
 */
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { z } from 'zod';

import { loadPlan } from './plan/load.ts';
import type { Problem, ProblemPlace } from './problems/problem.ts';
import { hasErrors, problem, sortProblems } from './problems/problem.ts';
import type { ProblemArgs, ProblemCode } from './problems/catalogue.ts';
import { planRegistry } from './stages/registry.ts';
import { measures } from './measures/registry.ts';
import type { DialogueSettings, Measure, MeasureContext, WordCategories } from './measures/types.ts';
import { readLexicons } from './stages/read-lexicons.ts';
import { checkPins } from './dialogue/pins.ts';
import { dialogueReport, type DialogueReport } from './dialogue/report.ts';
import { charts } from './charts/index.ts';
import { drawPanel } from './stages/notes.ts';
import { cacheKey, ResultCache } from './cache/cache.ts';
import type { CacheCheck } from './cache/cache.ts';
import { readText } from './stages/read-text.ts';
import type { ReadText } from './stages/read-text.ts';
import type { CastMember, HeadingReport, TextOptions, TrimmedLines } from './text/model.ts';
import type { PreparedExhibit, PreparedMethod, PreparedPanel, PreparedRoom, PreparedText } from './stages/prepared.ts';
import type { StructureResult } from './measures/structure.ts';
import { planJobs } from './stages/jobs.ts';
import type { ExhibitJobs, PanelJob, TextJob, Where } from './stages/jobs.ts';
import { paramDocs } from './stages/param-docs.ts';
import { READING_VERSION, readingProblems, readingReport, readingReportSchema } from './stages/reading.ts';

/** What stage 2 and the notes read of a cached structure result; anything else there is computed again. */
const structureShape = z.object({
  words: z.number(),
  chapters: z.array(z.object({ number: z.number(), title: z.string(), part: z.string().nullable(), words: z.number() })),
});

/** A cache check from a schema: null when the value fits, otherwise where and how it does not. */
function shapeCheck(schema: z.ZodType): CacheCheck {
  return (value) => {
    const r = schema.safeParse(value);
    if (r.success) return null;
    const issue = r.error.issues[0]!;
    return `${issue.path.join('.') || 'the value'}: ${issue.message}`;
  };
}

export const GENERATOR = 'Vitrine 0.1.0';

const PIN_CODES = {
  'no-match': 'dialogue/pin-no-match',
  several: 'dialogue/pin-several',
  'unknown-speaker': 'dialogue/pin-unknown-speaker',
  'unknown-addressee': 'dialogue/pin-unknown-addressee',
} as const;

export interface PrepareOptions {
  /** Folder for cached measure results; null keeps nothing on disk. */
  cacheDir: string | null;
  /** Progress lines. */
  log?: (message: string) => void;
  /** Prepare only these panels (by id). Default: all. */
  only?: string[];
  /** Override the plan's base path (e.g. to serve a build from a sub-folder). */
  base?: string;
  /** Also describe each text for `vitrine check` (chapters, cast mentions, dialogue problems). This builds the text models even when every result is cached. */
  summarise?: boolean;
}

export interface PrepareResult {
  prepared: PreparedExhibit | null;
  problems: Problem[];
  /** The exhibit folder. */
  dir: string;
  /** Files the result depends on (plan, texts), for a live preview to watch. */
  watch: string[];
  /** Per text: what `vitrine check` prints. */
  texts: TextSummary[];
  cache: { hits: number; misses: number };
}

export interface TextSummary {
  id: string;
  source: string;
  words: number;
  chapters: { number: number; title: string; words: number; part: string | null; line: number }[];
  /** The headings taken and turned down, and the front and back matter trimmed (source lines). */
  headings: HeadingReport;
  trimmed: { front?: TrimmedLines; back?: TrimmedLines };
  /** Stretches of the text read but outside every chapter (title page, contents, preface; source lines, inclusive). */
  outside: { from: number; to: number }[];
  cast: { id: string; name: string; mentions: number }[];
  ambiguous: { text: string; chapter: number; candidates: string[] }[];
  /** The speech marks read per chapter, and the speakers outside the cast heard most often. */
  dialogue: Pick<DialogueReport, 'chapters' | 'outsiders'>;
  warnings: Problem[];
}

interface TextState {
  job: TextJob;
  read: ReadText;
  structure: StructureResult;
}

export async function prepareExhibit(planPath: string, opts: PrepareOptions): Promise<PrepareResult> {
  const log = opts.log ?? (() => {});
  const cache = new ResultCache(opts.cacheDir);
  const started = performance.now();

  // 1. plan
  const loaded = await loadPlan(planPath, planRegistry());
  const problems: Problem[] = [...loaded.problems];
  const watch = [loaded.file];
  const empty = (): PrepareResult => ({
    prepared: null,
    problems: sortProblems([...problems, ...cache.problems()]),
    dir: loaded.dir,
    watch,
    texts: [],
    cache: { ...cache.stats },
  });
  if (!loaded.plan || hasErrors(problems)) return empty();
  const jobs = planJobs(loaded.plan);
  // Link previews need absolute addresses: without the site's address, say what is left out.
  if (!jobs.exhibit.url) problems.push(atWhere(loaded.plan.exhibit.where, 'plan/no-url', {}));
  watch.push(...jobs.lexicons.map((l) => l.file));
  const language = jobs.exhibit.language;

  // 2. texts
  const states = new Map<string, TextState>();
  for (const t of jobs.texts) {
    watch.push(t.file);
    const { text, problems: textProblems } = readText(t.file, t.display, t.options, jobs.cast);
    problems.push(...textProblems.map((p) => ({ ...p, path: p.path ?? t.where.path })));
    if (!text) continue;
    const structure = cache.get(
      key(text.hash, t.options, measures.structure!, {}, jobs.cast, language),
      () => measures.structure!.compute(contextOf(text, jobs.cast, language), {}),
      shapeCheck(structureShape),
    ) as StructureResult;
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
    states.set(t.id, { job: t, read: text, structure });
  }
  const lexicons = readLexicons(jobs.lexicons, problems);
  for (const room of jobs.rooms) {
    for (const p of room.panels) {
      const named = p.params.lexicon;
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
  // Curator pins that match no quotation would silently correct nothing.
  for (const s of states.values()) {
    if (s.job.dialogue.pins.length === 0) continue;
    for (const p of checkPins(s.read.open().model, s.job.dialogue, jobs.cast)) {
      problems.push(atWhere({ ...s.job.where, path: `${s.job.where.path}.dialogue.pins[${p.pin}]` }, PIN_CODES[p.reason], { detail: p.message }));
    }
  }
  if (hasErrors(problems)) return empty();
  for (const s of states.values()) {
    log(`Read ${s.job.display}: ${s.structure.words.toLocaleString('en-GB')} words in ${s.structure.chapters.length} chapters`);
  }

  // 3–5. measures, notes, charts
  const rooms: PreparedRoom[] = [];
  let computed = 0;
  for (const room of jobs.rooms) {
    const panels: PreparedPanel[] = [];
    for (const job of room.panels) {
      if (opts.only && !opts.only.includes(job.id)) continue;
      const state = states.get(job.text)!;
      const panel = preparePanel(job, state, jobs, cache, problems, language, lexicons);
      if (panel) panels.push(panel.panel);
      if (panel?.computed) computed++;
    }
    rooms.push({ id: room.id, title: room.title, intro: room.intro, panels });
  }
  const panelCount = rooms.reduce((s, r) => s + r.panels.length, 0);
  log(
    `Measured ${panelCount} panel${panelCount === 1 ? '' : 's'}: ${computed} computed, ${panelCount - computed} from the cache (${((performance.now() - started) / 1000).toFixed(2)} s)`,
  );
  if (hasErrors(problems)) return empty();

  // 6. assemble
  const used = [...new Set(rooms.flatMap((r) => r.panels.map((p) => p.measure)))];
  const methods: PreparedMethod[] = used.map((name) => {
    const m = measures[name]!;
    return { name, version: m.version, card: m.method, params: paramDocs(m.params), credits: m.credits ?? null };
  });
  const texts: PreparedText[] = [...states.values()].map((s) => ({
    id: s.job.id,
    source: s.job.source,
    edition: s.job.edition,
    hash: s.read.hash,
    words: s.structure.words,
    chapters: s.structure.chapters.map((c) => ({ number: c.number, title: c.title, part: c.part, words: c.words })),
  }));
  const captionFiles = [
    ...new Set(
      [jobs.exhibit.intro, jobs.exhibit.rights, ...rooms.map((r) => r.intro), ...rooms.flatMap((r) => r.panels.map((p) => p.caption))].filter(
        (f): f is string => !!f,
      ),
    ),
  ];
  const buildHash = hashOf([readFileSync(loaded.file), ...texts.map((t) => t.hash), ...captionFiles.map((f) => readFileSync(`${loaded.dir}/${f}`))]);
  for (const r of rooms) for (const p of r.panels) p.citation = citation(jobs, p, texts, buildHash);
  const prepared: PreparedExhibit = {
    exhibit: { ...jobs.exhibit, base: opts.base ?? jobs.exhibit.base },
    texts,
    cast: jobs.cast.map((c) => ({ id: c.id, name: c.name, aliases: c.aliases, pronoun: c.pronoun ?? null })),
    rooms,
    methods,
    captionFiles,
    buildHash,
    generator: GENERATOR,
  };
  return {
    prepared,
    problems: sortProblems([...problems, ...cache.problems()]),
    dir: loaded.dir,
    watch,
    texts: opts.summarise ? [...states.values()].map((s) => summarise(s, jobs.cast)) : [],
    cache: { ...cache.stats },
  };
}

/** What a measure may read besides the text: the plan's dialogue settings and word lists. */
export interface Extras {
  dialogue?: DialogueSettings;
  lexicons?: Record<string, WordCategories>;
}

function contextOf(text: ReadText, cast: CastMember[], language: string, extras: Extras = {}): MeasureContext {
  const { model, mentions } = text.open();
  return { model, mentions, cast, language, ...extras };
}

function key(hash: string, options: TextOptions, m: Measure, params: unknown, cast: CastMember[], language: string, extras: Extras = {}): string {
  // Only what can change this measure's result is part of the key: the cast and dialogue
  // settings for measures that read characters, the word list a parameter names.
  const lexicon = (params as { lexicon?: unknown } | null)?.lexicon;
  return cacheKey({
    textHash: hash,
    textOptions: options,
    measure: m.name,
    version: m.version,
    params,
    cast: (m.readsCast ? m.readsCast(params) : m.needsCast) ? { cast, dialogue: extras.dialogue ?? null } : null,
    language,
    ...(typeof lexicon === 'string' ? { lexicon: extras.lexicons?.[lexicon] ?? null } : {}),
  });
}

/** Runs one panel's measure (or recalls it), resolves its notes and draws its chart. */
export function computePanelResult(
  job: PanelJob,
  read: ReadText,
  textOptions: TextOptions,
  cast: CastMember[],
  language: string,
  cache: ResultCache,
  extras: Extras = {},
): unknown {
  const m = measures[job.measure]!;
  return cache.get(key(read.hash, textOptions, m, job.params, cast, language, extras), () =>
    m.compute(contextOf(read, cast, language, extras), job.params),
  );
}

function preparePanel(
  job: PanelJob,
  state: TextState,
  jobs: ExhibitJobs,
  cache: ResultCache,
  problems: Problem[],
  language: string,
  lexicons: Record<string, WordCategories>,
): { panel: PreparedPanel; computed: boolean } | null {
  const m = measures[job.measure]!;
  const misses = cache.stats.misses;
  const extras: Extras = { dialogue: state.job.dialogue, lexicons };
  const compute = () => m.compute(contextOf(state.read, jobs.cast, language, extras), job.params);
  let result: unknown;
  try {
    result = computePanelResult(job, state.read, state.job.options, jobs.cast, language, cache, extras);
  } catch (e) {
    problems.push(atWhere(job.measureWhere, 'panel/measure-failed', { measure: job.measure, reason: (e as Error).message }));
    return null;
  }
  let shown: ReturnType<typeof presentPanel>;
  try {
    shown = presentPanel(job, result, state, jobs.cast);
  } catch (e) {
    // A result read back from the cache that the chart cannot use (an entry of the wrong
    // shape) is computed again; a freshly computed one that fails is a fault of the program.
    if (cache.stats.misses > misses) throw e;
    result = cache.refresh(key(state.read.hash, state.job.options, m, job.params, jobs.cast, language, extras), compute, `drawing it failed: ${(e as Error).message}`);
    shown = presentPanel(job, result, state, jobs.cast);
  }
  problems.push(...shown.problems);
  return {
    computed: cache.stats.misses > misses,
    panel: {
      id: job.id,
      room: job.room,
      title: job.title,
      text: job.text,
      measure: job.measure,
      params: job.params,
      chart: job.chart,
      options: job.options,
      svg: shown.out.svg,
      svgNarrow: shown.out.svgNarrow,
      alt: job.alt ?? shown.out.alt,
      summary: job.alt ?? shown.out.summary,
      table: shown.table,
      notes: shown.notes,
      caption: job.caption,
      data: result,
      citation: '',
    },
  };
}

/** The chart, table and notes of a panel from its measure's result. Throws when the result does not fit the chart. */
function presentPanel(job: PanelJob, result: unknown, state: TextState, cast: CastMember[]) {
  const m = measures[job.measure]!;
  const problems: Problem[] = [];
  const data = m.views[job.chart]!(result, job.params);
  // 4–5. notes and chart: the notes made exact against the text, placed by the chart kind, what it cannot draw reported.
  const segments = job.params.by === 'segment' && typeof job.params.segments === 'number' ? job.params.segments : undefined;
  const { out, notes, problems: noteProblems } = drawPanel(charts[job.chart]!, data, job.options, job.notes, {
    chapters: state.structure.chapters,
    parts: state.structure.parts,
    cast,
    segments,
  });
  problems.push(...noteProblems);
  return { out, table: m.table(result, job.params), notes, problems };
}

function atWhere<C extends ProblemCode>(where: Where, code: C, args: ProblemArgs<C>): Problem {
  const place: ProblemPlace = { file: where.file, line: where.line, column: where.column, path: where.path };
  return problem(code, args, place);
}

function citation(jobs: ExhibitJobs, p: PreparedPanel, texts: PreparedText[], buildHash: string): string {
  const t = texts.find((x) => x.id === p.text);
  const edition = t?.edition ? `; ${t.edition}` : '';
  return `${jobs.exhibit.organiser}, “${p.title}”, in ${jobs.exhibit.title} (measure: ${p.measure}${edition}). Build ${buildHash}.`;
}

function summarise(s: TextState, cast: CastMember[]): TextSummary {
  const { model, mentions } = s.read.open();
  const counts = new Array<number>(cast.length).fill(0);
  for (let k = 0; k < mentions.count; k++) counts[mentions.member[k]!]!++;
  const dialogue = dialogueReport(model, cast, mentions, s.job.dialogue);
  return {
    id: s.job.id,
    source: s.job.display,
    words: s.structure.words,
    chapters: s.structure.chapters.map((c, i) => ({ number: c.number, title: c.title, words: c.words, part: c.part, line: model.chapters[i]?.line ?? 0 })),
    headings: model.headings ?? { taken: [], rejected: [] },
    trimmed: model.trimmed ?? {},
    outside: (model.skipped ?? []).map((r) => ({ from: r.line, to: model.position(Math.max(r.start, r.end - 1)).line })),
    cast: cast.map((c, i) => ({ id: c.id, name: c.name, mentions: counts[i]! })),
    ambiguous: mentions.ambiguous.map((a) => ({ text: a.text, chapter: a.chapter + 1, candidates: a.candidates })),
    dialogue: { chapters: dialogue.chapters, outsiders: dialogue.outsiders },
    // The text model's own warnings are reported with the reading (stage 2), cache or no cache.
    warnings: [
      // Unbalanced quotation marks, and marks with no speech found: the rest of the text is still read.
      // Only where dialogue is read at all (the speech measures need a cast).
      ...(cast.length ? dialogue.warnings : []).map((q) =>
        problem(q.code, { chapter: q.chapter, paragraph: q.paragraph, detail: q.message }, { file: s.job.display, line: q.line }),
      ),
    ],
  };
}

function hashOf(parts: (string | Uint8Array)[]): string {
  const h = createHash('sha256');
  for (const p of parts) h.update(p);
  return h.digest('hex').slice(0, 12);
}



