/**
 * Hardening: CSRF by origin, rate limits on sign-in and password reset, sign-out that ends
 * the session, the content security policy, cookie flags, bcrypt cost, no user enumeration.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BCRYPT_COST, hashPassword } from '../../../server/auth/password.js';
import { DEMO_PASSWORD } from '../../../server/db/seed.js';
import { closeMailers } from '../../../server/mail/mailer.js';
import { createTestApp, sessionCookie, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  process.env.RESET_RATE_LIMIT = '3';
  t = await createTestApp({ config: { loginRateLimit: 3 } });
  delete process.env.RESET_RATE_LIMIT;
});
afterAll(async () => {
  await closeMailers();
  await t.close();
});

describe('CSRF', () => {
  it('refuses a state-changing call the browser marks cross-site, and allows same-origin', async () => {
    const cross = await t.as('engineer').post('/api/projects').set('Sec-Fetch-Site', 'cross-site').send({ name: 'CSRF' });
    expect(cross.status).toBe(403);
    expect(cross.body.error.message).toBe('Cross-site request refused');
    expect((await t.as('engineer').post('/api/projects').set('Sec-Fetch-Site', 'same-site').send({ name: 'CSRF' })).status).toBe(403);
    expect((await t.as('engineer').post('/api/projects').set('Sec-Fetch-Site', 'same-origin').send({ name: 'Same origin' })).status).toBe(201);
  });

  it('without Sec-Fetch-Site, compares Origin with Host', async () => {
    const evil = await t.as('engineer').post('/api/projects').set('Host', 'trestle.local').set('Origin', 'https://evil.example').send({ name: 'x' });
    expect(evil.status).toBe(403);
    const nullOrigin = await t.as('engineer').post('/api/projects').set('Origin', 'null').send({ name: 'x' });
    expect(nullOrigin.status).toBe(403);
    const same = await t.as('engineer').post('/api/projects').set('Host', 'trestle.local').set('Origin', 'http://trestle.local').send({ name: 'Same host' });
    expect(same.status).toBe(201);
  });

  it('lets cross-site reads through (they change nothing and CORS keeps the answer from the other site)', async () => {
    expect((await t.as('viewer').get('/api/auth/me').set('Sec-Fetch-Site', 'cross-site')).status).toBe(200);
  });
});

describe('rate limits', () => {
  it('stops failed sign-ins after the limit with 429, the same for known and unknown addresses', async () => {
    const codes: number[] = [];
    for (let i = 0; i < 4; i++) {
      const email = i % 2 ? 'nobody@example.com' : 'lead@example.com';
      codes.push((await request(t.app).post('/api/auth/login').send({ email, password: 'wrong-password' })).status);
    }
    expect(codes).toEqual([401, 401, 401, 429]);
  });

  it('limits password-reset requests per client', async () => {
    const codes: number[] = [];
    for (let i = 0; i < 4; i++) codes.push((await request(t.app).post('/api/account/forgot').send({ email: 'lead@example.com' })).status);
    expect(codes).toEqual([202, 202, 202, 429]);
  });
});

describe('sessions', () => {
  it('refuses a signed-out session cookie even though its token has not expired', async () => {
    const fresh = await createTestApp();
    try {
      const cookie = await fresh.signIn('engineer@example.com', DEMO_PASSWORD);
      expect((await request(fresh.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(200);
      const out = await request(fresh.app).post('/api/auth/logout').set('Cookie', cookie);
      expect(out.status).toBe(204);
      expect((await request(fresh.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
      // another session of the same user is untouched
      const other = await fresh.signIn('engineer@example.com', DEMO_PASSWORD);
      expect((await request(fresh.app).get('/api/auth/me').set('Cookie', other)).status).toBe(200);
    } finally {
      await fresh.close();
    }
  });

  it('marks the session cookie HttpOnly, SameSite=Lax, with an expiry, and Secure when configured (production)', async () => {
    const secure = await createTestApp({ config: { cookieSecure: true } });
    try {
      const res = await request(secure.app).post('/api/auth/login').send({ email: 'viewer@example.com', password: DEMO_PASSWORD });
      const raw = ([] as string[]).concat(res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('trestle_session='))!;
      expect(raw).toMatch(/HttpOnly/);
      expect(raw).toMatch(/SameSite=Lax/);
      expect(raw).toMatch(/Secure/);
      expect(raw).toMatch(/Max-Age=3600/); // sessionHours: 1 in the test config
      expect(sessionCookie(res)).not.toBeNull();
    } finally {
      await secure.close();
    }
  });

  it('hashes passwords with bcrypt at cost 10 or more', async () => {
    expect(BCRYPT_COST).toBeGreaterThanOrEqual(10);
    expect(await hashPassword('some-password')).toMatch(/^\$2[aby]\$1\d\$/);
  });
});

describe('headers', () => {
  it('sends a content security policy without inline scripts', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("script-src-attr 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });
});
