/**
 * Exports of a large run: built in a worker and streamed (the HTTP thread keeps answering),
 * every row present under the right header, and a bounded number in flight.
 */
import ExcelJS from 'exceljs';
import { PassThrough } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { frameMemberCount, frameTables } from '../../../bench/frame-model.js';
import { ExportGate } from '../../../server/exports/export-gate.js';
import { SharedExports, sharedExports } from '../../../server/exports/export-sharing.js';
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
  let projectId: number;
  beforeAll(async () => {
    t = await createTestApp();
    projectId = await newProject(t, 'Large export');
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

  it('builds the same file asked for by three people at once once, and gives each the same bytes', async () => {
    const joined0 = await t.as('admin').post(`/api/projects/${projectId}/members`).send({ userId: t.users.lead!.id, role: 'engineer' });
    expect([200, 201]).toContain(joined0.status);
    const before = { ...sharedExports().stats };
    const [a, b, c] = await Promise.all(['engineer', 'lead', 'admin'].map((role) =>
      t.as(role as 'engineer').get(`/api/runs/${runId}/exports/utilisation.xlsx`).buffer(true).parse(binary as never)));
    for (const r of [a, b, c]) expect(r.status).toBe(200);
    expect(Buffer.compare(a.body as Buffer, b.body as Buffer)).toBe(0);
    expect(Buffer.compare(a.body as Buffer, c.body as Buffer)).toBe(0);
    const built = sharedExports().stats.built - before.built;
    const joined = sharedExports().stats.joined - before.joined;
    expect(built + joined).toBe(3);
    expect(built).toBeLessThan(3);
    // a later request (the build is over) builds afresh: nothing is kept after a build
    expect(sharedExports().inProgress).toBe(0);
  }, 180_000);

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

describe('SharedExports', () => {
  const pieces = (n: number) => Array.from({ length: n }, (_, i) => new Uint8Array([i]));
  const builder = (chunks: Uint8Array[], gate: Promise<void>) => async (onChunk: (c: Uint8Array) => void) => {
    onChunk(chunks[0]);
    await gate;
    for (const c of chunks.slice(1)) onChunk(c);
    return chunks.length;
  };

  it('a request that joins a build in progress gets the pieces already made, then the rest, in order', async () => {
    const shared = new SharedExports();
    let open!: () => void;
    const gate = new Promise<void>((r) => (open = r));
    const chunks = pieces(4);
    let builds = 0;
    const build = (on: (c: Uint8Array) => void) => (builds++, builder(chunks, gate)(on));
    const first: number[] = [], second: number[] = [];
    const p1 = shared.run('k', build, (c) => first.push(c[0]));
    const p2 = shared.run('k', build, (c) => second.push(c[0]));
    open();
    expect(await Promise.all([p1, p2])).toEqual([4, 4]);
    expect(first).toEqual([0, 1, 2, 3]);
    expect(second).toEqual([0, 1, 2, 3]);
    expect(builds).toBe(1);
    expect(shared.stats).toEqual({ built: 1, joined: 1 });
  });

  it('another key, a finished build, or a build past the memory bound is not shared', async () => {
    const shared = new SharedExports(1);
    let open!: () => void;
    const gate = new Promise<void>((r) => (open = r));
    const p1 = shared.run('a', builder(pieces(3), gate), () => {});
    const p2 = shared.run('b', builder(pieces(3), gate), () => {});
    open();
    await Promise.all([p1, p2]);
    await shared.run('a', builder(pieces(3), Promise.resolve()), () => {});
    expect(shared.stats).toEqual({ built: 3, joined: 0 });
    // two one-byte pieces pass the bound of one byte: later requests build their own
    let open2!: () => void;
    const gate2 = new Promise<void>((r) => (open2 = r));
    const chunks = pieces(3);
    const big = async (on: (c: Uint8Array) => void) => { on(chunks[0]); on(chunks[1]); await gate2; on(chunks[2]); return 3; };
    const q1 = shared.run('c', big, () => {});
    const q2 = shared.run('c', builder(pieces(3), Promise.resolve()), () => {});
    open2();
    await Promise.all([q1, q2]);
    expect(shared.stats.joined).toBe(0);
  });

  it('a failed build fails every request that joined it, and the next request builds again', async () => {
    const shared = new SharedExports();
    let fail!: (e: Error) => void;
    const failing = (on: (c: Uint8Array) => void) => { on(new Uint8Array([1])); return new Promise<number>((_, rej) => (fail = rej)); };
    const p1 = shared.run('k', failing, () => {});
    const p2 = shared.run('k', failing, () => {});
    fail(new Error('worker stopped'));
    await expect(p1).rejects.toThrow('worker stopped');
    await expect(p2).rejects.toThrow('worker stopped');
    expect(await shared.run('k', builder(pieces(2), Promise.resolve()), () => {})).toBe(2);
    expect(shared.stats).toEqual({ built: 2, joined: 1 });
  });
});
