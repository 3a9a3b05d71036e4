/**
 * npm run bench [-- --json]
 *
 * Speed figures, each measured side by side with a reference in the same run,
 * so the ratios hold on any machine:
 *   1. text model: tokens per second of buildTextModel on a large text, beside
 *      one plain regex tokenising pass over the same text;
 *   2. site build: the demo exhibit built by `vitrine build`, beside a bare
 *      Astro build of as many trivial pages, each with an inline SVG;
 *   and the share pictures: the demo's social cards and chart PNGs drawn with an
 *      empty cache (cold), then taken from the cache (warm), per picture.
 * The large text is the King James Bible from Debian's bible-kjv package
 * (public domain, ~790k words) when installed, else a generated text of the
 * same size made from the demo text.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { tmpdir } from 'node:os';
import { buildTextModel } from '../pipeline/text/build.ts';
import { findMentions } from '../pipeline/text/mentions.ts';
import type { CastMember } from '../pipeline/text/model.ts';
import { measures } from '../pipeline/measures/registry.ts';
import type { MeasureContext } from '../pipeline/measures/types.ts';
import { tagModel } from '../pipeline/nlp/tag.ts';
import { wink } from '../pipeline/nlp/wink.ts';
import type { ItsFunction } from 'wink-nlp';
import { prepareExhibit } from '../pipeline/exhibit.ts';
import { writeSharePictures } from '../pipeline/stages/share.ts';

const json = process.argv.includes('--json');
const root = resolve(import.meta.dirname, '..');
const scratchBase = existsSync('/dev/shm') ? '/dev/shm' : tmpdir();
const figures: Record<string, unknown> = {};
const say = (s: string) => {
  if (!json) console.log(s);
};

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

function time(fn: () => void, runs: number): number {
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const a = performance.now();
    fn();
    t.push(performance.now() - a);
  }
  return median(t) / 1000;
}

function largeText(): { text: string; source: string } {
  try {
    const text = execFileSync('bible', ['-f', 'gen1:1-rev22:21'], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024, stdio: ['ignore', 'pipe', 'ignore'] });
    if (text.length > 1_000_000) {
      // Each verse is a line ("Ge1:1 In the beginning…"); a heading line before each first verse
      // gives the reader its 1,189 chapters, and blank lines make each verse a paragraph.
      let n = 0;
      const chaptered = text.replace(/^(\S+?)(\d+):(\d+) /gm, (_m, book: string, ch: string, verse: string) =>
        verse === '1' ? `\nCHAPTER ${++n}.\n\n${book}${ch}:${verse} ` : `\n${book}${ch}:${verse} `,
      );
      return { text: chaptered, source: 'bible-kjv (Debian package), gen1:1–rev22:21, a heading before each chapter' };
    }
  } catch {
    // Not installed: fall back below.
  }
  const demo = readFileSync(join(root, 'content/texts/the-lamps-of-wendle-staithe.txt'), 'utf8');
  const parts: string[] = [];
  let words = 0;
  for (let i = 1; words < 790_000; i++) {
    parts.push(`CHAPTER ${i}.\n\n${demo}`);
    words += demo.split(/\s+/).length;
  }
  return { text: parts.join('\n\n'), source: 'generated: the demo text repeated to ~790k words (install bible-kjv for a real text)' };
}

const large = largeText();

// 1. Text model against one regex pass.
{
  const { text, source } = large;
  const wordRe = /[\p{L}\p{N}]+(?:['’-][\p{L}\p{N}]+)*/gu;
  let regexTokens = 0;
  const regexSeconds = time(() => {
    regexTokens = text.match(wordRe)?.length ?? 0;
  }, 5);
  let modelTokens = 0;
  const heapBefore = process.memoryUsage().heapUsed;
  const modelSeconds = time(() => {
    modelTokens = buildTextModel(text, { id: 'bench' }).tokens.count;
  }, 3);
  const heapAfter = process.memoryUsage().heapUsed;
  figures.textModel = {
    source,
    characters: text.length,
    regexTokens,
    modelTokens,
    regexSeconds: round(regexSeconds),
    modelSeconds: round(modelSeconds),
    modelTokensPerSecond: Math.round(modelTokens / modelSeconds),
    ratio: round(modelSeconds / regexSeconds),
    heapDeltaMB: round((heapAfter - heapBefore) / 1e6),
  };
  say(`Text model on ${source}`);
  say(`  ${text.length.toLocaleString('en-GB')} characters, ${modelTokens.toLocaleString('en-GB')} tokens (regex pass: ${regexTokens.toLocaleString('en-GB')})`);
  say(`  regex pass ${regexSeconds.toFixed(3)} s · text model ${modelSeconds.toFixed(3)} s · ${Math.round(modelTokens / modelSeconds).toLocaleString('en-GB')} tokens/s · ratio ${(modelSeconds / regexSeconds).toFixed(1)}×`);
}

// 2. Every measure on the large text: the counting measures against the regex pass,
//    everything with parts of speech against wink-nlp's own tokenise-and-tag pass.
{
  const { text } = large;
  const wordRe = /[\p{L}\p{N}]+(?:['’-][\p{L}\p{N}]+)*/gu;
  const regexSeconds = time(() => void text.match(wordRe), 5);
  const t0 = performance.now();
  const model = buildTextModel(text, { id: 'bench' });
  const modelSeconds = (performance.now() - t0) / 1000;
  // Characters of the reference text, for the measures that read a cast.
  const cast: CastMember[] = large.source.startsWith('bible')
    ? [
        { id: 'moses', name: 'Moses', aliases: [], pronoun: 'he' },
        { id: 'david', name: 'David', aliases: [], pronoun: 'he' },
        { id: 'jesus', name: 'Jesus', aliases: [], pronoun: 'he' },
        { id: 'paul', name: 'Paul', aliases: [], pronoun: 'he' },
      ]
    : [
        { id: 'tamsin', name: 'Tamsin Rook', aliases: ['Tamsin'], pronoun: 'she' },
        { id: 'abel', name: 'Abel Hask', aliases: ['Abel', 'the ferryman'], pronoun: 'he' },
      ];
  const ctx: MeasureContext = { model, cast, mentions: findMentions(model, cast), language: 'en' };
  const node = large.source.startsWith('bible') ? 'light' : 'water';
  const counting: [string, Record<string, unknown>][] = [
    ['frequency', {}],
    ['keyness', { target: 'each-chapter' }],
    ['dispersion', {}],
    ['collocates', { node }],
    ['concordance', { node }],
    ['continuations', { phrase: `the ${node}` }],
    ['readability', {}],
    ['diversity', {}],
    ['sentiment', {}],
    ['repetition', {}],
  ];
  const withPos: [string, Record<string, unknown>][] = [
    ['frequency', { unit: 'lemma', pos: ['NOUN'] }],
    ['surroundings', {}],
  ];
  const timings: Record<string, number> = {};
  const runMeasure = (name: string, params: Record<string, unknown>): number => {
    const m = measures[name]!;
    const parsed = m.params.parse(params);
    const a = performance.now();
    m.compute(ctx, parsed);
    return (performance.now() - a) / 1000;
  };
  let countingSeconds = modelSeconds;
  for (const [name, params] of counting) {
    const sec = runMeasure(name, params);
    timings[name] = round(sec);
    countingSeconds += sec;
  }
  // wink-nlp's own pass over the same text, then our tagging and the measures that use it.
  const { nlp, its } = wink();
  const w0 = performance.now();
  nlp.readDoc(text).tokens().out(its.pos as ItsFunction<string>);
  const winkSeconds = (performance.now() - w0) / 1000;
  const g0 = performance.now();
  tagModel(model);
  const tagSeconds = (performance.now() - g0) / 1000;
  let posSeconds = tagSeconds;
  for (const [name, params] of withPos) {
    const sec = runMeasure(name, params);
    timings[`${name} (${Object.keys(params).join(', ') || 'parts of speech'})`] = round(sec);
    posSeconds += sec;
  }
  const everything = countingSeconds + posSeconds;
  const peakMB = Math.round(process.resourceUsage().maxRSS / 1024);
  figures.measures = {
    regexSeconds: round(regexSeconds),
    modelSeconds: round(modelSeconds),
    timings,
    countingSeconds: round(countingSeconds),
    countingRatio: round(countingSeconds / regexSeconds),
    winkSeconds: round(winkSeconds),
    tagSeconds: round(tagSeconds),
    everythingSeconds: round(everything),
    everythingRatio: round(everything / winkSeconds),
    peakMB,
  };
  say('Measures on the same text');
  for (const [name, sec] of Object.entries(timings)) say(`  ${name.padEnd(34)} ${sec.toFixed(3)} s`);
  say(`  text model + counting measures ${countingSeconds.toFixed(2)} s = ${(countingSeconds / regexSeconds).toFixed(1)}× the regex pass (target ≤ 25×)`);
  say(`  wink-nlp tokenise-and-tag pass ${winkSeconds.toFixed(2)} s; our tagging ${tagSeconds.toFixed(2)} s`);
  say(`  everything incl. parts of speech ${everything.toFixed(2)} s = ${(everything / winkSeconds).toFixed(2)}× wink's pass (target ≤ 4×)`);
  say(`  peak memory ${peakMB} MB (target < 1,500 MB)`);
}

// 3. Demo build against a bare Astro build of as many pages.
{
  const scratch = mkdtempSync(join(scratchBase, 'vitrine-bench-'));
  try {
    const out = join(scratch, 'demo');
    const cache = join(scratch, 'cache');
    const run = (args: string[], env: Record<string, string> = {}) => {
      const a = performance.now();
      const r = spawnSync('node', args, { cwd: root, env: { ...process.env, ...env, ASTRO_TELEMETRY_DISABLED: '1' }, encoding: 'utf8' });
      if (r.status !== 0) throw new Error(`${args.join(' ')} failed:\n${r.stdout}\n${r.stderr}`);
      return (performance.now() - a) / 1000;
    };
    // A first build fills the cache; the timed builds are warm, as after a caption edit.
    run(['bin/vitrine.mjs', 'build', '--quiet', '--out', out, '--cache', cache]);
    const pages = countPages(out);
    const demoSeconds = median([0, 1, 2].map(() => run(['bin/vitrine.mjs', 'build', '--quiet', '--out', out, '--cache', cache])));
    const bare = join(scratch, 'bare');
    makeBareProject(bare, pages);
    const bareSeconds = median([0, 1, 2].map(() => run([join(root, 'node_modules/astro/bin/astro.mjs'), 'build', '--root', bare, '--silent'])));
    figures.siteBuild = { pages, demoSeconds: round(demoSeconds), bareAstroSeconds: round(bareSeconds), ratio: round(demoSeconds / bareSeconds) };
    say(`Site build (${pages} HTML pages, warm cache, output on ${scratchBase})`);
    say(`  vitrine build ${demoSeconds.toFixed(2)} s · bare Astro build ${bareSeconds.toFixed(2)} s · ratio ${(demoSeconds / bareSeconds).toFixed(2)}×`);
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

// 4. Share pictures: drawing every card and chart PNG, then copying them from the cache.
{
  const scratch = mkdtempSync(join(scratchBase, 'vitrine-bench-'));
  try {
    const prepared = (await prepareExhibit(join(root, 'content/exhibit.yaml'), { cacheDir: join(scratch, 'cache') })).prepared!;
    const cold = await writeSharePictures(prepared, join(scratch, 'cold'), join(scratch, 'cache'));
    const warm = await writeSharePictures(prepared, join(scratch, 'warm'), join(scratch, 'cache'));
    const n = cold.cards.drawn + cold.charts.drawn;
    figures.pictures = {
      cards: cold.cards.drawn,
      chartPngs: cold.charts.drawn,
      coldSeconds: round(cold.seconds),
      coldMsPerPicture: round((cold.seconds * 1000) / n),
      warmSeconds: round(warm.seconds),
      warmMsPerPicture: round((warm.seconds * 1000) / n),
      warmDrawn: warm.cards.drawn + warm.charts.drawn,
    };
    say(`Share pictures (${cold.cards.drawn} social cards, ${cold.charts.drawn} chart PNGs)`);
    say(`  cold ${cold.seconds.toFixed(2)} s = ${((cold.seconds * 1000) / n).toFixed(1)} ms a picture · warm ${warm.seconds.toFixed(3)} s = ${((warm.seconds * 1000) / n).toFixed(2)} ms a picture (${warm.cards.drawn + warm.charts.drawn} redrawn)`);
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

if (json) console.log(JSON.stringify(figures));

function round(x: number): number {
  return Math.round(x * 1000) / 1000;
}

function countPages(dir: string): number {
  const r = spawnSync('find', [dir, '-name', 'index.html'], { encoding: 'utf8' });
  return r.stdout.trim().split('\n').filter(Boolean).length;
}

/** A bare Astro project with `pages` static pages, each holding a 200-element inline SVG. */
function makeBareProject(dir: string, pages: number): void {
  mkdirSync(join(dir, 'src/pages'), { recursive: true });
  symlinkSync(join(root, 'node_modules'), join(dir, 'node_modules'));
  writeFileSync(join(dir, 'astro.config.mjs'), `export default { outDir: ${JSON.stringify(join(dir, 'dist'))} };\n`);
  const rects = Array.from({ length: 200 }, (_, i) => `<rect x="${i * 3}" y="${i % 50}" width="2" height="${(i * 7) % 90}"/>`).join('');
  writeFileSync(
    join(dir, 'src/pages/[n].astro'),
    `---\nexport function getStaticPaths() { return Array.from({ length: ${pages} }, (_, n) => ({ params: { n: String(n) } })); }\nconst { n } = Astro.params;\n---\n<html lang="en"><head><title>Page {n}</title></head><body><h1>Page {n}</h1><svg viewBox="0 0 600 100">${rects}</svg></body></html>\n`,
  );
}
