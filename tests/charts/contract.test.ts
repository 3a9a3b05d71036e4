/**
 * The chart contract (chart.ts), through a kind defined here and nowhere
 * else: a row of dots, one per value. It is one definition and one registry
 * entry, and gets from the contract what every kind gets: strict options
 * with worded errors, ids, both layouts in their frames, the empty panel,
 * notes placed once with an outcome each, the alt text with its summary kept
 * apart, and its table. These are checks of the project's own contract (no
 * outside source); the kinds' own tests check what they draw.
 */
import { describe, expect, expectTypeOf, it } from 'vitest';
import { z } from 'zod';
import { defineChart, idOption, isDataAt } from '../../pipeline/charts/chart.ts';
import type { Miss } from '../../pipeline/charts/chart.ts';
import { charts, registry } from '../../pipeline/charts/index.ts';
import * as kinds from '../../pipeline/charts/kinds.ts';
import { el } from '../../pipeline/charts/svg.ts';
import type { ChartDataOf } from '../../pipeline/charts/index.ts';
import type {
  BarsData,
  ChartData,
  KwicData,
  LinesData,
  MatrixData,
  MultiplesData,
  NetworkData,
  PinnedNote,
  ScatterData,
  StripData,
  TextmapData,
  TreeData,
  TreemapData,
} from '../../pipeline/charts/types.ts';
import { expectChartRoot, texts } from './inspect.ts';
import { wellFormednessProblems } from './xml.ts';

/** The data of the kind: a kind's data type lives in its own file. */
interface DotsData {
  kind: 'dots';
  title: string;
  names: string[];
  values: number[];
}

const dots = defineChart({
  name: 'dots',
  options: z.strictObject({
    radius: z.number().min(1).max(10).default(4).describe('Radius of a dot. Default: 4.'),
    id: idOption,
  }),
  prepare: (data: DotsData) => ({ values: data.values.filter(Number.isFinite) }),
  empty: ({ prep }) => (prep.values.length === 0 ? 'the dataset has no values.' : null),
  table: ({ data }) => ({ columns: [{ key: 'name', label: 'Name', numeric: false }, { key: 'value', label: 'Value', numeric: true }], rows: data.names.map((n, i) => [n, data.values[i] ?? null]) }),
  place: (at, { data }): { dot: number } | Miss => {
    const name = isDataAt(at) ? at.category : 'character' in at ? at.name : undefined;
    const i = name === undefined ? -1 : data.names.indexOf(name);
    if (i < 0) return 'absent';
    return data.values[i]! > 0 ? { dot: i } : 'beside';
  },
  slot: (t) => t.dot,
  alt: ({ prep }) => `${prep.values.length} dots.`,
  draw: ({ data, opts }, notes, { width, narrow }) => ({
    body: data.values.map((_, i) => el('circle', { cx: 10 + i * (narrow ? 20 : 40), cy: 20, r: opts.radius, 'data-note': notes.find((n) => n.dot === i)?.note.label })).join(''),
    height: width / 10,
  }),
});

const data: DotsData = { kind: 'dots', title: 'Dots', names: ['Ada', 'Bram', 'Cleo'], values: [3, 0, 5] };
const note = (label: string, at: PinnedNote['at']): PinnedNote => ({ label, text: `Note about ${label}.`, at });

describe('a kind defined in one file and registered in one line', () => {
  const all = registry({ ...kinds, dots });

  it('is registered under its name beside the others, and only there', () => {
    expect(all.dots).toBe(dots);
    expect(Object.keys(all).sort()).toEqual([...Object.keys(charts), 'dots'].sort());
    expect(charts.dots).toBeUndefined();
  });

  it('refuses a kind registered under another name', () => {
    expect(() => registry({ spots: dots })).toThrow(/"dots" is registered as "spots"/);
  });

  it('draws both layouts in the shared frame, with ids from the data or the id option', () => {
    const out = dots.render(data);
    expectChartRoot(out.svg, 'dots', 'Dots', out.alt);
    expectChartRoot(out.svgNarrow, 'dots', 'Dots', out.alt);
    expect(out.svg).toMatch(/^<svg [^>]*viewBox="0 0 720 72"/);
    expect(out.svgNarrow).toMatch(/^<svg [^>]*viewBox="0 0 360 36"/);
    expect(out.svg).toMatch(/aria-labelledby="vt-dots-[0-9a-z]+-title vt-dots-[0-9a-z]+-desc"/);
    expect(dots.render(data, { id: 'mine' }).svgNarrow).toContain('aria-labelledby="mine-n-title mine-n-desc"');
    expect(out.table.rows).toEqual([['Ada', 3], ['Bram', 0], ['Cleo', 5]]);
  });

  it('fills defaults and rejects unknown or wrong options, naming the option and what it takes', () => {
    expect(dots.render(data).svg).toContain('r="4"');
    expect(() => dots.render(data, { colour: 'red' } as never)).toThrow(/options of the "dots" chart: unknown option "colour" \(the options are: radius, id\)/);
    expect(() => dots.render(data, { radius: 40 })).toThrow(/"radius": .*\(Radius of a dot\. Default: 4\.\)/);
  });

  it('draws the shared empty panel when the kind says there is nothing to draw', () => {
    const out = dots.render({ ...data, values: [] }, {}, undefined, [note('1', { category: 'Ada' })]);
    expect(out.alt).toBe('No data to draw: the dataset has no values.');
    expect(out.summary).toBe(out.alt);
    expect(texts(out.svgNarrow)).toContain('No data to draw');
    expect(wellFormednessProblems(out.svg)).toEqual([]);
    expect(out.skippedNotes).toEqual(['1']);
  });

  it('places each note once and says what became of it', () => {
    const notes = [
      note('1', { category: 'Ada' }),
      note('2', { category: 'Bram' }), // its value is 0: shown, but no dot to mark
      note('3', { category: 'Dora' }), // not in the data
      note('4', { character: 'ada', name: 'Ada' }), // the same dot as note 1: one note per slot
      note('5', { character: 'cleo', name: 'Cleo' }),
    ];
    const out = dots.render(data, {}, undefined, notes);
    expect(out.notes.map((o) => o.placed)).toEqual(['drawn', 'beside', 'absent', 'beside', 'drawn']);
    expect(out.skippedNotes).toEqual(['2', '3', '4']);
    expect(out.svg).toContain('data-note="1"');
    expect(out.svg).toContain('data-note="5"');
    expect(out.summary).toBe('3 dots.');
    expect(out.alt).toBe('3 dots. Note 1: Note about 1. Note 5: Note about 5.');
  });
});

describe('the data of the registered kinds', () => {
  it('is read from the registry, so a kind’s data type is declared in its own file only', () => {
    expectTypeOf<ChartData>().toEqualTypeOf<
      BarsData | LinesData | StripData | MatrixData | NetworkData | TreeData | TreemapData | KwicData | TextmapData | MultiplesData | ScatterData
    >();
    expectTypeOf<ChartDataOf<'strip'>>().toEqualTypeOf<StripData>();
    expectTypeOf<DotsData>().not.toMatchTypeOf<ChartData>();
  });
});
