/**
 * The promises every chart kind keeps, as reusable checks for one kind's
 * test file: root structure, same bytes twice, escaping, legible and
 * high-contrast type, the empty state and strict, documented options
 * (`commonChecks` runs the first three together).
 */

import { expect, it } from 'vitest';
import type { z } from 'zod';
import type { ChartOutput } from '../../pipeline/charts/types.ts';
import { contrastRatio, defaultTheme } from '../../pipeline/charts/theme.ts';
import { count, expectChartRoot, fontSizes, textFills, texts } from './inspect.ts';
import { wellFormednessProblems } from './xml.ts';

export const HOSTILE = '<script>alert(1)</script>';
export const AMP = '"&amp;';

/** Root, title, desc, one root group; both layouts; distinct ids. */
export function checkRoot(kind: string, title: string, render: () => ChartOutput): void {
  it('writes the root, title, desc and one root group in both layouts', () => {
    const out = render();
    const wide = expectChartRoot(out.svg, kind, title, out.alt);
    const narrow = expectChartRoot(out.svgNarrow!, kind, title, out.alt);
    expect(wide).not.toBe(narrow);
    expect(out.svg).toMatch(/viewBox="0 0 720 \d+"/);
    expect(out.svgNarrow).toMatch(/viewBox="0 0 360 \d+"/);
  });
}

/** Same input, same bytes, even with other work in between. */
export function checkDeterminism(render: () => ChartOutput, other: () => unknown): void {
  it('gives the same bytes twice', () => {
    const a = render();
    other();
    const b = render();
    expect(b.svg).toBe(a.svg);
    expect(b.svgNarrow).toBe(a.svgNarrow);
    expect(b.alt).toBe(a.alt);
    expect(b.table).toEqual(a.table);
  });
}

/** No text under 13 units; font stacks with fallbacks; text in colours that pass 4.5:1 on paper. */
export function checkType(render: () => ChartOutput, serif = true): void {
  it('sets no text under 13 units, in font stacks with fallbacks', () => {
    // common practice, no source: 13 units is the theme's floor (see theme.test.ts for the arithmetic).
    const out = render();
    for (const svg of [out.svg, out.svgNarrow!]) {
      const sizes = fontSizes(svg);
      expect(sizes.length).toBeGreaterThan(0);
      expect(Math.min(...sizes)).toBeGreaterThanOrEqual(13);
      expect(svg).toContain('font-family:var(--vt-sans, ');
      if (serif) expect(svg).toContain('font-family:var(--vt-serif, ');
    }
  });
  it('colours text only in colours that pass 4.5:1 on paper', () => {
    // Source: WCAG 2.2 SC 1.4.3 (4.5:1 for text). Text on coloured fills is checked by each kind.
    const out = render();
    const allowed = new Set([defaultTheme.ink, defaultTheme.inkMuted, defaultTheme.paper, ...defaultTheme.series.map((s) => s.text)]);
    for (const svg of [out.svg, out.svgNarrow!]) {
      const fills = textFills(svg);
      expect(fills.length).toBe(texts(svg).length);
      for (const f of fills) expect(allowed.has(f), f).toBe(true);
    }
  });
}

/** Hostile strings come out escaped: well-formed XML, no live markup, the characters shown as typed. */
export function expectEscaped(out: ChartOutput): void {
  for (const svg of [out.svg, out.svgNarrow]) {
    // Source: XML 1.0 (5th ed.), §2.1 well-formed documents, §4.6 predefined entities.
    expect(wellFormednessProblems(svg)).toEqual([]);
    expect(svg).not.toMatch(/<script/i);
    expect(svg).toContain('&lt;script&gt;');
    expect(svg).toContain('&quot;&amp;amp;');
    // Every "<" opens a tag, every ">" closes one: the counts agree.
    expect(count(svg, '<')).toBe(count(svg, '>'));
  }
}

/** Hostile strings arrive escaped, and read back as they were. */
export function checkEscaping(outputs: () => ChartOutput[]): void {
  it('never lets markup through', () => {
    for (const out of outputs()) expectEscaped(out);
  });
}

/** The shared "No data to draw" panel, in both layouts. */
export function expectEmpty(out: ChartOutput): void {
  expect(out.alt).toMatch(/^No data to draw: /);
  expect(texts(out.svg)).toContain('No data to draw');
  expect(texts(out.svgNarrow)).toContain('No data to draw');
  expect(wellFormednessProblems(out.svg)).toEqual([]);
  expect(wellFormednessProblems(out.svgNarrow)).toEqual([]);
}

/** The shared "No data to draw" panel. */
export function checkEmpty(cases: [string, () => ChartOutput][]): void {
  for (const [name, render] of cases) it(`says there is nothing to draw: ${name}`, () => expectEmpty(render()));
}

/** The checks every kind's own test file runs on one rendering: root and layouts, same bytes twice, legible and high-contrast type. */
export function commonChecks(kind: string, title: string, render: () => ChartOutput): void {
  checkRoot(kind, title, render);
  checkDeterminism(render, () => undefined);
  checkType(render);
}

/** Strict options, each documented with its default, defaults filled. */
export function checkOptions(schema: z.ZodType, render: (options: never) => ChartOutput, defaults: Record<string, unknown>): void {
  it('rejects unknown keys', () => {
    expect(schema.safeParse({ colour: 'red' }).success).toBe(false);
    expect(() => render({ colour: 'red' } as never)).toThrow();
  });
  it('documents every option with its default and fills the defaults', () => {
    const shape = (schema as unknown as { shape: Record<string, { description?: string }> }).shape;
    for (const [key, field] of Object.entries(shape)) expect(field.description ?? '', key).toMatch(/Default: /);
    expect(Object.keys(shape)).toContain('id');
    expect(schema.parse({})).toEqual(defaults);
  });
  it('takes the shared id option', () => {
    const out = render({ id: 'panel-x' } as never);
    expect(out.svg).toContain('aria-labelledby="panel-x-title panel-x-desc"');
    expect(out.svgNarrow).toContain('aria-labelledby="panel-x-n-title panel-x-n-desc"');
    expect(schema.safeParse({ id: '1abc' }).success).toBe(false);
  });
}

/** Pairs of (text colour, background) that a chart sets text on: each must reach 4.5:1. */
export function expectReadable(pairs: readonly [string, string][]): void {
  // Source: WCAG 2.2 SC 1.4.3 Contrast (Minimum): 4.5:1 for text.
  expect(pairs.length).toBeGreaterThan(0);
  for (const [fg, bg] of pairs) expect(contrastRatio(fg, bg), `${fg} on ${bg}`).toBeGreaterThanOrEqual(4.5);
}
