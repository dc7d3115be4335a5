/** Fairness (issue 12, item 5): per-user budgets on runs, imports, exports and compare; 429 with Retry-After. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '../../../shared/schemas/error.js';
import { fairnessLimitsFromEnv } from '../../../server/security/fairness.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

const ENV = { RUN_RATE_LIMIT: '2', IMPORT_RATE_LIMIT: '2', EXPORT_RATE_LIMIT: '2', COMPARE_RATE_LIMIT: '2', RATE_WINDOW_MINUTES: '5' };

let t: TestApp;
beforeAll(async () => {
  Object.assign(process.env, ENV);
  t = await createTestApp();
  for (const k of Object.keys(ENV)) delete process.env[k];
}, 120_000);
afterAll(() => t.close());

const ROUTES = [
  { name: 'runs', variable: 'RUN_RATE_LIMIT', what: 'runs started', call: (as: ReturnType<TestApp['as']>) => as.post('/api/models/9999/runs').send({}) },
  { name: 'imports', variable: 'IMPORT_RATE_LIMIT', what: 'uploads', call: (as: ReturnType<TestApp['as']>) => as.post('/api/projects/9999/imports') },
  { name: 'exports', variable: 'EXPORT_RATE_LIMIT', what: 'exports', call: (as: ReturnType<TestApp['as']>) => as.get('/api/runs/9999/exports/utilisation.csv') },
  { name: 'compare', variable: 'COMPARE_RATE_LIMIT', what: 'run comparisons', call: (as: ReturnType<TestApp['as']>) => as.get('/api/runs/compare?a=9998&b=9999') },
];

describe('per-user rate limits', () => {
  it.each(ROUTES)('answers the third $name request of a user in the window with 429, Retry-After and the standard body', async ({ variable, what, call }) => {
    for (let i = 0; i < 2; i++) expect((await call(t.as('engineer'))).status).not.toBe(429);
    const res = await call(t.as('engineer'));
    expect(res.status).toBe(429);
    const retryAfter = Number(res.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(300);
    const error = errorBodySchema.parse(res.body).error;
    expect(error.code).toBe('rate_limited');
    expect(error.message).toMatch(new RegExp(`^Too many ${what}: at most 2 per user in 5 minutes \\(${variable}\\); try again in \\d+ s$`));
    // another user has a budget of their own
    expect((await call(t.as('lead'))).status).not.toBe(429);
  });

  it('leaves signed-out calls to the route (401), and reads its defaults from the environment', async () => {
    const res = await ROUTES[0].call({ post: (u: string) => t.as('engineer').post(u).set('Cookie', '') } as never);
    expect(res.status).toBe(401);
    expect(fairnessLimitsFromEnv({})).toEqual({ windowMs: 60_000, limits: { runs: 10, imports: 10, exports: 20, compare: 30 } });
    expect(fairnessLimitsFromEnv({ RUN_RATE_LIMIT: '3', EXPORT_RATE_LIMIT: 'lots' }).limits).toMatchObject({ runs: 3, exports: 20 });
  });
});
