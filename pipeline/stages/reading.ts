/**
 * How a text was read, told to the curator (stage 2 of pipeline/exhibit.ts):
 * a text without words is an error; a text without chapter headings, the
 * text model's own warnings, and cast names that probably count more than the
 * character are warnings that say what was done.
 *
 * The report is computed once per text, reading options and cast, and kept
 * in the result cache like a measure, so that a build from a warm cache still
 * says all of it without building the text model.
 */
import { z } from 'zod';
import type { CastMember, Mentions, TextModel } from '../text/model.ts';
import { formKey } from '../text/mentions.ts';
import { stopwords } from '../text/stopwords.ts';
import type { Problem, ProblemPlace } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';
import type { ProblemCode } from '../problems/catalogue.ts';

/** Part of the cache key: bump when the report for the same input changes. */
export const READING_VERSION = 1;

/**
 * An alias found more than this many times as often as all the other names of
 * its character together is probably a common word or a phrase that also
 * means something else (the alias "the" turned 30 mentions into 677).
 * Common practice, no source: a threshold chosen so that a nickname a novel
 * prefers (counted a few times as often as the full name) passes.
 */
export const ALIAS_MULTIPLE = 10;
/** Below this many matches an alias is not compared with the other names: the counts are too small to tell. */
export const ALIAS_MIN_COUNT = 20;

export const readingReportSchema = z.object({
  words: z.number().int().nonnegative(),
  /** No chapter heading was found: the whole text is one chapter. */
  oneChapter: z.boolean(),
  /** The text model's warnings (trim markers, the chapter pattern). */
  warnings: z.array(z.object({ code: z.string(), message: z.string(), hint: z.string().optional(), line: z.number().optional(), column: z.number().optional() })),
  /** Per cast member: mentions in all, and per form (keyed by `formKey`). */
  counts: z.array(z.object({ total: z.number().int().nonnegative(), byForm: z.record(z.string(), z.number().int().nonnegative()) })),
});

export type ReadingReport = z.infer<typeof readingReportSchema>;

export function readingReport(model: TextModel, mentions: Mentions, cast: readonly CastMember[]): ReadingReport {
  const counts = cast.map(() => ({ total: 0, byForm: {} as Record<string, number> }));
  for (let k = 0; k < mentions.count; k++) {
    const c = counts[mentions.member[k]!]!;
    const key = mentions.forms[mentions.form[k]!]!;
    c.total++;
    c.byForm[key] = (c.byForm[key] ?? 0) + 1;
  }
  return {
    words: model.tokens.count,
    oneChapter: model.chapters.length > 0 && model.chapters.every((c) => c.heading === null),
    // An empty text is reported as an error below, from the word count.
    warnings: model.warnings.filter((w) => w.code !== 'text/empty').map((w) => ({ ...w })),
    counts,
  };
}

/** Where the curator wrote a text's entry, and a cast member's name and aliases. */
export type Place = ProblemPlace;

export interface ReadingContext {
  /** The text's id and file as shown. */
  id: string;
  display: string;
  /** Where the text's entry stands in the plan. */
  where: Place;
  /** Whether the plan trims the text with start or end markers. */
  trimmed: boolean;
  /** Whether the plan gives a chapter pattern. */
  pattern: boolean;
  cast: readonly CastMember[];
  /** Per member: where its name and each alias are written. */
  castPlaces: readonly { name: Place; aliases: readonly Place[] }[];
  language: string;
}

/** Every word of `name` is a stopword of the language. */
function allStopwords(name: string, stop: ReadonlySet<string>): boolean {
  const words = name.toLowerCase().replace(/\u2019/g, "'").split(/[^\p{L}\p{N}']+/u).filter(Boolean);
  return words.length > 0 && words.every((w) => stop.has(w));
}

export function readingProblems(report: ReadingReport, ctx: ReadingContext): Problem[] {
  const out: Problem[] = [];
  const atText: Place = { file: ctx.display, ...(ctx.where.path ? { path: ctx.where.path } : {}) };
  if (report.words === 0) return [problem('text/empty', { id: ctx.id, markers: ctx.trimmed }, atText)];
  for (const w of report.warnings) {
    // Codes and wording come from the text model, which takes them from the catalogue.
    const p: Problem = { severity: 'warning', code: w.code as ProblemCode, file: ctx.display, message: w.message };
    if (w.hint !== undefined) p.hint = w.hint;
    if (w.line !== undefined) p.line = w.line;
    if (w.column !== undefined) p.column = w.column;
    out.push(p);
  }
  if (report.oneChapter && !ctx.pattern) out.push(problem('text/no-headings', { id: ctx.id }, atText));
  const stop = stopwords(ctx.language);
  ctx.cast.forEach((member, m) => {
    const counts = report.counts[m];
    if (!counts) return;
    const place = ctx.castPlaces[m];
    const seen = new Set<string>();
    member.aliases.forEach((alias, k) => {
      const key = formKey(alias);
      if (key === null || seen.has(key) || key === formKey(member.name)) return;
      seen.add(key);
      const count = counts.byForm[key] ?? 0;
      const args = { alias, id: member.id, name: member.name, text: ctx.id, count, others: counts.total - count };
      const at = place?.aliases[k] ?? place?.name ?? {};
      if (allStopwords(alias, stop)) out.push(problem('cast/common-word-alias', args, at));
      else if (count >= ALIAS_MIN_COUNT && count > ALIAS_MULTIPLE * args.others) {
        out.push(problem('cast/dominant-alias', { ...args, multiple: ALIAS_MULTIPLE, file: ctx.display }, at));
      }
    });
  });
  return out;
}
