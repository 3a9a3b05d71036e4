import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { join, relative, resolve } from 'node:path';
import { tmpdir } from 'node:os';

export const ROOT = resolve(import.meta.dirname, '../..');

export interface Run {
  status: number;
  stdout: string;
  stderr: string;
}

/** The environment a curator's shell would have: without the test runner's own variables. */
export function cleanEnv(extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, ASTRO_TELEMETRY_DISABLED: '1', ...extra };
  for (const k of Object.keys(env)) if (k.startsWith('VITEST') || k === 'TEST' || k === 'NODE_ENV') delete env[k];
  return env;
}

/** Runs the vitrine CLI as a curator would, in `cwd`. */
export function vitrine(args: string[], cwd = ROOT, env: Record<string, string> = {}): Run {
  const r = spawnSync(process.execPath, [join(ROOT, 'bin/vitrine.mjs'), ...args], {
    cwd,
    encoding: 'utf8',
    env: cleanEnv(env),
    maxBuffer: 64 * 1024 * 1024,
  });
  return { status: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

/** A scratch copy of the demo exhibit folder, to break on purpose. */
export function demoCopy(): { dir: string; plan: string } {
  const dir = mkdtempSync(join(tmpdir(), 'vitrine-test-'));
  cpSync(join(ROOT, 'content'), join(dir, 'content'), { recursive: true });
  return { dir, plan: join(dir, 'content/exhibit.yaml') };
}

/** Replaces the first occurrence of `find` in a file and returns the 1-based line and column where it stood. */
export function replaceIn(file: string, find: string, replacement: string): { line: number; column: number } {
  const text = readFileSync(file, 'utf8');
  const at = text.indexOf(find);
  if (at < 0) throw new Error(`"${find}" is not in ${file}`);
  writeFileSync(file, text.slice(0, at) + replacement + text.slice(at + find.length));
  const before = text.slice(0, at).split('\n');
  return { line: before.length, column: before.at(-1)!.length + 1 };
}

/** Position (1-based line, column) of the first occurrence of `find` in a file. */
export function positionOf(file: string, find: string): { line: number; column: number } {
  const text = readFileSync(file, 'utf8');
  const at = text.indexOf(find);
  if (at < 0) throw new Error(`"${find}" is not in ${file}`);
  const before = text.slice(0, at).split('\n');
  return { line: before.length, column: before.at(-1)!.length + 1 };
}

/** sha256 of every file under a folder, by relative path. */
export function treeHashes(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else out[relative(dir, p)] = createHash('sha256').update(readFileSync(p)).digest('hex');
    }
  };
  walk(dir);
  return out;
}
