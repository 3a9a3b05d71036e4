/**
 * The `vitrine` command.
 *
 *   vitrine check   [plan]                      validate plan, files and texts; report what was found
 *   vitrine measure [plan] --panel ID           the data behind one panel (JSON or CSV)
 *   vitrine measure --text FILE --measure NAME  ad-hoc: one measure on one text, no plan
 *   vitrine build   [plan]                      build the site into a fresh folder, then swap it into dist/
 *   vitrine dev     [plan]                      live preview that follows edits to plan, captions and text
 *
 * Exit codes: 0 success; 1 the curator's files have problems (or the build failed);
 * 2 the command line is wrong; 3 an unexpected internal failure.
 */
import { parseArgs } from 'node:util';
import { existsSync, rmSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describeChapterMarks } from './dialogue/report.ts';
import { prepareExhibit, GENERATOR } from './exhibit.ts';
import type { PrepareResult } from './exhibit.ts';
import { formatProblem, hasErrors, problem, sortProblems, wording } from './problems/problem.ts';
import type { Problem } from './problems/problem.ts';
import { tableToCsv } from './stages/csv.ts';
import { readText } from './stages/read-text.ts';
import { nearest } from './plan/suggest.ts';
import { checkOutputFolder, cleanStaleBuilds, markBuild, swapInto } from './stages/output.ts';
import type { Protected } from './stages/output.ts';

export const EXIT = { ok: 0, problems: 1, usage: 2, internal: 3 } as const;

/** The package root: where site/ and astro.config.mjs live. */
export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const DEFAULT_PLAN = 'content/exhibit.yaml';

const HELP = `vitrine — build an exhibition of visual readings of a text as a static site

Usage:
  vitrine check [plan]                     Check the plan, its files and texts; list chapters and cast mentions
  vitrine measure [plan] --panel ID        Print the data behind one panel
  vitrine measure --text FILE --measure NAME [--cast CAST.yaml] [--param key=value …]
                                           Run one measure on a text without a plan
  vitrine build [plan] [--out DIR]         Build the exhibit site (default: dist/)
  vitrine dev [plan] [--port N]            Preview the exhibit, rebuilding as files change

The plan defaults to ${DEFAULT_PLAN}.

Options:
  --format json|csv    Output format of \`measure\` (default: json)
  --language CODE      Language of an ad-hoc text (default: en)
  --base PATH          Serve the built site under this base path instead of the plan's
  --cache DIR          Keep measure results in DIR (default: .vitrine/cache)
  --no-cache           Compute every measure afresh
  --quiet              Print only problems
  --help, --version

Exit codes: 0 success, 1 problems in the exhibit files or a failed build, 2 wrong command line, 3 internal error.
`;

class UsageError extends Error {}

export interface Io {
  out: (s: string) => void;
  err: (s: string) => void;
  /** Also told every problem reported, as data (for tests and tools that run the command in-process). */
  problems?: (problems: Problem[]) => void;
}

const defaultIo: Io = {
  out: (s) => process.stdout.write(s),
  err: (s) => process.stderr.write(s),
};

export async function main(argv: string[], io: Io = defaultIo): Promise<number> {
  process.env.ASTRO_TELEMETRY_DISABLED = '1';
  // Vite reads these names from the environment into import.meta.env, where a stray
  // BASE_URL (set by a test runner or a shell profile) would override the exhibit's base path.
  for (const name of ['BASE_URL', 'MODE', 'DEV', 'PROD', 'SSR']) delete process.env[name];
  let args: ReturnType<typeof parse>;
  try {
    args = parse(argv);
  } catch (e) {
    io.err(`${(e as Error).message}\nRun "vitrine --help" for the commands and options.\n`);
    return EXIT.usage;
  }
  const { values, positionals } = args;
  if (values.version) {
    io.out(`${GENERATOR}\n`);
    return EXIT.ok;
  }
  const [command, ...rest] = positionals;
  if (values.help || !command) {
    io.out(HELP);
    return command || values.help ? EXIT.ok : EXIT.usage;
  }
  try {
    switch (command) {
      case 'check':
        return await check(rest, values, io);
      case 'measure':
        return await measure(rest, values, io);
      case 'build':
        return await build(rest, values, io);
      case 'dev':
        return await dev(rest, values, io);
      default: {
        const near = nearest(command, ['check', 'measure', 'build', 'dev']);
        throw new UsageError(`unknown command "${command}"${near ? ` — did you mean "${near}"?` : ''}`);
      }
    }
  } catch (e) {
    if (e instanceof UsageError) {
      io.err(`${e.message}\nRun "vitrine --help" for the commands and options.\n`);
      return EXIT.usage;
    }
    io.err(`vitrine stopped on an internal error: ${(e as Error).stack ?? String(e)}\n`);
    return EXIT.internal;
  }
}

function parse(argv: string[]) {
  return parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      panel: { type: 'string' },
      text: { type: 'string' },
      cast: { type: 'string' },
      measure: { type: 'string' },
      param: { type: 'string', multiple: true },
      format: { type: 'string' },
      language: { type: 'string' },
      out: { type: 'string' },
      base: { type: 'string' },
      port: { type: 'string' },
      cache: { type: 'string' },
      'no-cache': { type: 'boolean' },
      quiet: { type: 'boolean', short: 'q' },
      help: { type: 'boolean', short: 'h' },
      version: { type: 'boolean' },
    },
  });
}

type Values = ReturnType<typeof parse>['values'];

function planArg(rest: string[]): string {
  if (rest.length > 1) throw new UsageError(`expected at most one plan file, got: ${rest.join(' ')}`);
  return resolve(rest[0] ?? DEFAULT_PLAN);
}

function cacheDir(values: Values): string | null {
  return values['no-cache'] ? null : resolve(values.cache ?? '.vitrine/cache');
}

function report(problems: Problem[], io: Io): void {
  const sorted = sortProblems(problems);
  io.problems?.(sorted);
  for (const p of sorted) io.err(formatProblem(p) + '\n');
}

function summaryLine(problems: Problem[]): string {
  const errors = problems.filter((p) => p.severity === 'error').length;
  const warnings = problems.length - errors;
  const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;
  return `${plural(errors, 'error')}, ${plural(warnings, 'warning')}`;
}

// ——— check ———

async function check(rest: string[], values: Values, io: Io): Promise<number> {
  const plan = planArg(rest);
  const log = values.quiet ? undefined : (m: string) => io.out(m + '\n');
  const result = await prepareExhibit(plan, { cacheDir: cacheDir(values), log, summarise: true });
  const problems = [...result.problems, ...result.texts.flatMap((t) => t.warnings)];
  if (!values.quiet) {
    for (const t of result.texts) printTextSummary(t, io);
  }
  report(problems, io);
  if (!values.quiet || hasErrors(problems)) io.out(`${hasErrors(problems) ? 'The exhibit has problems' : 'The exhibit is ready to build'}: ${summaryLine(problems)}.\n`);
  return hasErrors(problems) ? EXIT.problems : EXIT.ok;
}

/** How many near-miss headings `check` lists per text. */
const NEAR_MISSES_SHOWN = 30;

function printTextSummary(t: PrepareResult['texts'][number], io: Io): void {
  io.out(`\nText "${t.id}" (${t.source}): ${t.words.toLocaleString('en-GB')} words, ${t.chapters.length} chapters\n`);
  for (const [side, cut] of [['front', t.trimmed.front], ['back', t.trimmed.back]] as const) {
    if (!cut) continue;
    const what = cut.automatic ? `the e-text licence ${side === 'front' ? 'header' : 'footer'}` : `the ${side === 'front' ? 'start' : 'end'} marker of the plan`;
    io.out(`  Trimmed lines ${cut.from}–${cut.to} (${side} matter, ${side === 'front' ? 'up to' : 'from'} ${what}: "${cut.marker}")\n`);
  }
  if (t.outside.length && t.headings.taken.length) {
    io.out(`  Read but outside every chapter: ${t.outside.map((r) => (r.from === r.to ? `line ${r.from}` : `lines ${r.from}–${r.to}`)).join(', ')}\n`);
  }
  const partLines = new Map(t.headings.taken.filter((h) => h.level === 'part').map((h) => [h.title, h.line]));
  let part: string | null = null;
  for (const c of t.chapters) {
    if (c.part && c.part !== part) io.out(`  ${c.part}, line ${partLines.get(c.part) ?? '?'}\n`);
    part = c.part;
    const at = c.line > 0 && t.headings.taken.length > 0 ? `, line ${c.line}` : '';
    const indent = partLines.size > 0 && c.part ? '    ' : '  ';
    io.out(`${indent}${String(c.number).padStart(3)}. ${c.title}${at}  (${c.words.toLocaleString('en-GB')} words, ${c.paragraphs.toLocaleString('en-GB')} paragraph${c.paragraphs === 1 ? '' : 's'})\n`);
    const marks = t.dialogue.chapters.find((m) => m.chapter === c.number);
    if (marks) for (const line of describeChapterMarks(marks)) io.out(`${indent}       ${line}\n`);
  }
  if (t.headings.rejected.length) {
    const shown = t.headings.rejected.slice(0, NEAR_MISSES_SHOWN);
    io.out('  Lines that look like headings but were not taken:\n');
    for (const r of shown) io.out(`    line ${r.line}: "${r.text}" — ${r.reason}\n`);
    const more = t.headings.rejected.length - shown.length;
    if (more > 0) io.out(`    … and ${more} more\n`);
  }
  if (t.cast.length) {
    io.out('  Cast mentions:\n');
    for (const c of [...t.cast].sort((a, b) => b.mentions - a.mentions)) io.out(`    ${c.name} (${c.id}): ${c.mentions}\n`);
  }
  if (t.dialogue.outsiders.length) {
    const top = t.dialogue.outsiders.slice(0, 10);
    io.out('  Speakers outside the cast (their speech has no speaker; add them to the cast to count it):\n');
    io.out(`    ${top.map((o) => `${o.name} ×${o.turns}`).join(', ')}${t.dialogue.outsiders.length > top.length ? `, and ${t.dialogue.outsiders.length - top.length} more` : ''}\n`);
  }
  if (t.ambiguous.length) {
    const byText = new Map<string, { candidates: string[]; chapters: Set<number>; n: number }>();
    for (const a of t.ambiguous) {
      const e = byText.get(a.text) ?? { candidates: a.candidates, chapters: new Set(), n: 0 };
      e.n++;
      e.chapters.add(a.chapter);
      byText.set(a.text, e);
    }
    io.out('  Ambiguous mentions (not counted for anyone):\n');
    for (const [text, e] of byText) {
      io.out(`    "${text}" ×${e.n} in chapter${e.chapters.size > 1 ? 's' : ''} ${[...e.chapters].join(', ')} — could be ${e.candidates.join(' or ')}\n`);
    }
  }
}

// ——— measure ———

async function measure(rest: string[], values: Values, io: Io): Promise<number> {
  const format = values.format ?? 'json';
  if (format !== 'json' && format !== 'csv') throw new UsageError(`--format must be json or csv, not "${format}"`);
  if (values.text) return adhocMeasure(rest, values, format, io);
  if (!values.panel) throw new UsageError('measure needs --panel ID (with a plan) or --text FILE --measure NAME (without one)');
  const plan = planArg(rest);
  const result = await prepareExhibit(plan, { cacheDir: cacheDir(values), only: [values.panel] });
  report(result.problems, io);
  if (hasErrors(result.problems)) return EXIT.problems;
  const panel = result.prepared!.rooms.flatMap((r) => r.panels).find((p) => p.id === values.panel);
  if (!panel) {
    const all = (await prepareExhibit(plan, { cacheDir: cacheDir(values), only: [] })).prepared;
    const ids: string[] = [];
    // Panel ids come from the plan; list them so the user can pick one.
    if (all) for (const r of all.rooms) ids.push(...r.panels.map((p) => p.id));
    const near = nearest(values.panel, ids);
    io.err(`${plan}: there is no panel "${values.panel}"${near ? ` — did you mean "${near}"?` : ''}\n`);
    return EXIT.problems;
  }
  io.out(format === 'csv' ? tableToCsv(panel.table) : JSON.stringify(panel.data, null, 2) + '\n');
  return EXIT.ok;
}

async function adhocMeasure(rest: string[], values: Values, format: 'json' | 'csv', io: Io): Promise<number> {
  if (rest.length) throw new UsageError(`--text runs without a plan; remove "${rest.join(' ')}"`);
  const name = values.measure;
  if (!name) throw new UsageError('--text needs --measure NAME');
  // Loaded here, not at start: a build that finds its exhibit in the cache loads no measure, schema or check.
  const [{ measures }, { readCastFile }, { checkSettingsValue }, { formatPath }, { coreKind, schemaAt }, { readingProblems, readingReport }] = await Promise.all([
    import('./measures/registry.ts'),
    import('./plan/cast-file.ts'),
    import('./plan/check-panels.ts'),
    import('./plan/source.ts'),
    import('./plan/schema-walk.ts'),
    import('./stages/reading.ts'),
  ]);
  const m = Object.hasOwn(measures, name) ? measures[name] : undefined;
  if (!m) {
    const near = nearest(name, Object.keys(measures));
    throw new UsageError(`unknown measure "${name}"${near ? ` — did you mean "${near}"?` : ` — the measures are: ${Object.keys(measures).join(', ')}`}`);
  }
  // The parameters, worded as the plan words a panel's params: nearest names, expected types, documented defaults.
  const raw: Record<string, unknown> = {};
  for (const p of values.param ?? []) {
    const eq = p.indexOf('=');
    if (eq < 1) throw new UsageError(`--param takes key=value, not "${p}"`);
    const key = p.slice(0, eq);
    const value = p.slice(eq + 1);
    // A parameter that takes text keeps the value as written ("--param node=1848" looks for the word 1848).
    raw[key] = coreKind(schemaAt(m.params, [key])) === 'string' ? value : parseValue(value);
  }
  const checked = checkSettingsValue(m.params, raw, {
    word: (key, hint) => wording('plan/unknown-param', { key, measure: name, hint }),
    plural: `parameters of "${name}"`,
  });
  if (!('output' in checked)) {
    const problems: Problem[] = checked.worded.map(({ path, wording: w }) => ({
      severity: 'error',
      code: w.code,
      path: `--param ${formatPath(path) || '(parameters)'}`,
      message: w.message,
      ...(w.hint ? { hint: w.hint } : {}),
    }));
    report(problems, io);
    io.err(`Run "vitrine --help" for the commands and options; the method card of "${name}" lists its parameters.\n`);
    return EXIT.usage;
  }
  const params = checked.output;
  const problems: Problem[] = [];
  const castFile = values.cast ? await readCastFile(resolve(values.cast), values.cast) : undefined;
  if (castFile) problems.push(...castFile.problems);
  const cast = castFile?.cast ?? [];
  if (m.needsCast && !values.cast) problems.push(problem('cli/needs-cast', { measure: name }));
  const language = values.language ?? 'en';
  const read = readText(resolve(values.text!), values.text!, { id: 'text' }, cast);
  problems.push(...read.problems);
  if (read.text && !hasErrors(problems)) {
    const { model, mentions } = read.text.open();
    const reading = readingReport(model, mentions, cast);
    problems.push(
      ...readingProblems(reading, {
        id: values.text!,
        display: values.text!,
        where: {},
        trimmed: false,
        pattern: false,
        cast,
        castPlaces: castFile?.places ?? [],
        language,
      }),
    );
  }
  report(problems, io);
  if (hasErrors(problems)) return EXIT.problems;
  const { model, mentions } = read.text!.open();
  let result: unknown;
  try {
    result = m.compute({ model, mentions, cast, language }, params);
  } catch (e) {
    io.err(`${values.text}: the measure "${name}" cannot run with these parameters: ${(e as Error).message}\n`);
    return EXIT.problems;
  }
  io.out(format === 'csv' ? tableToCsv(m.table(result, params)) : JSON.stringify(result, null, 2) + '\n');
  return EXIT.ok;
}

/** `--param` values: numbers, booleans and JSON arrays or objects are read as such, anything else as text. */
function parseValue(v: string): unknown {
  if (/^-?\d+(\.\d+)?$/.test(v)) return Number(v);
  if (v === 'true' || v === 'false') return v === 'true';
  if (/^\{.*\}$/.test(v)) {
    try {
      return JSON.parse(v);
    } catch {
      return v;
    }
  }
  if (/^\[.*\]$/.test(v)) {
    try {
      return JSON.parse(v);
    } catch {
      return v.slice(1, -1).split(',').map((s) => s.trim()).filter(Boolean);
    }
  }
  return v;
}

// ——— build ———

async function build(rest: string[], values: Values, io: Io): Promise<number> {
  const plan = planArg(rest);
  if (values.base !== undefined) {
    const { basePathProblem } = await import('./plan/schema.ts');
    const wrong = basePathProblem(values.base);
    if (wrong) throw new UsageError(`--base: ${wrong.message} — ${wrong.hint}`);
  }
  const out = resolve(values.out ?? 'dist');
  const quiet = !!values.quiet;
  const log = quiet ? undefined : (m: string) => io.out(m + '\n');
  const started = performance.now();
  const builds = resolve(ROOT, '.vitrine/builds');
  cleanStaleBuilds(builds, out);
  // Check everything first: a plan with problems, or an output folder that is not a build's
  // own, never reaches Astro and never touches the output folder.
  const result = await prepareExhibit(plan, { cacheDir: cacheDir(values), base: values.base, log });
  const problems = [...result.problems, ...checkOutputFolder(out, protectedPaths(plan, result))];
  if (hasErrors(problems)) {
    report(problems, io);
    io.err(`Nothing was built; ${out} is unchanged. ${summaryLine(problems)}.\n`);
    return EXIT.problems;
  }
  report(problems, io);
  // Astro's prerender step imports packages from the build folder, so it must sit inside the
  // project (where node_modules resolves); it is moved beside the output folder afterwards.
  const work = resolve(builds, `${process.pid}-${Date.now()}`);
  // Astro resolves some of its working folders from the current directory: build from the project.
  const cwd = process.cwd();
  process.chdir(ROOT);
  try {
    const [astro, { siteConfig }] = await Promise.all([import('astro'), import('../site/config.ts')]);
    // The exhibit prepared above goes to Astro as it is: it is not prepared a second time.
    const site = siteConfig({ root: ROOT, outDir: work, plan, prepared: result, cacheDir: cacheDir(values), base: values.base });
    await astro.build({ ...site, configFile: false, logLevel: quiet ? 'error' : 'warn', mode: 'production' });
    if (!existsSync(join(work, 'index.html'))) throw new Error('the site build finished without writing index.html');
    const { shareSummary, writeSharePictures } = await import('./stages/share.ts');
    const pictures = await writeSharePictures(result.prepared!, work, cacheDir(values));
    log?.(shareSummary(pictures));
    markBuild(work);
  } catch (e) {
    rmSync(work, { recursive: true, force: true });
    io.err(`The site build failed: ${(e as Error).message}\nNothing was changed in ${out}.\n`);
    return EXIT.problems;
  } finally {
    process.chdir(cwd);
  }
  const late = swapInto(work, out);
  if (late.length) {
    report(late, io);
    io.err(`The new site was discarded; ${out} is unchanged.\n`);
    return EXIT.problems;
  }
  const pages = result.prepared!.rooms.reduce((s, r) => s + r.panels.length, 0);
  if (!quiet) io.out(`Built ${result.prepared!.exhibit.title}: ${result.prepared!.rooms.length} rooms, ${pages} panels → ${out} (${((performance.now() - started) / 1000).toFixed(1)} s)\n`);
  return EXIT.ok;
}

/** What an output folder must neither be nor hold: the exhibit and everything it names, Vitrine itself, the working folder. */
function protectedPaths(plan: string, result: PrepareResult): Protected[] {
  const named = [...result.watch, ...(result.prepared?.captionFiles ?? []).map((f) => resolve(result.dir, f))];
  return [
    { path: dirname(plan), what: 'the exhibit folder' },
    { path: ROOT, what: "Vitrine's own folder" },
    { path: process.cwd(), what: 'the folder this command was run from' },
    ...named.map((f) => ({ path: f, what: f === plan ? 'the plan' : 'a file the plan names' })),
  ];
}

// ——— dev ———

async function dev(rest: string[], values: Values, io: Io): Promise<number> {
  const plan = planArg(rest);
  const result = await prepareExhibit(plan, { cacheDir: cacheDir(values), base: values.base });
  report(result.problems, io);
  if (hasErrors(result.problems)) return EXIT.problems;
  const port = values.port ? Number(values.port) : 4321;
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new UsageError(`--port must be a port number, not "${values.port}"`);
  process.chdir(ROOT);
  const [astro, { siteConfig }] = await Promise.all([import('astro'), import('../site/config.ts')]);
  // The integration starts from the exhibit prepared above and prepares it again once per change.
  const site = siteConfig({ root: ROOT, plan, prepared: result, cacheDir: cacheDir(values), base: values.base });
  const server = await astro.dev({ ...site, configFile: false, server: { port, host: '127.0.0.1' }, logLevel: values.quiet ? 'error' : 'info' });
  io.out(`Previewing ${result.prepared!.exhibit.title} at http://127.0.0.1:${server.address.port}${result.prepared!.exhibit.base} — edits to the plan, captions and text are picked up. Ctrl+C stops.\n`);
  await new Promise<void>((done) => {
    process.once('SIGINT', done);
    process.once('SIGTERM', done);
  });
  await server.stop();
  return EXIT.ok;
}
