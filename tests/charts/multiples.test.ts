import { describe, expect, it } from 'vitest';
import { multiples, multiplesOptions, wideColumns } from '../../pipeline/charts/multiples.ts';
import { contrastRatio, defaultTheme } from '../../pipeline/charts/theme.ts';
import type { BarsData, MultiplesData } from '../../pipeline/charts/types.ts';
import { chaptersMultiples, characterMultiples } from './fixtures-kinds.ts';
import { count, textFills, texts } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';
import { AMP, HOSTILE, commonChecks, expectEmpty, expectEscaped } from './kind-checks.ts';

const t = defaultTheme;

/** x of every panel title, in order. */
function titleXs(svg: string): number[] {
  return Array.from(svg.matchAll(/<text x="([\d.]+)" y="[\d.]+" font-weight="600" class="vt-panel-title">/g), (m) => Number(m[1]));
}

/** Width of the bar whose tooltip names `panel, category`. */
function barWidth(svg: string, panel: string, category: string): number {
  const re = new RegExp(`<title>${panel}, ${category}: [^<]*</title>(?:<text[^>]*>[^<]*</text>)?<rect x="[\\d.]+" y="[\\d.]+" width="([\\d.]+)"`);
  return Number(re.exec(svg)![1]);
}

/** The lines panels: their baseline and the centre of their peak marker. */
function peaks(svg: string): { panel: string; baseline: number; cy: number }[] {
  return Array.from(svg.matchAll(/<g class="vt-panel" data-panel="([^"]+)">([\s\S]*?)(?=<g class="vt-panel"|<text[^>]*class="vt-axis-title")/g), (m) => ({
    panel: m[1],
    baseline: Number(/class="vt-baseline" x1="[\d.]+" x2="[\d.]+" y1="([\d.]+)"/.exec(m[2])![1]),
    cy: Number(/class="vt-peak" cx="[\d.]+" cy="([\d.]+)"/.exec(m[2])![1]),
  }));
}

describe('multiples: shared promises', () => {
  describe('bars panels', () => commonChecks('multiples', chaptersMultiples.title, () => multiples.render(chaptersMultiples, {}, t, [{ label: '1', text: 'The ledger is opened', at: { category: 'chapter-4' } }])));
  describe('lines panels', () => commonChecks('multiples', characterMultiples.title, () => multiples.render(characterMultiples)));
});

describe('multiples: snapshots', () => {
  it('one bars panel per chapter, with a note', () => {
    const out = multiples.render(chaptersMultiples, {}, t, [{ label: '1', text: 'The ledger is opened', at: { category: 'chapter-4' } }]);
    expectSvgSnapshot('multiples-bars', out.svg);
    expectSvgSnapshot('multiples-bars-narrow', out.svgNarrow!);
  });
  it('one lines panel per character', () => {
    const out = multiples.render(characterMultiples);
    expectSvgSnapshot('multiples-lines', out.svg);
    expectSvgSnapshot('multiples-lines-narrow', out.svgNarrow!);
  });
});

describe('multiples: shared scales', () => {
  it('draws bars of every panel on one value scale', () => {
    // common practice, no source: small multiples share their scales so panels compare at a glance.
    const svg = multiples.render(chaptersMultiples).svg;
    // Ada Vell: 30 in chapter I, 34 in V, 12 in VI; Cleo Harrow 25 in II.
    const unit = barWidth(svg, 'I. The Ferry', 'Ada Vell') / 30;
    expect(barWidth(svg, 'V. Lock Gates', 'Ada Vell') / unit).toBeCloseTo(34, 0);
    expect(barWidth(svg, 'VI. Slack Tide', 'Ada Vell') / unit).toBeCloseTo(12, 0);
    expect(barWidth(svg, 'II. High Water', 'Cleo Harrow') / unit).toBeCloseTo(25, 0);
  });

  it('draws lines of every panel on one value scale, each panel as tall as the others', () => {
    for (const svg of [multiples.render(characterMultiples).svg, multiples.render(characterMultiples).svgNarrow!]) {
      const ps = peaks(svg);
      // Peaks: Ada 11, Bram 6, Cleo 8, Doran 12, Essa 10.
      const value: Record<string, number> = { ada: 11, bram: 6, cleo: 8, doran: 12, essa: 10 };
      const per = ps.map((p) => (p.baseline - p.cy) / value[p.panel]);
      for (const k of per) expect(k).toBeCloseTo(per[0], 1);
    }
  });

  it('writes value ticks beside the first column only', () => {
    const out = multiples.render(characterMultiples);
    // 5 panels: 3 columns and 2 rows wide, 2 columns and 3 rows narrow.
    expect(count(out.svg, 'class="vt-ticks"')).toBe(2);
    expect(count(out.svgNarrow!, 'class="vt-ticks"')).toBe(3);
  });

  it('keeps one colour per series id in every panel', () => {
    const part = (id: string, title: string, ids: string[]): MultiplesData['panels'][number] => ({
      id,
      title,
      data: { ...(chaptersMultiples.panels[0].data as BarsData), series: ids.map((s, i) => ({ id: s, name: s === 'p1' ? 'Part One' : 'Part Two', values: [i + 1, 2, 3, 4, 5] })) },
    });
    const data: MultiplesData = { kind: 'multiples', title: 'Two parts', panels: [part('a', 'A', ['p1', 'p2']), part('b', 'B', ['p2', 'p1'])] };
    const svg = multiples.render(data).svg;
    const fillsOf = (panel: string) => Array.from(new RegExp(`data-panel="${panel}">([\\s\\S]*?)(?=<g class="vt-panel"|</g></svg>)`).exec(svg)![1].matchAll(/<rect[^>]*fill="(#[0-9A-F]{6})"/g), (m) => m[1]);
    expect(new Set(fillsOf('a'))).toEqual(new Set([t.series[0].mark, t.series[1].mark]));
    // Panel B lists Part Two first, yet draws it in Part Two's colour.
    expect(fillsOf('b').slice(0, 2)).toEqual([t.series[1].mark, t.series[0].mark]);
    expect(texts(svg)).toEqual(expect.arrayContaining(['Part One', 'Part Two']));
  });
});

describe('multiples: layout', () => {
  it('chooses 2 to 4 columns wide and at most 2 narrow', () => {
    expect([1, 2, 3, 4, 5, 6, 9, 10, 16].map((n) => wideColumns(n, 'auto'))).toEqual([1, 2, 2, 2, 3, 3, 3, 4, 4]);
    expect(wideColumns(3, 4)).toBe(3);
    const out = multiples.render(chaptersMultiples);
    expect(new Set(titleXs(out.svg)).size).toBe(3);
    expect(new Set(titleXs(out.svgNarrow!)).size).toBe(2);
    expect(new Set(titleXs(multiples.render(chaptersMultiples, { columns: 2 }).svg)).size).toBe(2);
  });

  it('writes shared category names once per row, and each panel its own when they differ', () => {
    const shared = multiples.render(chaptersMultiples).svg;
    expect(texts(shared).filter((s) => s === 'Bram Osk')).toHaveLength(2); // two rows of three
    const own: MultiplesData = {
      ...chaptersMultiples,
      panels: chaptersMultiples.panels.slice(0, 3).map((p, i) => ({ ...p, data: { ...(p.data as BarsData), categories: (p.data as BarsData).categories.map((c) => `${c} ${'I'.repeat(i + 1)}`) } })),
    };
    const out = multiples.render(own);
    expect(texts(out.svg)).toEqual(expect.arrayContaining(['Bram Osk I', 'Bram Osk II', 'Bram Osk III']));
    // Panels that each need their names stack in one column on a phone.
    expect(new Set(titleXs(out.svgNarrow!)).size).toBe(1);
  });

  it('sets its text in ink, muted ink or series text colours, all 4.5:1 on paper', () => {
    // Source: WCAG 2.2, SC 1.4.3 Contrast (Minimum): 4.5:1 for text.
    for (const out of [multiples.render(chaptersMultiples), multiples.render(characterMultiples)]) {
      for (const f of textFills(out.svg)) expect(contrastRatio(f, t.paper) >= 4.5 || f === t.paper, f).toBe(true);
    }
  });
});

describe('multiples: alt text and table', () => {
  it('says which panel peaks highest and which lowest', () => {
    // Highest value per chapter: I 30, II 25, III 31, IV 28, V 34, VI 12.
    expect(multiples.render(chaptersMultiples).alt).toBe(
      'Mentions, on one scale across 6 panels: V. Lock Gates peaks highest, with Ada Vell, 34; VI. Slack Tide has the lowest peak, 12.',
    );
    expect(multiples.render(characterMultiples).alt).toBe(
      'Mentions per segment, on one scale across 5 panels: Doran Pike peaks highest, at Segment 5 (words 3801\u20134750), 12; Bram Osk has the lowest peak, 6.',
    );
  });
  it('names ties and appends the notes drawn', () => {
    const tied: MultiplesData = { ...chaptersMultiples, panels: chaptersMultiples.panels.slice(0, 2).map((p) => ({ ...p, data: { ...(p.data as BarsData), series: [{ id: 'm', name: 'M', values: [5, 1, 1, 1, 1] }] } })) };
    expect(multiples.render(tied).alt).toBe('Mentions, on one scale across 2 panels: I. The Ferry and II. High Water peak equally high, 5.');
    const out = multiples.render(chaptersMultiples, {}, t, [
      { label: '1', text: 'The ledger is opened', at: { category: 'chapter-4' } },
      { label: '2', text: 'Nowhere', at: { category: 'chapter-9' } },
      { label: '3', text: 'Twice', at: { category: 'chapter-4' } },
    ]);
    expect(out.alt).toMatch(/ Note 1: The ledger is opened\.$/);
    expect(count(out.svg, 'class="vt-note"')).toBe(1);
    expect(out.skippedNotes).toEqual(['2', '3']);
  });
  it('tabulates every panel, position, series and value', () => {
    const { table } = multiples.render(chaptersMultiples);
    expect(table.columns.map((c) => c.label)).toEqual(['Panel', 'Character', 'Series', 'Mentions']);
    expect(table.rows).toHaveLength(30);
    expect(table.rows[20]).toEqual(['V. Lock Gates', 'Ada Vell', 'Mentions', 34]);
  });
});

describe('multiples: escaping and empty data', () => {
  it('escapes panel titles, categories and series names', () => {
    const data: MultiplesData = {
      kind: 'multiples',
      title: HOSTILE,
      panels: chaptersMultiples.panels.slice(0, 2).map((p, i) => ({
        id: i ? AMP : HOSTILE,
        title: i ? HOSTILE : AMP,
        data: { ...(p.data as BarsData), valueLabel: AMP, categories: [HOSTILE, AMP, 'c', 'd', 'e'], series: [{ id: HOSTILE, name: AMP, values: [1, 2, 3, 4, 5] }] },
      })),
    };
    expectEscaped(multiples.render(data, {}, t, [{ label: '"', text: HOSTILE, at: { category: AMP } }]));
    const lines: MultiplesData = { ...characterMultiples, panels: characterMultiples.panels.map((p) => ({ ...p, title: HOSTILE, data: { ...p.data, ticks: p.data.kind === 'lines' ? p.data.ticks.map(() => AMP) : [] } as typeof p.data })) };
    expectEscaped(multiples.render(lines));
  });
  it('says there is nothing to draw without panels or values', () => {
    expectEmpty(multiples.render({ ...chaptersMultiples, panels: [] }));
    const zeros = { ...chaptersMultiples, panels: chaptersMultiples.panels.map((p) => ({ ...p, data: { ...(p.data as BarsData), series: [{ id: 'm', name: 'M', values: [0, 0, Number.NaN, 0, 0] }] } })) };
    expectEmpty(multiples.render(zeros));
  });
});

describe('multiples: options', () => {
  it('fills the documented defaults and rejects the rest', () => {
    expect(multiplesOptions.parse({})).toEqual({ columns: 'auto', zero: true });
    expect(multiplesOptions.safeParse({ columns: 5 }).success).toBe(false);
    expect(multiplesOptions.safeParse({ columns: 0 }).success).toBe(false);
    expect(multiplesOptions.safeParse({ colour: 'red' }).success).toBe(false);
    expect(() => multiples.render(chaptersMultiples, { width: 3 } as never)).toThrow();
    for (const field of Object.values(multiplesOptions.shape)) expect(field.description).toMatch(/Default: /);
  });
  it('fits the shared lines axis to the data when zero is false', () => {
    const raised: MultiplesData = { ...characterMultiples, panels: characterMultiples.panels.map((p) => ({ ...p, data: { ...p.data, series: p.data.series.map((s) => ({ ...s, values: s.values.map((v) => v + 40) })) } as typeof p.data })) };
    expect(texts(multiples.render(raised).svg)).toContain('0');
    expect(texts(multiples.render(raised, { zero: false }).svg)).not.toContain('0');
  });
});
