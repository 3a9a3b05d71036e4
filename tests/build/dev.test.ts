import { describe, it, expect, afterAll } from 'vitest';
import { spawn } from 'node:child_process';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, cleanEnv, demoCopy } from './helpers.ts';
import { checkoutPort } from '../support/ports.ts';

const { dir, plan } = demoCopy();
const port = checkoutPort(2);
const server = spawn(process.execPath, [join(ROOT, 'bin/vitrine.mjs'), 'dev', plan, '--port', String(port)], {
  cwd: dir,
  env: cleanEnv(),
  stdio: 'pipe',
});
let log = '';
server.stdout.on('data', (d) => (log += d));
server.stderr.on('data', (d) => (log += d));

afterAll(() => {
  server.kill('SIGTERM');
  rmSync(dir, { recursive: true, force: true });
});

async function page(path: string): Promise<string> {
  for (let i = 0; i < 100; i++) {
    try {
      const r = await fetch(`http://127.0.0.1:${port}${path}`);
      if (r.ok) return await r.text();
      log += `\n(test) ${path} answered ${r.status}`;
    } catch {
      // not up yet
    }
    await new Promise((done) => setTimeout(done, 300));
  }
  throw new Error(`the preview never answered ${path}:\n${log}`);
}

/** Polls until the page shows `want`, after an edit. */
async function until(path: string, want: RegExp): Promise<string> {
  for (let i = 0; i < 60; i++) {
    const html = await page(path);
    if (want.test(html)) return html;
    await new Promise((done) => setTimeout(done, 250));
  }
  throw new Error(`the preview never showed ${want} on ${path}:\n${log}`);
}

function edit(file: string, from: string | RegExp, to: string): void {
  writeFileSync(file, readFileSync(file, 'utf8').replace(from, to));
}

describe('vitrine dev', () => {
  it('follows edits to the plan, a caption and the text, and survives a broken plan', async () => {
    const first = (await import('yaml')).parse(readFileSync(plan, 'utf8')).rooms[0];
    const panel = first.panels[0];
    const path = `/${first.id}/${panel.id}/`;
    expect(await page(path)).toContain(`<h1>${panel.title}</h1>`);
    edit(plan, `title: ${panel.title}`, 'title: A title changed during the preview');
    await until(path, /<h1>A title changed during the preview<\/h1>/);
    writeFileSync(join(dir, 'content', panel.caption), 'A caption rewritten during the preview.\n');
    await until(path, /A caption rewritten during the preview\./);
    // A broken plan keeps the last good exhibit on screen and says what is wrong.
    edit(plan, `measure: ${panel.measure}`, 'measure: nonesuch');
    await until(path, /A title changed during the preview/);
    await new Promise((done) => setTimeout(done, 1500));
    expect(log).toMatch(/unknown measure "nonesuch"/);
    edit(plan, 'measure: nonesuch', `measure: ${panel.measure}`);
    edit(plan, 'title: A title changed during the preview', 'title: Mended again');
    await until(path, /<h1>Mended again<\/h1>/);
  });
});
