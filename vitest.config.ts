import { defineConfig } from 'vitest/config';

// Unit tests: pure pipeline code, no build, no browser.
export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    exclude: ['tests/build/**', 'tests/browser/**', 'node_modules/**'],
    testTimeout: 20_000,
  },
});
