/**
 * The reading edition of a text: every chapter with its paragraphs set as a
 * printed page sets them (./typography.ts), numbered as everything else in
 * Vitrine counts them: chapters from 1 through the whole text (as notes and
 * `vitrine check` count them), paragraphs from 1 within their chapter (as the
 * concordance, the phrase places and a passage's `paragraph` count them). The
 * site gives each chapter a page and each paragraph the anchor `#p<n>`.
 *
 * `passageOfToken` turns a word's position (a token index, as measures record
 * occurrences) into the paragraph that holds it, so that every place a panel
 * points at links into the edition by the same numbering.
 *
 * Pure and JSON-serialisable: it is cached with the measures and handed to
 * the site as part of the prepared exhibit.
 */
import type { TextModel, TrimmedLines } from '../text/model.ts';
import { wrapOfLengths } from '../text/structure.ts';
import { equalSegments } from '../stats/windows.ts';
import type { SetParagraph } from './typography.ts';
import { ordinaryIndent, setParagraph } from './typography.ts';

/** Bump when the edition made from the same text changes (it is part of the cache key). */
export const EDITION_VERSION = 1;

export interface EditionParagraph extends SetParagraph {
  /** 1-based within its chapter: the anchor `#p<n>`. */
  n: number;
  /** 1-based line of its first line in the source file. */
  line: number;
  /** Index of its first word token through the whole text, and how many it holds. */
  token: number;
  tokens: number;
}

export interface EditionChapter {
  /** 1-based through the whole text. */
  number: number;
  title: string;
  /** The heading line as printed, or null for the single chapter of a text without headings. */
  heading: string | null;
  /** 0-based index into `parts`, or null. */
  part: number | null;
  /** 1-based within its part, or null. */
  numberInPart: number | null;
  /** 1-based source line of the heading. */
  line: number;
  /** Index of its first word token through the whole text, and how many words it holds. */
  token: number;
  words: number;
  paragraphs: EditionParagraph[];
}

export interface EditionPart {
  title: string;
  heading: string;
  /** 1-based number (through the text) of its first chapter, and how many it holds. */
  firstChapter: number;
  chapters: number;
}

export interface Edition {
  /** Word tokens in the whole text. */
  words: number;
  parts: EditionPart[];
  chapters: EditionChapter[];
  /** Source lines left out as front and back matter. */
  trimmed: { front?: TrimmedLines; back?: TrimmedLines };
}

/** A place in the edition: chapter (1-based through the text) and paragraph (1-based within it). */
export interface Passage {
  chapter: number;
  paragraph: number;
}

/** The source lines of paragraph `p`, the first from the start of its line (so that its indentation shows). */
function sourceLines(model: TextModel, p: number): string[] {
  const start = model.paragraphs.start[p]!;
  const lineStart = model.text.lastIndexOf('\n', start - 1) + 1;
  return model.text.slice(lineStart, model.paragraphs.end[p]!).split('\n').filter((l) => l.trim() !== '');
}

export function buildEdition(model: TextModel): Edition {
  const { paragraphs, tokens } = model;
  const lines: string[][] = [];
  for (let p = 0; p < paragraphs.count; p++) lines.push(sourceLines(model, p));
  const lengths = lines.filter((ls) => ls.length >= 2).flatMap((ls) => ls.map((l) => l.trim().length));
  const measure = { wrap: wrapOfLengths(lengths), ...ordinaryIndent(lines) };
  // First token of each paragraph (paragraphs without words start where the next word is).
  const first = new Uint32Array(paragraphs.count + 1).fill(tokens.count);
  for (let t = tokens.count - 1; t >= 0; t--) first[tokens.paragraph[t]!] = t;
  for (let p = paragraphs.count - 1; p >= 0; p--) if (first[p]! > first[p + 1]!) first[p] = first[p + 1]!;
  const chapters = model.chapters.map((ch): EditionChapter => {
    const paras: EditionParagraph[] = [];
    for (let k = 0; k < ch.paragraphCount; k++) {
      const p = ch.firstParagraph + k;
      paras.push({ n: k + 1, line: paragraphs.line[p]!, token: first[p]!, tokens: first[p + 1]! - first[p]!, ...setParagraph(lines[p]!, measure) });
    }
    return {
      number: ch.index + 1,
      title: ch.title,
      heading: ch.heading,
      part: ch.partIndex,
      numberInPart: ch.numberInPart,
      line: ch.line,
      token: ch.firstToken,
      words: ch.tokenCount,
      paragraphs: paras,
    };
  });
  return {
    words: tokens.count,
    parts: (model.parts ?? []).map((p) => ({ title: p.title, heading: p.heading, firstChapter: p.firstChapter + 1, chapters: p.chapterCount })),
    chapters,
    trimmed: model.trimmed ?? {},
  };
}

/**
 * The paragraph holding word token `token` (an index through the whole text), or null when
 * the edition has no such word. Binary search over the first tokens of chapters, then of
 * their paragraphs.
 */
export function passageOfToken(edition: Edition, token: number): Passage | null {
  if (!Number.isInteger(token) || token < 0 || token >= edition.words) return null;
  const ch = edition.chapters[lastAtOrBefore(edition.chapters, token)];
  const p = ch?.paragraphs[lastAtOrBefore(ch.paragraphs, token)];
  if (!ch || !p || token < p.token || token >= p.token + p.tokens) return null;
  return { chapter: ch.number, paragraph: p.n };
}

/** Index of the last item whose first token is at or before `token` (items in text order). */
function lastAtOrBefore(items: readonly { token: number }[], token: number): number {
  let a = 0;
  let b = items.length - 1;
  while (a < b) {
    const mid = (a + b + 1) >> 1;
    if (items[mid]!.token <= token) a = mid;
    else b = mid - 1;
  }
  return a;
}

/** The paragraph where equal segment `segment` (1-based, of `of`) begins, as measures cut segments (stats/windows.ts). */
export function passageOfSegment(edition: Edition, segment: number, of: number): Passage | null {
  if (!Number.isInteger(segment) || !Number.isInteger(of) || of < 1 || segment < 1 || segment > of) return null;
  return passageOfToken(edition, equalSegments(edition.words, of)[segment - 1]![0]);
}

/** The paragraph `n` of chapter `chapter`, or null when the edition has none. */
export function paragraphAt(edition: Edition, at: Passage): EditionParagraph | null {
  return edition.chapters[at.chapter - 1]?.paragraphs[at.paragraph - 1] ?? null;
}
