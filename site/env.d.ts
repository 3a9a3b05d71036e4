/// <reference types="astro/client" />

declare module 'virtual:vitrine/exhibit' {
  const exhibit: import('../pipeline/prepared.ts').PreparedExhibit;
  export default exhibit;
}
