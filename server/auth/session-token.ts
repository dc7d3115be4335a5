/** The session cookie: a signed JWT carrying the user id and session version. */
import { createSecretKey, randomUUID, type KeyObject } from 'node:crypto';
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

/**
 * The secret as a key object, made once per secret: given the secret as a string, jsonwebtoken
 * first tries to read it as a public key and throws that attempt away — about a millisecond of
 * the HTTP thread on every request that carries a session.
 */
const keys = new Map<string, KeyObject>();
function sessionKey(config: AppConfig): KeyObject {
  let key = keys.get(config.jwtSecret);
  if (!key) {
    key = createSecretKey(Buffer.from(config.jwtSecret, 'utf8'));
    keys.set(config.jwtSecret, key);
  }
  return key;
}

export function signSession(config: AppConfig, userId: number, version: number): string {
  return jwt.sign({ ver: version }, sessionKey(config), {
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
    const claims = jwt.verify(token, sessionKey(config), { algorithms: ['HS256'] });
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
