/**
 * Invitations and password resets, read back from the outbox the capture SMTP server fills:
 * expiring, single-use links; the same answer whether or not an address exists.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../../server/config/logger.js';
import { closeMailers, mailerFor } from '../../../server/mail/mailer.js';
import { AccountTokenEntity } from '../../../server/security/account-token.entity.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
interface Msg { to: string[]; subject: string; text: string; html: string; kind: string }

async function outbox(): Promise<Msg[]> {
  await t.mailIdle();
  return (await t.as('admin').get('/api/outbox')).body as Msg[];
}
const linkToken = (text: string) => /set-password\?token=([A-Za-z0-9_-]+)/.exec(text)?.[1] ?? null;

beforeAll(async () => {
  process.env.RESET_RATE_LIMIT = '100'; // the limit itself is tested in tests/server/security
  t = await createTestApp();
  delete process.env.RESET_RATE_LIMIT;
});
afterAll(async () => {
  await closeMailers();
  await t.close();
});

describe('invitations', () => {
  it('invites by e-mail; the link sets a password once, and then the new user signs in', async () => {
    const res = await t.as('admin').post('/api/account/invite').send({ email: 'New.Person@Example.com', name: 'Nia Newcomer', role: 'engineer' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'new.person@example.com', role: 'engineer', active: true });
    const [mail] = await outbox();
    expect(mail).toMatchObject({ kind: 'invite', to: ['new.person@example.com'], subject: 'You are invited to Trestle' });
    expect(mail!.text).toContain('Hello Nia Newcomer');
    expect(mail!.html).toContain('<a href="http://localhost:');
    const token = linkToken(mail!.text)!;
    expect(token).toHaveLength(43); // 32 random bytes, base64url

    const info = await request(t.app).get(`/api/account/token?token=${token}`);
    expect(info.body).toMatchObject({ kind: 'invite', email: 'new.person@example.com', name: 'Nia Newcomer' });
    expect((await request(t.app).post('/api/account/set-password').send({ token, password: 'short' })).status).toBe(400);
    expect((await request(t.app).post('/api/account/set-password').send({ token, password: 'a-long-new-password' })).status).toBe(204);
    expect((await request(t.app).post('/api/account/set-password').send({ token, password: 'another-password' })).status).toBe(404);
    expect((await request(t.app).get(`/api/account/token?token=${token}`)).status).toBe(404);
    await expect(t.signIn('new.person@example.com', 'a-long-new-password')).resolves.toMatch(/^trestle_session=/);
  });

  it('adds the invited user to a project when asked', async () => {
    const project = await t.as('admin').post('/api/projects').send({ name: 'Invite target' });
    const res = await t.as('admin').post('/api/account/invite').send({ email: 'joiner@example.com', name: 'Jo Joiner', role: 'viewer', projectId: project.body.id });
    expect(res.status).toBe(201);
    const members = (await t.as('admin').get(`/api/projects/${project.body.id}/members`)).body as { email: string; role: string }[];
    expect(members).toContainEqual(expect.objectContaining({ email: 'joiner@example.com', role: 'viewer' }));
  });

  it('refuses an address already in use', async () => {
    expect((await t.as('admin').post('/api/account/invite').send({ email: 'lead@example.com', name: 'X', role: 'viewer' })).status).toBe(409);
  });
});

describe('password reset', () => {
  it('answers the same for a known and an unknown address, and mails only the known one', async () => {
    const before = (await outbox()).length;
    const known = await request(t.app).post('/api/account/forgot').send({ email: 'Engineer@example.com' });
    const unknown = await request(t.app).post('/api/account/forgot').send({ email: 'nobody@example.com' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    const mail = await outbox();
    expect(mail.length).toBe(before + 1);
    expect(mail[0]).toMatchObject({ kind: 'reset', to: ['engineer@example.com'], subject: 'Reset your Trestle password' });
  });

  it('sets a new password once, ends old sessions, and a newer link replaces an older one', async () => {
    await request(t.app).post('/api/account/forgot').send({ email: 'viewer@example.com' });
    const first = linkToken((await outbox())[0]!.text)!;
    await request(t.app).post('/api/account/forgot').send({ email: 'viewer@example.com' });
    const second = linkToken((await outbox())[0]!.text)!;
    expect(second).not.toBe(first);
    expect((await request(t.app).post('/api/account/set-password').send({ token: first, password: 'viewer-new-pass' })).status).toBe(404);
    expect((await request(t.app).post('/api/account/set-password').send({ token: second, password: 'viewer-new-pass' })).status).toBe(204);
    expect((await t.as('viewer').get('/api/auth/me')).status).toBe(401); // the old session ended
    await expect(t.signIn('viewer@example.com', 'viewer-new-pass')).resolves.toMatch(/^trestle_session=/);
  });

  it('refuses an expired link', async () => {
    await request(t.app).post('/api/account/forgot').send({ email: 'lead@example.com' });
    const token = linkToken((await outbox())[0]!.text)!;
    await t.dataSource.getRepository(AccountTokenEntity).update({ userId: t.users.lead!.id, kind: 'reset' }, { expiresAt: new Date(Date.now() - 1000) });
    const res = await request(t.app).post('/api/account/set-password').send({ token, password: 'lead-new-password' });
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/expired/);
  });
});

describe('outbox', () => {
  it('keeps plain text and HTML of a message with non-ASCII text', async () => {
    const mailer = mailerFor(t.dataSource, createLogger('silent'));
    mailer.send({ to: 'ünïcode@example.com', subject: 'Prüfung – Träger M1 ✓', text: 'Länge 6 m — ok', html: '<p>Länge 6 m — ok</p>', kind: 'test' });
    const [m] = await outbox();
    expect(m).toMatchObject({ subject: 'Prüfung – Träger M1 ✓', text: 'Länge 6 m — ok', html: '<p>Länge 6 m — ok</p>', kind: 'test' });
  });
});
