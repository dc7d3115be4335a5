/**
 * CSRF protection for cookie sessions, by request origin (no token to carry around):
 * a state-changing /api request (POST, PUT, PATCH, DELETE) is refused with 403 when
 *   - the browser says it is not same-origin (`Sec-Fetch-Site` other than `same-origin`
 *     or `none`), or
 *   - without `Sec-Fetch-Site`, an `Origin` header names another host than the request's
 *     `Host` (or than APP_URL, when set).
 * Browsers always send one of the two on cross-site POSTs; requests with neither come from
 * non-browser clients (curl, tests), which carry no ambient cookies to abuse. The session
 * cookie is also SameSite=Lax, so it is never sent on cross-site subrequests.
 */
import type { RequestHandler } from 'express';
import { forbidden } from '../errors/app-error.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

export function csrfGuard(appUrl?: string | null): RequestHandler {
  const allowedOrigins = new Set<string>();
  if (appUrl) allowedOrigins.add(new URL(appUrl).origin);
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const site = req.get('sec-fetch-site');
    if (site !== undefined) {
      return next(site === 'same-origin' || site === 'none' ? undefined : forbidden('Cross-site request refused'));
    }
    const origin = req.get('origin');
    if (origin === undefined) return next();
    let host: string | null = null;
    try {
      host = new URL(origin).host;
    } catch {
      host = null;
    }
    if (origin !== 'null' && host !== null && (host === req.get('host') || allowedOrigins.has(origin))) return next();
    next(forbidden('Cross-site request refused'));
  };
}
