import { defineConfig } from 'vitest/config';

/** The cluster suite (`npm test -- cluster`): one file, long hooks, nothing in parallel. */
export default defineConfig({
  test: {
    include: ['cluster/**/*.spec.ts'],
    environment: 'node',
    testTimeout: 120_000,
    hookTimeout: 300_000,
    maxWorkers: 1,
  },
});
