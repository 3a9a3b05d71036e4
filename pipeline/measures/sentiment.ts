import { z } from 'zod';
import type { Measure } from './types.ts';
import { narrativeTime, segmentsOf } from './params.ts';
import type { BarsData, LinesData, Table, TextmapData } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { chapterTick, segmentLabel } from '../text/labels.ts';
import { AFINN_CREDIT, afinnLexicon } from '../lexicons/afinn.ts';
import { DEFAULT_NEGATORS, scoreTokens, type TokenScores } from '../stats/valence.ts';
import { equalSegments, meanAndSd, prefixSums, windowStarts } from '../stats/windows.ts';
import { lowPass, movingAverage } from '../stats/smoothing.ts';

/** The attribution the AFINN-165 data licence asks for; shown wherever sentiment results are. */
export const credits = AFINN_CREDIT;

/** Most windows a result may hold; beyond it the step must grow. */
const MAX_WINDOWS = 20000;

export const sentimentParams = z
  .object({
    ...narrativeTime({ default: 'segment', by: 'What the charts and the table run along: equal segments of narrative time, or chapters. Both are always in the result.', segments: 'How many equal segments of narrative time.' }),
    window: z
      .number()
      .int()
      .min(10)
      .max(1000000)
      .default(1000)
      .describe('Length, in words, of the sliding windows whose valence makes the arc (cut to the text’s length if longer). Default: 1000.'),
    step: z
      .number()
      .int()
      .min(1)
      .max(1000000)
      .default(250)
      .describe('How many words each window moves on from the last; at most `window`. Default: 250.'),
    smoothing: z
      .enum(['none', 'moving-average', 'low-pass'])
      .default('moving-average')
      .describe(
        'How the window scores are smoothed into the arc: "none"; "moving-average" (a centred mean over `width` windows); "low-pass" (only the `keep` slowest cosines of the scores’ discrete cosine transform are kept). Default: "moving-average".',
      ),
    width: z
      .number()
      .int()
      .min(1)
      .max(1001)
      .default(5)
      .describe('Windows averaged by the moving average (an even number is widened by one to stay centred). Default: 5.'),
    keep: z
      .number()
      .int()
      .min(1)
      .max(1000)
      .default(10)
      .describe('Cosine components kept by the low-pass smoothing; fewer gives a smoother arc. Default: 10.'),
    negation: z
      .number()
      .int()
      .min(0)
      .max(10)
      .default(3)
      .describe('A negator up to this many words before a scored word, in the same sentence and clause, flips its sign; 0 turns negation off. Default: 3.'),
    negators: z
      .array(z.string().min(1))
      .default([...DEFAULT_NEGATORS])
      .describe('Words that negate, besides any word ending in “n’t”. Default: not, no, never, nor, neither, cannot.'),
    exclude: z
      .array(z.string().min(1))
      .default([])
      .describe('Words of the list not to score in this text (case-insensitive), e.g. "miss" when it is mostly a title, or "like" when it is mostly a preposition. Default: none.'),
    top: z.number().int().min(0).max(100).default(10).describe('How many of the most positive and most negative words (by total valence) to list. Default: 10.'),
    passage: z
      .object({
        chapter: z.number().int().min(1).default(1).describe('Chapter of the passage (1-based). Default: 1.'),
        paragraph: z.number().int().min(1).default(1).describe('Paragraph of that chapter where the passage starts (1-based). Default: 1.'),
        words: z
          .number()
          .int()
          .min(1)
          .max(2000)
          .default(250)
          .describe('About how many words the passage holds; it runs on to the end of the sentence it reaches. Default: 250.'),
      })
      .strict()
      .default({ chapter: 1, paragraph: 1, words: 250 })
      .describe('The passage the "textmap" chart shows, each scored word marked with its valence. Default: the first 250 words of chapter 1.'),
  })
  .strict();

export type SentimentParams = z.infer<typeof sentimentParams>;

export interface ValenceCounts {
  /** Words in the span. */
  tokens: number;
  /** Words and phrases of the list found (a phrase counts once). */
  scored: number;
  /** Matches with a positive / negative valence after negation. */
  positive: number;
  negative: number;
  /** Sum of valences after negation. */
  sum: number;
  /** sum ÷ words × 100. */
  per100: number;
}

export interface SentimentPosition extends ValenceCounts {
  label: string;
  tick: string;
  firstToken: number;
  /** Windows whose centre lies in this span (when none does, the window nearest to it, counted as 1). */
  windows: number;
  /** Mean and population SD of those windows' scores (valence per 100 words). */
  windowMean: number;
  windowSd: number;
  /** Mean of their smoothed scores. */
  smoothed: number;
}

export interface SentimentResult {
  lexicon: string;
  credits: string;
  by: 'segment' | 'chapter';
  totalTokens: number;
  whole: ValenceCounts;
  chapters: SentimentPosition[];
  segments: SentimentPosition[];
  windows: {
    /** Words per window, after cutting to the text's length. */
    width: number;
    step: number;
    smoothing: SentimentParams['smoothing'];
    /** First token of each window. */
    starts: number[];
    /** Valence per 100 words of each window. */
    valence: number[];
    smoothed: number[];
  };
  /** Words and phrases with the largest total valence, each side. */
  words: { positive: ScoredWord[]; negative: ScoredWord[] };
  /** Matches whose sign a negator flipped. */
  negated: number;
  passage: { title: string; chapter: number; paragraph: number; words: number; spans: { text: string; value: number | null }[]; breaks: number[] };
}

export interface ScoredWord {
  word: string;
  /** Valence in the list. */
  valence: number;
  count: number;
  /** Sum of its valences in the text, after negation. */
  total: number;
}

const r3 = (x: number): number => Math.round(x * 1000) / 1000;

function countsOf(scores: TokenScores, from: number, to: number): ValenceCounts {
  let scored = 0;
  let positive = 0;
  let negative = 0;
  let sum = 0;
  for (let i = from; i < to; i++) {
    if (!scores.matched[i]) continue;
    scored++;
    const v = scores.value[i]!;
    if (v > 0) positive++;
    else if (v < 0) negative++;
    sum += v;
  }
  const tokens = to - from;
  return { tokens, scored, positive, negative, sum, per100: tokens ? r3((sum / tokens) * 100) : 0 };
}

function smooth(values: number[], params: SentimentParams): number[] {
  if (params.smoothing === 'moving-average') return movingAverage(values, params.width);
  if (params.smoothing === 'low-pass') return lowPass(values, params.keep);
  return values.slice();
}

/** Windows (by centre) that fall in [a, b); the nearest one when none does. */
function windowsIn(starts: number[], width: number, a: number, b: number): number[] {
  const inside: number[] = [];
  for (let k = 0; k < starts.length; k++) {
    const c = starts[k]! + width / 2;
    if (c >= a && c < b) inside.push(k);
  }
  if (inside.length || starts.length === 0) return inside;
  const mid = (a + b) / 2;
  let best = 0;
  for (let k = 1; k < starts.length; k++) {
    if (Math.abs(starts[k]! + width / 2 - mid) < Math.abs(starts[best]! + width / 2 - mid)) best = k;
  }
  return [best];
}

function passageOf(model: TextModel, scores: TokenScores, p: SentimentParams['passage']): SentimentResult['passage'] {
  const { chapters, paragraphs, sentences, tokens, text } = model;
  const ch = chapters[p.chapter - 1];
  if (!ch) throw new RangeError(`passage.chapter ${p.chapter} does not exist: the text has ${chapters.length} chapter(s)`);
  if (p.paragraph > ch.paragraphCount) {
    throw new RangeError(`passage.paragraph ${p.paragraph} does not exist: chapter ${p.chapter} has ${ch.paragraphCount} paragraph(s)`);
  }
  const para = ch.firstParagraph + p.paragraph - 1;
  const end = ch.firstToken + ch.tokenCount;
  let first = ch.firstToken;
  while (first < end && tokens.paragraph[first]! < para) first++;
  const title = `${ch.title}, paragraph ${p.paragraph}`;
  if (first >= end) return { title, chapter: p.chapter, paragraph: p.paragraph, words: 0, spans: [], breaks: [] };
  // Run on to the end of the sentence holding the last allowed word.
  const capped = Math.min(end, first + p.words) - 1;
  const s = tokens.sentence[capped]!;
  const last = Math.min(end, sentences.firstToken[s]! + sentences.tokenCount[s]!) - 1;

  const spans: { text: string; value: number | null }[] = [];
  const breaks: number[] = [];
  let newParagraph = false;
  const push = (t: string, value: number | null): void => {
    const clean = t.replace(/\s+/g, ' ');
    if (!clean) return;
    const prev = spans[spans.length - 1];
    if (value === null && prev && prev.value === null && !newParagraph) prev.text += clean;
    else spans.push({ text: clean, value });
    newParagraph = false;
  };
  let current = tokens.paragraph[first]!;
  let cursor = paragraphs.start[current]!;
  for (let i = first; i <= last; i++) {
    const pi = tokens.paragraph[i]!;
    if (pi !== current) {
      push(text.slice(cursor, paragraphs.end[current]!), null);
      breaks.push(spans.length);
      newParagraph = true;
      current = pi;
      cursor = paragraphs.start[pi]!;
    }
    push(text.slice(cursor, tokens.start[i]!), null);
    if (scores.matched[i]) {
      const j = Math.min(tokens.count - 1, i + scores.span[i]! - 1);
      push(text.slice(tokens.start[i]!, tokens.end[j]!), scores.value[i]!);
      cursor = tokens.end[j]!;
      i = j;
    } else {
      push(text.slice(tokens.start[i]!, tokens.end[i]!), null);
      cursor = tokens.end[i]!;
    }
  }
  const lastSentence = tokens.sentence[Math.min(last, tokens.count - 1)]!;
  const stop = Math.min(sentences.end[lastSentence]!, paragraphs.end[current]!);
  push(text.slice(cursor, stop), null);
  if (stop < paragraphs.end[current]! || last < end - 1) push(' …', null);
  return { title, chapter: p.chapter, paragraph: p.paragraph, words: last - first + 1, spans, breaks };
}

export function computeSentiment(model: TextModel, params: SentimentParams): SentimentResult {
  if (params.step > params.window) {
    throw new RangeError(`step (${params.step}) is longer than window (${params.window}), so words between windows would be skipped; make step at most ${params.window}`);
  }
  const lexicon = afinnLexicon();
  const { tokens, chapters, vocab } = model;
  const n = tokens.count;
  const excluded = new Set(params.exclude.map((w) => w.toLowerCase().replace(/\u2019/g, "'")));
  const list = excluded.size ? { words: new Map([...lexicon.words].filter(([w]) => !excluded.has(w))), phrases: lexicon.phrases } : lexicon;
  const scores = scoreTokens(model, list, { window: params.negation, words: params.negators });

  const width = Math.min(params.window, n);
  const starts = windowStarts(n, width, params.step);
  if (starts.length > MAX_WINDOWS) {
    throw new RangeError(`window and step give ${starts.length} windows over ${n} words, more than ${MAX_WINDOWS}; make step larger (at least ${Math.ceil(n / MAX_WINDOWS)})`);
  }
  const prefix = prefixSums(scores.value);
  const raw = starts.map((s) => ((prefix[s + width]! - prefix[s]!) / width) * 100);
  const smoothed = smooth(raw, params);

  const position = (a: number, b: number, label: string, tick: string): SentimentPosition => {
    const ks = windowsIn(starts, width, a, b);
    const spread = meanAndSd(ks.map((k) => raw[k]!));
    const sm = meanAndSd(ks.map((k) => smoothed[k]!));
    return {
      label,
      tick,
      firstToken: a,
      ...countsOf(scores, a, b),
      windows: ks.length,
      windowMean: r3(spread?.mean ?? 0),
      windowSd: r3(spread?.sd ?? 0),
      smoothed: r3(sm?.mean ?? 0),
    };
  };
  const segs = equalSegments(n, Math.max(1, Math.min(params.segments, n)));

  // The words and phrases behind the scores.
  const byWord = new Map<string, ScoredWord>();
  let negated = 0;
  for (let i = 0; i < n; i++) {
    if (!scores.matched[i]) continue;
    const len = scores.span[i]!;
    let word = vocab[tokens.type[i]!]!;
    for (let k = 1; k < len; k++) word += ` ${vocab[tokens.type[i + k]!]!}`;
    const v = scores.value[i]!;
    if (scores.negated[i]) negated++;
    const entry = byWord.get(word) ?? { word, valence: (len > 1 ? undefined : lexicon.words.get(word)) ?? phraseValue(word), count: 0, total: 0 };
    entry.count++;
    entry.total += v;
    byWord.set(word, entry);
  }
  function phraseValue(w: string): number {
    return lexicon.phrases.find((p) => p.words.join(' ') === w)?.value ?? 0;
  }
  const all = [...byWord.values()];
  const positive = all
    .filter((w) => w.total > 0)
    .sort((a, b) => b.total - a.total || a.word.localeCompare(b.word))
    .slice(0, params.top);
  const negative = all
    .filter((w) => w.total < 0)
    .sort((a, b) => a.total - b.total || a.word.localeCompare(b.word))
    .slice(0, params.top);

  return {
    lexicon: lexicon.name,
    credits,
    by: params.by,
    totalTokens: n,
    whole: countsOf(scores, 0, n),
    chapters: chapters.map((c) => position(c.firstToken, c.firstToken + c.tokenCount, c.title, chapterTick(c.index + 1))),
    segments: segs.map(([a, b], k) => position(a, b, segmentLabel(k, a, b), String(k + 1))),
    windows: { width, step: params.step, smoothing: params.smoothing, starts, valence: raw.map(r3), smoothed: smoothed.map(r3) },
    words: { positive, negative },
    negated,
    passage: passageOf(model, scores, params.passage),
  };
}

function positionsOf(result: SentimentResult): SentimentPosition[] {
  return result.by === 'chapter' ? result.chapters : result.segments;
}

export const sentiment: Measure<SentimentParams, SentimentResult> = {
  credits,
  name: 'sentiment',
  version: 1,
  params: sentimentParams,
  needsCast: false,
  reads: { data: ['afinn-165'] },
  segments: segmentsOf,
  compute({ model }, params) {
    return computeSentiment(model, params);
  },
  method: {
    what: 'The emotional colouring of the words across the text: each word found in a published list of rated words adds its rating, from −5 (very negative) to +5 (very positive), and the sums are followed through the chapters and along narrative time.',
    formula:
      'Each word (or listed phrase, longest first: “does not work”, “not good”) found in AFINN-165 scores its rating. Negation: when a negator (by default “not”, “no”, “never”, “nor”, “neither”, “cannot”, and any word ending in “n’t”) stands up to `negation` words (default 3) before a scored word, in the same sentence and with no comma, semicolon, colon, bracket or dash between, the score’s sign is flipped; negators are not scored themselves (“no” is −1 in the list). Valence of a span = Σ scores ÷ words × 100 (per 100 words). The arc: windows of `window` words every `step` words (the last one aligned to the end of the text), each scored per 100 words, then smoothed (centred moving average over `width` windows, or keeping the `keep` slowest cosines of the discrete cosine transform). For each chapter or equal segment: its own valence, and the mean and standard deviation of the windows centred in it (the band is ±1 SD).',
    source: `${AFINN_CREDIT} Nielsen (2011) appeared in the Proceedings of the ESWC2011 Workshop on Making Sense of Microposts. Sliding-window arcs of narrative sentiment as in Reagan, A. J. et al. (2016), “The emotional arcs of stories are dominated by six basic shapes”, EPJ Data Science 5:31 (who used much longer windows on whole novels).`,
    caveats: [
      'The list rates words out of context: “fine rain”, “a terrible beauty” and a curse said in jest score as their words do.',
      'AFINN-165 was built for modern social-media English; archaic and literary senses (“gay”, “awful”, “mean”, “fast”) are rated by today’s meaning, and words it lacks count as neutral.',
      'Irony, understatement and free indirect speech defeat word counts: a character’s hopeful speech in a bleak scene lifts the arc.',
      'A word is rated in its commonest modern sense whatever its use: the title “Miss” scores as the verb “miss” (−2), the preposition “like” as the verb (+2); the `exclude` option leaves such words out.',
      'Dialogue and narration are scored alike, so a chapter of quarrels reads as negative whatever its outcome.',
      'The negation rule is a simple window: it misses negation that reaches further (“not, I think, happy”) and can flip words a negator does not govern.',
      'Smoothing and window size shape the arc: shorter windows show more peaks, most of them noise; compare arcs made with the same settings only.',
    ],
  },
  table(result): Table {
    const pos = positionsOf(result);
    return {
      columns: [
        { key: 'position', label: result.by === 'chapter' ? 'Chapter' : 'Segment', numeric: false },
        { key: 'words', label: 'Words', numeric: true },
        { key: 'scored', label: 'Scored words', numeric: true },
        { key: 'positive', label: 'Positive', numeric: true },
        { key: 'negative', label: 'Negative', numeric: true },
        { key: 'sum', label: 'Sum of valence', numeric: true },
        { key: 'per100', label: 'Valence per 100 words', numeric: true },
        { key: 'windowMean', label: 'Window mean', numeric: true },
        { key: 'windowSd', label: 'Window SD', numeric: true },
        { key: 'smoothed', label: 'Smoothed arc', numeric: true },
      ],
      rows: [
        ...pos.map((p) => [p.label, p.tokens, p.scored, p.positive, p.negative, p.sum, p.per100, p.windowMean, p.windowSd, p.smoothed]),
        ['Whole text', result.whole.tokens, result.whole.scored, result.whole.positive, result.whole.negative, result.whole.sum, result.whole.per100, null, null, null],
      ],
    };
  },
  views: {
    lines(result): LinesData {
      const pos = positionsOf(result);
      const series = [{ id: 'valence', name: 'Valence per 100 words', values: pos.map((p) => p.per100) }];
      if (result.windows.smoothing !== 'none') {
        series.push({ id: 'smoothed', name: `Smoothed arc (${result.windows.width}-word windows)`, values: pos.map((p) => p.smoothed) });
      }
      return {
        kind: 'lines',
        title: `Valence across the text (${result.lexicon}), by ${result.by}`,
        xLabel: result.by === 'chapter' ? 'Chapter' : 'Narrative time (equal segments)',
        yLabel: 'Valence per 100 words',
        points: pos.map((p) => p.label),
        ticks: pos.map((p) => p.tick),
        series,
        format: 'decimal',
        bands: [{ series: 'valence', low: pos.map((p) => r3(p.per100 - p.windowSd)), high: pos.map((p) => r3(p.per100 + p.windowSd)) }],
      };
    },
    bars(result): BarsData {
      const pos = positionsOf(result);
      return {
        kind: 'bars',
        title: `Valence of each ${result.by} (${result.lexicon})`,
        categoryLabel: result.by === 'chapter' ? 'Chapter' : 'Segment',
        valueLabel: 'Valence per 100 words',
        categories: pos.map((p) => p.label),
        series: [{ id: 'valence', name: 'Valence per 100 words', values: pos.map((p) => p.per100) }],
        format: 'decimal',
      };
    },
    textmap(result): TextmapData {
      return {
        kind: 'textmap',
        title: `Valence of each scored word — ${result.passage.title}`,
        valueLabel: `Valence (${result.lexicon})`,
        domain: [-5, 5],
        spans: result.passage.spans,
        breaks: result.passage.breaks,
      };
    },
  },
};
