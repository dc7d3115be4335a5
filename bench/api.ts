/**
 * API speed: on a synthetic 10 × 10 bay, 30-storey frame (10,230 members; demo data of our
 * own) — upload-to-preview, commit, full run, and a rerun after editing one section, each
 * end to end through the HTTP API (supertest over the real app, in-memory database), and
 * the bare analysis + checks in-process for the 1.2× target.
 */
import { performance } from 'node:perf_hooks';
import request from 'supertest';
import { createApp } from '../server/app.js';
import { createLogger } from '../server/config/logger.js';
import { openDatabase } from '../server/db/data-source.js';
import { DEMO_PASSWORD, seedDemoAccounts } from '../server/db/seed.js';
import { closeRunPool, runPool } from '../server/runs/worker-pool.js';
import { frameTables } from './frame-model.js';

export interface ApiBenchFigures {
  members: number;
  uploadToPreviewMs: number;
  commitMs: number;
  fullRunMs: number;
  editMs: number;
  rerunMs: number;
  bareAnalysisAndChecksMs: number | null;
  rerunOverBare: number | null;
  runStatus: string;
  runMessage: string;
  runTimings: Record<string, number>;
}

export { frameTables } from './frame-model.js';

export async function benchApi(bays = 10, storeys = 30): Promise<ApiBenchFigures> {
  const { dataSource } = await openDatabase({ database: ':memory:' });
  await dataSource.transaction((m) => seedDemoAccounts(m));
  const app = createApp({
    config: {
      jwtSecret: 'bench-secret-bench-secret-bench-secret-0123', sessionHours: 1, cookieSecure: false, loginRateLimit: 1000,
      loginRateWindowMs: 60_000, trustProxy: false, distDir: '/nonexistent', dataDir: '/nonexistent', production: false,
    },
    dataSource,
    logger: createLogger('silent'),
  });
  const agent = request.agent(app);
  await agent.post('/api/auth/login').send({ email: 'engineer@example.com', password: DEMO_PASSWORD }).expect(200);
  const project = await agent.post('/api/projects').send({ name: 'Bench' }).expect(201);
  await runPool().warm();
  const tables = frameTables(bays, storeys);
  const nMembers = tables['members.csv'].split('\n').length - 1;

  const time = async <T>(f: () => Promise<T>): Promise<[T, number]> => {
    const t0 = performance.now();
    const v = await f();
    return [v, performance.now() - t0];
  };
  const settle = async (runId: number) => {
    for (;;) {
      const r = await agent.get(`/api/runs/${runId}`);
      if (r.body.status === "done" || r.body.status === "failed") return (await agent.get(`/api/runs/${runId}`)).body;
      if (r.body.status === 'done' || r.body.status === 'failed') return r.body;
      await new Promise((res) => setTimeout(res, 20));
    }
  };

  const [preview, uploadToPreviewMs] = await time(async () => {
    let req = agent.post(`/api/projects/${project.body.id}/imports`);
    for (const [name, text] of Object.entries(tables)) req = req.attach('files', Buffer.from(text), name);
    return req;
  });
  if (!preview.body.canCommit) throw new Error(`bench model does not import: ${JSON.stringify(preview.body.problems?.slice(0, 3) ?? preview.body)}`);
  const [commit, commitMs] = await time(() => agent.post(`/api/projects/${project.body.id}/imports/${preview.body.id}/commit`).send({}));
  const modelId = commit.body.model.id;
  const [first, fullRunMs] = await time(async () => settle((await agent.post(`/api/models/${modelId}/runs`).send({})).body.id));
  const [, editMs] = await time(() =>
    agent.patch(`/api/models/${modelId}/members`).send({ baseVersion: 1, edits: [{ member: 'B31', field: 'section', value: 'IPE450' }] }),
  );
  const [, rerunMs] = await time(async () => settle((await agent.post(`/api/models/${modelId}/runs`).send({})).body.id));

  let bare: number | null = null;
  if (first.status === 'done') {
    const { computeRun } = await import('../server/runs/run-compute.js');
    const { readCsvFiles } = await import('../shared/reader/index.js');
    const read = await readCsvFiles(Object.entries(tables).map(([name, text]) => ({ name, text })));
    if (read.ok) {
      const json = JSON.stringify(read.model);
      // twice: the second (warm, as in a running server) is the one compared
      for (let i = 0; i < 2; i++) {
        const t0 = performance.now();
        computeRun(json, read.model.settings.designCode);
        bare = performance.now() - t0;
      }
    }
  }
  await closeRunPool();
  await dataSource.destroy();
  return {
    members: nMembers,
    uploadToPreviewMs,
    commitMs,
    fullRunMs,
    editMs,
    rerunMs,
    bareAnalysisAndChecksMs: bare,
    rerunOverBare: bare ? (editMs + rerunMs) / bare : null,
    runStatus: first.status,
    runMessage: first.message,
    runTimings: first.timings,
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const [bays, storeys] = process.argv.slice(2).map(Number);
  benchApi(bays || 10, storeys || 30).then((f) => console.log(JSON.stringify(f, null, 2)));
}
