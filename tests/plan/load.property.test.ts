// Property tests for the plan loader: any text in, a plan or problems out — never an exception —
// and every problem placed inside the file, with a code of the catalogue, a message, and no plan
// when there is an error. Seeded, and few enough runs for the unit tests.
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { loadPlan } from '../../pipeline/plan/load.ts';
import { catalogue } from '../../pipeline/problems/catalogue.ts';
import { hasErrors } from '../../pipeline/problems/problem.ts';
import { fakeRegistry } from './fake-registry.ts';

const RUNS = { seed: 4242, numRuns: 150 };

// A copy of the valid fixture exhibit, whose plan each run overwrites.
const root = mkdtempSync(path.join(tmpdir(), 'vitrine-plan-prop-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));
cpSync(path.resolve(import.meta.dirname, '../fixtures/plans/valid'), path.join(root, 'content'), { recursive: true });
const planFile = path.join(root, 'content/exhibit.yaml');
const valid = readFileSync(planFile, 'utf8');

async function load(text: string | Uint8Array) {
  writeFileSync(planFile, text);
  return loadPlan('content/exhibit.yaml', fakeRegistry, { cwd: root });
}

/** Lines and their lengths as an editor counts them (LF, CRLF or CR end a line). */
function lineLengths(text: string): number[] {
  return text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/).map((l) => l.length);
}

async function holds(text: string): Promise<void> {
  const r = await load(text);
  const lengths = lineLengths(text);
  for (const p of r.problems) {
    expect(Object.hasOwn(catalogue, p.code), p.code).toBe(true);
    expect(p.message.length).toBeGreaterThan(0);
    expect(p.file).toBe('content/exhibit.yaml');
    if (p.line !== undefined) {
      expect(p.line).toBeGreaterThanOrEqual(1);
      expect(p.line).toBeLessThanOrEqual(lengths.length);
      if (p.column !== undefined) {
        expect(p.column).toBeGreaterThanOrEqual(1);
        expect(p.column).toBeLessThanOrEqual(lengths[p.line - 1]! + 1);
      }
    }
  }
  expect(r.plan === null).toBe(hasErrors(r.problems));
}

/** One to four keystrokes a curator could make in the valid plan: characters YAML cares about, typed, deleted or doubled. */
const edited = fc
  .array(
    fc.record({
      at: fc.nat(),
      kind: fc.constantFrom('insert', 'delete', 'double-line'),
      char: fc.constantFrom('{', '}', '[', ']', ':', ',', '-', '#', '&', '*', '!', '|', '>', '"', "'", '\t', ' ', '\n', '\r\n', '\\', '%', '@', '`', '?', 'x', '0', '\u202E', '\uFEFF'),
    }),
    { minLength: 1, maxLength: 4 },
  )
  .map((edits) => {
    let text = valid;
    for (const e of edits) {
      const at = e.at % (text.length + 1);
      if (e.kind === 'insert') text = text.slice(0, at) + e.char + text.slice(at);
      else if (e.kind === 'delete') text = text.slice(0, at) + text.slice(at + 1);
      else {
        const start = text.lastIndexOf('\n', at - 1) + 1;
        const end = text.indexOf('\n', at);
        const line = text.slice(start, end < 0 ? text.length : end + 1);
        text = text.slice(0, start) + line + text.slice(start);
      }
    }
    return text;
  });

describe('the plan loader, on any input', () => {
  it('loads the unbroken fixture without problems (the properties below start from it)', async () => {
    expect((await load(valid)).problems).toEqual([]);
  });

  it('never throws on a plan with a few keystrokes wrong, and places every problem inside the file', async () => {
    await fc.assert(fc.asyncProperty(edited, holds), RUNS);
  });

  it('never throws on any text at all', async () => {
    const text = fc.oneof(fc.string({ unit: 'binary', maxLength: 300 }), fc.string({ unit: fc.constantFrom('a', ':', ' ', '\n', '-', '{', '}', '[', ']', '"', '\t', '&', '*', '#'), maxLength: 200 }));
    await fc.assert(fc.asyncProperty(text, holds), RUNS);
  });

  it('never throws on any bytes, and refuses those that are not text at the first bad byte', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 200 }), async (bytes) => {
        const r = await load(bytes);
        expect(r.plan === null).toBe(hasErrors(r.problems));
        for (const p of r.problems) expect(Object.hasOwn(catalogue, p.code), p.code).toBe(true);
      }),
      RUNS,
    );
  });
});
