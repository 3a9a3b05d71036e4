/**
 * Growable typed-array buffers: append, then take an exactly sized copy.
 */

export interface U32Buffer {
  push(v: number): void;
  get(i: number): number;
  set(i: number, v: number): void;
  readonly length: number;
  /** An exactly sized copy of what was pushed. */
  toArray(): Uint32Array;
}

export interface U8Buffer {
  push(v: number): void;
  readonly length: number;
  toArray(): Uint8Array;
}

export function u32Buffer(initialCapacity = 1024): U32Buffer {
  let data = new Uint32Array(Math.max(16, initialCapacity));
  let n = 0;
  return {
    push(v: number): void {
      if (n === data.length) {
        const bigger = new Uint32Array(data.length * 2);
        bigger.set(data);
        data = bigger;
      }
      data[n++] = v;
    },
    get: (i: number): number => data[i],
    set(i: number, v: number): void {
      data[i] = v;
    },
    get length(): number {
      return n;
    },
    toArray: (): Uint32Array => data.slice(0, n),
  };
}

export function u8Buffer(initialCapacity = 1024): U8Buffer {
  let data = new Uint8Array(Math.max(16, initialCapacity));
  let n = 0;
  return {
    push(v: number): void {
      if (n === data.length) {
        const bigger = new Uint8Array(data.length * 2);
        bigger.set(data);
        data = bigger;
      }
      data[n++] = v;
    },
    get length(): number {
      return n;
    },
    toArray: (): Uint8Array => data.slice(0, n),
  };
}
