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
  let groups = model.vocab.length;
  let aliveCount = firstLevel(type, n, minCount, counts, gid, alive);
  // Each alive position's pair id at the level being built; the first
  // position of each group (`firstAt`, from level 2 on; pair ids are given in
  // order of first position, so group ids run in text order).
  const pairOf = new Int32Array(aliveCount);
  let firstAt: Int32Array = new Int32Array(aliveCount);
  const table = pairTable(aliveCount);
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
      pairs = table.size = countPairs(table, gid, alive, aliveCount, sentence, len, pairOf);
      ratio = pairs / Math.max(1, aliveCount);
      // The frequent pairs; a group is covered when one of them holds all its occurrences.
      if (nextCounts.length < pairs) nextCounts = new Int32Array(pairs);
      pairCounts(table, minCount, counts, covered, nextCounts);
    }
    // This level's phrases (level 1 never has any: minN is 2 or more). At the
    // first such level, room for about as many positions (and words) as it
    // has, so that the columns seldom grow (untouched room costs nothing).
    if (len === opts.minN) reserve(out, aliveCount >>> 2, aliveCount, aliveCount);
    const cursor = len >= opts.minN ? choosePhrases(out, len, groups, counts, minCount, covered, firstAt, content, type, slot) : null;
    const next = advance(gid, alive, aliveCount, building ? pairOf : null, nextCounts, minCount, cursor, out.positions, slot);
    if (!building || next === 0) break;
    aliveCount = next;
    [counts, nextCounts] = [nextCounts, counts];
    groups = pairs;
    [firstAt, table.first] = [table.first, firstAt];
  }
  return finish(out, runs);
}

/*
 * Each hot loop below has a function of its own: the engine compiles a
 * function while its first loop runs, and a later loop in the same function
 * would then run with no type feedback and fall back to the interpreter.
 */

/** Level 1 over the first `n` tokens: the word types that occur at least `minCount` times (`counts` gets each type's count); returns how many tokens are alive. */
function firstLevel(type: Uint32Array, n: number, minCount: number, counts: Int32Array, gid: Int32Array, alive: Int32Array): number {
  countTypes(type, n, counts);
  return keepFrequent(type, n, minCount, counts, gid, alive);
}

function countTypes(type: Uint32Array, n: number, counts: Int32Array): void {
  for (let i = 0; i < n; i++) counts[type[i]!]!++;
}

function keepFrequent(type: Uint32Array, n: number, minCount: number, counts: Int32Array, gid: Int32Array, alive: Int32Array): number {
  let aliveCount = 0;
  for (let i = 0; i < n; i++) {
    const t = type[i]!;
    if (counts[t]! >= minCount) {
      gid[i] = t;
      alive[aliveCount++] = i;
    } else gid[i] = -1;
  }
  return aliveCount;
}

/**
 * One pass over a level's positions: puts down the positions of the level's
 * phrases (`slot` of each group and `cursor` of each slot, see
 * `choosePhrases`) in `positions`, when `cursor` is given; and, when `pairOf`
 * is given, moves to the next level in place (the positions of pairs counted
 * at least `minCount` times, numbered by pair id). Returns how many positions
 * the next level has. (Three loops, one for each case, so that each is
 * compiled with all it needs.)
 */
function advance(
  gid: Int32Array,
  alive: Int32Array,
  aliveCount: number,
  pairOf: Int32Array | null,
  pairCounts: Int32Array,
  minCount: number,
  cursor: Int32Array | null,
  positions: Int32Array,
  slot: Int32Array,
): number {
  if (!cursor) return pairOf ? nextLevel(gid, alive, aliveCount, pairOf, pairCounts, minCount) : 0;
  if (!pairOf) {
    placePhrases(gid, alive, aliveCount, cursor, positions, slot);
    return 0;
  }
  return placeAndAdvance(gid, alive, aliveCount, pairOf, pairCounts, minCount, cursor, positions, slot);
}

function nextLevel(gid: Int32Array, alive: Int32Array, aliveCount: number, pairOf: Int32Array, pairCounts: Int32Array, minCount: number): number {
  let next = 0;
  for (let k = 0; k < aliveCount; k++) {
    const p = alive[k]!;
    const id = pairOf[k]!;
    if (id >= 0 && pairCounts[id]! >= minCount) {
      gid[p] = id;
      alive[next++] = p;
    } else gid[p] = -1;
  }
  return next;
}

function placePhrases(gid: Int32Array, alive: Int32Array, aliveCount: number, cursor: Int32Array, positions: Int32Array, slot: Int32Array): void {
  for (let k = 0; k < aliveCount; k++) {
    const p = alive[k]!;
    const s = slot[gid[p]!]!;
    if (s >= 0) positions[cursor[s]!++] = p;
  }
}

function placeAndAdvance(
  gid: Int32Array,
  alive: Int32Array,
  aliveCount: number,
  pairOf: Int32Array,
  pairCounts: Int32Array,
  minCount: number,
  cursor: Int32Array,
  positions: Int32Array,
  slot: Int32Array,
): number {
  let next = 0;
  for (let k = 0; k < aliveCount; k++) {
    const p = alive[k]!;
    const s = slot[gid[p]!]!;
    if (s >= 0) positions[cursor[s]!++] = p;
    const id = pairOf[k]!;
    if (id >= 0 && pairCounts[id]! >= minCount) {
      gid[p] = id;
      alive[next++] = p;
    } else gid[p] = -1;
  }
  return next;
}

/**
 * Adds to `out` the level's maximal phrases (groups not covered) that hold a
 * content token, in order of first position (the order of group ids), and
 * returns where their positions go: each slot's next place in
 * `out.positions`; `slot` gets the slot of each group (−1 for none).
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
): Int32Array {
  const kept = keptGroups(groups, slot, markPhrases(len, groups, counts, minCount, covered, firstAt, content, slot));
  reserve(out, kept.length, kept.length * len, sumOf(counts, kept));
  return addPhrases(out, len, kept, counts, firstAt, type);
}

/** The sum of `values` at `indices`. */
function sumOf(values: Int32Array, indices: Int32Array): number {
  let sum = 0;
  for (let k = 0; k < indices.length; k++) sum += values[indices[k]!]!;
  return sum;
}

/** How many groups are kept as phrases; `slot` gets each group's place among them (−1 for none). */
function markPhrases(
  len: number,
  groups: number,
  counts: Int32Array,
  minCount: number,
  covered: Uint8Array,
  firstAt: Int32Array,
  content: Uint8Array,
  slot: Int32Array,
): number {
  let kept = 0;
  for (let g = 0; g < groups; g++) {
    slot[g] = -1;
    // Pairs counted fewer than minCount times are not groups.
    if (counts[g]! < minCount || covered[g]) continue;
    const p = firstAt[g]!;
    let keep = false;
    for (let j = p; j < p + len && !keep; j++) keep = content[j] === 1;
    if (keep) slot[g] = kept++;
  }
  return kept;
}

/** The `kept` groups with a slot, in slot order. */
function keptGroups(groups: number, slot: Int32Array, kept: number): Int32Array {
  const out = new Int32Array(kept);
  for (let g = 0; g < groups; g++) if (slot[g]! >= 0) out[slot[g]!] = g;
  return out;
}

/** Appends the kept groups as phrases; returns each one's first place in `out.positions`. */
function addPhrases(out: SetBuilder, len: number, kept: Int32Array, counts: Int32Array, firstAt: Int32Array, type: Uint32Array): Int32Array {
  const cursor = new Int32Array(kept.length);
  for (let k = 0; k < kept.length; k++) {
    const g = kept[k]!;
    const p = firstAt[g]!;
    for (let j = p; j < p + len; j++) out.types[out.typeCount++] = type[j]!;
    cursor[k] = out.positionCount;
    out.positionCount += counts[g]!;
    out.count++;
    out.typeStart[out.count] = out.typeCount;
    out.positionStart[out.count] = out.positionCount;
  }
  return cursor;
}

/** Phrases as they are found: columns with room to grow (see `PhraseSet`). */
interface SetBuilder {
  count: number;
  typeStart: Int32Array;
  types: Int32Array;
  typeCount: number;
  positionStart: Int32Array;
  positions: Int32Array;
  positionCount: number;
}

function setBuilder(): SetBuilder {
  return {
    count: 0,
    typeStart: new Int32Array(1 << 14),
    types: new Int32Array(1 << 16),
    typeCount: 0,
    positionStart: new Int32Array(1 << 14),
    positions: new Int32Array(1 << 16),
    positionCount: 0,
  };
}

/** Room for `phrases` more phrases of `words` words in all, at `occurrences` more positions. */
function reserve(out: SetBuilder, phrases: number, words: number, occurrences: number): void {
  const room = (column: Int32Array, size: number): Int32Array => {
    if (size <= column.length) return column;
    const bigger = new Int32Array(Math.max(size, column.length * 2));
    bigger.set(column);
    return bigger;
  };
  out.typeStart = room(out.typeStart, out.count + phrases + 1);
  out.positionStart = room(out.positionStart, out.count + phrases + 1);
  out.types = room(out.types, out.typeCount + words);
  out.positions = room(out.positions, out.positionCount + occurrences);
}

function finish(out: SetBuilder, runs: PhraseSet['runs']): PhraseSet {
  return {
    count: out.count,
    typeStart: out.typeStart.subarray(0, out.count + 1),
    types: out.types.subarray(0, out.typeCount),
    positionStart: out.positionStart.subarray(0, out.count + 1),
    positions: out.positions.subarray(0, out.positionCount),
    runs,
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
  /** The first position of each pair, by id (room for as many pairs as positions). */
  first: Int32Array;
}

function pairTable(positions: number): PairTable {
  return { slots: new Int32Array(0), bits: 0, size: 0, first: new Int32Array(positions) };
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
 * (`table.first[id]`). Returns the number of distinct pairs (for
 * `table.size`). One loop with the probing written out, as it runs over most
 * of the text.
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
  const first = table.first;
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
        first[size] = p;
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
