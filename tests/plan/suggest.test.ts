import { distance } from 'fastest-levenshtein';
import { describe, expect, it } from 'vitest';
import { maxSuggestDistance, nearest, slipDistance, suggestionHint } from '../../pipeline/plan/suggest.ts';

describe('Levenshtein distance used for suggestions', () => {
  it('matches the textbook worked example', () => {
    // Source: the classic example "kitten" → "sitting" needs 3 edits (k→s, e→i, +g),
    // e.g. the "Levenshtein distance" article on Wikipedia; from memory.
    expect(distance('kitten', 'sitting')).toBe(3);
    // One transposition costs two edits under Levenshtein (no transposition operation);
    // Source: V. I. Levenshtein (1966), insert/delete/substitute only; from memory.
    expect(distance('presence', 'presnece')).toBe(2);
  });
});

describe('slipDistance', () => {
  it('counts a swap of neighbouring letters as one slip', () => {
    // Source: F. J. Damerau (1964), "A technique for computer detection and correction of spelling
    // errors", CACM 7(3): transposition of two adjacent letters is one of the four single-error kinds; from memory.
    expect(slipDistance('titel', 'title')).toBe(1);
    expect(slipDistance('presnece', 'presence')).toBe(1);
    expect(slipDistance('tpo', 'top')).toBe(1);
  });

  it('agrees with Levenshtein when no swap helps', () => {
    expect(slipDistance('kitten', 'sitting')).toBe(3);
    expect(slipDistance('presense', 'presence')).toBe(1);
    expect(slipDistance('bars', 'bars')).toBe(0);
  });
});

describe('nearest', () => {
  const measures = ['structure', 'frequency', 'presence'];

  it('suggests a name one slip away', () => {
    expect(nearest('presense', measures)).toBe('presence');
    expect(nearest('frequncy', measures)).toBe('frequency');
  });

  it('catches swapped letters', () => {
    expect(nearest('tpo', ['terms', 'top'])).toBe('top');
    expect(nearest('titel', ['id', 'title', 'text'])).toBe('title');
  });

  it('ignores case when comparing', () => {
    expect(nearest('Structure', measures)).toBe('structure');
  });

  it('suggests nothing when no name is close relative to its length', () => {
    expect(nearest('pie', ['bars', 'lines', 'strip'])).toBeUndefined();
    expect(nearest('sentiment', measures)).toBeUndefined();
  });

  it('allows a third of the length in edits, at least one', () => {
    // common practice, no source: a third of the length separates slips from different words.
    expect(maxSuggestDistance('bar', 'bars')).toBe(1);
    expect(maxSuggestDistance('frequency', 'frequncy')).toBe(3);
    expect(nearest('bra', ['bars'])).toBeUndefined(); // 3 edits for a 4-letter name
    expect(nearest('bar', ['bars'])).toBe('bars');
  });

  it('picks the closest of several, and the earlier one on a tie', () => {
    expect(nearest('lines', ['line', 'lanes'])).toBe('line');
    expect(nearest('stripe', ['strip', 'stripes'])).toBe('strip');
  });

  it('returns undefined for no candidates', () => {
    expect(nearest('bars', [])).toBeUndefined();
  });
});

describe('suggestionHint', () => {
  it('offers the close name, or else lists the valid ones', () => {
    expect(suggestionHint('sortd', ['orientation', 'sorted'], 'options')).toBe('did you mean "sorted"?');
    expect(suggestionHint('colour', ['orientation', 'sorted'], 'options')).toBe('the options are: "orientation", "sorted"');
    expect(suggestionHint('colour', [], 'options')).toBe('there are no options');
  });
});
