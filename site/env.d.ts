/// <reference types="astro/client" />

declare module 'virtual:vitrine/exhibit' {
  const exhibit: import('../pipeline/stages/prepared.ts').PreparedExhibit;
  export default exhibit;
}

declare module 'virtual:vitrine/captions' {
  /** The exhibit folder: caption paths are relative to it. */
  export const dir: string;
  /** The caption and introduction files the plan names. */
  export const files: string[];
}
