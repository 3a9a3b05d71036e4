/**
 * Files named in the plan: resolved against the exhibit folder, kept inside
 * it (also through symbolic links), and checked to exist as files.
 */
import { realpath, stat } from 'node:fs/promises';
import path from 'node:path';
import type { Wording } from './raw.ts';
import { wording } from '../problems/problem.ts';

export interface FileCheckResult {
  /** Absolute path, set when the path stays inside the exhibit folder. */
  absolute?: string;
  problems: Wording[];
}

export interface FileRule {
  /** What the file is, for messages: "caption", "text", "introduction", "rights statement". */
  what: string;
  /** Whether it must be an MDX (or Markdown) file. */
  mdx: boolean;
}

/** A path shown to the user: relative to the working directory when it lies inside it. */
export function displayPath(absolute: string, cwd: string): string {
  const rel = path.relative(cwd, absolute);
  if (rel === '') return '.';
  if (rel.startsWith('..') || path.isAbsolute(rel)) return absolute;
  return rel.split(path.sep).join('/');
}

function isInside(folder: string, candidate: string): boolean {
  const rel = path.relative(folder, candidate);
  return rel !== '' && !rel.startsWith(`..${path.sep}`) && rel !== '..' && !path.isAbsolute(rel);
}

function looksAbsolute(written: string): boolean {
  return path.isAbsolute(written) || /^[A-Za-z]:[\\/]/.test(written) || written.startsWith('\\\\');
}

const MDX_EXTENSIONS = ['.mdx', '.md'];

/**
 * Checks one path as written in the plan. `dir` is the exhibit folder,
 * `realDir` its real path (symbolic links resolved), `shownDir` how to name it.
 */
export async function checkFile(written: string, rule: FileRule, dir: string, realDir: string, shownDir: string): Promise<FileCheckResult> {
  const what = rule.what;
  if (looksAbsolute(written)) {
    return { problems: [wording('plan/path-outside', { what, written, dir: shownDir, how: 'absolute' })] };
  }
  const absolute = path.resolve(dir, written);
  if (absolute === dir) {
    return { problems: [wording('plan/not-a-file', { what, written, folder: 'exhibit' })] };
  }
  if (!isInside(dir, absolute)) {
    return { problems: [wording('plan/path-outside', { what, written, dir: shownDir, how: 'outside' })] };
  }

  const problems: Wording[] = [];
  if (rule.mdx && !MDX_EXTENSIONS.includes(path.extname(written).toLowerCase())) {
    problems.push(wording('plan/not-mdx', { what, written }));
  }

  let real: string;
  try {
    real = await realpath(absolute);
  } catch {
    problems.push(wording('plan/missing-file', { what, written, looked: path.join(shownDir, written).split(path.sep).join('/') }));
    return { absolute, problems };
  }
  if (!isInside(realDir, real)) {
    problems.push(wording('plan/path-outside', { what, written, dir: shownDir, how: 'link' }));
    return { problems };
  }
  const info = await stat(real);
  if (!info.isFile()) {
    problems.push(wording('plan/not-a-file', { what, written, folder: 'other' }));
  }
  return { absolute, problems };
}
