import { z } from 'zod';
import type { Measure } from './types.ts';
import { narrativeTime, segmentsOf } from './params.ts';
import type { BarsData, StripData } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { griesDP, griesDPnorm } from '../stats/dp.ts';
import { juillandD } from '../stats/juilland.ts';
import { entropyD2 } from '../stats/entropy-d2.ts';
import { findSequence } from '../stats/sequence.ts';
import { hasStopwords, stopwords } from '../text/stopwords.ts';
import { chapterTick, segmentLabel } from '../text/labels.ts';
import { segmentBounds, segmentOf } from '../stats/windows.ts';
import { phraseTypes } from '../text/phrases.ts';

export const dispersionParams = z
  .object({
    words: z
      .array(z.string().min(1))
      .max(100)
      .default([])
      .describe(
        'The words (or phrases, matched on consecutive words of one sentence) to measure, in this order. Default: none, which measures the `top` most frequent words instead.',
      ),
    top: z
      .number()
      .int()
      .min(1)
      .max(100)
      .default(10)
      .describe('How many of the most frequent words to measure when `words` is empty. Default: 10.'),
    stopwords: z
      .boolean()
      .default(true)
      .describe("Leave the stopwords of the plan's language (from stopwords-iso) out when choosing the most frequent words. Default: true."),
    ...narrativeTime({ default: 'chapter', by: 'The parts the text is divided into: its chapters, or equal segments of word positions.', segmentsDefault: 10 }),
    maxPositions: z
      .number()
      .int()
      .min(1)
      .max(100000)
      .default(2000)
      .describe(
        'Most occurrence positions listed per word for the dispersion plot; a word occurring more often lists an evenly spaced sample of its occurrences (every k-th) and is marked `positionsSampled`. Counts and dispersion scores always use every occurrence. Default: 2000.',
      ),
    value: z
      .enum(['dp', 'dpNorm', 'juillandD', 'entropyD2'])
      .default('dp')
      .describe("What a bar chart shows: Gries' DP, DPnorm, Juilland's D or the entropy-based D₂. Default: \"dp\"."),
  })
  .strict();

export type DispersionParams = z.infer<typeof dispersionParams>;

export interface DispersionPart {
  label: string;
  tick: string;
  firstToken: number;
  tokens: number;
}

export interface DispersionWord {
  word: string;
  frequency: number;
  /** Occurrences in each part. */
  perPart: number[];
  /** Gries' DP (0 = spread as the parts' sizes predict, towards 1 = packed in one part); null when the word does not occur. */
  dp: number | null;
  /** DP ÷ (1 − the smallest part's share of the text). */
  dpNorm: number | null;
  /** Juilland's D on the word's rate per part (1 = perfectly even). */
  juillandD: number | null;
  /** the entropy-based D₂, the relative entropy of the word's rates per part (1 = perfectly even). */
  entropyD2: number | null;
  /** Token index of each occurrence (first word of a phrase), in text order; a sample when `positionsSampled`. */
  positions: number[];
  positionsSampled: boolean;
}

export interface DispersionResult {
  by: 'chapter' | 'segment';
  totalTokens: number;
  parts: DispersionPart[];
  chapters: { number: number; title: string; firstToken: number; tokens: number }[];
  stopwordList: string | null;
  words: DispersionWord[];
}

/** The `top` most frequent word types, most frequent first, ties alphabetical. */
function topTypes(model: TextModel, top: number, stop: Set<string>): number[] {
  const { tokens, vocab } = model;
  const counts = new Uint32Array(vocab.length);
  for (let i = 0; i < tokens.count; i++) counts[tokens.type[i]!]!++;
  const ranked: number[] = [];
  for (let t = 0; t < counts.length; t++) if (counts[t] && !stop.has(vocab[t]!)) ranked.push(t);
  ranked.sort((a, b) => counts[b]! - counts[a]! || (vocab[a]! < vocab[b]! ? -1 : vocab[a]! > vocab[b]! ? 1 : 0));
  return ranked.slice(0, top);
}

/** Occurrence positions of several single word types, in one pass over the text. */
function positionsOfTypes(model: TextModel, types: number[]): number[][] {
  const slot = new Int32Array(model.vocab.length).fill(-1);
  types.forEach((t, k) => (slot[t] = k));
  const out = types.map(() => [] as number[]);
  const type = model.tokens.type;
  for (let i = 0; i < model.tokens.count; i++) {
    const k = slot[type[i]!]!;
    if (k >= 0) out[k]!.push(i);
  }
  return out;
}

/** An evenly spaced sample of `cap` items (every k-th), or the list itself when it is short enough. */
function sample(list: number[], cap: number): number[] {
  if (list.length <= cap) return list;
  const out = new Array<number>(cap);
  for (let k = 0; k < cap; k++) out[k] = list[Math.floor((k * list.length) / cap)]!;
  return out;
}

function round(x: number | null, digits: number): number | null {
  if (x === null) return null;
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

export const dispersion: Measure<DispersionParams, DispersionResult> = {
  name: 'dispersion',
  version: 1,
  params: dispersionParams,
  needsCast: false,
  reads: { data: ['stopwords-iso'] },
  segments: segmentsOf,
  compute({ model, language }, params) {
    const { chapters, tokens } = model;
    const total = tokens.count;
    const segments = params.by === 'segment' ? Math.min(params.segments, Math.max(1, total)) : 0;
    const parts: DispersionPart[] =
      params.by === 'chapter'
        ? chapters.map((c) => ({ label: c.title, tick: chapterTick(c.index + 1), firstToken: c.firstToken, tokens: c.tokenCount }))
        : segmentBounds(total, segments).map(([a, b], i) => ({ label: segmentLabel(i, a, b), tick: String(i + 1), firstToken: a, tokens: b - a }));
    const partOf = (t: number): number => (params.by === 'chapter' ? tokens.chapter[t]! : segmentOf(t, total, segments));
    const sizes = parts.map((p) => p.tokens);

    let names: string[];
    let found: number[][];
    if (params.words.length) {
      names = params.words;
      found = params.words.map((w) => {
        const seq = phraseTypes(model, w);
        return seq ? findSequence(tokens.type, seq, tokens.sentence) : [];
      });
    } else {
      const types = topTypes(model, params.top, params.stopwords ? stopwords(language) : new Set());
      names = types.map((t) => model.vocab[t]!);
      found = positionsOfTypes(model, types);
    }

    const words = names.map((word, k): DispersionWord => {
      const at = found[k]!;
      const perPart = new Array<number>(parts.length).fill(0);
      for (const t of at) perPart[partOf(t)]!++;
      const rates = perPart.map((f, i) => (sizes[i]! > 0 ? f / sizes[i]! : 0)).filter((_, i) => sizes[i]! > 0);
      const kept = sample(at, params.maxPositions);
      return {
        word,
        frequency: at.length,
        perPart,
        dp: round(griesDP(perPart, sizes), 4),
        dpNorm: round(griesDPnorm(perPart, sizes), 4),
        juillandD: round(juillandD(rates), 4),
        entropyD2: round(entropyD2(rates), 4),
        positions: kept === at ? at.slice() : kept,
        positionsSampled: kept.length < at.length,
      };
    });
    return {
      by: params.by,
      totalTokens: total,
      parts,
      chapters: chapters.map((c) => ({ number: c.index + 1, title: c.title, firstToken: c.firstToken, tokens: c.tokenCount })),
      stopwordList: !params.words.length && params.stopwords ? (hasStopwords(language) ? `stopwords-iso (${language})` : null) : null,
      words,
    };
  },
  method: {
    what: 'How evenly a word is spread through the text: whether it turns up in every chapter (or stretch of the text) in proportion to its length, or is packed into a few.',
    formula:
      "Split the text into n parts (chapters, or equal segments of word positions). For part i, sᵢ = its share of the text's words and vᵢ = its share of the word's occurrences. Gries' DP = ½ Σ |vᵢ − sᵢ|: 0 when the word is spread exactly as the parts' lengths predict, close to 1 when it sits in one small part. DPnorm = DP ÷ (1 − min sᵢ), so that 1 is the most uneven spread possible. Juilland's D = 1 − (σ/μ)/√(n − 1), with μ and σ (population standard deviation) taken over the word's rate in each part (occurrences ÷ part length): 1 is perfectly even. The entropy-based D₂ = −Σ pᵢ log₂ pᵢ / log₂ n, with pᵢ the part's share of the summed rates: also 1 when perfectly even. A phrase counts where its first word stands; its words must be consecutive and in one sentence.",
    source:
      "DP: Gries (2008, \"Dispersions and adjusted frequencies in corpora\", International Journal of Corpus Linguistics 13(4)); DPnorm: Lijffijt & Gries (2012, International Journal of Corpus Linguistics 17(1)). Juilland's D: Juilland & Chang-Rodríguez (1964), in the form given by the 1970 ETS research report \"An alternative to Juilland's usage coefficient for lexical frequencies\", which also proposed the entropy-based D₂.",
    caveats: [
      'Scores depend on the parts chosen: chapters of very different lengths and equal segments can rank the same words differently.',
      "Juilland's D and the entropy-based D₂ need at least two parts, and every score here depends on how the text is divided: compare words over the same parts only.",
      'A rare word cannot be evenly spread: with three occurrences in twenty chapters, DP is high whatever the author intended. Compare words of similar frequency.',
      'For the dispersion plot, a word with more occurrences than `maxPositions` shows an evenly spaced sample of them; the scores use them all.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'word', label: 'Word', numeric: false },
        { key: 'frequency', label: 'Occurrences', numeric: true },
        { key: 'dp', label: 'DP', numeric: true },
        { key: 'dpNorm', label: 'DPnorm', numeric: true },
        { key: 'juillandD', label: "Juilland's D", numeric: true },
        { key: 'entropyD2', label: "Entropy D₂", numeric: true },
        ...result.parts.map((p) => ({
          key: `${result.by === 'segment' ? 's' : 'ch'}${p.tick}`,
          label: result.by === 'segment' ? `Seg. ${p.tick}` : `Ch. ${p.tick}`,
          numeric: true,
        })),
      ],
      rows: result.words.map((w) => [w.word, w.frequency, w.dp, w.dpNorm, w.juillandD, w.entropyD2, ...w.perPart]),
      places: result.words.map((w) => w.positions),
    };
  },
  views: {
    strip(result): StripData {
      const total = Math.max(1, result.totalTokens);
      return {
        kind: 'strip',
        title: 'Where each word occurs, across the text',
        rows: result.words.map((w) => ({ id: w.word, name: w.word, positions: w.positions.map((t) => t / total) })),
        boundaries: result.chapters.map((c) => ({ at: c.firstToken / total, label: chapterTick(c.number), title: c.title })),
        totalTokens: result.totalTokens,
      };
    },
    bars(result, params): BarsData {
      const label = { dp: 'DP', dpNorm: 'DPnorm', juillandD: "Juilland's D", entropyD2: "Entropy D₂" }[params.value];
      const shown = result.words.filter((w) => w[params.value] !== null);
      return {
        kind: 'bars',
        title: `Dispersion of each word over ${result.by === 'chapter' ? 'the chapters' : `${result.parts.length} equal segments`} (${label}; ${params.value.startsWith('dp') ? '0 = perfectly even' : '1 = perfectly even'})`,
        categoryLabel: 'Word',
        valueLabel: label,
        categories: shown.map((w) => w.word),
        series: [{ id: params.value, name: label, values: shown.map((w) => w[params.value]!) }],
        format: 'decimal',
      };
    },
  },
};
