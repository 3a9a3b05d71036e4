import { describe, it, expect } from 'vitest';
import { continuations } from '../../pipeline/measures/continuations.ts';
import { context } from './fixture.ts';
import type { TreeNode } from '../../pipeline/charts/types.ts';

/** The tree without the places of its occurrences. */
const shape = (n: TreeNode): Omit<TreeNode, 'at'> => ({ word: n.word, count: n.count, children: n.children.map(shape) });

const HERON = [
  'CHAPTER 1.',
  '',
  'The heron waited. The heron stood by the weir. The heron stood by the mill.',
  'The heron stood still. A heron waited, and the heron stood by.',
  '',
].join('\n');

describe('continuations', () => {
  const ctx = context(HERON);
  const run = (p: Record<string, unknown>) => continuations.compute(ctx, continuations.params.parse(p));

  it('grows the tree of what follows, stopping at sentence ends (worked by hand)', () => {
    const r = run({ phrase: 'the heron', depth: 3, minCount: 1 });
    expect(r.occurrences).toBe(5);
    expect(shape(r.root)).toEqual({
      word: 'the heron',
      count: 5,
      children: [
        {
          word: 'stood',
          count: 4,
          children: [
            { word: 'by', count: 3, children: [{ word: 'the', count: 2, children: [] }] },
            { word: 'still', count: 1, children: [] },
          ],
        },
        { word: 'waited', count: 1, children: [] },
      ],
    });
  });

  it('drops rare branches and keeps the most frequent children, ties alphabetically', () => {
    expect(run({ phrase: 'the heron', depth: 3, minCount: 2 }).root.children.map(shape)).toEqual([
      { word: 'stood', count: 4, children: [{ word: 'by', count: 3, children: [{ word: 'the', count: 2, children: [] }] }] },
    ]);
    const r = run({ phrase: 'stood by the', depth: 1, minCount: 1 });
    expect(r.root.children.map((c) => c.word)).toEqual(['mill', 'weir']);
    expect(run({ phrase: 'stood by the', depth: 1, minCount: 1, maxChildren: 1 }).root.children.map((c) => c.word)).toEqual(['mill']);
  });

  it('grows leftwards, reading outwards from the phrase', () => {
    const r = run({ phrase: 'heron', direction: 'left', depth: 2, minCount: 1 });
    // "the" before five of the six herons, "a" before one; nothing before them (sentence starts),
    // except "and the heron": "and" comes before that "the".
    expect(shape(r.root)).toEqual({
      word: 'heron',
      count: 6,
      children: [
        { word: 'the', count: 5, children: [{ word: 'and', count: 1, children: [] }] },
        { word: 'a', count: 1, children: [] },
      ],
    });
  });

  it('gives an empty tree for an absent phrase and draws a tree dataset', () => {
    expect(run({ phrase: 'grey otter' }).root).toEqual({ word: 'grey otter', count: 0, children: [], at: [] });
    const params = continuations.params.parse({ phrase: 'the heron', minCount: 1 });
    const r = continuations.compute(ctx, params);
    const tree = continuations.views.tree!(r, params);
    expect(tree).toMatchObject({ kind: 'tree', direction: 'right', root: r.root });
    const table = continuations.table(r, params);
    expect(table.rows[0]).toEqual([0, 'the heron', 5]);
    expect(table.rows).toContainEqual([2, 'the heron stood by', 3]);
  });

  it('records where each path is taken: the first word of every occurrence that takes it, one per table row', () => {
    const params = continuations.params.parse({ phrase: 'the heron', depth: 3, minCount: 1 });
    const r = continuations.compute(ctx, params);
    const table = continuations.table(r, params);
    expect(table.places).toHaveLength(table.rows.length);
    const { tokens, vocab } = ctx.model;
    table.rows.forEach((row, i) => {
      const places = table.places![i]!;
      expect(places).toHaveLength(row[2] as number);
      for (const t of places) {
        const words = String(row[1]).split(' ');
        expect(words.map((_, k) => vocab[tokens.type[t + k]!])).toEqual(words);
      }
    });
  });
});
