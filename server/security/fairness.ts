/**
 * Fairness: per-user rate limits on the expensive authenticated routes (issue 12, item 5).
 * Each kind of route has its own budget of requests per user per window (RUN_RATE_LIMIT,
 * IMPORT_RATE_LIMIT, EXPORT_RATE_LIMIT, COMPARE_RATE_LIMIT per RATE_WINDOW_MINUTES); over it,
 * 429 with Retry-After and the standard error body. Keyed by user id (express-rate-limit),
 * so colleagues behind one address do not share a budget. Signed-out calls pass through to
 * the route's own 401.
 */
import type { Request, RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { cleanEnv, fairnessEnvShape } from '../config/env.js';
import { AppError } from '../errors/app-error.js';
import { sharedRateStore } from '../queue/rate-store.js';

export interface FairRoute {
  name: 'runs' | 'imports' | 'exports' | 'compare';
  method: string;
  path: RegExp;
  /** the variable that sets its budget */
  variable: keyof typeof fairnessEnvShape;
  what: string;
}

export const FAIR_ROUTES: FairRoute[] = [
  { name: 'runs', method: 'POST', path: /^\/api\/models\/[^/]+\/runs\/?$/, variable: 'RUN_RATE_LIMIT', what: 'runs started' },
  { name: 'imports', method: 'POST', path: /^\/api\/projects\/[^/]+\/imports\/?$/, variable: 'IMPORT_RATE_LIMIT', what: 'uploads' },
  {
    name: 'exports',
    method: 'GET',
    path: /^\/api\/(runs\/[^/]+\/exports\/[^/]+|models\/[^/]+\/versions\/[^/]+\/workbook\.(xlsx|zip))$/,
    variable: 'EXPORT_RATE_LIMIT',
    what: 'exports',
  },
  { name: 'compare', method: 'GET', path: /^\/api\/runs\/compare\/?$/, variable: 'COMPARE_RATE_LIMIT', what: 'run comparisons' },
];

export interface FairnessLimits {
  windowMs: number;
  limits: Record<FairRoute['name'], number>;
}

/** From the environment (server/config/env.ts validates at boot; here a bad value falls back to its default). */
export function fairnessLimitsFromEnv(env: Record<string, string | undefined> = process.env): FairnessLimits {
  const cleaned = cleanEnv(env);
  const values: Record<string, unknown> = {};
  for (const [key, field] of Object.entries(fairnessEnvShape)) {
    if (key in cleaned && field.safeParse(cleaned[key]).success) values[key] = cleaned[key];
  }
  const v = z.object(fairnessEnvShape).parse(values);
  return {
    windowMs: v.RATE_WINDOW_MINUTES * 60_000,
    limits: { runs: v.RUN_RATE_LIMIT, imports: v.IMPORT_RATE_LIMIT, exports: v.EXPORT_RATE_LIMIT, compare: v.COMPARE_RATE_LIMIT },
  };
}

function describeWindow(ms: number): string {
  const minutes = ms / 60_000;
  return minutes === 1 ? 'a minute' : `${+minutes.toFixed(2)} minutes`;
}

/** One middleware for /api: finds the route's budget and applies it to the signed-in user. */
export function fairness(limits: FairnessLimits = fairnessLimitsFromEnv()): RequestHandler {
  const limiters = new Map<FairRoute['name'], RequestHandler>();
  for (const route of FAIR_ROUTES) {
    const limit = limits.limits[route.name];
    limiters.set(
      route.name,
      rateLimit({
        windowMs: limits.windowMs,
        limit,
        standardHeaders: 'draft-8',
        legacyHeaders: false,
        keyGenerator: (req: Request) => `user:${req.user!.id}`,
        // with QUEUE_URL the counts live in Redis, shared by every web server
        store: sharedRateStore(`fair:${route.name}`),
        handler: (req, _res, next) => {
          const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
          const seconds = reset ? Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 1000)) : Math.ceil(limits.windowMs / 1000);
          next(
            new AppError(429, 'rate_limited', `Too many ${route.what}: at most ${limit} per user in ${describeWindow(limits.windowMs)} (${route.variable}); try again in ${seconds} s`, {
              retryAfterSeconds: seconds,
              limit,
              variable: route.variable,
            }),
          );
        },
      }),
    );
  }
  return (req, res, next) => {
    if (!req.user) return next();
    const path = req.originalUrl.split('?')[0]!;
    const route = FAIR_ROUTES.find((r) => r.method === req.method && r.path.test(path));
    if (!route) return next();
    return limiters.get(route.name)!(req, res, next);
  };
}
