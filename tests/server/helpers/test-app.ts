/**
 * A fresh app over a fresh in-memory database, migrated like a real one, for API tests.
 *
 *   const t = await createTestApp();            // demo accounts only
 *   const res = await t.as('engineer').get('/api/projects');
 *   afterAll(() => t.close());
 */
import type { Express } from 'express';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { Role } from '../../../shared/schemas/users.js';
import { createApp } from '../../../server/app.js';
import { hashPassword } from '../../../server/auth/password.js';
import { SESSION_COOKIE, signSession } from '../../../server/auth/session-token.js';
import type { AppConfig } from '../../../server/config/app-config.js';
import { createLogger, type LogLevel } from '../../../server/config/logger.js';
import { openDatabase } from '../../../server/db/data-source.js';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, seedDemoAccounts, seedDemoData } from '../../../server/db/seed.js';
import type { UserRecord } from '../../../server/users/user.entity.js';

export interface TestAppOptions {
  /** 'accounts' (default): the four demo accounts; 'demo': everything a new database gets; 'none'. */
  seed?: 'accounts' | 'demo' | 'none';
  config?: Partial<AppConfig>;
  logLevel?: LogLevel;
}

export interface TestApp {
  app: Express;
  dataSource: DataSource;
  config: AppConfig;
  /** Demo users by role (empty when seed is 'none'). */
  users: Partial<Record<Role, UserRecord>>;
  /** Session cookie (`name=value`) of the demo account of a role (minted, not via login). */
  cookieFor(role: Role): string;
  /** A request builder that sends the role's session cookie. */
  as(role: Role): {
    get(url: string): request.Test;
    post(url: string): request.Test;
    patch(url: string): request.Test;
    put(url: string): request.Test;
    delete(url: string): request.Test;
  };
  /** Signs in with e-mail and password; returns the cookie header value or throws. */
  signIn(email: string, password: string): Promise<string>;
  close(): Promise<void>;
}

let demoHash: Promise<string> | undefined;

export const TEST_JWT_SECRET = 'test-secret-test-secret-test-secret-0123456789';

export function testConfig(overrides: Partial<AppConfig> = {}): AppConfig {
  return {
    jwtSecret: TEST_JWT_SECRET,
    sessionHours: 1,
    cookieSecure: false,
    loginRateLimit: 1000,
    loginRateWindowMs: 60_000,
    trustProxy: false,
    distDir: '/nonexistent-trestle-dist',
    dataDir: '/nonexistent-trestle-data',
    production: false,
    ...overrides,
  };
}

/** The `name=value` part of the session cookie in a response, or null. */
export function sessionCookie(res: request.Response): string | null {
  const raw = res.headers['set-cookie'] as unknown as string[] | string | undefined;
  const list = Array.isArray(raw) ? raw : raw ? [raw] : [];
  const found = list.find((c) => c.startsWith('trestle_session=') && !c.startsWith('trestle_session=;'));
  return found ? found.split(';')[0]! : null;
}

export async function createTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const { dataSource } = await openDatabase({ database: ':memory:' });
  let users: Partial<Record<Role, UserRecord>> = {};
  const seed = options.seed ?? 'accounts';
  if (seed === 'demo') await seedDemoData(dataSource);
  if (seed === 'accounts') {
    demoHash ??= hashPassword(DEMO_PASSWORD);
    const hash = await demoHash;
    users = await dataSource.transaction((m) => seedDemoAccounts(m, hash));
  }
  if (seed === 'demo') {
    for (const u of await dataSource.getRepository('User').find()) users[(u as UserRecord).role] = u as UserRecord;
  }
  const config = testConfig(options.config);
  const app = createApp({ config, dataSource, logger: createLogger(options.logLevel ?? 'silent') });

  const signIn = async (email: string, password: string) => {
    const res = await request(app).post('/api/auth/login').send({ email, password });
    const cookie = sessionCookie(res);
    if (res.status !== 200 || !cookie) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return cookie;
  };
  // A session cookie for every seeded demo account, minted directly (login itself is
  // tested in auth.test.ts; bcrypt compares would slow every suite).
  const cookies = new Map<Role, string>();
  for (const account of DEMO_ACCOUNTS) {
    const u = users[account.role];
    if (u) cookies.set(account.role, `${SESSION_COOKIE}=${signSession(config, u.id, u.sessionVersion)}`);
  }
  const cookieFor = (role: Role) => {
    const c = cookies.get(role);
    if (!c) throw new Error(`no demo ${role} in this test app (seed: ${seed})`);
    return c;
  };
  const as = (role: Role) => {
    const c = cookieFor(role);
    return {
      get: (url: string) => request(app).get(url).set('Cookie', c),
      post: (url: string) => request(app).post(url).set('Cookie', c),
      patch: (url: string) => request(app).patch(url).set('Cookie', c),
      put: (url: string) => request(app).put(url).set('Cookie', c),
      delete: (url: string) => request(app).delete(url).set('Cookie', c),
    };
  };

  return { app, dataSource, config, users, cookieFor, as, signIn, close: () => dataSource.destroy() };
}
