import { describe, expect, it } from 'vitest';
import { spreadApart, thinEvenly, thinGreedy } from '../../pipeline/charts/place.ts';

describe('spreadApart', () => {
  it('leaves labels that do not collide where they are', () => {
    expect(spreadApart([10, 50, 90], 16, 0, 100)).toEqual([10, 50, 90]);
  });
  it('centres a cluster of colliding labels on their mean', () => {
    expect(spreadApart([50, 50, 50], 10, 0, 100)).toEqual([40, 50, 60]);
  });
  it('keeps the input order in the output and every gap at least the minimum', () => {
    const out = spreadApart([30, 10, 31, 12], 8, 0, 100);
    const sorted = [...out].sort((a, b) => a - b);
    for (let i = 1; i < sorted.length; i++) expect(sorted[i] - sorted[i - 1]).toBeGreaterThanOrEqual(8 - 1e-9);
    expect(out[1]).toBeLessThan(out[3]);
    expect(out[0]).toBeLessThan(out[2]);
  });
  it('pushes clusters back inside the range', () => {
    expect(spreadApart([98, 99, 100], 10, 0, 100)).toEqual([80, 90, 100]);
    expect(spreadApart([0, 0], 10, 0, 100)).toEqual([0, 10]);
  });
});

describe('thinning', () => {
  it('keeps every label when there is room', () => {
    const labels = [0, 50, 100].map((at) => ({ at, width: 20 }));
    expect(thinEvenly(labels, 4)).toEqual([0, 1, 2]);
  });
  it('keeps every k-th label when crowded, with no collisions', () => {
    const labels = Array.from({ length: 40 }, (_, i) => ({ at: i * 10, width: 16 }));
    const kept = thinEvenly(labels, 4);
    expect(kept[0]).toBe(0);
    expect(kept[1] - kept[0]).toBe(2);
    for (let i = 1; i < kept.length; i++) expect(kept[i] - kept[i - 1]).toBe(kept[1] - kept[0]);
  });
  it('greedily drops labels that would touch the last one kept', () => {
    const labels = [0, 5, 30, 33, 60].map((at) => ({ at, width: 10 }));
    expect(thinGreedy(labels, 4)).toEqual([0, 2, 4]);
  });
});
