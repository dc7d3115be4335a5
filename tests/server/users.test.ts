import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { userSchema } from '../../shared/schemas/users.js';
import { createTestApp, type TestApp } from './helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('users (admin)', () => {
  it('lists users as { id, email, name, role, active } only', async () => {
    const res = await t.as('admin').get('/api/users');
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(4);
    for (const u of res.body) {
      expect(Object.keys(u).sort()).toEqual(['active', 'email', 'id', 'name', 'role']);
      userSchema.parse(u);
    }
  });

  it('creates a user with a role and initial password, who can then sign in', async () => {
    const res = await t.as('admin').post('/api/users').send({ email: 'New.Person@Example.com', name: 'New Person', role: 'lead', password: 'first-pass-1' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'new.person@example.com', name: 'New Person', role: 'lead', active: true });
    const login = await request(t.app).post('/api/auth/login').send({ email: 'new.person@example.com', password: 'first-pass-1' });
    expect(login.status).toBe(200);
    expect(login.body.role).toBe('lead');
  });

  it('refuses a duplicate e-mail (409) and bad fields (400 naming each field)', async () => {
    const dup = await t.as('admin').post('/api/users').send({ email: 'viewer@example.com', name: 'Again', role: 'viewer', password: 'another-pass' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.code).toBe('conflict');
    const bad = await t.as('admin').post('/api/users').send({ email: 'not-an-email', name: '', role: 'owner', password: 'x' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details.fieldErrors).sort()).toEqual(['email', 'name', 'password', 'role']);
  });

  it('changes name and role; the new role applies to the next request', async () => {
    const id = t.users.viewer!.id;
    const res = await t.as('admin').patch(`/api/users/${id}`).send({ name: 'Vic Promoted', role: 'engineer' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id, name: 'Vic Promoted', role: 'engineer', active: true });
    expect((await t.as('viewer').post('/api/projects').send({ name: 'By promoted viewer' })).status).toBe(201);
    await t.as('admin').patch(`/api/users/${id}`).send({ role: 'viewer' });
    expect((await t.as('viewer').post('/api/projects').send({ name: 'Not any more' })).status).toBe(403);
  });

  it('keeps an admin from demoting or deactivating themself', async () => {
    const id = t.users.admin!.id;
    expect((await t.as('admin').patch(`/api/users/${id}`).send({ role: 'lead' })).status).toBe(400);
    expect((await t.as('admin').patch(`/api/users/${id}`).send({ active: false })).status).toBe(400);
    expect((await t.as('admin').patch(`/api/users/${id}`).send({ name: 'Ada A.' })).status).toBe(200);
  });

  it('answers 404 for an unknown user and 400 for unknown fields', async () => {
    expect((await t.as('admin').patch('/api/users/99999').send({ name: 'X' })).status).toBe(404);
    const res = await t.as('admin').patch(`/api/users/${t.users.lead!.id}`).send({ passwordHash: 'x' });
    expect(res.status).toBe(400);
  });
});
