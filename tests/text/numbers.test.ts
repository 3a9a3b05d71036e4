import { describe, it, expect } from 'vitest';
import { parseLeadingNumber, parseNumberWords, romanValue, toRoman } from '../../pipeline/text/numbers.ts';

describe('Roman numerals', () => {
  // Values from memory; subtractive notation as in common practice, no source.
  it.each([
    ['I', 1], ['IV', 4], ['IX', 9], ['XIV', 14], ['XL', 40], ['XLII', 42], ['XC', 90], ['CDXLIV', 444], ['MCMXCIV', 1994],
  ])('%s = %i', (s, v) => {
    expect(romanValue(s)).toBe(v);
    expect(toRoman(v)).toBe(s);
  });

  it.each(['IIII', 'VX', 'IC', 'XXL', 'VV', 'MIM', ''])('%s is not well formed', (s) => {
    expect(romanValue(s)).toBeNull();
  });

  it('round-trips 1..3999', () => {
    for (let n = 1; n < 4000; n++) expect(romanValue(toRoman(n))).toBe(n);
  });
});

describe('number words', () => {
  // English number names: common practice, no source.
  it.each([
    ['One', 1, false], ['twelve', 12, false], ['Twenty-Three', 23, false], ['twenty three', 23, false],
    ['First', 1, true], ['Twelfth', 12, true], ['Twenty-First', 21, true], ['Fortieth', 40, true], ['Fiftieth', 50, true],
    ['Ninety-Ninth', 99, true], ['One Hundred and Two', 102, false], ['two hundred', 200, false],
  ])('%s = %i', (s, v, ordinal) => {
    expect(parseNumberWords(s)).toEqual({ value: v, ordinal, length: s.length });
  });

  it('consumes only the number words', () => {
    expect(parseNumberWords('Three Ships')).toEqual({ value: 3, ordinal: false, length: 5 });
    expect(parseNumberWords('Ships')).toBeNull();
  });

  it('reads a leading chapter number in every style', () => {
    expect(parseLeadingNumber('the Twenty-First', true)).toMatchObject({ value: 21, style: 'ordinal', withThe: true });
    expect(parseLeadingNumber('xiv.', true)).toMatchObject({ value: 14, style: 'roman', length: 3 });
    expect(parseLeadingNumber('xiv.', false)).toBeNull();
    expect(parseLeadingNumber('12: A Title', false)).toMatchObject({ value: 12, style: 'arabic', length: 2 });
    expect(parseLeadingNumber('Seven', false)).toMatchObject({ value: 7, style: 'words' });
    expect(parseLeadingNumber('Inward', true)).toBeNull();
    expect(parseLeadingNumber('12th', false)).toBeNull();
  });
});
