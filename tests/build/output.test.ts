import { describe, it, expect, afterAll } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { ROOT, demoCopy, treeHashes, vitrine } from './helpers.ts';

// Issue 8: "vitrine build --out content" replaced the exhibit with the site, and "--out ."
// deleted a curator's file. A build replaces only a folder that is new, empty or its own.
const scratch: string[] = [];
afterAll(() => scratch.forEach((d) => rmSync(d, { recursive: true, force: true })));
const cache = mkdtempSync(join(tmpdir(), 'vitrine-out-cache-'));
scratch.push(cache);
const withCache = ['--cache', cache];
function copy() {
  const c = demoCopy();
  scratch.push(c.dir);
  return c;
}

describe('vitrine build refuses an output folder that is not its own, and deletes nothing', () => {
  it('--out content: the exhibit folder', () => {
    const { dir, plan } = copy();
    const before = treeHashes(dir);
    const r = vitrine(['build', plan, '--out', 'content', ...withCache], dir);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^content: the output folder is the exhibit folder, .* — build into a folder of its own with --out/m);
    expect(r.stderr).toMatch(/Nothing was built; .*content is unchanged/);
    expect(treeHashes(dir)).toEqual(before);
  });

  it('--out . inside the exhibit folder, beside a file of the curator’s', () => {
    const { dir, plan } = copy();
    writeFileSync(join(dir, 'content', 'draft-caption-ideas.txt'), 'Ask the Circle about the ferry steps.\n');
    const before = treeHashes(dir);
    const r = vitrine(['build', plan, '--out', '.', ...withCache], join(dir, 'content'));
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^\.: the output folder is the exhibit folder/m);
    expect(treeHashes(dir)).toEqual(before);
  });

  it('--out at a folder of other files; and it removes what a killed build left behind', () => {
    const { dir, plan } = copy();
    mkdirSync(join(dir, 'papers'));
    writeFileSync(join(dir, 'papers', 'minutes.txt'), 'Thursday: the flood chapter.\n');
    const before = treeHashes(dir);
    // A build that was killed left its private folder; its process is gone.
    const gone = spawnSync(process.execPath, ['-e', '0']).pid!;
    const stale = join(ROOT, '.vitrine/builds', `${gone}-1700000000000`);
    mkdirSync(join(stale, '_astro'), { recursive: true });
    writeFileSync(join(stale, 'index.html'), 'half a site');
    const r = vitrine(['build', plan, '--out', 'papers', ...withCache], dir);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^papers: the output folder holds files that no Vitrine build wrote \(minutes\.txt\)/m);
    expect(treeHashes(dir)).toEqual(before);
    expect(existsSync(stale)).toBe(false);
  });
});
