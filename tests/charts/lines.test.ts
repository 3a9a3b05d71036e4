import { describe, expect, it } from 'vitest';
import { lines, linesOptions } from '../../pipeline/charts/lines.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import { arcLines, notes } from './fixtures.ts';
import { count, texts } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';

/** The y of each direct label at the line ends, by name. */
function endLabelYs(svg: string): Record<string, number> {
  const group = /<g class="vt-end-labels"[^>]*>([\s\S]*?)<\/g>/.exec(svg)![1];
  return Object.fromEntries(Array.from(group.matchAll(/<text x="[\d.]+" y="([\d.]+)"[^>]*>([^<]*)<\/text>/g), (m) => [m[2], Number(m[1])]));
}

describe('lines: snapshots', () => {
  it('three series with two notes', () => {
    const out = lines.render(arcLines, {}, defaultTheme, notes);
    expectSvgSnapshot('lines', out.svg);
    expectSvgSnapshot('lines-narrow', out.svgNarrow!);
  });
  it('one series as an area, without markers', () => {
    expectSvgSnapshot('lines-area', lines.render({ ...arcLines, series: arcLines.series.slice(0, 1) }, { area: true, markers: false }).svg);
  });
});

describe('lines: alt text', () => {
  it('says where each series peaks, highest first', () => {
    expect(lines.render(arcLines).alt).toBe(
      'Mentions: Ada Vell peaks at Chapter 5: Lock Gates, 34; Cleo Harrow at Chapter 2: High Water, 25; Bram Osk at Chapter 5: Lock Gates, 4.',
    );
  });
  it('gives the peak and the low of a single series', () => {
    expect(lines.render({ ...arcLines, series: [arcLines.series[2]] }).alt).toBe(
      'Mentions: Cleo Harrow peaks at Chapter 2: High Water, 25, and is lowest at Chapter 1: The Ferry, 10.',
    );
  });
  it('formats shares as percentages', () => {
    const { alt } = lines.render({ ...arcLines, format: 'share', yLabel: 'Share of dialogue', series: [{ id: 'd', name: 'Dialogue', values: [0.12, 0.2, 0.35, 0.31, 0.08, 0.15] }] });
    expect(alt).toBe('Share of dialogue: Dialogue peaks at Chapter 3: The Eel Market, 35%, and is lowest at Chapter 5: Lock Gates, 8%.');
  });
  it('appends the notes that were drawn', () => {
    expect(lines.render(arcLines, {}, defaultTheme, notes).alt).toMatch(/ Note 1: Ada takes the night ferry alone\. Note 2: The lock gates fail & the lower fields flood\.$/);
  });
});

describe('lines: drawing', () => {
  it('draws one path per series and a marker per point', () => {
    const out = lines.render(arcLines);
    expect(count(out.svg, 'class="vt-line"')).toBe(3);
    expect(count(out.svg, '<circle')).toBe(6); // series 1: circles
    expect(count(out.svg, '<rect') - 1).toBe(6); // series 2: squares (less the paper)
  });
  it('breaks a line at missing values', () => {
    const out = lines.render({ ...arcLines, series: [{ id: 'a', name: 'Ada', values: [1, 2, Number.NaN, 4, 5, 6] }] });
    expect(count(out.svg, 'class="vt-line"')).toBe(2);
  });
  it('leaves markers out when positions are crowded', () => {
    const n = 80;
    const data = { ...arcLines, points: Array.from({ length: n }, (_, i) => `Segment ${i + 1}`), ticks: Array.from({ length: n }, (_, i) => String(i + 1)), series: [{ id: 'a', name: 'Ada', values: Array.from({ length: n }, (_, i) => i % 7) }] };
    const out = lines.render(data);
    expect(count(out.svg, '<circle')).toBe(0);
    // Tick labels thinned: fewer than the positions, evenly spaced, starting at the first.
    const tickTexts = Array.from(/<g class="vt-x-ticks"[^>]*>([\s\S]*?)<\/g>/.exec(out.svg)![1].matchAll(/>(\d+)<\/text>/g), (m) => Number(m[1]));
    expect(tickTexts.length).toBeLessThan(n);
    expect(tickTexts[0]).toBe(1);
    const step = tickTexts[1] - tickTexts[0];
    expect(step).toBeGreaterThan(1);
    tickTexts.forEach((t, i) => expect(t).toBe(1 + i * step));
  });
  it('nudges end labels apart when lines end together', () => {
    const data = { ...arcLines, series: [
      { id: 'a', name: 'Ada', values: [1, 2, 3, 4, 5, 10] },
      { id: 'b', name: 'Bram', values: [5, 4, 3, 2, 1, 10] },
      { id: 'c', name: 'Cleo', values: [3, 3, 3, 3, 3, 10] },
    ] };
    const ys = endLabelYs(lines.render(data).svg);
    const sorted = Object.values(ys).sort((p, q) => p - q);
    expect(sorted).toHaveLength(3);
    for (let i = 1; i < sorted.length; i++) expect(sorted[i] - sorted[i - 1]).toBeGreaterThanOrEqual(defaultTheme.sizes.label * 1.2 - 0.01);
    // The middle label stays at the shared end, the others move symmetrically around it.
    expect(sorted[1] - sorted[0]).toBeCloseTo(sorted[2] - sorted[1], 1);
  });
  it('labels each line in its own text colour', () => {
    const out = lines.render(arcLines);
    expect(out.svg).toContain(`fill="${defaultTheme.series[1].text}">Bram Osk</text>`);
  });
  it('uses the y axis ticks of d3-scale, formatted', () => {
    // 0..34 with 5 ticks → d3's nice ticks 0, 5, …, 35 (step 5).
    const t = texts(lines.render(arcLines).svg);
    for (const v of ['0', '5', '10', '15', '20', '25', '30', '35']) expect(t).toContain(v);
  });
});

describe('lines: notes', () => {
  it('places notes on a series point, on a position, or on a series end, and skips the rest', () => {
    const out = lines.render(arcLines, {}, defaultTheme, [
      ...notes,
      { label: '3', text: 'Bram returns', at: { series: 'bram' } },
      { label: '4', text: 'Nowhere', at: { x: 40 } },
      { label: '5', text: 'Nobody', at: { series: 'zed', x: 1 } },
      { label: '6', text: 'Nothing at all', at: {} },
    ]);
    expect(count(out.svg, 'class="vt-note"')).toBe(3);
    expect(out.skippedNotes).toEqual(['4', '5', '6']);
  });
});

describe('lines: table and options', () => {
  it('tabulates positions by series', () => {
    const { table } = lines.render(arcLines);
    expect(table.columns.map((c) => c.key)).toEqual(['position', 'ada', 'bram', 'cleo']);
    expect(table.columns.map((c) => c.numeric)).toEqual([false, true, true, true]);
    expect(table.rows[4]).toEqual(['Chapter 5: Lock Gates', 34, 4, 16]);
  });
  it('fills the documented defaults', () => {
    expect(linesOptions.parse({})).toEqual({ markers: true, area: false, zero: true });
  });
});
