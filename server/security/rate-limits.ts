/** Rate limits of the public account routes (forgot password, set password). */
import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { AppError } from '../errors/app-error.js';
import { sharedRateStore } from '../queue/rate-store.js';

export interface AccountRateLimits {
  /** requests per window per client address */
  limit: number;
  windowMs: number;
}

export function accountRateLimitsFromEnv(env: Record<string, string | undefined> = process.env): AccountRateLimits {
  const v = z.coerce.number().int().positive().default(5).safeParse(env.RESET_RATE_LIMIT?.trim() || undefined);
  return { limit: v.success ? v.data : 5, windowMs: 15 * 60_000 };
}

/** `name` keeps the limiters apart and the same on every web server (their counts are shared in Redis). */
export function accountLimiter(limits: AccountRateLimits, name: 'forgot' | 'set-password'): RequestHandler {
  return rateLimit({
    windowMs: limits.windowMs,
    limit: limits.limit,
    store: sharedRateStore(`account:${name}`),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many requests; wait a few minutes and try again')),
  });
}
