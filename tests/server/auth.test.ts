import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BCRYPT_COST } from '../../server/auth/password.js';
import { UserEntity } from '../../server/users/user.entity.js';
import { createTestApp, sessionCookie, TEST_JWT_SECRET, type TestApp } from './helpers/test-app.js';

const PASSWORD = 'trestle-demo';

describe('sign-in', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('returns the user and sets an httpOnly SameSite=Lax session cookie', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'Engineer@Example.com', password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id: t.users.engineer!.id, email: 'engineer@example.com', name: 'Eli Engineer', role: 'engineer', active: true });
    const raw = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('trestle_session='))!;
    expect(raw).toMatch(/HttpOnly/i);
    expect(raw).toMatch(/SameSite=Lax/i);
    expect(raw).not.toMatch(/Secure/i);
  });

  it('never returns the password hash', async () => {
    const res = await t.as('viewer').get('/api/auth/me');
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it('refuses a wrong password and an unknown e-mail with the same 401 message', async () => {
    const wrong = await request(t.app).post('/api/auth/login').send({ email: 'engineer@example.com', password: 'nope-nope' });
    const unknown = await request(t.app).post('/api/auth/login').send({ email: 'nobody@example.com', password: 'nope-nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect(sessionCookie(wrong)).toBeNull();
  });

  it('answers 400 with field errors when e-mail or password is missing', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'x@example.com' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.details.fieldErrors)).toEqual(['password']);
  });

  it('GET /me answers 401 without a session and the user with one', async () => {
    expect((await request(t.app).get('/api/auth/me')).status).toBe(401);
    const res = await t.as('lead').get('/api/auth/me');
    expect(res.status).toBe(200);
    expect(res.body.email).toBe('lead@example.com');
  });

  it('refuses a tampered, foreign-signed or expired token', async () => {
    const good = t.cookieFor('viewer');
    const tampered = good.slice(0, -3) + (good.endsWith('aaa') ? 'bbb' : 'aaa');
    const foreign = 'trestle_session=' + jwt.sign({ ver: 0 }, 'another-secret-another-secret-another', { subject: String(t.users.admin!.id) });
    const expired = 'trestle_session=' + jwt.sign({ ver: 0, exp: Math.floor(Date.now() / 1000) - 10 }, TEST_JWT_SECRET, { subject: String(t.users.admin!.id) });
    for (const cookie of [tampered, foreign, expired]) {
      expect((await request(t.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
    }
  });

  it('logout clears the cookie', async () => {
    const res = await request(t.app).post('/api/auth/logout').set('Cookie', t.cookieFor('viewer'));
    expect(res.status).toBe(204);
    const raw = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('trestle_session='))!;
    expect(raw).toMatch(/^trestle_session=;/);
    expect(raw).toMatch(/Expires=Thu, 01 Jan 1970/);
  });

  it('stores bcrypt hashes of cost 10 or more', async () => {
    expect(BCRYPT_COST).toBeGreaterThanOrEqual(10);
    const user = await t.dataSource.getRepository(UserEntity).findOneByOrFail({ email: 'admin@example.com' });
    const cost = Number(/^\$2[aby]\$(\d\d)\$/.exec(user.passwordHash)?.[1]);
    expect(cost).toBeGreaterThanOrEqual(10);
  });
});

describe('secure cookie', () => {
  it('marks the cookie Secure when configured (production default)', async () => {
    const t = await createTestApp({ config: { cookieSecure: true } });
    const res = await request(t.app).post('/api/auth/login').send({ email: 'viewer@example.com', password: PASSWORD });
    const raw = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('trestle_session='))!;
    expect(raw).toMatch(/; Secure/i);
    await t.close();
  });
});

describe('deactivated users', () => {
  it('cannot sign in, and a session they already hold stops working', async () => {
    const t = await createTestApp();
    const before = await t.as('engineer').get('/api/auth/me');
    expect(before.status).toBe(200);
    const patch = await t.as('admin').patch(`/api/users/${t.users.engineer!.id}`).send({ active: false });
    expect(patch.status).toBe(200);
    expect(patch.body.active).toBe(false);
    expect((await t.as('engineer').get('/api/auth/me')).status).toBe(401);
    expect((await t.as('engineer').get('/api/projects')).status).toBe(401);
    const login = await request(t.app).post('/api/auth/login').send({ email: 'engineer@example.com', password: PASSWORD });
    expect(login.status).toBe(401);
    expect(login.body.error.message).toMatch(/deactivated/);
    // Reactivated: signs in again.
    await t.as('admin').patch(`/api/users/${t.users.engineer!.id}`).send({ active: true });
    expect((await request(t.app).post('/api/auth/login').send({ email: 'engineer@example.com', password: PASSWORD })).status).toBe(200);
    await t.close();
  });
});

describe('change own password', () => {
  it('needs the current password, then ends old sessions and accepts only the new one', async () => {
    const t = await createTestApp();
    const oldCookie = t.cookieFor('viewer');

    const wrong = await t.as('viewer').post('/api/auth/password').send({ currentPassword: 'not-it-at-all', newPassword: 'a-new-secret-1' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details.fieldErrors.currentPassword).toBeDefined();

    const short = await t.as('viewer').post('/api/auth/password').send({ currentPassword: PASSWORD, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.details.fieldErrors.newPassword).toBeDefined();

    const ok = await t.as('viewer').post('/api/auth/password').send({ currentPassword: PASSWORD, newPassword: 'a-new-secret-1' });
    expect(ok.status).toBe(204);
    const newCookie = sessionCookie(ok);
    expect(newCookie).not.toBeNull();

    expect((await request(t.app).get('/api/auth/me').set('Cookie', oldCookie)).status).toBe(401);
    expect((await request(t.app).get('/api/auth/me').set('Cookie', newCookie!)).status).toBe(200);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'viewer@example.com', password: PASSWORD })).status).toBe(401);
    expect((await request(t.app).post('/api/auth/login').send({ email: 'viewer@example.com', password: 'a-new-secret-1' })).status).toBe(200);
    await t.close();
  });
});

describe('login rate limit', () => {
  it('answers 429 after the configured number of failed attempts, and counts no successful ones', async () => {
    const t = await createTestApp({ config: { loginRateLimit: 3 } });
    const attempt = (password: string) => request(t.app).post('/api/auth/login').send({ email: 'lead@example.com', password });
    // Successful sign-ins do not count towards the limit.
    for (let i = 0; i < 4; i++) expect((await attempt(PASSWORD)).status).toBe(200);
    for (let i = 0; i < 3; i++) expect((await attempt('wrong-password')).status).toBe(401);
    const blocked = await attempt('wrong-password');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    // Even the right password waits out the window.
    expect((await attempt(PASSWORD)).status).toBe(429);
    await t.close();
  });
});
