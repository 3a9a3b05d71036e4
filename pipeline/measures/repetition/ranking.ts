import type { PhraseSet } from './phrases.ts';
import { phrasePlaces, placeCounter } from './places.ts';

/** A family of phrases as ranked: its members (in phrase order), its most frequent member and its number of places. */
export interface RankedFamily {
  members: number[];
  head: number;
  count: number;
}

function compare(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * The `top` families with the most places (ties: by the label, the most
 * frequent member, alphabetically; then by first member), and how many
 * families there are. `family` gives the family of each phrase, `label` a
 * phrase's words. Only families that can reach the top are ordered, so that
 * labels are written out for few phrases.
 */
export function rankFamilies(
  set: PhraseSet,
  family: Int32Array,
  label: (phrase: number) => string,
  top: number,
): { ranked: RankedFamily[]; familyCount: number } {
  const n = set.count;
  // Families numbered by their first member; members in phrase order.
  const index = new Int32Array(n).fill(-1);
  const familyOf = new Int32Array(n);
  let familyCount = 0;
  for (let i = 0; i < n; i++) {
    const f = family[i]!;
    if (index[f] === -1) index[f] = familyCount++;
    familyOf[i] = index[f]!;
  }
  const start = new Int32Array(familyCount + 1);
  for (let i = 0; i < n; i++) start[familyOf[i]! + 1]!++;
  for (let f = 0; f < familyCount; f++) start[f + 1]! += start[f]!;
  const fill = start.slice(0, familyCount);
  const members = new Int32Array(n);
  for (let i = 0; i < n; i++) members[fill[familyOf[i]!]!++] = i;

  // Places of each family: at least those of its member with the most, at
  // most its members' occurrences together. Counted exactly only for the
  // families whose most can reach the top.
  const occurrences = (i: number): number => set.positionStart[i + 1]! - set.positionStart[i]!;
  const least = new Int32Array(familyCount);
  const most = new Int32Array(familyCount);
  for (let f = 0; f < familyCount; f++) {
    for (let k = start[f]!; k < start[f + 1]!; k++) {
      least[f] = Math.max(least[f]!, phrasePlaces(set, members[k]!));
      most[f]! += occurrences(members[k]!);
    }
  }
  const reach = kthLargest(least, top);
  const countPlaces = placeCounter(set);
  const counts = new Int32Array(familyCount).fill(-1);
  for (let f = 0; f < familyCount; f++) {
    if (most[f]! < reach) continue;
    counts[f] = start[f + 1]! - start[f]! === 1 ? least[f]! : countPlaces(members, start[f]!, start[f + 1]!);
  }
  // The fewest places a family in the top can have.
  const threshold = Math.max(0, kthLargest(counts, top));

  const byMember = (a: number, b: number): number => occurrences(b) - occurrences(a) || compare(label(a), label(b));
  const ranked: RankedFamily[] = [];
  for (let f = 0; f < familyCount; f++) {
    if (counts[f]! < threshold) continue;
    const list = Array.from(members.subarray(start[f]!, start[f + 1]!));
    // The most frequent member (the first of them in phrase order on a tie, as a stable sort keeps it).
    let head = list[0]!;
    for (const m of list) if (byMember(m, head) < 0) head = m;
    ranked.push({ members: list, head, count: counts[f]! });
  }
  ranked.sort((a, b) => b.count - a.count || compare(label(a.head), label(b.head)));
  return { ranked: ranked.slice(0, top), familyCount };
}

/** The k-th largest of `values` (the smallest when there are k or fewer). */
function kthLargest(values: Int32Array, k: number): number {
  if (values.length === 0) return 0;
  const sorted = Int32Array.from(values).sort();
  return sorted[Math.max(0, sorted.length - k)]!;
}

/**
 * Orders a family's members (in place): most occurrences first, ties
 * alphabetical (then in phrase order). Only the head of the list is put in
 * full order, through at least `shown` members and the first member `wanted`
 * accepts; the rest stay ordered by occurrences alone, so that few labels are
 * written out.
 */
export function orderMembers(
  set: PhraseSet,
  members: number[],
  label: (phrase: number) => string,
  shown: number,
  wanted: (phrase: number) => boolean,
): number[] {
  const occurrences = (i: number): number => set.positionStart[i + 1]! - set.positionStart[i]!;
  members.sort((a, b) => occurrences(b) - occurrences(a));
  let found = false;
  for (let i = 0; i < members.length && (i < shown || !found); ) {
    // A run of members with as many occurrences: alphabetical.
    let j = i + 1;
    while (j < members.length && occurrences(members[j]!) === occurrences(members[i]!)) j++;
    if (j - i > 1) {
      const block = members.slice(i, j).sort((a, b) => compare(label(a), label(b)));
      for (let k = i; k < j; k++) members[k] = block[k - i]!;
    }
    for (let k = i; k < j && !found; k++) found = wanted(members[k]!);
    i = j;
  }
  return members;
}
