/** The session cookie: a signed JWT carrying the user id and session version. */
import { randomUUID } from 'node:crypto';
import type { CookieOptions } from 'express';
import jwt from 'jsonwebtoken';
import type { AppConfig } from '../config/app-config.js';

export const SESSION_COOKIE = 'trestle_session';

export interface SessionClaims {
  /** User id. */
  sub: string;
  /** The user's sessionVersion when the token was issued. */
  ver: number;
}

export function signSession(config: AppConfig, userId: number, version: number): string {
  return jwt.sign({ ver: version }, config.jwtSecret, {
    algorithm: 'HS256',
    subject: String(userId),
    // a random id makes every session distinct, so signing one out never touches another
    jwtid: randomUUID(),
    expiresIn: Math.round(config.sessionHours * 3600),
  });
}

/** The claims of a valid, unexpired token, else null. */
export function verifySession(config: AppConfig, token: string): SessionClaims | null {
  try {
    const claims = jwt.verify(token, config.jwtSecret, { algorithms: ['HS256'] });
    if (typeof claims === 'string' || typeof claims.sub !== 'string' || typeof claims.ver !== 'number') return null;
    return { sub: claims.sub, ver: claims.ver };
  } catch {
    return null;
  }
}

export function sessionCookieOptions(config: AppConfig): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.cookieSecure,
    path: '/',
    maxAge: Math.round(config.sessionHours * 3600 * 1000),
  };
}
