// @ts-check
import { defineConfig } from 'astro/config';
import mdx from '@astrojs/mdx';
import vitrine from './site/integration.ts';
import { createHash } from 'node:crypto';
import { dirname, resolve } from 'node:path';

// Astro caches the content layer (the rendered captions) by entry id. Two exhibit folders
// have the same caption ids, so each folder gets its own cache.
const exhibitDir = dirname(resolve(process.env.VITRINE_PLAN ?? 'content/exhibit.yaml'));
const cacheDir = `./.vitrine/astro-cache/${createHash('sha256').update(exhibitDir).digest('hex').slice(0, 12)}`;

// The exhibit plan is read by the vitrine integration: set VITRINE_PLAN to
// build another plan than content/exhibit.yaml. `vitrine build` sets
// VITRINE_OUT_DIR to a fresh folder and swaps it into dist/ on success.
export default defineConfig({
  srcDir: './site',
  cacheDir,
  publicDir: './public',
  outDir: process.env.VITRINE_OUT_DIR ?? './dist',
  trailingSlash: 'always',
  build: { format: 'directory' },
  devToolbar: { enabled: false },
  integrations: [mdx(), vitrine()],
  vite: {
    build: {
      rollupOptions: {
        // MDX captions carry Astro's own "use astro:head-inject" directive; the bundler's
        // notice about it says nothing a curator can act on.
        onwarn(warning, warn) {
          if (warning.code === 'MODULE_LEVEL_DIRECTIVE') return;
          warn(warning);
        },
      },
    },
  },
});
