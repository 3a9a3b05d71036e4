// Sharing, end to end on a copy of the demo: link-preview tags on every page, social cards,
// chart downloads and the embed snippet; the picture cache across rebuilds.
// Tag names: The Open Graph protocol (ogp.me: og:title, og:type, og:image, og:url, og:image:width,
// og:image:height, og:image:alt, og:site_name) and Twitter's card markup (twitter:card with
// "summary_large_image"). Picture sizes are read back with sharp; SVG parsed with @xmldom/xmldom.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { parse as parseYaml } from 'yaml';
import sharp from 'sharp';
import { DOMParser } from '@xmldom/xmldom';
import { demoCopy, positionOf, replaceIn, treeHashes, vitrine } from './helpers.ts';

const { dir, plan } = demoCopy();
const dist = join(dir, 'dist');
const cache = join(dir, 'cache');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const demo = parseYaml(readFileSync(plan, 'utf8'));
const SITE: string = demo.exhibit.url;
const panels: { room: string; id: string; caption: string; chart: string }[] = demo.rooms.flatMap(
  (r: { id: string; panels: { id: string; caption: string; chart: string }[] }) => r.panels.map((p) => ({ room: r.id, ...p })),
);

function build(out = dist): string {
  const r = vitrine(['build', plan, '--out', out, '--cache', cache], dir);
  expect(r.stderr).toBe('');
  expect(r.status).toBe(0);
  return r.stdout;
}

/** The log line of the pictures: social cards drawn, chart PNGs drawn, taken from the cache. */
function pictures(stdout: string): { cards: number; charts: number; cached: number } {
  const m = /Pictures: (\d+) social cards? and (\d+) chart PNGs? drawn, (\d+) from the cache/.exec(stdout);
  expect(m, stdout).not.toBeNull();
  return { cards: Number(m![1]), charts: Number(m![2]), cached: Number(m![3]) };
}

function htmlPages(root: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (name.endsWith('.html')) out.push(p);
    }
  };
  walk(root);
  return out.sort();
}

const decode = (s: string) => s.replace(/&amp;/g, '&').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>');

function meta(html: string): Map<string, string> {
  const tags = new Map<string, string>();
  for (const m of html.matchAll(/<meta\s+(?:property|name)="((?:og|twitter):[^"]+)"\s+content="([^"]*)"\s*\/?>/g)) tags.set(m[1]!, decode(m[2]!));
  return tags;
}

/** Hashes of the PNG files of a built site, by path. */
function pngHashes(root: string): Record<string, string> {
  return Object.fromEntries(Object.entries(treeHashes(root)).filter(([p]) => p.endsWith('.png')));
}

let first = '';
beforeAll(() => {
  first = build();
});

describe('link previews', () => {
  it('every HTML page carries Open Graph and Twitter card tags with absolute addresses, pointing at a 1200×630 PNG in the site', async () => {
    const pages = htmlPages(dist);
    expect(pages.length).toBeGreaterThan(panels.length);
    for (const file of pages) {
      const rel = relative(dist, file).replace(/index\.html$/, '');
      const tags = meta(readFileSync(file, 'utf8'));
      for (const name of ['og:title', 'og:description', 'og:image', 'og:image:width', 'og:image:height', 'og:image:alt', 'og:url', 'og:type', 'og:site_name', 'twitter:card']) {
        expect(tags.get(name), `${rel}: ${name}`).toBeTruthy();
      }
      expect(tags.get('twitter:card')).toBe('summary_large_image');
      expect(tags.get('og:site_name')).toBe(demo.exhibit.title);
      if (!rel.endsWith('.html')) expect(tags.get('og:url')).toBe(new URL(rel, SITE).href);
      const image = tags.get('og:image')!;
      expect(image.startsWith(SITE), image).toBe(true);
      const png = join(dist, image.slice(SITE.length));
      expect(existsSync(png), png).toBe(true);
      const m = await sharp(png).metadata();
      expect([m.format, m.width, m.height]).toEqual(['png', 1200, 630]);
      expect([tags.get('og:image:width'), tags.get('og:image:height')]).toEqual(['1200', '630']);
    }
  });

  it('gives the home page, each room and each panel a card of its own', () => {
    const image = (page: string) => meta(readFileSync(join(dist, page, 'index.html'), 'utf8')).get('og:image');
    expect(image('')).toBe(`${SITE}card.png`);
    for (const r of demo.rooms as { id: string }[]) expect(image(r.id)).toBe(`${SITE}${r.id}/card.png`);
    for (const p of panels) expect(image(`${p.room}/${p.id}`)).toBe(`${SITE}${p.room}/${p.id}/card.png`);
    const cards = 1 + demo.rooms.length + panels.length;
    expect(pictures(first)).toEqual({ cards, charts: panels.length, cached: 0 });
  });
});

describe('panel downloads', () => {
  it('links a standalone SVG, a PNG at twice its size and an embed snippet from every panel page', async () => {
    for (const p of panels) {
      const folder = join(dist, p.room, p.id);
      const html = readFileSync(join(folder, 'index.html'), 'utf8');
      expect(html).toMatch(new RegExp(`<a href="/${p.room}/${p.id}/chart\\.svg" download="${p.id}\\.svg">SVG</a>`));
      expect(html).toMatch(new RegExp(`<a href="/${p.room}/${p.id}/chart\\.png" download="${p.id}\\.png">PNG</a>`));
      const svg = readFileSync(join(folder, 'chart.svg'), 'utf8');
      const errors: string[] = [];
      const doc = new DOMParser({ onError: (level, msg) => { if (level !== 'warning') errors.push(msg); } }).parseFromString(svg, 'image/svg+xml');
      expect(errors).toEqual([]);
      const root = doc.documentElement!;
      expect(root.namespaceURI).toBe('http://www.w3.org/2000/svg');
      expect(root.getElementsByTagName('title')[0]!.textContent).toBeTruthy();
      expect(svg).toContain(`${SITE}${p.room}/${p.id}/`);
      expect(svg).not.toMatch(/var\(--/);
      const png = await sharp(join(folder, 'chart.png')).metadata();
      expect([png.width, png.height]).toEqual([Number(root.getAttribute('width')) * 2, Number(root.getAttribute('height')) * 2]);
      // The snippet, shown as text in a read-only field: selectable without any script.
      const area = /<textarea id="embed-snippet" readonly[^>]*>([\s\S]*?)<\/textarea>/.exec(html);
      expect(area).not.toBeNull();
      const snippet = decode(area![1]!);
      expect(snippet).toMatch(/^<figure>\n<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
      expect(snippet).toContain(`<a href="${SITE}${p.room}/${p.id}/">`);
    }
    expect(htmlPages(dist).every((f) => !/<script/.test(readFileSync(f, 'utf8')))).toBe(true);
  });
});

describe('the picture cache', () => {
  it('redraws no picture when only a caption changed, and exactly the changed chart’s card and PNG when a chart option changed', () => {
    const store = join(cache, 'pictures');
    const stamps = () => Object.fromEntries(readdirSync(store).map((f) => [f, statSync(join(store, f)).mtimeMs]));
    const before = stamps();
    const pngs = pngHashes(dist);

    const caption = join(dir, 'content', panels[0]!.caption);
    replaceIn(caption, '\n', '\n\nA sentence the curator added.\n');
    const second = build();
    expect(pictures(second)).toEqual({ cards: 0, charts: 0, cached: Object.keys(pngs).length });
    expect(stamps()).toEqual(before);
    expect(pngHashes(dist)).toEqual(pngs);
    expect(readFileSync(join(dist, panels[0]!.room, panels[0]!.id, 'index.html'), 'utf8')).toContain('A sentence the curator added.');

    // A chart option of a panel that is not the first of its room (the room and home cards show first panels).
    const target = panels.find((p, i) => p.chart === 'bars' && i > 0 && panels[i - 1]!.room === p.room)!;
    const text = readFileSync(plan, 'utf8');
    const start = text.indexOf(`      - id: ${target.id}\n`);
    const from = text.indexOf('        chart: bars\n', start);
    expect(text.slice(start + `      - id: ${target.id}\n`.length, from)).not.toMatch(/- id:|options:/);
    writeFileSync(plan, `${text.slice(0, from)}        chart: bars\n        options: { labels: false }\n${text.slice(from + '        chart: bars\n'.length)}`);
    const third = build();
    expect(pictures(third)).toEqual({ cards: 1, charts: 1, cached: Object.keys(pngs).length - 2 });
    const after = pngHashes(dist);
    const changed = Object.keys(after).filter((p) => after[p] !== pngs[p]).sort();
    expect(changed).toEqual([`${target.room}/${target.id}/card.png`, `${target.room}/${target.id}/chart.png`]);
  });
});

describe('without a public address', () => {
  it('check warns at the exhibit, and pages leave out the tags that need an address', () => {
    const { dir: bare, plan: barePlan } = demoCopy();
    try {
      replaceIn(barePlan, `  url: ${SITE}\n`, '');
      const at = positionOf(barePlan, 'exhibit:\n  title:');
      const check = vitrine(['check', barePlan, '--quiet'], bare);
      expect(check.status).toBe(0);
      expect(check.stderr).toContain(`exhibit.yaml:${at.line}:${at.column} exhibit: warning:`);
      expect(check.stderr).toMatch(/no public address \("url"\)/);
      const r = vitrine(['build', barePlan, '--out', join(bare, 'dist'), '--quiet', '--cache', cache], bare);
      expect(r.status).toBe(0);
      const tags = meta(readFileSync(join(bare, 'dist', panels[0]!.room, panels[0]!.id, 'index.html'), 'utf8'));
      expect(tags.get('og:title')).toBeTruthy();
      expect(tags.get('twitter:card')).toBe('summary');
      expect([tags.get('og:image'), tags.get('og:url')]).toEqual([undefined, undefined]);
      // The cards are drawn all the same, and the downloads carry no address.
      expect(existsSync(join(bare, 'dist', 'card.png'))).toBe(true);
      expect(readFileSync(join(bare, 'dist', panels[0]!.room, panels[0]!.id, 'chart.svg'), 'utf8')).not.toContain('https://');
    } finally {
      rmSync(bare, { recursive: true, force: true });
    }
  });
});
