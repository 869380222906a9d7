import { defineConfig } from 'vitest/config';

// Two cores in CI: one fork per core keeps timings honest and memory low.
export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    pool: 'forks',
    maxWorkers: 2,
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
