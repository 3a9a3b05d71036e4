import { describe, it, expect } from 'vitest';
import { presence } from '../../pipeline/measures/presence.ts';
import { segmentBounds, segmentOf } from '../../pipeline/stats/windows.ts';
import { context, TALE, TALE_CAST } from './fixture.ts';

describe('presence', () => {
  const ctx = context(TALE, TALE_CAST);

  it('counts mentions per chapter, surname included when it is unique', () => {
    const r = presence.compute(ctx, presence.params.parse({}));
    const milo = r.characters.find((c) => c.id === 'milo')!;
    const nessa = r.characters.find((c) => c.id === 'nessa')!;
    // Milo: "Milo Brack", "Milo" (I); "Brack" (II); "Milo" (III).
    expect(milo.perChapter).toEqual([2, 1, 1]);
    // Nessa: "Nessa Quill" (I); "Nessa" (II); "Nessa" (III).
    expect(nessa.perChapter).toEqual([1, 1, 1]);
    expect(r.totalMentions).toBe(7);
    expect(milo.share + nessa.share).toBeCloseTo(1, 6);
    expect(milo.first).toBe(1);
    expect(milo.last).toBe(3);
  });

  it('counts per equal segment, and every mention lands in exactly one segment', () => {
    const r = presence.compute(ctx, presence.params.parse({ by: 'segment', segments: 4 }));
    expect(r.positions).toHaveLength(4);
    for (const c of r.characters) expect(c.perSegment!.reduce((a, b) => a + b, 0)).toBe(c.mentions);
  });

  it('places token t in the segment whose bounds hold it, for many sizes', () => {
    // Equal-width segments of word positions: segment k holds ⌊kN/S⌋ … ⌊(k+1)N/S⌋−1 (common practice, no source).
    for (const n of [1, 7, 10, 99, 1000]) {
      for (const s of [1, 2, 3, 7, 10]) {
        if (s > n) continue;
        const bounds = segmentBounds(n, s);
        expect(bounds[0]![0]).toBe(0);
        expect(bounds.at(-1)![1]).toBe(n);
        for (let t = 0; t < n; t++) {
          const k = segmentOf(t, n, s);
          expect(t >= bounds[k]![0] && t < bounds[k]![1]).toBe(true);
        }
      }
    }
  });

  it('offers lines, bars and strip views of the same counts', () => {
    const params = presence.params.parse({});
    const r = presence.compute(ctx, params);
    const lines = presence.views.lines!(r, params);
    const strip = presence.views.strip!(r, params);
    if (lines.kind !== 'lines' || strip.kind !== 'strip') throw new Error('wrong view kind');
    expect(lines.series.map((s) => s.values.reduce((a, b) => a + b, 0))).toEqual(r.characters.map((c) => c.mentions));
    expect(strip.rows.map((row) => row.positions.length)).toEqual(r.characters.map((c) => c.mentions));
    expect(strip.rows.every((row) => row.positions.every((x) => x >= 0 && x < 1))).toBe(true);
  });

  it('refuses character ids that are not in the cast', () => {
    expect(() => presence.compute(ctx, presence.params.parse({ characters: ['milo', 'ghost'] }))).toThrow(/ghost/);
  });
});
