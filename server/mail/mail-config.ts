/**
 * Mail settings from the environment. With SMTP_HOST unset (development, tests) the app
 * starts its own capture server (fake-smtp.ts) on a free local port and every message lands
 * in the outbox that admins read at /outbox.
 */
import { z } from 'zod';

export interface MailConfig {
  /** null: use the built-in capture server */
  host: string | null;
  port: number;
  user: string | null;
  pass: string | null;
  from: string;
  /** public address of the app, for links in messages */
  appUrl: string;
  /** hours an invitation link stays valid */
  inviteHours: number;
  /** minutes a password-reset link stays valid */
  resetMinutes: number;
}

const schema = z.object({
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  SMTP_FROM: z.string().default('Trestle <trestle@localhost>'),
  APP_URL: z.url('must be a URL such as https://trestle.example.com').optional(),
  PORT: z.string().optional(),
  INVITE_HOURS: z.coerce.number().positive().max(24 * 30).default(72),
  RESET_MINUTES: z.coerce.number().positive().max(24 * 60).default(60),
});

export function mailConfigFromEnv(env: Record<string, string | undefined> = process.env): MailConfig {
  const cleaned: Record<string, string> = {};
  for (const [k, v] of Object.entries(env)) if (v !== undefined && v.trim() !== '') cleaned[k] = v.trim();
  const e = schema.parse(cleaned);
  return {
    host: e.SMTP_HOST ?? null,
    port: e.SMTP_PORT ?? 587,
    user: e.SMTP_USER ?? null,
    pass: e.SMTP_PASS ?? null,
    from: e.SMTP_FROM,
    appUrl: (e.APP_URL ?? `http://localhost:${e.PORT ?? '3000'}`).replace(/\/+$/, ''),
    inviteHours: e.INVITE_HOURS,
    resetMinutes: e.RESET_MINUTES,
  };
}
