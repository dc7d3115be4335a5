/**
 * Who is calling. `authenticate` (mounted once on /api) reads the session cookie and loads
 * the user on every request, so deactivated users and old sessions stop working at once.
 * Guard every route with `requireAuth` or `requireRole(...)`:
 *
 *   router.get('/', requireRole(...rolesAtLeast('viewer')), handler);
 *   router.delete('/:id', requireRole('lead', 'admin'), handler);
 */
import type { RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import type { Role } from '../../shared/schemas/users.js';
import type { AppConfig } from '../config/app-config.js';
import { forbidden, unauthorized } from '../errors/app-error.js';
import { SESSION_COOKIE, verifySession } from '../auth/session-token.js';
import { UserEntity, type UserRecord } from '../users/user.entity.js';
import { isRevoked } from '../security/session-revocation.js';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** The signed-in, active user, set by `authenticate`. */
      user?: UserRecord;
    }
  }
}

export function authenticate(config: AppConfig, dataSource: DataSource): RequestHandler {
  const users = dataSource.getRepository(UserEntity);
  return async (req, _res, next) => {
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof token === 'string' && token) {
      const claims = verifySession(config, token);
      const id = claims ? Number(claims.sub) : NaN;
      if (claims && Number.isSafeInteger(id) && !(await isRevoked(dataSource, token))) {
        const user = await users.findOneBy({ id });
        if (user && user.active && user.sessionVersion === claims.ver) req.user = user;
      }
    }
    next();
  };
}

/** 401 unless signed in. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthorized());
};

/** 401 unless signed in, 403 unless the user's role is one of `roles`. */
export function requireRole(...roles: Role[]): RequestHandler {
  const allowed = new Set(roles);
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!allowed.has(req.user.role)) return next(forbidden());
    next();
  };
}

/** The signed-in user; only call behind requireAuth/requireRole. */
export function currentUser(req: { user?: UserRecord }): UserRecord {
  if (!req.user) throw unauthorized();
  return req.user;
}
