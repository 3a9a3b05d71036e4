/**
 * Aligning the tagger's tokens with ours by character offsets. The two
 * tokenisers differ: wink splits "don't" into "do" + "n't" and "well-kept"
 * into "well" + "-" + "kept", and reads "Mrs." as one token where we read the
 * word "Mrs". Each of our tokens is matched with every tagger token that
 * overlaps it; the first of them gives its tag.
 */

/** How one of our tokens lines up with the tagger's tokens. */
export interface Alignment {
  /** Index of the first overlapping tagger token, -1 when none overlaps. */
  first: Int32Array;
  /** How many tagger tokens overlap it (capped at 255). */
  parts: Uint8Array;
  /** Start of the first and end of the last overlapping tagger token. */
  partStart: Uint32Array;
  partEnd: Uint32Array;
}

/**
 * Align our tokens `from … to-1` (character ranges `ourStart[k] … ourEnd[k]`,
 * in text order, not overlapping) with `count` tagger tokens (ranges
 * `start[j] … end[j]`, in text order). Entry k - from of the result describes
 * our token k. Linear in the number of tokens.
 */
export function align(
  ourStart: ArrayLike<number>,
  ourEnd: ArrayLike<number>,
  from: number,
  to: number,
  start: ArrayLike<number>,
  end: ArrayLike<number>,
  count: number,
): Alignment {
  const n = Math.max(0, to - from);
  const first = new Int32Array(n).fill(-1);
  const parts = new Uint8Array(n);
  const partStart = new Uint32Array(n);
  const partEnd = new Uint32Array(n);
  let k = from;
  for (let j = 0; j < count; j++) {
    const ws = start[j]!;
    const we = end[j]!;
    if (we <= ws) continue;
    while (k < to && ourEnd[k]! <= ws) k++;
    // Every token from k on ends after ws; those that start before we overlap.
    for (let q = k; q < to && ourStart[q]! < we; q++) {
      const o = q - from;
      if (first[o] === -1) {
        first[o] = j;
        partStart[o] = ws;
      }
      if (parts[o]! < 255) parts[o]!++;
      partEnd[o] = we;
    }
  }
  return { first, parts, partStart, partEnd };
}
