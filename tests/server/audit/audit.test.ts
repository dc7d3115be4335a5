/** The audit trail: what gets recorded, with whom, project and version; filters, scoping, CSV. */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuditEvent } from '../../../shared/schemas/audit.js';
import { auditIdle } from '../../../server/audit/audit-middleware.js';
import { closeMailers } from '../../../server/mail/mailer.js';
import { DEMO_PASSWORD } from '../../../server/db/seed.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { importDemo } from '../models/fixture.js';
import { makeTeam, type Team } from '../membership/fixture.js';
import { runInState } from '../reviews/fixture.js';

let t: TestApp;
let team: Team;
let modelId: number;

async function events(query = ''): Promise<AuditEvent[]> {
  await auditIdle();
  const res = await t.as('admin').get(`/api/audit${query}`);
  expect(res.status).toBe(200);
  return res.body.events as AuditEvent[];
}

beforeAll(async () => {
  t = await createTestApp();
  team = await makeTeam(t, 'Audit project');
  modelId = await importDemo(t, team.projectId);
});
afterAll(async () => {
  await closeMailers();
  await t.close();
});

describe('audit trail', () => {
  it('records sign-in, failed sign-in and sign-out with who and from where', async () => {
    const cookie = await t.signIn('engineer@example.com', DEMO_PASSWORD);
    await request(t.app).post('/api/auth/login').send({ email: 'engineer@example.com', password: 'wrong-password' });
    await request(t.app).post('/api/auth/logout').set('Cookie', cookie);
    const list = await events();
    const [out, failed, signIn] = [list.find((e) => e.action === 'sign-out'), list.find((e) => e.action === 'sign-in-failed'), list.find((e) => e.action === 'sign-in')];
    expect(signIn).toMatchObject({ userId: t.users.engineer!.id, userEmail: 'engineer@example.com' });
    expect(failed).toMatchObject({ userId: null, userEmail: 'engineer@example.com' });
    expect(out).toMatchObject({ userId: t.users.engineer!.id });
    expect(signIn!.ip).toBeTruthy();
  });

  it('records import and commit with project, model and version; edits with the new version', async () => {
    const list = await events(`?projectId=${team.projectId}`);
    expect(list.find((e) => e.action === 'commit')).toMatchObject({ userEmail: 'engineer@example.com', projectId: team.projectId, modelId, version: 1 });
    expect(list.find((e) => e.action === 'import')).toMatchObject({ projectId: team.projectId });
    const edit = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({ baseVersion: 1, edits: [{ member: 'M1', field: 'section', value: 'B400' }] });
    expect(edit.status).toBe(200);
    const [e] = await events('?action=edit');
    expect(e).toMatchObject({ projectId: team.projectId, modelId, version: 2, userId: t.users.engineer!.id });
    expect(e!.detail).toBe('1 member edit(s) on version 1');
  });

  it('records review steps, membership and user changes', async () => {
    const runId = await runInState(t, modelId, 'draft', null, 2);
    await t.as('engineer').post(`/api/runs/${runId}/review/submit`).send({ message: 'please check' });
    await t.as('lead').post(`/api/runs/${runId}/review/approve`).send({ message: 'ok' });
    await t.as('admin').patch(`/api/users/${team.users.outViewer.id}`).send({ role: 'engineer' });
    await t.as('lead').post(`/api/projects/${team.projectId}/members`).send({ email: team.users.outViewer.email, role: 'viewer' });
    const list = await events();
    expect(list.find((e) => e.action === 'submit')).toMatchObject({ runId, version: 2, modelId, projectId: team.projectId, detail: 'please check' });
    expect(list.find((e) => e.action === 'approve')).toMatchObject({ runId, userId: t.users.lead!.id });
    expect(list.find((e) => e.action === 'user-update')!.detail).toContain('role="engineer"');
    expect(list.find((e) => e.action === 'member-add')).toMatchObject({ projectId: team.projectId });
  });

  it('filters by user, action, project and date range', async () => {
    const byUser = await events(`?userId=${t.users.lead!.id}`);
    expect(byUser.length).toBeGreaterThan(0);
    expect(byUser.every((e) => e.userId === t.users.lead!.id)).toBe(true);
    expect((await events('?from=2000-01-01&to=2000-12-31')).length).toBe(0);
    const today = new Date().toISOString().slice(0, 10);
    expect((await events(`?from=${today}&to=${today}`)).length).toBeGreaterThan(0);
    const bad = await t.as('admin').get('/api/audit?from=yesterday');
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.fieldErrors.from).toBeDefined();
  });

  it('shows a lead only the projects they lead, and nothing to engineers', async () => {
    const own = await t.as('lead').get('/api/audit');
    expect(own.status).toBe(200);
    expect((own.body.events as AuditEvent[]).every((e) => e.projectId === team.projectId)).toBe(true);
    expect((own.body.events as AuditEvent[]).some((e) => e.action === 'sign-in')).toBe(false);
    const other = await t.as('admin').post('/api/projects').send({ name: 'Not led by the demo lead' });
    expect((await t.as('lead').get(`/api/audit?projectId=${other.body.id}`)).status).toBe(403);
    expect((await t.as('engineer').get('/api/audit')).status).toBe(403);
  });

  it('exports the filtered trail as CSV with formula-like text neutralised', async () => {
    const runId = await runInState(t, modelId, 'draft', null, 2);
    expect((await t.as('engineer').post(`/api/runs/${runId}/comments`).send({ body: '=HYPERLINK("x")' })).status).toBe(201);
    await auditIdle();
    const res = await t.as('admin').get(`/api/audit/export.csv?projectId=${team.projectId}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="trestle-audit-/);
    const lines = res.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines[0]).toBe('id,at,userId,userEmail,action,projectId,modelId,version,runId,detail,ip');
    expect(lines.length).toBe(1 + (await events(`?projectId=${team.projectId}`)).length);
    const commentLine = lines.find((l) => l.includes(',comment,'))!;
    expect(commentLine).toContain(`,"'=HYPERLINK(""x"")",`);
  });
});
