import { describe, it, expect, afterAll } from 'vitest';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { cacheKey, ResultCache, stableJson } from '../../pipeline/cache/cache.ts';
import { tableToCsv } from '../../pipeline/stages/csv.ts';

const dirs: string[] = [];
afterAll(() => dirs.forEach((d) => rmSync(d, { recursive: true, force: true })));

const parts = { textHash: 'abc', textOptions: { id: 't' }, measure: 'frequency', version: 1, params: { top: 20, stopwords: true }, cast: null, language: 'en' };

describe('result cache', () => {
  it('gives the same key whatever the order of keys in the parameters', () => {
    expect(cacheKey(parts)).toBe(cacheKey({ ...parts, params: { stopwords: true, top: 20 } }));
    expect(stableJson({ b: 1, a: { d: 2, c: 3 } })).toBe('{"a":{"c":3,"d":2},"b":1}');
  });

  it('changes the key with the text, the measure version or a parameter', () => {
    const k = cacheKey(parts);
    expect(cacheKey({ ...parts, textHash: 'abd' })).not.toBe(k);
    expect(cacheKey({ ...parts, version: 2 })).not.toBe(k);
    expect(cacheKey({ ...parts, params: { top: 21, stopwords: true } })).not.toBe(k);
  });

  it('computes once, then recalls from disk in a new cache over the same folder', () => {
    const dir = mkdtempSync(join(tmpdir(), 'vitrine-cache-'));
    dirs.push(dir);
    let runs = 0;
    const a = new ResultCache(dir);
    expect(a.get('k1', () => ({ n: ++runs }))).toEqual({ n: 1 });
    const b = new ResultCache(dir);
    expect(b.get('k1', () => ({ n: ++runs }))).toEqual({ n: 1 });
    expect(runs).toBe(1);
    expect(b.stats).toEqual({ hits: 1, misses: 0 });
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
});

describe('result cache: what it reads back is checked, never trusted', () => {
  const scratch = (): string => {
    const dir = mkdtempSync(join(tmpdir(), 'vitrine-cache-'));
    dirs.push(dir);
    return dir;
  };
  const wordsOnly = (v: unknown): string | null => (typeof (v as { words?: unknown })?.words === 'number' ? null : 'words: expected a number');

  it.each([
    ['not JSON at all', 'half a {', /not complete JSON/],
    ['JSON of another layout (a bare result)', '{"words":12}', /not a cache entry of this version/],
    ['a list', '[1,2,3]', /not a cache entry of this version/],
    ['an entry of this layout saved under another key', JSON.stringify({ format: 2, key: 'other', value: { words: 1 } }), /another key/],
    ['an entry whose result has the wrong shape', JSON.stringify({ format: 2, key: 'k', value: { words: 'many' } }), /expected shape: words: expected a number/],
  ])('recomputes an entry that is %s, and says so in one warning', (_name, body, reason) => {
    const dir = scratch();
    writeFileSync(join(dir, 'k.json'), body);
    const cache = new ResultCache(dir, dir);
    expect(cache.get('k', () => ({ words: 7 }), wordsOnly)).toEqual({ words: 7 });
    expect(cache.stats).toEqual({ hits: 0, misses: 1 });
    const [warning, ...rest] = cache.problems();
    expect(rest).toEqual([]);
    expect(warning).toMatchObject({ severity: 'warning', code: 'cache/bad-entry', file: 'k.json' });
    expect(warning!.message).toMatch(reason);
    // The entry was replaced: a new cache over the folder reads it back without complaint.
    const again = new ResultCache(dir, dir);
    expect(again.get('k', () => ({ words: -1 }), wordsOnly)).toEqual({ words: 7 });
    expect(again.problems()).toEqual([]);
  });

  it('falls back to computing everything, with a warning, when the cache folder is a file', () => {
    const dir = scratch();
    writeFileSync(join(dir, 'cache'), 'not a folder');
    const cache = new ResultCache(join(dir, 'cache'), dir);
    expect(cache.dir).toBeNull();
    expect(cache.get('k', () => 3)).toBe(3);
    expect(cache.problems()).toEqual([expect.objectContaining({ severity: 'warning', code: 'cache/unusable-folder', file: 'cache' })]);
    expect(cache.problems()[0]!.message).toMatch(/is a file/);
    // A file where a parent folder should be.
    const below = new ResultCache(join(dir, 'cache', 'inner'), dir);
    expect(below.dir).toBeNull();
    expect(below.problems()[0]!.code).toBe('cache/unusable-folder');
  });

  it('keeps going, with one warning, when an entry cannot be written', () => {
    const dir = scratch();
    mkdirSync(join(dir, 'k.json')); // a folder where the entry should go: reading and renaming onto it both fail
    mkdirSync(join(dir, 'k2.json'));
    const cache = new ResultCache(dir, dir);
    expect(cache.get('k', () => 1)).toBe(1);
    expect(cache.get('k2', () => 2)).toBe(2);
    const codes = cache.problems().map((p) => p.code);
    expect(codes.filter((c) => c === 'cache/not-written')).toHaveLength(1);
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('replaces an entry found unusable only when used', () => {
    const dir = scratch();
    const cache = new ResultCache(dir, dir);
    cache.get('k', () => ({ n: 1 }));
    expect(cache.refresh('k', () => ({ n: 2 }), 'drawing it failed')).toEqual({ n: 2 });
    expect(new ResultCache(dir, dir).get('k', () => ({ n: 3 }))).toEqual({ n: 2 });
    expect(cache.problems()[0]!.message).toMatch(/drawing it failed/);
  });
});

describe('CSV downloads', () => {
  it('quote fields with commas, quotes and line breaks, doubling inner quotes, and end records with CRLF', () => {
    // Source: RFC 4180, section 2, rules 1, 5, 6 and 7.
    const csv = tableToCsv({
      columns: [
        { key: 'a', label: 'Word', numeric: false },
        { key: 'b', label: 'Count', numeric: true },
      ],
      rows: [
        ['plain', 1],
        ['with, comma', 2],
        ['say "hush"', 3],
        ['two\nlines', null],
      ],
    });
    expect(csv).toBe('Word,Count\r\nplain,1\r\n"with, comma",2\r\n"say ""hush""",3\r\n"two\nlines",\r\n');
  });
});
