/// <reference types="astro/client" />

declare module 'virtual:vitrine/exhibit' {
  const exhibit: import('../pipeline/stages/prepared.ts').PreparedExhibit;
  export default exhibit;
}
