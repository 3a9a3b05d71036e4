import { describe, it, expect, afterAll } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { BUILD_MARKER, checkOutputFolder, cleanStaleBuilds, markBuild, processAlive, swapInto } from '../../pipeline/stages/output.ts';
import type { Protected } from '../../pipeline/stages/output.ts';

const dirs: string[] = [];
afterAll(() => dirs.forEach((d) => rmSync(d, { recursive: true, force: true })));
function scratch(): string {
  const d = mkdtempSync(join(tmpdir(), 'vitrine-out-'));
  dirs.push(d);
  return d;
}

/** A project folder: an exhibit (plan, text, caption) and nothing else yet. */
function project() {
  const root = scratch();
  mkdirSync(join(root, 'content/captions'), { recursive: true });
  writeFileSync(join(root, 'content/exhibit.yaml'), 'version: 1\n');
  writeFileSync(join(root, 'content/tale.txt'), 'A short tale.\n');
  writeFileSync(join(root, 'content/captions/one.mdx'), 'A caption.\n');
  const protect: Protected[] = [
    { path: join(root, 'content'), what: 'the exhibit folder' },
    { path: join(root, 'content/exhibit.yaml'), what: 'the plan' },
    { path: join(root, 'content/tale.txt'), what: 'a file the plan names' },
    { path: join(root, 'content/captions/one.mdx'), what: 'a file the plan names' },
  ];
  return { root, protect };
}

const refused = (out: string, protect: Protected[], cwd: string) => checkOutputFolder(out, protect, cwd).map((p) => `${p.file}: ${p.message} — ${p.hint}`);

describe('which output folders a build may replace', () => {
  it('a new folder, an empty one, or one a build marked', () => {
    const { root, protect } = project();
    expect(refused(join(root, 'dist'), protect, root)).toEqual([]);
    mkdirSync(join(root, 'empty'));
    expect(refused(join(root, 'empty'), protect, root)).toEqual([]);
    mkdirSync(join(root, 'site'));
    writeFileSync(join(root, 'site/index.html'), '<!doctype html>');
    markBuild(join(root, 'site'));
    expect(refused(join(root, 'site'), protect, root)).toEqual([]);
  });

  it('never the exhibit folder, a folder above it, or one that holds a file the plan names', () => {
    const { root, protect } = project();
    expect(refused(join(root, 'content'), protect, root)).toEqual([expect.stringMatching(/^content: the output folder is the exhibit folder, .* — build into a folder of its own/)]);
    expect(refused(root, protect, join(root, 'content'))).toEqual([expect.stringContaining(`${root}: the output folder holds the exhibit folder (.),`)]);
    expect(refused(join(root, 'content/captions'), protect, root)).toEqual([expect.stringMatching(/holds a file the plan names \(content\/captions\/one\.mdx\)/)]);
    // Even when a build's marker is there: a caption moved into an old build folder is still the curator's.
    markBuild(join(root, 'content/captions'));
    expect(refused(join(root, 'content/captions'), protect, root)).toHaveLength(1);
  });

  it('sees through a symbolic link to the exhibit folder', () => {
    const { root, protect } = project();
    symlinkSync(join(root, 'content'), join(root, 'link'));
    expect(refused(join(root, 'link'), protect, root)).toEqual([expect.stringMatching(/is the exhibit folder/)]);
  });

  it('refuses a folder of other files, naming some of them and what to do', () => {
    const { root, protect } = project();
    mkdirSync(join(root, 'papers'));
    for (const f of ['minutes.txt', 'letter.txt', 'photo.png', 'rota.txt']) writeFileSync(join(root, 'papers', f), 'x');
    const [message] = refused(join(root, 'papers'), protect, root);
    expect(message).toMatch(/^papers: the output folder holds files that no Vitrine build wrote \((letter|minutes|photo|rota)[^)]*… \(4 in all\)\)/);
    expect(message).toMatch(/choose another folder with --out, or move those files away/);
    // A marker file that is not a build's own does not count.
    writeFileSync(join(root, 'papers', BUILD_MARKER), 'my notes\n');
    expect(refused(join(root, 'papers'), protect, root)).toHaveLength(1);
  });

  it('refuses a file and a symbolic link as the output folder', () => {
    const { root, protect } = project();
    writeFileSync(join(root, 'notes.txt'), 'x');
    expect(refused(join(root, 'notes.txt'), protect, root)).toEqual([expect.stringMatching(/is a file, not a folder/)]);
    mkdirSync(join(root, 'real'));
    symlinkSync(join(root, 'real'), join(root, 'dist'));
    expect(refused(join(root, 'dist'), protect, root)).toEqual([expect.stringMatching(/is a symbolic link/)]);
  });
});

describe('swapping a new site in', () => {
  it('replaces a marked build and leaves nothing staged beside it', () => {
    const root = scratch();
    mkdirSync(join(root, 'dist'));
    writeFileSync(join(root, 'dist/old.html'), 'old');
    markBuild(join(root, 'dist'));
    const work = join(root, 'work');
    mkdirSync(work);
    writeFileSync(join(work, 'index.html'), 'new');
    markBuild(work);
    expect(swapInto(work, join(root, 'dist'), root)).toEqual([]);
    expect(readFileSync(join(root, 'dist/index.html'), 'utf8')).toBe('new');
    expect(existsSync(join(root, 'dist/old.html'))).toBe(false);
    expect(spawnSync('ls', ['-A', root], { encoding: 'utf8' }).stdout.trim()).toBe('dist');
  });

  it('discards the new site when a file of someone else appeared in the folder during the build', () => {
    const root = scratch();
    mkdirSync(join(root, 'dist'));
    writeFileSync(join(root, 'dist/draft.txt'), 'written while the site was building');
    const work = join(root, 'work');
    mkdirSync(work);
    writeFileSync(join(work, 'index.html'), 'new');
    expect(swapInto(work, join(root, 'dist'), root)).toHaveLength(1);
    expect(readFileSync(join(root, 'dist/draft.txt'), 'utf8')).toBe('written while the site was building');
    expect(spawnSync('ls', ['-A', root], { encoding: 'utf8' }).stdout.trim()).toBe('dist');
  });
});

describe('cleaning up after killed builds', () => {
  it('removes build folders whose process is gone, and keeps those of running processes', () => {
    const root = scratch();
    const gone = spawnSync(process.execPath, ['-e', '0']).pid!;
    expect(processAlive(gone)).toBe(false);
    const builds = join(root, 'builds');
    for (const name of [`${gone}-1700000000000`, `${process.pid}-1700000000000`, 'notes']) mkdirSync(join(builds, name), { recursive: true });
    for (const name of [`.dist.new-${gone}-1700000000000`, `.dist.old-${gone}-1`, `.dist.new-${process.pid}-1`, '.distant.new-1-1']) mkdirSync(join(root, name));
    const removed = cleanStaleBuilds(builds, join(root, 'dist'));
    expect(removed.map((r) => r.slice(root.length + 1)).sort()).toEqual([`.dist.new-${gone}-1700000000000`, `.dist.old-${gone}-1`, `builds/${gone}-1700000000000`]);
    expect(spawnSync('ls', ['-A', builds], { encoding: 'utf8' }).stdout.split('\n').filter(Boolean).sort()).toEqual([`${process.pid}-1700000000000`, 'notes']);
  });
});
