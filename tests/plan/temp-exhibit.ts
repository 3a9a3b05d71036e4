/**
 * Writes a throw-away exhibit folder for one test: the plan (given as lines,
 * so that line numbers in a test can be read off the array index + 1) and the
 * files it names.
 */
import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';

export interface TempExhibit {
  /** The folder holding everything (the working directory for loadPlan). */
  root: string;
  /** The exhibit folder (`root/content`). */
  dir: string;
  /** Plan path relative to `root`. */
  plan: string;
  remove(): Promise<void>;
}

/** Writes `content/exhibit.yaml` from `planLines` and each of `files` (paths relative to `content/`). */
export async function tempExhibit(planLines: readonly string[], files: Record<string, string> = {}): Promise<TempExhibit> {
  const root = await mkdtemp(path.join(tmpdir(), 'vitrine-plan-'));
  const dir = path.join(root, 'content');
  await mkdir(dir, { recursive: true });
  await writeFile(path.join(dir, 'exhibit.yaml'), `${planLines.join('\n')}\n`);
  for (const [name, body] of Object.entries(files)) {
    const target = path.join(dir, name);
    await mkdir(path.dirname(target), { recursive: true });
    await writeFile(target, body);
  }
  return { root, dir, plan: 'content/exhibit.yaml', remove: () => rm(root, { recursive: true, force: true }) };
}

/** The usual files of a one-text exhibit. */
export const baseFiles: Record<string, string> = {
  'texts/ledger.txt': 'Entry 1\n\nThe ferry crossed at dawn with a crate of lamps.\n',
  'texts/almanac.txt': 'Spring\n\nThe tide tables for the quay, kept by hand.\n',
  'captions/a.mdx': 'A caption.\n',
  'captions/b.mdx': 'Another caption.\n',
};
