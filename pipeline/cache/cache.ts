import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import type { Problem } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';

/**
 * Measure results on disk, keyed by everything that can change them: the
 * text's content hash and reading options, the measure's name, version and
 * parameters, the cast and the language. Editing a caption changes none of
 * these, so it recomputes nothing.
 *
 * The cache is only ever a shortcut: an entry that cannot be read, is not in
 * this format, was written under another key or does not have the shape its
 * reader expects is computed again (with a warning); a cache folder that
 * cannot be made or written falls back to computing everything, also with a
 * warning. Nothing read from the cache can stop a check or a build.
 */
export interface CacheKeyParts {
  textHash: string;
  textOptions: unknown;
  measure: string;
  version: number;
  params: unknown;
  cast: unknown;
  language: string;
  /** Anything else the result depends on (dialogue settings, a word list, data package versions). */
  [more: string]: unknown;
}

/** Layout of an entry file; part of every key, so entries of an older layout are never read. */
export const CACHE_FORMAT = 2;

export function cacheKey(parts: CacheKeyParts): string {
  return createHash('sha256').update(stableJson({ format: CACHE_FORMAT, ...parts })).digest('hex');
}

/** JSON with object keys sorted, so equal values give equal strings. */
export function stableJson(value: unknown): string {
  return JSON.stringify(value, (_k, v) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.keys(v).sort().map((k) => [k, (v as Record<string, unknown>)[k]]))
      : v,
  );
}

export interface CacheStats {
  hits: number;
  misses: number;
}

/** Checks a value read back from disk: null when it is usable, otherwise why not. */
export type CacheCheck = (value: unknown) => string | null;

interface Envelope {
  format: number;
  key: string;
  value: unknown;
}

function errorCode(e: unknown): string {
  return (e as NodeJS.ErrnoException).code ?? (e instanceof Error ? e.message : String(e));
}

export class ResultCache {
  /** The folder in use, or null when nothing is kept on disk (asked for, or the folder cannot be used). */
  readonly dir: string | null;
  readonly stats: CacheStats = { hits: 0, misses: 0 };
  private readonly shown: (file: string) => string;
  private readonly trouble: Problem[] = [];
  private readonly rejected: { file: string; reason: string }[] = [];
  private writable = true;

  /**
   * `dir` null keeps nothing on disk (every lookup is a miss). `cwd` is what
   * file names in warnings are shown relative to.
   */
  constructor(dir: string | null, cwd: string = process.cwd()) {
    this.shown = (file) => {
      const rel = relative(cwd, file);
      return rel && !rel.startsWith('..') ? rel : file;
    };
    if (dir) {
      try {
        mkdirSync(dir, { recursive: true });
      } catch (e) {
        const code = errorCode(e);
        this.trouble.push(problem('cache/unusable-folder', { blocked: code === 'EEXIST' || code === 'ENOTDIR', reason: code }, { file: this.shown(dir) }));
        dir = null;
      }
    }
    this.dir = dir;
  }

  /**
   * The cached value under `key`, or `compute()`'s (stored for next time).
   * `check` vets a value read back: one it rejects is computed again.
   */
  get<T>(key: string, compute: () => T, check?: CacheCheck): T {
    if (!this.dir) {
      this.stats.misses++;
      return compute();
    }
    const file = this.fileOf(key);
    const read = this.read(file, key, check);
    if (read.found) {
      this.stats.hits++;
      return read.value as T;
    }
    return this.store(file, key, compute);
  }

  /** Computes again and replaces the entry: for a cached value that turned out unusable when it was used. */
  refresh<T>(key: string, compute: () => T, reason: string): T {
    if (!this.dir) {
      this.stats.misses++;
      return compute();
    }
    const file = this.fileOf(key);
    this.rejected.push({ file, reason });
    return this.store(file, key, compute);
  }

  /** Warnings about the cache itself: a folder that could not be used, entries computed again, results not saved. */
  problems(): Problem[] {
    const out = [...this.trouble];
    if (this.rejected.length > 0) {
      const [first] = this.rejected;
      out.push(problem('cache/bad-entry', { count: this.rejected.length, reason: first!.reason }, { file: this.shown(first!.file) }));
    }
    return out;
  }

  private fileOf(key: string): string {
    return join(this.dir!, `${key}.json`);
  }

  private read(file: string, key: string, check?: CacheCheck): { found: true; value: unknown } | { found: false } {
    let text: string;
    try {
      text = readFileSync(file, 'utf8');
    } catch (e) {
      if (errorCode(e) !== 'ENOENT') this.rejected.push({ file, reason: `it cannot be read: ${errorCode(e)}` });
      return { found: false };
    }
    let entry: Envelope;
    try {
      entry = JSON.parse(text) as Envelope;
    } catch {
      this.rejected.push({ file, reason: 'it is not complete JSON' });
      return { found: false };
    }
    if (entry === null || typeof entry !== 'object' || Array.isArray(entry) || entry.format !== CACHE_FORMAT || !('value' in entry)) {
      this.rejected.push({ file, reason: 'it is not a cache entry of this version of Vitrine' });
      return { found: false };
    }
    if (entry.key !== key) {
      this.rejected.push({ file, reason: 'it was saved under another key' });
      return { found: false };
    }
    const wrong = check?.(entry.value) ?? null;
    if (wrong !== null) {
      this.rejected.push({ file, reason: `its result does not have the expected shape: ${wrong}` });
      return { found: false };
    }
    return { found: true, value: entry.value };
  }

  private store<T>(file: string, key: string, compute: () => T): T {
    const value = compute();
    this.stats.misses++;
    if (!this.writable) return value;
    // Write then rename, so a crash never leaves a half-written entry.
    const tmp = `${file}.${process.pid}.tmp`;
    try {
      const entry: Envelope = { format: CACHE_FORMAT, key, value };
      writeFileSync(tmp, JSON.stringify(entry));
      renameSync(tmp, file);
    } catch (e) {
      try {
        rmSync(tmp, { force: true, recursive: true });
      } catch {
        // Nothing more can be done about a leftover temporary file here.
      }
      this.writable = false;
      this.trouble.push(problem('cache/not-written', { reason: errorCode(e) }, { file: this.shown(file) }));
    }
    return value;
  }
}
