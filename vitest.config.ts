import { defineConfig } from 'vitest/config';

// One config for every suite; scripts/test.ts runs the suites one after another
// (shared and reference in parallel files, api and e2e one file at a time,
// because they share one private database).
export default defineConfig({
  test: {
    environment: 'node',
    include: ['tests/**/*.test.ts'],
    testTimeout: 30_000,
    hookTimeout: 120_000,
  },
});
