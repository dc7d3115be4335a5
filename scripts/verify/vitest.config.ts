/**
 * The verification run: the sourced verification tests (analysis, design, moving loads,
 * stability, section properties, samples), with ./setup.ts recording the numbers of each
 * comparison and the JSON reporter writing titles, locations and records.
 */
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export const VERIFICATION_DIRS = [
  'tests/shared/engine',
  'tests/shared/design',
  'tests/shared/moving',
  'tests/shared/stability',
  'tests/shared/sections',
  'tests/samples',
];

const root = fileURLToPath(new URL('../../', import.meta.url));

export default defineConfig({
  root,
  test: {
    include: VERIFICATION_DIRS.map((d) => `${d}/**/*.test.ts`),
    environment: 'node',
    testTimeout: 120000,
    includeTaskLocation: true,
    setupFiles: [fileURLToPath(new URL('./setup.ts', import.meta.url))],
    reporters: ['dot', ['json', { outputFile: process.env.VERIFY_JSON ?? 'docs/verification/results.json' }]],
    maxWorkers: Number(process.env.VERIFY_WORKERS ?? 2),
  },
});
