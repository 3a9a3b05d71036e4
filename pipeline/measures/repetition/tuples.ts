/**
 * Interning of short tuples of integers (word-type ids): each distinct tuple
 * gets a dense id, 0, 1, 2… in the order first seen. A key is a range of an
 * array, whole, with one item starred (a wildcard) or with one item left out.
 * Open addressing over typed arrays, so that hundreds of thousands of keys
 * cost no strings and little garbage; keys are hashed polynomially, so that
 * every one-gap key of a tuple is hashed in one pass (`gapHasher`).
 */
export interface TupleTable {
  /** How many distinct tuples have been added. */
  readonly size: number;
  /**
   * The id of the tuple `items[from…to)`, added when new. With `at` in that
   * range, `items[at]` is starred (`gap: "star"`, the default) or left out
   * (`gap: "omit"`).
   */
  add(items: ArrayLike<number>, from: number, to: number, at?: number, gap?: Gap): number;
  /** As `add`, but −1 when the tuple was never added. */
  find(items: ArrayLike<number>, from: number, to: number, at?: number, gap?: Gap): number;
  /** False when no tuple with this hash was ever added (a quick test before `findHashed`; true may be a false alarm). */
  mayHold(hash: number): boolean;
  /** The bits `mayHold` reads, for loops that test them in line: bit `hash >>> filterShift` of `filter`. */
  readonly filter: Int32Array;
  readonly filterShift: number;
  /** As `find`, with the key's hash already known (from `gapHasher` or `tupleHash`). */
  findHashed(hash: number, items: ArrayLike<number>, from: number, to: number, at?: number, gap?: Gap): number;
}

/** How a tuple key treats one item: starred (matches nothing but a star), or left out. */
export type Gap = 'star' | 'omit';

const EMPTY = -1;
const BASE = 0x01000193;

/** 0: the whole range; 1: `at` starred; 2: `at` left out. */
function modeOf(from: number, to: number, at: number, gap: Gap): number {
  if (at < from || at >= to) return 0;
  return gap === 'star' ? 1 : 2;
}

/** Spreads a polynomial hash of a key of `length` items over all 32 bits. */
function finish(h: number, length: number): number {
  h ^= Math.imul(length, 0x9e3779b1);
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  return h ^ (h >>> 16);
}

/** The hash of a key (see `TupleTable.add`): Σ x_k·BASE^(m−1−k) over its m items, x = item + 1, a star 0. */
export function tupleHash(items: ArrayLike<number>, from: number, to: number, at = -1, gap: Gap = 'star'): number {
  const mode = modeOf(from, to, at, gap);
  let h = 0;
  for (let i = from; i < to; i++) {
    if (i === at && mode === 2) continue;
    h = (Math.imul(h, BASE) + (i === at && mode === 1 ? 0 : items[i]! + 1)) | 0;
  }
  return finish(h, to - from - (mode === 2 ? 1 : 0));
}

/** Fills `star` and `omit` with the hashes of a tuple's one-gap keys and returns the hash of the whole; see `gapHasher`. */
export type GapHasher = (items: ArrayLike<number>, from: number, to: number, star: Int32Array, omit: Int32Array) => number;

/**
 * A function giving, in one pass, the hashes of the tuple `items[from…to)`
 * with each item starred (`star[s − from]`) and left out (`omit[s − from]`),
 * and returning the hash of the whole tuple; each equal to `tupleHash` of the
 * key. It reuses its own scratch space from call to call.
 */
export function gapHasher(): GapHasher {
  // prefix[s] = polynomial hash of the first s items; power[s] = BASE^s.
  let prefix = new Int32Array(16);
  let power = new Int32Array(16);
  return (items, from, to, star, omit) => {
    const m = to - from;
    if (m + 1 > prefix.length) {
      prefix = new Int32Array(2 * (m + 1));
      power = new Int32Array(2 * (m + 1));
    }
    prefix[0] = 0;
    power[0] = 1;
    for (let s = 0; s < m; s++) {
      prefix[s + 1] = (Math.imul(prefix[s]!, BASE) + items[from + s]! + 1) | 0;
      power[s + 1] = Math.imul(power[s]!, BASE);
    }
    const whole = prefix[m]!;
    for (let s = 0; s < m; s++) {
      const tail = power[m - 1 - s]!;
      star[s] = finish((whole - Math.imul(items[from + s]! + 1, tail)) | 0, m);
      omit[s] = finish((Math.imul(prefix[s]!, tail) + whole - Math.imul(prefix[s + 1]!, tail)) | 0, m - 1);
    }
    return finish(whole, m);
  };
}

/** A table sized for about `expected` distinct tuples (it grows when needed). */
export function tupleTable(expected: number): TupleTable {
  let bits = 4;
  while (1 << bits < expected * 2) bits++;
  // Slot: [id, hash].
  let slots = new Int32Array(2 << bits).fill(EMPTY);
  // Tuple id → its items (a star as −1) in `pool`.
  let start = new Int32Array(Math.max(16, expected) + 1);
  let pool = new Int32Array(Math.max(64, expected * 4));
  let size = 0;
  // A bit per hash prefix of every key added: about 32 bits per expected key.
  let filterBits = 10;
  while (1 << filterBits < expected * 32) filterBits++;
  const filter = new Int32Array(1 << (filterBits - 5));
  const filterShift = 32 - filterBits;

  const equals = (id: number, items: ArrayLike<number>, from: number, to: number, mode: number, at: number): boolean => {
    let k = start[id]!;
    if (start[id + 1]! - k !== to - from - (mode === 2 ? 1 : 0)) return false;
    for (let i = from; i < to; i++) {
      if (i === at && mode === 2) continue;
      if (pool[k++] !== (i === at && mode === 1 ? -1 : items[i]!)) return false;
    }
    return true;
  };

  /** The slot holding the key, or the empty slot where it goes. */
  const slotOf = (h: number, items: ArrayLike<number>, from: number, to: number, mode: number, at: number): number => {
    const mask = (1 << bits) - 1;
    let s = h & mask;
    for (;;) {
      const id = slots[2 * s]!;
      if (id === EMPTY || (slots[2 * s + 1] === h && equals(id, items, from, to, mode, at))) return s;
      s = (s + 1) & mask;
    }
  };

  const grow = (): void => {
    const old = slots;
    bits++;
    slots = new Int32Array(2 << bits).fill(EMPTY);
    const mask = (1 << bits) - 1;
    for (let o = 0; o < old.length; o += 2) {
      if (old[o] === EMPTY) continue;
      let s = old[o + 1]! & mask;
      while (slots[2 * s] !== EMPTY) s = (s + 1) & mask;
      slots[2 * s] = old[o]!;
      slots[2 * s + 1] = old[o + 1]!;
    }
  };

  const insert = (s: number, h: number, items: ArrayLike<number>, from: number, to: number, mode: number, at: number): number => {
    const id = size++;
    const bit = h >>> filterShift;
    filter[bit >>> 5]! |= 1 << (bit & 31);
    slots[2 * s] = id;
    slots[2 * s + 1] = h;
    if (id + 2 > start.length) {
      const bigger = new Int32Array(start.length * 2);
      bigger.set(start);
      start = bigger;
    }
    let k = start[id]!;
    if (k + (to - from) > pool.length) {
      const bigger = new Int32Array(Math.max(pool.length * 2, k + (to - from)));
      bigger.set(pool);
      pool = bigger;
    }
    for (let i = from; i < to; i++) {
      if (i === at && mode === 2) continue;
      pool[k++] = i === at && mode === 1 ? -1 : items[i]!;
    }
    start[id + 1] = k;
    if (size * 2 > 1 << bits) grow();
    return id;
  };

  const findHashed = (h: number, items: ArrayLike<number>, from: number, to: number, at = -1, gap: Gap = 'star'): number => {
    const mode = modeOf(from, to, at, gap);
    const id = slots[2 * slotOf(h, items, from, to, mode, at)]!;
    return id === EMPTY ? -1 : id;
  };

  return {
    get size() {
      return size;
    },
    add(items, from, to, at = -1, gap = 'star') {
      const mode = modeOf(from, to, at, gap);
      const h = tupleHash(items, from, to, at, gap);
      const s = slotOf(h, items, from, to, mode, at);
      const id = slots[2 * s]!;
      return id === EMPTY ? insert(s, h, items, from, to, mode, at) : id;
    },
    find: (items, from, to, at = -1, gap = 'star') => findHashed(tupleHash(items, from, to, at, gap), items, from, to, at, gap),
    mayHold(h) {
      const bit = h >>> filterShift;
      return (filter[bit >>> 5]! & (1 << (bit & 31))) !== 0;
    },
    filter,
    filterShift,
    findHashed,
  };
}
