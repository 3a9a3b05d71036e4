import { z } from 'zod';
import type { Measure } from './types.ts';
import { narrativeTime, segmentsOf } from './params.ts';
import type { BarsData, LinesData, Table } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { chapterTick, segmentLabel } from '../text/labels.ts';
import { syllablesPerType } from '../stats/syllables.ts';
import { fleschKincaidGrade, fleschReadingEase, lengthHistogram, nearestRank } from '../stats/readability.ts';
import { positionRanges, rangeOf } from '../stats/windows.ts';

export const readabilityParams = z
  .object({
    ...narrativeTime({ default: 'chapter', by: 'Score each chapter, or each equal segment of narrative time (a sentence belongs to the segment where it starts).' }),
    score: z
      .enum(['grade', 'ease'])
      .default('grade')
      .describe('What the charts show: "grade" (Flesch–Kincaid grade level, higher is harder) or "ease" (Flesch Reading Ease, higher is easier). Default: "grade".'),
    bars: z
      .enum(['positions', 'lengths'])
      .default('positions')
      .describe('What a bar chart shows: "positions" the score of each chapter or segment; "lengths" how many sentences have each length (a histogram of words per sentence). Default: "positions".'),
    binWidth: z.number().int().min(1).max(50).default(5).describe('Width, in words, of each bin of the sentence-length histogram. Default: 5.'),
    maxLength: z
      .number()
      .int()
      .min(1)
      .max(1000)
      .default(60)
      .describe('Sentences longer than this many words share the histogram’s last, open bin. Default: 60.'),
  })
  .strict();

export type ReadabilityParams = z.infer<typeof readabilityParams>;

export interface ReadabilityScores {
  words: number;
  sentences: number;
  syllables: number;
  /** Mean words per sentence. */
  wordsPerSentence: number | null;
  /** Mean syllables per word. */
  syllablesPerWord: number | null;
  /** Flesch Reading Ease. */
  ease: number | null;
  /** Flesch–Kincaid grade level. */
  grade: number | null;
  /** Median and 90th percentile of sentence length in words (nearest rank). */
  medianSentence: number | null;
  p90Sentence: number | null;
  /** The longest sentence, in words. */
  longestSentence: number;
}

export interface ReadabilityPosition extends ReadabilityScores {
  label: string;
  tick: string;
  firstToken: number;
  tokens: number;
}

export interface ReadabilityResult {
  by: 'chapter' | 'segment';
  totalTokens: number;
  whole: ReadabilityScores;
  positions: ReadabilityPosition[];
  /** Sentence lengths of the whole text; `to` null for the open last bin. */
  histogram: { from: number; to: number | null; label: string; count: number }[];
}

const round = (x: number | null, digits = 3): number | null => (x === null ? null : Math.round(x * 10 ** digits) / 10 ** digits);

function scores(lengths: number[], syllables: number): ReadabilityScores {
  const words = lengths.reduce((a, b) => a + b, 0);
  const sentences = lengths.length;
  const sorted = Float64Array.from(lengths).sort();
  return {
    words,
    sentences,
    syllables,
    wordsPerSentence: round(sentences ? words / sentences : null),
    syllablesPerWord: round(words ? syllables / words : null),
    ease: round(fleschReadingEase(words, sentences, syllables)),
    grade: round(fleschKincaidGrade(words, sentences, syllables)),
    medianSentence: nearestRank(sorted, 0.5),
    p90Sentence: nearestRank(sorted, 0.9),
    longestSentence: sentences ? sorted[sorted.length - 1]! : 0,
  };
}

export function computeReadability(model: TextModel, params: ReadabilityParams): ReadabilityResult {
  const { sentences, tokens, chapters, vocab } = model;
  const perType = syllablesPerType(vocab);
  // Syllables of every sentence, from the per-type counts.
  const sentenceSyllables = new Uint32Array(sentences.count);
  for (let i = 0; i < tokens.count; i++) sentenceSyllables[tokens.sentence[i]!]! += perType[tokens.type[i]!]!;
  const ranges = positionRanges(chapters, tokens.count, params.by, params.segments);
  const lengths = ranges.map(() => [] as number[]);
  const syll = new Array<number>(ranges.length).fill(0);
  const allLengths: number[] = [];
  let allSyllables = 0;
  for (let s = 0; s < sentences.count; s++) {
    const n = sentences.tokenCount[s]!;
    if (n === 0) continue;
    const k = rangeOf(ranges, sentences.firstToken[s]!);
    allLengths.push(n);
    allSyllables += sentenceSyllables[s]!;
    if (k < 0) continue;
    lengths[k]!.push(n);
    syll[k]! += sentenceSyllables[s]!;
  }
  const positions = ranges.map(([a, b], k) => ({
    label: params.by === 'chapter' ? chapters[k]!.title : segmentLabel(k, a, b),
    tick: params.by === 'chapter' ? chapterTick(k + 1) : String(k + 1),
    firstToken: a,
    tokens: b - a,
    ...scores(lengths[k]!, syll[k]!),
  }));
  const histogram = lengthHistogram(allLengths, params.binWidth, params.maxLength).map((b) => ({
    ...b,
    label: b.to === null ? `${b.from}+` : b.from === b.to ? String(b.from) : `${b.from}–${b.to}`,
  }));
  return { by: params.by, totalTokens: tokens.count, whole: scores(allLengths, allSyllables), positions, histogram };
}

function scoreOf(s: ReadabilityScores, score: ReadabilityParams['score']): number {
  return (score === 'grade' ? s.grade : s.ease) ?? 0;
}

function scoreName(score: ReadabilityParams['score']): string {
  return score === 'grade' ? 'Flesch–Kincaid grade level' : 'Flesch Reading Ease';
}

export const readability: Measure<ReadabilityParams, ReadabilityResult> = {
  name: 'readability',
  version: 1,
  params: readabilityParams,
  needsCast: false,
  reads: {},
  segments: segmentsOf,
  compute({ model }, params) {
    return computeReadability(model, params);
  },
  method: {
    what: 'How hard the prose is to read by two classic formulas that weigh long sentences and long words, with the spread of sentence lengths.',
    formula:
      'Flesch Reading Ease = 206.835 − 1.015 × (words ÷ sentences) − 84.6 × (syllables ÷ words); Flesch–Kincaid grade = 0.39 × (words ÷ sentences) + 11.8 × (syllables ÷ words) − 15.59. Words are the text model’s word tokens; sentences are its sentences (each holds at least one word). Syllables are counted by spelling rules (vowel groups, silent final e, syllabic -le, -ed and -es endings, y as vowel or consonant, vowel pairs spoken apart, a short list of exceptions), once per distinct word; a numeral counts one syllable per digit. Percentiles of sentence length are by nearest rank.',
    source:
      'Flesch, R. (1948), “A new readability yardstick”, Journal of Applied Psychology 32(3); Kincaid, J. P., Fishburne, R. P., Rogers, R. L. & Chissom, B. S. (1975), Derivation of new readability formulas for Navy enlisted personnel, Research Branch Report 8-75. Syllable counter written for this project and checked against the npm package syllable and dictionary syllabification.',
    caveats: [
      'The formulas were fitted to school reading tests of mid-20th-century American prose; on fiction, and on older texts with long periodic sentences, the grade is a rough index for comparing chapters, not a reading age.',
      'Dialogue lowers the scores: short spoken sentences make a chapter look easier whatever its vocabulary.',
      'Sentence splitting follows punctuation: semicolons and dashes do not end sentences, so a text punctuated with them reads as “harder”.',
      'Syllables are estimated from spelling; counts for names, rare words and dialect forms may be off by one.',
    ],
  },
  table(result, params): Table {
    if (params.bars === 'lengths') {
      return {
        columns: [
          { key: 'length', label: 'Words per sentence', numeric: false },
          { key: 'sentences', label: 'Sentences', numeric: true },
        ],
        rows: result.histogram.map((b) => [b.label, b.count]),
      };
    }
    const row = (label: string, s: ReadabilityScores): (string | number | null)[] => [
      label,
      s.words,
      s.sentences,
      s.syllables,
      s.wordsPerSentence,
      s.syllablesPerWord,
      s.ease,
      s.grade,
      s.medianSentence,
    ];
    return {
      columns: [
        { key: 'position', label: result.by === 'chapter' ? 'Chapter' : 'Segment', numeric: false },
        { key: 'words', label: 'Words', numeric: true },
        { key: 'sentences', label: 'Sentences', numeric: true },
        { key: 'syllables', label: 'Syllables', numeric: true },
        { key: 'wps', label: 'Words per sentence', numeric: true },
        { key: 'spw', label: 'Syllables per word', numeric: true },
        { key: 'ease', label: 'Reading Ease', numeric: true },
        { key: 'grade', label: 'Grade level', numeric: true },
        { key: 'median', label: 'Median sentence (words)', numeric: true },
      ],
      rows: [...result.positions.map((p) => row(p.label, p)), row('Whole text', result.whole)],
    };
  },
  views: {
    bars(result, params): BarsData {
      if (params.bars === 'lengths') {
        return {
          kind: 'bars',
          title: 'Sentence lengths in words',
          categoryLabel: 'Words per sentence',
          valueLabel: 'Sentences',
          categories: result.histogram.map((b) => b.label),
          series: [{ id: 'sentences', name: 'Sentences', values: result.histogram.map((b) => b.count) }],
          format: 'count',
        };
      }
      return {
        kind: 'bars',
        title: `${scoreName(params.score)} of each ${result.by}`,
        categoryLabel: result.by === 'chapter' ? 'Chapter' : 'Segment',
        valueLabel: scoreName(params.score),
        categories: result.positions.map((p) => p.label),
        series: [{ id: params.score, name: scoreName(params.score), values: result.positions.map((p) => scoreOf(p, params.score)) }],
        format: 'decimal',
      };
    },
    lines(result, params): LinesData {
      return {
        kind: 'lines',
        title: `${scoreName(params.score)} across the text, by ${result.by}`,
        xLabel: result.by === 'chapter' ? 'Chapter' : 'Narrative time (equal segments)',
        yLabel: scoreName(params.score),
        points: result.positions.map((p) => p.label),
        ticks: result.positions.map((p) => p.tick),
        series: [{ id: params.score, name: scoreName(params.score), values: result.positions.map((p) => scoreOf(p, params.score)) }],
        format: 'decimal',
      };
    },
  },
};
