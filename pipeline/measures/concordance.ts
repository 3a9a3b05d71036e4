import { z } from 'zod';
import type { Measure } from './types.ts';
import type { KwicData } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { phraseTypes, phraseWords } from '../text/phrases.ts';
import { findSequence } from '../stats/sequence.ts';

export const concordanceParams = z
  .object({
    node: z
      .string()
      .min(1)
      .describe(
        'The word or phrase to show in context; case is ignored, and a phrase matches consecutive words of one sentence (punctuation between them is allowed). Required.',
      ),
    width: z
      .number()
      .int()
      .min(1)
      .max(50)
      .default(8)
      .describe('Words of context on each side of the node, within its chapter; punctuation next to the outermost word is kept. Default: 8.'),
    sort: z
      .enum(['position', 'left', 'right'])
      .default('position')
      .describe(
        'Order of the lines: "position" (text order), "left" (alphabetically by the word just before the node, then the one before that, …) or "right" (by the word just after, then the next, …). Default: "position".',
      ),
    limit: z
      .number()
      .int()
      .min(1)
      .max(5000)
      .default(200)
      .describe('Most lines kept, after sorting; `total` still counts every occurrence. Default: 200.'),
    chapter: z.number().int().min(1).optional().describe('Only this chapter (1-based). Default: the whole text.'),
  })
  .strict();

export type ConcordanceParams = z.infer<typeof concordanceParams>;

export interface ConcordanceLine {
  left: string;
  /** The node as written in the text. */
  keyword: string;
  right: string;
  /** Index of the node's first token. */
  token: number;
  /** Chapter (1-based). */
  chapter: number;
  /** Paragraph index in the text model (0-based, over the whole text). */
  paragraph: number;
  /** Paragraph within its chapter (1-based). */
  paragraphInChapter: number;
  /** Character offset of the node in the normalised text. */
  offset: number;
  /** 1-based line of the node in the source file. */
  line: number;
}

export interface ConcordanceResult {
  node: string;
  /** The node's words as matched (lower-cased). */
  words: string[];
  /** Occurrences in scope, before `limit`. */
  total: number;
  sort: 'position' | 'left' | 'right';
  width: number;
  scope: { chapter: number | null; title: string };
  lines: ConcordanceLine[];
}

/** Where an occurrence's context begins and ends, in characters, extended over adjacent punctuation but not past the chapter. */
function contextSpan(model: TextModel, first: number, last: number, from: number, to: number, width: number): [number, number] {
  const { tokens, text, chapters } = model;
  const ch = chapters[tokens.chapter[first]!]!;
  let start = tokens.start[Math.max(from, first - width)]!;
  let end = tokens.end[Math.min(to - 1, last + width)]!;
  while (start > ch.start && !/\s/.test(text[start - 1]!)) start--;
  while (end < ch.end && !/\s/.test(text[end]!)) end++;
  return [start, end];
}

/**
 * Sort occurrences by their context, word by word outwards from the node
 * (within its chapter): alphabetically by the first context word, then the
 * second, …; a shorter context first when one is a prefix of the other; then
 * text order. Words are ranked once with the language's collator, so the sort
 * itself compares integers.
 */
function sortByContext(model: TextModel, hits: number[], len: number, side: 'left' | 'right', width: number, language: string): void {
  const { tokens, chapters, vocab } = model;
  // keys[h * width + k]: type of the k-th context word of hit h, or -1 past the chapter's edge.
  const keys = new Int32Array(hits.length * width).fill(-1);
  hits.forEach((i, h) => {
    const ch = chapters[tokens.chapter[i]!]!;
    const lo = ch.firstToken;
    const hi = ch.firstToken + ch.tokenCount;
    for (let k = 0; k < width; k++) {
      const p = side === 'left' ? i - 1 - k : i + len + k;
      if (p < lo || p >= hi) break;
      keys[h * width + k] = tokens.type[p]!;
    }
  });
  const seen = [...new Set(keys)].filter((t) => t >= 0);
  const collator = new Intl.Collator(language, { sensitivity: 'base', numeric: true });
  seen.sort((a, b) => collator.compare(vocab[a]!, vocab[b]!) || a - b);
  const rank = new Map<number, number>();
  // Words the collator holds equal share a rank.
  seen.forEach((t, k) => rank.set(t, k > 0 && collator.compare(vocab[seen[k - 1]!]!, vocab[t]!) === 0 ? rank.get(seen[k - 1]!)! : k));
  const ranked = new Int32Array(keys.length);
  for (let k = 0; k < keys.length; k++) ranked[k] = keys[k]! < 0 ? -1 : rank.get(keys[k]!)!;
  const order = hits.map((_, h) => h);
  order.sort((x, y) => {
    for (let k = 0; k < width; k++) {
      const a = ranked[x * width + k]!;
      const b = ranked[y * width + k]!;
      if (a !== b) return a - b; // -1 (no word) sorts first
      if (a < 0) break;
    }
    return hits[x]! - hits[y]!;
  });
  const sorted = order.map((h) => hits[h]!);
  for (let k = 0; k < sorted.length; k++) hits[k] = sorted[k]!;
}

function clean(s: string): string {
  return s.replace(/\s+/g, ' ').trim();
}

export const concordance: Measure<ConcordanceParams, ConcordanceResult> = {
  name: 'concordance',
  version: 1,
  params: concordanceParams,
  needsCast: false,
  reads: {},
  compute({ model, language }, params) {
    const { tokens, chapters, text, vocab } = model;
    if (params.chapter !== undefined && params.chapter > chapters.length) {
      throw new RangeError(`chapter ${params.chapter} does not exist: the text has ${chapters.length} chapter(s)`);
    }
    const scope = params.chapter !== undefined ? chapters[params.chapter - 1]! : null;
    const words = phraseWords(params.node);
    const seq = phraseTypes(model, params.node);
    const len = words.length;
    const from = scope ? scope.firstToken : 0;
    const to = scope ? scope.firstToken + scope.tokenCount : tokens.count;
    const hits = seq ? findSequence(tokens.type, seq, tokens.sentence, from, to) : [];

    if (params.sort !== 'position') sortByContext(model, hits, len, params.sort, params.width, language);

    const lines = hits.slice(0, params.limit).map((i): ConcordanceLine => {
      const last = i + len - 1;
      const chIndex = tokens.chapter[i]!;
      const ch = chapters[chIndex]!;
      const [start, end] = contextSpan(model, i, last, ch.firstToken, ch.firstToken + ch.tokenCount, params.width);
      const nodeStart = tokens.start[i]!;
      const nodeEnd = tokens.end[last]!;
      const paragraph = tokens.paragraph[i]!;
      return {
        left: clean(text.slice(start, nodeStart)),
        keyword: clean(text.slice(nodeStart, nodeEnd)),
        right: clean(text.slice(nodeEnd, end)),
        token: i,
        chapter: chIndex + 1,
        paragraph,
        paragraphInChapter: paragraph - ch.firstParagraph + 1,
        offset: nodeStart,
        line: model.position(nodeStart).line,
      };
    });
    return {
      node: params.node,
      words,
      total: hits.length,
      sort: params.sort,
      width: params.width,
      scope: scope ? { chapter: scope.index + 1, title: scope.title } : { chapter: null, title: 'whole text' },
      lines,
    };
  },
  method: {
    what: 'Every place a word or phrase occurs, shown as one line with the words around it, the word itself aligned in the middle (a keyword-in-context concordance).',
    formula:
      'The node is split into words as the text is and matched, ignoring case, on consecutive words of one sentence. Each line shows up to `width` words on either side, within the same chapter, with the punctuation attached to the outermost words; line breaks become spaces. Sorting by the left context compares the word just before the node, then the one before it, and so on (alphabetically, ignoring case and accents); sorting by the right context does the same rightwards; ties keep text order.',
    source: 'The keyword-in-context concordance, a standard tool of corpus linguistics (e.g. Sinclair 1991, Corpus, Concordance, Collocation; McEnery & Hardie 2012, Corpus Linguistics: Method, Theory and Practice).',
    caveats: [
      'Forms are matched as written: "barge" does not find "barges"; list each form you want.',
      'Context stops at chapter ends but runs across sentence and paragraph breaks.',
      'Only the first `limit` lines are listed; sorted orders are taken over every occurrence before the cut.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'chapter', label: 'Chapter', numeric: true },
        { key: 'paragraph', label: 'Paragraph in chapter', numeric: true },
        { key: 'offset', label: 'Character offset', numeric: true },
        { key: 'left', label: 'Left context', numeric: false },
        { key: 'keyword', label: 'Node', numeric: false },
        { key: 'right', label: 'Right context', numeric: false },
      ],
      rows: result.lines.map((l) => [l.chapter, l.paragraphInChapter, l.offset, l.left, l.keyword, l.right]),
      places: result.lines.map((l) => [l.token]),
    };
  },
  views: {
    kwic(result): KwicData {
      const order = result.sort === 'position' ? 'in text order' : `sorted by the ${result.sort} context`;
      const count = result.lines.length < result.total ? `${result.lines.length} of ${result.total}` : String(result.total);
      return {
        kind: 'kwic',
        title: `“${result.node}” in context (${count} ${result.total === 1 ? 'line' : 'lines'}, ${order})`,
        keyword: result.node,
        lines: result.lines.map((l) => ({
          left: l.left,
          keyword: l.keyword,
          right: l.right,
          where: `Ch. ${l.chapter}, ¶ ${l.paragraphInChapter}`,
        })),
      };
    },
  },
};
