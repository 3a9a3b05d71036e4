/**
 * Files named in the plan: resolved against the exhibit folder, kept inside
 * it (also through symbolic links), and checked to exist as files.
 */
import { realpath, stat } from 'node:fs/promises';
import path from 'node:path';
import type { Wording } from './raw.ts';

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
  const stayInside = `paths must stay inside the exhibit folder (${shownDir}); move the file into it and write the path relative to it`;
  if (looksAbsolute(written)) {
    return { problems: [{ code: 'plan/path-outside', message: `the ${rule.what} path "${written}" is absolute`, hint: stayInside }] };
  }
  const absolute = path.resolve(dir, written);
  if (absolute === dir) {
    return { problems: [{ code: 'plan/not-a-file', message: `the ${rule.what} path "${written}" names the exhibit folder itself`, hint: 'name a file inside it' }] };
  }
  if (!isInside(dir, absolute)) {
    return { problems: [{ code: 'plan/path-outside', message: `the ${rule.what} path "${written}" leads outside the exhibit folder`, hint: stayInside }] };
  }

  const problems: Wording[] = [];
  if (rule.mdx && !MDX_EXTENSIONS.includes(path.extname(written).toLowerCase())) {
    problems.push({
      code: 'plan/not-mdx',
      message: `the ${rule.what} "${written}" is not an MDX file`,
      hint: 'name a file ending in .mdx (or .md for plain Markdown)',
    });
  }

  let real: string;
  try {
    real = await realpath(absolute);
  } catch {
    problems.push({
      code: 'plan/missing-file',
      message: `the ${rule.what} file "${written}" does not exist`,
      hint: `looked for ${path.join(shownDir, written).split(path.sep).join('/')}; create it or correct the path`,
    });
    return { absolute, problems };
  }
  if (!isInside(realDir, real)) {
    problems.push({
      code: 'plan/path-outside',
      message: `the ${rule.what} path "${written}" leads outside the exhibit folder through a symbolic link`,
      hint: `${stayInside} (copy it rather than link to it)`,
    });
    return { problems };
  }
  const info = await stat(real);
  if (!info.isFile()) {
    problems.push({
      code: 'plan/not-a-file',
      message: `the ${rule.what} path "${written}" is a folder, not a file`,
      hint: 'name a file inside it',
    });
  }
  return { absolute, problems };
}
