/**
 * Upload limits, from the IMPORT_* variables (server/config/env.ts validates them at boot;
 * here a bad value falls back to its default).
 */
import { z } from 'zod';
import type { XlsxLimits } from '../../shared/reader/xlsx.js';
import { cleanEnv, importEnvShape } from '../config/env.js';

export interface ImportLimits {
  /** per file */
  maxBytes: number;
  /** the whole request (every file and field together) */
  maxRequestBytes: number;
  maxRows: number;
  maxFiles: number;
  /** checked while a workbook is read */
  xlsx: XlsxLimits;
  /** imports read at once (in the run worker pool), and imports waiting for their turn */
  concurrency: number;
  queue: number;
  /** problems listed in a preview (all are counted) */
  maxListedProblems: number;
  /** how long a pending import waits for its commit */
  ttlMs: number;
}

const schema = z.object(importEnvShape);

/** The variable that sets each workbook limit (named in refusals). */
export const XLSX_LIMIT_VARIABLES: Record<keyof XlsxLimits, string> = {
  maxSheets: 'IMPORT_MAX_SHEETS',
  maxRows: 'IMPORT_MAX_ROWS',
  maxColumns: 'IMPORT_MAX_COLUMNS',
  maxCells: 'IMPORT_MAX_CELLS',
  maxUncompressedBytes: 'IMPORT_MAX_UNCOMPRESSED_MB',
};

export function importLimits(env: Record<string, string | undefined> = process.env): ImportLimits {
  const cleaned = cleanEnv(env);
  const values: Record<string, unknown> = {};
  for (const [key, field] of Object.entries(importEnvShape)) {
    if (key in cleaned && field.safeParse(cleaned[key]).success) values[key] = cleaned[key];
  }
  const v = schema.parse(values);
  const mib = (x: number) => Math.round(x * 1024 * 1024);
  return {
    maxBytes: mib(v.IMPORT_MAX_MB),
    maxRequestBytes: mib(v.IMPORT_MAX_REQUEST_MB),
    maxRows: v.IMPORT_MAX_ROWS,
    maxFiles: 30,
    xlsx: {
      maxSheets: v.IMPORT_MAX_SHEETS,
      maxRows: v.IMPORT_MAX_ROWS,
      maxColumns: v.IMPORT_MAX_COLUMNS,
      maxCells: v.IMPORT_MAX_CELLS,
      maxUncompressedBytes: mib(v.IMPORT_MAX_UNCOMPRESSED_MB),
    },
    concurrency: v.IMPORT_CONCURRENCY,
    queue: v.IMPORT_QUEUE,
    maxListedProblems: 1000,
    ttlMs: 60 * 60 * 1000,
  };
}

export function describeBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${+(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.ceil(bytes / 1024)} kB`;
}
