/** POST /api/runs/:runId/suggestions and …/apply: proposals from a run, apply as a version, rerun. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditIdle } from '../../../server/audit/audit-middleware.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { newProject, upload } from '../models/fixture.js';
import { settle } from '../runs/poll.js';

/** Simply supported IPE beam, L = 6 m, S235, continuously braced, w = 22 kN/m (as tests/shared/design/suggest). */
const BEAM: Record<string, string> = {
  'settings.csv': 'key,value\ntitle,Suggest beam\nunits,metric\ndesign_code,en1993-1-1\ngamma_m0,1.0\n',
  'nodes.csv': 'node,x,y\nA,0,0\nB,6,0\n',
  'supports.csv': 'node,ux,uy\nA,1,1\nB,0,1\n',
  'members.csv': 'member,start,end,section,material,lb\nM1,A,B,IPE330,S235,0\n',
  'cases.csv': 'case,category,self_weight\nD,dead,0\n',
  'member_loads.csv': 'case,member,kind,direction,w1\nD,M1,uniform,global_y,-22\n',
};

let t: TestApp;
let modelId: number;
let runId: number;

beforeAll(async () => {
  t = await createTestApp();
  const projectId = await newProject(t, 'Suggestions');
  const preview = await upload(t, projectId, BEAM);
  expect(preview.body.canCommit).toBe(true);
  const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
  modelId = commit.body.model.id as number;
  runId = (await t.as('engineer').post(`/api/models/${modelId}/runs`).send({})).body.id as number;
  expect((await settle(t, runId)).status).toBe('done');
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

describe('section suggestions API', () => {
  it('proposes IPE270 for the beam (99 kNm / 113.74 kNm = 0.870, EN 1993-1-1 6.2.5; hand calculation in tests/shared/design/suggest)', async () => {
    const res = await t.as('engineer').post(`/api/runs/${runId}/suggestions`).send({ by: 'member' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ runId, modelId, version: 1, units: 'metric', by: 'member', iterations: null, converged: null });
    const [p] = res.body.proposals;
    expect(p).toMatchObject({ key: 'M1', current: ['IPE330'], proposed: 'IPE270', change: true });
    expect(p.proposedRatio).toBeCloseTo(0.8704, 3); // M_Ed = wL²/8, M_c,Rd = Wpl·fy/γM0 (EN 1993-1-1 6.2.5), Wpl 484.0 cm³ from memory
    expect(res.body.notes.join(' ')).toMatch(/stiffness ratio/);
  });

  it('refuses viewers (403), bad limits (400 naming the field) and repeats until stable on request', async () => {
    expect((await t.as('viewer').post(`/api/runs/${runId}/suggestions`).send({})).status).toBe(403);
    const bad = await t.as('engineer').post(`/api/runs/${runId}/suggestions`).send({ limits: { targetRatio: 1.2 } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details.fieldErrors)).toContain('limits.targetRatio');
    const rep = await t.as('engineer').post(`/api/runs/${runId}/suggestions`).send({ repeat: true });
    expect(rep.status).toBe(200);
    // a determinate beam: the forces do not move, so the second pass changes nothing
    expect(rep.body).toMatchObject({ iterations: 2, converged: true });
    expect(rep.body.proposals[0]).toMatchObject({ proposed: 'IPE270', change: true });
  });

  it('apply makes one new version, starts its run (which passes) and is audited; a second apply on the old run is stale (409)', async () => {
    const res = await t.as('engineer').post(`/api/runs/${runId}/suggestions/apply`).send({ changes: [{ member: 'M1', section: 'IPE270' }] });
    expect(res.status).toBe(202);
    expect(res.body.model).toMatchObject({ id: modelId, currentVersion: 2 });
    expect(res.body.run).toMatchObject({ modelId, version: 2 });
    const done = await settle(t, res.body.run.id as number);
    expect(done.status).toBe('done');
    expect(done.maxRatio as number).toBeCloseTo(0.8704, 3); // the rerun confirms the proposal (EN 1993-1-1 6.2.5)
    expect(done.counts).toMatchObject({ pass: 1, fail: 0 });
    await auditIdle();
    const audit = await t.as('admin').get('/api/audit?action=edit');
    expect(JSON.stringify(audit.body)).toMatch(/1 section suggestion\(s\) of run \d+ applied as version 2/);
    const stale = await t.as('engineer').post(`/api/runs/${runId}/suggestions/apply`).send({ changes: [{ member: 'M1', section: 'IPE300' }] });
    expect(stale.status).toBe(409);
    const unknown = await t.as('engineer').post(`/api/runs/${res.body.run.id}/suggestions/apply`).send({ changes: [{ member: 'M1', section: 'NOPE1' }] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toMatch(/member M1, section: unknown section "NOPE1"/);
  });
});
