import { describe, it, expect, vi, afterAll } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { EventEmitter } from 'node:events';

const calls = vi.hoisted(() => ({ prepare: 0 }));
vi.mock('../../pipeline/exhibit.ts', async (original) => (await import('../support/prepare-count.ts')).countingExhibit(original as never, calls));

const { prepareExhibit } = await import('../../pipeline/exhibit.ts');
const { default: vitrine } = await import('../../site/integration.ts');

const ROOT = join(import.meta.dirname, '../..');
// The demo exhibit, measured once into a scratch cache.
const PLAN = join(ROOT, 'content/exhibit.yaml');
const CACHE = mkdtempSync(join(tmpdir(), 'vitrine-integration-'));
afterAll(() => rmSync(CACHE, { recursive: true, force: true }));

type Hooks = Record<string, (arg: never) => unknown>;
type Plugin = { resolveId(id: string): string | undefined; load(id: string): string | undefined };

async function setUp(options: Parameters<typeof vitrine>[0]) {
  const integration = vitrine(options);
  const hooks = integration.hooks as unknown as Hooks;
  let plugin: Plugin | undefined;
  let base: string | undefined;
  const logger = { info: () => {}, warn: () => {}, error: () => {} };
  await hooks['astro:config:setup']!({
    config: { root: new URL(`file://${ROOT}/`) },
    logger,
    updateConfig: (c: { base: string; vite: { plugins: Plugin[] } }) => {
      base = c.base;
      plugin = c.vite.plugins[0];
    },
  } as never);
  const load = (id: string) => plugin!.load(plugin!.resolveId(id)!)!;
  return { hooks, load, base, logger };
}

describe('the Astro integration', () => {
  it('serves the exhibit it is handed, without preparing it again', async () => {
    const result = await prepareExhibit(PLAN, { cacheDir: CACHE });
    calls.prepare = 0;
    const { load, base } = await setUp({ plan: PLAN, prepared: result, cacheDir: CACHE });
    expect(calls.prepare).toBe(0);
    expect(base).toBe(result.prepared!.exhibit.base);
    expect(load('virtual:vitrine/exhibit')).toBe(`export default ${JSON.stringify(result.prepared)};`);
    // The caption collection's file list comes from the same exhibit, not from the environment.
    const captions = load('virtual:vitrine/captions');
    expect(captions).toContain(`export const dir = ${JSON.stringify(result.dir)};`);
    expect(captions).toContain(`export const files = ${JSON.stringify(result.prepared!.captionFiles)};`);
  });

  it('prepares the exhibit itself when Astro runs on its own, once', async () => {
    calls.prepare = 0;
    await setUp({ plan: PLAN, cacheDir: CACHE });
    expect(calls.prepare).toBe(1);
  });

  it('prepares again once per change of a watched file in the live preview', async () => {
    const result = await prepareExhibit(PLAN, { cacheDir: CACHE });
    const { hooks, logger } = await setUp({ plan: PLAN, prepared: result, cacheDir: CACHE });
    calls.prepare = 0;
    const watcher = Object.assign(new EventEmitter(), { add: () => {} });
    const sent: unknown[] = [];
    const server = { watcher, ws: { send: (m: unknown): void => void sent.push(m) }, environments: {}, restart: async () => {} };
    hooks['astro:server:setup']!({ server, logger } as never);
    const done = new Promise<void>((resolve) => {
      server.ws.send = (m: unknown) => {
        sent.push(m);
        resolve();
      };
    });
    watcher.emit('change', join(ROOT, 'README.md')); // not watched
    watcher.emit('change', PLAN);
    await done;
    expect(calls.prepare).toBe(1);
    expect(sent).toEqual([{ type: 'full-reload' }]);
  });
});
