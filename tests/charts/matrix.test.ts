import { describe, expect, it } from 'vitest';
import { tickStep } from 'd3-array';
import { matrix, matrixOptions } from '../../pipeline/charts/matrix.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import { hexToLab, labToLch } from '../../pipeline/charts/lab.ts';
import { RAMP_LIGHTNESS, lightnessRamp, pickSteps, textOn } from '../../pipeline/charts/ramp.ts';
import { averageLinkage, seriate, unitProfile } from '../../pipeline/charts/seriate.ts';
import { equalClasses } from '../../pipeline/charts/classes.ts';
import type { MatrixData } from '../../pipeline/charts/types.ts';
import { people, sharedMatrix, villageNetwork, wordsByChapter } from './fixtures-structure.ts';
import { count, texts, titles } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';
import { AMP, HOSTILE, checkDeterminism, checkEmpty, checkEscaping, checkOptions, checkRoot, checkType, expectReadable } from './kind-checks.ts';

const rowNote = { label: '1', text: 'Ada crosses alone', at: { category: 'ada' } };
const columnNote = { label: '2', text: 'The lock gates fail', at: { category: 'V. Lock Gates' } };

/** Row ids in the order drawn. */
function drawnRows(svg: string): string[] {
  return Array.from(svg.matchAll(/<g class="vt-matrix-row" data-row="([^"]*)">/g), (m) => m[1]);
}

/** Pairs of (value text colour, cell fill) as drawn. */
function cellTextPairs(svg: string): [string, string][] {
  const cells = svg.slice(svg.indexOf('<g class="vt-cells">'), svg.indexOf('class="vt-frame"'));
  return Array.from(cells.matchAll(/<rect [^>]*fill="(#[0-9A-F]{6})"[^>]*><title>[^<]*<\/title><\/rect><text [^>]*fill="(#[0-9A-F]{6})">/g), (m) => [m[2], m[1]]);
}

describe('matrix: snapshots', () => {
  it('a symmetric matrix in clustered order, with a note on a row', () => {
    const out = matrix.render(sharedMatrix, { order: 'cluster' }, defaultTheme, [rowNote]);
    expectSvgSnapshot('matrix-cluster', out.svg);
    expectSvgSnapshot('matrix-cluster-narrow', out.svgNarrow!);
  });
  it('words by chapter in the given order, with a note on a column', () => {
    const out = matrix.render(wordsByChapter, {}, defaultTheme, [columnNote]);
    expectSvgSnapshot('matrix-words', out.svg);
    expectSvgSnapshot('matrix-words-narrow', out.svgNarrow!);
  });
});

describe('matrix: what every chart promises', () => {
  const render = () => matrix.render(sharedMatrix, { order: 'cluster' }, defaultTheme, [rowNote]);
  checkRoot('matrix', sharedMatrix.title, render);
  checkDeterminism(render, () => matrix.render(wordsByChapter));
  checkType(render);
  checkType(() => matrix.render(wordsByChapter, {}, defaultTheme, [columnNote]));
  checkEscaping(() => [
    matrix.render(
      {
        ...wordsByChapter,
        title: `${HOSTILE} ${AMP}`,
        rowLabel: HOSTILE,
        columnLabel: AMP,
        valueLabel: HOSTILE,
        rows: wordsByChapter.rows.map((r, i) => ({ id: i === 0 ? HOSTILE : r.id, name: i % 2 ? HOSTILE : AMP })),
        columns: wordsByChapter.columns.map((c, i) => ({ id: c.id, name: i % 2 ? AMP : HOSTILE })),
      },
      { order: 'cluster' },
      defaultTheme,
      [{ label: '<1>', text: HOSTILE, at: { category: HOSTILE } }],
    ),
  ]);
  checkEmpty([
    ['no rows', () => matrix.render({ ...wordsByChapter, rows: [], values: [] })],
    ['no columns', () => matrix.render({ ...wordsByChapter, columns: [], values: wordsByChapter.rows.map(() => []) })],
    ['only zeros and gaps', () => matrix.render({ ...wordsByChapter, values: wordsByChapter.rows.map((_, r) => wordsByChapter.columns.map((_, c) => (r + c) % 2 ? 0 : Number.NaN)) })],
  ]);
  checkOptions(matrixOptions, (o) => matrix.render(wordsByChapter, o), { order: 'given', values: true, diagonal: true });
});

describe('matrix: alt text', () => {
  it('names the strongest pair once in a symmetric matrix', () => {
    expect(matrix.render(sharedMatrix).alt).toBe('Paragraphs shared: highest between Ada Vell and Bram Osk, 42; lowest 0.');
  });
  it('names row and column of the strongest cell otherwise', () => {
    expect(matrix.render(wordsByChapter).alt).toBe('Uses: highest in row lock, column V. Lock Gates, 26; lowest 0.');
  });
  it('names ties and ends with the notes drawn', () => {
    const tied: MatrixData = { ...wordsByChapter, values: wordsByChapter.values.map((vs, r) => vs.map((v, c) => (r === 0 && c === 0 ? 26 : v))) };
    const out = matrix.render(tied, {}, defaultTheme, [rowNote, columnNote]);
    expect(out.alt).toBe('Uses: highest in row ferry, column I. The Ferry and in row lock, column V. Lock Gates, 26 each; lowest 0. Note 2: The lock gates fail.');
    expect(out.skippedNotes).toEqual(['1']);
  });
});

describe('matrix: order', () => {
  it('keeps the given order by default', () => {
    expect(drawnRows(matrix.render(wordsByChapter).svg)).toEqual(wordsByChapter.rows.map((r) => r.id));
  });
  it('orders rows and columns by their totals', () => {
    // Row totals by hand: ferry 60, tide 50, lock 45, ledger 37, flood 35, eel 31, school 15.
    const out = matrix.render(wordsByChapter, { order: 'total' });
    expect(drawnRows(out.svg)).toEqual(['ferry', 'tide', 'lock', 'ledger', 'flood', 'eel', 'school']);
    // Column totals by hand: V 69, VI 48, II 44, I 42, IV 40, III 30.
    expect(out.table.columns.slice(1).map((c) => c.label)).toEqual(['V. Lock Gates', 'VI. Slack Tide', 'II. High Water', 'I. The Ferry', 'IV. A Ledger Opened', 'III. The Eel Market']);
  });
  it('clusters the three circles of the village into blocks, one order for rows and columns', () => {
    const out = matrix.render(sharedMatrix, { order: 'cluster' });
    const rows = drawnRows(out.svg);
    const circle = (id: string) => villageNetwork.nodes.find((n) => n.id === id)!.community;
    // Each circle of characters sits in one unbroken run of rows.
    const runs = rows.map(circle).filter((c, i, all) => i === 0 || c !== all[i - 1]);
    expect(runs).toHaveLength(3);
    const byName = new Map(people.map((p) => [p.name, p.id]));
    expect(out.table.columns.slice(1).map((c) => byName.get(c.label))).toEqual(rows);
  });
});

describe('matrix: cells and labels', () => {
  it('writes values when they fit, and leaves zeros blank', () => {
    const svg = matrix.render(sharedMatrix).svg;
    const t = texts(svg);
    for (const v of ['42', '31', '26', '2']) expect(t).toContain(v);
    // 17 linked pairs, each written twice; the 66 other cells hold 0 and stay blank.
    expect(cellTextPairs(svg)).toHaveLength(34);
    // The only "0" is the legend's blank key.
    expect(t.filter((s) => s === '0')).toHaveLength(1);
  });
  it('leaves values out when asked', () => {
    expect(texts(matrix.render(sharedMatrix, { values: false }).svg)).not.toContain('42');
  });
  it('sets every value in ink or paper, whichever reaches 4.5:1 on its cell', () => {
    const out = matrix.render(sharedMatrix);
    const pairs = [...cellTextPairs(out.svg), ...cellTextPairs(out.svgNarrow!)];
    expect(pairs.length).toBeGreaterThan(20);
    expectReadable(pairs);
  });
  it('crosses missing cells and hides the diagonal when asked', () => {
    const gaps = { ...wordsByChapter, values: wordsByChapter.values.map((vs, r) => vs.map((v, c) => (r === 1 && c === 1 ? Number.NaN : v))) };
    const out = matrix.render(gaps);
    expect(count(out.svg, 'class="vt-missing"')).toBe(2); // the cell and its key in the legend
    expect(titles(out.svg)).toContain('ledger \u00D7 II. High Water: no value');
    expect(out.table.rows[1][2]).toBeNull();
    const self = { ...sharedMatrix, values: sharedMatrix.values.map((vs, r) => vs.map((v, c) => (r === c && r === 0 ? 99 : v))) };
    expect(matrix.render(self).alt).toContain('highest for Ada Vell with itself, 99');
    expect(matrix.render(self, { diagonal: false }).alt).toContain('between Ada Vell and Bram Osk, 42');
  });
  it('turns crowded column labels upright and thins them, keeping every name in the tooltips', () => {
    const cols = Array.from({ length: 40 }, (_, i) => ({ id: `s${i + 1}`, name: `Segment ${i + 1}` }));
    const data: MatrixData = { ...wordsByChapter, columns: cols, values: wordsByChapter.rows.map((_, r) => cols.map((_, c) => (r * 7 + c * 3) % 11)) };
    const out = matrix.render(data);
    const labelled = (svg: string) => texts(svg).filter((s) => s.startsWith('Segment '));
    expect(out.svgNarrow).toContain('rotate(-90');
    expect(labelled(out.svgNarrow!).length).toBeLessThan(40);
    expect(labelled(out.svgNarrow!).length).toBeGreaterThan(5);
    expect(titles(out.svgNarrow!)).toContain('eel \u00D7 Segment 40: 6');
  });
});

describe('matrix: notes and table', () => {
  it('draws a note on a row beside it and a note on a column under it', () => {
    const out = matrix.render(wordsByChapter, {}, defaultTheme, [
      { label: '1', text: 'Eels everywhere', at: { category: 'eel' } },
      columnNote,
      { label: '3', text: 'Nowhere', at: { category: 'nobody' } },
      { label: '4', text: 'No target', at: { x: 2 } },
    ]);
    expect(count(out.svg, 'class="vt-note"')).toBe(2);
    expect(count(out.svg, 'class="vt-note-leader"')).toBe(1);
    expect(out.skippedNotes).toEqual(['3', '4']);
    expect(out.alt).toContain('Note 1: Eels everywhere. Note 2: The lock gates fail.');
  });
  it('tabulates one row per matrix row, one column per matrix column', () => {
    const { table } = matrix.render(wordsByChapter);
    expect(table.columns[0]).toEqual({ key: 'row', label: 'Word', numeric: false });
    expect(table.columns.slice(1).map((c) => c.key)).toEqual(['ch1', 'ch2', 'ch3', 'ch4', 'ch5', 'ch6']);
    expect(table.rows[0]).toEqual(['ferry', 24, 9, 3, 5, 7, 12]);
    expect(table.rows).toHaveLength(7);
  });
});

describe('colour classes', () => {
  it('covers the data with round limits in at most seven classes', () => {
    // common practice, no source: class limits on steps of 1, 2 or 5 × 10ⁿ, as d3-array's tickStep gives.
    const c = equalClasses([0, 3, 17, 42], 7, true);
    expect(c.limits).toEqual([0, 10, 20, 30, 40, 50]);
    expect([0, 9, 10, 42].map(c.classOf)).toEqual([0, 0, 1, 4]);
    const d = equalClasses([0.05, 0.31, 0.62], 7, false);
    const step = d.limits[1] - d.limits[0];
    expect(d.limits.length - 1).toBeLessThanOrEqual(7);
    expect(d.limits[0]).toBeLessThanOrEqual(0.05);
    expect(d.limits[d.limits.length - 1]).toBeGreaterThanOrEqual(0.62);
    expect(step).toBeCloseTo(tickStep(0, 0.62, d.limits.length - 1), 10);
  });
  it('closes the last class and copes with one value', () => {
    const c = equalClasses([0, 40], 7, true);
    expect(c.classOf(40)).toBe(c.limits.length - 2);
    expect(equalClasses([5, 5], 7, true).limits).toEqual([0, 1, 2, 3, 4, 5]);
    expect(equalClasses([-2, -2], 7, true).limits).toEqual([-2, -1]);
    expect(equalClasses([], 7, true).limits).toEqual([0, 1]);
  });
});

describe('CIELAB and the ramp', () => {
  it('converts sRGB primaries to their published L*a*b* values (D65)', () => {
    // from memory: the widely published CIELAB (D65) coordinates of the sRGB primaries and white.
    const cases: [string, [number, number, number]][] = [
      ['#FF0000', [53.24, 80.09, 67.2]],
      ['#00FF00', [87.73, -86.18, 83.18]],
      ['#0000FF', [32.3, 79.19, -107.86]],
      ['#FFFFFF', [100, 0, 0]],
    ];
    for (const [hex, [l, a, b]] of cases) {
      const lab = hexToLab(hex);
      expect(lab.l, hex).toBeCloseTo(l, 1);
      expect(lab.a, hex).toBeCloseTo(a, 1);
      expect(lab.b, hex).toBeCloseTo(b, 1);
    }
  });
  it('steps lightness evenly in the hue of the first series colour', () => {
    const ramp = lightnessRamp(defaultTheme.series[0].source);
    const source = labToLch(hexToLab(defaultTheme.series[0].source));
    ramp.forEach((hex, i) => {
      const lch = labToLch(hexToLab(hex));
      expect(lch.l, hex).toBeCloseTo(RAMP_LIGHTNESS[i], 0);
      expect(Math.abs(lch.h - source.h), hex).toBeLessThan(3);
    });
    expect(pickSteps(ramp, 5)).toEqual([ramp[0], ramp[2], ramp[3], ramp[5], ramp[6]]);
    expect(pickSteps(ramp, 1)).toEqual([ramp[3]]);
  });
  it('keeps ink or paper readable on every step of every hue', () => {
    // Source: WCAG 2.2 SC 1.4.3 (4.5:1); the steps skip the lightness band where neither ink nor paper reaches it.
    const pairs = defaultTheme.series.flatMap((s) => lightnessRamp(s.source).map((c) => [textOn(c, defaultTheme), c] as [string, string]));
    expectReadable(pairs);
  });
});

describe('seriation', () => {
  it('merges at the heights of the worked UPGMA example', () => {
    // Source: Wikipedia, "UPGMA", worked example on five items a–e (from memory): joins at 17 (a,b),
    // 22 ((a,b),e), 28 (c,d) and 33 (all), i.e. branch tips at 8.5, 11, 14 and 16.5.
    const d = [
      [0, 17, 21, 31, 23],
      [17, 0, 30, 34, 21],
      [21, 30, 0, 28, 39],
      [31, 34, 28, 0, 43],
      [23, 21, 39, 43, 0],
    ];
    const { merges, order } = averageLinkage(d);
    expect(merges.map((m) => m.height)).toEqual([17, 22, 28, 33]);
    expect(merges[1].a.length + merges[1].b.length).toBe(3);
    expect([...order].sort()).toEqual([0, 1, 2, 3, 4]);
    // Flipping puts b next to e (21) rather than a next to e (23).
    const ab = order.indexOf(1);
    expect(Math.abs(order.indexOf(4) - ab)).toBe(1);
  });
  it('recovers shuffled blocks as unbroken runs', () => {
    // common practice, no source: a block-diagonal matrix with rows shuffled seriates back into its blocks.
    const block = (i: number) => Math.floor(i / 3);
    const rows = [4, 0, 7, 2, 5, 8, 1, 6, 3].map((i) => Array.from({ length: 9 }, (_, j) => (block(i) === block(j) ? 5 + ((i + j) % 3) : 0)));
    const original = [4, 0, 7, 2, 5, 8, 1, 6, 3];
    const order = seriate(rows).map((k) => block(original[k]));
    expect(order.filter((b, i) => i === 0 || b !== order[i - 1])).toHaveLength(3);
  });
  it('scales profiles to unit length and leaves zero rows alone', () => {
    expect(unitProfile([3, 4])).toEqual([0.6, 0.8]);
    expect(unitProfile([0, 0])).toEqual([0, 0]);
  });
});
