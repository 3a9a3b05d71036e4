import { defineCollection } from 'astro:content';
import { glob } from 'astro/loaders';

// The integration (site/integration.ts) sets these before the content layer
// loads: the exhibit folder and the caption files the plan names.
const base = process.env.VITRINE_EXHIBIT_DIR ?? './content';
const files: string[] = JSON.parse(process.env.VITRINE_CAPTIONS ?? '[]');

export const collections = {
  captions: defineCollection({
    loader: glob({
      base,
      // Only the files the plan names: a stray draft in the folder is never built.
      pattern: files.length ? files : '__none__',
      generateId: ({ entry }) => entry,
    }),
  }),
};
