import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { appConfigFromEnv } from '../../server/config/app-config.js';
import { ConfigError, loadEnv } from '../../server/config/env.js';
import { resolveJwtSecret } from '../../server/config/secret.js';

describe('environment', () => {
  it('has the documented defaults', () => {
    const env = loadEnv({});
    expect(env).toMatchObject({ NODE_ENV: 'development', PORT: 3000, DATA_DIR: './data', SESSION_HOURS: 12, SEED_DEMO: true, LOGIN_RATE_LIMIT: 10 });
    expect(env.JWT_SECRET).toBeUndefined();
  });

  it('reads values and treats empty strings as unset', () => {
    const env = loadEnv({ PORT: '8080', DATA_DIR: '/var/lib/trestle', SESSION_HOURS: '', SEED_DEMO: 'false', COOKIE_SECURE: 'true' });
    expect(env).toMatchObject({ PORT: 8080, DATA_DIR: '/var/lib/trestle', SESSION_HOURS: 12, SEED_DEMO: false, COOKIE_SECURE: true });
  });

  it('requires JWT_SECRET in production, naming the variable', () => {
    expect(() => loadEnv({ NODE_ENV: 'production' })).toThrow(ConfigError);
    expect(() => loadEnv({ NODE_ENV: 'production' })).toThrow(/JWT_SECRET: is required when NODE_ENV=production/);
    const env = loadEnv({ NODE_ENV: 'production', JWT_SECRET: 'x'.repeat(40) });
    expect(appConfigFromEnv(env, env.JWT_SECRET!).cookieSecure).toBe(true);
  });

  it('names every bad variable at once', () => {
    try {
      loadEnv({ PORT: 'eighty', SEED_DEMO: 'maybe', JWT_SECRET: 'short' });
      expect.unreachable();
    } catch (err) {
      const message = (err as Error).message;
      expect(message).toMatch(/PORT: must be a port number/);
      expect(message).toMatch(/SEED_DEMO: expected true or false/);
      expect(message).toMatch(/JWT_SECRET: must be at least 32 characters/);
    }
  });

  it('wants ADMIN_EMAIL and ADMIN_PASSWORD together', () => {
    expect(() => loadEnv({ ADMIN_EMAIL: 'boss@example.com' })).toThrow(/ADMIN_PASSWORD: ADMIN_EMAIL and ADMIN_PASSWORD go together/);
    expect(loadEnv({ ADMIN_EMAIL: 'boss@example.com', ADMIN_PASSWORD: 'long-enough' }).ADMIN_EMAIL).toBe('boss@example.com');
  });
});

describe('JWT secret', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'trestle-secret-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('is generated once under DATA_DIR and kept', () => {
    const first = resolveJwtSecret(undefined, dir);
    expect(first.length).toBeGreaterThanOrEqual(32);
    expect(readFileSync(path.join(dir, 'jwt-secret'), 'utf8').trim()).toBe(first);
    expect(resolveJwtSecret(undefined, dir)).toBe(first);
  });

  it('comes from JWT_SECRET when set', () => {
    expect(resolveJwtSecret('y'.repeat(32), dir)).toBe('y'.repeat(32));
  });
});
