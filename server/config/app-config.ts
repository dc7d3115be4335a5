/** What the Express app needs to know, resolved from the environment (or built by tests). */
import path from 'node:path';
import type { Env } from './env.js';

export interface AppConfig {
  /** Signing secret for session tokens. */
  jwtSecret: string;
  /** Session lifetime in hours. */
  sessionHours: number;
  /** Mark the session cookie Secure (default: in production). */
  cookieSecure: boolean;
  /** Failed login attempts allowed per window per client address. */
  loginRateLimit: number;
  loginRateWindowMs: number;
  /** Express `trust proxy` (true behind one reverse proxy). */
  trustProxy: boolean;
  /** Folder of the built client (`CLIENT_DIST`, default `dist/`). */
  distDir: string;
  /** Folder for the database and other files. */
  dataDir: string;
  production: boolean;
}

export function appConfigFromEnv(env: Env, jwtSecret: string): AppConfig {
  const production = env.NODE_ENV === 'production';
  return {
    jwtSecret,
    sessionHours: env.SESSION_HOURS,
    cookieSecure: env.COOKIE_SECURE ?? production,
    loginRateLimit: env.LOGIN_RATE_LIMIT,
    loginRateWindowMs: env.LOGIN_RATE_WINDOW_MINUTES * 60_000,
    trustProxy: env.TRUST_PROXY,
    distDir: path.resolve(env.CLIENT_DIST),
    dataDir: path.resolve(env.DATA_DIR),
    production,
  };
}
