/**
 * Results kept in parts (issue 12): one row per member and per loading, read one at a time by
 * the member page, the picture and the displacement exports; runs saved before the parts
 * existed (whole-run blobs only) give the same answers.
 */
import { gunzipSync, gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { importDemo, newProject } from '../models/fixture.js';
import { settle } from './poll.js';

let t: TestApp;
let runId: number;
beforeAll(async () => {
  t = await createTestApp();
  const modelId = await importDemo(t, await newProject(t));
  const start = await t.as('engineer').post(`/api/models/${modelId}/runs`).send({});
  runId = start.body.id;
  const run = await settle(t, runId);
  if (run.status !== 'done') throw new Error(String(run.message));
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

const answers = async () => ({
  detail: (await t.as('engineer').get(`/api/runs/${runId}/members/M2?loading=ULS`)).body,
  picture: (await t.as('engineer').get(`/api/runs/${runId}/model?loading=L`)).body,
  displacements: (await t.as('engineer').get(`/api/runs/${runId}/exports/displacements.csv`)).text,
  reactions: (await t.as('engineer').get(`/api/runs/${runId}/exports/reactions.csv`)).text,
});

describe('results in parts', () => {
  let before: Awaited<ReturnType<typeof answers>>;

  it('keeps one row per member and one per loading, and the whole-run node blob empty', async () => {
    const members = await t.dataSource.query(`SELECT "memberIndex", "memberId" FROM "run_member_results" WHERE "runId" = ${runId} ORDER BY "memberIndex"`);
    expect(members).toEqual([{ memberIndex: 0, memberId: 'M1' }, { memberIndex: 1, memberId: 'M2' }]);
    const loadings = await t.dataSource.query(`SELECT "loadingIndex" FROM "run_loading_results" WHERE "runId" = ${runId} ORDER BY "loadingIndex"`);
    // D, L, ULS, SLS
    expect(loadings.map((r: { loadingIndex: number }) => r.loadingIndex)).toEqual([0, 1, 2, 3]);
    const [blob] = await t.dataSource.query(`SELECT length("nodeData") AS n FROM "run_results" WHERE "runId" = ${runId}`);
    expect(blob.n).toBe(0);
    before = await answers();
    expect(before.detail).toMatchObject({ start: expect.any(String), end: expect.any(String), type: 'frame', loading: 'ULS' });
    expect(before.detail.row.member).toBe('M2');
    expect(before.picture.loading).toBe('L');
    expect(before.displacements.split('\n').length).toBeGreaterThan(4);
  });

  it('answers a member that is not in the run with 404', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/members/NOPE`);
    expect(res.status).toBe(404);
  });

  it('gives the same answers for a run saved before the parts (whole-run blobs only)', async () => {
    // rebuild the old layout: displacements of every loading, then reactions, in one gzip block
    const rows: { nodeData: Buffer }[] = await t.dataSource.query(`SELECT "nodeData" FROM "run_loading_results" WHERE "runId" = ${runId} ORDER BY "loadingIndex"`);
    const blocks = rows.map((r) => {
      const b = gunzipSync(r.nodeData);
      return new Float64Array(b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength));
    });
    const n = blocks[0].length / 2;
    const all = new Float64Array(2 * n * blocks.length);
    blocks.forEach((b, l) => {
      all.set(b.subarray(0, n), l * n);
      all.set(b.subarray(n), (blocks.length + l) * n);
    });
    await t.sql(`UPDATE "run_results" SET "nodeData" = ? WHERE "runId" = ?`, [gzipSync(Buffer.from(all.buffer)), runId]);
    await t.sql(`DELETE FROM "run_member_results" WHERE "runId" = ?`, [runId]);
    await t.sql(`DELETE FROM "run_loading_results" WHERE "runId" = ?`, [runId]);
    const after = await answers();
    expect(after.detail).toEqual(before.detail);
    expect(after.picture).toEqual(before.picture);
    expect(after.displacements).toEqual(before.displacements);
    expect(after.reactions).toEqual(before.reactions);
  });
});
