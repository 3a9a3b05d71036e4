import { describe, it, expect, vi, afterAll } from 'vitest';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { ROOT } from './helpers.ts';

// Count every preparation of the exhibit, by the command and by the Astro integration alike:
// both reach prepareExhibit through this one module.
const calls = vi.hoisted(() => ({ prepare: 0 }));
vi.mock('../../pipeline/exhibit.ts', async (original) => (await import('../support/prepare-count.ts')).countingExhibit(original as never, calls));

const scratch = mkdtempSync(join(tmpdir(), 'vitrine-once-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('vitrine build', () => {
  it('prepares the exhibit once: Astro is handed the exhibit the command checked', async () => {
    const { main } = await import('../../pipeline/cli.ts');
    const out = join(scratch, 'site');
    let said = '';
    const io = { out: (s: string) => void (said += s), err: (s: string) => void (said += s) };
    const status = await main(['build', join(ROOT, 'content/exhibit.yaml'), '--out', out, '--cache', join(scratch, 'cache'), '--quiet'], io);
    expect(status, said).toBe(0);
    expect(existsSync(join(out, 'index.html'))).toBe(true);
    expect(calls.prepare).toBe(1);
  });
});
