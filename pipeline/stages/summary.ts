/**
 * Stage 6 of pipeline/exhibit.ts, summary: the prepared exhibit the site renders
 * (stages/prepared.ts), with the caption files it shows, the build's short hash
 * of everything it was built from, and a citation for every panel; and, for
 * `vitrine check`, what was found in each text.
 */
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { problem } from '../problems/problem.ts';
import { dialogueReport } from '../dialogue/report.ts';
import type { CastMember } from '../text/model.ts';
import type { ExhibitJobs } from './jobs.ts';
import type { PreparedExhibit, PreparedMethod, PreparedPanel, PreparedRoom, PreparedText } from './prepared.ts';
import type { TextState } from './texts.ts';
import type { TextSummary } from './text-summary.ts';

export const GENERATOR = 'Vitrine 0.1.0';

/** What the summary is made from: the work of stages 1–5, which the exhibit cache keeps (stages/recall.ts). */
export interface Measured {
  jobs: ExhibitJobs;
  rooms: PreparedRoom[];
  methods: PreparedMethod[];
  texts: PreparedText[];
}

export function assemble(measured: Measured, planFile: string, dir: string, base: string | undefined): PreparedExhibit {
  const { jobs, methods, texts } = measured;
  const rooms = measured.rooms.map((r) => ({ ...r, panels: r.panels.map((p) => ({ ...p })) }));
  const captionFiles = captionFilesOf(measured);
  const buildHash = hashOf([readFileSync(planFile), ...texts.map((t) => t.hash), ...captionFiles.map((f) => readFileSync(`${dir}/${f}`))]);
  for (const r of rooms) for (const p of r.panels) p.citation = citation(jobs, p, texts, buildHash);
  return {
    exhibit: { ...jobs.exhibit, base: base ?? jobs.exhibit.base },
    texts,
    cast: jobs.cast.map((c) => ({ id: c.id, name: c.name, aliases: c.aliases, pronoun: c.pronoun ?? null })),
    rooms,
    methods,
    captionFiles,
    buildHash,
    generator: GENERATOR,
  };
}

/** The caption and introduction files the site renders, relative to the exhibit folder, each once. */
export function captionFilesOf({ jobs, rooms }: Pick<Measured, 'jobs' | 'rooms'>): string[] {
  return [
    ...new Set(
      [jobs.exhibit.intro, jobs.exhibit.rights, ...rooms.map((r) => r.intro), ...rooms.flatMap((r) => r.panels.map((p) => p.caption))].filter(
        (f): f is string => !!f,
      ),
    ),
  ];
}

/** The texts as the site describes them. */
export function describeTexts(states: Iterable<TextState>): PreparedText[] {
  return [...states].map((s) => ({
    id: s.job.id,
    title: s.job.title,
    author: s.job.author,
    source: s.job.source,
    edition: s.job.edition,
    hash: s.read.hash,
    words: s.structure.words,
    chapters: s.structure.chapters.map((c) => ({ number: c.number, title: c.title, part: c.part, words: c.words })),
    pages: s.edition,
  }));
}

function citation(jobs: ExhibitJobs, p: PreparedPanel, texts: PreparedText[], buildHash: string): string {
  const t = texts.find((x) => x.id === p.text);
  const edition = t?.edition ? `; ${t.edition}` : '';
  return `${jobs.exhibit.organiser}, “${p.title}”, in ${jobs.exhibit.title} (measure: ${p.measure}${edition}). Build ${buildHash}.`;
}

function hashOf(parts: (string | Uint8Array)[]): string {
  const h = createHash('sha256');
  for (const p of parts) h.update(p);
  return h.digest('hex').slice(0, 12);
}

/** What `vitrine check` prints about a text. */
export function summarise(s: TextState, cast: CastMember[]): TextSummary {
  const { model, mentions } = s.read.open();
  const counts = new Array<number>(cast.length).fill(0);
  for (let k = 0; k < mentions.count; k++) counts[mentions.member[k]!]!++;
  const dialogue = dialogueReport(model, cast, mentions, s.job.dialogue);
  return {
    id: s.job.id,
    source: s.job.display,
    words: s.structure.words,
    chapters: s.structure.chapters.map((c, i) => ({
      number: c.number,
      title: c.title,
      words: c.words,
      paragraphs: model.chapters[i]?.paragraphCount ?? 0,
      part: c.part,
      line: model.chapters[i]?.line ?? 0,
    })),
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
