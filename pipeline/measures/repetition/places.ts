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
 * member is the longest one that starts there (the first of them in
 * `members` on a tie). At most the first `limit` places.
 *
 * Each member's occurrences are in text order, so they are merged through a
 * heap and the merge stops once `limit` places are complete.
 */
export function placesOf(set: PhraseSet, members: ArrayLike<number>, limit = Infinity): Place[] {
  const { positions, positionStart } = set;
  const k = members.length;
  // Heap of member indices (into `members`) by their next occurrence: start,
  // then longest first, then member order. `next[i]` is that occurrence's index in `positions`.
  const next = new Int32Array(k);
  const key = new Float64Array(k);
  const heap = new Int32Array(k);
  let size = 0;
  const less = (x: number, y: number): boolean => key[x]! < key[y]! || (key[x] === key[y] && x < y);
  const down = (at: number): void => {
    for (;;) {
      let least = at;
      const l = 2 * at + 1;
      if (l < size && less(heap[l]!, heap[least]!)) least = l;
      if (l + 1 < size && less(heap[l + 1]!, heap[least]!)) least = l + 1;
      if (least === at) return;
      [heap[at], heap[least]] = [heap[least]!, heap[at]!];
      at = least;
    }
  };
  for (let i = 0; i < k; i++) {
    const m = members[i]!;
    next[i] = positionStart[m]!;
    if (next[i]! === positionStart[m + 1]!) continue;
    key[i] = positions[next[i]!]! * 32 + (31 - lengthOf(set, m));
    heap[size++] = i;
  }
  for (let at = (size >> 1) - 1; at >= 0; at--) down(at);

  const places: Place[] = [];
  while (size > 0) {
    const i = heap[0]!;
    const m = members[i]!;
    const p = positions[next[i]!]!;
    const end = p + lengthOf(set, m);
    const last = places[places.length - 1];
    if (last && p < last[1]) last[1] = Math.max(last[1], end);
    else if (places.length === limit) break;
    else places.push([p, end, m]);
    // The member's next occurrence, or out of the heap.
    if (++next[i]! < positionStart[m + 1]!) key[i] = positions[next[i]!]! * 32 + (31 - lengthOf(set, m));
    else heap[0] = heap[--size]!;
    down(0);
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
