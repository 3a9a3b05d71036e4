/**
 * Conversation links: two characters are linked by the turns of speech one
 * addresses to the other, in either direction.
 */

import { pairTally } from './pairs.ts';

/** What the network needs of a quotation: who speaks and to whom (cast ids, or null when unknown). */
export interface QuoteTurn {
  speaker: string | null | undefined;
  addressee: string | null | undefined;
}

/**
 * Turns between cast members (indices into the cast).
 * weight(a, b) = quotations spoken by a to b plus those spoken by b to a.
 * Quotations with no speaker or no addressee, spoken to oneself, or naming
 * someone outside `counted` are left out.
 */
export function conversationPairs(
  quotes: readonly QuoteTurn[],
  castIds: readonly string[],
  counted: readonly boolean[],
): { a: number; b: number; weight: number }[] {
  const index = new Map(castIds.map((id, i) => [id, i]));
  const tally = pairTally(castIds.length);
  for (const q of quotes) {
    if (q.speaker == null || q.addressee == null) continue;
    const a = index.get(q.speaker);
    const b = index.get(q.addressee);
    if (a === undefined || b === undefined || !counted[a] || !counted[b]) continue;
    tally.add(a, b);
  }
  return tally.pairs();
}
