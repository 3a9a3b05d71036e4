import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { parse as parseYaml } from 'yaml';
import { ROOT, demoCopy, positionOf, replaceIn, treeHashes, vitrine } from './helpers.ts';

const scratch: string[] = [];
afterAll(() => {
  for (const d of scratch) rmSync(d, { recursive: true, force: true });
});
function copy() {
  const c = demoCopy();
  scratch.push(c.dir);
  return c;
}

const demoPlan = parseYaml(readFileSync(join(ROOT, 'content/exhibit.yaml'), 'utf8'));
const demoPanels: { room: string; id: string; measure: string; caption: string }[] = demoPlan.rooms.flatMap(
  (r: { id: string; panels: { id: string; measure: string; caption: string }[] }) => r.panels.map((p) => ({ room: r.id, ...p })),
);

describe('vitrine check', () => {
  it('passes on the demo exhibit and prints its chapters with titles, words, paragraphs and cast mentions', () => {
    const r = vitrine(['check', 'content/exhibit.yaml']);
    expect(r.stderr).not.toMatch(/error/i);
    expect(r.status).toBe(0);
    const chapters = r.stdout.split('\n').filter((l) => /^\s+\d+\. .+\(\d[\d,]* words, \d[\d,]* paragraphs?\)$/.test(l));
    expect(chapters.length).toBeGreaterThanOrEqual(4);
    expect(r.stdout).toMatch(/Cast mentions:/);
    expect(r.stdout).toMatch(/ready to build/);
  });

  it('reports a misspelt measure at its line and column, with the nearest name', () => {
    const { plan } = copy();
    const at = replaceIn(plan, 'measure: presence', 'measure: presense');
    const r = vitrine(['check', plan]);
    expect(r.status).toBe(1);
    const col = at.column + 'measure: '.length;
    expect(r.stderr).toMatch(new RegExp(`exhibit\\.yaml:${at.line}:${col} rooms\\[\\d+\\]\\.panels\\[\\d+\\]\\.measure: unknown measure "presense" — did you mean "presence"\\?`));
  });

  it('reports a YAML syntax error with file:line:col', () => {
    const { plan } = copy();
    const text = readFileSync(plan, 'utf8');
    const lines = text.split('\n');
    const i = lines.findIndex((l) => /^\s+title:/.test(l));
    lines[i] = lines[i]!.replace('title: ', 'title: "');
    writeFileSync(plan, lines.join('\n'));
    const r = vitrine(['check', plan]);
    expect(r.status).toBe(1);
    // The unclosed quotation mark is reported on the line where it opens.
    expect(r.stderr).toMatch(new RegExp(`exhibit\\.yaml:${i + 1}:\\d+`));
  });

  it('reports a missing caption file and a text path outside the exhibit folder, together', () => {
    const { dir, plan } = copy();
    const caption = demoPanels[0]!.caption;
    rmSync(join(dir, 'content', caption));
    const src = parseYaml(readFileSync(plan, 'utf8')).texts[0].source as string;
    const at = replaceIn(plan, `source: ${src}`, 'source: ../secret.txt');
    writeFileSync(join(dir, 'secret.txt'), 'A file beside the exhibit folder.\n');
    const cap = positionOf(plan, `caption: ${caption}`);
    const r = vitrine(['check', plan]);
    expect(r.status).toBe(1);
    const lines = r.stderr.split('\n');
    expect(lines.some((l) => l.includes(`exhibit.yaml:${at.line}:${at.column + 'source: '.length}`) && /inside/.test(l))).toBe(true);
    expect(lines.some((l) => l.includes(`exhibit.yaml:${cap.line}:${cap.column + 'caption: '.length}`))).toBe(true);
  });
});

describe('vitrine check: dialogue pins and word lists', () => {
  it('reports a pin that matches no quotation, at the pin in the plan', () => {
    const { plan } = copy();
    const text = readFileSync(plan, 'utf8');
    if (/\n    dialogue:\n      pins:\n/.test(text)) {
      writeFileSync(plan, text.replace(/\n      pins:\n/, '\n      pins:\n        - { chapter: 2, startsWith: "No such words are spoken", speaker: tamsin }\n'));
    } else {
      replaceIn(plan, '    edition:', '    dialogue:\n      pins:\n        - { chapter: 2, startsWith: "No such words are spoken", speaker: tamsin }\n    edition:');
    }
    const r = vitrine(['check', plan]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/exhibit\.yaml:\d+:\d+ texts\[0\]\.dialogue\.pins\[0\]: .*No such words are spoken/);
  });

  it('reports a malformed word list line with its position', () => {
    const { dir, plan } = copy();
    const list = parseYaml(readFileSync(plan, 'utf8')).lexicons?.[0]?.file as string | undefined;
    expect(list).toBeDefined();
    writeFileSync(join(dir, 'content', list!), 'word\tcategory\nflood\tfear\nthis line has no tab\n');
    const r = vitrine(['check', plan]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(new RegExp(`${list!.replace(/[./]/g, '\\$&')}:3(:\\d+)?`));
  });
});

describe('vitrine measure', () => {
  it('prints the data behind a panel as JSON and CSV', () => {
    const panel = demoPanels.find((p) => p.measure === 'structure')!;
    const json = vitrine(['measure', 'content/exhibit.yaml', '--panel', panel.id]);
    expect(json.status).toBe(0);
    const data = JSON.parse(json.stdout);
    expect(data.chapters.length).toBeGreaterThanOrEqual(4);
    const csv = vitrine(['measure', 'content/exhibit.yaml', '--panel', panel.id, '--format', 'csv']);
    expect(csv.status).toBe(0);
    // RFC 4180: records end in CRLF; one header record, then one per chapter.
    expect(csv.stdout.split('\r\n').filter(Boolean).length).toBe(data.chapters.length + 1);
  });

  it('runs ad hoc on a text without a plan, with the documented JSON shapes', () => {
    const dir = mkdtempSync(join(tmpdir(), 'vitrine-adhoc-'));
    scratch.push(dir);
    const text = join(dir, 'tale.txt');
    writeFileSync(
      text,
      'CHAPTER I.\n\nMilo Brack rowed out. Milo sang.\n\nCHAPTER II.\n\nNessa Quill waited on the bank. Brack came late.\n\nCHAPTER III.\n\nNessa and Milo walked home.\n',
    );
    const cast = join(dir, 'cast.yaml');
    writeFileSync(cast, '- id: milo\n  name: Milo Brack\n  pronoun: he\n- id: nessa\n  name: Nessa Quill\n  aliases: [Nessa]\n  pronoun: she\n');
    const s = vitrine(['measure', '--text', text, '--measure', 'structure', '--format', 'json']);
    expect(s.status).toBe(0);
    const structure = JSON.parse(s.stdout);
    expect(structure.chapters.map((c: { words: number }) => c.words)).toEqual([6, 9, 5]);
    expect(Object.keys(structure.chapters[0])).toEqual(expect.arrayContaining(['title', 'words', 'paragraphs', 'sentences']));
    const p = vitrine(['measure', '--text', text, '--cast', cast, '--measure', 'presence']);
    expect(p.status).toBe(0);
    const presence = JSON.parse(p.stdout);
    const milo = presence.characters.find((c: { id: string }) => c.id === 'milo');
    expect(milo.mentions).toBe(4);
    expect(milo.perChapter).toEqual([2, 1, 1]);
    const bad = vitrine(['measure', '--text', text, '--measure', 'presense']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/did you mean "presence"/);
  });
});

describe('vitrine build', () => {
  let out: string;
  let cacheDir: string;
  beforeAll(() => {
    const dir = mkdtempSync(join(tmpdir(), 'vitrine-build-'));
    scratch.push(dir);
    out = join(dir, 'dist');
    cacheDir = join(dir, 'cache');
    const r = vitrine(['build', 'content/exhibit.yaml', '--out', out, '--quiet', '--cache', cacheDir], ROOT);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
  });

  it('writes a home page, a page per room and per panel, with chart, caption, method card, table and downloads', () => {
    expect(existsSync(join(out, 'index.html'))).toBe(true);
    expect(existsSync(join(out, 'methods/index.html'))).toBe(true);
    for (const room of demoPlan.rooms as { id: string }[]) expect(existsSync(join(out, room.id, 'index.html'))).toBe(true);
    for (const p of demoPanels) {
      const html = readFileSync(join(out, p.room, p.id, 'index.html'), 'utf8');
      expect(html).toMatch(/<svg[^>]*role="img"[^>]*data-chart="[a-z]+"/);
      expect(html).toMatch(/<title id="[^"]+">/);
      expect(html).toMatch(/class="caption prose"/);
      expect(html).toMatch(/class="method-card"/);
      expect(html).toMatch(/<table class="data"/);
      expect(readFileSync(join(out, p.room, p.id, 'data.csv'), 'utf8').split('\r\n').length).toBeGreaterThan(2);
      expect(JSON.parse(readFileSync(join(out, p.room, p.id, 'data.json'), 'utf8')).measure).toBe(p.measure);
    }
  });

  it('publishes the text: a contents page and a page per chapter, its paragraphs numbered as vitrine check counts them', () => {
    const check = vitrine(['check', 'content/exhibit.yaml']);
    const counted = [...check.stdout.matchAll(/^\s+(\d+)\. .+\(\d[\d,]* words, (\d[\d,]*) paragraphs?\)$/gm)].map((m) => [Number(m[1]), Number(m[2]!.replace(/,/g, ''))]);
    expect(counted.length).toBe(6);
    const contents = readFileSync(join(out, 'texts/lamps/index.html'), 'utf8');
    for (const [chapter, paragraphs] of counted) {
      expect(contents).toContain(`href="/texts/lamps/${chapter}/"`);
      const page = readFileSync(join(out, `texts/lamps/${chapter}/index.html`), 'utf8');
      const ids = [...page.matchAll(/<div class="para" id="p(\d+)"/g)].map((m) => Number(m[1]));
      expect(ids).toEqual(Array.from({ length: paragraphs! }, (_, k) => k + 1));
    }
    // The home page keeps its promise, and the About page links the text.
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toContain('href="/texts/lamps/"');
    expect(readFileSync(join(out, 'about/index.html'), 'utf8')).toContain('href="/texts/lamps/"');
  });

  it('draws identical SVG on a second build (determinism)', () => {
    const again = join(out, '..', 'again');
    const r = vitrine(['build', 'content/exhibit.yaml', '--out', again, '--quiet', '--cache', cacheDir], ROOT);
    expect(r.status).toBe(0);
    const svgs = (dir: string) =>
      demoPanels.map((p) => readFileSync(join(dir, p.room, p.id, 'index.html'), 'utf8').match(/<svg[\s\S]*?<\/svg>/g)!.join('\n'));
    expect(svgs(again)).toEqual(svgs(out));
  });

  it('recomputes nothing when only a caption changed', () => {
    const { dir, plan } = copy();
    const first = vitrine(['build', plan, '--out', join(dir, 'dist'), '--cache', join(dir, 'cache')], dir);
    expect(first.status).toBe(0);
    expect(first.stdout).toMatch(/[1-9]\d* computed/);
    // The build marks its folder, so the next build may replace it.
    expect(readFileSync(join(dir, 'dist', '.vitrine-build'), 'utf8')).toMatch(/^vitrine build output\n/);
    const caption = join(dir, 'content', demoPanels[0]!.caption);
    writeFileSync(caption, readFileSync(caption, 'utf8') + '\nA sentence added by the curator.\n');
    const second = vitrine(['build', plan, '--out', join(dir, 'dist'), '--cache', join(dir, 'cache')], dir);
    expect(second.status).toBe(0);
    expect(second.stdout).toMatch(/ 0 computed, \d+ from the cache/);
    expect(readFileSync(join(dir, 'dist', demoPanels[0]!.room, demoPanels[0]!.id, 'index.html'), 'utf8')).toContain('A sentence added by the curator.');
  });

  it('leaves an existing dist/ byte-for-byte unchanged when a build fails, at the plan or in the site build', () => {
    const { dir, plan } = copy();
    const dist = join(dir, 'dist');
    expect(vitrine(['build', plan, '--out', dist, '--quiet'], dir).status).toBe(0);
    const before = treeHashes(dist);
    // A plan error: stopped before the site build.
    const text = readFileSync(plan, 'utf8');
    replaceIn(plan, 'chart: bars', 'chart: barz');
    const r1 = vitrine(['build', plan, '--out', dist], dir);
    expect(r1.status).toBe(1);
    expect(r1.stderr).toMatch(/unchanged/);
    expect(treeHashes(dist)).toEqual(before);
    // A caption that passes the plan check but breaks the MDX compiler: the site build itself fails.
    writeFileSync(plan, text);
    writeFileSync(join(dir, 'content', demoPanels[1]!.caption), 'An unclosed element <div>\n\n{broken\n');
    const r2 = vitrine(['build', plan, '--out', dist], dir);
    expect(r2.status).toBe(1);
    expect(treeHashes(dist)).toEqual(before);
  });

  it('respects a base path: every internal link starts with it', () => {
    const { dir, plan } = copy();
    const dist = join(dir, 'dist');
    expect(vitrine(['build', plan, '--out', dist, '--quiet', '--base', '/society/exhibit/'], dir).status).toBe(0);
    const html = readFileSync(join(dist, 'index.html'), 'utf8');
    const hrefs = [...html.matchAll(/href="([^"#]+)"/g)].map((m) => m[1]!).filter((h) => !/^[a-z]+:/.test(h));
    expect(hrefs.length).toBeGreaterThan(5);
    expect(hrefs.filter((h) => !h.startsWith('/society/exhibit/'))).toEqual([]);
  });
});
