/** The IMPORT_* variables: defaults, values, and a clear boot error for a bad one. */
import { describe, expect, it } from 'vitest';
import { ConfigError, loadEnv } from '../../../server/config/env.js';
import { importLimits } from '../../../server/imports/import-limits.js';

describe('import limits from the environment', () => {
  it('gives the documented defaults', () => {
    const l = importLimits({});
    expect(l).toMatchObject({ maxBytes: 20 * 1024 ** 2, maxRequestBytes: 40 * 1024 ** 2, maxRows: 200_000, concurrency: 1, queue: 8, maxListedProblems: 1000 });
    expect(l.xlsx).toEqual({ maxSheets: 50, maxRows: 200_000, maxColumns: 200, maxCells: 4_000_000, maxUncompressedBytes: 200 * 1024 ** 2 });
  });

  it('reads each variable, and falls back to the default for a bad value', () => {
    const l = importLimits({ IMPORT_MAX_CELLS: '1000', IMPORT_MAX_UNCOMPRESSED_MB: '0.5', IMPORT_MAX_COLUMNS: 'many', IMPORT_CONCURRENCY: '2' });
    expect(l.xlsx).toMatchObject({ maxCells: 1000, maxUncompressedBytes: 512 * 1024, maxColumns: 200 });
    expect(l.concurrency).toBe(2);
  });

  it('stops the server at boot with a message naming a bad variable', () => {
    expect(() => loadEnv({ IMPORT_MAX_COLUMNS: 'many', RUN_RATE_LIMIT: '0' })).toThrow(ConfigError);
    try {
      loadEnv({ IMPORT_MAX_COLUMNS: 'many', RUN_RATE_LIMIT: '0' });
    } catch (e) {
      expect((e as Error).message).toMatch(/IMPORT_MAX_COLUMNS: must be a whole number/);
      expect((e as Error).message).toMatch(/RUN_RATE_LIMIT: /);
    }
  });
});
