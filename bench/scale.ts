/**
 * `npm run bench -- scale`: the scaled mode (issue 15) on real PostgreSQL and Redis started
 * for the bench (tests/scaled/cluster.ts), two web servers. A generated 4 × 4 bay, 16-storey
 * frame (bench/frame-model.ts, 1,040 members; demo data of our own) is imported once; then 20
 * runs of it are started at once through both servers, with 1, 2 and 4 worker processes
 * (WORKER_CONCURRENCY 1 each): throughput (runs per minute, first start to last finish) and
 * queue wait (run created → a worker claimed it; p50, p95). Then the API read figures of the
 * single-process bench on the last run: the grid payload, one export, and 50 clients reading
 * the run across both servers (p95). Printed, never asserted; on a shared 2-core machine more
 * workers than cores only queue on the CPU.
 */
import os from 'node:os';
import { performance } from 'node:perf_hooks';
import { ApiClient, startCluster } from '../tests/scaled/cluster.js';
import { missingEngines } from '../tests/scaled/engines.js';
import { frameTables } from './frame-model.js';

const RUNS = 20;
const pct = (xs: number[], p: number) => {
  if (xs.length === 0) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
};

async function settle(api: ApiClient, id: number): Promise<any> {
  for (;;) {
    const r = await api.get(`/api/runs/${id}`);
    if (r.body.status === 'done' || r.body.status === 'failed') return r.body;
    await new Promise((res) => setTimeout(res, 100));
  }
}

export async function benchScale(log: (line: string) => void = console.log): Promise<void> {
  const missing = missingEngines();
  if (missing) {
    log(`\nscale: skipped, ${missing} not installed`);
    return;
  }
  log(`\nscaled mode: PostgreSQL + Redis, 2 web servers, ${RUNS} concurrent runs of a 1,040-member frame (${os.cpus().length} CPUs on this machine)`);
  const cluster = await startCluster({ servers: 2, workers: 1, env: { RUN_RATE_LIMIT: '1000', EXPORT_RATE_LIMIT: '1000', LOG_LEVEL: 'warn' } });
  try {
    const a = new ApiClient(cluster.servers[0].url);
    await a.signIn('engineer@example.com');
    const b = a.on(cluster.servers[1].url);
    const clients = [a, b];
    const project = await a.post('/api/projects', { name: 'Scale bench' });
    const form = new FormData();
    for (const [name, text] of Object.entries(frameTables(4, 16))) form.append('files', new Blob([text]), name);
    const preview = await a.request('POST', `/api/projects/${project.body.id}/imports`, form);
    if (!preview.body.canCommit) throw new Error(`bench model does not import: ${JSON.stringify(preview.body).slice(0, 300)}`);
    const commit = await b.post(`/api/projects/${project.body.id}/imports/${preview.body.id}/commit`);
    const modelId = commit.body.model.id as number;
    log(`  model: ${commit.body.model.counts.members} members`);
    // one run first: the workers' threads have loaded and compiled the analysis
    await settle(a, (await a.post(`/api/models/${modelId}/runs`)).body.id);

    let lastRun = 0;
    log(`  ${'workers'.padEnd(9)}${'wall s'.padStart(8)}${'runs/min'.padStart(10)}${'wait p50 ms'.padStart(13)}${'wait p95 ms'.padStart(13)}${'run p50 ms'.padStart(12)}${'failed'.padStart(8)}`);
    for (const workers of [1, 2, 4]) {
      while (cluster.workers.length < workers) await cluster.startWorker();
      const t0 = performance.now();
      const started = await Promise.all(Array.from({ length: RUNS }, (_, i) => clients[i % 2].post(`/api/models/${modelId}/runs`)));
      const ends = await Promise.all(started.map((s, i) => settle(clients[(i + 1) % 2], s.body.id)));
      const wall = (performance.now() - t0) / 1000;
      const waits = ends.filter((r) => r.startedAt).map((r) => Date.parse(r.startedAt) - Date.parse(r.createdAt));
      const durations = ends.filter((r) => r.durationMs !== null).map((r) => r.durationMs as number);
      const failed = ends.filter((r) => r.status !== 'done').length;
      lastRun = ends[ends.length - 1].id;
      log(`  ${String(workers).padEnd(9)}${wall.toFixed(1).padStart(8)}${((RUNS / wall) * 60).toFixed(1).padStart(10)}${pct(waits, 50).toFixed(0).padStart(13)}${pct(waits, 95).toFixed(0).padStart(13)}${pct(durations, 50).toFixed(0).padStart(12)}${String(failed).padStart(8)}`);
    }

    // API reads on the last run, as the single-process bench measures them
    const time = async <T>(f: () => Promise<T>): Promise<[T, number]> => {
      const t = performance.now();
      const v = await f();
      return [v, performance.now() - t];
    };
    const [grid, gridMs] = await time(() => a.get(`/api/runs/${lastRun}/members?layout=table`));
    const [exp, expMs] = await time(() => b.get(`/api/runs/${lastRun}/exports/utilisation.xlsx`));
    const [detail, detailMs] = await time(() => a.get(`/api/runs/${lastRun}/members/C1`));
    log(`  grid payload (layout=table) ${gridMs.toFixed(0)} ms, ${grid.bytes.byteLength} bytes; utilisation.xlsx through a worker ${expMs.toFixed(0)} ms (${exp.status}, ${exp.bytes.byteLength} bytes); member detail through a worker ${detailMs.toFixed(0)} ms (${detail.status})`);
    // member detail needs the analysis: sent to the worker that ran the run (it holds it)
    const details: number[] = [];
    let detailErrors = 0;
    await Promise.all(
      Array.from({ length: 10 }, async (_, i) => {
        for (let k = 0; k < 3; k++) {
          const [r, ms] = await time(() => clients[(i + k) % 2].get(`/api/runs/${lastRun}/members/C1`));
          if (r.status !== 200) detailErrors++;
          details.push(ms);
        }
      }),
    );
    log(`  10 readers × 3 member details (alternating servers, answered by the run's worker): p50 ${pct(details, 50).toFixed(0)} ms, p95 ${pct(details, 95).toFixed(0)} ms, errors ${detailErrors}`);
    const latencies: number[] = [];
    let errors = 0;
    await Promise.all(
      Array.from({ length: 50 }, async (_, i) => {
        const c = clients[i % 2];
        for (let k = 0; k < 5; k++) {
          const [r, ms] = await time(() => c.get(k % 2 ? `/api/runs/${lastRun}` : `/api/runs/${lastRun}/members?layout=table`));
          if (r.status !== 200) errors++;
          latencies.push(ms);
        }
      }),
    );
    log(`  50 readers × 5 requests (run status and grid payload, alternating servers): p50 ${pct(latencies, 50).toFixed(0)} ms, p95 ${pct(latencies, 95).toFixed(0)} ms, errors ${errors}`);
  } finally {
    await cluster.stop();
  }
}
