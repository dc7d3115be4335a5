/**
 * /api/auth — POST /login (public, rate-limited), POST /logout (public),
 * GET /me and POST /password (any signed-in user).
 */
import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { AppContext } from '../app.js';
import { AppError } from '../errors/app-error.js';
import { currentUser, requireAuth } from '../middleware/auth.js';
import { toUser } from '../users/user.service.js';
import { revokeSession } from '../security/session-revocation.js';
import { sharedRateStore } from '../queue/rate-store.js';
import { changePassword, login } from './auth.service.js';
import { SESSION_COOKIE, sessionCookieOptions, signSession } from './session-token.js';

export function authRouter(ctx: AppContext): Router {
  const { config, dataSource } = ctx;
  const router = Router();
  const cookie = sessionCookieOptions(config);
  const { maxAge: _maxAge, ...clearCookie } = cookie;

  const loginLimiter = rateLimit({
    windowMs: config.loginRateWindowMs,
    limit: config.loginRateLimit,
    skipSuccessfulRequests: true,
    store: sharedRateStore('login'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError(429, 'rate_limited', 'Too many failed sign-in attempts; wait a few minutes and try again')),
  });

  router.post('/login', loginLimiter, async (req, res) => {
    const user = await login(dataSource, req.body ?? {});
    res.cookie(SESSION_COOKIE, signSession(config, user.id, user.sessionVersion), cookie);
    res.json(toUser(user));
  });

  router.post('/logout', async (req, res) => {
    // only a valid session (authenticate set req.user) is revoked: any other cookie writes nothing
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (req.user && typeof token === 'string' && token) await revokeSession(dataSource, token);
    res.clearCookie(SESSION_COOKIE, clearCookie);
    res.status(204).end();
  });

  router.get('/me', requireAuth, (req, res) => {
    res.json(toUser(currentUser(req)));
  });

  router.post('/password', requireAuth, async (req, res) => {
    const user = await changePassword(dataSource, currentUser(req), req.body ?? {});
    res.cookie(SESSION_COOKIE, signSession(config, user.id, user.sessionVersion), cookie);
    res.status(204).end();
  });

  return router;
}
