import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/**
 * Measure results on disk, keyed by everything that can change them: the
 * text's content hash and reading options, the measure's name, version and
 * parameters, the cast and the language. Editing a caption changes none of
 * these, so it recomputes nothing.
 */
export interface CacheKeyParts {
  textHash: string;
  textOptions: unknown;
  measure: string;
  version: number;
  params: unknown;
  cast: unknown;
  language: string;
}

export function cacheKey(parts: CacheKeyParts): string {
  return createHash('sha256').update(stableJson(parts)).digest('hex');
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

export class ResultCache {
  readonly dir: string | null;
  readonly stats: CacheStats = { hits: 0, misses: 0 };

  /** `dir` null keeps nothing on disk (every lookup is a miss). */
  constructor(dir: string | null) {
    this.dir = dir;
    if (dir) mkdirSync(dir, { recursive: true });
  }

  get<T>(key: string, compute: () => T): T {
    if (this.dir) {
      const file = join(this.dir, `${key}.json`);
      try {
        const value = JSON.parse(readFileSync(file, 'utf8')) as T;
        this.stats.hits++;
        return value;
      } catch {
        // Missing or unreadable: compute below.
      }
      const value = compute();
      this.stats.misses++;
      // Write then rename, so a crash never leaves a half-written entry.
      const tmp = `${file}.${process.pid}.tmp`;
      writeFileSync(tmp, JSON.stringify(value));
      renameSync(tmp, file);
      return value;
    }
    this.stats.misses++;
    return compute();
  }
}
