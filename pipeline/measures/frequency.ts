import { z } from 'zod';
import type { Measure, MeasureContext } from './types.ts';
import type { BarsData, LinesData } from '../charts/types.ts';
import { TOKEN_FLAGS } from '../text/model.ts';
import { hasStopwords, stopwords } from './stopwords.ts';
import { chapterTick } from './labels.ts';

export const frequencyParams = z
  .object({
    top: z.number().int().min(1).max(1000).default(20).describe('How many of the most frequent words to keep. Default: 20.'),
    chapter: z
      .number()
      .int()
      .min(1)
      .optional()
      .describe('Count only this chapter (1-based). Default: the whole text.'),
    stopwords: z
      .boolean()
      .default(true)
      .describe("Leave out the stopwords of the plan's language (from stopwords-iso). Default: true."),
    minLength: z.number().int().min(1).max(20).default(2).describe('Leave out words shorter than this many characters. Default: 2.'),
    numbers: z.boolean().default(false).describe('Count numerals as words. Default: false.'),
    exclude: z.array(z.string()).default([]).describe('Further words to leave out (case-insensitive). Default: none.'),
  })
  .strict();

export type FrequencyParams = z.infer<typeof frequencyParams>;

export interface FrequencyResult {
  /** Tokens in the counted scope (before filtering). */
  tokens: number;
  /** Tokens left after the filters. */
  counted: number;
  scope: { chapter: number | null; title: string };
  stopwordList: string | null;
  words: { word: string; count: number; per10k: number; perChapter: number[] }[];
  chapters: { number: number; title: string; tokens: number }[];
}

export const frequency: Measure<FrequencyParams, FrequencyResult> = {
  name: 'frequency',
  version: 1,
  params: frequencyParams,
  needsCast: false,
  compute(ctx, params) {
    return computeFrequency(ctx, params);
  },
  method: {
    what: 'The words used most often, after leaving out very common function words (stopwords).',
    formula:
      'count(w) = occurrences of the lower-cased word form w in the scope; rate = count(w) ÷ tokens in scope × 10,000. Words are ranked by count, ties broken alphabetically.',
    source: 'Raw and normalised frequency as in corpus linguistics handbooks (e.g. McEnery & Hardie 2012, ch. 3); stopword lists from stopwords-iso.',
    caveats: [
      'Forms are counted as written: "river" and "rivers" are separate words (no lemmatising).',
      'The stopword list is generic; it removes some words that may matter in a literary reading (e.g. "home", "night" are kept, but "little" or "old" may not be).',
      'A high count shows what a text repeats, not what it is about: names and dialogue habits weigh heavily.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'rank', label: 'Rank', numeric: true },
        { key: 'word', label: 'Word', numeric: false },
        { key: 'count', label: 'Count', numeric: true },
        { key: 'per10k', label: 'Per 10,000 words', numeric: true },
        ...result.chapters.map((c) => ({ key: `ch${c.number}`, label: `Ch. ${c.number}`, numeric: true })),
      ],
      rows: result.words.map((w, i) => [i + 1, w.word, w.count, w.per10k, ...w.perChapter]),
    };
  },
  views: {
    bars(result): BarsData {
      return {
        kind: 'bars',
        title: `Most frequent words — ${result.scope.title}`,
        categoryLabel: 'Word',
        valueLabel: 'Occurrences',
        categories: result.words.map((w) => w.word),
        series: [{ id: 'count', name: 'Occurrences', values: result.words.map((w) => w.count) }],
        format: 'count',
      };
    },
    lines(result): LinesData {
      const shown = result.words.slice(0, 6);
      return {
        kind: 'lines',
        title: 'Most frequent words across the chapters (per 10,000 words)',
        xLabel: 'Chapter',
        yLabel: 'Per 10,000 words',
        points: result.chapters.map((c) => c.title),
        ticks: result.chapters.map((c) => chapterTick(c.number)),
        series: shown.map((w) => ({
          id: w.word,
          name: w.word,
          values: w.perChapter.map((n, i) => rate(n, result.chapters[i]!.tokens)),
        })),
        format: 'decimal',
      };
    },
  },
};

function rate(count: number, tokens: number): number {
  return tokens ? Math.round((count / tokens) * 10000 * 100) / 100 : 0;
}

export function computeFrequency({ model, language }: MeasureContext, params: FrequencyParams): FrequencyResult {
  const { tokens, chapters, vocab } = model;
  if (params.chapter !== undefined && params.chapter > chapters.length) {
    throw new RangeError(`chapter ${params.chapter} does not exist: the text has ${chapters.length} chapter(s)`);
  }
  const stop = params.stopwords ? stopwords(language) : new Set<string>();
  const exclude = new Set(params.exclude.map((w) => w.toLowerCase().replace(/’/g, "'")));
  // Decide once per word type whether it is counted.
  const keep = new Uint8Array(vocab.length);
  for (let t = 0; t < vocab.length; t++) {
    const w = vocab[t]!;
    keep[t] = w.length >= params.minLength && !stop.has(w) && !exclude.has(w) ? 1 : 0;
  }
  const scope = params.chapter !== undefined ? chapters[params.chapter - 1]! : null;
  const from = scope ? scope.firstToken : 0;
  const to = scope ? scope.firstToken + scope.tokenCount : tokens.count;
  const counts = new Uint32Array(vocab.length);
  let counted = 0;
  for (let i = from; i < to; i++) {
    const t = tokens.type[i]!;
    if (!keep[t]) continue;
    if (!params.numbers && tokens.flags[i]! & TOKEN_FLAGS.numeric) continue;
    counts[t]!++;
    counted++;
  }
  const ranked: number[] = [];
  for (let t = 0; t < counts.length; t++) if (counts[t]) ranked.push(t);
  ranked.sort((a, b) => counts[b]! - counts[a]! || (vocab[a]! < vocab[b]! ? -1 : vocab[a]! > vocab[b]! ? 1 : 0));
  const top = ranked.slice(0, params.top);
  // Per-chapter counts of the kept words, over the whole text.
  const index = new Map<number, number>(top.map((t, i) => [t, i]));
  const perChapter = top.map(() => new Array<number>(chapters.length).fill(0));
  for (let i = 0; i < tokens.count; i++) {
    const k = index.get(tokens.type[i]!);
    if (k !== undefined) perChapter[k]![tokens.chapter[i]!]!++;
  }
  const scopeTokens = to - from;
  return {
    tokens: scopeTokens,
    counted,
    scope: scope ? { chapter: scope.index + 1, title: scope.title } : { chapter: null, title: 'whole text' },
    stopwordList: params.stopwords ? (hasStopwords(language) ? `stopwords-iso (${language})` : null) : null,
    words: top.map((t, k) => ({
      word: vocab[t]!,
      count: counts[t]!,
      per10k: rate(counts[t]!, scopeTokens),
      perChapter: perChapter[k]!,
    })),
    chapters: chapters.map((c) => ({ number: c.index + 1, title: c.title, tokens: c.tokenCount })),
  };
}
