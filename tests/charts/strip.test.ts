import { describe, expect, it } from 'vitest';
import { strip, stripOptions } from '../../pipeline/charts/strip.ts';
import { defaultTheme } from '../../pipeline/charts/theme.ts';
import { presenceStrip, stripNotes } from './fixtures.ts';
import { count, texts, titles } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';

describe('strip: snapshots', () => {
  it('three rows, five chapters, three notes', () => {
    const out = strip.render(presenceStrip, {}, defaultTheme, stripNotes);
    expectSvgSnapshot('strip', out.svg);
    expectSvgSnapshot('strip-narrow', out.svgNarrow!);
  });
});

describe('strip: alt text', () => {
  it('names the most and least frequent rows with their spread', () => {
    expect(strip.render(presenceStrip).alt).toBe(
      'Ada Vell occurs most often, 12 times, between 1% and 98% of the text; Bram Osk least often, 3 times, between 61% and 95%.',
    );
  });
  it('handles one row and a single occurrence', () => {
    const one = { ...presenceStrip, rows: [{ id: 'e', name: 'Essa Quill', positions: [0.34] }] };
    expect(strip.render(one).alt).toBe('Essa Quill occurs once, at 34% of the text.');
  });
  it('says when a row does not occur', () => {
    const rows = [...presenceStrip.rows, { id: 'd', name: 'Doran Pike', positions: [] }];
    expect(strip.render({ ...presenceStrip, rows }).alt).toContain('Doran Pike least often, not at all');
  });
});

describe('strip: drawing', () => {
  it('draws a tick at every position, a count per row and a label per row', () => {
    const out = strip.render(presenceStrip);
    const rowPaths = Array.from(out.svg.matchAll(/<path d="([^"]+)" fill="none" stroke="#0072B2"/g), (m) => m[1]);
    expect(rowPaths.map((d) => count(d, 'M'))).toEqual([12, 3, 6]);
    const t = texts(out.svg);
    for (const s of ['Ada Vell', 'Bram Osk', 'Cleo Harrow', '12', '3', '6']) expect(t).toContain(s);
  });
  it('leaves the counts out when asked', () => {
    expect(texts(strip.render(presenceStrip, { counts: false }).svg)).not.toContain('12');
  });
  it('draws chapter rules with their titles and thins crowded labels', () => {
    const out = strip.render(presenceStrip);
    expect(count(out.svg, 'class="vt-chapter"')).toBe(5);
    for (const b of presenceStrip.boundaries) expect(titles(out.svg)).toContain(b.title);
    const many = Array.from({ length: 60 }, (_, i) => ({ at: i / 60, label: `Ch. ${i + 1}`, title: `Chapter ${i + 1}` }));
    const crowded = strip.render({ ...presenceStrip, boundaries: many });
    const labels = texts(crowded.svg).filter((s) => s.startsWith('Ch. '));
    expect(labels.length).toBeGreaterThan(1);
    expect(labels.length).toBeLessThan(60);
  });
  it('writes the text length in the axis title', () => {
    expect(texts(strip.render(presenceStrip).svg)).toContain('Position in the text (% of 9,507 words)');
  });
});

describe('strip: notes', () => {
  it('draws notes on a row, a position or both, and skips unknown rows', () => {
    const out = strip.render(presenceStrip, {}, defaultTheme, [...stripNotes, { label: '4', text: 'x', at: { category: 'nobody' } }, { label: '5', text: 'y', at: { x: 1.5 } }]);
    expect(count(out.svg, 'class="vt-note"')).toBe(3);
    expect(out.skippedNotes).toEqual(['4', '5']);
    expect(out.alt).toContain('Note 3: Cleo leaves the village.');
  });
});

describe('strip: table and options', () => {
  it('tabulates occurrences, first and last place, and counts per chapter', () => {
    const { table } = strip.render(presenceStrip);
    expect(table.columns.map((c) => c.label)).toEqual([
      'Name', 'Occurrences', 'First (% of text)', 'Last (% of text)',
      'Chapter 1: The Ferry', 'Chapter 2: High Water', 'Chapter 3: The Eel Market', 'Chapter 4: A Ledger Opened', 'Chapter 5: Lock Gates',
    ]);
    // Ada: 0.01 0.04 0.05 0.12 | 0.2 0.33 0.34 | 0.5 0.61 | 0.77 | 0.9 0.98
    expect(table.rows[0]).toEqual(['Ada Vell', 12, 1, 98, 4, 3, 2, 1, 2]);
    const sum = (table.rows[0].slice(4) as number[]).reduce((a, b) => a + b, 0);
    expect(sum).toBe(12);
  });
  it('fills the documented defaults', () => {
    expect(stripOptions.parse({})).toEqual({ counts: true });
  });
});
