import { describe, expect, it } from 'vitest';
import { byProminence, scatter, scatterOptions } from '../../pipeline/charts/scatter.ts';
import { distanceToBox, overlaps, placeInRings, segmentHitsBox } from '../../pipeline/charts/labels.ts';
import type { Box, Disc } from '../../pipeline/charts/labels.ts';
import { contrastRatio, defaultTheme } from '../../pipeline/charts/theme.ts';
import { textWidth } from '../../pipeline/charts/svg.ts';
import type { ScatterData } from '../../pipeline/charts/types.ts';
import { scatterNotes, voicesScatter } from './fixtures-kinds.ts';
import { count, textFills, texts } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';
import { AMP, HOSTILE, commonChecks, expectEmpty, expectEscaped } from './kind-checks.ts';

const t = defaultTheme;

/** The names set beside points. */
function pointLabels(svg: string): string[] {
  const g = /<g class="vt-point-labels"[^>]*>([\s\S]*?)<\/g>/.exec(svg);
  return g ? texts(g[1]) : [];
}

describe('scatter: shared promises', () => {
  commonChecks('scatter', voicesScatter.title, () => scatter.render(voicesScatter, {}, t, scatterNotes));
});

describe('scatter: snapshots', () => {
  it('twelve points in five groups, two notes', () => {
    const out = scatter.render(voicesScatter, {}, t, scatterNotes);
    expectSvgSnapshot('scatter', out.svg);
    expectSvgSnapshot('scatter-narrow', out.svgNarrow!);
  });
});

describe('scatter: axes', () => {
  it('uses the nice ticks of d3-scale on both axes', () => {
    // from memory: d3's ticks(0, 142, 6) step by 20 and nice() rounds the end up to 160;
    // ticks(0.01, 0.31, 5) step by 0.05 and nice() gives 0 … 0.35.
    const tx = texts(/<g class="vt-x-ticks"[^>]*>([\s\S]*?)<\/g>/.exec(scatter.render(voicesScatter).svg)![1]);
    expect(tx).toEqual(['0', '20', '40', '60', '80', '100', '120', '140', '160']);
    const ty = texts(/<g class="vt-ticks"[^>]*>([\s\S]*?)<\/g>/.exec(scatter.render(voicesScatter).svg)![1]);
    expect(ty).toEqual(['0.00', '0.05', '0.10', '0.15', '0.20', '0.25', '0.30', '0.35']);
  });
  it('fits the axes to the data, or reaches zero when asked', () => {
    const far: ScatterData = { ...voicesScatter, points: voicesScatter.points.map((p) => ({ ...p, x: p.x + 500, y: p.y + 2 })) };
    const tx = (svg: string) => texts(/<g class="vt-x-ticks"[^>]*>([\s\S]*?)<\/g>/.exec(svg)![1]);
    expect(tx(scatter.render(far).svg)[0]).not.toBe('0');
    expect(tx(scatter.render(far, { zero: true }).svg)[0]).toBe('0');
  });
});

describe('scatter: groups and names', () => {
  it('gives each group a palette colour and a shape, in order of first appearance, with a legend', () => {
    const svg = scatter.render(voicesScatter).svg;
    const legend = /<g class="vt-legend">([\s\S]*?)<\/g><text/.exec(svg)![1];
    expect(texts(legend)).toEqual(['Ferry house', 'Lock', 'School', 'Market', 'Chapel']);
    const shapes = Array.from(legend.matchAll(/<(circle|rect|path)\b[^>]*fill="(#[0-9A-F]{6})"/g), (m) => `${m[1]} ${m[2]}`);
    expect(shapes).toEqual([
      `circle ${t.series[0].mark}`,
      `rect ${t.series[1].mark}`,
      `path ${t.series[2].mark}`,
      `path ${t.series[3].mark}`,
      `path ${t.series[4].mark}`,
    ]);
    const one = scatter.render({ ...voicesScatter, points: voicesScatter.points.map(({ group: _g, ...p }) => p) });
    expect(one.svg).not.toContain('class="vt-legend"');
    expect(one.table.columns.map((c) => c.key)).toEqual(['label', 'x', 'y']);
  });

  it('names points in group text colours that reach 4.5:1 on paper', () => {
    // Source: WCAG 2.2, SC 1.4.3 Contrast (Minimum): 4.5:1 for text.
    const out = scatter.render(voicesScatter, {}, t, scatterNotes);
    for (const svg of [out.svg, out.svgNarrow!]) {
      for (const f of textFills(svg)) expect(contrastRatio(f, t.paper) >= 4.5 || f === t.paper, f).toBe(true);
    }
    expect(out.svg).toContain(`fill="${t.series[0].text}">Ada Vell</text>`);
  });

  it('names every point it can, none when asked, and the extremes first', () => {
    const all = pointLabels(scatter.render(voicesScatter).svg);
    const ext = pointLabels(scatter.render(voicesScatter, { labels: 'extremes' }).svg);
    expect(pointLabels(scatter.render(voicesScatter, { labels: 'none' }).svg)).toEqual([]);
    expect(all.length).toBeGreaterThan(ext.length);
    expect(ext.length).toBeLessThanOrEqual(7);
    // Highest and lowest on each axis: Ada Vell (142, 0.31), Tilly Marsh (9, 0.01).
    expect(ext).toEqual(expect.arrayContaining(['Ada Vell', 'Tilly Marsh']));
    expect(all).toEqual(expect.arrayContaining(['Ada Vell', 'Cleo Harrow', 'Doran Pike', 'Essa Quill']));
  });

  it('keeps names apart from each other and off the points', () => {
    for (const svg of [scatter.render(voicesScatter).svg, scatter.render(voicesScatter).svgNarrow!]) {
      const g = /<g class="vt-point-labels" font-size="13">([\s\S]*?)<\/g>/.exec(svg)![1];
      const boxes: Box[] = Array.from(g.matchAll(/<text x="([\d.]+)" y="([\d.]+)"(?: text-anchor="(middle|end)")?[^>]*>([^<]*)<\/text>/g), (m) => {
        const w = textWidth(m[4], 13);
        const x = Number(m[1]);
        const x0 = m[3] === 'middle' ? x - w / 2 : m[3] === 'end' ? x - w : x;
        return { x0, x1: x0 + w, y0: Number(m[2]) - 13 * 0.85, y1: Number(m[2]) - 13 * 0.85 + 15 };
      });
      expect(boxes.length).toBeGreaterThan(3);
      for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) expect(overlaps(boxes[i], boxes[j])).toBe(false);
      const points = Array.from(svg.matchAll(/<circle cx="([\d.]+)" cy="([\d.]+)" r="([\d.]+)" fill="#[0-9A-F]{6}"><title>/g), (m) => ({ x: Number(m[1]), y: Number(m[2]), r: Number(m[3]) }));
      expect(points.length).toBeGreaterThan(0);
      for (const b of boxes) for (const p of points) expect(distanceToBox(p.x, p.y, b)).toBeGreaterThanOrEqual(p.r);
    }
  });

  it('orders points by how far they stand out', () => {
    const pts = [{ x: 5, y: 5 }, { x: 0, y: 4 }, { x: 10, y: 6 }, { x: 5, y: 0 }, { x: 5, y: 10 }, { x: 6, y: 5 }];
    // Highest y (4), highest x (2), lowest y (3), lowest x (1), then by distance from the median point.
    expect(byProminence(pts)).toEqual([4, 2, 3, 1, 5, 0]);
  });
});

describe('placeInRings', () => {
  const bounds: Box = { x0: 0, y0: 0, x1: 400, y1: 300 };
  const disc = (x: number, y: number): Disc => ({ x, y, r: 5 });

  it('sets a lone name to the right of its point', () => {
    // common practice, no source: the right of a point is the first choice in cartographic point labelling.
    const d = disc(100, 100);
    const [p] = placeInRings([{ point: d, width: 50, height: 15 }], [0], [d], bounds);
    expect(p!.anchor).toBe('start');
    expect(p!.box.x0).toBeGreaterThan(105);
    expect((p!.box.y0 + p!.box.y1) / 2).toBe(100);
    expect(p!.leaderTo).toBeUndefined();
  });

  it('moves to the left at the right edge, and keeps off names placed before', () => {
    const a = disc(380, 100);
    const [p] = placeInRings([{ point: a, width: 50, height: 15 }], [0], [a], bounds);
    expect(p!.anchor).toBe('end');
    const b = disc(100, 100);
    const c = disc(100, 118);
    const out = placeInRings([{ point: b, width: 50, height: 15 }, { point: c, width: 50, height: 15 }], [0, 1], [b, c], bounds, { near: 0 });
    expect(out.every((o) => o !== null)).toBe(true);
    expect(overlaps(out[0]!.box, out[1]!.box)).toBe(false);
  });

  it('does not set a name beside a point it could be taken for, and joins a distant name with a leader', () => {
    const own = disc(100, 100);
    const other = disc(170, 100);
    const [p] = placeInRings([{ point: own, width: 50, height: 15 }], [0], [own, other], bounds);
    // Right would end 12 units from the other point: the name goes to the left instead.
    expect(p!.anchor).toBe('end');
    // Neighbours right, left, above and below: the name goes out along a diagonal, with a leader.
    const cross = [disc(200, 200), disc(220, 200), disc(180, 200), disc(200, 220), disc(200, 180)];
    const [q] = placeInRings([{ point: cross[0], width: 40, height: 15 }], [0], cross, bounds);
    expect(q).not.toBeNull();
    expect(q!.leaderTo).toBeDefined();
    for (const d of cross.slice(1)) expect(distanceToBox(d.x, d.y, q!.box)).toBeGreaterThan(d.r);
    // Closed in on all eight sides, even the leaders would cross a point: no name.
    const ring = [...cross, disc(215, 185), disc(185, 185), disc(215, 215), disc(185, 215)];
    expect(placeInRings([{ point: ring[0], width: 40, height: 15 }], [0], ring, bounds)).toEqual([null]);
  });

  it('leaves a name out when no spot is free, and names only the points in the order', () => {
    const tight: Box = { x0: 90, y0: 90, x1: 130, y1: 110 };
    const d = disc(100, 100);
    expect(placeInRings([{ point: d, width: 80, height: 15 }], [0], [d], tight)).toEqual([null]);
    expect(placeInRings([{ point: d, width: 10, height: 15 }], [], [d], bounds)).toEqual([null]);
  });

  it('finds segments that cross boxes', () => {
    const box: Box = { x0: 10, y0: 10, x1: 20, y1: 20 };
    expect(segmentHitsBox({ x: 0, y: 15 }, { x: 30, y: 15 }, box)).toBe(true);
    expect(segmentHitsBox({ x: 0, y: 0 }, { x: 30, y: 5 }, box)).toBe(false);
    expect(segmentHitsBox({ x: 15, y: 15 }, { x: 16, y: 16 }, box)).toBe(true);
  });
});

describe('scatter: alt text, table and notes', () => {
  it('states the extremes on both axes', () => {
    expect(scatter.render(voicesScatter).alt).toBe(
      '12 points in 5 groups. Mentions: highest Ada Vell (142), lowest Tilly Marsh (9). Share of dialogue: highest Ada Vell (0.31), lowest Tilly Marsh (0.01).',
    );
  });
  it('names ties and says when points lack a value', () => {
    const data: ScatterData = { ...voicesScatter, points: [...voicesScatter.points, { id: 'x', label: 'Nobody', x: Number.NaN, y: 1 }, { id: 'z', label: 'Zed', x: 142, y: 0.2 }] };
    const out = scatter.render(data);
    expect(out.alt).toContain('Mentions: highest Ada Vell and Zed (142)');
    expect(out.alt).toContain('1 point lacks a value and is left out.');
    expect(out.table.rows.at(-2)).toEqual(['Nobody', '', null, 1]);
  });
  it('tabulates every point with its group', () => {
    const { table } = scatter.render(voicesScatter);
    expect(table.columns.map((c) => c.label)).toEqual(['Point', 'Group', 'Mentions', 'Share of dialogue']);
    expect(table.rows[0]).toEqual(['Ada Vell', 'Ferry house', 142, 0.31]);
  });
  it('pins notes to points by id or by label, and skips the rest', () => {
    const out = scatter.render(voicesScatter, {}, t, [...scatterNotes, { label: '3', text: 'Nobody', at: { category: 'nobody' } }, { label: '4', text: 'No point', at: { x: 3 } }]);
    expect(count(out.svg, 'class="vt-note"')).toBe(2);
    expect(out.skippedNotes).toEqual(['3', '4']);
    expect(out.alt).toMatch(/ Note 1: Bram keeps the lock but hardly speaks\. Note 2: Essa reads the ledger aloud in chapter five\.$/);
  });
});

describe('scatter: escaping and empty data', () => {
  it('escapes labels, groups and axis titles', () => {
    const data: ScatterData = {
      ...voicesScatter,
      title: HOSTILE,
      xLabel: AMP,
      yLabel: HOSTILE,
      points: voicesScatter.points.map((p, i) => ({ ...p, id: i ? p.id : HOSTILE, label: i % 2 ? HOSTILE : AMP, group: i % 3 ? AMP : HOSTILE })),
    };
    expectEscaped(scatter.render(data, {}, t, [{ label: '<', text: AMP, at: { category: HOSTILE } }]));
  });
  it('says there is nothing to draw without points', () => {
    expectEmpty(scatter.render({ ...voicesScatter, points: [] }));
    const out = scatter.render({ ...voicesScatter, points: [{ id: 'a', label: 'A', x: Number.NaN, y: 2 }] });
    expectEmpty(out);
    expect(out.alt).toBe('No data to draw: no point has both of its values.');
  });
});

describe('scatter: options', () => {
  it('fills the documented defaults and rejects the rest', () => {
    expect(scatterOptions.parse({})).toEqual({ labels: 'all', zero: false });
    expect(scatterOptions.safeParse({ labels: 'some' }).success).toBe(false);
    expect(scatterOptions.safeParse({ colour: 'red' }).success).toBe(false);
    expect(() => scatter.render(voicesScatter, { width: 3 } as never)).toThrow();
    for (const field of Object.values(scatterOptions.shape)) expect(field.description).toMatch(/Default: /);
  });
});
