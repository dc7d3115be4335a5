import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { defineConfig } from 'vitest/config';
import { missingEngines } from './tests/scaled/engines.js';

/** The API suite: every tests/server file that builds its app with createTestApp. */
function apiTestFiles(): string[] {
  return readdirSync('tests/server', { recursive: true, encoding: 'utf8' })
    .filter((f) => f.endsWith('.test.ts'))
    .map((f) => path.posix.join('tests/server', f.split(path.sep).join('/')))
    .filter((f) => readFileSync(f, 'utf8').includes('createTestApp('))
    .sort();
}

const missing = missingEngines();

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
          exclude: ['tests/scaled/api-missing.test.ts'],
          environment: 'node',
          testTimeout: 180000,
          hookTimeout: 240000,
          fileParallelism: false,
        },
      },
      {
        // the API suite a second time on PostgreSQL, Redis and two worker processes, two
        // web-server instances per test app (tests/scaled/api-setup.ts); without the engines
        // one file that says what is missing
        test: missing
          ? { name: 'scaled-api', include: ['tests/scaled/api-missing.test.ts'], environment: 'node' }
          : {
              name: 'scaled-api',
              include: apiTestFiles(),
              environment: 'node',
              globalSetup: ['tests/scaled/api-setup.ts'],
              setupFiles: ['tests/scaled/api-env.ts'],
              testTimeout: 60000,
              hookTimeout: 180000,
              // one database and one Redis for all files: one file at a time
              fileParallelism: false,
            },
      },
    ],
  },
});
