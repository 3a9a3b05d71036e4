import { describe, expect, it } from 'vitest';
import { treemap, treemapOptions } from '../../pipeline/charts/treemap.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import type { TreemapData } from '../../pipeline/charts/types.ts';
import { spokenTreemap } from './fixtures-structure.ts';
import { count, texts, titles, unescapeXml } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';
import { AMP, HOSTILE, checkDeterminism, checkEmpty, checkEscaping, checkOptions, checkRoot, checkType, expectReadable } from './kind-checks.ts';

const flat: TreemapData = { ...spokenTreemap, title: 'Who speaks most', items: spokenTreemap.items.map(({ group: _group, ...i }) => i) };
const smallNote = { label: '1', text: 'Jory barely speaks', at: { category: 'jory' } };
const bigNote = { label: '2', text: 'Ada speaks for the ferry', at: { category: 'Ada Vell' } };

interface CellMark {
  item: string;
  fill: string;
  x: number;
  y: number;
  width: number;
  height: number;
  /** Texts written inside, in order. */
  texts: string[];
}

/** Item rectangles as drawn. */
function cells(svg: string): CellMark[] {
  return Array.from(svg.matchAll(/<g class="vt-cell" data-item="([^"]*)">(.*?)<\/g>(?=<g class="vt-cell"|<\/g>)/g), (m) => {
    const rect = /<rect x="([\d.]+)" y="([\d.]+)" width="([\d.]+)" height="([\d.]+)" fill="(#[0-9A-F]{6})"/.exec(m[2])!;
    return {
      item: unescapeXml(m[1]),
      fill: rect[5],
      x: Number(rect[1]),
      y: Number(rect[2]),
      width: Number(rect[3]),
      height: Number(rect[4]),
      texts: texts(m[2].replace(/<g class="vt-note".*$/, '')),
    };
  });
}

const area = (c: CellMark) => c.width * c.height;

describe('treemap: snapshots', () => {
  it('ten speakers in three parts of the village, with two notes', () => {
    const out = treemap.render(spokenTreemap, {}, defaultTheme, [smallNote, bigNote]);
    expectSvgSnapshot('treemap', out.svg);
    expectSvgSnapshot('treemap-narrow', out.svgNarrow!);
  });
  it('ungrouped', () => {
    expectSvgSnapshot('treemap-flat', treemap.render(flat).svg);
  });
});

describe('treemap: what every chart promises', () => {
  const render = () => treemap.render(spokenTreemap, {}, defaultTheme, [smallNote, bigNote]);
  checkRoot('treemap', spokenTreemap.title, render);
  checkDeterminism(render, () => treemap.render(flat));
  checkType(render);
  checkType(() => treemap.render(flat));
  checkEscaping(() => [
    treemap.render(
      {
        ...spokenTreemap,
        title: `${HOSTILE} ${AMP}`,
        valueLabel: HOSTILE,
        items: spokenTreemap.items.map((i, k) => ({ ...i, id: k === 0 ? HOSTILE : i.id, label: k % 2 ? HOSTILE : AMP, group: k % 3 ? AMP : HOSTILE })),
      },
      { limit: 5 },
      defaultTheme,
      [{ label: '&', text: HOSTILE, at: { category: HOSTILE } }],
    ),
  ]);
  checkEmpty([
    ['no items', () => treemap.render({ ...spokenTreemap, items: [] })],
    ['no positive value', () => treemap.render({ ...spokenTreemap, items: spokenTreemap.items.map((i, k) => ({ ...i, value: k % 2 ? 0 : Number.NaN })) })],
  ]);
  checkOptions(treemapOptions, (o) => treemap.render(spokenTreemap, o), { values: true, limit: 60 });
});

describe('treemap: areas and labels', () => {
  it('draws areas in proportion to the values', () => {
    // Source: the definition of a treemap (Shneiderman 1992): area proportional to value. The gaps
    // between rectangles take a little, so the check allows 10%.
    const check = (cs: CellMark[], ids: string[], base: string) => {
      const ref = cs.find((c) => c.item === base)!;
      const value = (id: string) => spokenTreemap.items.find((i) => i.id === id)!.value;
      const big = cs.filter((c) => ids.includes(c.item) && c.item !== base && area(c) > 3000);
      expect(big.length).toBeGreaterThan(1);
      for (const c of big) expect(Math.abs(area(c) / area(ref) / (value(c.item) / value(base)) - 1), c.item).toBeLessThan(0.1);
    };
    const all = spokenTreemap.items.map((i) => i.id);
    check(cells(treemap.render(flat).svg), all, 'ada');
    check(cells(treemap.render(flat).svgNarrow!), all, 'ada');
    // Grouped: within a group (the group's band takes its share of the group's area).
    for (const svg of [treemap.render(spokenTreemap).svg, treemap.render(spokenTreemap).svgNarrow!]) check(cells(svg), ['ada', 'bram', 'ivo', 'fenna'], 'ada');
  });
  it('keeps the items of a group together inside its outline', () => {
    const svg = treemap.render(spokenTreemap).svg;
    const groups = Array.from(svg.matchAll(/<g class="vt-group" data-group="([^"]*)"><title>[^<]*<\/title><rect x="([\d.]+)" y="([\d.]+)" width="([\d.]+)" height="([\d.]+)"/g), (m) => ({
      name: m[1],
      x0: Number(m[2]),
      y0: Number(m[3]),
      x1: Number(m[2]) + Number(m[4]),
      y1: Number(m[3]) + Number(m[5]),
    }));
    expect(groups.map((g) => g.name)).toEqual(['Ferry side', 'Village green', 'Eel market']);
    for (const c of cells(svg)) {
      const g = groups.find((x) => x.name === spokenTreemap.items.find((i) => i.id === c.item)!.group)!;
      expect(c.x).toBeGreaterThanOrEqual(g.x0);
      expect(c.y).toBeGreaterThan(g.y0 + 14); // under the band with the group's name
      expect(c.x + c.width).toBeLessThanOrEqual(g.x1 + 0.01);
      expect(c.y + c.height).toBeLessThanOrEqual(g.y1 + 0.01);
    }
    expect(texts(svg)).toContain('Ferry side \u00B7 4,845');
  });
  it('labels only rectangles that hold the name and the value, and says how many go without', () => {
    const svg = treemap.render(spokenTreemap).svg;
    const cs = cells(svg);
    expect(cs.find((c) => c.item === 'ada')!.texts).toEqual(['Ada Vell', '2,310 (22%)']);
    expect(cs.find((c) => c.item === 'jory')!.texts).toEqual([]);
    expect(titles(svg)).toContain('Jory Lumm: 95 (0.9%)');
    expect(texts(svg)).toContain('Area: Words spoken. One rectangle is too small for its label; the table lists it.');
    expect(cs.filter((c) => c.texts.length > 0).every((c) => c.texts.length >= 2)).toBe(true);
    expect(cells(treemap.render(spokenTreemap, { values: false }).svg).find((c) => c.item === 'ada')!.texts).toEqual(['Ada Vell']);
  });
  it('sets every text in a colour that reads on its tint', () => {
    const out = treemap.render(spokenTreemap);
    const itemFills = new Set(cells(out.svg).map((c) => c.fill));
    const groupFills = new Set(Array.from(out.svg.matchAll(/<g class="vt-group"[^>]*><title>[^<]*<\/title><rect [^>]*fill="(#[0-9A-F]{6})"/g), (m) => m[1]));
    expect(itemFills.size).toBe(3);
    expect(groupFills.size).toBe(3);
    expectReadable([
      ...[...itemFills].flatMap((f) => [[defaultTheme.ink, f], [defaultTheme.inkMuted, f]] as [string, string][]),
      ...[...groupFills].map((f) => [defaultTheme.ink, f] as [string, string]),
    ]);
  });
  it('draws the smallest items of each group together beyond the limit, and keeps them all in the table', () => {
    const out = treemap.render(spokenTreemap, { limit: 4 }, defaultTheme, [smallNote]);
    const cs = cells(out.svg);
    expect(cs.map((c) => c.item).sort()).toEqual(['ada', 'bram', 'cleo', 'doran', 'more:Eel market', 'more:Ferry side', 'more:Village green'].sort());
    expect(titles(out.svg)).toContain('2 more: Gil Tarrow, Jory Lumm \u2014 475 together (4.6%)');
    expect(out.table.rows).toHaveLength(10);
    // The note on Jory points at the rectangle that holds him.
    expect(out.skippedNotes).toEqual([]);
  });
  it('leaves out items without a positive value but lists them', () => {
    const data = { ...flat, items: [...flat.items, { id: 'x', label: 'The heron', value: 0 }, { id: 'y', label: 'The weir', value: Number.NaN }] };
    const out = treemap.render(data);
    expect(cells(out.svg)).toHaveLength(10);
    expect(out.table.rows.slice(-2)).toEqual([
      ['The heron', 0, null],
      ['The weir', null, null],
    ]);
  });
});

describe('treemap: alt text, notes and table', () => {
  it('names the largest item and its share, and the largest group', () => {
    // 2,310 of 10,367 = 22.3%; Ferry side 2,310 + 1,480 + 640 + 415 = 4,845 = 46.7%.
    expect(treemap.render(spokenTreemap).alt).toBe('Words spoken: Ada Vell is the largest, 2,310 (22% of 10,367). The largest group is Ferry side, 4,845 (47%).');
    expect(treemap.render(flat).alt).toBe('Words spoken: Ada Vell is the largest, 2,310 (22% of 10,367).');
  });
  it('names ties', () => {
    // 10,367 − 1,975 + 2,310 = 10,702; 2,310 / 10,702 = 21.6%.
    const tied = { ...flat, items: flat.items.map((i) => (i.id === 'cleo' ? { ...i, value: 2310 } : i)) };
    expect(treemap.render(tied).alt).toBe('Words spoken: Ada Vell and Cleo Harrow are the largest, 2,310 each (22% of 10,702 each).');
  });
  it('pins notes inside a rectangle with room, above the chart otherwise, and skips unknown items', () => {
    const out = treemap.render(spokenTreemap, {}, defaultTheme, [smallNote, bigNote, { label: '3', text: 'x', at: { category: 'nobody' } }]);
    expect(count(out.svg, 'class="vt-note"')).toBe(2);
    expect(count(out.svg, 'class="vt-notes"')).toBe(1); // the lane, for Jory's small rectangle
    expect(cells(out.svg).find((c) => c.item === 'ada')!.texts).toEqual(['Ada Vell', '2,310 (22%)']);
    expect(out.skippedNotes).toEqual(['3']);
    expect(out.alt).toMatch(/Note 1: Jory barely speaks\. Note 2: Ada speaks for the ferry\.$/);
  });
  it('tabulates every item, largest first, with group and share', () => {
    const { table } = treemap.render(spokenTreemap);
    expect(table.columns.map((c) => c.label)).toEqual(['Item', 'Group', 'Words spoken', 'Share of the total (%)']);
    expect(table.rows[0]).toEqual(['Ada Vell', 'Ferry side', 2310, 22.3]);
    expect(table.rows[9]).toEqual(['Jory Lumm', 'Eel market', 95, 0.9]);
    expect(treemap.render(flat).table.columns.map((c) => c.key)).toEqual(['item', 'value', 'share']);
  });
});
