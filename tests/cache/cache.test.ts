import { describe, it, expect, afterAll } from 'vitest';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
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
