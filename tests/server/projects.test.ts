import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { projectSchema } from '../../shared/schemas/projects.js';
import { createTestApp, type TestApp } from './helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('projects', () => {
  it('creates a project from just a name (201) with the defaults filled in', async () => {
    const res = await t.as('engineer').post('/api/projects').send({ name: '  Pier 4 conveyor gallery ' });
    expect(res.status).toBe(201);
    const project = projectSchema.parse(res.body);
    expect(project).toMatchObject({
      name: 'Pier 4 conveyor gallery',
      jobNumber: '',
      client: '',
      description: '',
      designCode: 'en1993-1-1',
      units: 'metric',
      createdBy: t.users.engineer!.id,
    });
    expect(Date.parse(project.createdAt)).not.toBeNaN();
  });

  it('creates with every field, lists, reads, changes and deletes', async () => {
    const created = await t.as('lead').post('/api/projects').send({
      name: 'Tank farm pipe rack',
      jobNumber: 'J-2291',
      client: 'Demo client',
      description: 'Two-level rack',
      designCode: 'aisc360-asd',
      units: 'us',
    });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    // membership (server/membership): the creator is its lead; others see it once added
    for (const [email, role] of [['viewer@example.com', 'viewer'], ['engineer@example.com', 'engineer']]) {
      expect((await t.as('lead').post(`/api/projects/${id}/members`).send({ email, role })).status).toBe(201);
    }

    const list = await t.as('viewer').get('/api/projects');
    expect(list.status).toBe(200);
    expect(list.body.map((p: { id: number }) => p.id)).toContain(id);

    const read = await t.as('viewer').get(`/api/projects/${id}`);
    expect(read.status).toBe(200);
    expect(read.body).toEqual(created.body);

    const patched = await t.as('engineer').patch(`/api/projects/${id}`).send({ client: 'Another client', units: 'metric' });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ name: 'Tank farm pipe rack', client: 'Another client', units: 'metric', designCode: 'aisc360-asd' });

    expect((await t.as('engineer').delete(`/api/projects/${id}`)).status).toBe(403);
    expect((await t.as('lead').delete(`/api/projects/${id}`)).status).toBe(204);
    expect((await t.as('viewer').get(`/api/projects/${id}`)).status).toBe(404);
    expect((await t.as('admin').delete(`/api/projects/${id}`)).status).toBe(404);
  });

  it('refuses a missing name, an unknown design code, unknown units and unknown fields with field errors', async () => {
    const res = await t.as('engineer').post('/api/projects').send({ name: ' ', designCode: 'bs5950', units: 'imperial', colour: 'red' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    const fields = res.body.error.details.fieldErrors;
    expect(Object.keys(fields).sort()).toEqual(['designCode', 'name', 'units']);
    expect(res.body.error.details.formErrors.join(' ')).toMatch(/colour/);
  });

  it('refuses a PATCH that empties the name and leaves the project unchanged', async () => {
    const created = await t.as('engineer').post('/api/projects').send({ name: 'Keep me' });
    const res = await t.as('engineer').patch(`/api/projects/${created.body.id}`).send({ name: '', client: 'X' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.fieldErrors.name).toBeDefined();
    expect((await t.as('admin').get(`/api/projects/${created.body.id}`)).body.client).toBe('');
  });

  it('answers 404 JSON for a missing or malformed id', async () => {
    for (const id of ['424242', 'abc', '0', '1.5']) {
      const res = await t.as('viewer').get(`/api/projects/${id}`);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });

  it('lets viewers read but not write, and anonymous callers do nothing', async () => {
    expect((await t.as('viewer').post('/api/projects').send({ name: 'Nope' })).status).toBe(403);
    expect((await request(t.app).get('/api/projects')).status).toBe(401);
    expect((await request(t.app).post('/api/projects').send({ name: 'Nope' })).status).toBe(401);
  });
});
