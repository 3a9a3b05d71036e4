import { describe, it, expect } from 'vitest';
import { jStat } from 'jstat';
import { countTypes, mattr, mtld, typeTokenRatio } from '../../pipeline/stats/diversity.ts';

/** Type ids for a list of words, by first appearance. */
function ids(words: string[]): Uint32Array {
  const seen = new Map<string, number>();
  return Uint32Array.from(words.map((w) => seen.get(w) ?? (seen.set(w, seen.size), seen.size - 1)));
}

describe('type–token ratio', () => {
  it('is distinct types over tokens', () => {
    // Trivial by definition: 3 types in 6 tokens.
    const seq = ids('tide rose tide fell rose tide'.split(' '));
    expect(countTypes(seq)).toBe(3);
    expect(typeTokenRatio(seq)).toBe(0.5);
    expect(typeTokenRatio(seq, 1, 4)).toBe(1);
    expect(typeTokenRatio(seq, 2, 2)).toBeNull();
  });
});

describe('MATTR (Covington & McFall 2010)', () => {
  it('equals the mean, taken by jStat, of the TTRs of every window counted with a Set', () => {
    // Source: jStat 1.9 `mean`, run here as the reference, over window TTRs counted independently (a JavaScript Set per window).
    const words = 'the tide rose and the tide fell and the lamps were lit along the quay as the tide rose'.split(' ');
    const seq = ids(words);
    for (const w of [2, 3, 5, 8]) {
      const ttrs: number[] = [];
      for (let i = 0; i + w <= words.length; i++) ttrs.push(new Set(words.slice(i, i + w)).size / w);
      expect(mattr(seq, w).value).toBeCloseTo(jStat.mean(ttrs), 12);
    }
  });

  const seq = ids('tide rose tide fell rose tide'.split(' '));

  it('averages the TTR of every window', () => {
    // Computed by hand, window 3: [tide rose tide] 2/3, [rose tide fell] 1, [tide fell rose] 1,
    // [fell rose tide] 1 → (2/3 + 3) / 4 = 11/12.
    const r = mattr(seq, 3);
    expect(r.value).toBeCloseTo(11 / 12, 12);
    expect(r.windows).toBe(4);
    expect(r.fallback).toBe(false);
    // Window 4: every window holds 3 types → 3/4.
    expect(mattr(seq, 4).value).toBeCloseTo(0.75, 12);
  });

  it('equals the TTR when the window is the whole span, and falls back to it when the span is shorter', () => {
    expect(mattr(seq, 6).value).toBeCloseTo(0.5, 12);
    const short = mattr(seq, 10);
    expect(short).toEqual({ value: 0.5, windows: 0, fallback: true });
  });
});

describe('MTLD (McCarthy & Jarvis 2010)', () => {
  it('regression value: "of the X by the X for the X" gives 9 both ways, worked by hand', () => {
    // Regression value, worked by hand with the procedure of McCarthy & Jarvis 2010 (threshold 0.72, partial
    // factor (1 − TTR)/(1 − 0.72)); not a printed figure. No general-purpose implementation of MTLD or MATTR
    // is published on npm to check against, so this file's checks are hand-worked (see also the plain
    // reference below).
    // Forward: "of the river by the river" ends a factor at TTR 4/6 ≤ 0.72; "for the river" is
    // left with TTR 1, a partial factor of 0 → 9 words ÷ 1 factor = 9.
    // Backward: "river the for river the" ends at 3/5; "river by the of" has TTR 1 → 9 ÷ 1 = 9.
    const r = mtld(ids('of the river by the river for the river'.split(' ')));
    expect(r.forward.factors).toBe(1);
    expect(r.forward.value).toBe(9);
    expect(r.backward.value).toBe(9);
    expect(r.value).toBe(9);
  });

  it('adds a partial factor for the remainder', () => {
    // Computed by hand: "a a b" forward → "a a" (TTR 1/2 ≤ 0.72) is a factor; "b" has TTR 1 → 0.
    // Backward: "b a a" → TTR after "b a a" = 2/3 ≤ 0.72 → 1 factor, nothing left. Both 3.
    // "a b c a" forward: TTRs 1, 1, 1, 3/4 > 0.72 → no factor; partial (1 − 0.75)/0.28 = 0.892857…
    const seq = ids(['a', 'b', 'c', 'a']);
    const r = mtld(seq);
    expect(r.forward.factors).toBeCloseTo(0.25 / 0.28, 12);
    expect(r.forward.value).toBeCloseTo(4 / (0.25 / 0.28), 12);
    expect(mtld(ids(['a', 'a', 'b'])).value).toBe(3);
  });

  it('is undefined when no factor forms (every word new)', () => {
    // Our convention: no factor at all → null (the ratio tokens ÷ 0 is undefined).
    expect(mtld(ids(['a', 'b', 'c'])).value).toBeNull();
  });
});
