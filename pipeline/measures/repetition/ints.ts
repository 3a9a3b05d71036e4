/** A growable list of 32-bit integers over a typed array (no per-item garbage). */
export interface IntList {
  readonly length: number;
  push(value: number): void;
  /** The items so far, as a typed array of exactly `length` items (a copy). */
  toArray(): Int32Array;
  /** The items so far, as a view on the list's storage (valid until the next push). */
  view(): Int32Array;
}

export function intList(capacity = 1024): IntList {
  let items = new Int32Array(Math.max(16, capacity));
  let length = 0;
  return {
    get length() {
      return length;
    },
    push(value) {
      if (length === items.length) {
        const bigger = new Int32Array(length * 2);
        bigger.set(items);
        items = bigger;
      }
      items[length++] = value;
    },
    toArray: () => items.slice(0, length),
    view: () => items.subarray(0, length),
  };
}

/** Lists of integers grouped by key, each in the order added (compressed rows): row k is items[start[k] … start[k+1]). */
export interface Rows {
  start: Int32Array;
  items: Int32Array;
}

/** A growable list of (key, item) pairs, turned into `Rows` over keys 0…keys−1. */
export function pairList(capacity = 1024): { push: (key: number, item: number) => void; rows: (keys: number) => Rows } {
  const keys = intList(capacity);
  const items = intList(capacity);
  return {
    push(key, item) {
      keys.push(key);
      items.push(item);
    },
    rows(count) {
      const k = keys.toArray();
      const it = items.toArray();
      const start = new Int32Array(count + 1);
      for (let i = 0; i < k.length; i++) start[k[i]! + 1]!++;
      for (let r = 0; r < count; r++) start[r + 1]! += start[r]!;
      const fill = start.slice(0, count);
      const out = new Int32Array(k.length);
      for (let i = 0; i < k.length; i++) out[fill[k[i]!]!++] = it[i]!;
      return { start, items: out };
    },
  };
}
