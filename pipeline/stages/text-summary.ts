import type { Problem } from '../problems/problem.ts';
import type { HeadingReport, TrimmedLines } from '../text/model.ts';
import type { DialogueReport } from '../dialogue/report.ts';

/** Per text: what `vitrine check` prints. */
export interface TextSummary {
  id: string;
  source: string;
  words: number;
  /** Paragraphs are counted as the reading edition numbers them (within the chapter). */
  chapters: { number: number; title: string; words: number; paragraphs: number; part: string | null; line: number }[];
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
