import { defineCollection } from 'astro:content';
import { glob } from 'astro/loaders';
// Served by the integration (site/integration.ts): the exhibit folder and the caption files the plan names.
import { dir, files } from 'virtual:vitrine/captions';

export const collections = {
  captions: defineCollection({
    loader: glob({
      base: dir,
      // Only the files the plan names: a stray draft in the folder is never built.
      pattern: files.length ? files : '__none__',
      generateId: ({ entry }) => entry,
    }),
  }),
};
