/**
 * Checks every chart kind shares, written once for the concordance, text
 * map, small multiples and scatter tests: the root and its labels, the two
 * layouts, identical bytes on a second render, legible type, escaping of
 * whatever the text or the plan supplies, and the empty state.
 */

import { expect, it } from 'vitest';
import type { ChartOutput } from '../../pipeline/charts/types.ts';
import { count, expectChartRoot, fontSizes, texts } from './inspect.ts';
import { wellFormednessProblems } from './xml.ts';

export const HOSTILE = '<script>alert(1)</script>';
export const AMP = '"&amp;';

/** The checks of charts.test.ts for one rendering of a kind. */
export function commonChecks(kind: string, title: string, render: () => ChartOutput): void {
  it('writes the root, title, desc and one root group, in both layouts', () => {
    const out = render();
    const wide = expectChartRoot(out.svg, kind, title, out.alt);
    const narrow = expectChartRoot(out.svgNarrow!, kind, title, out.alt);
    expect(wide).not.toBe(narrow);
    expect(out.svg).toMatch(/viewBox="0 0 720 \d+"/);
    expect(out.svgNarrow).toMatch(/viewBox="0 0 360 \d+"/);
  });

  it('is deterministic', () => {
    const a = render();
    const b = render();
    expect(b.svg).toBe(a.svg);
    expect(b.svgNarrow).toBe(a.svgNarrow);
    expect(b.alt).toBe(a.alt);
    expect(b.table).toEqual(a.table);
  });

  it('sets no text under 13 units, in font stacks with fallbacks', () => {
    // common practice, no source: 13 viewBox units is ≥ 9.75 px at 540 px wide and ≥ 11.5 px at 320 px (see theme.ts).
    const out = render();
    for (const svg of [out.svg, out.svgNarrow!]) {
      const sizes = fontSizes(svg);
      expect(sizes.length).toBeGreaterThan(0);
      expect(Math.min(...sizes)).toBeGreaterThanOrEqual(13);
      expect(svg).toContain('font-family:var(--vt-sans, ');
      expect(svg).toContain('font-family:var(--vt-serif, ');
    }
  });
}

/** Hostile strings come out escaped: well-formed XML, no live markup, the characters shown as typed. */
export function expectEscaped(out: ChartOutput): void {
  for (const svg of [out.svg, out.svgNarrow!]) {
    // Source: XML 1.0 (5th ed.), §2.1 well-formed documents, §4.6 predefined entities.
    expect(wellFormednessProblems(svg)).toEqual([]);
    expect(svg).not.toMatch(/<script/i);
    expect(svg).toContain('&lt;script&gt;');
    expect(svg).toContain('&quot;&amp;amp;');
    expect(count(svg, '<')).toBe(count(svg, '>'));
  }
}

/** The shared empty state. */
export function expectEmpty(out: ChartOutput): void {
  expect(out.alt).toMatch(/^No data to draw: /);
  expect(texts(out.svg)).toContain('No data to draw');
  expect(texts(out.svgNarrow!)).toContain('No data to draw');
  expect(wellFormednessProblems(out.svg)).toEqual([]);
  expect(wellFormednessProblems(out.svgNarrow!)).toEqual([]);
}
