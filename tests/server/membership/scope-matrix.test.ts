/**
 * Membership × route matrix: every project-scoped route, called on a real project, model,
 * run and pending import, by each role as a member, by admins (members of nothing), and by
 * each role as a non-member. Non-members get 404; members below the route's project role get
 * 403; everyone else gets past the guards (bodies are invalid or the work is locked, so
 * nothing changes). The route list must match the app's project-scoped routes.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { hasRoleAtLeast, type Role } from '../../../shared/schemas/users.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { closeMailers } from '../../../server/mail/mailer.js';
import { listRoutes } from '../helpers/list-routes.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { CSV, importDemo, upload } from '../models/fixture.js';
import { settle } from '../runs/poll.js';
import { reportSettled } from '../../../server/reports/report.service.js';
import { makeTeam, type Team } from './fixture.js';

interface ScopedRoute {
  method: 'GET' | 'POST' | 'PATCH' | 'DELETE';
  path: string;
  /** least effective project role that gets through */
  min: Role;
  /** concrete URL */
  url: () => string;
}

let t: TestApp;
let team: Team;
let modelId: number;
let runId: number;
let importId: string;
let reportId: string;

const P = () => team.projectId;
const ROUTES: ScopedRoute[] = [
  { method: 'GET', path: '/api/projects/:id', min: 'viewer', url: () => `/api/projects/${P()}` },
  { method: 'PATCH', path: '/api/projects/:id', min: 'engineer', url: () => `/api/projects/${P()}` },
  { method: 'DELETE', path: '/api/projects/:id', min: 'lead', url: () => `/api/projects/${P()}` },
  { method: 'GET', path: '/api/projects/:projectId/models', min: 'viewer', url: () => `/api/projects/${P()}/models` },
  { method: 'POST', path: '/api/projects/:projectId/imports', min: 'engineer', url: () => `/api/projects/${P()}/imports` },
  { method: 'GET', path: '/api/projects/:projectId/imports/:importId', min: 'engineer', url: () => `/api/projects/${P()}/imports/${importId}` },
  { method: 'POST', path: '/api/projects/:projectId/imports/:importId/commit', min: 'engineer', url: () => `/api/projects/${P()}/imports/${importId}/commit` },
  { method: 'GET', path: '/api/projects/:projectId/members', min: 'viewer', url: () => `/api/projects/${P()}/members` },
  { method: 'POST', path: '/api/projects/:projectId/members', min: 'lead', url: () => `/api/projects/${P()}/members` },
  { method: 'PATCH', path: '/api/projects/:projectId/members/:userId', min: 'lead', url: () => `/api/projects/${P()}/members/${t.users.viewer!.id}` },
  { method: 'DELETE', path: '/api/projects/:projectId/members/:userId', min: 'lead', url: () => `/api/projects/${P()}/members/999999` },
  { method: 'GET', path: '/api/projects/:projectId/access', min: 'viewer', url: () => `/api/projects/${P()}/access` },
  { method: 'GET', path: '/api/models/:id', min: 'viewer', url: () => `/api/models/${modelId}` },
  { method: 'PATCH', path: '/api/models/:id', min: 'engineer', url: () => `/api/models/${modelId}` },
  { method: 'GET', path: '/api/models/:id/versions', min: 'viewer', url: () => `/api/models/${modelId}/versions` },
  { method: 'GET', path: '/api/models/:id/versions/:version/workbook.xlsx', min: 'viewer', url: () => `/api/models/${modelId}/versions/1/workbook.xlsx` },
  { method: 'GET', path: '/api/models/:id/versions/:version/workbook.zip', min: 'viewer', url: () => `/api/models/${modelId}/versions/1/workbook.zip` },
  { method: 'GET', path: '/api/models/:id/members', min: 'viewer', url: () => `/api/models/${modelId}/members` },
  { method: 'PATCH', path: '/api/models/:id/members', min: 'engineer', url: () => `/api/models/${modelId}/members` },
  { method: 'GET', path: '/api/models/:id/tables', min: 'viewer', url: () => `/api/models/${modelId}/tables` },
  { method: 'PATCH', path: '/api/models/:id/tables', min: 'engineer', url: () => `/api/models/${modelId}/tables` },
  { method: 'GET', path: '/api/models/:id/runs', min: 'viewer', url: () => `/api/models/${modelId}/runs` },
  { method: 'POST', path: '/api/models/:id/runs', min: 'engineer', url: () => `/api/models/${modelId}/runs` },
  { method: 'GET', path: '/api/runs/compare', min: 'viewer', url: () => `/api/runs/compare?a=${runId}&b=${runId}` },
  { method: 'GET', path: '/api/runs/:id', min: 'viewer', url: () => `/api/runs/${runId}` },
  { method: 'GET', path: '/api/runs/:id/members', min: 'viewer', url: () => `/api/runs/${runId}/members` },
  { method: 'GET', path: '/api/runs/:id/members/:member', min: 'viewer', url: () => `/api/runs/${runId}/members/M1` },
  { method: 'GET', path: '/api/runs/:id/model', min: 'viewer', url: () => `/api/runs/${runId}/model` },
  { method: 'GET', path: '/api/runs/:id/shapes', min: 'viewer', url: () => `/api/runs/${runId}/shapes?kind=none` }, // 400 once through the guards
  { method: 'GET', path: '/api/runs/:id/exports/:file', min: 'viewer', url: () => `/api/runs/${runId}/exports/utilisation.csv` },
  { method: 'GET', path: '/api/runs/:runId/review', min: 'viewer', url: () => `/api/runs/${runId}/review` },
  { method: 'POST', path: '/api/runs/:runId/review/submit', min: 'engineer', url: () => `/api/runs/${runId}/review/submit` },
  { method: 'POST', path: '/api/runs/:runId/review/return', min: 'lead', url: () => `/api/runs/${runId}/review/return` },
  { method: 'POST', path: '/api/runs/:runId/review/approve', min: 'lead', url: () => `/api/runs/${runId}/review/approve` },
  { method: 'GET', path: '/api/runs/:runId/comments', min: 'viewer', url: () => `/api/runs/${runId}/comments` },
  { method: 'POST', path: '/api/runs/:runId/comments', min: 'engineer', url: () => `/api/runs/${runId}/comments` },
  { method: 'POST', path: '/api/runs/:runId/reports', min: 'viewer', url: () => `/api/runs/${runId}/reports` },
  { method: 'GET', path: '/api/runs/:runId/reports/:reportId', min: 'viewer', url: () => `/api/runs/${runId}/reports/${reportId}` },
  { method: 'GET', path: '/api/runs/:runId/reports/:reportId/file', min: 'viewer', url: () => `/api/runs/${runId}/reports/${reportId}/file` },
  { method: 'POST', path: '/api/runs/:runId/suggestions', min: 'engineer', url: () => `/api/runs/${runId}/suggestions` },
  { method: 'POST', path: '/api/runs/:runId/suggestions/apply', min: 'engineer', url: () => `/api/runs/${runId}/suggestions/apply` },
];

/** Routes that name no project (accounts, users, audit with its own scoping, samples, outbox). */
const UNSCOPED = /^\/api\/(health|auth|users|account|audit|outbox|samples|templates)\b|^\/api\/projects$/;

beforeAll(async () => {
  t = await createTestApp();
  team = await makeTeam(t, 'Scope matrix project');
  modelId = await importDemo(t, team.projectId);
  const started = await t.as('engineer').post(`/api/models/${modelId}/runs`).send({});
  runId = started.body.id as number;
  expect((await settle(t, runId)).status).toBe('done');
  // approved, so viewers see it and every write on the model or project is refused as locked
  expect((await t.as('engineer').post(`/api/runs/${runId}/review/submit`).send({ message: 'check' })).status).toBe(200);
  expect((await t.as('lead').post(`/api/runs/${runId}/review/approve`).send({})).status).toBe(200);
  importId = (await upload(t, team.projectId, CSV, { modelId: String(modelId) })).body.id as string;
  reportId = (await t.as('engineer').post(`/api/runs/${runId}/reports`).send({ members: 'failing' })).body.id as string;
  await reportSettled(reportId);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await closeMailers();
  await t.close();
});

type Caller = { label: string; role: Role; member: boolean; send: (r: ScopedRoute) => request.Test };

function send(builder: ReturnType<TestApp['as']>, r: ScopedRoute): request.Test {
  const url = r.url();
  const req = r.method === 'GET' ? builder.get(url) : r.method === 'POST' ? builder.post(url) : r.method === 'PATCH' ? builder.patch(url) : builder.delete(url);
  return r.method === 'GET' || r.method === 'DELETE' ? req : req.send({ bogus: 1 });
}

const CALLERS: Caller[] = [
  { label: 'member viewer', role: 'viewer', member: true, send: (r) => send(t.as('viewer'), r) },
  { label: 'member engineer', role: 'engineer', member: true, send: (r) => send(t.as('engineer'), r) },
  { label: 'member lead', role: 'lead', member: true, send: (r) => send(t.as('lead'), r) },
  { label: 'admin (no membership needed)', role: 'admin', member: true, send: (r) => send(t.as('admin'), r) },
  { label: 'non-member viewer', role: 'viewer', member: false, send: (r) => send(team.as('outViewer'), r) },
  { label: 'non-member engineer', role: 'engineer', member: false, send: (r) => send(team.as('outEngineer'), r) },
  { label: 'non-member lead', role: 'lead', member: false, send: (r) => send(team.as('outLead'), r) },
];

describe.each(ROUTES)('$method $path', (route) => {
  for (const caller of CALLERS) {
    // The account-role guard runs first: a role below the route's minimum is 403 for members and non-members alike.
    const expectation = !hasRoleAtLeast(caller.role, route.min) ? 403 : caller.member ? 'through' : 404;
    it(`${caller.label}: ${expectation === 'through' ? 'gets through' : expectation}`, async () => {
      const res = await caller.send(route);
      if (expectation === 'through') {
        expect([401, 403]).not.toContain(res.status);
        // 404 only where the route's own target is missing (DELETE of a non-member user)
        if (res.status === 404) expect(route.path).toBe('/api/projects/:projectId/members/:userId');
      } else {
        expect(res.status).toBe(expectation);
      }
    });
  }
});

describe('scope table', () => {
  it('lists every project-scoped route the app registers', () => {
    const registered = listRoutes(t.app)
      .filter((r) => r.split(' ')[1]!.startsWith('/api') && !UNSCOPED.test(r.split(' ')[1]!))
      .sort();
    expect(registered).toEqual(ROUTES.map((r) => `${r.method} ${r.path}`).sort());
  });

  it('keeps approved work intact through all of the above', async () => {
    expect((await t.as('admin').get(`/api/runs/${runId}/review`)).body.status).toBe('approved');
    expect((await t.as('admin').get(`/api/models/${modelId}`)).body.currentVersion).toBe(1);
    expect((await t.as('admin').get(`/api/projects/${P()}`)).status).toBe(200);
  });
});
