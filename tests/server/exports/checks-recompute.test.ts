/** Runs with more check records than are kept: the detailed-checks export recomputes them. */
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, onlyEmbedded, type TestApp } from '../helpers/test-app.js';
import { importDemo, newProject } from '../models/fixture.js';
import { settle } from '../runs/poll.js';

let t: TestApp;
let runId: number;
beforeAll(async () => {
  await closeRunPool();
  process.env.RUN_MAX_STORED_RECORDS = '1'; // read by the workers this file starts
  t = await createTestApp();
  const modelId = await importDemo(t, await newProject(t));
  runId = (await t.as('engineer').post(`/api/models/${modelId}/runs`).send({})).body.id;
  await settle(t, runId);
}, 120_000);
afterAll(async () => {
  delete process.env.RUN_MAX_STORED_RECORDS;
  await closeRunPool();
  await t.close();
});

describe.skipIf(onlyEmbedded('RUN_MAX_STORED_RECORDS is read by the run workers, which the scaled-api suite starts once for every file'))('checks export without kept records', () => {
  it('keeps no records and still exports every member’s checks', async () => {
    const [row] = await t.sql('SELECT "recordsData" FROM run_results WHERE "runId" = ?', [runId]);
    expect(gunzipSync(row.recordsData).toString()).toBe('null');
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/checks.csv`);
    expect(res.status).toBe(200);
    const lines = res.text.trim().split('\r\n');
    expect(lines[0]).toBe('member,combination,check,clause,demand,capacity,ratio,status,note,unit,details');
    const members = new Set(lines.slice(1).map((l) => l.split(',')[0]));
    expect([...members].sort()).toEqual(['M1', 'M2']);
  });
});
