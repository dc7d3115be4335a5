/** Models: listing, detail, member edits as one new version, optimistic locking. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { importDemo, newProject } from './fixture.js';

let t: TestApp;
let projectId: number;
let modelId: number;
beforeAll(async () => {
  t = await createTestApp();
  projectId = await newProject(t);
  modelId = await importDemo(t, projectId);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

describe('models', () => {
  it('lists the project models and shows one with its settings and choice lists', async () => {
    const list = await t.as('engineer').get(`/api/projects/${projectId}/models`);
    expect(list.status).toBe(200);
    expect(list.body.map((m: { id: number }) => m.id)).toEqual([modelId]);
    const detail = await t.as('engineer').get(`/api/models/${modelId}`);
    expect(detail.status).toBe(200);
    expect(detail.body.sections).toEqual(['B300', 'B400']);
    expect(detail.body.groups).toEqual(['beams']);
    expect(detail.body.loadings.map((l: { id: string }) => l.id)).toEqual(['D', 'L', 'ULS', 'SLS']);
  });

  it('lists editable members in the model unit system', async () => {
    const res = await t.as('engineer').get(`/api/models/${modelId}/members`);
    expect(res.body.lengthUnit).toBe('m');
    // closed form: member M1 runs from x = 0 to x = 6 m, so its length is 6 m
    expect(res.body.members[0]).toMatchObject({ member: 'M1', section: 'B300', k_major: 1, l_major: null });
    expect(res.body.members[0].length).toBeCloseTo(6, 9);
  });

  it('saves a list of member edits as one new version', async () => {
    const res = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: 1,
      edits: [
        { member: 'M1', field: 'section', value: 'B400' },
        { member: 'M1', field: 'lb', value: '3' },
        { member: 'M2', field: 'k_major', value: 0.85 },
        { member: 'M2', field: 'group', value: 'end span' },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.currentVersion).toBe(2);
    const members = await t.as('engineer').get(`/api/models/${modelId}/members`);
    expect(members.body.version).toBe(2);
    expect(members.body.members[0]).toMatchObject({ section: 'B400', lb: 3 });
    expect(members.body.members[1]).toMatchObject({ k_major: 0.85, group: 'end span' });
    const v1 = await t.as('engineer').get(`/api/models/${modelId}/members?version=1`);
    expect(v1.body.members[0].section).toBe('B300');
    const versions = await t.as('engineer').get(`/api/models/${modelId}/versions`);
    expect(versions.body.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(versions.body[0].origin).toBe('edit');
  });

  it('answers a stale edit with 409 and a clear message, saving nothing', async () => {
    const res = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: 1,
      edits: [{ member: 'M2', field: 'section', value: 'B400' }],
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/version 1/);
    expect(res.body.error.message).toMatch(/Reload/);
    const model = await t.as('engineer').get(`/api/models/${modelId}`);
    expect(model.body.currentVersion).toBe(2);
  });

  it('refuses an unknown section with 400 naming the member and field, saving nothing', async () => {
    const res = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: 2,
      edits: [
        { member: 'M2', field: 'k_minor', value: 0.7 },
        { member: 'M2', field: 'section', value: 'NOPE123' },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/member M2, section/);
    expect(res.body.error.details.problems[0]).toMatchObject({ member: 'M2', field: 'section' });
    const model = await t.as('engineer').get(`/api/models/${modelId}`);
    expect(model.body.currentVersion).toBe(2);
  });

  it('refuses non-numbers and non-positive factors', async () => {
    const res = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: 2,
      edits: [{ member: 'M1', field: 'k_major', value: 'abc' }, { member: 'M1', field: 'cb', value: -1 }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details.problems).toHaveLength(2);
  });

  it('accepts a catalogue designation as a section', async () => {
    const res = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: 2,
      edits: [{ member: 'M2', field: 'section', value: 'IPE300' }],
    });
    expect(res.status).toBe(200);
    const detail = await t.as('engineer').get(`/api/models/${modelId}`);
    expect(detail.body.sections).toContain('IPE300');
  });

  it('does not let a viewer edit', async () => {
    const res = await t.as('viewer').patch(`/api/models/${modelId}/members`).send({ baseVersion: 3, edits: [{ member: 'M1', field: 'cb', value: 1 }] });
    expect(res.status).toBe(403);
  });
});
