import { defineConfig } from 'vitest/config';

// Build tests: run the vitrine CLI end to end (check, measure, build) on the demo and on broken plans.
export default defineConfig({
  test: {
    include: ['tests/build/**/*.test.ts'],
    testTimeout: 240_000,
    hookTimeout: 240_000,
    fileParallelism: false,
  },
});
