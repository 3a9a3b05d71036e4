/**
 * A word-level view of the text for dialogue analysis: per token its lower-case
 * form, whether it lies inside a quotation, and the cast mention (or the
 * ambiguous mention) that starts on it.
 */

import type { CastMember, Mentions, TextModel } from '../text/model.ts';
import { TOKEN_FLAGS } from '../text/model.ts';
import { tokenise } from '../text/tokens.ts';
import type { Quote } from './quotes.ts';

export interface TokenView {
  model: TextModel;
  text: string;
  cast: CastMember[];
  /** First token of each paragraph, and one past its last. */
  paraFirst: Uint32Array;
  paraEnd: Uint32Array;
  /** Per token: index of the quotation it lies in, or -1 in narrative. */
  quoteOf: Int32Array;
  /** Per token: cast index of the mention that starts here, or -1. */
  mention: Int32Array;
  /** Per token: number of tokens of the mention that starts here. */
  mentionLength: Uint8Array;
  /** Token → cast indices of an ambiguous mention starting there, and its length. */
  ambiguous: Map<number, { candidates: number[]; length: number }>;
}

export function buildView(model: TextModel, cast: CastMember[], mentions: Mentions, quotes: readonly Quote[]): TokenView {
  const { tokens, paragraphs, text } = model;
  const paraFirst = new Uint32Array(paragraphs.count);
  const paraEnd = new Uint32Array(paragraphs.count);
  let t = 0;
  for (let p = 0; p < paragraphs.count; p++) {
    while (t < tokens.count && tokens.paragraph[t] < p) t++;
    paraFirst[p] = t;
    let u = t;
    while (u < tokens.count && tokens.paragraph[u] === p) u++;
    paraEnd[p] = u;
    t = u;
  }
  const quoteOf = new Int32Array(tokens.count).fill(-1);
  for (const q of quotes) {
    for (let k = firstTokenAtOrAfter(model, q.start, paraFirst[q.paragraph], paraEnd[q.paragraph]); k < paraEnd[q.paragraph] && tokens.start[k] < q.end; k++) {
      quoteOf[k] = q.index;
    }
  }
  const mention = new Int32Array(tokens.count).fill(-1);
  const mentionLength = new Uint8Array(tokens.count);
  for (let m = 0; m < mentions.count; m++) {
    mention[mentions.token[m]] = mentions.member[m];
    mentionLength[mentions.token[m]] = mentions.length[m];
  }
  const ambiguous = new Map<number, { candidates: number[]; length: number }>();
  const idIndex = new Map(cast.map((c, i) => [c.id, i]));
  for (const a of mentions.ambiguous) {
    const candidates = a.candidates.map((id) => idIndex.get(id)).filter((i): i is number => i !== undefined);
    ambiguous.set(a.token, { candidates, length: Math.max(1, tokenise(a.text).length) });
  }
  return { model, text, cast, paraFirst, paraEnd, quoteOf, mention, mentionLength, ambiguous };
}

/** The first token of [from, to) that starts at or after `offset`. */
export function firstTokenAtOrAfter(model: TextModel, offset: number, from: number, to: number): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (model.tokens.start[mid] < offset) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

export function word(v: TokenView, i: number): string {
  return v.model.vocab[v.model.tokens.type[i]];
}

export function surface(v: TokenView, i: number): string {
  return v.text.slice(v.model.tokens.start[i], v.model.tokens.end[i]);
}

export function isCapitalised(v: TokenView, i: number): boolean {
  return (v.model.tokens.flags[i] & TOKEN_FLAGS.capitalised) !== 0;
}

/** Text between token i and token j (i < j). */
export function gapBetween(v: TokenView, i: number, j: number): string {
  return v.text.slice(v.model.tokens.end[i], v.model.tokens.start[j]);
}

/** Narrative tokens (outside every quotation) of text[start, end) in paragraph p. */
export function narrativeTokens(v: TokenView, p: number, start: number, end: number): number[] {
  const out: number[] = [];
  const { tokens } = v.model;
  for (let k = firstTokenAtOrAfter(v.model, start, v.paraFirst[p], v.paraEnd[p]); k < v.paraEnd[p] && tokens.end[k] <= end; k++) {
    if (v.quoteOf[k] < 0) out.push(k);
  }
  return out;
}
