/**
 * What `vitrine check` says about a text's dialogue: the convention read for
 * each chapter (and each scene that differs), warnings where quotation marks
 * stay unbalanced or where quote-like marks are frequent but no speech was
 * found, and the speakers outside the cast heard most often.
 */

import type { CastMember, Mentions, TextModel } from '../text/model.ts';
import type { DialogueSettings } from '../measures/types.ts';
import { analyseDialogue } from './attribute.ts';
import { CONVENTION_NAMES, marksSetting, type Convention, type ConventionMap, type ConventionSource } from './conventions.ts';
import { findQuotes, type Quote } from './quotes.ts';

export interface StretchReport {
  /** 1-based paragraph within the chapter where the stretch starts. */
  paragraph: number;
  /** 1-based source line of that paragraph. */
  line: number;
  convention: Convention;
  source: ConventionSource;
}

export interface ChapterMarks {
  /** 1-based chapter. */
  chapter: number;
  convention: Convention;
  source: ConventionSource;
  /** Scenes in other marks than the chapter's, in order (empty when the whole chapter shares one convention). */
  scenes: StretchReport[];
}

export interface DialogueWarning {
  code: 'dialogue/unbalanced' | 'dialogue/marks-without-speech';
  /** 1-based chapter and paragraph within it. */
  chapter: number;
  paragraph: number;
  line: number;
  message: string;
}

export interface OutsiderCount {
  /** As the text names or describes them ("the maid", "Mrs Threlkeld"). */
  name: string;
  turns: number;
  words: number;
}

export interface DialogueReport {
  chapters: ChapterMarks[];
  warnings: DialogueWarning[];
  /** Speakers outside the cast, most turns first (empty without a cast). */
  outsiders: OutsiderCount[];
}

/** Characters that print like quotation marks, and dashes opening a paragraph. */
const QUOTE_LIKE = /["“”‘’'«»„‚‹›]/g;

/** A stretch has "frequent" marks when it has at least this many and this many per 1,000 characters. common practice, no source. */
const FREQUENT = { count: 6, perThousand: 2 };

/** Group outsiders' turns by their name as printed (case aside), most turns first. */
export function countOutsiders(turns: readonly { rule: string; outsider: string | null; words: number }[]): OutsiderCount[] {
  const by = new Map<string, OutsiderCount>();
  for (const t of turns) {
    if (t.rule !== 'outsider' || t.outsider === null) continue;
    const key = t.outsider.toLowerCase();
    const c = by.get(key) ?? { name: t.outsider, turns: 0, words: 0 };
    c.turns++;
    c.words += t.words;
    by.set(key, c);
  }
  return [...by.values()].sort((a, b) => b.turns - a.turns || b.words - a.words || a.name.localeCompare(b.name));
}

/** The convention of each chapter, and of its scenes when they differ, numbered as curators read them. */
export function chapterMarks(model: TextModel, conventions: ConventionMap): ChapterMarks[] {
  return conventions.chapters.map((c) => {
    const first = model.chapters[c.chapter].firstParagraph;
    const differ = c.scenes.length > 1 || c.scenes[0]?.convention !== c.convention;
    return {
      chapter: c.chapter + 1,
      convention: c.convention,
      source: c.source,
      scenes: differ
        ? c.scenes.map((s) => ({ paragraph: s.firstParagraph - first + 1, line: model.paragraphs.line[s.firstParagraph], convention: s.convention, source: s.source }))
        : [],
    };
  });
}

/** The dialogue report of one text. Outsiders are counted only with a cast (without one every speaker is outside it). */
export function dialogueReport(model: TextModel, cast: CastMember[], mentions: Mentions, dialogue?: DialogueSettings): DialogueReport {
  const scan = cast.length
    ? analyseDialogue({ model, cast, mentions, dialogue })
    : { ...findQuotes(model, dialogue?.verbs ?? [], marksSetting(dialogue?.marks)), turns: [] };
  const { paragraphs } = model;
  const line = (p: number): number => paragraphs.line[p];
  const chapters = chapterMarks(model, scan.conventions);
  const warnings: DialogueWarning[] = scan.problems.map((p) => ({ code: 'dialogue/unbalanced', chapter: p.chapter, paragraph: p.paragraph, line: p.line, message: p.message }));

  // Quote-like marks frequent in a stretch, and no speech found there.
  const speechIn = new Set<number>();
  for (const q of scan.quotes as readonly Quote[]) if (q.kind === 'speech') speechIn.add(q.paragraph);
  for (const c of scan.conventions.chapters) {
    const first = model.chapters[c.chapter].firstParagraph;
    for (const s of c.scenes) {
      let marks = 0;
      let chars = 0;
      let firstMarked = -1;
      let speech = false;
      for (let p = s.firstParagraph; p < s.endParagraph; p++) {
        const body = model.text.slice(paragraphs.start[p], paragraphs.end[p]);
        chars += body.length;
        const n = (body.match(QUOTE_LIKE) ?? []).length - (body.match(/\p{L}['’]\p{L}/gu) ?? []).length + (/^[—–―]/.test(body) ? 1 : 0);
        if (n > 0 && firstMarked < 0) firstMarked = p;
        marks += Math.max(0, n);
        if (speechIn.has(p)) speech = true;
      }
      if (speech || marks < FREQUENT.count || (marks * 1000) / Math.max(1, chars) < FREQUENT.perThousand) continue;
      const where = s.endParagraph - s.firstParagraph === model.chapters[c.chapter].paragraphCount ? 'this chapter' : `this scene (paragraphs ${s.firstParagraph - first + 1}–${s.endParagraph - first})`;
      warnings.push({
        code: 'dialogue/marks-without-speech',
        chapter: c.chapter + 1,
        paragraph: firstMarked - first + 1,
        line: line(firstMarked),
        message: `${where} has ${marks} quotation marks or dashes, but no speech was found in it when read as ${CONVENTION_NAMES[s.convention]}. If its speech is set another way, name the marks for chapter ${c.chapter + 1} in the plan (dialogue.marks).`,
      });
    }
  }
  warnings.sort((a, b) => a.line - b.line);
  return { chapters, warnings, outsiders: countOutsiders(scan.turns) };
}

/** How a stretch's convention was decided, in a few words. */
const SOURCE_WORDS: Record<ConventionSource, string> = { plan: 'set in the plan', read: 'read from its marks', text: 'as the rest of the text' };

/** The lines `vitrine check` prints under a chapter: its speech marks, and scenes in other marks. */
export function describeChapterMarks(c: ChapterMarks): string[] {
  const out = [`speech in ${CONVENTION_NAMES[c.convention]} (${SOURCE_WORDS[c.source]})`];
  for (const s of c.scenes) out.push(`from paragraph ${s.paragraph} (line ${s.line}): ${CONVENTION_NAMES[s.convention]} (${SOURCE_WORDS[s.source]})`);
  return out;
}
