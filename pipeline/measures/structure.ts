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
    number: number;
    title: string;
    part: string | null;
    words: number;
    paragraphs: number;
    sentences: number;
    /** Mean sentence length in words. */
    meanSentence: number;
    /** Token range, for locating the chapter in narrative time. */
    firstToken: number;
  }[];
}

export const structure: Measure<StructureParams, StructureResult> = {
  name: 'structure',
  version: 1,
  params: structureParams,
  needsCast: false,
  compute({ model }) {
    const chapters = model.chapters.map((c) => ({
      number: c.index + 1,
      title: c.title,
      part: c.part,
      words: c.tokenCount,
      paragraphs: c.paragraphCount,
      sentences: c.sentenceCount,
      meanSentence: c.sentenceCount ? round(c.tokenCount / c.sentenceCount, 2) : 0,
      firstToken: c.firstToken,
    }));
    return {
      words: chapters.reduce((s, c) => s + c.words, 0),
      paragraphs: chapters.reduce((s, c) => s + c.paragraphs, 0),
      sentences: chapters.reduce((s, c) => s + c.sentences, 0),
      chapters,
    };
  },
  method: {
    what: 'The length of each chapter: how many words, paragraphs and sentences it holds.',
    formula:
      'Words are runs of letters and digits (with inner apostrophes and hyphens, so "o’clock" and "well-kept" count once). Paragraphs are blocks separated by a blank line. Sentences end at . ! ? or … followed by a capital or the end of the paragraph, except after common abbreviations (Mr., Mrs., Dr., St.) and initials.',
    source: 'Word and sentence boundaries follow the general approach of Unicode UAX #29 (Text Segmentation), adapted for prose.',
    caveats: [
      'Word counts depend on the tokenising convention: hyphenated compounds count as one word here; other tools may count two.',
      'Chapter boundaries come from the headings detected in the text; a missed or spurious heading changes every figure.',
      'Sentence splitting can err on unusual abbreviations and on dialogue punctuation.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'number', label: 'Chapter', numeric: true },
        { key: 'title', label: 'Title', numeric: false },
        { key: 'words', label: 'Words', numeric: true },
        { key: 'paragraphs', label: 'Paragraphs', numeric: true },
        { key: 'sentences', label: 'Sentences', numeric: true },
        { key: 'meanSentence', label: 'Mean sentence length (words)', numeric: true },
      ],
      rows: result.chapters.map((c) => [c.number, c.title, c.words, c.paragraphs, c.sentences, c.meanSentence]),
    };
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
