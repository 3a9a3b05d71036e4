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
      return rowsOf(keys.view(), items.view(), count);
    },
  };
}

/** Pairs (keys[k], items[k]) as rows over keys 0…count−1, each row in the order given (a counting sort). */
export function rowsOf(keys: Int32Array, items: Int32Array, count: number): Rows {
  const start = rowStarts(keys, count);
  const fill = start.slice(0, count);
  const out = new Int32Array(keys.length);
  for (let i = 0; i < keys.length; i++) out[fill[keys[i]!]!++] = items[i]!;
  return { start, items: out };
}

/** Where each key's row starts, for rows over keys 0…count−1 (one past the last at `count`). */
function rowStarts(keys: Int32Array, count: number): Int32Array {
  const start = new Int32Array(count + 1);
  for (let i = 0; i < keys.length; i++) start[keys[i]! + 1]!++;
  return runningTotals(start);
}

/** Each item made the sum of itself and all before it (in place). */
export function runningTotals(values: Int32Array): Int32Array {
  for (let i = 1; i < values.length; i++) values[i]! += values[i - 1]!;
  return values;
}
