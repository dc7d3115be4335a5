/**
 * Role × route matrix: for EVERY route the app registers, anonymous callers get 401 (unless
 * the route is public) and every role outside `allowed` gets 403; allowed roles get past the
 * guard. Add your routes to ROUTES; the last test fails when the app has a route the table
 * lacks (or the table names a route the app no longer has).
 *
 * Path parameters are replaced by ids that do not exist, so allowed calls end in 400/404
 * and nothing is changed.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { ROLES, rolesAtLeast, type Role } from '../../shared/schemas/users.js';
import { SESSION_COOKIE, signSession } from '../../server/auth/session-token.js';
import { listRoutes } from './helpers/list-routes.js';
import { createTestApp, type TestApp } from './helpers/test-app.js';

type Access = 'public' | 'signed-in' | readonly Role[];

interface RouteRule {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  path: string;
  allowed: Access;
}

const ADMIN: Role[] = ['admin'];
const READ = rolesAtLeast('viewer');
const EDIT = rolesAtLeast('engineer');
const LEAD = rolesAtLeast('lead');

export const ROUTES: RouteRule[] = [
  { method: 'GET', path: '/api/health', allowed: 'public' },
  { method: 'POST', path: '/api/auth/login', allowed: 'public' },
  { method: 'POST', path: '/api/auth/logout', allowed: 'public' },
  { method: 'GET', path: '/api/auth/me', allowed: 'signed-in' },
  { method: 'POST', path: '/api/auth/password', allowed: 'signed-in' },
  { method: 'GET', path: '/api/users', allowed: ADMIN },
  { method: 'POST', path: '/api/users', allowed: ADMIN },
  { method: 'PATCH', path: '/api/users/:id', allowed: ADMIN },
  { method: 'GET', path: '/api/projects', allowed: READ },
  { method: 'POST', path: '/api/projects', allowed: EDIT },
  { method: 'GET', path: '/api/projects/:id', allowed: READ },
  { method: 'PATCH', path: '/api/projects/:id', allowed: EDIT },
  { method: 'DELETE', path: '/api/projects/:id', allowed: LEAD },
  // models, imports, runs, exports, samples, templates (server/models, imports, runs, exports, samples)
  { method: 'GET', path: '/api/projects/:projectId/models', allowed: READ },
  { method: 'POST', path: '/api/projects/:projectId/imports', allowed: EDIT },
  { method: 'GET', path: '/api/projects/:projectId/imports/:importId', allowed: EDIT },
  { method: 'POST', path: '/api/projects/:projectId/imports/:importId/commit', allowed: EDIT },
  { method: 'GET', path: '/api/models/:id', allowed: READ },
  { method: 'PATCH', path: '/api/models/:id', allowed: EDIT },
  { method: 'GET', path: '/api/models/:id/versions', allowed: READ },
  { method: 'GET', path: '/api/models/:id/versions/:version/workbook.xlsx', allowed: READ },
  { method: 'GET', path: '/api/models/:id/versions/:version/workbook.zip', allowed: READ },
  { method: 'GET', path: '/api/models/:id/members', allowed: READ },
  { method: 'PATCH', path: '/api/models/:id/members', allowed: EDIT },
  { method: 'GET', path: '/api/models/:id/tables', allowed: READ },
  { method: 'PATCH', path: '/api/models/:id/tables', allowed: EDIT },
  { method: 'GET', path: '/api/models/:id/runs', allowed: READ },
  { method: 'POST', path: '/api/models/:id/runs', allowed: EDIT },
  { method: 'GET', path: '/api/runs/compare', allowed: READ },
  { method: 'GET', path: '/api/runs/:id', allowed: READ },
  { method: 'GET', path: '/api/runs/:id/members', allowed: READ },
  { method: 'GET', path: '/api/runs/:id/members/:member', allowed: READ },
  { method: 'GET', path: '/api/runs/:id/model', allowed: READ },
  { method: 'GET', path: '/api/runs/:id/shapes', allowed: READ },
  { method: 'GET', path: '/api/runs/:id/exports/:file', allowed: READ },
  { method: 'GET', path: '/api/samples', allowed: READ },
  { method: 'GET', path: '/api/samples/:file', allowed: READ },
  { method: 'GET', path: '/api/templates/:file', allowed: READ },
  // membership, reviews, comments, audit, mail, account (server/membership, reviews, comments, audit, mail, security);
  // project scoping (member / non-member) is covered in tests/server/membership/scope-matrix.test.ts
  { method: 'GET', path: '/api/projects/:projectId/members', allowed: READ },
  { method: 'POST', path: '/api/projects/:projectId/members', allowed: LEAD },
  { method: 'PATCH', path: '/api/projects/:projectId/members/:userId', allowed: LEAD },
  { method: 'DELETE', path: '/api/projects/:projectId/members/:userId', allowed: LEAD },
  { method: 'GET', path: '/api/projects/:projectId/access', allowed: READ },
  { method: 'GET', path: '/api/runs/:runId/review', allowed: READ },
  { method: 'POST', path: '/api/runs/:runId/review/submit', allowed: EDIT },
  { method: 'POST', path: '/api/runs/:runId/review/return', allowed: LEAD },
  { method: 'POST', path: '/api/runs/:runId/review/approve', allowed: LEAD },
  { method: 'GET', path: '/api/runs/:runId/comments', allowed: READ },
  { method: 'POST', path: '/api/runs/:runId/comments', allowed: EDIT },
  { method: 'POST', path: '/api/runs/:runId/reports', allowed: READ },
  { method: 'GET', path: '/api/runs/:runId/reports/:reportId', allowed: READ },
  { method: 'GET', path: '/api/runs/:runId/reports/:reportId/file', allowed: READ },
  { method: 'POST', path: '/api/runs/:runId/suggestions', allowed: EDIT },
  { method: 'POST', path: '/api/runs/:runId/suggestions/apply', allowed: EDIT },
  { method: 'GET', path: '/api/audit', allowed: LEAD },
  { method: 'GET', path: '/api/audit/export.csv', allowed: LEAD },
  { method: 'GET', path: '/api/outbox', allowed: 'signed-in' },
  { method: 'POST', path: '/api/account/invite', allowed: ADMIN },
  { method: 'POST', path: '/api/account/forgot', allowed: 'public' },
  { method: 'GET', path: '/api/account/token', allowed: 'public' },
  { method: 'POST', path: '/api/account/set-password', allowed: 'public' },
];

/** Routes outside /api (the single-page fallback) are not part of the matrix. */
const NOT_API = (route: string) => !route.split(' ')[1]!.startsWith('/api');

function concrete(path: string): string {
  return path.replace(/:[A-Za-z_]\w*/g, '999999');
}

function allowedRoles(access: Access): readonly Role[] {
  if (access === 'public' || access === 'signed-in') return ROLES;
  return access;
}

let t: TestApp;

function freshCookie(role: Role): string {
  const u = t.users[role]!;
  return `${SESSION_COOKIE}=${signSession(t.config, u.id, u.sessionVersion)}`;
}
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

function send(rule: RouteRule, cookie?: string): request.Test {
  const agent = request(t.app);
  const url = concrete(rule.path);
  const r =
    rule.method === 'GET' ? agent.get(url)
    : rule.method === 'POST' ? agent.post(url)
    : rule.method === 'PATCH' ? agent.patch(url)
    : rule.method === 'PUT' ? agent.put(url)
    : agent.delete(url);
  if (cookie) r.set('Cookie', cookie);
  if (rule.method !== 'GET' && rule.method !== 'DELETE') r.send({});
  return r;
}

describe.each(ROUTES)('$method $path', (rule) => {
  if (rule.allowed !== 'public') {
    it('answers 401 to an anonymous caller', async () => {
      const res = await send(rule);
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('unauthorized');
    });
  }

  const allowed = allowedRoles(rule.allowed);
  for (const role of ROLES) {
    if (allowed.includes(role)) {
      it(`lets ${role} past the role guard`, async () => {
        // signing out revokes the session it carries: use a fresh one so later cases keep theirs
        const res = await send(rule, rule.path === '/api/auth/logout' ? freshCookie(role) : t.cookieFor(role));
        expect([401, 403]).not.toContain(res.status);
      });
    } else {
      it(`answers 403 to ${role}`, async () => {
        const res = await send(rule, t.cookieFor(role));
        expect(res.status).toBe(403);
        expect(res.body.error.code).toBe('forbidden');
      });
    }
  }
});

describe('route table', () => {
  it('lists exactly the /api routes the app registers', () => {
    const registered = listRoutes(t.app).filter((r) => !NOT_API(r));
    const table = ROUTES.map((r) => `${r.method} ${r.path}`).sort();
    expect(registered).toEqual(table);
  });
});
