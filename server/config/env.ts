/**
 * Environment, parsed once at boot. `loadEnv()` throws a ConfigError naming every bad
 * variable; `server/index.ts` prints it and exits.
 */
import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], { message: 'expected true or false' })
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const count = (fallback: number) => z.coerce.number({ message: 'must be a whole number' }).int('must be a whole number').positive().default(fallback);
const megabytes = (fallback: number) => z.coerce.number({ message: 'must be a number of MB' }).positive().max(4096).default(fallback);

/** Upload limits (server/imports/import-limits.ts). */
export const importEnvShape = {
  IMPORT_MAX_MB: megabytes(20),
  IMPORT_MAX_REQUEST_MB: megabytes(40),
  IMPORT_MAX_ROWS: count(200_000),
  IMPORT_MAX_SHEETS: count(50),
  IMPORT_MAX_COLUMNS: count(200),
  IMPORT_MAX_CELLS: count(4_000_000),
  IMPORT_MAX_UNCOMPRESSED_MB: megabytes(200),
  IMPORT_CONCURRENCY: count(1),
  IMPORT_QUEUE: count(8),
};

/** Requests per user per window on the expensive routes (server/security/rate-limits.ts). */
export const fairnessEnvShape = {
  RATE_WINDOW_MINUTES: z.coerce.number({ message: 'must be a number of minutes' }).positive().default(1),
  RUN_RATE_LIMIT: count(10),
  IMPORT_RATE_LIMIT: count(10),
  EXPORT_RATE_LIMIT: count(20),
  COMPARE_RATE_LIMIT: count(30),
};

/** The scaled mode (issue 15): PostgreSQL instead of SQLite, a Redis queue instead of in-process threads. */
export const scaledEnvShape = {
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgres:// URL (unset: SQLite under DATA_DIR)').optional(),
  QUEUE_URL: z.string().regex(/^rediss?:\/\//, 'must be a redis:// URL (unset: runs in threads of this process)').optional(),
  /** jobs one `npm run worker` process works on at once */
  WORKER_CONCURRENCY: count(1),
};

const envSchema = z
  .object({
    ...importEnvShape,
    ...fairnessEnvShape,
    NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
    PORT: z.coerce.number({ message: 'must be a port number' }).int('must be a whole number').min(0).max(65535).default(3000),
    HOST: z.string().min(1).optional(),
    DATA_DIR: z.string().min(1).default('./data'),
    CLIENT_DIST: z.string().min(1).default('./dist'),
    JWT_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
    SESSION_HOURS: z.coerce.number({ message: 'must be a number of hours' }).positive().max(24 * 90).default(12),
    COOKIE_SECURE: bool.optional(),
    LOGIN_RATE_LIMIT: z.coerce.number({ message: 'must be a whole number' }).int().positive().default(10),
    LOGIN_RATE_WINDOW_MINUTES: z.coerce.number({ message: 'must be a number of minutes' }).positive().default(15),
    TRUST_PROXY: bool.default(false),
    SEED_DEMO: bool.default(true),
    ADMIN_EMAIL: z.email('must be an e-mail address').optional(),
    ADMIN_PASSWORD: z.string().min(8, 'must be at least 8 characters').max(72).optional(),
    LOG_LEVEL: z.enum(['silent', 'error', 'warn', 'info', 'debug']).default('info'),
    ...scaledEnvShape,
  })
  .superRefine((env, ctx) => {
    if (!!env.ADMIN_EMAIL !== !!env.ADMIN_PASSWORD) {
      ctx.addIssue({ code: 'custom', path: [env.ADMIN_EMAIL ? 'ADMIN_PASSWORD' : 'ADMIN_EMAIL'], message: 'ADMIN_EMAIL and ADMIN_PASSWORD go together' });
    }
    if (env.NODE_ENV === 'production' && !env.JWT_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['JWT_SECRET'], message: 'is required when NODE_ENV=production' });
    }
  });

export type Env = z.output<typeof envSchema>;

/** The environment with empty values dropped (they count as unset). */
export function cleanEnv(source: Record<string, string | undefined>): Record<string, string> {
  const cleaned: Record<string, string> = {};
  for (const [key, value] of Object.entries(source)) {
    if (value !== undefined && value.trim() !== '') cleaned[key] = value.trim();
  }
  return cleaned;
}

export class ConfigError extends Error {
  override name = 'ConfigError';
}

/** Parses the environment (default `process.env`); empty strings count as unset. */
export function loadEnv(source: Record<string, string | undefined> = process.env): Env {
  const parsed = envSchema.safeParse(cleanEnv(source));
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(environment)'}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/** For entry points (server, worker): the environment, or the configuration errors printed and exit 1. */
export function loadEnvOrExit(): Env {
  try {
    return loadEnv();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
}
