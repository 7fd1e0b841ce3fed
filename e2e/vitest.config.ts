import { defineConfig } from 'vitest/config';

// Browser tests against a running Rhotrace (E2E_BASE_URL); one browser at a time, shared data.
export default defineConfig({
  test: {
    include: ['**/*.e2e.ts'],
    testTimeout: 180_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    sequence: { concurrent: false },
    reporters: ['default'],
  },
});
