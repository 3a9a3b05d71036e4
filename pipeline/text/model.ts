/**
 * The text model: a plain text split into chapters, paragraphs, sentences and
 * word tokens. Offsets are UTF-16 code-unit offsets into `text` (the normalised
 * text: BOM removed, CRLF/CR turned into LF). `sourceOffset()` maps one back
 * to the file as read. Per-token and per-sentence data live in typed-array
 * columns so that a million-word text stays compact.
 */
import type { ProblemCode } from '../problems/catalogue.ts';

export interface Chapter {
  /** 0-based position in `chapters`. */
  index: number;
  /** Display title, e.g. "Chapter III: The Weir" or "III. The Weir"; a generated "Chapter 3" when the heading has no words. */
  title: string;
  /** The heading line exactly as it stands in the text, or null for an implicit chapter (a text with no headings). */
  heading: string | null;
  /** The enclosing BOOK/PART/VOLUME heading's display title, if any. */
  part: string | null;
  /** Index of the enclosing part in `parts`, or null (no parts, or a prologue, epilogue or interlude outside them). */
  partIndex: number | null;
  /** 1-based position of the chapter within its part, or null outside parts. */
  numberInPart: number | null;
  /** 1-based line in the source file of the heading (or of the first paragraph). */
  line: number;
  /** Character range of the chapter body in `text`. */
  start: number;
  end: number;
  firstParagraph: number;
  paragraphCount: number;
  firstSentence: number;
  sentenceCount: number;
  firstToken: number;
  tokenCount: number;
}

/** A part (BOOK, PART, VOLUME) holding chapters: the upper level of a two-level text. */
export interface Part {
  /** 0-based position in `parts`. */
  index: number;
  /** Display title, e.g. "Book Two: The Miller". */
  title: string;
  /** The heading line as it stands in the text. */
  heading: string;
  /** 1-based line of the heading in the source file. */
  line: number;
  /** Index in `chapters` of its first chapter, and how many it holds. */
  firstChapter: number;
  chapterCount: number;
}

/** What the heading detection took and turned down, with source lines. */
export interface HeadingReport {
  taken: { line: number; text: string; title: string; level: 'part' | 'chapter' }[];
  rejected: { line: number; text: string; reason: string }[];
}

/** Lines trimmed from the front or back of the file (1-based, inclusive). */
export interface TrimmedLines {
  from: number;
  to: number;
  /** What marked the cut: the plan's marker, or the e-text licence line that was found. */
  marker: string;
  /** True when found without a marker in the plan. */
  automatic: boolean;
}

export interface Columns {
  count: number;
}

export interface ParagraphColumns extends Columns {
  start: Uint32Array;
  end: Uint32Array;
  chapter: Uint32Array;
  /** 1-based source line of the paragraph's first line. */
  line: Uint32Array;
}

export interface SentenceColumns extends Columns {
  start: Uint32Array;
  end: Uint32Array;
  paragraph: Uint32Array;
  firstToken: Uint32Array;
  tokenCount: Uint32Array;
}

export interface TokenColumns extends Columns {
  start: Uint32Array;
  end: Uint32Array;
  sentence: Uint32Array;
  paragraph: Uint32Array;
  chapter: Uint32Array;
  /** Index into `vocab` of the token's lower-cased form. */
  type: Uint32Array;
  /** Bit flags, see TOKEN_FLAGS. */
  flags: Uint8Array;
}

export const TOKEN_FLAGS = {
  /** Starts with an upper-case letter. */
  capitalised: 1,
  /** Made only of digits (and separators). */
  numeric: 2,
  /** First word of its sentence. */
  sentenceInitial: 4,
} as const;

export interface TextWarning {
  /** A code of the problem catalogue (pipeline/problems/catalogue.ts). */
  code: ProblemCode;
  message: string;
  hint?: string;
  line?: number;
  column?: number;
}

export interface TextModel {
  /** The text's id in the plan (or the file name for ad-hoc use). */
  id: string;
  /** sha256 (hex) of the file's bytes as read. */
  hash: string;
  /** Normalised text. */
  text: string;
  chapters: Chapter[];
  paragraphs: ParagraphColumns;
  sentences: SentenceColumns;
  tokens: TokenColumns;
  /** Lower-cased word forms; `tokens.type[i]` indexes this. */
  vocab: string[];
  /** Map an offset in `text` to the code-unit offset in the source as read (before BOM/CRLF normalisation). */
  sourceOffset(offset: number): number;
  /** Map an offset in `text` to a 1-based line and column in the source file. */
  position(offset: number): { line: number; column: number };
  warnings: TextWarning[];
  /**
   * Stretches of `text` outside every chapter (text before the first chapter
   * heading, or between a part heading and its first chapter). They have no
   * paragraphs, sentences or tokens. Empty when every paragraph is in a chapter.
   */
  skipped?: TextRange[];
  /** The parts of a two-level text, in order; empty when chapters are not grouped into parts. */
  parts?: Part[];
  /** The headings taken and the near-misses turned down. */
  headings?: HeadingReport;
  /** Front and back matter trimmed before reading (by the plan's markers or an e-text licence header and footer). */
  trimmed?: { front?: TrimmedLines; back?: TrimmedLines };
}

/** A stretch of `text` and the 1-based source line where it begins. */
export interface TextRange {
  start: number;
  end: number;
  line: number;
}

export interface TextOptions {
  id: string;
  /**
   * Trim everything before the first line that contains this marker (the marker line is dropped too).
   * Without one, an e-text licence header ending in a "*** START OF …" line is trimmed.
   */
  start?: string;
  /**
   * Trim everything from the first line after `start` that contains this marker.
   * Without one, an e-text licence footer from its "*** END OF …" line (or the "End of the … e-book" line just above) is trimmed.
   */
  end?: string;
  /** A regular expression (source string, matched per line, case-insensitive) that a chapter heading line matches. Replaces automatic detection. */
  chapterPattern?: string;
}

export interface CastMember {
  id: string;
  name: string;
  aliases: string[];
  pronoun?: 'he' | 'she' | 'they' | 'it';
}

export interface Mentions {
  count: number;
  /** Index of the first token of the mention. */
  token: Uint32Array;
  /** Number of tokens the mention spans. */
  length: Uint8Array;
  /** Index into the cast array. */
  member: Uint32Array;
  /** Index into `forms` of the name or alias that matched. */
  form: Uint32Array;
  /** Every form looked for, as the key `formKey()` (text/mentions.ts) gives a name or alias. */
  forms: string[];
  /** Mentions that could name more than one cast member; they are reported, not attributed. */
  ambiguous: AmbiguousMention[];
}

export interface AmbiguousMention {
  token: number;
  text: string;
  chapter: number;
  candidates: string[];
}
