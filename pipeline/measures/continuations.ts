import { z } from 'zod';
import type { Measure } from './types.ts';
import type { TreeData, TreeNode } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { findSequence } from '../stats/sequence.ts';
import { phraseTypes, phraseWords } from '../text/phrases.ts';

export const continuationsParams = z
  .object({
    phrase: z
      .string()
      .min(1)
      .describe('The word or phrase the tree grows from; case is ignored, and a phrase matches consecutive words of one sentence. Required.'),
    direction: z
      .enum(['right', 'left'])
      .default('right')
      .describe('"right" shows what follows the phrase, "left" what precedes it (read outwards from the phrase). Default: "right".'),
    depth: z.number().int().min(1).max(20).default(4).describe('How many words a branch runs beyond the phrase. Default: 4.'),
    minCount: z
      .number()
      .int()
      .min(1)
      .default(2)
      .describe('Least number of occurrences a branch must share to be drawn. Default: 2.'),
    maxChildren: z
      .number()
      .int()
      .min(1)
      .max(50)
      .default(5)
      .describe('Most branches from one word, the most frequent kept (ties alphabetically). Default: 5.'),
  })
  .strict();

export type ContinuationsParams = z.infer<typeof continuationsParams>;

export interface ContinuationsResult {
  phrase: string;
  /** The phrase's words as matched (lower-cased). */
  words: string[];
  direction: 'right' | 'left';
  /** Occurrences of the phrase (the root's count). */
  occurrences: number;
  /** The tree: the root is the phrase; each child a word that follows (or precedes) its parent's path, with how many occurrences take that path. */
  root: TreeNode;
}

interface Grow {
  model: TextModel;
  /** Offset from an occurrence's first token to the word at level 0. */
  step: (start: number, level: number) => number;
  params: ContinuationsParams;
}

/** The children of a path: the occurrences (by first token) grouped by the word at `level`, within their sentence. */
function children(g: Grow, starts: number[], level: number): TreeNode[] {
  const { tokens, vocab } = g.model;
  const groups = new Map<number, number[]>();
  for (const s of starts) {
    const p = g.step(s, level);
    if (p < 0 || p >= tokens.count || tokens.sentence[p] !== tokens.sentence[s]) continue;
    const t = tokens.type[p]!;
    const list = groups.get(t);
    if (list) list.push(s);
    else groups.set(t, [s]);
  }
  const kept = [...groups.entries()]
    .filter(([, list]) => list.length >= g.params.minCount)
    .sort(([ta, a], [tb, b]) => b.length - a.length || (vocab[ta]! < vocab[tb]! ? -1 : vocab[ta]! > vocab[tb]! ? 1 : 0))
    .slice(0, g.params.maxChildren);
  return kept.map(([t, list]) => ({
    word: vocab[t]!,
    count: list.length,
    children: level + 1 < g.params.depth ? children(g, list, level + 1) : [],
    at: list,
  }));
}

export const continuations: Measure<ContinuationsParams, ContinuationsResult> = {
  name: 'continuations',
  version: 2,
  params: continuationsParams,
  needsCast: false,
  reads: {},
  compute({ model }, params) {
    const words = phraseWords(params.phrase);
    const seq = phraseTypes(model, params.phrase);
    const len = words.length;
    const starts = seq ? findSequence(model.tokens.type, seq, model.tokens.sentence) : [];
    const step = params.direction === 'right' ? (s: number, level: number) => s + len + level : (s: number, level: number) => s - 1 - level;
    return {
      phrase: params.phrase,
      words,
      direction: params.direction,
      occurrences: starts.length,
      root: { word: words.join(' '), count: starts.length, children: children({ model, step, params }, starts, 0), at: starts },
    };
  },
  method: {
    what: 'What comes after a word or phrase (or before it), drawn as a branching tree: each branch is a way the text goes on, thicker the more often it is taken.',
    formula:
      'Every occurrence of the phrase (consecutive words of one sentence, case ignored) is followed word by word, up to `depth` words; occurrences that continue with the same word share a branch, whose count is how many of them do. A branch shared by fewer than `minCount` occurrences is dropped, and only the `maxChildren` most frequent branches of each word are kept. A branch stops at the end of its sentence; punctuation inside the sentence (commas, dashes, quotation marks) is not a word and is passed over. A word’s count minus its children’s counts is how many occurrences end there, or went on in branches too rare to draw.',
    source: 'The word tree of Wattenberg & Viégas (2008, "The Word Tree, an interactive visual concordance", IEEE TVCG 14(6)), a suffix tree of the concordance lines.',
    caveats: [
      'Words are shown lower-cased, and forms are matched as written.',
      'The tree shows the most frequent continuations only; the concordance lists every occurrence.',
      'Branches are counted per occurrence: a phrase that follows itself closely is counted once for each occurrence.',
    ],
  },
  table(result) {
    const rows: (string | number)[][] = [];
    const places: (number[] | null)[] = [];
    const walk = (node: TreeNode, path: string[], level: number): void => {
      for (const c of node.children) {
        const next = [...path, c.word];
        rows.push([level, result.direction === 'right' ? next.join(' ') : [...next].reverse().join(' '), c.count]);
        places.push(c.at ?? null);
        walk(c, next, level + 1);
      }
    };
    rows.push([0, result.root.word, result.root.count]);
    places.push(result.root.at ?? null);
    walk(result.root, [result.root.word], 1);
    return {
      columns: [
        { key: 'depth', label: 'Words from the phrase', numeric: true },
        { key: 'path', label: 'Sequence', numeric: false },
        { key: 'count', label: 'Occurrences', numeric: true },
      ],
      rows,
      places,
    };
  },
  views: {
    tree(result): TreeData {
      return {
        kind: 'tree',
        title:
          result.direction === 'right'
            ? `What follows “${result.phrase}” (${result.occurrences} ${result.occurrences === 1 ? 'occurrence' : 'occurrences'})`
            : `What comes before “${result.phrase}” (${result.occurrences} ${result.occurrences === 1 ? 'occurrence' : 'occurrences'})`,
        root: result.root,
        direction: result.direction,
      };
    },
  },
};
