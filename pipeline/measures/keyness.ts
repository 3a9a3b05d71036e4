import { z } from 'zod';
import type { Measure } from './types.ts';
import type { BarsData, MultiplesData, ScatterData } from '../charts/types.ts';
import type { Chapter, TextModel } from '../text/model.ts';
import { keyness as compareCounts } from '../stats/keyness.ts';
import type { KeynessRow } from '../stats/keyness.ts';
import { criticalValue } from '../stats/chisquare.ts';
import type { SignificanceBand } from '../stats/chisquare.ts';
import { hasStopwords, stopwords } from '../text/stopwords.ts';
import { chapterTick } from '../text/labels.ts';

export const keynessParams = z
  .object({
    target: z
      .union([
        z.literal('each-chapter'),
        z
          .object({ chapter: z.number().int().min(1).describe('The chapter (1-based) compared with the rest of the text.') })
          .strict(),
      ])
      .default('each-chapter')
      .describe(
        'What is compared with what: `{ chapter: N }` compares chapter N with the rest of the text; "each-chapter" compares every chapter in turn with the rest. Default: "each-chapter".',
      ),
    minFrequency: z
      .number()
      .int()
      .min(1)
      .default(3)
      .describe(
        'Least number of occurrences on the side where a word is over-used (in the target for positive keywords, in the rest for negative ones). Default: 3.',
      ),
    p: z
      .union([z.literal(0.05), z.literal(0.01), z.literal(0.001), z.literal(0.0001), z.literal(1)])
      .default(0.01)
      .describe(
        'Significance level a keyword must reach: 0.05, 0.01, 0.001 or 0.0001 (G² at least 3.84, 6.63, 10.83 or 15.13); 1 keeps every word tested. Default: 0.01.',
      ),
    direction: z
      .enum(['positive', 'negative', 'both'])
      .default('positive')
      .describe(
        'Which keywords: "positive" (used more in the target than in the rest), "negative" (used less), or "both" (positive first, then negative). Default: "positive".',
      ),
    top: z
      .number()
      .int()
      .min(1)
      .max(500)
      .default(20)
      .describe('How many keywords to keep per comparison (and per direction when `direction` is "both"). Default: 20.'),
    sort: z
      .enum(['g2', 'logRatio'])
      .default('g2')
      .describe('Rank keywords by significance ("g2") or by effect size, the absolute Log Ratio ("logRatio"). Default: "g2".'),
    stopwords: z
      .boolean()
      .default(true)
      .describe(
        "Leave the stopwords of the plan's language (from stopwords-iso) out of the keyword list; they still count in the corpus sizes. Default: true.",
      ),
    value: z
      .enum(['g2', 'logRatio'])
      .default('g2')
      .describe('What a bar chart shows: G² (negative for negative keywords) or Log Ratio. Default: "g2".'),
  })
  .strict();

export type KeynessParams = z.infer<typeof keynessParams>;

export interface Keyword {
  word: string;
  /** Occurrences in the target and in the reference. */
  a: number;
  b: number;
  /** Log-likelihood G² (two-cell form). */
  g2: number;
  pBand: SignificanceBand;
  /** log₂ of the ratio of relative frequencies, a zero count replaced by 0.5. */
  logRatio: number;
  direction: 'positive' | 'negative';
  /** Occurrences per 10,000 words of the target and of the reference. */
  per10kA: number;
  per10kB: number;
}

export interface KeynessComparison {
  /** "ch3". */
  id: string;
  /** Target chapter, 1-based. */
  chapter: number;
  title: string;
  /** What was compared: "Chapter 3 …" and "the rest of the text". */
  targetLabel: string;
  referenceLabel: string;
  /** Tokens in the target and in the reference. */
  sizeA: number;
  sizeB: number;
  /** Words scored (after the stopword and frequency filters) and how many of them reached the level. */
  tested: number;
  significant: number;
  keywords: Keyword[];
}

export interface KeynessResult {
  target: 'each-chapter' | { chapter: number };
  tokens: number;
  /** The significance level and its χ²(1) critical value (0 when every word is kept). */
  level: number;
  critical: number;
  stopwordList: string | null;
  comparisons: KeynessComparison[];
}

/** The rest of the text, as a label: "the rest of the text (chapters 1–2, 4–9)". */
function restLabel(model: TextModel, chapter: number): string {
  const n = model.chapters.length;
  const ranges: string[] = [];
  if (chapter > 1) ranges.push(chapter > 2 ? `1–${chapter - 1}` : '1');
  if (chapter < n) ranges.push(chapter < n - 1 ? `${chapter + 1}–${n}` : String(n));
  const plural = n - 1 > 1 ? 'chapters' : 'chapter';
  return `the rest of the text (${plural} ${ranges.join(', ')})`;
}

function per10k(n: number, size: number): number {
  return size ? round((n / size) * 10000, 2) : 0;
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

export const keyness: Measure<KeynessParams, KeynessResult> = {
  name: 'keyness',
  version: 1,
  params: keynessParams,
  needsCast: false,
  reads: { data: ['stopwords-iso'] },
  compute({ model, language }, params) {
    const { chapters, tokens, vocab } = model;
    const targets: Chapter[] =
      params.target === 'each-chapter'
        ? chapters
        : (() => {
            const n = (params.target as { chapter: number }).chapter;
            if (n > chapters.length) {
              throw new RangeError(`target chapter ${n} does not exist: the text has ${chapters.length} chapter(s); choose a chapter from 1 to ${chapters.length}`);
            }
            return [chapters[n - 1]!];
          })();
    if (chapters.length < 2) {
      throw new RangeError('keyness compares a chapter with the rest of the text, but the text has a single chapter; split it into chapters or compare with another text');
    }
    const stop = params.stopwords ? stopwords(language) : new Set<string>();
    const allowed = new Uint8Array(vocab.length);
    for (let t = 0; t < vocab.length; t++) allowed[t] = stop.has(vocab[t]!) ? 0 : 1;
    const include = (t: number): boolean => allowed[t] === 1;
    const tieBreak = (x: number, y: number): number => (vocab[x]! < vocab[y]! ? -1 : vocab[x]! > vocab[y]! ? 1 : 0);

    const type = tokens.type;
    const total = new Uint32Array(vocab.length);
    for (let i = 0; i < tokens.count; i++) total[type[i]!]!++;
    const countsA = new Uint32Array(vocab.length);
    const countsB = new Uint32Array(vocab.length);
    const comparisons: KeynessComparison[] = [];
    for (const ch of targets) {
      const from = ch.firstToken;
      const to = from + ch.tokenCount;
      const sizeA = ch.tokenCount;
      const sizeB = tokens.count - sizeA;
      const number = ch.index + 1;
      const base = {
        id: `ch${number}`,
        chapter: number,
        title: ch.title,
        targetLabel: ch.title,
        referenceLabel: restLabel(model, number),
        sizeA,
        sizeB,
      };
      if (sizeA === 0 || sizeB === 0) {
        comparisons.push({ ...base, tested: 0, significant: 0, keywords: [] });
        continue;
      }
      for (let i = from; i < to; i++) countsA[type[i]!]!++;
      for (let t = 0; t < total.length; t++) countsB[t] = total[t]! - countsA[t]!;
      const outcome = compareCounts(countsA, sizeA, countsB, sizeB, {
        minFrequency: params.minFrequency,
        p: params.p,
        direction: params.direction,
        sort: params.sort,
        top: params.top,
        include,
        tieBreak,
      });
      for (let i = from; i < to; i++) countsA[type[i]!] = 0;
      comparisons.push({
        ...base,
        tested: outcome.tested,
        significant: outcome.significant,
        keywords: outcome.rows.map((r: KeynessRow) => ({
          word: vocab[r.type]!,
          a: r.a,
          b: r.b,
          g2: round(r.g2, 4),
          pBand: r.band,
          logRatio: round(r.logRatio, 4),
          direction: r.direction,
          per10kA: per10k(r.a, sizeA),
          per10kB: per10k(r.b, sizeB),
        })),
      });
    }
    return {
      target: params.target === 'each-chapter' ? 'each-chapter' : { chapter: (params.target as { chapter: number }).chapter },
      tokens: tokens.count,
      level: params.p,
      critical: criticalValue(params.p),
      stopwordList: params.stopwords ? (hasStopwords(language) ? `stopwords-iso (${language})` : null) : null,
      comparisons,
    };
  },
  method: {
    what: 'The words a chapter uses unusually often (or unusually rarely) compared with the rest of the text: its keywords. Each word gets a significance score (how unlikely the difference is by chance) and an effect size (how big the difference is).',
    formula:
      'For a word occurring a times in the target (c words) and b times in the reference (d words): expected counts E₁ = c(a+b)/(c+d), E₂ = d(a+b)/(c+d); log-likelihood G² = 2[a ln(a/E₁) + b ln(b/E₂)], with 0·ln 0 = 0. G² is read against the χ² distribution with one degree of freedom: at least 3.84 for p < 0.05, 6.63 for p < 0.01, 10.83 for p < 0.001, 15.13 for p < 0.0001. Effect size: Log Ratio = log₂((a/c)/(b/d)), a count of 0 replaced by 0.5 (half a count, less than any observed one, so that a word missing from one side still gets a finite ratio: this measure’s convention); +1 means twice as frequent in the target, −1 half as frequent. The corpus sizes c and d count every word, stopwords included.',
    source:
      'G² in the two-cell form used by Rayson & Garside (2000, "Comparing corpora using frequency profiling", ACL Workshop on Comparing Corpora); Dunning (1993, Computational Linguistics 19(1)) sums over all four cells of the 2×2 table (the word and all other words in each corpus), which gives slightly different values. Log Ratio after Hardie (2014, "Log Ratio: an informal introduction", CASS, Lancaster University).',
    caveats: [
      'Thousands of words are tested at once, so some pass p < 0.05 by chance alone; a stricter level (0.001 or 0.0001) is common practice for keyword lists.',
      'G² grows with frequency: a very common word with a small difference can outrank a rarer word with a large one. Sort by Log Ratio to rank by the size of the difference instead.',
      'A word packed into a few pages of a chapter counts as key for the whole chapter; check its spread (the dispersion measure).',
      'Forms are compared as written, lower-cased: "barge" and "barges" are separate words.',
    ],
  },
  table(result) {
    const each = result.comparisons.length > 1 || result.target === 'each-chapter';
    return {
      columns: [
        ...(each ? [{ key: 'chapter', label: 'Chapter', numeric: true }] : []),
        { key: 'word', label: 'Word', numeric: false },
        { key: 'direction', label: 'Direction', numeric: false },
        { key: 'a', label: 'In target', numeric: true },
        { key: 'b', label: 'In rest of text', numeric: true },
        { key: 'g2', label: 'G²', numeric: true },
        { key: 'p', label: 'p', numeric: false },
        { key: 'logRatio', label: 'Log Ratio', numeric: true },
        { key: 'per10kA', label: 'Target per 10,000 words', numeric: true },
        { key: 'per10kB', label: 'Rest per 10,000 words', numeric: true },
      ],
      rows: result.comparisons.flatMap((c) =>
        c.keywords.map((k) => [
          ...(each ? [c.chapter] : []),
          k.word,
          k.direction,
          k.a,
          k.b,
          k.g2,
          k.pBand,
          k.logRatio,
          k.per10kA,
          k.per10kB,
        ]),
      ),
    };
  },
  views: {
    bars(result, params): BarsData {
      const label = valueLabel(params.value);
      if (result.comparisons.length === 1) return keywordBars(result.comparisons[0]!, params.value);
      // Every chapter: the strongest keyword of each, one bar per chapter.
      const best = result.comparisons.filter((c) => c.keywords.length > 0);
      return {
        kind: 'bars',
        title: `The strongest keyword of each chapter against the rest of the text (${label})`,
        categoryLabel: 'Chapter and keyword',
        valueLabel: label,
        categories: best.map((c) => `Ch. ${chapterTick(c.chapter)}: ${c.keywords[0]!.word}`),
        series: [{ id: params.value, name: label, values: best.map((c) => barValue(c.keywords[0]!, params.value)) }],
        format: 'decimal',
      };
    },
    multiples(result, params): MultiplesData {
      return {
        kind: 'multiples',
        title: `Keywords of each chapter against the rest of the text (${valueLabel(params.value)})`,
        panels: result.comparisons.map((c) => ({ id: c.id, title: c.title, data: keywordBars(c, params.value) })),
      };
    },
    scatter(result): ScatterData {
      const each = result.comparisons.length > 1;
      return {
        kind: 'scatter',
        title: each
          ? 'Keywords of each chapter: effect size (Log Ratio) against significance (G²)'
          : `Keywords of ${result.comparisons[0]?.title ?? 'the chapter'}: effect size (Log Ratio) against significance (G²)`,
        xLabel: 'Log Ratio (binary log of the ratio of relative frequencies)',
        yLabel: 'Log-likelihood G²',
        points: result.comparisons.flatMap((c) =>
          c.keywords.map((k) => ({
            id: `${c.id}-${k.word}`,
            label: k.word,
            x: k.logRatio,
            y: k.g2,
            group: each ? c.title : k.direction === 'positive' ? 'Used more in the chapter' : 'Used less in the chapter',
          })),
        ),
      };
    },
  },
};

function valueLabel(value: 'g2' | 'logRatio'): string {
  return value === 'g2' ? 'G² (negative: used less)' : 'Log Ratio';
}

function barValue(k: Keyword, value: 'g2' | 'logRatio'): number {
  return value === 'g2' ? (k.direction === 'negative' ? -k.g2 : k.g2) : k.logRatio;
}

function keywordBars(c: KeynessComparison, value: 'g2' | 'logRatio'): BarsData {
  const label = valueLabel(value);
  return {
    kind: 'bars',
    title: `Keywords of ${c.title} against ${c.referenceLabel} (${label})`,
    categoryLabel: 'Keyword',
    valueLabel: label,
    categories: c.keywords.map((k) => k.word),
    series: [{ id: value, name: label, values: c.keywords.map((k) => barValue(k, value)) }],
    format: 'decimal',
  };
}
