/**
 * The quotation finder: every quoted span of a text, in text order.
 *
 * The convention that sets off speech is read stretch by stretch (chapters,
 * scenes: conventions.ts), or fixed by the plan; each paragraph's marks are
 * paired by its stretch's convention (scan.ts), or, in dash dialogue, its
 * speech is read from its dashes (dashes.ts). A quotation
 * left open at a paragraph's end goes on when the next paragraph of the
 * chapter opens with a mark (a speech over several paragraphs: one entry per
 * paragraph, linked by `continued` / `continuation`). Otherwise, in the single
 * convention, a right mark read as an apostrophe closes it after all (the last
 * such candidate); failing that the quotation ends with its paragraph and a
 * problem is reported. A right mark read as an apostrophe but followed by a speech verb
 * closes its quotation in any case. Each quotation is then classed as speech
 * or text (kind.ts).
 */

import type { TextModel } from '../text/model.ts';
import { tokenise } from '../text/tokens.ts';
import { AUTO, readConventions, type Convention, type ConventionMap, type MarksSetting } from './conventions.ts';
import { opensParagraph, scanParagraph, type ParagraphMarks, type Span } from './scan.ts';
import { scanDashParagraph } from './dashes.ts';
import { quoteKind } from './kind.ts';
import { speechVerbs, type VerbList } from './verbs.ts';

export interface Quote {
  /** 0-based position in the list. */
  index: number;
  /** Offset of the opening mark in `model.text`. */
  open: number;
  /** Range of the words inside the marks. */
  start: number;
  end: number;
  /** Offset of the closing mark, or -1 when there is none (a speech that goes on, or a missing mark). */
  close: number;
  /** 0-based chapter. */
  chapter: number;
  /** Index into `model.paragraphs`. */
  paragraph: number;
  /** 'text' for written or displayed words (a sign, a letter, a scare-quoted word), left out of speech counts. */
  kind: 'speech' | 'text';
  /** The speech goes on in the next paragraph (this part has no closing mark; the next paragraph opens again). */
  continued: boolean;
  /** This part goes on from the previous paragraph's quotation. */
  continuation: boolean;
  /** The words inside the marks, runs of white space as one space. */
  text: string;
  /** Word tokens inside the marks. */
  words: number;
  /** The convention of the stretch the quotation stands in. */
  marks: Convention;
}

export interface QuoteProblem {
  /** 1-based chapter. */
  chapter: number;
  /** 1-based paragraph within the chapter. */
  paragraph: number;
  /** 1-based line in the source file. */
  line: number;
  message: string;
}

export interface QuoteScan {
  /** The convention of most of the text. */
  convention: Convention;
  /** The convention of every chapter and scene. */
  conventions: ConventionMap;
  quotes: Quote[];
  problems: QuoteProblem[];
}

function excerpt(text: string, from: number, to: number): string {
  const s = text.slice(from, Math.min(to, from + 40)).replace(/\s+/g, ' ').trim();
  return to - from > 40 ? `${s}…` : s;
}

const PRONOUNS = new Set(['he', 'she', 'they', 'i', 'we']);

/** Whether a tag follows offset i: a speech verb, or a pronoun or capitalised name and then a speech verb ("’ she said"). */
function tagFollows(text: string, i: number, b: number, verbs: VerbList): boolean {
  const s = text.slice(i + 1, Math.min(b, i + 60));
  if (!/^[\s,]/.test(s)) return false;
  const words = tokenise(s).slice(0, 2).map((t) => s.slice(t.start, t.end));
  if (words.length === 0) return false;
  if (verbs.single.has(words[0].toLowerCase())) return true;
  const subject = PRONOUNS.has(words[0].toLowerCase()) || /^\p{Lu}/u.test(words[0]);
  return subject && words.length > 1 && verbs.single.has(words[1].toLowerCase());
}

/** Find every quotation of the text. `extraVerbs` are the plan's speech verbs (they help tell a tag); `marks` the plan's conventions. */
export function findQuotes(model: TextModel, extraVerbs: readonly string[] = [], marks: MarksSetting = AUTO): QuoteScan {
  const { text, paragraphs, chapters } = model;
  const verbs = speechVerbs(extraVerbs);
  const conventions = readConventions(model, marks);
  const quotes: Quote[] = [];
  const problems: QuoteProblem[] = [];
  const report = (p: number, at: number, message: string): void => {
    const ch = paragraphs.chapter[p];
    problems.push({ chapter: ch + 1, paragraph: p - chapters[ch].firstParagraph + 1, line: model.position(at).line, message });
  };
  const push = (s: Span, p: number, kind: Quote['kind'], continuation: boolean): void => {
    const content = text.slice(s.start, s.end);
    quotes.push({
      index: quotes.length,
      open: s.open,
      start: s.start,
      end: s.end,
      close: s.close,
      chapter: paragraphs.chapter[p],
      paragraph: p,
      kind,
      continued: false,
      continuation,
      text: content.replace(/\s+/g, ' ').trim(),
      words: tokenise(content).length,
      marks: conventions.of(p),
    });
  };

  for (const chapter of chapters) {
    const first = chapter.firstParagraph;
    const last = first + chapter.paragraphCount;
    let carry: Quote | null = null;
    for (let p = first; p < last; p++) {
      const a = paragraphs.start[p];
      const b = paragraphs.end[p];
      const convention = conventions.of(p);
      const unclosed = (q: Quote): void => {
        q.continued = false;
        report(q.paragraph, q.open, `a quotation (“${excerpt(text, q.start, q.end)}”) has no closing mark and the next paragraph does not go on with it. Add the missing closing mark.`);
      };
      if (convention === 'dash') {
        if (carry) unclosed(carry);
        carry = null;
        for (const s of scanDashParagraph(text, a, b, verbs)) push(s, p, 'speech', false);
        continue;
      }
      const reversed = conventions.reversed(p);
      const nextOpens = p + 1 < last && conventions.of(p + 1) === convention && opensParagraph(text, paragraphs.start[p + 1], paragraphs.end[p + 1], convention);
      const continuing = carry !== null;
      let found: ParagraphMarks = scanParagraph(text, a, b, convention, new Set(), reversed, continuing);
      // Single convention: an open quotation closes at a right mark read as an apostrophe, when a tag follows it
      // or when the speech cannot go on into the next paragraph.
      const forced = new Set<number>();
      for (let guard = 0; convention === 'single' && guard < 50; guard++) {
        // A candidate followed by a tag closes its quotation ("the nets’ she said, ‘are torn’").
        const tagged = [...found.spans.flatMap((sp) => sp.ambiguous), ...(found.open?.ambiguous ?? [])].find((i) => !forced.has(i) && tagFollows(text, i, b, verbs));
        const amb = found.open?.ambiguous ?? [];
        const pick = tagged ?? (found.open && !nextOpens && amb.length > 0 ? amb[amb.length - 1] : undefined);
        if (pick === undefined) break;
        forced.add(pick);
        found = scanParagraph(text, a, b, convention, forced, reversed, continuing);
      }
      for (const pr of found.problems) {
        report(p, pr.at, `${pr.message} (at “${excerpt(text, pr.at, b)}”). Check the marks there; the rest of the text was read as usual.`);
      }

      const spans = [...found.spans];
      if (found.open) {
        let e = b;
        while (e > found.open.start && /\s/.test(text[e - 1])) e--;
        spans.push({ open: found.open.open, start: found.open.start, end: e, close: -1, ambiguous: found.open.ambiguous });
      }
      const startsWithOpen = spans.length > 0 && spans[0].open === a;
      if (carry && !startsWithOpen) unclosed(carry);
      spans.forEach((s, k) => {
        if (!/[\p{L}\p{N}]/u.test(text.slice(s.start, s.end))) return;
        const isContinuation = k === 0 && carry !== null && s.open === a;
        const kind = isContinuation ? carry!.kind : quoteKind(text, s, a, b, p > first ? { start: paragraphs.start[p - 1], end: paragraphs.end[p - 1] } : null, verbs);
        push(s, p, kind, isContinuation);
      });
      carry = null;
      if (found.open) {
        const q = quotes[quotes.length - 1];
        if (q && q.open === found.open.open) {
          if (nextOpens) {
            q.continued = true;
            carry = q;
          } else {
            report(
              p,
              found.open.open,
              `a quotation opens (“${excerpt(text, found.open.start, b)}”) and has no closing mark before the paragraph ends, and the next paragraph does not open a new one; it was taken to end with its paragraph. Add the missing closing mark, or open the next paragraph with a quotation mark if the speech goes on.`,
            );
          }
        }
      }
    }
  }
  return { convention: conventions.text, conventions, quotes, problems };
}
