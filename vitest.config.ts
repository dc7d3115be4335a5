import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/**/*.test.ts'],
          exclude: ['tests/e2e/**', 'tests/scaled/**'],
          environment: 'node',
          testTimeout: 30000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 120000,
          hookTimeout: 180000,
          fileParallelism: false,
        },
      },
      {
        // the scaled mode against real PostgreSQL and Redis (tests/scaled/); skips, naming what is missing
        test: {
          name: 'scaled',
          include: ['tests/scaled/**/*.test.ts'],
          environment: 'node',
          testTimeout: 180000,
          hookTimeout: 240000,
          fileParallelism: false,
        },
      },
    ],
  },
});
