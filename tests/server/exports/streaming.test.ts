/**
 * Exports of a large run: built in a worker and streamed (the HTTP thread keeps answering),
 * every row present under the right header, and a bounded number in flight.
 */
import ExcelJS from 'exceljs';
import { PassThrough } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { frameMemberCount, frameTables } from '../../../bench/frame-model.js';
import { ExportGate } from '../../../server/exports/export-gate.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { newProject, upload } from '../models/fixture.js';
import { settle } from '../runs/poll.js';

// a 10 × 10 bay, 6-storey grid frame (bench/frame-model.ts): 2,046 members, 847 nodes
const BAYS = 10;
const STOREYS = 6;
const MEMBERS = frameMemberCount(BAYS, STOREYS);
const NODES = (BAYS + 1) ** 2 * (STOREYS + 1);
const LOADINGS = 6; // cases D, L, W and combinations ULS1–3 (frameTables)

const binary = (r: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  r.on('data', (c: Buffer) => chunks.push(c));
  r.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('streamed exports of a large run', () => {
  let t: TestApp;
  let runId: number;
  beforeAll(async () => {
    t = await createTestApp();
    const projectId = await newProject(t, 'Large export');
    const preview = await upload(t, projectId, frameTables(BAYS, STOREYS));
    expect(preview.body.canCommit).toBe(true);
    const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
    const start = await t.as('engineer').post(`/api/models/${commit.body.model.id}/runs`).send({});
    runId = start.body.id;
    const run = await settle(t, runId, 240_000);
    expect(run.status).toBe('done');
  }, 300_000);
  afterAll(async () => {
    await closeRunPool();
    await t.close();
  });

  it('streams utilisation.csv with its header and one line per member', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/utilisation.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/utilisation\.csv"$/);
    // streamed: no length known in advance
    expect(res.headers['content-length']).toBeUndefined();
    const lines = res.text.trimEnd().split('\r\n');
    expect(lines[0].startsWith('member,group,section,material,length [m],ratio,check,clause,combination,status')).toBe(true);
    expect(lines.length - 1).toBe(MEMBERS);
    expect(new Set(lines.slice(1).map((l) => l.split(',')[0])).size).toBe(MEMBERS);
  }, 120_000);

  it('streams displacements.xlsx: header block, table header, one row per node and loading', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/displacements.xlsx`).buffer(true).parse(binary as never);
    expect(res.status).toBe(200);
    const reader = new ExcelJS.stream.xlsx.WorkbookReader(new PassThrough().end(res.body as Buffer), {});
    let header: unknown[] = [];
    let headerAt = -1;
    let rows = 0;
    for await (const ws of reader) {
      for await (const row of ws) {
        const values = (row.values as unknown[]).slice(1);
        if (headerAt < 0 && values[0] === 'loading') {
          header = values;
          headerAt = row.number;
        } else if (headerAt > 0) rows++;
      }
    }
    expect(header).toEqual(['loading', 'node', 'ux [mm]', 'uy [mm]', 'uz [mm]', 'rx [rad]', 'ry [rad]', 'rz [rad]']);
    expect(rows).toBe(NODES * LOADINGS);
  }, 120_000);

  it('answers /api/health while a big export is being built', async () => {
    let done = false;
    const exporting = t.as('engineer').get(`/api/runs/${runId}/exports/checks.xlsx`).buffer(true).parse(binary as never)
      .then((r) => {
        done = true;
        return r;
      });
    const latencies: number[] = [];
    while (!done) {
      const t0 = performance.now();
      const h = await t.as('engineer').get('/api/health');
      expect(h.status).toBe(200);
      if (!done) latencies.push(performance.now() - t0);
      await new Promise((r) => setTimeout(r, 20));
    }
    const res = await exporting;
    expect(res.status).toBe(200);
    expect((res.body as Buffer).byteLength).toBeGreaterThan(10_000);
    // the health route answered during the build, each time without waiting for it
    expect(latencies.length).toBeGreaterThan(2);
    expect(Math.max(...latencies)).toBeLessThan(1500);
  }, 180_000);
});

describe('ExportGate', () => {
  it('refuses a user past EXPORT_MAX_PER_USER and the server past workers + queue with 429 and a retry time', () => {
    const gate = new ExportGate({ workers: 1, queued: 1, perUser: 1 });
    const a = gate.enter(1);
    expect(() => gate.enter(1)).toThrowError(expect.objectContaining({ status: 429, code: 'rate_limited', details: expect.objectContaining({ retryAfterSeconds: 5 }) }));
    const b = gate.enter(2);
    expect(() => gate.enter(3)).toThrowError(expect.objectContaining({ status: 429, details: expect.objectContaining({ limit: 2 }) }));
    a();
    a(); // a second release changes nothing
    expect(gate.active).toBe(1);
    const c = gate.enter(1);
    b();
    c();
    expect(gate.active).toBe(0);
  });
});
