import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { catalogue } from '../../pipeline/problems/catalogue.ts';
import type { CatalogueEntry } from '../../pipeline/problems/catalogue.ts';
import { DOCS_FILE, problemsDoc } from '../../pipeline/problems/docs.ts';
import { formatProblem, problem, sortProblems } from '../../pipeline/problems/problem.ts';

const ROOT = join(import.meta.dirname, '../..');
const CATALOGUE = 'pipeline/problems/catalogue.ts';

function sources(dir: string): string[] {
  return readdirSync(join(ROOT, dir), { withFileTypes: true, recursive: true })
    .filter((d) => d.isFile() && /\.(ts|mjs|astro)$/.test(d.name))
    .map((d) => relative(ROOT, join(d.parentPath, d.name)))
    .filter((f) => f !== CATALOGUE);
}

const files = [...sources('pipeline'), ...sources('site')];
const codes = new Set(Object.keys(catalogue));
const areas = new Set([...codes].map((c) => c.split('/')[0]));

/** Every problem code written in the code base: after `code:`, as the first argument of problem()/wording(), or any literal of a known area. */
function codesUsed(): { file: string; code: string }[] {
  const found: { file: string; code: string }[] = [];
  for (const file of files) {
    const text = readFileSync(join(ROOT, file), 'utf8');
    // (zod's own issue codes, such as code: 'custom', have no slash.)
    for (const m of text.matchAll(/\bcode:\s*(['"])([^'"]*\/[^'"]*)\1/g)) found.push({ file, code: m[2]! });
    for (const m of text.matchAll(/\bcode:\s*`/g)) found.push({ file, code: `template at offset ${m.index}` });
    for (const m of text.matchAll(/\b(?:problem|wording|atWhere)\(\s*(?:[^,()]*,\s*)?(['"`])([a-z]+\/[a-z0-9${}-]+)\1/g)) found.push({ file, code: m[2]! });
    for (const m of text.matchAll(/(['"])([a-z]+)\/([a-z0-9-]+)\1/g)) if (areas.has(m[2]!)) found.push({ file, code: `${m[2]}/${m[3]}` });
  }
  return found;
}

describe('the problem catalogue', () => {
  it('lists every problem code the code base uses', () => {
    const used = codesUsed();
    // The scan itself must see the codes: it finds a good share of the catalogue.
    expect(new Set(used.map((u) => u.code)).size).toBeGreaterThan(codes.size / 2);
    const missing = used.filter((u) => !codes.has(u.code)).map((u) => `${u.file}: ${u.code}`);
    expect(missing, 'add these codes to pipeline/problems/catalogue.ts').toEqual([]);
  });

  it('has no entry that nothing uses', () => {
    const all = files.map((f) => readFileSync(join(ROOT, f), 'utf8')).join('\n');
    const unused = [...codes].filter((c) => !all.includes(`'${c}'`));
    expect(unused, 'remove these entries, or use them').toEqual([]);
  });

  it('gives every entry a title, and a message and hint worded from its example', () => {
    for (const [code, e] of Object.entries(catalogue) as [string, CatalogueEntry<unknown>][]) {
      expect(code).toMatch(/^[a-z]+\/[a-z0-9]+(-[a-z0-9]+)*$/);
      expect(e.title.length, code).toBeGreaterThan(3);
      const message = e.message(e.example);
      expect(message.length, code).toBeGreaterThan(10);
      expect(message, code).not.toMatch(/undefined|\[object/);
      const hint = e.hint(e.example);
      if (hint !== undefined) expect(hint, code).not.toMatch(/undefined|\[object/);
    }
  });

  it('builds problems with the entry severity and its wording', () => {
    const p = problem('plan/unknown-measure', { measure: 'frequncy', hint: 'did you mean "frequency"?' }, { file: 'exhibit.yaml', line: 12, column: 18, path: 'rooms[0].panels[1].measure' });
    expect(formatProblem(p)).toBe('exhibit.yaml:12:18 rooms[0].panels[1].measure: unknown measure "frequncy" — did you mean "frequency"?');
    expect(problem('plan/shared-alias', { name: 'rook', first: 'tamsin', second: 'jory' }).severity).toBe('warning');
  });

  it('has one order for problems, defined once: by file, line, column', () => {
    const definitions = files.filter((f) => /function sortProblems\b/.test(readFileSync(join(ROOT, f), 'utf8')));
    expect(definitions).toEqual(['pipeline/problems/problem.ts']);
    const at = (file: string | undefined, line?: number, column?: number) => ({ ...problem('note/not-drawn', {}), file, line, column });
    const sorted = sortProblems([at('b.yaml', 1, 1), at('a.yaml', 3, 2), at('a.yaml', 3, 1), at('a.yaml'), at(undefined, 9)]);
    expect(sorted.map((p) => `${p.file ?? ''}:${p.line ?? ''}:${p.column ?? ''}`)).toEqual([':9:', 'a.yaml::', 'a.yaml:3:1', 'a.yaml:3:2', 'b.yaml:1:1']);
  });

  it(`is what ${DOCS_FILE} lists (run "npm run docs" after changing the catalogue)`, () => {
    expect(readFileSync(join(ROOT, DOCS_FILE), 'utf8')).toBe(problemsDoc());
  });
});
