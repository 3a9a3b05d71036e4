/**
 * The folder a build writes into. `vitrine build` replaces its output folder as a
 * whole, so it may only replace a folder that is new, empty, or marked as one an
 * earlier build wrote, and never one that holds the exhibit, Vitrine itself, the
 * folder the command was run from, or any file the plan names. Every refusal is a
 * Problem naming the folder and saying what to do; nothing is deleted.
 *
 * The site is built into a private folder (`.vitrine/builds/<pid>-<time>`), moved
 * beside the output folder, and swapped in by two renames. A build that is killed
 * leaves those folders behind; the next build removes the ones whose process is gone.
 */
import { cpSync, existsSync, lstatSync, mkdirSync, readdirSync, readFileSync, realpathSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, relative, resolve, sep } from 'node:path';
import type { Problem } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';
import { displayPath } from '../plan/files.ts';

/** Name of the marker file every build leaves at the top of its output folder. */
export const BUILD_MARKER = '.vitrine-build';
const MARKER_FIRST_LINE = 'vitrine build output';
const MARKER_TEXT = `${MARKER_FIRST_LINE}
This folder was written by "vitrine build". The next build replaces all of it:
keep nothing of your own here.
`;

/** Something the output folder must neither be nor hold, and how to name it in a message. */
export interface Protected {
  path: string;
  /** "the exhibit folder", "the plan", "Vitrine itself", … */
  what: string;
}

/** A path with symbolic links resolved, as far as it exists. */
function real(p: string): string {
  const abs = resolve(p);
  if (existsSync(abs)) return realpathSync(abs);
  const parent = dirname(abs);
  return parent === abs ? abs : join(real(parent), basename(abs));
}

/** Whether `folder` is `candidate` or one of its ancestors. */
function holds(folder: string, candidate: string): boolean {
  const rel = relative(folder, candidate);
  return rel === '' || (!rel.startsWith(`..${sep}`) && rel !== '..' && !rel.startsWith(sep) && !/^[A-Za-z]:/.test(rel));
}

function refusal(out: string, cwd: string, detail: string, hint: string): Problem {
  return problem('build/out-refused', { detail, hint }, { file: displayPath(out, cwd) });
}

const ELSEWHERE = 'build into a folder of its own with --out (for example --out dist, the default, beside the exhibit folder)';

/**
 * Why `out` may not be replaced by a build, if it may not. `protect` lists what it must
 * neither be nor hold: the exhibit folder, the plan and every file it names, Vitrine's own
 * folder, the working folder.
 */
export function checkOutputFolder(out: string, protect: readonly Protected[], cwd = process.cwd()): Problem[] {
  const target = real(out);
  for (const p of protect) {
    const at = real(p.path);
    if (!holds(target, at)) continue;
    const which = target === at ? `is ${p.what}` : `holds ${p.what} (${displayPath(resolve(p.path), cwd)})`;
    return [refusal(out, cwd, `the output folder ${which}, and a build replaces its output folder as a whole`, ELSEWHERE)];
  }
  return replaceable(out, cwd);
}

/** Whether the folder itself may be replaced: new, empty, or marked as a build's. */
function replaceable(out: string, cwd: string): Problem[] {
  let info;
  try {
    info = lstatSync(out);
  } catch {
    return []; // A new folder.
  }
  if (info.isSymbolicLink()) {
    return [refusal(out, cwd, 'the output folder is a symbolic link', 'give the folder it points to, or another folder, with --out')];
  }
  if (!info.isDirectory()) {
    return [refusal(out, cwd, 'the output folder is a file, not a folder', 'name a folder with --out; the file was left as it is')];
  }
  const entries = readdirSync(out);
  if (entries.length === 0 || isMarked(out)) return [];
  const some = entries.slice(0, 3).join(', ') + (entries.length > 3 ? `, … (${entries.length} in all)` : '');
  return [
    refusal(
      out,
      cwd,
      `the output folder holds files that no Vitrine build wrote (${some})`,
      `a build replaces only an empty folder or one it built itself (marked by its ${BUILD_MARKER} file): choose another folder with --out, or move those files away. A site built by a Vitrine older than this marker has to be deleted by hand, once`,
    ),
  ];
}

function isMarked(folder: string): boolean {
  const marker = join(folder, BUILD_MARKER);
  try {
    return lstatSync(marker).isFile() && readFileSync(marker, 'utf8').split('\n')[0] === MARKER_FIRST_LINE;
  } catch {
    return false;
  }
}

/** Marks a freshly built site as one the next build may replace. */
export function markBuild(folder: string): void {
  writeFileSync(join(folder, BUILD_MARKER), MARKER_TEXT);
}

/**
 * Replaces `out` with the freshly built `work` folder. The new site is first moved (or,
 * across file systems, copied) beside `out`; then two renames on the same file system swap
 * it in, and only then is the old site deleted. The folder is checked again just before the
 * swap, in case files were put into it while the site was being built. Returns the
 * problems that stopped the swap (the new site is then discarded and `out` left as it was).
 */
export function swapInto(work: string, out: string, cwd = process.cwd()): Problem[] {
  mkdirSync(dirname(out), { recursive: true });
  const stamp = `${process.pid}-${Date.now()}`;
  const staged = join(dirname(out), `.${basename(out)}.new-${stamp}`);
  const old = join(dirname(out), `.${basename(out)}.old-${stamp}`);
  try {
    renameSync(work, staged);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== 'EXDEV') throw e;
    cpSync(work, staged, { recursive: true });
    rmSync(work, { recursive: true, force: true });
  }
  const late = replaceable(out, cwd);
  if (late.length) {
    rmSync(staged, { recursive: true, force: true });
    return late;
  }
  const had = existsSync(out);
  if (had) renameSync(out, old);
  try {
    renameSync(staged, out);
  } catch (e) {
    if (had) renameSync(old, out);
    rmSync(staged, { recursive: true, force: true });
    throw e;
  }
  if (had) rmSync(old, { recursive: true, force: true });
  return [];
}

/** Whether a process with this id is still running (on this machine, as any user). */
export function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Removes what killed builds left behind: private build folders in `buildsDir`
 * (`<pid>-<time>`) and staged or retired sites beside `out` (`.<name>.new-<pid>-<time>`,
 * `.<name>.old-<pid>-<time>`), but only those whose process is gone. Returns what it removed.
 */
export function cleanStaleBuilds(buildsDir: string, out: string): string[] {
  const removed: string[] = [];
  const sweep = (dir: string, pattern: RegExp) => {
    let names: string[];
    try {
      names = readdirSync(dir);
    } catch {
      return;
    }
    for (const name of names) {
      const m = pattern.exec(name);
      if (!m || processAlive(Number(m[1]))) continue;
      rmSync(join(dir, name), { recursive: true, force: true });
      removed.push(join(dir, name));
    }
  };
  sweep(buildsDir, /^(\d+)-\d+$/);
  const name = basename(resolve(out)).replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  sweep(dirname(resolve(out)), new RegExp(`^\\.${name}\\.(?:new|old)-(\\d+)-\\d+$`));
  return removed;
}
