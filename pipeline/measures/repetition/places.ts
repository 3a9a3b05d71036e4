import { phraseSet, type Phrase, type PhraseSet } from './phrases.ts';

/** One place: [first token, end token (exclusive), the member that starts there]. */
export type Place = [number, number, number];

/** Words in phrase `m`. */
function lengthOf(set: PhraseSet, m: number): number {
  return set.typeStart[m + 1]! - set.typeStart[m]!;
}

/**
 * The places where a family's members occur, in text order: occurrences that
 * overlap ("mark my words" inside "mark my words, girl"; two overlapping
 * pieces of a repeat longer than maxN) are one place, spanning them all; its
 * member is the longest one that starts there.
 */
export function placesOf(set: PhraseSet, members: ArrayLike<number>): Place[] {
  let total = 0;
  for (let k = 0; k < members.length; k++) total += set.positionStart[members[k]! + 1]! - set.positionStart[members[k]!]!;
  // Occurrences as start × 32 + (31 − length): by start, longest first.
  const keys = new Float64Array(total);
  // Start → the longest member starting there (the first of them, in member order).
  const longest = new Map<number, number>();
  let n = 0;
  for (let k = 0; k < members.length; k++) {
    const m = members[k]!;
    const len = lengthOf(set, m);
    for (let r = set.positionStart[m]!; r < set.positionStart[m + 1]!; r++) {
      const p = set.positions[r]!;
      keys[n++] = p * 32 + (31 - len);
      const other = longest.get(p);
      if (other === undefined || lengthOf(set, other) < len) longest.set(p, m);
    }
  }
  keys.sort();
  const places: Place[] = [];
  for (let i = 0; i < n; i++) {
    const p = Math.floor(keys[i]! / 32);
    const end = p + 31 - (keys[i]! - p * 32);
    const last = places[places.length - 1];
    if (last && p < last[1]) last[1] = Math.max(last[1], end);
    else places.push([p, end, longest.get(p)!]);
  }
  return places;
}

/** `placesOf` for phrases as objects. */
export function familyPlaces(phrases: Phrase[], members: number[]): Place[] {
  return placesOf(phraseSet(phrases), members);
}

/**
 * Counts the places `placesOf` finds, without listing them, for the family
 * whose members are `members[from…to)`: a function over the families of one
 * set, reusing one buffer.
 */
export function placeCounter(set: PhraseSet): (members: Int32Array, from: number, to: number) => number {
  let spans = new Float64Array(1024);
  return (members, from, to) => {
    if (to - from === 1) return phrasePlaces(set, members[from]!);
    let total = 0;
    for (let k = from; k < to; k++) total += set.positionStart[members[k]! + 1]! - set.positionStart[members[k]!]!;
    if (total > spans.length) spans = new Float64Array(Math.max(total, spans.length * 2));
    // Start and length of every occurrence (start × 32 + length), sorted by start.
    let n = 0;
    for (let k = from; k < to; k++) {
      const m = members[k]!;
      const len = lengthOf(set, m);
      for (let r = set.positionStart[m]!; r < set.positionStart[m + 1]!; r++) spans[n++] = set.positions[r]! * 32 + len;
    }
    sortPrefix(spans, n);
    let places = 0;
    let end = -1;
    for (let i = 0; i < n; i++) {
      const p = Math.floor(spans[i]! / 32);
      if (p >= end) places++;
      end = Math.max(end, p + (spans[i]! - p * 32));
    }
    return places;
  };
}

/** Sorts `a[0…n)` ascending: insertion sort for a few items, else the built-in sort. */
function sortPrefix(a: Float64Array, n: number): void {
  if (n > 32) {
    a.subarray(0, n).sort();
    return;
  }
  for (let i = 1; i < n; i++) {
    const v = a[i]!;
    let j = i - 1;
    while (j >= 0 && a[j]! > v) {
      a[j + 1] = a[j]!;
      j--;
    }
    a[j + 1] = v;
  }
}

/** Places of one phrase, whose occurrences (ascending, of one length) may overlap one another. */
export function phrasePlaces(set: PhraseSet, m: number): number {
  const len = lengthOf(set, m);
  let places = 0;
  let end = -1;
  for (let r = set.positionStart[m]!; r < set.positionStart[m + 1]!; r++) {
    const p = set.positions[r]!;
    if (p >= end) places++;
    end = p + len;
  }
  return places;
}
