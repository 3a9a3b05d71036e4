/**
 * The notes stage: a curator's notes on one panel, from the plan to the
 * drawn chart, in one hop.
 *
 * A note in the plan points at a chapter (or a paragraph of one), a character,
 * a word or a segment.
 * Here it is made exact against the text (the chapter's title, the
 * character's name, how many segments the measure counted) or rejected when
 * the text has no such thing; then the chart draws the panel with its
 * notes, its kind placing each note once (the kind's `place`, see
 * charts/chart.ts), and says for each one whether it was drawn. A note the
 * chart shows nowhere comes back as a problem at the note's own line in the
 * plan: an error when it names a character, word or segment the chart does
 * not show (most likely a slip), a warning when the chart has the target but
 * no place for the note (it is then shown only beside the chart).
 *
 * A note at a chapter, a paragraph or a segment also names its passage of the
 * reading edition (the chapter, or the paragraph where the segment begins),
 * which the site links it to. A paragraph is drawn where its chapter is, or,
 * on a chart of segments, at the segment holding its first word.
 */

import type { AnyChart } from '../charts/index.ts';
import type { ChartOutput, PinnedNote, TextAt } from '../charts/types.ts';
import type { Problem } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';
import type { PreparedNote } from './prepared.ts';
import type { CastMember } from '../text/model.ts';
import type { Where } from './jobs.ts';
import type { Passage } from '../edition/edition.ts';

/** A note as the plan gives it: one target (a chapter may name its part: the third chapter of part 2, and a paragraph in it). */
export interface PlanNote {
  at: { part?: number; chapter?: number; paragraph?: number; character?: string; word?: string; segment?: number };
  text: string;
  where: Where;
}

/** What the text knows that the plan's targets refer to. */
export interface NoteFacts {
  /** The text's chapters, in order (chapter n is `chapters[n - 1]`), with how many paragraphs each holds when known. */
  chapters: readonly { title: string; paragraphs?: number }[];
  /** The text's parts, when it has two levels: chapter k of part p is running chapter `firstChapter + k - 1`. */
  parts?: readonly { title: string; firstChapter: number; chapters: number }[];
  cast: readonly CastMember[];
  /** How many equal segments the panel's measure counted by, if it did. */
  segments?: number;
  /** The reading edition's paragraph where segment k (1-based) of n begins, when the edition is known. */
  segmentPassage?: (segment: number, of: number) => Passage | null;
  /** The segment (1-based, of n) holding the first word of a paragraph, when the edition is known. */
  segmentOfPassage?: (at: Passage, of: number) => number | null;
}

/** A passage of the reading edition a note points at: a chapter, or a paragraph of it. */
export interface NotePassage {
  chapter: number;
  paragraph: number | null;
}

export interface DrawnPanel {
  out: ChartOutput;
  /** The notes shown beside the chart, in plan order: every note whose target exists. */
  notes: PreparedNote[];
  problems: Problem[];
}

type Exact = { at: TextAt; target: string; passage: NotePassage | null };

/** A plan note made exact against the text, with its target in words and its passage; or why the text has no such target. */
export function exactTarget(at: PlanNote['at'], facts: NoteFacts): Exact | { problem: string; hint: string } {
  const made = exactChapterOrOther(at, facts);
  if ('problem' in made || at.paragraph === undefined || !('chapter' in made.at)) return made;
  // A paragraph of the chapter made exact above.
  const chapter = made.at.chapter;
  const count = facts.chapters[chapter - 1]!.paragraphs;
  if (count !== undefined && at.paragraph > count) {
    return { problem: `the note points at paragraph ${at.paragraph} of ${made.target}, which has ${count} paragraph${count === 1 ? '' : 's'}`, hint: `use a paragraph from 1 to ${count}` };
  }
  const passage = { chapter, paragraph: at.paragraph };
  const segment = facts.segments && facts.segmentOfPassage ? facts.segmentOfPassage(passage, facts.segments) : null;
  return {
    at: segment !== null ? { segment, of: facts.segments! } : made.at,
    target: `${made.target}, paragraph ${at.paragraph}`,
    passage,
  };
}

function exactChapterOrOther(at: PlanNote['at'], facts: NoteFacts): Exact | { problem: string; hint: string } {
  if (at.chapter !== undefined && at.part !== undefined) {
    const part = facts.parts?.[at.part - 1];
    if (!part) {
      const n = facts.parts?.length ?? 0;
      return {
        problem: `the note points at part ${at.part}, but the text has ${n === 0 ? 'no parts' : `${n} part${n === 1 ? '' : 's'}`}`,
        hint: n === 0 ? 'point it at a chapter by its number through the text: { chapter: N }' : `use a part from 1 to ${n}`,
      };
    }
    if (at.chapter > part.chapters) {
      return { problem: `the note points at chapter ${at.chapter} of ${part.title}, which has ${part.chapters} chapter${part.chapters === 1 ? '' : 's'}`, hint: `use a chapter from 1 to ${part.chapters}` };
    }
    const running = part.firstChapter + at.chapter - 1;
    return { at: { chapter: running, title: facts.chapters[running - 1]!.title }, target: facts.chapters[running - 1]!.title, passage: { chapter: running, paragraph: null } };
  }
  if (at.chapter !== undefined) {
    const ch = facts.chapters[at.chapter - 1];
    if (!ch) return { problem: `the note points at chapter ${at.chapter}, but the text has ${facts.chapters.length} chapters`, hint: `use a chapter from 1 to ${facts.chapters.length}` };
    return { at: { chapter: at.chapter, title: ch.title }, target: ch.title, passage: { chapter: at.chapter, paragraph: null } };
  }
  if (at.character !== undefined) {
    const member = facts.cast.find((c) => c.id === at.character);
    if (!member) return { problem: `the note points at the character "${at.character}", who is not in the cast`, hint: 'use a cast id' };
    return { at: { character: member.id, name: member.name }, target: member.name, passage: null };
  }
  if (at.word !== undefined) return { at: { word: at.word }, target: `\u201C${at.word}\u201D`, passage: null };
  const seg = at.segment!;
  const passage = facts.segments && facts.segmentPassage ? facts.segmentPassage(seg, facts.segments) : null;
  return {
    at: { segment: seg, of: facts.segments ?? null },
    target: facts.segments ? `Segment ${seg} of ${facts.segments}` : `Segment ${seg}`,
    passage: passage ? { chapter: passage.chapter, paragraph: passage.paragraph } : null,
  };
}

/** Why the chart shows a note's target nowhere, as an error; null when the note may simply sit beside the chart. */
function absentProblem(at: TextAt): { problem: string; hint: string } | null {
  if ('character' in at) return { problem: `the note points at ${at.name}, who is not shown in this chart`, hint: 'point it at a character the chart shows, or at a chapter' };
  if ('word' in at) return { problem: `the note points at the word "${at.word}", which this chart does not show`, hint: 'point it at a word the chart shows' };
  if ('segment' in at) return { problem: `the note points at segment ${at.segment}, which this chart does not show`, hint: 'segments exist only on charts of a measure counted by segment' };
  // A chapter always exists in the text; a chart without chapters shows its note beside it.
  return null;
}

/** Draws one panel's chart with its notes; see the file comment. */
export function drawPanel(chart: AnyChart, data: { kind: string; title: string }, options: unknown, notes: readonly PlanNote[], facts: NoteFacts): DrawnPanel {
  const problems: Problem[] = [];
  const exact: { plan: PlanNote; pinned: PinnedNote & { at: TextAt }; target: string; passage: NotePassage | null }[] = [];
  notes.forEach((plan, i) => {
    const made = exactTarget(plan.at, facts);
    if ('problem' in made) problems.push(problem('note/unresolved', { detail: made.problem, hint: made.hint }, placeOf(plan.where)));
    else exact.push({ plan, pinned: { label: String(i + 1), text: plan.text, at: made.at }, target: made.target, passage: made.passage });
  });
  const out = chart.render(data, options as never, undefined, exact.map((e) => e.pinned));
  const shown: PreparedNote[] = [];
  exact.forEach((e, k) => {
    const outcome = out.notes[k]!;
    const absent = outcome.placed === 'absent' ? absentProblem(e.pinned.at) : null;
    if (absent) {
      problems.push(problem('note/unresolved', { detail: absent.problem, hint: absent.hint }, placeOf(e.plan.where)));
      return;
    }
    if (outcome.placed !== 'drawn') {
      problems.push(problem('note/not-drawn', {}, placeOf(e.plan.where)));
    }
    // A paragraph keeps its own words: the chart's would name only its chapter or segment.
    const words = e.plan.at.paragraph !== undefined ? e.target : (outcome.words ?? e.target);
    shown.push({ label: e.pinned.label, text: e.pinned.text, target: words, passage: e.passage });
  });
  return { out, notes: shown, problems };
}

function placeOf(where: Where) {
  return { file: where.file, line: where.line, column: where.column, path: where.path };
}
