import { describe, expect, it } from 'vitest';
import { tree, treeOptions } from '../../pipeline/charts/tree.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import { textWidth } from '../../pipeline/charts/svg.ts';
import { boxOf, overlaps } from '../../pipeline/charts/labels.ts';
import type { TreeData, TreeNode } from '../../pipeline/charts/types.ts';
import { lockTree } from './fixtures-structure.ts';
import { count, texts, unescapeXml } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';
import { AMP, HOSTILE, checkDeterminism, checkEmpty, checkEscaping, checkOptions, checkRoot, checkType } from './kind-checks.ts';

interface Word {
  /** The phrase up to this word, from the tooltip. */
  phrase: string;
  depth: number;
  text: string;
  size: number;
  x: number;
  y: number;
  anchor: 'start' | 'end';
  box: { x: number; y: number; width: number; height: number };
}

/** Every word drawn: its tooltip's phrase, depth, type size and the box its text takes. */
function words(svg: string): Word[] {
  return Array.from(
    svg.matchAll(/<g class="vt-tree-(?:root|word)" data-depth="(\d+)"><title>([^<]*): [^<]*<\/title><text x="([\d.-]+)" y="([\d.-]+)" font-size="([\d.]+)"( text-anchor="end")?>([^<]*)<\/text>/g),
    (m) => {
      const size = Number(m[5]);
      const text = unescapeXml(m[7]);
      const x = Number(m[3]);
      const y = Number(m[4]);
      const width = textWidth(text, size);
      const anchor = m[6] ? 'end' : 'start';
      return {
        phrase: unescapeXml(m[2]),
        depth: Number(m[1]),
        text,
        size,
        x,
        y,
        anchor,
        box: { x: anchor === 'end' ? x - width : x, y: y - size * 0.85, width, height: size * 1.1 },
      };
    },
  );
}

function word(svg: string, phrase: string): Word {
  const w = words(svg).find((x) => x.phrase === phrase);
  if (!w) throw new Error(`no word for "${phrase}"`);
  return w;
}

function countNodes(n: TreeNode): number {
  return n.children.reduce((s, c) => s + 1 + countNodes(c), 0);
}

/** A tree too wide for a phone: long words, six levels. */
const longTree: TreeData = {
  kind: 'tree',
  title: 'What follows “the ferrywoman”',
  direction: 'right',
  root: {
    word: 'the ferrywoman',
    count: 9,
    children: [
      {
        word: 'remembered',
        count: 5,
        children: [{ word: 'everything', count: 4, children: [{ word: 'afterwards', count: 3, children: [{ word: 'unexpectedly', count: 2, children: [{ word: 'notwithstanding', count: 2, children: [] }] }] }] }],
      },
      { word: 'disappeared', count: 4, children: [{ word: 'downstream', count: 2, children: [] }] },
    ],
  },
};

describe('tree: snapshots', () => {
  it('what follows "the lock", 30 words', () => {
    const out = tree.render(lockTree);
    expectSvgSnapshot('tree', out.svg);
    expectSvgSnapshot('tree-narrow', out.svgNarrow!);
  });
  it('mirrored for what precedes a phrase', () => {
    expectSvgSnapshot('tree-left', tree.render({ ...lockTree, direction: 'left' }).svg);
  });
});

describe('tree: what every chart promises', () => {
  const render = () => tree.render(lockTree);
  checkRoot('tree', lockTree.title, render);
  checkDeterminism(render, () => tree.render(longTree));
  checkType(render);
  checkEscaping(() => [
    tree.render({
      ...lockTree,
      title: `${HOSTILE} ${AMP}`,
      root: { word: HOSTILE, count: 4, children: [{ word: AMP, count: 3, children: [{ word: HOSTILE, count: 2, children: [] }] }, { word: '<', count: 1, children: [] }] },
    }),
  ]);
  checkEmpty([
    ['nothing follows the phrase', () => tree.render({ ...lockTree, root: { word: 'the lock', count: 3, children: [] } })],
    ['no branch occurs often enough', () => tree.render(lockTree, { minCount: 20 })],
  ]);
  checkOptions(treeOptions, (o) => tree.render(lockTree, o), { depth: 4, minCount: 1, breadth: 5, limit: 40 });
});

describe('tree: alt text and notes', () => {
  it('states the most frequent continuation and branch', () => {
    // 17 of 48 = 35.4%.
    expect(tree.render(lockTree).alt).toBe(
      '\u201Cthe lock\u201D occurs 48 times; it is most often followed by \u201Cgates\u201D, 17 times (35%), then by \u201Ckeeper\u201D, 13 times. The most frequent branch reads \u201Cthe lock gates held fast\u201D (3 times).',
    );
  });
  it('reads a left tree towards its phrase', () => {
    const { alt } = tree.render({ ...lockTree, direction: 'left' });
    expect(alt).toContain('most often preceded by \u201Cgates\u201D');
    expect(alt).toContain('\u201Cfast held gates the lock\u201D');
  });
  it('names ties and says when words were left out', () => {
    const tied: TreeData = { ...lockTree, root: { ...lockTree.root, children: lockTree.root.children.map((c, i) => (i === 1 ? { ...c, count: 17 } : c)) } };
    expect(tree.render(tied).alt).toContain('followed by \u201Cgates\u201D and \u201Ckeeper\u201D, 17 times each (35%), then by \u201Cwas\u201D, 8 times');
    expect(tree.render(lockTree, { limit: 10 }).alt).toMatch(/The tree shows 10 of 30 words; the table lists all\.$/);
  });
  it('draws no notes: every note is skipped and left out of the alt text', () => {
    const out = tree.render(lockTree, {}, defaultTheme, [{ label: '1', text: 'The gates', at: { category: 'gates' } }]);
    expect(out.skippedNotes).toEqual(['1']);
    expect(out.alt).not.toContain('Note');
    expect(count(out.svg, 'vt-note')).toBe(0);
  });
});

describe('tree: layout', () => {
  it('draws every word of a 30-word tree, no two overlapping, inside both layouts', () => {
    const out = tree.render(lockTree);
    expect(countNodes(lockTree.root)).toBe(30);
    for (const [svg, width] of [[out.svg, 720], [out.svgNarrow!, 360]] as const) {
      const ws = words(svg);
      expect(ws).toHaveLength(31);
      ws.forEach((a, i) => {
        expect(a.box.x).toBeGreaterThanOrEqual(0);
        expect(a.box.x + a.box.width).toBeLessThanOrEqual(width);
        ws.slice(i + 1).forEach((b) => expect(overlaps(boxOf(a.box), boxOf(b.box)), `${a.phrase} / ${b.phrase}`).toBe(false));
      });
    }
  });
  it('sorts continuations by count and sizes type and branches by count', () => {
    const svg = tree.render(lockTree).svg;
    const first = lockTree.root.children.map((c) => word(svg, `the lock ${c.word}`));
    expect(first.map((w) => w.text)).toEqual(['gates', 'keeper', 'was', 'stood', 'house']);
    for (let i = 1; i < first.length; i++) {
      expect(first[i].y).toBeGreaterThan(first[i - 1].y);
      expect(first[i].size).toBeLessThan(first[i - 1].size);
    }
    expect(word(svg, 'the lock').size).toBeGreaterThan(first[0].size);
    // Branch strokes grow linearly with count: 1 + 6 × count / 48 in the wide layout.
    const strokes = Array.from(svg.matchAll(/<path d="[^"]*" stroke-width="([\d.]+)"\/>/g), (m) => Number(m[1]));
    expect(strokes).toHaveLength(30);
    expect(Math.max(...strokes)).toBeCloseTo(1 + (6 * 17) / 48, 1);
  });
  it('centres each word across its continuations', () => {
    // Source: Reingold & Tilford 1981, "Tidier drawings of trees" (IEEE TSE 7(2)): a parent is centred over its children.
    const svg = tree.render(lockTree).svg;
    const centre = (phrase: string) => {
      const w = word(svg, phrase);
      return w.y - w.size * 0.35;
    };
    for (const parent of ['the lock keeper', 'the lock gates held', 'the lock was full of']) {
      const kids = words(svg).filter((w) => w.phrase.startsWith(`${parent} `) && w.phrase.split(' ').length === parent.split(' ').length + 1);
      expect(kids.length).toBeGreaterThan(0);
      const mid = (centre(kids[0].phrase) + centre(kids[kids.length - 1].phrase)) / 2;
      expect(centre(parent), parent).toBeCloseTo(mid, 0);
    }
  });
  it('mirrors a left tree: the phrase at the right, words ending towards it', () => {
    const svg = tree.render({ ...lockTree, direction: 'left' }).svg;
    const root = word(svg, 'the lock');
    const gates = word(svg, 'gates the lock');
    expect(root.anchor).toBe('end');
    expect(root.x).toBeGreaterThan(600);
    expect(gates.x).toBeLessThan(root.box.x);
  });
  it('keeps a wide tree inside a phone screen by shrinking type, then levels, then words', () => {
    const out = tree.render(longTree, { depth: 6 });
    const narrow = words(out.svgNarrow!);
    for (const w of narrow) expect(w.box.x + w.box.width).toBeLessThanOrEqual(360);
    expect(Math.min(...narrow.map((w) => w.size))).toBeGreaterThanOrEqual(13);
    expect(words(out.svg)).toHaveLength(8);
    expect(narrow.length).toBeLessThan(8);
    // A word whose continuations are not drawn ends in "…".
    expect(texts(out.svgNarrow!)).toContain('\u2026');
  });
});

describe('tree: pruning and table', () => {
  it('prunes by depth, count, breadth and limit', () => {
    expect(words(tree.render(lockTree, { depth: 1 }).svg)).toHaveLength(6);
    const frequent = words(tree.render(lockTree, { minCount: 4 }).svg);
    expect(frequent.map((w) => w.text)).toEqual(['the lock', 'gates', 'keeper', 'was', 'stood', 'house', 'held', 'gave', 'said', 'was', 'open', 'way']);
    const narrow = tree.render(lockTree, { breadth: 2 }).svg;
    expect(words(narrow).filter((w) => w.depth === 1).map((w) => w.text)).toEqual(['gates', 'keeper']);
    const top = words(tree.render(lockTree, { limit: 5 }).svg);
    expect(top.map((w) => w.text)).toEqual(['the lock', 'gates', 'keeper', 'was', 'stood', 'said']);
  });
  it('marks words whose continuations are not all drawn', () => {
    const svg = tree.render(lockTree, { depth: 1 }).svg;
    expect(texts(svg).filter((t) => t === '\u2026')).toHaveLength(5);
  });
  it('tabulates every branch within depth and minCount, with its share of the shorter phrase', () => {
    const { table } = tree.render(lockTree, { limit: 3 });
    expect(table.rows).toHaveLength(30);
    expect(table.rows[0]).toEqual(['the lock gates', 1, 17, 35.4]);
    expect(table.rows.find((r) => r[0] === 'the lock was full of eels')).toEqual(['the lock was full of eels', 4, 2, 66.7]);
    const left = tree.render({ ...lockTree, direction: 'left' }).table;
    expect(left.rows[1][0]).toBe('held gates the lock');
    expect(left.columns[1].label).toBe('Words before the phrase');
    expect(tree.render(lockTree, { depth: 2, minCount: 3 }).table.rows.map((r) => r[0])).toEqual([
      'the lock gates', 'the lock gates held', 'the lock gates gave', 'the lock gates were',
      'the lock keeper', 'the lock keeper said', 'the lock keeper was',
      'the lock was', 'the lock was empty', 'the lock was full',
      'the lock stood', 'the lock stood open',
      'the lock house', 'the lock house door',
    ]);
  });
});
