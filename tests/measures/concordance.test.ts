import { describe, it, expect } from 'vitest';
import { concordance } from '../../pipeline/measures/concordance.ts';
import { context } from './fixture.ts';

// Tokens (by hand): Chapter 1: The(0) lamp(1) burned(2) low(3) Ada(4) trimmed(5) the(6) lamp(7) and(8) the(9)
// lamp(10) burned(11) again(12) ¶ The(13) ferry(14) came(15) at(16) dusk(17); Chapter 2: Light(18) the(19) lamp(20) said(21) Ada(22).
const LAMP = [
  'CHAPTER 1.',
  '',
  'The lamp burned low. Ada trimmed the lamp, and the lamp burned',
  'again.',
  '',
  'The ferry came at dusk.',
  '',
  'CHAPTER 2.',
  '',
  '“Light the lamp,” said Ada.',
  '',
].join('\n');

describe('concordance', () => {
  const ctx = context(LAMP);
  const run = (p: Record<string, unknown>) => concordance.compute(ctx, concordance.params.parse(p));

  it('gives each occurrence with its context, punctuation kept, within its chapter', () => {
    const r = run({ node: 'lamp', width: 2 });
    expect(r.total).toBe(4);
    expect(r.lines.map((l) => [l.left, l.keyword, l.right])).toEqual([
      ['The', 'lamp', 'burned low.'],
      ['trimmed the', 'lamp', ', and the'],
      ['and the', 'lamp', 'burned again.'],
      ['“Light the', 'lamp', ',” said Ada.'],
    ]);
  });

  it('turns line breaks into spaces and does not reach into the chapter heading', () => {
    const r = run({ node: 'lamp', width: 4 });
    expect(r.lines[0]!.left).toBe('The');
    expect(r.lines[1]!.right).toBe(', and the lamp burned');
    expect(r.lines[2]!.right).toBe('burned again. The ferry');
  });

  it('links each line to its chapter, paragraph and character offset', () => {
    const r = run({ node: 'lamp' });
    expect(r.lines.map((l) => [l.chapter, l.paragraph, l.paragraphInChapter, l.token])).toEqual([
      [1, 0, 1, 1],
      [1, 0, 1, 7],
      [1, 0, 1, 10],
      [2, 2, 1, 20],
    ]);
    for (const l of r.lines) expect(ctx.model.text.slice(l.offset, l.offset + 4)).toBe('lamp');
    // Source lines of the fixture (counted by hand): 3, 3, 3, 10.
    expect(r.lines.map((l) => l.line)).toEqual([3, 3, 3, 10]);
    expect(run({ node: 'ferry' }).lines[0]).toMatchObject({ chapter: 1, paragraph: 1, paragraphInChapter: 2 });
  });

  it('sorts by the left context word by word outwards, and likewise by the right', () => {
    // Left: L1 is "the" everywhere; L2 is none, "trimmed", "and", "light" → none first, then and, light, trimmed.
    expect(run({ node: 'lamp', sort: 'left' }).lines.map((l) => l.token)).toEqual([1, 10, 20, 7]);
    // Right: R1 burned, and, burned, said; R2 low, –, again → and, burned again, burned low, said.
    expect(run({ node: 'lamp', sort: 'right' }).lines.map((l) => l.token)).toEqual([7, 10, 1, 20]);
    expect(run({ node: 'lamp', sort: 'position' }).lines.map((l) => l.token)).toEqual([1, 7, 10, 20]);
  });

  it('sorts accented words with their base letters, not after "z"', () => {
    // Alphabetical order of the language (Intl collation, common practice, no source): eagle, école, fish, zebra.
    const ctx2 = context('CHAPTER 1.\n\nThe lamp zebra. The lamp école. The lamp fish. The lamp eagle.\n');
    const r = concordance.compute(ctx2, concordance.params.parse({ node: 'lamp', sort: 'right', width: 1 }));
    expect(r.lines.map((l) => l.right)).toEqual(['eagle.', 'école.', 'fish.', 'zebra.']);
  });

  it('matches phrases on consecutive words, punctuation between them allowed', () => {
    const r = run({ node: 'the lamp', width: 1 });
    expect(r.words).toEqual(['the', 'lamp']);
    expect(r.lines.map((l) => l.keyword)).toEqual(['The lamp', 'the lamp', 'the lamp', 'the lamp']);
    const comma = run({ node: 'Lamp and' });
    expect(comma.lines.map((l) => l.keyword)).toEqual(['lamp, and']);
    // "lamp burned" does not run across "burned low. Ada": the phrase must stay in one sentence.
    expect(run({ node: 'low ada' }).total).toBe(0);
  });

  it('keeps `limit` lines, counts them all, and can look in one chapter', () => {
    const r = run({ node: 'lamp', limit: 2 });
    expect([r.total, r.lines.length]).toEqual([4, 2]);
    expect(run({ node: 'lamp', chapter: 2 }).lines.map((l) => l.token)).toEqual([20]);
    expect(() => run({ node: 'lamp', chapter: 3 })).toThrow(/chapter 3 does not exist/);
    expect(run({ node: 'otter' }).lines).toEqual([]);
  });

  it('draws keyword-in-context lines that say where they are', () => {
    const params = concordance.params.parse({ node: 'lamp', width: 2, limit: 3 });
    const r = concordance.compute(ctx, params);
    const kwic = concordance.views.kwic!(r, params);
    expect(kwic.kind).toBe('kwic');
    if (kwic.kind !== 'kwic') return;
    expect(kwic.lines[0]).toEqual({ left: 'The', keyword: 'lamp', right: 'burned low.', where: 'Ch. 1, ¶ 1' });
    expect(kwic.title).toContain('3 of 4 lines');
    expect(concordance.table(r, params).rows[1]).toEqual([1, 1, r.lines[1]!.offset, 'trimmed the', 'lamp', ', and the']);
  });
});
