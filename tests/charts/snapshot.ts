/**
 * Expected-SVG snapshots kept as files under tests/charts/snapshots. Before
 * comparing, numbers are cleaned to 3 decimals and ids renumbered in order
 * of appearance, and tags are put one per line so a diff reads well.
 *
 * A missing snapshot is written only outside CI (the `CI` variable unset,
 * empty, "0" or "false"), and the check passes; in CI it fails, so a
 * snapshot deleted by mistake cannot pass unnoticed. A drawing that differs
 * from its snapshot fails anywhere and is written beside it as
 * "<name>-changed.svg" (ignored by git) for a reader to compare.
 */

import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

const DIR = join(dirname(fileURLToPath(import.meta.url)), 'snapshots');

/** Whether the tests run in continuous integration, judged from the `CI` variable as CI services set it. */
export function inCi(env: NodeJS.ProcessEnv = process.env): boolean {
  const v = (env.CI ?? '').trim().toLowerCase();
  return v !== '' && v !== '0' && v !== 'false';
}

/** Numbers to at most 3 decimals, ids renumbered ("id-1", "id-2", …), one tag per line. */
export function normaliseSvg(svg: string): string {
  const ids = Array.from(svg.matchAll(/\sid="([^"]+)"/g), (m) => m[1]);
  let out = svg;
  // Longest first, so an id that is a prefix of another is not replaced inside it.
  const order = ids.map((id, k) => ({ id, k })).sort((a, b) => b.id.length - a.id.length);
  for (const { id, k } of order) out = out.split(id).join(`\u0000${k + 1}\u0000`);
  out = out.replace(/\u0000(\d+)\u0000/g, 'id-$1');
  out = out.replace(/-?\d+\.\d+/g, (n) => {
    const r = Number(n).toFixed(3).replace(/\.?0+$/, '');
    return r === '-0' ? '0' : r;
  });
  return `${out.replace(/></g, '>\n<')}\n`;
}

/** Compares `svg` with the stored snapshot `name` (see the file comment); `dir` is for the tests of this file. */
export function expectSvgSnapshot(name: string, svg: string, dir: string = DIR): void {
  const file = join(dir, `${name}.svg`);
  const changed = join(dir, `${name}-changed.svg`);
  const actual = normaliseSvg(svg);
  if (!existsSync(file)) {
    expect(
      inCi(),
      `SVG snapshot "${name}" is missing (${file}); run the tests outside CI to write it, look at it, and commit it`,
    ).toBe(false);
    mkdirSync(dir, { recursive: true });
    writeFileSync(file, actual);
    return;
  }
  const expected = readFileSync(file, 'utf8');
  if (expected === actual) {
    if (existsSync(changed)) rmSync(changed);
    return;
  }
  writeFileSync(changed, actual);
  expect(actual, `SVG "${name}" differs from its snapshot; the new drawing is in ${changed}`).toBe(expected);
}
