import { defineConfig } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { checkoutPort } from '../support/ports.ts';

// The web server command runs from this folder; the site is built at the project root.
const ROOT = resolve(import.meta.dirname, '../..');

const tmp = resolve(ROOT, '.vitrine/browser-tmp');
mkdirSync(tmp, { recursive: true });
process.env.TMPDIR = tmp;

export const PORT = checkoutPort(1);
export const BASE = '/exhibit/';

export default defineConfig({
  testDir: '.',
  testMatch: '*.spec.ts',
  outputDir: resolve(ROOT, '.vitrine/test-results'),
  workers: 2,
  reporter: [['list']],
  use: {
    baseURL: `http://127.0.0.1:${PORT}`,
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
        '--disable-quic',
      ],
    },
  },
  webServer: {
    command: `node serve.mjs ${resolve(ROOT, '.vitrine/browser-site')} ${PORT} ${BASE}`,
    url: `http://127.0.0.1:${PORT}${BASE}`,
    reuseExistingServer: false,
    timeout: 30_000,
  },
});
