import { z } from 'zod';
import type { Measure } from './types.ts';
import type { BarsData, ScatterData } from '../charts/types.ts';
import { pmi } from '../stats/pmi.ts';
import { tScore } from '../stats/tscore.ts';
import { logDice } from '../stats/logdice.ts';
import { findSequence } from '../stats/sequence.ts';
import { hasStopwords, stopwords } from '../text/stopwords.ts';
import { phraseTypes, phraseWords } from '../text/phrases.ts';

const SORT_KEYS = ['logDice', 'pmi', 'tScore', 'frequency'] as const;
type SortKey = (typeof SORT_KEYS)[number];

export const collocatesParams = z
  .object({
    node: z
      .string()
      .min(1)
      .describe('The node: the word or phrase whose neighbours are counted; case is ignored, and a phrase matches consecutive words of one sentence. Required.'),
    left: z.number().int().min(0).max(20).default(5).describe('Words counted to the left of the node. Default: 5.'),
    right: z.number().int().min(0).max(20).default(5).describe('Words counted to the right of the node. Default: 5.'),
    boundary: z
      .enum(['sentence', 'paragraph', 'chapter'])
      .default('sentence')
      .describe('The window stops at the edge of the node’s sentence, paragraph or chapter. Default: "sentence".'),
    minFrequency: z
      .number()
      .int()
      .min(1)
      .default(3)
      .describe('Least number of times a word must occur in the window to be listed (its co-frequency). Default: 3.'),
    stopwords: z
      .boolean()
      .default(true)
      .describe("Leave the stopwords of the plan's language (from stopwords-iso) out of the collocates. Default: true."),
    sort: z
      .enum(SORT_KEYS)
      .default('logDice')
      .describe('Rank collocates by "logDice", "pmi", "tScore" or co-"frequency" (the bar chart shows the same score). Default: "logDice".'),
    top: z.number().int().min(1).max(500).default(20).describe('How many collocates to keep. Default: 20.'),
  })
  .strict()
  .refine((p) => p.left + p.right > 0, {
    message: 'the window is empty: set `left` or `right` (or both) to at least 1',
    path: ['right'],
  });

export type CollocatesParams = z.infer<typeof collocatesParams>;

export interface Collocate {
  word: string;
  /** Co-frequency: positions in the node's windows holding the word (each position counted once). */
  cooccurrences: number;
  /** Of those, how many stood left and right of the node. */
  left: number;
  right: number;
  /** The word's frequency in the whole text. */
  frequency: number;
  /** Co-occurrences expected by chance: S · f(word) / N, with S the window slots actually open (see `slots`). */
  expected: number;
  pmi: number;
  tScore: number;
  logDice: number;
}

export interface CollocatesResult {
  node: string;
  words: string[];
  /** Occurrences of the node. */
  nodeFrequency: number;
  window: { left: number; right: number; boundary: 'sentence' | 'paragraph' | 'chapter' };
  /** Tokens in the text (N). */
  tokens: number;
  /**
   * Window slots S: the positions actually inside some window of the node, each counted once, the
   * node's own positions left out. At most f(node) · (left + right); less when windows are cut at a
   * boundary or overlap.
   */
  slots: number;
  /** Distinct words in the windows (after the stopword filter), before `minFrequency` and `top`. */
  candidates: number;
  stopwordList: string | null;
  sort: SortKey;
  collocates: Collocate[];
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

const LABELS: Record<SortKey, string> = {
  logDice: 'logDice',
  pmi: 'PMI',
  tScore: 't-score',
  frequency: 'Co-occurrences',
};

export const collocates: Measure<CollocatesParams, CollocatesResult> = {
  name: 'collocates',
  version: 2,
  params: collocatesParams,
  needsCast: false,
  reads: { data: ['stopwords-iso'] },
  compute({ model, language }, params) {
    const { tokens, vocab } = model;
    const n = tokens.count;
    const type = tokens.type;
    const unit = params.boundary === 'sentence' ? tokens.sentence : params.boundary === 'paragraph' ? tokens.paragraph : tokens.chapter;
    const words = phraseWords(params.node);
    const seq = phraseTypes(model, params.node);
    const len = words.length;
    const hits = seq ? findSequence(type, seq, tokens.sentence) : [];
    const stop = params.stopwords ? stopwords(language) : new Set<string>();

    // Positions that belong to an occurrence of the node are never collocates.
    const isNode = new Uint8Array(n);
    for (const i of hits) isNode.fill(1, i, i + len);
    const leftCount = new Uint32Array(vocab.length);
    const rightCount = new Uint32Array(vocab.length);
    // Windows come in text order with non-decreasing ends, so one pointer keeps a position from being counted twice.
    let counted = -1;
    let slots = 0;
    for (const i of hits) {
      const last = i + len - 1;
      let lo = Math.max(0, i - params.left);
      while (unit[lo] !== unit[i]) lo++;
      let hi = Math.min(n - 1, last + params.right);
      while (unit[hi] !== unit[last]) hi--;
      for (let p = Math.max(lo, counted + 1); p <= hi; p++) {
        if (isNode[p]) continue;
        slots++;
        if (p < i) leftCount[type[p]!]!++;
        else rightCount[type[p]!]!++;
      }
      if (hi > counted) counted = hi;
    }

    const freq = new Uint32Array(vocab.length);
    for (let i = 0; i < n; i++) freq[type[i]!]!++;
    const fNode = hits.length;
    let candidates = 0;
    const rows: Collocate[] = [];
    for (let t = 0; t < vocab.length; t++) {
      const o = leftCount[t]! + rightCount[t]!;
      if (!o || stop.has(vocab[t]!)) continue;
      candidates++;
      if (o < params.minFrequency) continue;
      const f = freq[t]!;
      rows.push({
        word: vocab[t]!,
        cooccurrences: o,
        left: leftCount[t]!,
        right: rightCount[t]!,
        frequency: f,
        expected: round((slots * f) / n, 4),
        pmi: round(pmi(o, slots, f, n)!, 4),
        tScore: round(tScore(o, slots, f, n)!, 4),
        logDice: round(logDice(o, fNode, f)!, 4),
      });
    }
    const key = params.sort === 'frequency' ? 'cooccurrences' : params.sort;
    rows.sort((a, b) => b[key] - a[key] || b.cooccurrences - a.cooccurrences || (a.word < b.word ? -1 : a.word > b.word ? 1 : 0));
    return {
      node: params.node,
      words,
      nodeFrequency: fNode,
      window: { left: params.left, right: params.right, boundary: params.boundary },
      tokens: n,
      slots,
      candidates,
      stopwordList: params.stopwords ? (hasStopwords(language) ? `stopwords-iso (${language})` : null) : null,
      sort: params.sort,
      collocates: rows.slice(0, params.top),
    };
  },
  method: {
    what: 'The words that keep company with a given word or phrase (its collocates): which words turn up within a few words of it more often than chance would have them, and how strongly they are tied to it.',
    formula:
      "Every occurrence of the node opens a window of `left` words before it and `right` words after it, cut at the edge of its sentence (or paragraph, or chapter). O = how many window positions hold the collocate (a position shared by two overlapping windows counts once; positions inside any occurrence of the node never count). S = the window slots: how many positions the windows cover once so counted. With f(n) the node's frequency, f(c) the collocate's and N the words in the text: E = S·f(c)/N, the co-occurrences expected by chance (each slot holds the collocate with probability f(c)/N); PMI = log₂(O/E); t-score = (O − E)/√O; logDice = 14 + log₂(2O/(f(n) + f(c))). When no window is cut or overlaps another, S = f(n)·W with W = left + right, and E is the usual f(n)·W·f(c)/N; counting S instead keeps short sentences and clustered occurrences from deflating PMI.",
    source:
      'PMI: Church & Hanks (1990, "Word association norms, mutual information, and lexicography", Computational Linguistics 16(1)); t-score: Church, Gale, Hanks & Hindle (1991, "Using statistics in lexical analysis"); logDice: Rychlý (2008, "A lexicographer-friendly association score", RASLAN). For a window, the expectation scales the collocate’s rate f(c)/N by the number of positions examined; counting those positions after cutting and merging, rather than assuming W per occurrence, is this measure’s own choice, stated in the formula above.',
    caveats: [
      'PMI rewards rare words: a word seen twice, both times beside the node, scores very high. Raise `minFrequency` or rank by logDice or t-score.',
      't-score favours frequent words and grows with the amount of evidence; it is a confidence score more than a strength score.',
      'logDice ignores the size of the text, so it compares across texts; its top value 14 is for adjacent words and a wide window can exceed it slightly.',
      'Forms are counted as written: "barge" and "barges" are separate collocates.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'rank', label: 'Rank', numeric: true },
        { key: 'word', label: 'Collocate', numeric: false },
        { key: 'cooccurrences', label: 'Co-occurrences', numeric: true },
        { key: 'left', label: 'Left', numeric: true },
        { key: 'right', label: 'Right', numeric: true },
        { key: 'frequency', label: 'Frequency in text', numeric: true },
        { key: 'expected', label: 'Expected', numeric: true },
        { key: 'logDice', label: 'logDice', numeric: true },
        { key: 'pmi', label: 'PMI', numeric: true },
        { key: 'tScore', label: 't-score', numeric: true },
      ],
      rows: result.collocates.map((c, i) => [i + 1, c.word, c.cooccurrences, c.left, c.right, c.frequency, c.expected, c.logDice, c.pmi, c.tScore]),
    };
  },
  views: {
    bars(result): BarsData {
      const label = LABELS[result.sort];
      const key = result.sort === 'frequency' ? 'cooccurrences' : result.sort;
      return {
        kind: 'bars',
        title: `Collocates of “${result.node}” (${result.window.left} words left, ${result.window.right} right), by ${label}`,
        categoryLabel: 'Collocate',
        valueLabel: label,
        categories: result.collocates.map((c) => c.word),
        series: [{ id: result.sort, name: label, values: result.collocates.map((c) => c[key]) }],
        format: result.sort === 'frequency' ? 'count' : 'decimal',
      };
    },
    scatter(result): ScatterData {
      return {
        kind: 'scatter',
        title: `Collocates of “${result.node}”: strength (logDice) against co-occurrences`,
        xLabel: 'Co-occurrences with the node',
        yLabel: 'logDice',
        points: result.collocates.map((c) => ({ id: c.word, label: c.word, x: c.cooccurrences, y: c.logDice })),
      };
    },
  },
};
