/**
 * npm run bench [-- --json]
 *
 * Speed figures, each measured side by side with a reference in the same run,
 * so the ratios hold on any machine:
 *   1. text model: tokens per second of buildTextModel on a large text, beside
 *      one plain regex tokenising pass over the same text;
 *   2. every measure on the same text;
 *   3. site build: the demo exhibit rebuilt by `vitrine build` after one caption
 *      is edited (warm cache), beside a bare Astro build that writes the same
 *      pages and downloads (the demo's own bytes, handed to Astro as data):
 *      siteBuild.captionEditRatio, with the peak memory of each build;
 *   4. the share pictures: the demo's social cards and chart PNGs drawn with an
 *      empty cache (cold), then taken from the cache (warm), per picture.
 * The large text is the King James Bible from Debian's bible-kjv package
 * (public domain, ~790k words) when installed, else a generated text of the
 * same size made from the demo text.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
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
// --only text|measures|site|pictures runs one part.
const only = process.argv.includes('--only') ? process.argv[process.argv.indexOf('--only') + 1] : undefined;
const wants = (part: string) => only === undefined || only === part;
const root = resolve(import.meta.dirname, '..');
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

const large = wants('text') || wants('measures') ? largeText() : { text: '', source: '' };

// 1. Text model against one regex pass.
if (wants('text')) {
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
if (wants('measures')) {
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

// 3. The caption-edit rebuild against a bare Astro build of the same pages. Both write
//    into the project's own .vitrine/ folder (the file system a real dist/ is on).
if (wants('site')) {
  const scratch = mkdtempSync(join(root, '.vitrine', 'bench-'));
  try {
    const exhibit = join(scratch, 'exhibit');
    cpSync(join(root, 'content'), exhibit, { recursive: true });
    const plan = join(exhibit, 'exhibit.yaml');
    const out = join(scratch, 'demo');
    const cache = join(scratch, 'cache');
    // Each child reports its peak resident memory as it exits.
    const peak = `data:text/javascript,process.on('exit',()=>process.stderr.write('\\npeak-rss-kb '+process.resourceUsage().maxRSS+'\\n'))`;
    const run = (args: string[]) => {
      const a = performance.now();
      const r = spawnSync('node', ['--import', peak, ...args], { cwd: root, env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' }, encoding: 'utf8' });
      const seconds = (performance.now() - a) / 1000;
      if (r.status !== 0) throw new Error(`${args.join(' ')} failed:\n${r.stdout}\n${r.stderr}`);
      return { seconds, kb: Number(/peak-rss-kb (\d+)/.exec(r.stderr)?.[1] ?? 0) };
    };
    const build = () => run(['bin/vitrine.mjs', 'build', plan, '--quiet', '--out', out, '--cache', cache]);
    // A first build fills the measure cache and Astro's content cache; each timed build
    // follows an edit of one caption, as a curator's rebuild does.
    build();
    const caption = join(exhibit, 'captions', 'who-appears-where.mdx');
    const original = readFileSync(caption, 'utf8');
    const files = listFiles(out);
    const pages = files.filter((f) => f.endsWith('index.html')).length;
    const bare = join(scratch, 'bare');
    makeBareProject(bare, out, files);
    const bareBuild = () => run([join(root, 'node_modules/astro/bin/astro.mjs'), 'build', '--root', bare, '--silent']);
    bareBuild(); // Astro's own caches, as warm as the demo's.
    // Turn about, so that a change in the machine's load falls on both alike.
    const demoRuns: { seconds: number; kb: number }[] = [];
    const bareRuns: { seconds: number; kb: number }[] = [];
    for (let n = 1; n <= 5; n++) {
      writeFileSync(caption, `${original}\nEdited for the bench (${n}).\n`);
      demoRuns.push(build());
      bareRuns.push(bareBuild());
    }
    const bareFiles = listFiles(join(bare, 'dist')).length;
    const demoSeconds = median(demoRuns.map((r) => r.seconds));
    const bareSeconds = median(bareRuns.map((r) => r.seconds));
    const peakMB = Math.round(Math.max(...demoRuns.map((r) => r.kb)) / 1024);
    const barePeakMB = Math.round(Math.max(...bareRuns.map((r) => r.kb)) / 1024);
    figures.siteBuild = {
      pages,
      files: files.length,
      bareFiles,
      demoSeconds: round(demoSeconds),
      bareAstroSeconds: round(bareSeconds),
      captionEditRatio: round(demoSeconds / bareSeconds),
      peakMB,
      bareAstroPeakMB: barePeakMB,
    };
    say(`Site build: ${pages} HTML pages, ${files.length} files; one caption edited before each build, warm cache`);
    say(`  vitrine build ${demoSeconds.toFixed(2)} s · bare Astro build writing the same ${bareFiles} files ${bareSeconds.toFixed(2)} s · caption-edit ratio ${(demoSeconds / bareSeconds).toFixed(2)}× (target ≤ 1.25×)`);
    say(`  peak memory: vitrine build ${peakMB} MB, bare Astro build ${barePeakMB} MB`);
  } finally {
    // --keep leaves the scratch projects for profiling.
    if (process.argv.includes('--keep')) say(`  kept ${scratch}`);
    else rmSync(scratch, { recursive: true, force: true });
  }
}

// 4. Share pictures: drawing every card and chart PNG, then copying them from the cache.
if (wants('pictures')) {
  const scratch = mkdtempSync(join(root, '.vitrine', 'bench-'));
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

/** Every file under a folder, relative to it, in sorted order. */
function listFiles(dir: string): string[] {
  return readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => relative(dir, join(d.parentPath, d.name)))
    .sort();
}

/**
 * A bare Astro project that writes the same pages and downloads as the demo build:
 * each HTML page and each data file is the demo's own bytes, handed to Astro as data
 * (pages through set:html, downloads through endpoints), and the demo's bundled
 * stylesheets and fonts are its public files. It does what Astro must do for this
 * site and nothing Vitrine adds: no pipeline, no captions, no components.
 */
function makeBareProject(dir: string, built: string, files: string[]): void {
  mkdirSync(join(dir, 'src/pages/[room]/[panel]'), { recursive: true });
  symlinkSync(join(root, 'node_modules'), join(dir, 'node_modules'));
  const config = { outDir: join(dir, 'dist'), trailingSlash: 'always', build: { format: 'directory' }, devToolbar: { enabled: false } };
  writeFileSync(join(dir, 'astro.config.mjs'), `export default ${JSON.stringify(config)};\n`);
  const pages: Record<string, string> = {};
  const downloads: Record<string, string> = {};
  for (const f of files) {
    if (f.endsWith('index.html')) pages[f.slice(0, -'index.html'.length).replace(/\/$/, '')] = readFileSync(join(built, f), 'utf8');
    else if (/^[^/]+\/[^/]+\/data\.(csv|json)$/.test(f)) downloads[f] = readFileSync(join(built, f), 'utf8');
  }
  writeFileSync(join(dir, 'src/site.json'), JSON.stringify({ pages, downloads }));
  cpSync(join(built, '_astro'), join(dir, 'public/_astro'), { recursive: true });
  // Every other file the demo writes (favicon, chart SVGs and PNGs, social cards) is a public file of the bare site.
  for (const f of files) {
    if (f.endsWith('index.html') || f.startsWith('_astro/') || f.startsWith('.') || Object.hasOwn(downloads, f)) continue;
    mkdirSync(join(dir, 'public', f, '..'), { recursive: true });
    cpSync(join(built, f), join(dir, 'public', f));
  }
  writeFileSync(
    join(dir, 'src/pages/[...page].astro'),
    [
      '---',
      "import site from '../site.json';",
      'export function getStaticPaths() { return Object.keys(site.pages).map((page) => ({ params: { page: page || undefined } })); }',
      "const html = site.pages[Astro.params.page ?? ''];",
      '---',
      '<Fragment set:html={html} />',
      '',
    ].join('\n'),
  );
  for (const ext of ['csv', 'json']) {
    writeFileSync(
      join(dir, `src/pages/[room]/[panel]/data.${ext}.ts`),
      [
        "import site from '../../../site.json';",
        `const mine = Object.keys(site.downloads).filter((f) => f.endsWith('.${ext}'));`,
        "export function getStaticPaths() { return mine.map((f) => { const [room, panel] = f.split('/'); return { params: { room, panel } }; }); }",
        `export function GET({ params }) { return new Response(site.downloads[\`\${params.room}/\${params.panel}/data.${ext}\`]); }`,
        '',
      ].join('\n'),
    );
  }
}
