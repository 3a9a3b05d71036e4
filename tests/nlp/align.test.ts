import { describe, it, expect } from 'vitest';
import { align } from '../../pipeline/nlp/align.ts';

describe('align', () => {
  // Offsets worked out by hand for: Don't go, Mrs. Pell.
  //                                 0123456789012345678
  const ourStart = [0, 6, 10, 15];
  const ourEnd = [5, 8, 13, 19]; // Don't | go | Mrs | Pell
  // The tagger's tokens: Do | n't | go | , | Mrs. | Pell | .
  const start = [0, 2, 6, 8, 10, 15, 19];
  const end = [2, 5, 8, 9, 14, 19, 20];

  it('gives each of our tokens its first overlapping tagger token and the number of parts', () => {
    const a = align(ourStart, ourEnd, 0, 4, start, end, start.length);
    expect(Array.from(a.first)).toEqual([0, 2, 4, 5]);
    expect(Array.from(a.parts)).toEqual([2, 1, 1, 1]);
    expect(Array.from(a.partStart)).toEqual([0, 6, 10, 15]);
    expect(Array.from(a.partEnd)).toEqual([5, 8, 14, 19]);
  });

  it('aligns a sub-range of our tokens, and leaves a token no tagger token covers at -1', () => {
    const a = align(ourStart, ourEnd, 1, 4, [6, 15], [8, 19], 2);
    expect(Array.from(a.first)).toEqual([0, -1, 1]);
    expect(Array.from(a.parts)).toEqual([1, 0, 1]);
  });

  it('lets one tagger token cover two of ours', () => {
    // "e.g" read by us as "e" and "g", by the tagger as one token "e.g.".
    const a = align([0, 2], [1, 3], 0, 2, [0], [4], 1);
    expect(Array.from(a.first)).toEqual([0, 0]);
  });

  it('skips empty tagger tokens (its white-space tokens)', () => {
    const a = align([3], [6], 0, 1, [3, 3], [3, 6], 2);
    expect(Array.from(a.first)).toEqual([1]);
  });
});
