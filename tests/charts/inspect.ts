/** Reading back what a chart wrote, for assertions. */

import { expect } from 'vitest';
import { wellFormednessProblems } from './xml.ts';

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

export function unescapeXml(s: string): string {
  return s.replace(/&(amp|lt|gt|quot|apos);/g, (_, e: string) => ENTITIES[e]);
}

/** The plain-text contents of every <text> element, in order. */
export function texts(svg: string): string[] {
  return Array.from(svg.matchAll(/<text\b[^>]*>([^<]*)<\/text>/g), (m) => unescapeXml(m[1]));
}

/** The contents of every <title> element, in order (the first is the chart's own). */
export function titles(svg: string): string[] {
  return Array.from(svg.matchAll(/<title\b[^>]*>([^<]*)<\/title>/g), (m) => unescapeXml(m[1]));
}

/** Every font size set in the SVG, as attributes or in style attributes. */
export function fontSizes(svg: string): number[] {
  return [
    ...Array.from(svg.matchAll(/font-size="([\d.]+)"/g), (m) => Number(m[1])),
    ...Array.from(svg.matchAll(/font-size:([\d.]+)px/g), (m) => Number(m[1])),
  ];
}

/** How many times `needle` occurs in `hay`. */
export function count(hay: string, needle: string): number {
  return hay.split(needle).length - 1;
}

/**
 * Checks the root of a chart: the svg element and its attributes, the
 * <title> and <desc> it is labelled by, then exactly one root <g>.
 */
export function expectChartRoot(svg: string, kind: string, title: string, desc: string): string {
  expect(wellFormednessProblems(svg)).toEqual([]);
  const m =
    /^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" viewBox="0 0 (\d+) (\d+)" role="img" aria-labelledby="([A-Za-z][\w-]*)-title \3-desc" data-chart="([a-z]+)" class="vt-chart"><title id="\3-title">([^<]*)<\/title><desc id="\3-desc">([^<]*)<\/desc>(<g\b[\s\S]*<\/g>)<\/svg>$/.exec(
      svg,
    );
  expect(m, 'root element, title and desc in the expected form').not.toBeNull();
  const [, , , id, chartKind, t, d, body] = m!;
  expect(chartKind).toBe(kind);
  expect(unescapeXml(t)).toBe(title);
  expect(unescapeXml(d)).toBe(desc);
  // Exactly one element at the top level of the body: the root <g>.
  expect(wellFormednessProblems(body)).toEqual([]);
  return id;
}

/**
 * The colour each <text> is painted in: its own fill, or the fill it
 * inherits from the nearest enclosing element that sets one.
 */
export function textFills(svg: string): string[] {
  const out: string[] = [];
  const stack: (string | null)[] = [];
  for (const m of svg.matchAll(/<(\/?)([A-Za-z]+)\b([^>]*?)(\/?)>/g)) {
    const [, closing, name, attrs, selfClosing] = m;
    if (closing) {
      stack.pop();
      continue;
    }
    const own = /\sfill="([^"]+)"/.exec(attrs)?.[1] ?? null;
    const inherited = [...stack].reverse().find((f) => f !== null) ?? null;
    if (name === 'text') out.push(own ?? inherited ?? 'black');
    if (!selfClosing) stack.push(own);
  }
  return out;
}
