/**
 * A project with members for membership and review tests: the demo lead creates it (and so
 * leads it), the demo engineer and viewer are added with their own roles, a second lead
 * joins, and three outsiders (viewer, engineer, lead accounts) belong to no project.
 */
import request from 'supertest';
import type { Role } from '../../../shared/schemas/users.js';
import { SESSION_COOKIE, signSession } from '../../../server/auth/session-token.js';
import { UserEntity, type UserRecord } from '../../../server/users/user.entity.js';
import type { TestApp } from '../helpers/test-app.js';

export type Extra = 'lead2' | 'outViewer' | 'outEngineer' | 'outLead';

export interface Team {
  projectId: number;
  users: Record<Extra, UserRecord>;
  /** a request builder for an extra account */
  as(who: Extra): ReturnType<TestApp['as']>;
}

export async function makeTeam(t: TestApp, name = 'Membership test project'): Promise<Team> {
  const repo = t.dataSource.getRepository(UserEntity);
  const hash = t.users.viewer!.passwordHash;
  const mk = async (email: string, role: Role) => repo.save(repo.create({ email, name: email.split('@')[0]!, role, passwordHash: hash, active: true, sessionVersion: 0 }));
  const users: Record<Extra, UserRecord> = {
    lead2: await mk(`lead2.${name.length}.${Date.now()}@example.com`, 'lead'),
    outViewer: await mk(`out-viewer.${Date.now()}@example.com`, 'viewer'),
    outEngineer: await mk(`out-engineer.${Date.now()}@example.com`, 'engineer'),
    outLead: await mk(`out-lead.${Date.now()}@example.com`, 'lead'),
  };
  const created = await t.as('lead').post('/api/projects').send({ name });
  if (created.status !== 201) throw new Error(`project: ${created.status}`);
  const projectId = created.body.id as number;
  for (const [email, role] of [
    ['engineer@example.com', 'engineer'],
    ['viewer@example.com', 'viewer'],
    [users.lead2.email, 'lead'],
  ] as const) {
    const res = await t.as('lead').post(`/api/projects/${projectId}/members`).send({ email, role });
    if (res.status !== 201) throw new Error(`member ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  }
  const as = (who: Extra) => {
    const u = users[who];
    const c = `${SESSION_COOKIE}=${signSession(t.config, u.id, u.sessionVersion)}`;
    return {
      get: (url: string) => request(t.app).get(url).set('Cookie', c),
      post: (url: string) => request(t.app).post(url).set('Cookie', c),
      patch: (url: string) => request(t.app).patch(url).set('Cookie', c),
      put: (url: string) => request(t.app).put(url).set('Cookie', c),
      delete: (url: string) => request(t.app).delete(url).set('Cookie', c),
    };
  };
  return { projectId, users, as };
}
