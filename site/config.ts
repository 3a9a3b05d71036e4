/**
 * The site's Astro configuration, as a function of typed options: `vitrine build`
 * and `vitrine dev` call it with the exhibit they have already prepared (and the
 * fresh folder to build into); astro.config.mjs calls it with a plan path, for
 * running Astro by itself (astro check). Nothing is passed through the environment.
 */
import type { AstroUserConfig } from 'astro';
import mdx from '@astrojs/mdx';
import { createHash } from 'node:crypto';
import { dirname, join, resolve } from 'node:path';
import vitrine from './integration.ts';
import type { VitrineOptions } from './integration.ts';

export interface SiteOptions extends VitrineOptions {
  /** The project folder: where site/, public/ and node_modules live. */
  root: string;
  /** Where the site is written. Default: dist/ in the project folder. */
  outDir?: string;
}

export function siteConfig(options: SiteOptions): AstroUserConfig {
  const { root, outDir, ...exhibit } = options;
  // Astro caches the content layer (the rendered captions) by entry id. Two exhibit folders
  // have the same caption ids, so each folder gets its own cache.
  const exhibitDir = exhibit.prepared ? exhibit.prepared.dir : dirname(resolve(root, exhibit.plan ?? 'content/exhibit.yaml'));
  const cacheDir = join(root, '.vitrine/astro-cache', createHash('sha256').update(exhibitDir).digest('hex').slice(0, 12));
  return {
    root,
    srcDir: './site',
    cacheDir,
    publicDir: './public',
    outDir: outDir ?? './dist',
    trailingSlash: 'always',
    build: { format: 'directory' },
    devToolbar: { enabled: false },
    integrations: [mdx(), vitrine(exhibit)],
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
  };
}
