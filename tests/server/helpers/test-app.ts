/**
 * A fresh app over a fresh in-memory database, migrated like a real one, for API tests.
 *
 *   const t = await createTestApp();            // demo accounts only
 *   const res = await t.as('engineer').get('/api/projects');
 *   afterAll(() => t.close());
 *
 * On the engines (the `scaled-api` vitest project, tests/scaled/api-setup.ts sets
 * TRESTLE_TEST_DATABASE_URL and QUEUE_URL): the database is the throwaway PostgreSQL, emptied
 * (every table truncated, Redis's shared counters cleared) when no other test app is open;
 * `app` is a front that hands requests in turn to TWO web-server instances (two createApp,
 * each with its own DataSource and connection pool) in this process, and runs, uploads,
 * member pages, exports and suggestions go through the queue to the two worker processes.
 * Tests that mean nothing there skip with `it.skipIf(onlyEmbedded('reason'))`.
 */
import express, { type Express } from 'express';
import { Redis } from 'ioredis';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { Role } from '../../../shared/schemas/users.js';
import { createApp } from '../../../server/app.js';
import { hashPassword } from '../../../server/auth/password.js';
import { SESSION_COOKIE, signSession } from '../../../server/auth/session-token.js';
import type { AppConfig } from '../../../server/config/app-config.js';
import { createLogger, type LogLevel } from '../../../server/config/logger.js';
import { mailerFor } from '../../../server/mail/mailer.js';
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
  /** A raw query with `?` placeholders on either database (PostgreSQL gets `$1`, `$2`, …); quote camelCase names. */
  sql(query: string, params?: unknown[]): Promise<any>;
  /** Waits until every mail this app's server instances queued is in the outbox. */
  mailIdle(): Promise<void>;
  /** Signs in with e-mail and password; returns the cookie header value or throws. */
  signIn(email: string, password: string): Promise<string>;
  close(): Promise<void>;
}

let demoHash: Promise<string> | undefined;

/** PostgreSQL of the `scaled-api` project, or undefined for the embedded SQLite. */
const ENGINE_DATABASE_URL = process.env.TRESTLE_TEST_DATABASE_URL || undefined;
/** True when this suite runs against PostgreSQL, Redis and worker processes. */
export const onEngines = !!ENGINE_DATABASE_URL;

/**
 * For `it.skipIf(onlyEmbedded('why'))` / `describe.skipIf(...)`: true (skip) on the engines.
 * The reason says why the test means nothing there (it stays in the source, next to the test).
 */
export function onlyEmbedded(reason: string): boolean {
  if (!reason) throw new Error('onlyEmbedded: say why');
  return onEngines;
}

/** The two web-server instances behind a test app's front (for listRoutes). */
const INSTANCES = Symbol('trestle test app instances');
export function appInstances(app: Express): Express[] {
  return (app as unknown as { [INSTANCES]?: Express[] })[INSTANCES] ?? [app];
}

let openOnEngines = 0;

/** Waits (up to `ms`) until no run or task job is waiting or in hand, so nothing writes into the next test's data. */
async function queuesIdle(redis: Redis, ms = 60_000): Promise<void> {
  const until = Date.now() + ms;
  for (;;) {
    const counts = await Promise.all(
      ['bull:trestle-runs', 'bull:trestle-tasks'].flatMap((q) => [redis.llen(`${q}:wait`), redis.llen(`${q}:active`), redis.zcard(`${q}:prioritized`), redis.zcard(`${q}:delayed`)]),
    );
    if (counts.every((n) => n === 0) || Date.now() > until) return;
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Empties the shared PostgreSQL database and the shared counters in Redis (queues and worker heartbeats stay). */
async function resetEngines(dataSource: DataSource): Promise<void> {
  const redis = new Redis(process.env.QUEUE_URL!, { maxRetriesPerRequest: 3 });
  try {
    await queuesIdle(redis);
    const keys: string[] = [];
    let cursor = '0';
    do {
      const [next, batch] = await redis.scan(cursor, 'MATCH', 'trestle:*', 'COUNT', 1000);
      cursor = next;
      keys.push(...batch.filter((k) => !k.startsWith('trestle:worker:')));
    } while (cursor !== '0');
    if (keys.length) await redis.del(...keys);
  } finally {
    redis.disconnect();
  }
  const tables = (await dataSource.query(
    `SELECT tablename FROM pg_tables WHERE schemaname = current_schema() AND tablename NOT IN ('migrations', 'typeorm_metadata')`,
  )) as { tablename: string }[];
  // identities are NOT restarted: a worker's cache of an earlier test's run or model must never match a new one's id
  if (tables.length) await dataSource.query(`TRUNCATE ${tables.map((t) => `"${t.tablename}"`).join(', ')} CASCADE`);
}

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
  const seed = options.seed ?? 'accounts';
  const config = testConfig(options.config);
  const logger = createLogger(options.logLevel ?? 'silent');
  let dataSource: DataSource;
  let app: Express;
  let close: () => Promise<void>;
  let sources: DataSource[];
  // nested test apps on the engines share the one database: only the first empties and seeds it
  let seeded = false;
  if (ENGINE_DATABASE_URL) {
    const opened = await Promise.all([openDatabase({ url: ENGINE_DATABASE_URL }), openDatabase({ url: ENGINE_DATABASE_URL })]);
    sources = opened.map((o) => o.dataSource);
    dataSource = sources[0]!;
    if (openOnEngines === 0) await resetEngines(dataSource);
    else seeded = (await dataSource.getRepository('User').count()) > 0;
    openOnEngines++;
    const instances = sources.map((ds) => createApp({ config, dataSource: ds, logger }));
    let turn = 0;
    app = express();
    app.disable('x-powered-by');
    app.use((req, res, next) => instances[turn++ % instances.length]!(req, res, next));
    (app as unknown as { [INSTANCES]: Express[] })[INSTANCES] = instances;
    close = async () => {
      openOnEngines--;
      await Promise.all(sources.map((ds) => ds.destroy()));
    };
  } else {
    dataSource = (await openDatabase({ database: ':memory:' })).dataSource;
    sources = [dataSource];
    app = createApp({ config, dataSource, logger });
    close = () => dataSource.destroy();
  }
  let users: Partial<Record<Role, UserRecord>> = {};
  if (seed === 'demo' && !seeded) await seedDemoData(dataSource);
  if (seed === 'accounts' && !seeded) {
    demoHash ??= hashPassword(DEMO_PASSWORD);
    const hash = await demoHash;
    users = await dataSource.transaction((m) => seedDemoAccounts(m, hash));
  }
  if (seed === 'demo' && !seeded) {
    for (const u of await dataSource.getRepository('User').find()) users[(u as UserRecord).role] = u as UserRecord;
  }
  if (seeded) {
    for (const u of await dataSource.getRepository('User').find()) {
      const user = u as UserRecord;
      if (DEMO_ACCOUNTS.some((a) => a.email === user.email)) users[user.role] = user;
    }
  }

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

  const mailIdle = async () => {
    await Promise.all(sources.map((ds) => mailerFor(ds, logger).idle()));
  };

  const sql = (query: string, params: unknown[] = []) => {
    let n = 0;
    return dataSource.query(ENGINE_DATABASE_URL ? query.replace(/\?/g, () => `$${++n}`) : query, params);
  };

  return { app, dataSource, config, users, cookieFor, as, signIn, sql, mailIdle, close };
}
