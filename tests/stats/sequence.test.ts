import { describe, it, expect } from 'vitest';
import { findSequence } from '../../pipeline/stats/sequence.ts';

describe('findSequence', () => {
  // Type ids of an invented column: 5 1 2 1 2 2 1 2 | 1 2 (the bar is a unit boundary).
  const types = [5, 1, 2, 1, 2, 2, 1, 2, 1, 2];
  const unit = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1];

  it('finds every start of a sequence, by hand', () => {
    expect(findSequence(types, [1, 2])).toEqual([1, 3, 6, 8]);
    expect(findSequence(types, [2])).toEqual([2, 4, 5, 7, 9]);
    expect(findSequence(types, [9])).toEqual([]);
    expect(findSequence(types, [])).toEqual([]);
  });

  it('finds what Node’s own Buffer.indexOf finds', () => {
    // Source: Node.js Buffer.prototype.indexOf, run here as the reference: each type id written as one byte,
    // every match found by searching again one byte after the last.
    const column = Array.from({ length: 400 }, (_, i) => (i * 7 + ((i * i) % 5)) % 4);
    const bytes = Buffer.from(column);
    for (const needle of [[1, 2], [3], [0, 3, 2], [2, 2, 2]]) {
      const expected: number[] = [];
      for (let at = bytes.indexOf(Buffer.from(needle)); at !== -1; at = bytes.indexOf(Buffer.from(needle), at + 1)) expected.push(at);
      expect(findSequence(column, needle)).toEqual(expected);
    }
  });

  it('finds overlapping matches', () => {
    expect(findSequence([3, 3, 3], [3, 3])).toEqual([0, 1]);
  });

  it('keeps a match inside one unit, and within [from, to)', () => {
    expect(findSequence(types, [2, 1], unit)).toEqual([2, 5]);
    expect(findSequence(types, [2, 1])).toEqual([2, 5, 7]);
    expect(findSequence(types, [1, 2], undefined, 2, 8)).toEqual([3, 6]);
    expect(findSequence(types, [1, 2], undefined, 0, 7)).toEqual([1, 3]);
  });
});
