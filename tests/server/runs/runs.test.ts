/** Runs: worker pool end to end, results for the grid, member detail, picture, history, compare. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { MODEL_NEEDED } from '../../../server/runs/worker-protocol.js';
import { runWorkerTask } from '../../../server/runs/worker-tasks.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { CSV, importDemo, newProject, upload } from '../models/fixture.js';
import { settle } from './poll.js';

let t: TestApp;
let modelId: number;
let firstRun: number;
let secondRun: number;
beforeAll(async () => {
  t = await createTestApp();
  modelId = await importDemo(t, await newProject(t));
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

describe('runs', () => {
  it('queues a run, reports its phases and finishes with counts', async () => {
    const start = await t.as('engineer').post(`/api/models/${modelId}/runs`).send({});
    expect(start.status).toBe(202);
    expect(start.body).toMatchObject({ status: 'queued', version: 1, designCode: 'en1993-1-1', reviewStatus: 'draft' });
    firstRun = start.body.id;
    const run = await settle(t, firstRun);
    expect(run.status, String(run.message)).toBe('done');
    const counts = run.counts as { pass: number; fail: number; notChecked: number };
    expect(counts.pass + counts.fail + counts.notChecked).toBe(2);
    expect(run.maxRatio).toEqual(expect.any(Number));
    expect(Object.keys(run.timings as object)).toEqual(expect.arrayContaining(['reading', 'checking', 'saving']));
    expect(run.createdByName).toBe('Eli Engineer');
  });

  it('gives one grid row per member with ratio, check, clause and combination', async () => {
    const res = await t.as('engineer').get(`/api/runs/${firstRun}/members`);
    expect(res.status).toBe(200);
    expect(res.body.members.map((m: { member: string }) => m.member)).toEqual(['M1', 'M2']);
    const m1 = res.body.members[0];
    expect(m1).toMatchObject({ section: 'B300', group: 'beams', previousRatio: null });
    // closed form: M1 spans x = 0..6 m
    expect(m1.length).toBeCloseTo(6, 9);
    expect(res.body.previousRunId).toBeNull();
  });

  it('gives member detail with station diagrams for the governing and a chosen loading', async () => {
    const res = await t.as('engineer').get(`/api/runs/${firstRun}/members/M1`);
    expect(res.status).toBe(200);
    expect(res.body.loadings.map((l: { id: string }) => l.id)).toEqual(['D', 'L', 'ULS', 'SLS']);
    expect(res.body.stations.x[0]).toBe(0);
    expect(res.body.stations.x.at(-1)).toBeCloseTo(6, 9);
    // closed form, two equal spans under uniform w: support moment −wL²/8 at the middle support
    // (L = 6 m; w of the live case = 12 kN/m → −54 kNm); tolerance 0.5 %.
    const live = await t.as('engineer').get(`/api/runs/${firstRun}/members/M1?loading=L`);
    expect(live.body.loading).toBe('L');
    expect(live.body.stations.M_major.at(-1) / 1000).toBeCloseTo(-54, 0);
    expect(Math.abs(live.body.stations.M_major.at(-1) / 1000 + 54)).toBeLessThan(0.27);
    expect(live.body.loadingRecords).toEqual([]);
    const uls = await t.as('engineer').get(`/api/runs/${firstRun}/members/M1?loading=ULS`);
    expect(uls.body.loadingRecords.length).toBeGreaterThan(0);
    const bad = await t.as('engineer').get(`/api/runs/${firstRun}/members/M1?loading=NOPE`);
    expect(bad.status).toBe(400);
    const missing = await t.as('engineer').get(`/api/runs/${firstRun}/members/M99`);
    expect(missing.status).toBe(404);
  });

  it('gives the same member detail from the thread holding the analysis (sent without the model) and after the threads were replaced (sent with it)', async () => {
    const held = await t.as('engineer').get(`/api/runs/${firstRun}/members/M1?loading=ULS`);
    expect(held.status).toBe(200);
    await closeRunPool();
    const fresh = await t.as('engineer').get(`/api/runs/${firstRun}/members/M1?loading=ULS`);
    expect(fresh.status).toBe(200);
    expect(fresh.body).toEqual(held.body);
    // a worker asked without the model for a run it does not hold says so (the service then sends the model)
    expect(() => runWorkerTask({ kind: 'member', runId: 987654, designCode: 'en1993-1-1', member: 0, loading: 0, governing: -1, stability: null }, () => {}))
      .toThrow(MODEL_NEEDED);
  });

  it('gives the picture: nodes, members with ratio, supports, loads and displacements', async () => {
    const res = await t.as('engineer').get(`/api/runs/${firstRun}/model?loading=L`);
    expect(res.status).toBe(200);
    expect(res.body.nodes).toHaveLength(3);
    expect(res.body.members[0]).toMatchObject({ id: 'M1', start: 0, end: 1 });
    expect(res.body.supports).toHaveLength(3);
    expect(res.body.memberLoads).toHaveLength(2);
    expect(res.body.displacements).toHaveLength(18);
    // every node sits on a support (uy restrained), so translations vanish but the end rotations do not
    expect(res.body.maxDisplacement).toBeLessThan(1e-9);
    expect(Math.abs(res.body.displacements[5])).toBeGreaterThan(0);
    expect(res.body.planeFrame).not.toBeNull();
  });

  it('reruns after an edit and shows the previous ratio and section', async () => {
    const edit = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({ baseVersion: 1, edits: [{ member: 'M1', field: 'section', value: 'B400' }] });
    expect(edit.status).toBe(200);
    const start = await t.as('engineer').post(`/api/models/${modelId}/runs`).send({});
    secondRun = start.body.id;
    expect(start.body.version).toBe(2);
    expect((await settle(t, secondRun)).status).toBe('done');
    const res = await t.as('engineer').get(`/api/runs/${secondRun}/members`);
    expect(res.body.previousRunId).toBe(firstRun);
    const m1 = res.body.members[0];
    expect(m1.section).toBe('B400');
    expect(m1.previousSection).toBe('B300');
    expect(m1.previousRatio).toEqual(expect.any(Number));
  });

  it('lists the history and compares two runs member by member', async () => {
    const list = await t.as('engineer').get(`/api/models/${modelId}/runs`);
    expect(list.body.map((r: { id: number }) => r.id)).toEqual([secondRun, firstRun]);
    expect(list.body[0].durationMs).toEqual(expect.any(Number));
    const cmp = await t.as('engineer').get(`/api/runs/compare?a=${firstRun}&b=${secondRun}`);
    expect(cmp.status).toBe(200);
    const row = cmp.body.rows.find((r: { member: string }) => r.member === 'M1');
    expect(row).toMatchObject({ sectionA: 'B300', sectionB: 'B400' });
    expect(row.delta).toBeCloseTo(row.ratioB - row.ratioA, 12);
  });

  it('fails an unstable model with a message naming a node, and refuses its results', async () => {
    const projectId = await newProject(t, 'Unstable');
    const preview = await upload(t, projectId, { ...CSV, 'supports.csv': 'node,ux,uy\nN1,1,1\n' });
    expect(preview.body.canCommit).toBe(true);
    const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
    const start = await t.as('engineer').post(`/api/models/${commit.body.model.id}/runs`).send({});
    const run = await settle(t, start.body.id);
    expect(run.status).toBe('failed');
    expect(String(run.message)).toMatch(/N[123]/);
    const members = await t.as('engineer').get(`/api/runs/${start.body.id}/members`);
    expect(members.status).toBe(409);
    expect(members.body.error.message).toMatch(/failed/);
  });

  it('refuses results of a run that is not done and runs of a missing version', async () => {
    const res = await t.as('engineer').post(`/api/models/${modelId}/runs`).send({ version: 9 });
    expect(res.status).toBe(404);
  });
});
