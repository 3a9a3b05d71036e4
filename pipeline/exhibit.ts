/**
 * Preparing an exhibit, in numbered stages, each a call into its module:
 *
 *   1. plan       load and validate the YAML plan (every problem, with file:line:col) → jobs
 *                 (plan/load.ts, stages/jobs.ts)
 *   2. texts      read each text and word list, check the dialogue pins (stages/texts.ts)
 *   3. measures   compute each panel's measure, or take it from the cache (stages/measures.ts)
 *   4. notes      make each curator note exact against the text, and draw each panel as SVG
 *                 in both layouts, the chart kind placing each note (stages/notes.ts)
 *   5. captions   check the caption files the site renders (stages/captions.ts)
 *   6. summary    the PreparedExhibit the site renders (stages/summary.ts, stages/prepared.ts)
 *
 * Stages 1–4 never read a caption: their work is kept whole in the exhibit
 * cache (stages/recall.ts) and read back when the plan, texts, word lists,
 * options and code are unchanged, so a caption edit runs stages 5 and 6 only
 * and loads none of the code of stages 1–4.
 *
 * Nothing here writes outside the cache folder; the site build is Astro's job.
 */
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import type { Problem } from './problems/problem.ts';
import { hasErrors, sortProblems } from './problems/problem.ts';
import { ResultCache } from './cache/cache.ts';
import type { PreparedExhibit, PreparedMethod, PreparedPanel, PreparedRoom, PreparedText } from './stages/prepared.ts';
import type { ExhibitJobs, PanelJob } from './stages/jobs.ts';
import type { ReadTexts, TextState } from './stages/texts.ts';
import type { TextSummary } from './stages/text-summary.ts';
import type { Measured } from './stages/summary.ts';
import { assemble, captionFilesOf, GENERATOR } from './stages/summary.ts';
import { keep, keepKey, recall, sha256 } from './stages/recall.ts';
import { checkCaptions } from './stages/captions.ts';
import { displayPath } from './plan/files.ts';
import { atWhere } from './stages/where.ts';

export { GENERATOR };
export type { TextSummary };

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

export async function prepareExhibit(planPath: string, opts: PrepareOptions): Promise<PrepareResult> {
  const log = opts.log ?? (() => {});
  const started = performance.now();
  const planFile = resolve(planPath);
  const dir = dirname(planFile);

  // 0. recall: stages 1–4 as kept from an earlier preparation, if nothing they read has changed.
  const keepable = opts.cacheDir !== null && !opts.only && !opts.summarise;
  let planBytes: Uint8Array | null = null;
  try {
    planBytes = readFileSync(planFile);
  } catch {
    // Unreadable: stage 1 says why.
  }
  const key = keepable && planBytes ? keepKey(planFile, planBytes, opts) : null;
  const kept = key ? recall(opts.cacheDir!, planFile, key) : null;
  if (kept) {
    // 5. captions, 6. summary
    const captionProblems = await checkCaptions(captionFilesOf(kept.measured), dir, displayPath(dir, process.cwd()));
    let prepared: PreparedExhibit | null = null;
    try {
      prepared = captionProblems.length === 0 ? assemble(kept.measured, planFile, dir, opts.base) : null;
    } catch {
      // A kept file of the wrong shape: everything is prepared again below.
    }
    if (prepared) {
      for (const t of kept.measured.texts) log(readLine(kept.measured.jobs, t));
      const panels = kept.measured.rooms.reduce((s, r) => s + r.panels.length, 0);
      log(`Measured ${panels} panel${panels === 1 ? '' : 's'}: 0 computed, ${panels} from the cache (${seconds(started)} s)`);
      return {
        prepared,
        problems: sortProblems(kept.problems),
        dir,
        watch: kept.watch,
        texts: [],
        cache: { hits: panels, misses: 0 },
      };
    }
    // A caption file went missing or moved: the full preparation below reports it in the plan.
  }

  const cache = new ResultCache(opts.cacheDir);
  // 1. plan
  const [{ loadPlan }, { planRegistry }, { planJobs }] = await Promise.all([
    import('./plan/load.ts'),
    import('./stages/registry.ts'),
    import('./stages/jobs.ts'),
  ]);
  const loaded = await loadPlan(planPath, planRegistry());
  const problems: Problem[] = [...loaded.problems];
  const watch = [loaded.file];
  const failed = (): PrepareResult => ({ prepared: null, problems: sortProblems([...problems, ...cache.problems()]), dir: loaded.dir, watch, texts: [], cache: { ...cache.stats } });
  if (!loaded.plan || hasErrors(problems)) return failed();
  const jobs = planJobs(loaded.plan);
  // Link previews need absolute addresses: without the site's address, say what is left out.
  if (!jobs.exhibit.url) problems.push(atWhere(loaded.plan.exhibit.where, 'plan/no-url', {}));
  watch.push(...jobs.lexicons.map((l) => l.file), ...jobs.texts.map((t) => t.file));

  // 2. texts and pins
  const [{ readTexts }, measuresStage, { drawPanel }, { describeTexts, summarise }, { measures }, { charts }, { paramDocs }] = await Promise.all([
    import('./stages/texts.ts'),
    import('./stages/measures.ts'),
    import('./stages/notes.ts'),
    import('./stages/summary.ts'),
    import('./measures/registry.ts'),
    import('./charts/index.ts'),
    import('./stages/param-docs.ts'),
  ]);
  const { editionFacts, tablePassages } = await import('./stages/edition.ts');
  const read: ReadTexts = readTexts(jobs, cache, problems);
  if (hasErrors(problems)) return failed();
  const measuredTexts = describeTexts(read.states.values());
  for (const t of measuredTexts) log(readLine(jobs, t));

  const rooms: PreparedRoom[] = [];
  let computed = 0;
  for (const room of jobs.rooms) {
    const panels: PreparedPanel[] = [];
    for (const job of room.panels) {
      if (opts.only && !opts.only.includes(job.id)) continue;
      const state = read.states.get(job.text)!;
      const m = measures[job.measure]!;
      const inputs = inputsOf(state, jobs, read);
      // 3. measures
      const misses = cache.stats.misses;
      let result: unknown;
      try {
        result = measuresStage.measure(m, job.params, inputs, cache);
      } catch (e) {
        problems.push(atWhere(job.measureWhere, 'panel/measure-failed', { measure: job.measure, reason: (e as Error).message }));
        continue;
      }
      // 4. notes and charts: the notes made exact against the text, placed by the chart kind, what it cannot draw reported.
      const present = (value: unknown) => {
        const data = (m.views as Record<string, (r: unknown, p: unknown) => Parameters<typeof drawPanel>[1]>)[job.chart]!(value, job.params);
        const edition = editionFacts(state.edition);
        const facts = {
          chapters: state.structure.chapters.map((c, i) => ({ title: c.title, paragraphs: edition.paragraphs[i] })),
          parts: state.structure.parts,
          cast: jobs.cast,
          segments: m.segments?.(job.params),
          segmentPassage: edition.segmentPassage,
          segmentOfPassage: edition.segmentOfPassage,
        };
        const table = m.table(value, job.params);
        return { ...drawPanel(charts[job.chart]!, data, job.options, job.notes, facts), table, passages: tablePassages(table, state.edition) };
      };
      let shown: ReturnType<typeof present>;
      try {
        shown = present(result);
      } catch (e) {
        // A result read back from the cache that the chart cannot use (an entry of the wrong
        // shape) is computed again; a freshly computed one that fails is a fault of the program.
        if (cache.stats.misses > misses) throw e;
        result = measuresStage.remeasure(m, job.params, inputs, cache, `drawing it failed: ${(e as Error).message}`);
        shown = present(result);
      }
      if (cache.stats.misses > misses) computed++;
      problems.push(...shown.problems);
      panels.push(panelOf(job, shown.out, shown.table, shown.passages, shown.notes, result));
    }
    rooms.push({ id: room.id, title: room.title, intro: room.intro, panels });
  }
  const panelCount = rooms.reduce((s, r) => s + r.panels.length, 0);
  log(`Measured ${panelCount} panel${panelCount === 1 ? '' : 's'}: ${computed} computed, ${panelCount - computed} from the cache (${seconds(started)} s)`);
  if (hasErrors(problems)) return failed();

  const used = [...new Set(rooms.flatMap((r) => r.panels.map((p) => p.measure)))];
  const methods: PreparedMethod[] = used.map((name) => {
    const m = measures[name]!;
    return { name, version: m.version, card: m.method, params: paramDocs(m.params), credits: m.credits ?? null };
  });
  const measured: Measured = { jobs, rooms, methods, texts: measuredTexts };
  const cacheProblems = cache.problems();
  if (key && cacheProblems.length === 0) {
    const inputs = [
      ...[...read.states.values()].map((s) => ({ file: s.job.file, hash: s.read.hash })),
      ...jobs.lexicons.map((l) => ({ file: l.file, hash: sha256(readFileSync(l.file)) })),
    ];
    try {
      keep(opts.cacheDir!, planFile, { key, inputs, measured, problems, watch });
    } catch {
      // Not kept (a folder that turned read-only): the next build prepares everything again.
    }
  }

  // 5. captions: checked with the plan in stage 1. 6. summary
  return {
    prepared: assemble(measured, loaded.file, loaded.dir, opts.base),
    problems: sortProblems([...problems, ...cacheProblems]),
    dir: loaded.dir,
    watch,
    texts: opts.summarise ? [...read.states.values()].map((s) => summarise(s, jobs.cast)) : [],
    cache: { ...cache.stats },
  };
}

function inputsOf(state: TextState, jobs: ExhibitJobs, read: ReadTexts) {
  return { text: state.read, job: state.job, cast: jobs.cast, language: jobs.exhibit.language, lexicons: read.lexicons };
}

function panelOf(
  job: PanelJob,
  drawn: { svg: string; svgNarrow: string | null; alt: string; summary: string },
  table: PreparedPanel['table'],
  passages: PreparedPanel['passages'],
  notes: PreparedPanel['notes'],
  data: unknown,
): PreparedPanel {
  return {
    id: job.id,
    room: job.room,
    title: job.title,
    text: job.text,
    measure: job.measure,
    params: job.params,
    chart: job.chart,
    options: job.options,
    svg: drawn.svg,
    svgNarrow: drawn.svgNarrow,
    alt: job.alt ?? drawn.alt,
    summary: job.alt ?? drawn.summary,
    table,
    passages,
    notes,
    caption: job.caption,
    data,
    citation: '',
  };
}

function readLine(jobs: ExhibitJobs, t: PreparedText): string {
  const shown = jobs.texts.find((j) => j.id === t.id)?.display ?? t.source;
  return `Read ${shown}: ${t.words.toLocaleString('en-GB')} words in ${t.chapters.length} chapters`;
}

function seconds(started: number): string {
  return ((performance.now() - started) / 1000).toFixed(2);
}
