import { describe, expect, it } from 'vitest';
import { network, networkOptions } from '../../pipeline/charts/network.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import { lcg } from '../../pipeline/charts/force.ts';
import { boxOf, discOverlaps, overlaps, placeAllEightWays, placeEightWays, segmentHitsBox } from '../../pipeline/charts/labels.ts';
import type { PositionContext } from '../../pipeline/charts/labels.ts';
import { SHAPES, reach, symbol } from '../../pipeline/charts/shapes.ts';
import { textWidth } from '../../pipeline/charts/svg.ts';
import type { NetworkData } from '../../pipeline/charts/types.ts';
import { sharedMatrix, villageNetwork } from './fixtures-structure.ts';
import { count, titles, unescapeXml } from './inspect.ts';
import { expectSvgSnapshot, normaliseSvg } from './snapshot.ts';
import { AMP, HOSTILE, checkDeterminism, checkEmpty, checkEscaping, checkOptions, checkRoot, checkType } from './kind-checks.ts';
import { matrix } from '../../pipeline/charts/matrix.ts';

const note = { label: '1', text: 'Ada keeps the ferry running', at: { category: 'ada' } };

interface NodeMark {
  id: string;
  tag: string;
  fill: string;
  x: number;
  y: number;
  /** Farthest distance from the centre to the symbol's edge. */
  reach: number;
  /** Area of the symbol. */
  area: number;
}

/** Polygon vertices of a path made of M/L commands. */
function vertices(d: string): [number, number][] {
  return Array.from(d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g), (m) => [Number(m[1]), Number(m[2])]);
}

/** Shoelace formula. */
function polygonArea(pts: [number, number][]): number {
  let s = 0;
  pts.forEach(([x1, y1], i) => {
    const [x2, y2] = pts[(i + 1) % pts.length];
    s += x1 * y2 - x2 * y1;
  });
  return Math.abs(s) / 2;
}

function attr(tag: string, name: string): string | undefined {
  return new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1];
}

/** The node symbols drawn, read back from the SVG. */
function nodeMarks(svg: string): NodeMark[] {
  return Array.from(svg.matchAll(/<(circle|rect|path)\b([^>]*data-node="[^"]*"[^>]*)>/g), (m) => {
    const [, tag, a] = m;
    const id = unescapeXml(attr(a, 'data-node')!);
    const fill = attr(a, 'fill')!;
    if (tag === 'circle') {
      const r = Number(attr(a, 'r'));
      return { id, tag, fill, x: Number(attr(a, 'cx')), y: Number(attr(a, 'cy')), reach: r, area: Math.PI * r * r };
    }
    if (tag === 'rect') {
      const w = Number(attr(a, 'width'));
      return { id, tag, fill, x: Number(attr(a, 'x')) + w / 2, y: Number(attr(a, 'y')) + w / 2, reach: (w * Math.SQRT2) / 2, area: w * w };
    }
    const pts = vertices(attr(a, 'd')!);
    const isTriangle = pts.length === 3;
    const cx = pts.reduce((s, p) => s + p[0], 0) / pts.length;
    // A diamond's centre is the middle of its vertical diagonal; a triangle's is its centroid.
    const cy = isTriangle ? pts.reduce((s, p) => s + p[1], 0) / 3 : (pts[0][1] + pts[2][1]) / 2;
    return { id, tag, fill, x: cx, y: cy, reach: Math.max(...pts.map(([x, y]) => Math.hypot(x - cx, y - cy))), area: polygonArea(pts) };
  });
}

interface LabelMark {
  id: string;
  text: string;
  box: { x: number; y: number; width: number; height: number };
}

/** The names written beside nodes, with the boxes they were placed in. */
function labelMarks(svg: string): LabelMark[] {
  const group = svg.slice(svg.indexOf('<g class="vt-node-labels"'));
  return Array.from(group.matchAll(/<text x="([\d.-]+)" y="([\d.-]+)"(?: font-size="([\d.]+)")? data-node="([^"]*)">([^<]*)<\/text>/g), (m) => {
    const size = m[3] ? Number(m[3]) : 14;
    const text = unescapeXml(m[5]);
    const y = Number(m[2]);
    return { id: unescapeXml(m[4]), text, box: { x: Number(m[1]), y: y - size * 0.35 - (size + 2) / 2, width: textWidth(text, size), height: size + 2 } };
  });
}

function expectNoCollisions(svg: string): void {
  const nodes = nodeMarks(svg);
  const labels = labelMarks(svg);
  labels.forEach((a, i) => {
    labels.slice(i + 1).forEach((b) => expect(overlaps(boxOf(a.box), boxOf(b.box)), `${a.text} / ${b.text}`).toBe(false));
    for (const n of nodes) expect(discOverlaps({ x: n.x, y: n.y, r: n.reach - 0.05 }, boxOf(a.box)), `${a.text} on node ${n.id}`).toBe(false);
  });
}

/** A bigger invented network: 30 villagers, three hamlets, deterministic links. */
function crowd(n: number): NetworkData {
  const nodes = Array.from({ length: n }, (_, i) => ({ id: `v${i}`, name: `Villager ${String.fromCharCode(65 + (i % 26))}${i >= 26 ? i : ''}`, size: 1 + ((i * 7) % 11), community: i % 3 }));
  const edges: NetworkData['edges'] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if ((i * 31 + j * 17) % 9 === 0 || (i % 3 === j % 3 && (i + j) % 4 === 0)) edges.push({ source: `v${i}`, target: `v${j}`, weight: 1 + ((i + j) % 5) });
  return { ...villageNetwork, title: 'Who meets whom at the fair', nodes, edges };
}

describe('network: snapshots', () => {
  it('ten characters in three groups, with a note on one of them', () => {
    const out = network.render(villageNetwork, {}, defaultTheme, [note]);
    expectSvgSnapshot('network', out.svg);
    expectSvgSnapshot('network-narrow', out.svgNarrow!);
  });
});

describe('network: what every chart promises', () => {
  const render = () => network.render(villageNetwork, {}, defaultTheme, [note]);
  checkRoot('network', villageNetwork.title, render);
  checkDeterminism(render, () => network.render(crowd(12)));
  checkType(render);
  checkEscaping(() => [
    network.render(
      {
        ...villageNetwork,
        title: `${HOSTILE} ${AMP}`,
        sizeLabel: HOSTILE,
        weightLabel: AMP,
        nodes: villageNetwork.nodes.map((n, i) => ({ ...n, id: i === 0 ? HOSTILE : n.id, name: i % 2 ? HOSTILE : AMP })),
        edges: villageNetwork.edges.map((e) => ({ ...e, source: e.source === 'ada' ? HOSTILE : e.source })),
      },
      {},
      defaultTheme,
      [{ label: '"1"', text: HOSTILE, at: { category: HOSTILE } }],
    ),
  ]);
  checkEmpty([['no nodes', () => network.render({ ...villageNetwork, nodes: [], edges: [] })]]);
  checkOptions(networkOptions, (o) => network.render(villageNetwork, o), { minWeight: 0, ticks: 300 });
});

describe('network: layout', () => {
  it('gives the same picture whatever order the nodes and links come in', () => {
    const shuffled: NetworkData = {
      ...villageNetwork,
      nodes: [...villageNetwork.nodes].reverse(),
      edges: villageNetwork.edges.map((e, i) => (i % 2 ? { ...e, source: e.target, target: e.source } : e)).reverse(),
    };
    const a = network.render(villageNetwork, { id: 'net' });
    const b = network.render(shuffled, { id: 'net' });
    expect(b.svg).toBe(a.svg);
    expect(b.svgNarrow).toBe(a.svgNarrow);
  });
  it('keeps every node inside the drawing and apart from the others', () => {
    for (const svg of Object.values(network.render(crowd(30))).filter((v): v is string => typeof v === 'string' && v.startsWith('<svg'))) {
      const width = Number(/viewBox="0 0 (\d+)/.exec(svg)![1]);
      const nodes = nodeMarks(svg);
      expect(nodes).toHaveLength(30);
      for (const n of nodes) {
        expect(n.x - n.reach).toBeGreaterThanOrEqual(0);
        expect(n.x + n.reach).toBeLessThanOrEqual(width);
      }
      nodes.forEach((a, i) => nodes.slice(i + 1).forEach((b) => expect(Math.hypot(a.x - b.x, a.y - b.y), `${a.id}–${b.id}`).toBeGreaterThan(Math.max(a.reach, b.reach))));
    }
  });
  it('uses a seeded generator with the Numerical Recipes constants', () => {
    // from memory: the "quick and dirty" generator of Press et al., Numerical Recipes (2nd ed., §7.1),
    // I(j+1) = 1664525 I(j) + 1013904223 mod 2^32; from 0 it gives 1013904223, 1196435762, 3519870697, 2868466484.
    const next = lcg(0);
    expect([next(), next(), next(), next()].map((v) => v * 2 ** 32)).toEqual([1013904223, 1196435762, 3519870697, 2868466484]);
  });
});

describe('network: encoding', () => {
  it('sizes nodes by area, with a smallest radius', () => {
    const nodes = nodeMarks(network.render(villageNetwork).svg).filter((n) => n.tag === 'circle');
    const size = (id: string) => villageNetwork.nodes.find((n) => n.id === id)!.size;
    const [a, b] = [nodes.find((n) => n.id === 'ada')!, nodes.find((n) => n.id === 'bram')!];
    // Area ∝ size: Ada 101, Bram 66.
    expect(a.area / b.area).toBeCloseTo(size('ada') / size('bram'), 2);
  });
  it('gives each group its own colour and shape, of equal area for equal size', () => {
    const nodes = nodeMarks(network.render(villageNetwork).svg);
    const groupOf = (id: string) => villageNetwork.nodes.find((n) => n.id === id)!.community;
    for (const c of [0, 1, 2]) {
      const members = nodes.filter((n) => groupOf(n.id) === c);
      expect(new Set(members.map((n) => n.tag + n.fill)).size, `community ${c}`).toBe(1);
    }
    expect(new Set(nodes.map((n) => n.fill)).size).toBe(3);
    expect(new Set(nodes.map((n) => n.tag)).size).toBe(3);
  });
  it('draws shapes with the area of a circle of the same radius', () => {
    // common practice, no source: area of a polygon by the shoelace formula; circle πr².
    for (const shape of SHAPES) {
      const s = symbol(shape, 50, 50, 10);
      const area = s.tag === 'circle' ? Math.PI * 100 : s.tag === 'rect' ? Number(s.attrs.width) * Number(s.attrs.height) : polygonArea(vertices(String(s.attrs.d)));
      expect(area, shape).toBeCloseTo(Math.PI * 100, 0);
      const far = s.tag === 'path' ? Math.max(...vertices(String(s.attrs.d)).map(([x, y]) => Math.hypot(x - 50, y - 50))) : s.tag === 'rect' ? Math.SQRT2 * (Number(s.attrs.width) / 2) : 10;
      expect(far, shape).toBeCloseTo(reach(shape, 10), 1);
    }
  });
  it('draws links as wide as their weight, merging pairs and dropping loops and strangers', () => {
    const data: NetworkData = {
      ...villageNetwork,
      edges: [...villageNetwork.edges, { source: 'bram', target: 'ada', weight: 8 }, { source: 'ada', target: 'ada', weight: 5 }, { source: 'ada', target: 'nobody', weight: 3 }],
    };
    const svg = network.render(data).svg;
    const links = Array.from(svg.matchAll(/<line [^>]*stroke-width="([\d.]+)"><title>([^<]*)<\/title>/g), (m) => ({ width: Number(m[1]), title: m[2] }));
    expect(links).toHaveLength(villageNetwork.edges.length);
    const heaviest = links.find((l) => l.title.startsWith('Ada Vell \u2013 Bram Osk'))!;
    expect(heaviest.title).toContain(': 50 (');
    expect(heaviest.width).toBe(6);
    // Linear: width 1 + 5 × weight / 50.
    const gil = links.find((l) => l.title.startsWith('Doran Pike \u2013 Gil Tarrow'))!;
    expect(gil.width).toBeCloseTo(1 + (5 * 17) / 50, 1);
  });
  it('leaves light links out of the drawing when asked, not out of the table', () => {
    const out = network.render(villageNetwork, { minWeight: 10 });
    expect(count(out.svg, '<line ')).toBe(villageNetwork.edges.filter((e) => e.weight >= 10).length);
    expect(out.table.rows.find((r) => r[0] === 'Ada Vell')![3]).toBe(5);
  });
});

describe('network: names', () => {
  it('names every node, clear of other names and of nodes', () => {
    const out = network.render(villageNetwork, {}, defaultTheme, [note]);
    for (const svg of [out.svg, out.svgNarrow!]) {
      expect(labelMarks(svg).map((l) => l.text).sort()).toEqual(villageNetwork.nodes.map((n) => n.name).sort());
      expectNoCollisions(svg);
    }
  });
  it('falls back to numbers and a key only where names cannot fit, still without collisions', () => {
    const out = network.render(crowd(30));
    for (const svg of [out.svg, out.svgNarrow!]) {
      expectNoCollisions(svg);
      const labels = labelMarks(svg);
      expect(labels).toHaveLength(30);
      const numbered = labels.filter((l) => /^\d+$/.test(l.text));
      const key = Array.from(svg.matchAll(/<g class="vt-key"[^>]*>(.*?)<\/g>/g), (m) => m[1]).join('');
      for (const l of numbered) expect(key).toContain(`${l.text} ${crowd(30).nodes.find((n) => n.id === l.id)!.name}`);
    }
    // The wide layout has room for most names.
    expect(labelMarks(out.svg).filter((l) => /^\d+$/.test(l.text)).length).toBeLessThan(10);
  });
});

describe('network: alt text, notes and table', () => {
  it('names the most central node and the groups', () => {
    expect(network.render(villageNetwork).alt).toBe(
      'Ada Vell is the most central (Weighted degree 101), linked to 5 of the 9 others. 3 groups: Ada Vell, Bram Osk, Ivo Sedge and Fenna Rook; Essa Quill, Cleo Harrow and Hollis Marr; Doran Pike, Gil Tarrow and Jory Lumm.',
    );
  });
  it('names ties and a single group', () => {
    const flat = { ...villageNetwork, nodes: villageNetwork.nodes.map((n) => ({ ...n, size: 4, community: 7 })) };
    expect(network.render(flat).alt).toBe('Ada Vell, Bram Osk, Cleo Harrow and 7 more are the most central (Weighted degree 4 each). All 10 form one group.');
  });
  it('pins a note to a node by id or by name, and skips the rest', () => {
    const out = network.render(villageNetwork, {}, defaultTheme, [note, { label: '2', text: 'The clerk', at: { category: 'Essa Quill' } }, { label: '3', text: 'x', at: { category: 'nobody' } }]);
    expect(count(out.svg, 'class="vt-note"')).toBe(2);
    expect(out.skippedNotes).toEqual(['3']);
    expect(out.alt).toMatch(/Note 1: Ada keeps the ferry running\. Note 2: The clerk\.$/);
  });
  it('tabulates nodes with size, group and their links', () => {
    const { table } = network.render(villageNetwork);
    expect(table.columns.map((c) => c.label)).toEqual(['Name', 'Group', 'Weighted degree', 'Links', 'Linked to (Paragraphs shared)']);
    // Ada: 42 + 31 + 18 + 8 + 2 = 101, five links.
    expect(table.rows[0]).toEqual(['Ada Vell', 1, 101, 5, 'Bram Osk (42); Ivo Sedge (31); Fenna Rook (18); Cleo Harrow (8); Doran Pike (2)']);
    expect(table.rows).toHaveLength(10);
    expect(titles(network.render(villageNetwork).svg)).toContain('Group 1: Ada Vell, Bram Osk, Ivo Sedge and Fenna Rook');
  });
  it('agrees with the matrix drawn from the same links', () => {
    // The network's table and the matrix of shared paragraphs describe one dataset.
    const m = matrix.render(sharedMatrix).table;
    const adaRow = m.rows.find((r) => r[0] === 'Ada Vell')!;
    const total = (adaRow.slice(1) as number[]).reduce((s, v) => s + v, 0);
    expect(network.render(villageNetwork).table.rows[0][2]).toBe(total);
  });
});

describe('point-label placement', () => {
  it('tests segments, discs and rectangles against each other', () => {
    // common practice, no source: Liang–Barsky clipping; nearest point of a rectangle to a disc's centre.
    const r = boxOf({ x: 0, y: 0, width: 10, height: 10 });
    expect(segmentHitsBox({ x: -5, y: 5 }, { x: 15, y: 5 }, r)).toBe(true);
    expect(segmentHitsBox({ x: -5, y: -1 }, { x: 15, y: -1 }, r)).toBe(false);
    expect(segmentHitsBox({ x: -5, y: 12 }, { x: 12, y: -5 }, r)).toBe(true);
    expect(segmentHitsBox({ x: 2, y: 2 }, { x: 3, y: 3 }, r)).toBe(true);
    expect(discOverlaps({ x: 13, y: 13, r: 4 }, r)).toBe(false); // corner distance √18 ≈ 4.24
    expect(discOverlaps({ x: 13, y: 13, r: 4.5 }, r)).toBe(true);
    expect(overlaps(r, boxOf({ x: 10, y: 0, width: 5, height: 5 }))).toBe(false);
    expect(overlaps(r, boxOf({ x: 10, y: 0, width: 5, height: 5 }), 1)).toBe(true);
  });
  it('takes the first free position, then moves a neighbour to make room', () => {
    const ctx = (): PositionContext => ({ bounds: boxOf({ x: 0, y: 0, width: 100, height: 100 }), discs: [], segments: [], taken: [], gap: 2, pad: 1 });
    const c = ctx();
    expect(placeEightWays({ disc: { x: 50, y: 50, r: 5 }, width: 20, height: 10 }, c)!.pos).toBe('E');
    // At the right edge, the right is out of bounds: the left is next.
    expect(placeEightWays({ disc: { x: 95, y: 20, r: 3 }, width: 20, height: 10 }, ctx())!.pos).toBe('W');
    // A label whose only free position is taken by an earlier label gets it when that label can move.
    const lone = { x: 5, y: 50, r: 3 };
    const other = { x: 75, y: 50, r: 2 };
    const d: PositionContext = { ...ctx(), discs: [lone, other, { x: 20, y: 40, r: 3 }, { x: 20, y: 60, r: 3 }] };
    const placed = placeAllEightWays([{ disc: other, width: 36, height: 8 }, { disc: lone, width: 30, height: 10 }], d);
    expect(placed[1]!.pos).toBe('E');
    expect(placed[0]!.pos).toBe('N');
    expect(overlaps(placed[0]!.box, placed[1]!.box, 1)).toBe(false);
    // Without the repair the first label would have kept its first choice, on the left.
    expect(placeEightWays({ disc: other, width: 36, height: 8 }, { ...ctx(), discs: d.discs })!.pos).toBe('W');
  });
});

describe('network: the two layouts', () => {
  it('normalises to distinct drawings for wide and narrow', () => {
    const out = network.render(villageNetwork);
    expect(normaliseSvg(out.svg)).not.toBe(normaliseSvg(out.svgNarrow!));
  });
});
