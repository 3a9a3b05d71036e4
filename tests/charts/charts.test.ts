/**
 * What every chart kind promises: the root structure, deterministic bytes,
 * escaping, legible sizes, an empty state, strict documented options and a
 * registry keyed by name.
 */
import { describe, expect, it } from 'vitest';
import { charts } from '../../pipeline/charts/index.ts';
import type { ChartOutput } from '../../pipeline/charts/types.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import { arcLines, mentionsBars, mentionsByPartBars, notes, presenceStrip, stripNotes } from './fixtures.ts';
import { texts, titles } from './inspect.ts';
import { AMP, HOSTILE, checkDeterminism, checkEmpty, checkEscaping, checkRoot, checkType } from './kind-checks.ts';

const cases: { kind: 'bars' | 'lines' | 'strip'; title: string; render: () => ChartOutput }[] = [
  { kind: 'bars', title: mentionsBars.title, render: () => charts.bars.render(mentionsBars, {}, defaultTheme, notes) },
  { kind: 'bars', title: mentionsByPartBars.title, render: () => charts.bars.render(mentionsByPartBars, { orientation: 'vertical', layout: 'stacked' }, defaultTheme, notes) },
  { kind: 'lines', title: arcLines.title, render: () => charts.lines.render(arcLines, {}, defaultTheme, notes) },
  { kind: 'strip', title: presenceStrip.title, render: () => charts.strip.render(presenceStrip, {}, defaultTheme, stripNotes) },
];

describe('every chart kind', () => {
  it('is registered under its name', () => {
    expect(Object.keys(charts).sort()).toEqual(
      ['bars', 'kwic', 'lines', 'matrix', 'multiples', 'network', 'scatter', 'strip', 'textmap', 'tree', 'treemap'],
    );
    for (const [name, chart] of Object.entries(charts)) expect(chart.name).toBe(name);
  });

  for (const c of cases) {
    describe(`${c.kind}: ${c.title}`, () => {
      checkRoot(c.kind, c.title, c.render);
      checkDeterminism(c.render, () => charts.bars.render(mentionsBars)); // unrelated work in between
      checkType(c.render);
    });
  }

  it('uses the given id for both layouts', () => {
    const out = charts.lines.render(arcLines, { id: 'arc' });
    expect(out.svg).toContain('aria-labelledby="arc-title arc-desc"');
    expect(out.svgNarrow).toContain('aria-labelledby="arc-n-title arc-n-desc"');
  });

  it('derives different ids from different inputs', () => {
    const a = charts.bars.render(mentionsBars);
    const b = charts.bars.render({ ...mentionsBars, title: 'Another title' });
    const id = (svg: string) => /<title id="([^"]+)"/.exec(svg)![1];
    expect(id(a.svg)).not.toBe(id(b.svg));
  });
});

describe('escaping', () => {
  const hostile = [
    charts.bars.render({
      ...mentionsBars,
      title: `${HOSTILE} ${AMP}`,
      categoryLabel: AMP,
      valueLabel: HOSTILE,
      categories: [HOSTILE, AMP, "O'Hare", 'plain'],
      series: [{ id: HOSTILE, name: AMP, values: [3, 2, 1, 4] }],
    }),
    charts.bars.render(
      { ...mentionsByPartBars, categories: [HOSTILE, AMP, 'c', 'd'], series: mentionsByPartBars.series.map((s) => ({ ...s, name: `${s.name} ${HOSTILE}` })) },
      { orientation: 'vertical', id: 'hostile-v' },
      defaultTheme,
      [{ label: '<1>', text: HOSTILE, at: { category: AMP } }],
    ),
    charts.lines.render(
      { ...arcLines, title: HOSTILE, xLabel: AMP, yLabel: HOSTILE, points: arcLines.points.map(() => HOSTILE), ticks: arcLines.ticks.map(() => AMP), series: arcLines.series.map((s) => ({ ...s, id: HOSTILE, name: AMP })) },
      {},
      defaultTheme,
      [{ label: '&', text: AMP, at: { x: 1 } }],
    ),
    charts.strip.render(
      { ...presenceStrip, title: AMP, rows: presenceStrip.rows.map((r) => ({ ...r, id: AMP, name: HOSTILE })), boundaries: presenceStrip.boundaries.map((b) => ({ ...b, label: AMP, title: HOSTILE })) },
      {},
      defaultTheme,
      [{ label: '"', text: HOSTILE, at: { x: 0.5 } }],
    ),
  ];

  checkEscaping(() => hostile);

  it('shows the original characters once parsed', () => {
    const out = hostile[0];
    expect(texts(out.svg)).toContain(HOSTILE);
    expect(texts(out.svg)).toContain(AMP);
    expect(titles(out.svg)[0]).toBe(`${HOSTILE} ${AMP}`);
    expect(out.alt).toContain(HOSTILE); // alt is plain text; the page escapes it where it is used
  });
});

describe('empty data', () => {
  const empties: [string, () => ChartOutput][] = [
    ['bars without categories', () => charts.bars.render({ ...mentionsBars, categories: [], series: [{ id: 'x', name: 'X', values: [] }] })],
    ['bars without series', () => charts.bars.render({ ...mentionsBars, series: [] })],
    ['bars of zeros', () => charts.bars.render({ ...mentionsBars, series: [{ id: 'x', name: 'X', values: [0, 0, 0, 0, 0] }] })],
    ['lines without positions', () => charts.lines.render({ ...arcLines, points: [], ticks: [], series: arcLines.series.map((s) => ({ ...s, values: [] })) })],
    ['lines without series', () => charts.lines.render({ ...arcLines, series: [] })],
    ['lines of zeros and gaps', () => charts.lines.render({ ...arcLines, series: [{ id: 'x', name: 'X', values: [0, Number.NaN, 0, 0, 0, 0] }] })],
    ['strip without rows', () => charts.strip.render({ ...presenceStrip, rows: [] })],
    ['strip without occurrences', () => charts.strip.render({ ...presenceStrip, rows: presenceStrip.rows.map((r) => ({ ...r, positions: [] })) })],
  ];
  checkEmpty(empties);
});

describe('options', () => {
  for (const chart of Object.values(charts)) {
    it(`${chart.name}: rejects unknown keys`, () => {
      expect(chart.options.safeParse({ colour: 'red' }).success).toBe(false);
      expect(() => chart.render({} as never, { colour: 'red' } as never)).toThrow();
    });
    it(`${chart.name}: documents every option with its default and fills defaults`, () => {
      const shape = (chart.options as unknown as { shape: Record<string, { description?: string }> }).shape;
      expect(Object.keys(shape).length).toBeGreaterThan(1);
      for (const [key, field] of Object.entries(shape)) expect(field.description ?? '', key).toMatch(/Default: /);
      const parsed = chart.options.parse({}) as Record<string, unknown>;
      for (const key of Object.keys(shape)) if (key !== 'id') expect(parsed[key], key).not.toBeUndefined();
    });
  }
  it('rejects ids that could not be XML ids', () => {
    expect(charts.bars.options.safeParse({ id: '1abc' }).success).toBe(false);
    expect(charts.bars.options.safeParse({ id: 'a b' }).success).toBe(false);
    expect(charts.bars.options.safeParse({ id: 'panel-3' }).success).toBe(true);
  });
});
