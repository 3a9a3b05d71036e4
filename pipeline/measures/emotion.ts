import { z } from 'zod';
import type { Measure, WordCategories } from './types.ts';
import { narrativeTime, segmentsOf } from './params.ts';
import type { BarsData, LinesData, MultiplesData, Table } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { chapterTick, segmentLabel } from '../text/labels.ts';
import { equalSegments } from '../stats/windows.ts';

export const emotionParams = z
  .object({
    lexicon: z
      .string()
      .min(1)
      .describe('Id of the word list to count with, as named in the plan’s `lexicons` (a curator-supplied file of words and their categories). Required: no emotion list is bundled.'),
    categories: z
      .array(z.string().min(1))
      .optional()
      .describe('Only these categories of the list, in this order. Default: every category, in the order the file names them.'),
    ...narrativeTime({ default: 'segment', by: 'What the lines, small multiples and the table run along: equal segments of narrative time, or chapters. Both are always in the result.', segments: 'How many equal segments of narrative time.' }),
    bars: z
      .enum(['categories', 'positions'])
      .default('categories')
      .describe('What a bar chart runs along: "categories" one bar per category for the whole text; "positions" one group of bars per chapter or segment. Default: "categories".'),
    top: z.number().int().min(0).max(100).default(10).describe('How many of the most frequent matched words to list per category. Default: 10.'),
  })
  .strict();

export type EmotionParams = z.infer<typeof emotionParams>;

export interface EmotionPosition {
  label: string;
  tick: string;
  firstToken: number;
  tokens: number;
  /** Matches per category, in the order of `categories`. */
  counts: number[];
  /** counts ÷ words × 1,000. */
  per1000: number[];
}

export interface EmotionResult {
  lexicon: string;
  categories: string[];
  by: 'segment' | 'chapter';
  totalTokens: number;
  /** Word forms of the list that occur in the text at least once. */
  matchedTypes: number;
  whole: { tokens: number; counts: number[]; per1000: number[] };
  chapters: EmotionPosition[];
  segments: EmotionPosition[];
  /** The most frequent matched words of each category. */
  words: { category: string; words: { word: string; count: number }[] }[];
}

const r3 = (x: number): number => Math.round(x * 1000) / 1000;

function lexiconOf(lexicons: Record<string, WordCategories> | undefined, id: string): WordCategories {
  const lex = lexicons?.[id];
  if (lex) return lex;
  const known = Object.keys(lexicons ?? {});
  throw new RangeError(
    known.length
      ? `the word list "${id}" is not among the plan's word lists (${known.join(', ')}); name one of those in the lexicon parameter`
      : `the word list "${id}" is not loaded: the plan names no word lists; add a "lexicons" entry with this id and the file of words and categories`,
  );
}

export function computeEmotion(model: TextModel, lex: WordCategories, params: EmotionParams): EmotionResult {
  const chosen = params.categories ?? lex.categories;
  const missing = chosen.filter((c) => !lex.categories.includes(c));
  if (missing.length) {
    throw new RangeError(`categories names ${missing.map((c) => `"${c}"`).join(', ')}, not in the word list "${lex.id}" (its categories: ${lex.categories.join(', ')})`);
  }
  const index = new Map(chosen.map((c, k) => [c, k]));
  const { tokens, chapters, vocab } = model;
  const n = tokens.count;
  const k = chosen.length;
  // Per vocabulary type, the chosen categories it belongs to (compressed rows).
  const rowStart = new Uint32Array(vocab.length + 1);
  const cats: number[] = [];
  for (let t = 0; t < vocab.length; t++) {
    rowStart[t] = cats.length;
    const w = vocab[t]!;
    if (Object.hasOwn(lex.entries, w)) for (const c of lex.entries[w]!) if (index.has(c)) cats.push(index.get(c)!);
  }
  rowStart[vocab.length] = cats.length;
  const catOf = Uint32Array.from(cats);

  // Running counts per category, so that any span is a difference.
  const segs = equalSegments(n, Math.max(1, Math.min(params.segments, n)));
  const bounds = [...new Set([0, n, ...chapters.flatMap((c) => [c.firstToken, c.firstToken + c.tokenCount]), ...segs.flat()])].sort((a, b) => a - b);
  const at = new Map<number, Float64Array>();
  const running = new Float64Array(k);
  const perType = new Uint32Array(vocab.length);
  let b = 0;
  for (let i = 0; i <= n; i++) {
    while (b < bounds.length && bounds[b] === i) at.set(bounds[b++]!, running.slice());
    if (i === n) break;
    const t = tokens.type[i]!;
    const from = rowStart[t]!;
    const to = rowStart[t + 1]!;
    if (from === to) continue;
    perType[t]!++;
    for (let j = from; j < to; j++) running[catOf[j]!]!++;
  }
  const countsIn = (a: number, end: number): number[] => {
    const lo = at.get(a)!;
    const hi = at.get(end)!;
    return Array.from({ length: k }, (_, c) => hi[c]! - lo[c]!);
  };
  const position = (a: number, end: number, label: string, tick: string): EmotionPosition => {
    const counts = countsIn(a, end);
    return { label, tick, firstToken: a, tokens: end - a, counts, per1000: counts.map((c) => (end > a ? r3((c / (end - a)) * 1000) : 0)) };
  };
  const wholeCounts = countsIn(0, n);

  // The words behind each category.
  let matchedTypes = 0;
  const lists = chosen.map(() => [] as { word: string; count: number }[]);
  for (let t = 0; t < vocab.length; t++) {
    if (!perType[t]) continue;
    matchedTypes++;
    for (let j = rowStart[t]!; j < rowStart[t + 1]!; j++) lists[catOf[j]!]!.push({ word: vocab[t]!, count: perType[t]! });
  }
  return {
    lexicon: lex.id,
    categories: chosen,
    by: params.by,
    totalTokens: n,
    matchedTypes,
    whole: { tokens: n, counts: wholeCounts, per1000: wholeCounts.map((c) => (n ? r3((c / n) * 1000) : 0)) },
    chapters: chapters.map((c) => position(c.firstToken, c.firstToken + c.tokenCount, c.title, chapterTick(c.index + 1))),
    segments: segs.map(([a, end], s) => position(a, end, segmentLabel(s, a, end), String(s + 1))),
    words: chosen.map((category, c) => ({
      category,
      words: lists[c]!.sort((x, y) => y.count - x.count || x.word.localeCompare(y.word)).slice(0, params.top),
    })),
  };
}

function positionsOf(result: EmotionResult): EmotionPosition[] {
  return result.by === 'chapter' ? result.chapters : result.segments;
}

function linesOf(result: EmotionResult, categories: number[], title: string): LinesData {
  const pos = positionsOf(result);
  return {
    kind: 'lines',
    title,
    xLabel: result.by === 'chapter' ? 'Chapter' : 'Narrative time (equal segments)',
    yLabel: 'Words per 1,000',
    points: pos.map((p) => p.label),
    ticks: pos.map((p) => p.tick),
    series: categories.map((c) => ({ id: result.categories[c]!, name: result.categories[c]!, values: pos.map((p) => p.per1000[c]!) })),
    format: 'decimal',
  };
}

export const emotion: Measure<EmotionParams, EmotionResult> = {
  name: 'emotion',
  version: 1,
  params: emotionParams,
  needsCast: false,
  reads: { lexicon: (p) => p.lexicon },
  segments: segmentsOf,
  compute({ model, lexicons }, params) {
    return computeEmotion(model, lexiconOf(lexicons, params.lexicon), params);
  },
  method: {
    what: 'How often the text uses words that a curator’s word list files under each category (for instance emotions), chapter by chapter and along narrative time.',
    formula:
      'Each word of the text whose lower-cased form is in the list counts once for every category the list gives it. Rate = count ÷ words × 1,000, for each chapter, each of S equal segments of word positions, and the whole text. Word forms are matched exactly: the list must hold each inflected form it means to count (“fear”, “feared”, “fearful”).',
    source:
      'Category counting with a word–category lexicon, as in dictionary-based content analysis (e.g. Stone et al. 1966, The General Inquirer) and word–emotion association lists (e.g. Mohammad & Turney 2013). The word list is the curator’s own file, named in the plan; none is bundled, and its origin and licence are the curator’s to state.',
    caveats: [
      'A word list counts words, not feelings: “fearless” and “without fear” are not fear, and a list may hold “fear” but not “afraid”.',
      'Negation is not handled: “not afraid” counts as fear.',
      'Association lists are usually built from modern judgements of words out of context; archaic and literary senses, irony, and dialogue against narration are not told apart.',
      'A word filed under several categories counts in each, so the categories’ rates need not add up to the share of matched words.',
    ],
  },
  table(result): Table {
    const pos = positionsOf(result);
    return {
      columns: [
        { key: 'position', label: result.by === 'chapter' ? 'Chapter' : 'Segment', numeric: false },
        { key: 'words', label: 'Words', numeric: true },
        ...result.categories.flatMap((c) => [
          { key: `${c}-count`, label: `${c} (words)`, numeric: true },
          { key: `${c}-rate`, label: `${c} per 1,000`, numeric: true },
        ]),
      ],
      rows: [
        ...pos.map((p) => [p.label, p.tokens, ...p.counts.flatMap((n, c) => [n, p.per1000[c]!])]),
        ['Whole text', result.whole.tokens, ...result.whole.counts.flatMap((n, c) => [n, result.whole.per1000[c]!])],
      ],
    };
  },
  views: {
    lines(result): LinesData {
      return linesOf(result, result.categories.map((_, c) => c), `Words of each category in “${result.lexicon}” per 1,000 words, by ${result.by}`);
    },
    bars(result, params): BarsData {
      if (params.bars === 'positions') {
        const pos = positionsOf(result);
        return {
          kind: 'bars',
          title: `Words of each category in “${result.lexicon}” per 1,000 words, by ${result.by}`,
          categoryLabel: result.by === 'chapter' ? 'Chapter' : 'Segment',
          valueLabel: 'Words per 1,000',
          categories: pos.map((p) => p.label),
          series: result.categories.map((name, c) => ({ id: name, name, values: pos.map((p) => p.per1000[c]!) })),
          format: 'decimal',
        };
      }
      return {
        kind: 'bars',
        title: `Words of each category in “${result.lexicon}” per 1,000 words`,
        categoryLabel: 'Category',
        valueLabel: 'Words per 1,000',
        categories: result.categories,
        series: [{ id: 'per1000', name: 'Per 1,000 words', values: result.whole.per1000 }],
        format: 'decimal',
      };
    },
    multiples(result): MultiplesData {
      return {
        kind: 'multiples',
        title: `Each category of “${result.lexicon}” across the text, per 1,000 words`,
        panels: result.categories.map((name, c) => ({ id: name, title: name, data: linesOf(result, [c], name) })),
      };
    },
  },
};
