/**
 * CSRF protection for cookie sessions, by request origin (no token to carry around):
 * a state-changing /api request (POST, PUT, PATCH, DELETE) is refused with 403 when
 *   - the browser says it is not same-origin (`Sec-Fetch-Site` other than `same-origin`
 *     or `none`), or
 *   - without `Sec-Fetch-Site`, an `Origin` header names another origin — scheme, host and
 *     port compared — than the request's own (`req.protocol` + `Host`) or APP_URL's.
 * Browsers always send one of the two on cross-site POSTs; requests with neither come from
 * non-browser clients (curl, tests), which carry no ambient cookies to abuse. The session
 * cookie is also SameSite=Lax, so it is never sent on cross-site subrequests.
 */
import type { RequestHandler } from 'express';
import { forbidden } from '../errors/app-error.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** `scheme://host:port` with default ports dropped, or null for `null` and anything unparsable. */
function originOf(text: string): string | null {
  try {
    const o = new URL(text).origin;
    return o === 'null' ? null : o;
  } catch {
    return null;
  }
}

export function csrfGuard(appUrl?: string | null): RequestHandler {
  const allowedOrigins = new Set<string>();
  const app = appUrl ? originOf(appUrl) : null;
  if (app) allowedOrigins.add(app);
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const site = req.get('sec-fetch-site');
    if (site !== undefined) {
      return next(site === 'same-origin' || site === 'none' ? undefined : forbidden('Cross-site request refused'));
    }
    const origin = req.get('origin');
    if (origin === undefined) return next();
    const given = originOf(origin);
    const own = originOf(`${req.protocol}://${req.get('host') ?? ''}`);
    if (given !== null && (given === own || allowedOrigins.has(given))) return next();
    next(forbidden('Cross-site request refused'));
  };
}
