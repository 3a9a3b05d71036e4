import type { PhraseSet } from './phrases.ts';
import { phrasePlaces, placeCounter } from './places.ts';
import { rowsOf, type Rows } from './ints.ts';

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
  const { familyOf, familyCount } = numberFamilies(family);
  const members = rowsOf(familyOf, indices(set.count), familyCount);
  // Places of each family: at least those of its member with the most, at
  // most its members' occurrences together. Counted exactly only for the
  // families whose most can reach the top.
  const least = mostPlacesOfOne(set, members);
  const most = allOccurrences(set, members);
  const counts = countWithin(set, members, least, most, kthLargest(least, top));
  // The fewest places a family in the top can have.
  const threshold = Math.max(0, kthLargest(counts, top));
  const ranked = headsOf(set, members, counts, threshold, label);
  ranked.sort((a, b) => b.count - a.count || compare(label(a.head), label(b.head)));
  return { ranked: ranked.slice(0, top), familyCount };
}

/*
 * Each loop over all the phrases or families has a function of its own: the
 * engine compiles a function while its first loop runs, and a later loop in
 * the same function would then run with no type feedback and fall back to
 * the interpreter.
 */

/** Families numbered 0, 1, 2… in order of their first member; the number of each phrase's family. */
function numberFamilies(family: Int32Array): { familyOf: Int32Array; familyCount: number } {
  const n = family.length;
  const index = new Int32Array(n).fill(-1);
  const familyOf = new Int32Array(n);
  let familyCount = 0;
  for (let i = 0; i < n; i++) {
    const f = family[i]!;
    if (index[f] === -1) index[f] = familyCount++;
    familyOf[i] = index[f]!;
  }
  return { familyOf, familyCount };
}

function indices(n: number): Int32Array {
  const out = new Int32Array(n);
  for (let i = 0; i < n; i++) out[i] = i;
  return out;
}

/** Occurrences of phrase `i`. */
function occurrences(set: PhraseSet, i: number): number {
  return set.positionStart[i + 1]! - set.positionStart[i]!;
}

/** The places of each family's member with the most (a floor on the family's places). */
function mostPlacesOfOne(set: PhraseSet, members: Rows): Int32Array {
  const out = new Int32Array(members.start.length - 1);
  for (let f = 0; f < out.length; f++) {
    for (let k = members.start[f]!; k < members.start[f + 1]!; k++) out[f] = Math.max(out[f]!, phrasePlaces(set, members.items[k]!));
  }
  return out;
}

/** All the occurrences of each family's members (a ceiling on the family's places). */
function allOccurrences(set: PhraseSet, members: Rows): Int32Array {
  const out = new Int32Array(members.start.length - 1);
  for (let f = 0; f < out.length; f++) {
    for (let k = members.start[f]!; k < members.start[f + 1]!; k++) out[f]! += occurrences(set, members.items[k]!);
  }
  return out;
}

/** The places of each family whose ceiling reaches `reach` (−1 for the others). */
function countWithin(set: PhraseSet, members: Rows, least: Int32Array, most: Int32Array, reach: number): Int32Array {
  const countPlaces = placeCounter(set);
  const counts = new Int32Array(least.length).fill(-1);
  for (let f = 0; f < counts.length; f++) {
    if (most[f]! < reach) continue;
    const from = members.start[f]!;
    const to = members.start[f + 1]!;
    counts[f] = to - from === 1 ? least[f]! : countPlaces(members.items, from, to);
  }
  return counts;
}

/** The families with `threshold` places or more, each with its most frequent member (the first of them in phrase order on a tie, as a stable sort keeps it). */
function headsOf(set: PhraseSet, members: Rows, counts: Int32Array, threshold: number, label: (phrase: number) => string): RankedFamily[] {
  const byMember = (a: number, b: number): number => occurrences(set, b) - occurrences(set, a) || compare(label(a), label(b));
  const ranked: RankedFamily[] = [];
  for (let f = 0; f < counts.length; f++) {
    if (counts[f]! < threshold) continue;
    const list = Array.from(members.items.subarray(members.start[f]!, members.start[f + 1]!));
    let head = list[0]!;
    for (const m of list) if (byMember(m, head) < 0) head = m;
    ranked.push({ members: list, head, count: counts[f]! });
  }
  return ranked;
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
