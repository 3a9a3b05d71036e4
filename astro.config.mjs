// @ts-check
import { defineConfig } from 'astro/config';
import mdx from '@astrojs/mdx';
import vitrine from './site/integration.ts';

// The exhibit plan is read by the vitrine integration: set VITRINE_PLAN to
// build another plan than content/exhibit.yaml. `vitrine build` sets
// VITRINE_OUT_DIR to a fresh folder and swaps it into dist/ on success.
export default defineConfig({
  srcDir: './site',
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
