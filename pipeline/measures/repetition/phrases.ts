import type { TextModel } from '../../text/model.ts';
import { intList } from './ints.ts';

/** A maximal recurring phrase: its word types and the token index of each occurrence (ascending). */
export interface Phrase {
  types: number[];
  positions: number[];
}

/**
 * Phrases as flat columns (no object per phrase): phrase i has the word types
 * `types[typeStart[i] … typeStart[i+1])` and occurs at the tokens
 * `positions[positionStart[i] … positionStart[i+1])`, ascending.
 */
export interface PhraseSet {
  count: number;
  typeStart: Int32Array;
  types: Int32Array;
  positionStart: Int32Array;
  positions: Int32Array;
  /**
   * For phrases found in a text: an id for the recurring 3-word run starting
   * at each token (−1 where none), equal ids for equal runs, `count` ids in
   * all; null when not known.
   */
  runs: { at: Int32Array; count: number } | null;
}

/** Which phrases to find: `minN`…`maxN` words, at least `minCount` occurrences. */
export interface PhraseOptions {
  minN: number;
  maxN: number;
  minCount: number;
}

/** The phrases of a set as objects. */
export function phraseList(set: PhraseSet): Phrase[] {
  const out: Phrase[] = [];
  for (let i = 0; i < set.count; i++) {
    out.push({
      types: Array.from(set.types.subarray(set.typeStart[i]!, set.typeStart[i + 1]!)),
      positions: Array.from(set.positions.subarray(set.positionStart[i]!, set.positionStart[i + 1]!)),
    });
  }
  return out;
}

/** Phrase objects as a set. */
export function phraseSet(phrases: readonly Phrase[]): PhraseSet {
  const types = intList();
  const positions = intList();
  const typeStart = new Int32Array(phrases.length + 1);
  const positionStart = new Int32Array(phrases.length + 1);
  phrases.forEach((ph, i) => {
    for (const t of ph.types) types.push(t);
    for (const p of ph.positions) positions.push(p);
    typeStart[i + 1] = types.length;
    positionStart[i + 1] = positions.length;
  });
  return { count: phrases.length, typeStart, types: types.toArray(), positionStart, positions: positions.toArray(), runs: null };
}

/** Maximal recurring phrases as objects; see `findPhrases`. */
export function recurringPhrases(model: TextModel, content: Uint8Array, opts: PhraseOptions): Phrase[] {
  return phraseList(findPhrases(model, content, opts));
}

/**
 * Maximal recurring phrases of `minN`…`maxN` tokens within one sentence,
 * occurring at least `minCount` times and holding a content token
 * (`content[i]` is 1 for a content token). Listed by length, then by first
 * occurrence.
 *
 * Level by level (apriori): every (n+1)-word phrase is a frequent n-word
 * phrase followed by the frequent n-word phrase one position on (they share
 * n−1 words), so each level is one pass over the positions that survived the
 * last, pairing two group ids in a hash table of integers. An n-word phrase is
 * dropped when one (n+1)-word phrase that extends it to the right or the left
 * has as many occurrences (it then covers all of them).
 */
export function findPhrases(model: TextModel, content: Uint8Array, opts: PhraseOptions): PhraseSet {
  const { type, sentence, count: n } = model.tokens;
  const { minCount } = opts;
  const out = setBuilder();
  // Level `len`: the group (frequent len-word phrase) starting at each token,
  // or −1; the tokens where one starts (ascending); each group's occurrences.
  // Both columns are updated in place from level to level.
  const gid = new Int32Array(n);
  const alive = new Int32Array(n);
  let counts: Int32Array = new Int32Array(model.vocab.length);
  let aliveCount = 0;
  let groups = model.vocab.length;
  // Level 1: the word types that occur at least minCount times.
  for (let i = 0; i < n; i++) counts[type[i]!]!++;
  for (let i = 0; i < n; i++) {
    const t = type[i]!;
    if (counts[t]! >= minCount) {
      gid[i] = t;
      alive[aliveCount++] = i;
    } else gid[i] = -1;
  }
  // Each alive position's pair id at the level being built; the first
  // position of each group (`firstAt`, from level 2 on; pair ids are given in
  // order of first position, so group ids run in text order).
  const pairOf = new Int32Array(aliveCount);
  let firstAt: Int32Array = new Int32Array(Math.max(16, aliveCount >>> 2));
  const table = pairTable(aliveCount >>> 2);
  let ratio = 0.25; // distinct pairs per position, as last seen
  let runs: PhraseSet['runs'] = null;
  // Scratch reused from level to level (fresh memory is slow to touch).
  const covered = new Uint8Array(Math.max(groups, aliveCount));
  const slot = new Int32Array(Math.max(groups, aliveCount));
  let nextCounts: Int32Array = new Int32Array(0);

  for (let len = 1; len <= opts.maxN; len++) {
    if (len === 3) runs = { at: gid.slice(), count: groups };
    covered.fill(0, 0, groups);
    let pairs = 0;
    const building = len < opts.maxN;
    if (building) {
      // Pair (group at p, group at p + 1) of each position whose len + 1 words share a sentence.
      resetTable(table, Math.ceil(aliveCount * ratio));
      pairs = countPairs(table, gid, alive, aliveCount, sentence, len, pairOf);
      ratio = pairs / Math.max(1, aliveCount);
      // The frequent pairs; a group is covered when one of them holds all its occurrences.
      if (nextCounts.length < pairs || nextCounts === counts) nextCounts = new Int32Array(Math.max(pairs, nextCounts.length));
      pairCounts(table, minCount, counts, covered, nextCounts);
    }
    // This level's phrases (level 1 never has any: minN is 2 or more).
    const phrases = len >= opts.minN ? choosePhrases(out, len, groups, counts, minCount, covered, firstAt, content, type, slot) : null;
    // One pass: the positions of this level's phrases; the next level, in place
    // (the positions of frequent pairs, numbered by pair id).
    let next = 0;
    for (let k = 0; k < aliveCount; k++) {
      const p = alive[k]!;
      if (phrases) {
        const s = slot[gid[p]!]!;
        if (s >= 0) phrases.positions[phrases.cursor[s]!++] = p;
      }
      if (building) {
        const id = pairOf[k]!;
        if (id >= 0 && nextCounts[id]! >= minCount) {
          gid[p] = id;
          alive[next++] = p;
        } else gid[p] = -1;
      }
    }
    if (!building || next === 0) break;
    aliveCount = next;
    [counts, nextCounts] = [nextCounts, counts];
    groups = pairs;
    [firstAt, table.first] = [table.first, firstAt];
  }
  return out.finish(runs);
}

/**
 * Adds to `out` the level's maximal phrases (groups not covered) that hold a
 * content token, in order of first position (the order of group ids), and
 * returns where their positions go: each slot's next place in `positions`;
 * `slot` gets the slot of each group (−1 for none).
 */
function choosePhrases(
  out: SetBuilder,
  len: number,
  groups: number,
  counts: Int32Array,
  minCount: number,
  covered: Uint8Array,
  firstAt: Int32Array,
  content: Uint8Array,
  type: Uint32Array,
  slot: Int32Array,
): { cursor: Int32Array; positions: Int32Array } {
  slot.fill(-1, 0, groups);
  const cursor = intList();
  let next = out.positionCount();
  for (let g = 0; g < groups; g++) {
    // Pairs counted fewer than minCount times are not groups.
    if (counts[g]! < minCount || covered[g]) continue;
    const p = firstAt[g]!;
    let keep = false;
    for (let j = p; j < p + len && !keep; j++) keep = content[j] === 1;
    if (!keep) continue;
    slot[g] = cursor.length;
    cursor.push(next);
    next += counts[g]!;
    out.addPhrase(type, p, len, counts[g]!);
  }
  return { cursor: cursor.toArray(), positions: out.reservePositions(next) };
}

interface SetBuilder {
  addPhrase(type: Uint32Array, first: number, len: number, occurrences: number): void;
  positionCount(): number;
  /** Grows the positions column to `size` and returns it (to be filled in place). */
  reservePositions(size: number): Int32Array;
  finish(runs: PhraseSet['runs']): PhraseSet;
}

function setBuilder(): SetBuilder {
  const types = intList(1 << 16);
  const typeStart = intList(1 << 14);
  const positionStart = intList(1 << 14);
  typeStart.push(0);
  positionStart.push(0);
  let positions = new Int32Array(1 << 16);
  let positionCount = 0;
  return {
    addPhrase(type, first, len, occurrences) {
      for (let j = first; j < first + len; j++) types.push(type[j]!);
      typeStart.push(types.length);
      positionCount += occurrences;
      positionStart.push(positionCount);
    },
    positionCount: () => positionCount,
    reservePositions(size) {
      if (size > positions.length) {
        const bigger = new Int32Array(Math.max(size, positions.length * 2));
        bigger.set(positions);
        positions = bigger;
      }
      return positions;
    },
    finish(runs) {
      return {
        runs,
        count: positionStart.length - 1,
        typeStart: typeStart.view(),
        types: types.view(),
        positionStart: positionStart.view(),
        positions: positions.subarray(0, positionCount),
      };
    },
  };
}

/**
 * Pairs of non-negative integers with their counts, each with a dense id in
 * the order first seen: open addressing over one interleaved typed array
 * (slot: a, b, id, count; 16 bytes, one cache line). Reset for each level at
 * a size fitting it, so that a level with few distinct pairs stays in cache;
 * doubles when half full.
 */
interface PairTable {
  slots: Int32Array;
  /** The table has 2^bits slots. */
  bits: number;
  size: number;
  /** The first position of each pair, by id. */
  first: Int32Array;
}

function pairTable(expected: number): PairTable {
  return { slots: new Int32Array(0), bits: 0, size: 0, first: new Int32Array(Math.max(16, expected)) };
}

/** Empties the table, sized for about `expected` pairs. */
function resetTable(table: PairTable, expected: number): void {
  table.bits = bitsFor(expected);
  const length = 4 << table.bits;
  if (table.slots.length < length) table.slots = new Int32Array(length);
  table.slots.fill(-1, 0, length);
  table.size = 0;
}

function hashPair(a: number, b: number): number {
  const h = (Math.imul(a, 0x9e3779b1) + Math.imul(b, 0x85ebca77)) | 0;
  return Math.imul(h ^ (h >>> 16), 0x7feb352d);
}

/**
 * Counts the pair (group at p, group at p + 1) of each alive position whose
 * len + 1 words share a sentence, into `table`; gives each position its pair
 * id (`pairOf[k]`, −1 for none) and each new pair its first position
 * (`table.first[id]`). Returns the number of distinct pairs. One loop with the
 * probing written out, as it runs over most of the text.
 */
function countPairs(
  table: PairTable,
  gid: Int32Array,
  alive: Int32Array,
  aliveCount: number,
  sentence: Uint32Array,
  len: number,
  pairOf: Int32Array,
): number {
  const n = gid.length;
  let slots = table.slots;
  let bits = table.bits;
  let mask = (1 << bits) - 1;
  let size = 0;
  for (let k = 0; k < aliveCount; k++) {
    const p = alive[k]!;
    const b = p + len < n ? gid[p + 1]! : -1;
    if (b < 0 || sentence[p] !== sentence[p + len]) {
      pairOf[k] = -1;
      continue;
    }
    const a = gid[p]!;
    let at = hashPair(a, b) >>> (32 - bits);
    for (;;) {
      const s = 4 * at;
      const x = slots[s]!;
      if (x === a && slots[s + 1] === b) {
        slots[s + 3]!++;
        pairOf[k] = slots[s + 2]!;
        break;
      }
      if (x === -1) {
        slots[s] = a;
        slots[s + 1] = b;
        slots[s + 2] = size;
        slots[s + 3] = 1;
        if (size === table.first.length) {
          const bigger = new Int32Array(Math.max(1024, size * 2));
          bigger.set(table.first);
          table.first = bigger;
        }
        table.first[size] = p;
        pairOf[k] = size++;
        if (size * 2 > 1 << bits) {
          table.size = size;
          growTable(table);
          slots = table.slots;
          bits = table.bits;
          mask = (1 << bits) - 1;
        }
        break;
      }
      at = (at + 1) & mask;
    }
  }
  table.size = size;
  return size;
}

/**
 * The occurrences of each pair by id, into `out`; marks in `covered` each
 * group (of `counts`) that a pair counted at least `min` times holds entirely.
 */
function pairCounts(table: PairTable, min: number, counts: Int32Array, covered: Uint8Array, out: Int32Array): void {
  const slots = table.slots;
  const end = 4 << table.bits;
  for (let s = 0; s < end; s += 4) {
    const a = slots[s]!;
    if (a === -1) continue;
    const b = slots[s + 1]!;
    const c = slots[s + 3]!;
    out[slots[s + 2]!] = c;
    if (c < min) continue;
    if (c === counts[a]) covered[a] = 1;
    if (c === counts[b]) covered[b] = 1;
  }
}

function growTable(table: PairTable): void {
  const old = table.slots.slice(0, 4 << table.bits);
  const size = table.size;
  resetTable(table, 1 << table.bits);
  table.size = size;
  const { slots, bits } = table;
  const mask = (1 << bits) - 1;
  for (let o = 0; o < old.length; o += 4) {
    if (old[o] === -1) continue;
    let at = hashPair(old[o]!, old[o + 1]!) >>> (32 - bits);
    while (slots[4 * at] !== -1) at = (at + 1) & mask;
    slots.set(old.subarray(o, o + 4), 4 * at);
  }
}

/** The table size (a power of two, as bits) for about `expected` entries at most half full. */
function bitsFor(expected: number): number {
  let bits = 4;
  while (1 << bits < expected * 2) bits++;
  return bits;
}
