import { z } from 'zod';
import type { Measure } from './types.ts';
import type { BarsData, LinesData } from '../charts/types.ts';
import { chapterTick } from '../text/labels.ts';

export const structureParams = z
  .object({
    unit: z
      .enum(['words', 'paragraphs', 'sentences'])
      .default('words')
      .describe('What the chart counts per chapter. Default: "words". The table always has all three.'),
  })
  .strict();

export type StructureParams = z.infer<typeof structureParams>;

export interface StructureResult {
  words: number;
  paragraphs: number;
  sentences: number;
  chapters: {
    /** Running number, from 1 through the whole text. */
    number: number;
    title: string;
    /** Display title of the enclosing part, or null. */
    part: string | null;
    /** 1-based number of the enclosing part, and the chapter's position within it (null outside parts). */
    partNumber: number | null;
    numberInPart: number | null;
    words: number;
    paragraphs: number;
    sentences: number;
    /** Mean sentence length in words. */
    meanSentence: number;
    /** Token range, for locating the chapter in narrative time. */
    firstToken: number;
  }[];
  /** Present only for a text with two levels: the parts (BOOK, PART, VOLUME) and the chapters each holds. */
  parts?: {
    number: number;
    title: string;
    heading: string;
    /** Running number of its first chapter, and how many chapters it holds. */
    firstChapter: number;
    chapters: number;
    words: number;
  }[];
}

export const structure: Measure<StructureParams, StructureResult> = {
  name: 'structure',
  version: 2,
  params: structureParams,
  needsCast: false,
  reads: {},
  compute({ model }) {
    const chapters = model.chapters.map((c) => ({
      number: c.index + 1,
      title: c.title,
      part: c.part,
      partNumber: c.partIndex === null ? null : c.partIndex + 1,
      numberInPart: c.numberInPart,
      words: c.tokenCount,
      paragraphs: c.paragraphCount,
      sentences: c.sentenceCount,
      meanSentence: c.sentenceCount ? round(c.tokenCount / c.sentenceCount, 2) : 0,
      firstToken: c.firstToken,
    }));
    const result: StructureResult = {
      words: chapters.reduce((s, c) => s + c.words, 0),
      paragraphs: chapters.reduce((s, c) => s + c.paragraphs, 0),
      sentences: chapters.reduce((s, c) => s + c.sentences, 0),
      chapters,
    };
    const parts = model.parts ?? [];
    if (parts.length > 0) {
      result.parts = parts.map((p) => ({
        number: p.index + 1,
        title: p.title,
        heading: p.heading,
        firstChapter: p.firstChapter + 1,
        chapters: p.chapterCount,
        words: chapters.filter((c) => c.partNumber === p.index + 1).reduce((s, c) => s + c.words, 0),
      }));
    }
    return result;
  },
  method: {
    what: 'The length of each chapter: how many words, paragraphs and sentences it holds.',
    formula:
      'Chapters start at heading lines: a unit word and a number (Chapter, Stave, Letter, Canto, Section; in words, figures, Roman numerals or ordinals), a bare numeral where the text has no such words, or Prologue, Epilogue, Interlude; Book, Part and Volume headings group the chapters into parts. Words are runs of letters and digits (with inner apostrophes and hyphens, so "o’clock" and "well-kept" count once). Paragraphs are blocks separated by a blank line. Sentences end at . ! ? or … followed by a capital or the end of the paragraph, except after common abbreviations (Mr., Mrs., Dr., St.) and initials.',
    source: 'Word and sentence boundaries follow the general approach of Unicode UAX #29 (Text Segmentation), adapted for prose.',
    caveats: [
      'Word counts depend on the tokenising convention: hyphenated compounds count as one word here; other tools may count two.',
      'Chapter boundaries come from the headings detected in the text; a missed or spurious heading changes every figure. `vitrine check` lists each heading taken, with its line, and each near-miss turned down, with why.',
      'Front and back matter (title page, contents, preface, an e-text licence) are left out; what was trimmed is listed by `vitrine check`.',
      'Sentence splitting can err on unusual abbreviations and on dialogue punctuation.',
    ],
  },
  table(result) {
    const columns = [
      { key: 'number', label: 'Chapter', numeric: true },
      { key: 'title', label: 'Title', numeric: false },
      { key: 'words', label: 'Words', numeric: true },
      { key: 'paragraphs', label: 'Paragraphs', numeric: true },
      { key: 'sentences', label: 'Sentences', numeric: true },
      { key: 'meanSentence', label: 'Mean sentence length (words)', numeric: true },
    ];
    const rows = result.chapters.map((c) => [c.number, c.title, c.words, c.paragraphs, c.sentences, c.meanSentence]);
    if (!result.parts) return { columns, rows };
    // A two-level text: the part of each chapter after its title.
    columns.splice(2, 0, { key: 'part', label: 'Part', numeric: false });
    result.chapters.forEach((c, i) => rows[i]!.splice(2, 0, c.part ?? ''));
    return { columns, rows };
  },
  views: {
    bars(result, params): BarsData {
      const unit = params.unit;
      return {
        kind: 'bars',
        title: `${capitalise(unit)} per chapter`,
        categoryLabel: 'Chapter',
        valueLabel: capitalise(unit),
        categories: result.chapters.map((c) => c.title),
        series: [{ id: unit, name: capitalise(unit), values: result.chapters.map((c) => c[unit]) }],
        format: 'count',
      };
    },
    lines(result, params): LinesData {
      const unit = params.unit;
      return {
        kind: 'lines',
        title: `${capitalise(unit)} per chapter`,
        xLabel: 'Chapter',
        yLabel: capitalise(unit),
        points: result.chapters.map((c) => c.title),
        ticks: result.chapters.map((c) => chapterTick(c.number)),
        series: [{ id: unit, name: capitalise(unit), values: result.chapters.map((c) => c[unit]) }],
        format: 'count',
      };
    },
  },
};

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}
