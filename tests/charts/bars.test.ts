import { describe, expect, it } from 'vitest';
import { bars, barsOptions } from '../../pipeline/charts/bars.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import { chapterWordsBars, mentionsBars, mentionsByPartBars, notes } from './fixtures.ts';
import { count, texts, titles } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';

/** Category labels in the order drawn (the first text of each bar group). */
function drawnCategories(svg: string): string[] {
  return Array.from(svg.matchAll(/<g class="vt-bar-group" data-category="([^"]*)">/g), (m) => m[1]);
}

describe('bars: snapshots', () => {
  it('single series, horizontal, sorted, with a note', () => {
    const out = bars.render(mentionsBars, { sort: 'descending' }, defaultTheme, notes);
    expectSvgSnapshot('bars-horizontal', out.svg);
    expectSvgSnapshot('bars-horizontal-narrow', out.svgNarrow!);
  });
  it('two series, grouped and stacked', () => {
    expectSvgSnapshot('bars-grouped', bars.render(mentionsByPartBars).svg);
    expectSvgSnapshot('bars-stacked', bars.render(mentionsByPartBars, { layout: 'stacked' }).svg);
  });
  it('vertical, with a note in the lane above', () => {
    const out = bars.render(chapterWordsBars, { orientation: 'vertical' }, defaultTheme, [{ label: '1', text: 'The ledger is found', at: { category: 'IV. A Ledger Opened' } }]);
    expectSvgSnapshot('bars-vertical', out.svg);
    expectSvgSnapshot('bars-vertical-narrow', out.svgNarrow!);
  });
});

describe('bars: alt text', () => {
  it('states the largest and smallest category with values and share', () => {
    // 142 of 142 + 12 + 87 + 95 + 123 = 459 mentions → 30.9%, shown as 31%.
    const { alt } = bars.render(mentionsBars);
    expect(alt).toBe('Mentions: Ada Vell is highest, 142 (31% of the total); Bram Osk lowest, 12.');
  });
  it('groups thousands in the longest and shortest chapter', () => {
    const { alt } = bars.render(chapterWordsBars);
    expect(alt).toContain('IV. A Ledger Opened is highest, 2,310');
    expect(alt).toContain('I. The Ferry lowest, 640');
  });
  it('adds counts of several series together', () => {
    const { alt } = bars.render(mentionsByPartBars);
    // Ada: 60 + 82 = 142; Bram: 5 + 7 = 12; all: 127 + 12 + 87 + 95 = 336 → 42%.
    expect(alt).toBe('Mentions, both series together: Ada Vell is highest, 142 (42% of the total); Bram Osk lowest, 12.');
  });
  it('names ties', () => {
    const { alt } = bars.render({ ...mentionsBars, categories: ['Ada', 'Bram', 'Cleo'], series: [{ id: 'm', name: 'M', values: [5, 9, 9] }] });
    expect(alt).toContain('Bram and Cleo are highest, 9 each');
  });
  it('compares single bars when several series are not counts', () => {
    const { alt } = bars.render({ ...mentionsByPartBars, format: 'decimal', valueLabel: 'Share of speech', series: [
      { id: 'a', name: 'Part One', values: [0.2, 0.05, 0.3, 0.12] },
      { id: 'b', name: 'Part Two', values: [0.42, 0.1, 0.25, 0.15] },
    ] });
    expect(alt).toBe('Share of speech: Ada Vell (Part Two) is highest, 0.42; Bram Osk (Part One) lowest, 0.05.');
  });
  it('says when categories were left out', () => {
    const { alt } = bars.render(mentionsBars, { sort: 'descending', limit: 3 });
    expect(alt).toContain('The chart shows the highest 3 of 5 categories; the table lists all.');
  });
});

describe('bars: drawing', () => {
  it('keeps the order of the data unless asked to sort', () => {
    expect(drawnCategories(bars.render(mentionsBars).svg)).toEqual(mentionsBars.categories);
    expect(drawnCategories(bars.render(mentionsBars, { sort: 'descending' }).svg)).toEqual(['Ada Vell', 'Essa Quill', 'Doran Pike', 'Cleo Harrow', 'Bram Osk']);
    expect(drawnCategories(bars.render(mentionsBars, { sort: 'ascending' }).svg)).toEqual(['Bram Osk', 'Cleo Harrow', 'Doran Pike', 'Essa Quill', 'Ada Vell']);
  });
  it('draws at most `limit` categories but keeps all in the table', () => {
    const out = bars.render(mentionsBars, { sort: 'descending', limit: 2 });
    expect(drawnCategories(out.svg)).toEqual(['Ada Vell', 'Essa Quill']);
    expect(out.table.rows).toHaveLength(5);
  });
  it('truncates long labels but keeps them whole in the title and table', () => {
    const long = 'The Ferryman of the Lower Reach, Keeper of the Old Sluice';
    const out = bars.render({ ...mentionsBars, categories: [long, 'Ada'], series: [{ id: 'm', name: 'M', values: [3, 4] }] });
    const shown = texts(out.svg).find((t) => t.startsWith('The Ferryman'))!;
    expect(shown.endsWith('\u2026')).toBe(true);
    expect(shown.length).toBeLessThan(long.length);
    expect(titles(out.svg)).toContain(`${long}: 3`);
    expect(out.table.rows[0][0]).toBe(long);
  });
  it('writes value labels when asked, and none otherwise', () => {
    const on = texts(bars.render(mentionsBars).svg);
    for (const v of ['142', '12', '87', '95', '123']) expect(on).toContain(v);
    const off = texts(bars.render(mentionsBars, { labels: false }).svg);
    expect(off).not.toContain('123');
  });
  it('writes a stack total, not each segment, when stacked', () => {
    const t = texts(bars.render(mentionsByPartBars, { layout: 'stacked' }).svg);
    expect(t).toContain('142');
    expect(t).not.toContain('82');
    const g = texts(bars.render(mentionsByPartBars).svg);
    expect(g).toContain('82');
    expect(g).not.toContain('142');
  });
  it('draws one bar per value, with a legend for several series', () => {
    const out = bars.render(mentionsByPartBars);
    expect(count(out.svg, '<rect')).toBe(1 + 8 + 2); // paper, 4 × 2 bars, 2 swatches
    expect(texts(out.svg)).toEqual(expect.arrayContaining(['Part One', 'Part Two']));
  });
  it('falls back to horizontal bars when vertical ones would be too thin', () => {
    const many = Array.from({ length: 20 }, (_, i) => `Reach ${i + 1}`);
    const out = bars.render({ ...mentionsBars, categories: many, series: [{ id: 'm', name: 'M', values: many.map((_, i) => i + 1) }] }, { orientation: 'vertical' });
    // 20 categories: 720-wide layout has ~30 units each (vertical); the 360 one ~13 (horizontal).
    // The horizontal layout heads its two columns with the axis titles; the vertical one does not.
    expect(out.svg).not.toContain('class="vt-axis-titles"');
    expect(out.svgNarrow).toContain('class="vt-axis-titles"');
    expect(out.svgNarrow).toMatch(/<text x="[\d.]+" y="[\d.]+" text-anchor="end">Reach 1<\/text>/);
  });
  it('draws negative values to the left of zero', () => {
    const out = bars.render({ ...mentionsBars, format: 'decimal', series: [{ id: 's', name: 'S', values: [0.42, -0.31, 0.05, -0.12, 0.2] }] });
    expect(texts(out.svg)).toContain('\u22120.31');
    expect(texts(out.svg)).toContain('0.20'); // decimals kept equal across the chart
    expect(out.alt).toContain('Bram Osk lowest, \u22120.31');
  });
});

describe('bars: notes', () => {
  it('draws a numbered marker for notes on a shown category and skips the rest', () => {
    const out = bars.render(mentionsBars, {}, defaultTheme, notes);
    expect(count(out.svg, 'class="vt-note"')).toBe(1);
    expect(out.svg).toContain('data-note="1"');
    expect(out.alt).toMatch(/ Note 1: Ada takes the night ferry alone\.$/);
    expect(out.skippedNotes).toEqual(['2']);
  });
  it('skips notes on categories left out by the limit', () => {
    const out = bars.render(mentionsBars, { sort: 'ascending', limit: 2 }, defaultTheme, notes);
    expect(out.skippedNotes).toEqual(['1', '2']);
    expect(out.alt).not.toContain('Note 1');
  });
});

describe('bars: table and options', () => {
  it('tabulates every category and series', () => {
    const { table } = bars.render(mentionsByPartBars);
    expect(table.columns).toEqual([
      { key: 'category', label: 'Character', numeric: false },
      { key: 'part-1', label: 'Part One', numeric: true },
      { key: 'part-2', label: 'Part Two', numeric: true },
    ]);
    expect(table.rows[0]).toEqual(['Ada Vell', 60, 82]);
  });
  it('marks missing values as null', () => {
    const { table } = bars.render({ ...mentionsBars, series: [{ id: 'm', name: 'M', values: [1, Number.NaN, 3] }] });
    expect(table.rows.map((r) => r[1])).toEqual([1, null, 3, null, null]);
  });
  it('fills the documented defaults', () => {
    expect(barsOptions.parse({})).toEqual({ orientation: 'horizontal', layout: 'grouped', sort: 'none', labels: true, limit: 30 });
    expect(barsOptions.safeParse({ limit: 0 }).success).toBe(false);
    expect(barsOptions.safeParse({ sort: 'random' }).success).toBe(false);
  });
});
