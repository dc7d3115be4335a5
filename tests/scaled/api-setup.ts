/**
 * globalSetup of the `scaled-api` vitest project: the API suite (tests/server) a second time
 * against the real engines. Starts one throwaway PostgreSQL and Redis on free ports
 * (engines.ts), migrates the database once, and starts two worker processes
 * (`server/worker.ts`, as `npm run worker`); the test files reach them through
 * `inject('scaledApi')` (tests/scaled/api-env.ts), and createTestApp
 * (tests/server/helpers/test-app.ts) builds two web-server instances over them per test app.
 * Everything is stopped and its data removed at the end, also after a failure.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { openDatabase } from '../../server/db/data-source.js';
import { launch, until, type Proc } from './cluster.js';
import { startPostgres, startRedis, stopChild, type Engine } from './engines.js';

export interface ScaledApiContext {
  databaseUrl: string;
  queueUrl: string;
  dataDir: string;
}

declare module 'vitest' {
  export interface ProvidedContext {
    scaledApi: ScaledApiContext;
  }
}

export const WORKERS = 2;

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const engines: Engine[] = [];
  const procs: Proc[] = [];
  /** per worker: runs and tasks (other than upload reads) taken (from its log), printed at the end as proof the queue was used */
  const tally: { runs: number; tasks: number }[] = [];
  const dataDir = mkdtempSync(path.join(tmpdir(), 'trestle-scaled-api-'));
  const teardown = async () => {
    if (tally.length) console.log(`scaled-api workers: ${tally.map((c, i) => `#${i + 1} ${c.runs} runs, ${c.tasks} tasks`).join('; ')}`);
    await Promise.all(procs.map((p) => stopChild(p.child, 'SIGTERM', 8000)));
    await Promise.all(engines.map((e) => e.stop()));
    rmSync(dataDir, { recursive: true, force: true });
  };
  try {
    const pg = await startPostgres();
    engines.push(pg);
    const redis = await startRedis();
    engines.push(redis);
    // migrate once here, so the workers and the test apps find the schema in place
    const { dataSource } = await openDatabase({ url: pg.url });
    await dataSource.destroy();
    const env = { DATABASE_URL: pg.url, QUEUE_URL: redis.url, NODE_ENV: 'test', LOG_LEVEL: 'info', DATA_DIR: dataDir };
    await Promise.all(
      Array.from({ length: WORKERS }, async (_, i) => {
        const w = launch('server/worker.ts', env);
        procs.push(w);
        const count = { runs: 0, tasks: 0 };
        tally.push(count);
        w.child.stdout!.on('data', (d: Buffer) => {
          const text = d.toString();
          count.runs += text.match(/run \d+: started/g)?.length ?? 0;
          count.tasks += text.match(/task \w+ of run/g)?.length ?? 0;
        });
        await until(`worker ${i + 1}`, w, async () => /Trestle worker \S+:/.test(w.output()));
      }),
    );
    project.provide('scaledApi', { databaseUrl: pg.url, queueUrl: redis.url, dataDir });
  } catch (err) {
    await teardown();
    throw err;
  }
  return teardown;
}
