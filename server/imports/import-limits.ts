/** Upload limits, from IMPORT_MAX_MB (default 20) and IMPORT_MAX_ROWS (default 200 000). */
import { z } from 'zod';

export interface ImportLimits {
  maxBytes: number;
  maxRows: number;
  maxFiles: number;
  /** how long a pending import waits for its commit */
  ttlMs: number;
}

const schema = z.object({
  IMPORT_MAX_MB: z.coerce.number().positive().max(1024).default(20),
  IMPORT_MAX_ROWS: z.coerce.number().int().positive().default(200_000),
});

export function importLimits(env: Record<string, string | undefined> = process.env): ImportLimits {
  const parsed = schema.safeParse({
    IMPORT_MAX_MB: env.IMPORT_MAX_MB?.trim() || undefined,
    IMPORT_MAX_ROWS: env.IMPORT_MAX_ROWS?.trim() || undefined,
  });
  const v = parsed.success ? parsed.data : schema.parse({});
  return { maxBytes: Math.round(v.IMPORT_MAX_MB * 1024 * 1024), maxRows: v.IMPORT_MAX_ROWS, maxFiles: 30, ttlMs: 60 * 60 * 1000 };
}

export function describeBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${+(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.ceil(bytes / 1024)} kB`;
}
