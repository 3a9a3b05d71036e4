/**
 * The exhibit cache: stages 1–5 (plan, texts and pins, measures, notes, charts)
 * depend only on the plan, the texts and word lists it names, the options and
 * Vitrine's own code and packages, never on the captions. When none of those
 * changed since the last preparation, their work is read back from one file,
 * and only the caption stage and the summary run: editing a caption loads no
 * measure, chart or plan-checking code at all.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Problem } from '../problems/problem.ts';
import type { Measured } from './summary.ts';

/** What is kept: the work of stages 1–5, and what it was made from. */
export interface Kept {
  key: string;
  /** Texts and word lists the plan named, with the sha256 of their bytes when read. */
  inputs: { file: string; hash: string }[];
  measured: Measured;
  /** Warnings found by stages 1–5 (an exhibit with errors is never kept). */
  problems: Problem[];
  watch: string[];
}

const PIPELINE = fileURLToPath(new URL('..', import.meta.url));
const PROJECT = fileURLToPath(new URL('../..', import.meta.url));
let code: string | undefined;

/** A hash of Vitrine's own code and the packages it installed: any change makes every kept exhibit stale. */
export function codeFingerprint(): string {
  if (code === undefined) {
    const h = createHash('sha256');
    const files = readdirSync(PIPELINE, { recursive: true, withFileTypes: true })
      .filter((d) => d.isFile() && d.name.endsWith('.ts'))
      .map((d) => join(d.parentPath, d.name))
      .sort();
    for (const f of files) h.update(relative(PIPELINE, f)).update('\0').update(readFileSync(f)).update('\0');
    for (const f of ['package.json', 'package-lock.json']) {
      try {
        h.update(readFileSync(join(PROJECT, f)));
      } catch {
        // A project without a lockfile: its installed packages are not fingerprinted.
      }
    }
    code = h.digest('hex');
  }
  return code;
}

export function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** The key of a preparation: the plan's bytes, where it is, how it is shown, the options, the code. */
export function keepKey(planFile: string, planBytes: Uint8Array, options: { base?: string }): string {
  return sha256(Buffer.from(JSON.stringify([planFile, sha256(planBytes), process.cwd(), options.base ?? null, codeFingerprint()])));
}

function fileFor(cacheDir: string, planFile: string): string {
  return join(cacheDir, `exhibit-${sha256(Buffer.from(planFile)).slice(0, 16)}.json`);
}

/** The kept work for this plan, if it was made from the same plan, texts, word lists, options and code. */
export function recall(cacheDir: string, planFile: string, key: string): Kept | null {
  let kept: Kept;
  try {
    kept = JSON.parse(readFileSync(fileFor(cacheDir, planFile), 'utf8')) as Kept;
  } catch {
    return null;
  }
  if (kept?.key !== key || !Array.isArray(kept.inputs) || !Array.isArray(kept.problems) || !Array.isArray(kept.watch)) return null;
  const m = kept.measured;
  if (!m || !m.jobs?.exhibit || !Array.isArray(m.jobs.texts) || !Array.isArray(m.rooms) || !Array.isArray(m.methods) || !Array.isArray(m.texts)) return null;
  for (const input of kept.inputs) {
    try {
      if (sha256(readFileSync(input.file)) !== input.hash) return null;
    } catch {
      return null;
    }
  }
  return kept;
}

/** Keeps the work of stages 1–5 for the next preparation (written whole, then renamed into place). */
export function keep(cacheDir: string, planFile: string, kept: Kept): void {
  mkdirSync(cacheDir, { recursive: true });
  const file = fileFor(cacheDir, planFile);
  const tmp = `${file}.${process.pid}.tmp`;
  writeFileSync(tmp, JSON.stringify(kept));
  renameSync(tmp, file);
}
