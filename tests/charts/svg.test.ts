import { describe, expect, it } from 'vitest';
import { attrs, el, escapeXml, hashString, num, textEl, textWidth, truncateText, wrapText } from '../../pipeline/charts/svg.ts';
import { wellFormednessProblems } from './xml.ts';

describe('escapeXml', () => {
  it('escapes the five XML special characters', () => {
    // Source: XML 1.0 (5th ed.), §4.6 Predefined Entities: lt, gt, amp, apos, quot.
    expect(escapeXml(`<a href="x">Tom & Jerry's</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;Tom &amp; Jerry&apos;s&lt;/a&gt;');
  });
  it('escapes an ampersand that already looks like an entity', () => {
    // common practice, no source: text is data, never markup, so "&amp;" must show as typed.
    expect(escapeXml('&amp;')).toBe('&amp;amp;');
  });
});

describe('num', () => {
  it('rounds to at most two decimals and trims zeros', () => {
    expect(num(12)).toBe('12');
    expect(num(12.5)).toBe('12.5');
    expect(num(1 / 3)).toBe('0.33');
    expect(num(2 / 3)).toBe('0.67');
    expect(num(100.004)).toBe('100');
  });
  it('never writes -0, exponents or NaN', () => {
    expect(num(-0.001)).toBe('0');
    expect(num(-0)).toBe('0');
    expect(num(1e-9)).toBe('0');
    expect(num(Number.NaN)).toBe('0');
    expect(num(-3.456)).toBe('-3.46');
  });
});

describe('attrs and el', () => {
  it('escapes string values, formats numbers and drops empty values', () => {
    expect(attrs({ x: 1.234, title: 'a"b', hidden: undefined, off: false, on: true, n: null })).toBe(' x="1.23" title="a&quot;b" on="on"');
  });
  it('self-closes elements without children', () => {
    expect(el('rect', { width: 2 })).toBe('<rect width="2"/>');
    expect(el('g', {}, ['<a/>', '<b/>'])).toBe('<g><a/><b/></g>');
  });
  it('escapes text content', () => {
    const t = textEl('<script>', { x: 0 });
    expect(t).toBe('<text x="0">&lt;script&gt;</text>');
    expect(wellFormednessProblems(t)).toEqual([]);
  });
});

describe('text measurement', () => {
  it('grows with the string and the size', () => {
    expect(textWidth('Ada Vell', 14)).toBeGreaterThan(textWidth('Ada', 14));
    expect(textWidth('Ada', 28)).toBeCloseTo(textWidth('Ada', 14) * 2, 6);
  });
  it('treats narrow and wide glyphs differently', () => {
    expect(textWidth('iiii', 10)).toBeLessThan(textWidth('mmmm', 10));
  });
  it('falls within the range of common fonts for a known string', () => {
    // Measured for this project in Chromium with getComputedTextLength() at font-size 100:
    // 2042 units in DejaVu Sans, 1768 in a Helvetica-metric sans. The estimate must sit
    // between the two, erring towards the wider face so that labels are given room.
    const w = textWidth('weir of the long northern embankment 9', 100) / 100;
    expect(w).toBeGreaterThan(17.5);
    expect(w).toBeLessThan(21);
  });
  it('truncates with an ellipsis only when needed', () => {
    expect(truncateText('Ada', 100, 14)).toBe('Ada');
    const cut = truncateText('The Ferryman of the Lower Reach', 80, 14);
    expect(cut.endsWith('\u2026')).toBe(true);
    expect(textWidth(cut, 14)).toBeLessThanOrEqual(80);
    expect(cut).not.toMatch(/ \u2026$/);
  });
  it('wraps at spaces and says when it had to cut', () => {
    expect(wrapText('IV. A Ledger Opened', 100, 14, 2)).toEqual({ lines: ['IV. A Ledger', 'Opened'], complete: true });
    const long = wrapText('one two three four five six seven', 60, 14, 2);
    expect(long.complete).toBe(false);
    expect(long.lines).toHaveLength(2);
    expect(long.lines[1].endsWith('\u2026')).toBe(true);
  });
});

describe('hashString', () => {
  it('is FNV-1a 32-bit', () => {
    // Source: FNV test vectors (Fowler, Noll, Vo; IETF draft-eastlake-fnv), from memory:
    // FNV-1a 32 of "" = 0x811c9dc5, "a" = 0xe40c292c, "foobar" = 0xbf9cf968.
    expect(parseInt(hashString(''), 36)).toBe(0x811c9dc5);
    expect(parseInt(hashString('a'), 36)).toBe(0xe40c292c);
    expect(parseInt(hashString('foobar'), 36)).toBe(0xbf9cf968);
  });
});
