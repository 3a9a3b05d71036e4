/**
 * Co-presence links: two characters are linked each time the text names both
 * within one window — a paragraph, a sentence, or a stretch of at most `span`
 * word tokens inside one chapter.
 */

import type { Mentions, TextModel } from '../text/model.ts';
import { pairTally } from './pairs.ts';

export type CopresenceWindow = 'paragraph' | 'sentence' | 'tokens';

export interface CopresenceOptions {
  window: CopresenceWindow;
  /** Largest distance in word tokens between two mentions, for the "tokens" window. */
  span: number;
}

/**
 * Co-occurrence counts between cast members (indices into the cast).
 *
 * - "paragraph" / "sentence": weight = number of paragraphs (sentences) in
 *   which both are named at least once; repeated names in one unit count once.
 * - "tokens": weight = number of pairs of mentions, one of each member, whose
 *   first tokens are at most `span` tokens apart and in the same chapter.
 *
 * Only members for which `counted[member]` is true take part.
 */
export function copresencePairs(
  model: TextModel,
  mentions: Mentions,
  castSize: number,
  counted: readonly boolean[],
  options: CopresenceOptions,
): { a: number; b: number; weight: number }[] {
  const order = mentionOrder(mentions, counted);
  const tally = pairTally(castSize);
  if (options.window === 'tokens') {
    const { chapter } = model.tokens;
    for (let x = 0; x < order.length; x++) {
      const i = order[x]!;
      const ti = mentions.token[i]!;
      for (let y = x + 1; y < order.length; y++) {
        const j = order[y]!;
        const tj = mentions.token[j]!;
        if (tj - ti > options.span || chapter[tj] !== chapter[ti]) break;
        tally.add(mentions.member[i]!, mentions.member[j]!);
      }
    }
    return tally.pairs();
  }
  const unitOf = options.window === 'paragraph' ? model.tokens.paragraph : model.tokens.sentence;
  let unit = -1;
  let present = new Set<number>();
  const close = () => {
    const members = [...present];
    for (let p = 0; p < members.length; p++) for (let q = p + 1; q < members.length; q++) tally.add(members[p]!, members[q]!);
  };
  for (const i of order) {
    const u = unitOf[mentions.token[i]!]!;
    if (u !== unit) {
      close();
      present = new Set();
      unit = u;
    }
    present.add(mentions.member[i]!);
  }
  close();
  return tally.pairs();
}

/** Indices of the counted mentions, in text order. */
function mentionOrder(mentions: Mentions, counted: readonly boolean[]): number[] {
  const out: number[] = [];
  for (let k = 0; k < mentions.count; k++) if (counted[mentions.member[k]!]) out.push(k);
  return out.sort((a, b) => mentions.token[a]! - mentions.token[b]! || a - b);
}

/** Mentions per cast member, whole text. */
export function mentionCounts(mentions: Mentions, castSize: number): number[] {
  const counts = new Array<number>(castSize).fill(0);
  for (let k = 0; k < mentions.count; k++) counts[mentions.member[k]!]!++;
  return counts;
}
