import { describe, expect, it } from 'vitest';
import { lines } from '../../pipeline/charts/lines.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import type { LinesData } from '../../pipeline/charts/types.ts';
import { arcLines } from './fixtures.ts';
import { count, texts } from './inspect.ts';
import { expectSvgSnapshot, normaliseSvg } from './snapshot.ts';
import { wellFormednessProblems } from './xml.ts';

/** A smoothed arc of Ada's mentions with the spread of the raw counts around it (invented). */
const banded: LinesData = {
  ...arcLines,
  title: 'Ada Vell across the chapters, smoothed',
  series: [arcLines.series[0], arcLines.series[2]],
  bands: [{ series: 'ada', low: [24, 18, 15, 20, 27, 8], high: [36, 27, 22, 31, 41, 17] }],
};

function bandPaths(svg: string): string[] {
  return Array.from(svg.matchAll(/<path class="vt-band" data-series="([^"]+)" d="([^"]+)" fill="(#[0-9A-F]{6})" fill-opacity="0.16"/g), (m) => `${m[1]} ${m[3]} ${m[2]}`);
}

describe('lines: bands', () => {
  it('snapshot: a band behind its series', () => {
    const out = lines.render(banded);
    expectSvgSnapshot('lines-band', out.svg);
    expect(wellFormednessProblems(out.svgNarrow!)).toEqual([]);
  });

  it('draws the band in its series colour, lightly, before (behind) every line', () => {
    for (const svg of [lines.render(banded).svg, lines.render(banded).svgNarrow!]) {
      const paths = bandPaths(svg);
      expect(paths).toHaveLength(1);
      expect(paths[0].startsWith(`ada ${defaultTheme.series[0].mark} M`)).toBe(true);
      // A closed outline: six points along the top, six back along the bottom.
      expect(count(paths[0], 'L')).toBe(11);
      expect(paths[0].endsWith('Z')).toBe(true);
      expect(svg.indexOf('class="vt-bands"')).toBeLessThan(svg.indexOf('class="vt-lines"'));
    }
  });

  it('stretches the value axis to hold the band', () => {
    // from memory (d3-scale): 0…34 in five ticks steps by 5 and nice() ends at 35; the band reaches 41,
    // and 0…41 in five ticks steps by 10, so nice() ends at 50.
    const t = texts(/<g class="vt-ticks"[^>]*>([\s\S]*?)<\/g>/.exec(lines.render(banded).svg)![1]);
    expect(t.at(-1)).toBe('50');
    const plain = texts(/<g class="vt-ticks"[^>]*>([\s\S]*?)<\/g>/.exec(lines.render({ ...banded, bands: undefined }).svg)![1]);
    expect(plain.at(-1)).toBe('35');
  });

  it('breaks the band where a bound is missing, and leaves out bands of unknown series', () => {
    const gap = lines.render({ ...banded, bands: [{ series: 'ada', low: [24, 18, Number.NaN, 20, 27, 8], high: [36, 27, 22, 31, 41, 17] }, { series: 'nobody', low: [1, 1, 1, 1, 1, 1], high: [2, 2, 2, 2, 2, 2] }] });
    const paths = bandPaths(gap.svg);
    expect(paths).toHaveLength(1);
    expect(count(paths[0], 'Z')).toBe(2);
  });

  it('tabulates the bounds beside the series', () => {
    const { table } = lines.render(banded);
    expect(table.columns.map((c) => c.key)).toEqual(['position', 'ada', 'cleo', 'ada-low', 'ada-high']);
    expect(table.columns.at(-1)!.label).toBe('Ada Vell (band, high)');
    expect(table.rows[4]).toEqual(['Chapter 5: Lock Gates', 34, 16, 27, 41]);
  });

  it('draws exactly as before when there is no band', () => {
    const none = lines.render(arcLines);
    expect(normaliseSvg(lines.render({ ...arcLines, bands: [] }).svg)).toBe(normaliseSvg(none.svg));
    expect(normaliseSvg(lines.render({ ...arcLines, bands: [{ series: 'nobody', low: [0], high: [1] }] }).svg)).toBe(normaliseSvg(none.svg));
    expect(lines.render({ ...arcLines, bands: [] }).table).toEqual(none.table);
  });
});
