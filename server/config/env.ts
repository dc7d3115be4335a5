/**
 * Environment, parsed once at boot. `loadEnv()` throws a ConfigError naming every bad
 * variable; `server/index.ts` prints it and exits.
 */
import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], { message: 'expected true or false' })
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
    PORT: z.coerce.number({ message: 'must be a port number' }).int('must be a whole number').min(0).max(65535).default(3000),
    HOST: z.string().min(1).optional(),
    DATA_DIR: z.string().min(1).default('./data'),
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

export class ConfigError extends Error {
  override name = 'ConfigError';
}

/** Parses the environment (default `process.env`); empty strings count as unset. */
export function loadEnv(source: Record<string, string | undefined> = process.env): Env {
  const cleaned: Record<string, string> = {};
  for (const [key, value] of Object.entries(source)) {
    if (value !== undefined && value.trim() !== '') cleaned[key] = value.trim();
  }
  const parsed = envSchema.safeParse(cleaned);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(environment)'}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  return parsed.data;
}
