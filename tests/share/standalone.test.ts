// Standalone chart files and embed snippets. Well-formedness and namespaces are checked with
// @xmldom/xmldom, a general-purpose XML parser from npm (XML 1.0 and Namespaces in XML); the SVG
// namespace URI is the one SVG 1.1/2 define. The typefaces named are those of the site's CSS.
import { describe, expect, it } from 'vitest';
import { DOMParser } from '@xmldom/xmldom';
import { charts } from '../../pipeline/charts/index.ts';
import { chapterWordsBars, notes } from '../charts/fixtures.ts';
import { embedSnippet, panelCredit, standaloneSvg, viewBoxSize, withNamedFonts } from '../../pipeline/share/standalone.ts';
import { absoluteUrl, cardPath, chartPngPath, chartSvgPath, pagePath, sitePath } from '../../pipeline/share/addresses.ts';

const SVG_NS = 'http://www.w3.org/2000/svg';
const chart = charts.bars!.render(chapterWordsBars as never, {}, undefined, notes);
const credit = { exhibit: 'The Saltmarsh Ledger', organiser: 'The Wending Reach Society', url: 'https://ledger.example.org/shape/lengths/' };

function parse(xml: string, type: 'image/svg+xml' | 'text/html' = 'image/svg+xml') {
  const errors: string[] = [];
  const doc = new DOMParser({ onError: (level, msg) => { if (level !== 'warning') errors.push(msg); } }).parseFromString(xml, type);
  return { doc, errors };
}

describe('standaloneSvg', () => {
  const file = standaloneSvg(chart.svg, credit, 'en');
  const { doc, errors } = parse(file);
  const root = doc.documentElement!;

  it('is well-formed XML with an XML declaration and an <svg> root in the SVG namespace, with its own size', () => {
    expect(errors).toEqual([]);
    expect(file.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<svg ')).toBe(true);
    expect(root.localName).toBe('svg');
    expect(root.namespaceURI).toBe(SVG_NS);
    const { width, height } = viewBoxSize(chart.svg);
    expect(Number(root.getAttribute('width'))).toBe(width);
    expect(Number(root.getAttribute('height'))).toBeGreaterThan(height);
    expect(root.getAttribute('viewBox')).toBe(`0 0 ${width} ${root.getAttribute('height')}`);
    expect(root.getAttribute('xml:lang')).toBe('en');
  });

  it('keeps the chart’s title, description and the labels that point at them', () => {
    const [titleId, descId] = root.getAttribute('aria-labelledby')!.split(' ');
    const byId = (id: string) => Array.from(doc.getElementsByTagName('*')).find((e) => e.getAttribute('id') === id);
    expect(byId(titleId!)!.localName).toBe('title');
    expect(byId(titleId!)!.textContent).toBe(chapterWordsBars.title);
    expect(byId(descId!)!.textContent).toBe(chart.alt);
    expect(root.getAttribute('role')).toBe('img');
  });

  it('names its typefaces, with fallbacks and a generic family, instead of the page’s CSS variables', () => {
    expect(file).not.toMatch(/var\(/);
    const families = [...file.replaceAll('&apos;', "'").matchAll(/font-family:([^;"]+)/g)].map((m) => m[1]);
    expect(new Set(families)).toEqual(new Set(["'Source Sans 3', 'Helvetica Neue', Arial, sans-serif", "'Source Serif 4', Georgia, 'Times New Roman', serif"]));
  });

  it('carries the credit inside the drawing: exhibit, organiser, panel address', () => {
    const credit = Array.from(doc.getElementsByTagName('g')).find((g) => g.getAttribute('class') === 'vt-credit')!;
    const lines = Array.from(credit.getElementsByTagName('text')).map((t) => t.textContent);
    expect(lines).toEqual(['The Saltmarsh Ledger · The Wending Reach Society', 'https://ledger.example.org/shape/lengths/']);
    // The band lies below the chart, inside the drawing.
    const y = Number(credit.getElementsByTagName('rect')[0]!.getAttribute('y'));
    expect(y).toBe(viewBoxSize(chart.svg).height);
  });

  it('escapes what the curators wrote and leaves out the address when there is none', () => {
    const hostile = { exhibit: 'Tides & <Tallies> "of" the Reach', organiser: "Bram's <script>", url: null };
    const out = standaloneSvg(chart.svg, hostile);
    const p = parse(out);
    expect(p.errors).toEqual([]);
    const texts = Array.from(p.doc.getElementsByTagName('g')).find((g) => g.getAttribute('class') === 'vt-credit')!.getElementsByTagName('text');
    expect(Array.from(texts).map((t) => t.textContent)).toEqual([`Tides & <Tallies> "of" the Reach · Bram's <script>`]);
    expect(out).not.toContain('<script>');
  });
});

describe('embedSnippet', () => {
  const html = embedSnippet({ svg: chart.svg, title: 'How long is each entry?', credit });
  it('is a figure with the chart, the title linking back, and the credit; no script, nothing to fetch', () => {
    const { doc, errors } = parse(html, 'text/html');
    expect(errors).toEqual([]);
    const figure = doc.getElementsByTagName('figure')[0]!;
    expect(figure.getElementsByTagName('svg').length).toBe(1);
    const link = figure.getElementsByTagName('a')[0]!;
    expect(link.getAttribute('href')).toBe(credit.url);
    expect(link.textContent).toBe('How long is each entry?');
    expect(figure.getElementsByTagName('figcaption')[0]!.textContent).toBe(
      'How long is each entry? — from The Saltmarsh Ledger, The Wending Reach Society.',
    );
    expect(html).not.toMatch(/<script|<link|<img|<iframe|\bsrc=|url\(/i);
    // It shrinks to a narrower column.
    expect(figure.getElementsByTagName('svg')[0]!.getAttribute('style')).toBe('max-width:100%;height:auto');
  });
});

describe('addresses', () => {
  it('puts cards and downloads beside the pages they belong to', () => {
    expect([cardPath(), cardPath('shape'), cardPath('shape', 'lengths')]).toEqual(['card.png', 'shape/card.png', 'shape/lengths/card.png']);
    expect([chartSvgPath('shape', 'lengths'), chartPngPath('shape', 'lengths'), pagePath('shape', 'lengths')]).toEqual([
      'shape/lengths/chart.svg',
      'shape/lengths/chart.png',
      'shape/lengths/',
    ]);
  });

  it('makes absolute addresses under the public address, whatever base path the build was served from', () => {
    expect(absoluteUrl('https://ledger.example.org/quay/', 'shape/card.png')).toBe('https://ledger.example.org/quay/shape/card.png');
    expect(absoluteUrl('https://ledger.example.org/quay/', '')).toBe('https://ledger.example.org/quay/');
    expect(sitePath('/preview/shape/lengths/', '/preview/')).toBe('shape/lengths/');
    expect(sitePath('/shape/', '/')).toBe('shape/');
    const e = { exhibit: { title: 'T', organiser: 'O', url: 'https://ledger.example.org/quay/' } };
    expect(panelCredit(e as never, 'shape', 'lengths').url).toBe('https://ledger.example.org/quay/shape/lengths/');
    expect(panelCredit({ exhibit: { ...e.exhibit, url: null } } as never, 'shape', 'lengths').url).toBeNull();
  });

  it('replaces only the theme’s own font stacks', () => {
    expect(withNamedFonts('<text style="font-family:Courier">x</text>')).toBe('<text style="font-family:Courier">x</text>');
  });
});
