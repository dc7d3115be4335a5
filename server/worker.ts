/**
 * `npm run worker`: a worker process of the scaled mode, on any host with the same
 * configuration (DATABASE_URL, QUEUE_URL). It takes runs from `trestle-runs` and tasks
 * (uploads to read, member detail and forces, exports) from `trestle-tasks`, WORKER_CONCURRENCY
 * of each at once, and works on them in its own threads (the same task code as the server's
 * thread pool), so its event loop stays free to renew the jobs' locks. Runs write to the
 * database; tasks answer through the queue. SIGINT/SIGTERM: finish the jobs in hand, then stop.
 */
import { Worker, QueueEvents, type Job } from 'bullmq';
import { ConfigError, loadEnv } from './config/env.js';
import { createLogger } from './config/logger.js';
import { openDatabase } from './db/data-source.js';
import { redactUrl } from './queue/connection.js';
import { decodeFromQueue, encodeForQueue } from './queue/codec.js';
import { executeRun, markRunFailed } from './queue/run-job.js';
import { LOCK_MS, RUNS_QUEUE, STALLED_CHECK_MS, TASKS_QUEUE, stalledText, type TaskProgress } from './queue/task-queue.js';
import { WorkerPool } from './runs/worker-pool.js';
import type { WorkerTask } from './runs/worker-protocol.js';
import path from 'node:path';
import { DATABASE_FILE } from './db/data-source.js';

async function main(): Promise<void> {
  let env;
  try {
    env = loadEnv();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  const logger = createLogger(env.LOG_LEVEL);
  if (!env.QUEUE_URL) {
    console.error('npm run worker needs QUEUE_URL (redis://…): without it the server runs everything in its own threads');
    process.exit(1);
  }
  if (!env.DATABASE_URL) logger.warn('DATABASE_URL is unset: this worker uses the SQLite file under DATA_DIR (only right on the server\'s own host)');
  const { dataSource } = await openDatabase(env.DATABASE_URL ? { url: env.DATABASE_URL } : { database: path.join(path.resolve(env.DATA_DIR), DATABASE_FILE) });
  const concurrency = env.WORKER_CONCURRENCY;
  // threads: one per job in hand of each queue (a run and a task never wait for each other)
  const runThreads = new WorkerPool(concurrency);
  const taskThreads = new WorkerPool(concurrency);
  await Promise.all([runThreads.warm(), taskThreads.warm()]);
  const connection = { url: env.QUEUE_URL, maxRetriesPerRequest: null };
  const options = { connection, concurrency, lockDuration: LOCK_MS, stalledInterval: STALLED_CHECK_MS, maxStalledCount: 0 };

  const runs = new Worker<{ runId: number }>(RUNS_QUEUE, async (job) => {
    logger.info(`run ${job.data.runId}: started (pid ${process.pid})`);
    const outcome = await executeRun(dataSource, job.data.runId, runThreads, logger);
    logger.info(`run ${job.data.runId}: ${outcome}`);
    return outcome;
  }, options);

  const tasks = new Worker<{ task: string }>(TASKS_QUEUE, async (job: Job<{ task: string }>) => {
    const task = decodeFromQueue<WorkerTask>(job.data.task);
    // progress events in order: phases, and an export's chunks numbered from 0
    let chain: Promise<unknown> = Promise.resolve();
    let seq = 0;
    const progress = (p: TaskProgress) => {
      chain = chain.then(() => job.updateProgress(p));
    };
    const result = await taskThreads.run(task, {
      onPhase: (phase) => progress({ phase }),
      onChunk: (data) => progress({ chunk: Buffer.from(data.buffer, data.byteOffset, data.byteLength).toString('base64'), seq: seq++ }),
    });
    await chain;
    return encodeForQueue(result);
  }, options);

  // a run job failed without its worker writing it (the worker died): fail the run
  const runEvents = new QueueEvents(RUNS_QUEUE, { connection });
  runEvents.on('failed', ({ jobId, failedReason }) => {
    const runId = Number(/^run-(\d+)$/.exec(jobId)?.[1]);
    if (!runId) return;
    void markRunFailed(dataSource, runId, `The run failed: ${stalledText(failedReason)}; start the run again`).then(
      (changed) => changed && logger.warn(`run ${runId} marked failed: ${failedReason}`),
      (err: unknown) => logger.error(`could not mark run ${runId} failed`, err),
    );
  });
  for (const w of [runs, tasks]) w.on('error', (err) => logger.error('queue error', err));

  logger.info(`Trestle worker: ${concurrency} run${concurrency === 1 ? '' : 's'} and ${concurrency} task${concurrency === 1 ? '' : 's'} at once from ${redactUrl(env.QUEUE_URL)}`);

  let closing = false;
  const shutdown = async (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info(`${signal}: finishing the jobs in hand`);
    await Promise.allSettled([runs.close(), tasks.close(), runEvents.close()]);
    await Promise.allSettled([runThreads.close(), taskThreads.close()]);
    await dataSource.destroy();
    logger.info('worker stopped');
    process.exit(0);
  };
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error('Trestle worker could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
