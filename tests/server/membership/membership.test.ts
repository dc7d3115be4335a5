/** Project membership: who sees which project, who manages members, effective roles. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ProjectMemberEntity } from '../../../server/membership/member.entity.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTeam, type Team } from './fixture.js';

let t: TestApp;
let team: Team;
beforeAll(async () => {
  t = await createTestApp();
  team = await makeTeam(t);
});
afterAll(() => t.close());

describe('membership', () => {
  it('makes the creator a member: a lead creates → lead; an engineer creates → engineer', async () => {
    const members = (await t.as('lead').get(`/api/projects/${team.projectId}/members`)).body as { email: string; role: string }[];
    expect(members.find((m) => m.email === 'lead@example.com')?.role).toBe('lead');
    const own = await t.as('engineer').post('/api/projects').send({ name: 'Engineer-made' });
    const access = await t.as('engineer').get(`/api/projects/${own.body.id}/access`);
    expect(access.body).toEqual({ projectId: own.body.id, role: 'engineer' });
  });

  it('lists only the projects a user belongs to; admins see every project', async () => {
    const ids = async (res: { body: { id: number }[] }) => res.body.map((p) => p.id);
    expect(await ids(await t.as('viewer').get('/api/projects'))).toContain(team.projectId);
    expect(await ids(await team.as('outLead').get('/api/projects'))).not.toContain(team.projectId);
    expect(await ids(await t.as('admin').get('/api/projects'))).toContain(team.projectId);
  });

  it('answers 404 to a non-member for the project, exactly as for a missing one', async () => {
    const res = await team.as('outLead').get(`/api/projects/${team.projectId}`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe(`Project ${team.projectId} not found`);
    expect((await team.as('outLead').get(`/api/projects/${team.projectId}/members`)).status).toBe(404);
  });

  it('lets the project lead and admins add, change and remove members; engineers and viewers may not', async () => {
    const url = `/api/projects/${team.projectId}/members`;
    const outsider = team.users.outEngineer;
    expect((await t.as('engineer').post(url).send({ email: outsider.email, role: 'viewer' })).status).toBe(403);
    const added = await t.as('lead').post(url).send({ email: outsider.email, role: 'viewer' });
    expect(added.status).toBe(201);
    expect(added.body).toMatchObject({ userId: outsider.id, role: 'viewer', accountRole: 'engineer' });
    expect((await t.as('lead').post(url).send({ email: outsider.email, role: 'viewer' })).status).toBe(409);
    expect((await team.as('outEngineer').get(`/api/projects/${team.projectId}`)).status).toBe(200);
    // as a project viewer, the engineer account cannot edit this project
    expect((await team.as('outEngineer').patch(`/api/projects/${team.projectId}`).send({ client: 'x' })).status).toBe(403);
    const changed = await t.as('admin').patch(`${url}/${outsider.id}`).send({ role: 'engineer' });
    expect(changed.body.role).toBe('engineer');
    expect((await team.as('outEngineer').patch(`/api/projects/${team.projectId}`).send({ client: 'x' })).status).toBe(200);
    expect((await t.as('lead').delete(`${url}/${outsider.id}`)).status).toBe(204);
    expect((await team.as('outEngineer').get(`/api/projects/${team.projectId}`)).status).toBe(404);
    expect((await t.as('lead').delete(`${url}/${outsider.id}`)).status).toBe(404);
  });

  it('refuses an unknown e-mail and an unknown role with field errors', async () => {
    const url = `/api/projects/${team.projectId}/members`;
    const unknown = await t.as('lead').post(url).send({ email: 'nobody@example.com', role: 'viewer' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details.fieldErrors.email).toBeDefined();
    const badRole = await t.as('lead').post(url).send({ email: 'viewer@example.com', role: 'owner' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.details.fieldErrors.role).toBeDefined();
  });

  it('caps the project role at the account role (a viewer account made project lead stays viewer)', async () => {
    const repo = t.dataSource.getRepository(ProjectMemberEntity);
    await repo.update({ projectId: team.projectId, userId: t.users.viewer!.id }, { role: 'lead' });
    const access = await t.as('viewer').get(`/api/projects/${team.projectId}/access`);
    expect(access.body.role).toBe('viewer');
    await repo.update({ projectId: team.projectId, userId: t.users.viewer!.id }, { role: 'viewer' });
  });

  it('does not let a lead demote or remove themself', async () => {
    const url = `/api/projects/${team.projectId}/members/${t.users.lead!.id}`;
    expect((await t.as('lead').patch(url).send({ role: 'engineer' })).status).toBe(400);
    expect((await t.as('lead').delete(url)).status).toBe(400);
  });
});
