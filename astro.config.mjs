// @ts-check
// Running Astro by itself (astro check, astro build) reads the demo's plan. `vitrine build`
// and `vitrine dev` do not read this file: they hand siteConfig the exhibit they prepared.
import { defineConfig } from 'astro/config';
import { fileURLToPath } from 'node:url';
import { siteConfig } from './site/config.ts';

export default defineConfig(siteConfig({ root: fileURLToPath(new URL('.', import.meta.url)), plan: 'content/exhibit.yaml' }));
