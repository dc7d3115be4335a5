/** Clean refusals (issue 12, item 4): malformed requests get 4xx with the standard error body, never a 500 or a stack trace. */
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { errorBodySchema } from '../../shared/schemas/error.js';
import { auditIdle } from '../../server/audit/audit-middleware.js';
import { AuditEntity } from '../../server/audit/audit.entity.js';
import { SESSION_COOKIE, signSession } from '../../server/auth/session-token.js';
import { RevokedSessionEntity } from '../../server/security/revoked-session.entity.js';
import { closeRunPool } from '../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from './helpers/test-app.js';
import { importDemo, newProject } from './models/fixture.js';
import { runInState } from './reviews/fixture.js';

let t: TestApp;
let logged: unknown[][];
beforeAll(async () => {
  t = await createTestApp({ logLevel: 'error' });
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

/** Captures what the server logs as errors during `fn`. */
async function logOf<T>(fn: () => Promise<T>): Promise<T> {
  logged = [];
  const spy = vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => void logged.push(args));
  try {
    return await fn();
  } finally {
    spy.mockRestore();
  }
}

describe('malformed requests', () => {
  it.each(['/%ff', '/api/runs/2/members/%00%ff', '/api/projects/%E0%A4%A', '/assets/%ff.js'])('answers %s with 400 and no stack trace in the log', async (url) => {
    const res = await logOf(() => t.as('engineer').get(url));
    expect(res.status).toBe(400);
    expect(errorBodySchema.parse(res.body).error).toEqual({ code: 'bad_request', message: 'The address holds a malformed percent-encoding (such as %ff)' });
    expect(logged).toEqual([]);
  });

  it.each(['gzip', 'deflate', 'br'])('answers a JSON body labelled Content-Encoding: %s that is not, with 400', async (encoding) => {
    const res = await logOf(() =>
      t.as('engineer').post('/api/projects').set('Content-Type', 'application/json').set('Content-Encoding', encoding).send('{"name":"x"}'),
    );
    expect(res.status).toBe(400);
    expect(errorBodySchema.parse(res.body).error.message).toBe(`The request body could not be read as Content-Encoding: ${encoding}`);
    expect(logged).toEqual([]);
  });

  it('reads a body that really is gzip, and refuses an unknown encoding with 415', async () => {
    const ok = await t.as('engineer').post('/api/projects').set('Content-Type', 'application/json').set('Content-Encoding', 'gzip')
      .serialize((b: unknown) => b as string)
      .send(gzipSync('{"name":"Zipped"}'));
    expect(ok.status).toBe(201);
    const res = await logOf(() => t.as('engineer').post('/api/projects').set('Content-Type', 'application/json').set('Content-Encoding', 'bogus').send('{}'));
    expect(res.status).toBe(415);
    expect(errorBodySchema.parse(res.body).error.code).toBe('bad_request');
    expect(logged).toEqual([]);
  });
});

describe('sign-out', () => {
  async function counts() {
    await auditIdle();
    return {
      audit: await t.dataSource.getRepository(AuditEntity).count(),
      revoked: await t.dataSource.getRepository(RevokedSessionEntity).count(),
    };
  }

  it('writes nothing without a valid session: no audit row, no revoked-session row', async () => {
    const before = await counts();
    const forged = signSession({ ...t.config, jwtSecret: 'another-secret-another-secret-0123456789' }, t.users.engineer!.id, t.users.engineer!.sessionVersion);
    for (const cookie of [undefined, `${SESSION_COOKIE}=garbage`, `${SESSION_COOKIE}=${forged}`]) {
      const req = request(t.app).post('/api/auth/logout');
      const res = await (cookie ? req.set('Cookie', cookie) : req);
      expect(res.status).toBe(204);
    }
    expect(await counts()).toEqual(before);
  });

  it('still revokes and records a real sign-out', async () => {
    const before = await counts();
    const cookie = await t.signIn(t.users.viewer!.email, 'demo-password-unknown').catch(() => t.cookieFor('viewer'));
    const res = await request(t.app).post('/api/auth/logout').set('Cookie', cookie);
    expect(res.status).toBe(204);
    const after = await counts();
    expect(after.revoked).toBe(before.revoked + 1);
    expect(after.audit).toBeGreaterThan(before.audit);
  });
});

describe('comments', () => {
  it('answers 404 to a comment on a member the run does not have, and saves nothing', async () => {
    const projectId = await newProject(t, 'Comments');
    const modelId = await importDemo(t, projectId);
    const runId = await runInState(t, modelId, 'draft', t.users.engineer!.id);
    const missing = await t.as('engineer').post(`/api/runs/${runId}/comments`).send({ member: 'M99', body: 'Check this one' });
    expect(missing.status).toBe(404);
    expect(missing.body.error).toEqual({ code: 'not_found', message: `Member M99 not found in run ${runId}` });
    const ok = await t.as('engineer').post(`/api/runs/${runId}/comments`).send({ member: 'M1', body: 'Check this one' });
    expect(ok.status).toBe(201);
    const list = await t.as('engineer').get(`/api/runs/${runId}/comments`);
    expect(list.body.map((c: { member: string }) => c.member)).toEqual(['M1']);
  }, 60_000);
});

describe('CSRF origin check', () => {
  it('compares scheme, host and port, not the host alone', async () => {
    const post = (origin: string) => t.as('engineer').post('/api/projects').set('Host', 'trestle.local:3000').set('Origin', origin).send({ name: 'Origin test' });
    expect((await post('http://trestle.local:3000')).status).toBe(201);
    expect((await post('https://trestle.local:3000')).status).toBe(403); // other scheme
    expect((await post('http://trestle.local:4000')).status).toBe(403); // other port
    expect((await post('http://trestle.local')).status).toBe(403); // default port 80
    expect((await post('http://evil.example:3000')).status).toBe(403);
  });
});
