/**
 * The scaled mode against the real engines (issue 15): PostgreSQL and Redis started on free
 * ports with throwaway data, two web servers and two worker processes (tests/scaled/cluster.ts).
 * The API's key flows go through both servers; the races that SQLite used to serialise run
 * on two servers at once. Skips, naming what is missing, when postgres or redis-server is absent.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { frameTables } from '../../bench/frame-model.js';
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import { openDatabase } from '../../server/db/data-source.js';
import { TASKS_QUEUE } from '../../server/queue/task-queue.js';
import { ApiClient, startCluster, type Cluster } from './cluster.js';
import { missingEngines } from './engines.js';

const missing = missingEngines();
if (missing) console.warn(`scaled-mode tests skipped: ${missing} not installed`);

const SAMPLE = path.resolve('samples/portal-frame-building/portal-frame-building.xlsx');
const LOGIN_LIMIT = 4;

async function settle(api: ApiClient, runId: number, ms = 120_000): Promise<any> {
  const until = Date.now() + ms;
  for (;;) {
    const r = await api.get(`/api/runs/${runId}`);
    if (r.body.status === 'done' || r.body.status === 'failed') return r.body;
    if (Date.now() > until) throw new Error(`run ${runId} still ${r.body.status} after ${ms / 1000} s`);
    await new Promise((res) => setTimeout(res, 200));
  }
}

async function importFiles(api: ApiClient, projectId: number, files: { name: string; data: Uint8Array }[], via?: ApiClient): Promise<number> {
  const form = new FormData();
  for (const f of files) form.append('files', new Blob([f.data]), f.name);
  const preview = await api.request('POST', `/api/projects/${projectId}/imports`, form);
  expect(preview.status, JSON.stringify(preview.body).slice(0, 300)).toBe(201);
  expect(preview.body.canCommit).toBe(true);
  const commit = await (via ?? api).post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`);
  expect(commit.status).toBe(201);
  return commit.body.model.id as number;
}

describe.skipIf(!!missing)('scaled mode: PostgreSQL, Redis, two servers, two workers', () => {
  let cluster: Cluster;
  let a: ApiClient;
  let b: ApiClient;
  let projectId: number;
  let modelId: number;
  let runId: number;
  let memberName: string;

  beforeAll(async () => {
    cluster = await startCluster({ servers: 2, workers: 2, env: { LOGIN_RATE_LIMIT: String(LOGIN_LIMIT), EXPORT_MAX_PER_USER: '1' } });
    a = new ApiClient(cluster.servers[0].url);
    await a.signIn('engineer@example.com');
    b = a.on(cluster.servers[1].url);
  });
  afterAll(async () => {
    await cluster?.stop();
  });

  it('has the schema the entities describe (columns and types; keys and indexes are the migrations\')', async () => {
    const { dataSource, isNew } = await openDatabase({ url: cluster.databaseUrl });
    try {
      expect(isNew).toBe(false);
      const log = await dataSource.driver.createSchemaBuilder().log();
      // entities declare no foreign keys, CHECKs or indexes, so TypeORM would drop those: the rest must be nothing
      const changes = log.upQueries.map((q) => q.query).filter((q) => !/DROP CONSTRAINT|DROP INDEX/.test(q));
      expect(changes).toEqual([]);
    } finally {
      await dataSource.destroy();
    }
  });

  it('shares the session: signed in on one server, known on the other', async () => {
    const me = await b.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe('engineer@example.com');
  });

  it('imports a sample on one server and commits it on the other', async () => {
    const projects = await a.get('/api/projects');
    expect(projects.status).toBe(200);
    const created = await a.post('/api/projects', { name: 'Scaled' });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    projectId = created.body.id;
    modelId = await importFiles(a, projectId, [{ name: 'portal-frame-building.xlsx', data: readFileSync(SAMPLE) }], b);
    const versions = await b.get(`/api/models/${modelId}/versions`);
    expect(versions.body.map((v: { version: number }) => v.version)).toEqual([1]);
  });

  it('runs it on a worker; progress and results read from either server', async () => {
    const start = await a.post(`/api/models/${modelId}/runs`);
    expect(start.status).toBe(202);
    runId = start.body.id;
    const done = await settle(b, runId);
    expect(done.status, done.message).toBe('done');
    console.log(`scaled: run ${runId} queued ${Date.parse(done.startedAt) - Date.parse(done.createdAt)} ms, ran ${done.durationMs} ms`, done.timings);
    expect(done.counts.pass + done.counts.fail + done.counts.notChecked).toBeGreaterThan(0);
    const list = await a.get(`/api/models/${modelId}/runs`);
    expect(list.body[0].id).toBe(runId);
    const grid = await a.get(`/api/runs/${runId}/members`);
    expect(grid.status).toBe(200);
    const rows = grid.body.rows ?? grid.body.members ?? grid.body;
    expect(Array.isArray(rows) ? rows.length : 0).toBeGreaterThan(0);
    const first = (Array.isArray(rows) ? rows[0] : null) as { member: string } | null;
    memberName = first!.member;
    // member detail needs the analysis: a task through the queue
    const detail = await b.get(`/api/runs/${runId}/members/${encodeURIComponent(first!.member)}`);
    expect(detail.status, JSON.stringify(detail.body).slice(0, 300)).toBe(200);
    expect(detail.body.stations).toBeTruthy();
  });

  it('answers member detail on the worker that ran the run, from the analysis it holds', async () => {
    const { dataSource } = await openDatabase({ url: cluster.databaseUrl });
    let workerId: string | null;
    try {
      [{ workerId }] = await dataSource.query(`SELECT "workerId" FROM runs WHERE id = $1`, [runId]);
    } finally {
      await dataSource.destroy();
    }
    const ran = cluster.workers.find((w) => w.workerId === workerId);
    expect(ran, `run ${runId} recorded worker ${workerId}, not one of ours`).toBeTruthy();
    const line = `task member of run ${runId} from own queue: worker ${workerId}, analysis held`;
    const count = (w: { output(): string }) => w.output().split(line).length - 1;
    const others = cluster.workers.filter((w) => w !== ran);
    const before = count(ran!);
    const othersBefore = others.map((w) => w.output().split(`task member of run ${runId} `).length);
    // three details asked through both servers: every one on the worker that ran the run, none re-analysed
    for (const api of [a, b, a]) {
      const detail = await api.get(`/api/runs/${runId}/members/${encodeURIComponent(memberName)}`);
      expect(detail.status, JSON.stringify(detail.body).slice(0, 300)).toBe(200);
      expect(detail.body.stations).toBeTruthy();
    }
    for (let i = 0; i < 50 && count(ran!) < before + 3; i++) await new Promise((r) => setTimeout(r, 20));
    expect(count(ran!)).toBe(before + 3);
    expect(others.map((w) => w.output().split(`task member of run ${runId} `).length)).toEqual(othersBefore);
  });

  it('exports through a worker, streamed to the server that asked', async () => {
    const csv = await b.get(`/api/runs/${runId}/exports/utilisation.csv`);
    expect(csv.status).toBe(200);
    const text = Buffer.from(csv.bytes).toString('utf8');
    expect(text.split('\n').length).toBeGreaterThan(3);
    const xlsx = await a.get(`/api/runs/${runId}/exports/reactions.xlsx`);
    expect(xlsx.status).toBe(200);
    expect(Buffer.from(xlsx.bytes.subarray(0, 2)).toString('latin1')).toBe('PK');
  });

  it('keeps EXPORT_MAX_PER_USER (1 here) across both servers', async () => {
    // the workers take no new task while the queue is paused: the first export stays in flight
    const tasks = new Queue(TASKS_QUEUE, { connection: { url: cluster.queueUrl } });
    const redis = new Redis(cluster.queueUrl);
    try {
      await tasks.pause();
      const first = a.get(`/api/runs/${runId}/exports/utilisation.csv`);
      const me = (await a.get('/api/auth/me')).body.id as number;
      for (let i = 0; i < 200 && (await redis.get(`trestle:exports:user:${me}`)) !== '1'; i++) await new Promise((r) => setTimeout(r, 20));
      expect(await redis.get(`trestle:exports:user:${me}`)).toBe('1');
      const second = await b.get(`/api/runs/${runId}/exports/reactions.csv`);
      expect(second.status).toBe(429);
      expect(second.body.error.message).toMatch(/EXPORT_MAX_PER_USER/);
      // another user is not held up by it
      const admin = new ApiClient(cluster.servers[1].url);
      await admin.signIn('admin@example.com');
      const theirs = admin.get(`/api/runs/${runId}/exports/reactions.csv`);
      await tasks.resume();
      expect((await first).status).toBe(200);
      expect((await theirs).status).toBe(200);
      for (let i = 0; i < 100 && (await redis.get(`trestle:exports:user:${me}`)) !== null; i++) await new Promise((r) => setTimeout(r, 20));
      expect((await b.get(`/api/runs/${runId}/exports/reactions.csv`)).status).toBe(200);
    } finally {
      await tasks.resume().catch(() => undefined);
      await tasks.close();
      redis.disconnect();
    }
  });

  it('writes a calculation package started on one server; progress and download from the other', async () => {
    const start = await a.post(`/api/runs/${runId}/reports`, { members: 'all' });
    expect(start.status, JSON.stringify(start.body)).toBe(202);
    const id = start.body.id as string;
    // asked at once on the other server: it knows the job
    const first = await b.get(`/api/runs/${runId}/reports/${id}`);
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(['gathering', 'writing', 'done']).toContain(first.body.phase);
    expect(first.body.total).toBe(start.body.total);
    let job = first.body;
    for (let i = 0; i < 600 && job.phase !== 'done' && job.phase !== 'failed'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = (await b.get(`/api/runs/${runId}/reports/${id}`)).body;
    }
    expect(job.phase, job.message).toBe('done');
    expect(job.pages).toBeGreaterThan(0);
    const fromB = await b.get(`/api/runs/${runId}/reports/${id}/file`);
    expect(fromB.status).toBe(200);
    expect(fromB.headers.get('content-disposition')).toContain(job.fileName);
    expect(Buffer.from(fromB.bytes.subarray(0, 5)).toString('latin1')).toBe('%PDF-');
    const fromA = await a.get(`/api/runs/${runId}/reports/${id}/file`);
    expect(Buffer.compare(Buffer.from(fromA.bytes), Buffer.from(fromB.bytes))).toBe(0);
    // another run's id does not reach it
    expect((await b.get(`/api/runs/${runId + 1000}/reports/${id}`)).status).toBe(404);
  });

  it('lets exactly one of two concurrent edits of the same version through (optimistic lock)', async () => {
    const members = await a.get(`/api/models/${modelId}/members`);
    const member = members.body.members[0].member ?? members.body.members[0].id;
    const edit = (api: ApiClient, section: string) =>
      api.patch(`/api/models/${modelId}/members`, { baseVersion: 1, edits: [{ member, field: 'section', value: section }] });
    const [x, y] = await Promise.all([edit(a, 'IPE300'), edit(b, 'IPE330')]);
    expect([x.status, y.status].sort()).toEqual([200, 409]);
    const versions = await a.get(`/api/models/${modelId}/versions`);
    expect(versions.body.map((v: { version: number }) => v.version)).toEqual([2, 1]);
  });

  it('takes one review step of two concurrent submits, on two servers', async () => {
    const [x, y] = await Promise.all([a.post(`/api/runs/${runId}/review/submit`, { message: 'one' }), b.post(`/api/runs/${runId}/review/submit`, { message: 'two' })]);
    expect([x.status, y.status].sort()).toEqual([200, 409]);
    const admin = new ApiClient(cluster.servers[1].url);
    await admin.signIn('admin@example.com');
    const approve = await admin.on(cluster.servers[0].url).post(`/api/runs/${runId}/review/approve`, { message: 'ok' });
    expect(approve.status, JSON.stringify(approve.body)).toBe(200);
    const review = await b.get(`/api/runs/${runId}/review`);
    expect(review.body.status).toBe('approved');
    expect(review.body.events.length).toBe(2);
  });

  it('uses a password-reset link once, even when two servers get it at the same moment', async () => {
    const admin = new ApiClient(cluster.servers[0].url);
    await admin.signIn('admin@example.com');
    expect((await b.post('/api/account/forgot', { email: 'viewer@example.com' })).status).toBe(202);
    let token: string | null = null;
    for (let i = 0; i < 100 && !token; i++) {
      const outbox = await admin.get('/api/outbox');
      const msg = (outbox.body as { text: string }[]).find((m) => /set-password\?token=/.test(m.text));
      token = msg ? /set-password\?token=([A-Za-z0-9_-]+)/.exec(msg.text)![1] : null;
      if (!token) await new Promise((r) => setTimeout(r, 100));
    }
    expect(token).toBeTruthy();
    const anon = [new ApiClient(cluster.servers[0].url), new ApiClient(cluster.servers[1].url)];
    const results = await Promise.all(anon.map((c, i) => c.post('/api/account/set-password', { token, password: `viewer-new-pass-${i}` })));
    expect(results.map((r) => r.status).sort()).toEqual([204, 404]);
  });

  it('counts failed sign-ins across both servers (rate limits in Redis)', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < LOGIN_LIMIT + 1; i++) {
      const c = new ApiClient(cluster.servers[i % 2].url);
      statuses.push((await c.post('/api/auth/login', { email: 'lead@example.com', password: 'wrong-password' })).status);
    }
    expect(statuses.slice(0, LOGIN_LIMIT).every((s) => s === 401)).toBe(true);
    expect(statuses[LOGIN_LIMIT]).toBe(429);
  });

  it('marks a run failed when its worker is killed mid-run, and the other worker goes on', async () => {
    const tables = frameTables(4, 16); // about 1,000 members (demo data of our own)
    const big = await importFiles(a, projectId, Object.entries(tables).map(([name, text]) => ({ name, data: new TextEncoder().encode(text) })));
    const start = await a.post(`/api/models/${big}/runs`);
    const id = start.body.id as number;
    // the worker that took it says so in its log
    let victim = null;
    for (let i = 0; i < 600 && !victim; i++) {
      victim = cluster.workers.find((w) => w.output().includes(`run ${id}: started`)) ?? null;
      if (!victim) await new Promise((r) => setTimeout(r, 50));
    }
    expect(victim, 'no worker took the run').toBeTruthy();
    for (let i = 0; i < 200 && (await a.get(`/api/runs/${id}`)).body.status !== 'running'; i++) await new Promise((r) => setTimeout(r, 20));
    await cluster.killWorker(victim!);
    expect((await a.get(`/api/runs/${id}`)).body.status).toBe('running');
    const failed = await settle(b, id, 60_000);
    expect(failed.status).toBe('failed');
    expect(failed.message).toMatch(/worker/);
    // nothing half-written: no result rows for the failed run
    const { dataSource } = await openDatabase({ url: cluster.databaseUrl });
    try {
      for (const table of ['run_results', 'run_member_results', 'run_loading_results']) {
        const [{ n }] = await dataSource.query(`SELECT COUNT(*)::int AS n FROM "${table}" WHERE "runId" = $1`, [id]);
        expect(n, table).toBe(0);
      }
    } finally {
      await dataSource.destroy();
    }
    // the surviving worker still runs
    const again = await b.post(`/api/models/${modelId}/runs`);
    expect((await settle(a, again.body.id)).status).toBe('done');
  });
});
