/**
 * `npm run worker`: a worker process of the scaled mode, on any host with the same
 * configuration (DATABASE_URL, QUEUE_URL). It takes runs from `trestle-runs`, tasks (uploads
 * to read, member detail and forces, exports) from `trestle-tasks`, and the tasks on the runs
 * it ran from its own `trestle-tasks-<id>`, WORKER_CONCURRENCY of each at once, and works on
 * them in one pool of its own threads (the same task code as the server's thread pool; a task
 * goes to the thread that holds its run's analysis), so its event loop stays free to renew
 * the jobs' locks. Runs write to the database; tasks answer through the queue. It says it is
 * alive in Redis every few seconds (servers route to its queue only then).
 * SIGINT/SIGTERM: stop being routed to, finish the jobs in hand, then stop.
 */
import { Worker, QueueEvents, type Job } from 'bullmq';
import { loadEnvOrExit } from './config/env.js';
import { createLogger } from './config/logger.js';
import { openDatabase } from './db/data-source.js';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import { redactUrl, redisConnection } from './queue/connection.js';
import { decodeFromQueue, encodeForQueue } from './queue/codec.js';
import { executeRun, markRunFailed } from './queue/run-job.js';
import {
  ALIVE_MS, HEARTBEAT_MS, LOCK_MS, RUNS_QUEUE, RUN_WORKER_TTL_S, STALLED_CHECK_MS, TASKS_QUEUE, aliveKey, runWorkerKey, stalledText, workerIdOf, workerQueueName, type TaskProgress,
} from './queue/task-queue.js';
import { WorkerPool } from './runs/worker-pool.js';
import type { WorkerTask } from './runs/worker-protocol.js';
import path from 'node:path';
import { DATABASE_FILE } from './db/data-source.js';

async function main(): Promise<void> {
  const env = loadEnvOrExit();
  const logger = createLogger(env.LOG_LEVEL);
  if (!env.QUEUE_URL) {
    console.error('npm run worker needs QUEUE_URL (redis://…): without it the server runs everything in its own threads');
    process.exit(1);
  }
  if (!env.DATABASE_URL) logger.warn('DATABASE_URL is unset: this worker uses the SQLite file under DATA_DIR (only right on the server\'s own host)');
  const { dataSource } = await openDatabase(env.DATABASE_URL ? { url: env.DATABASE_URL } : { database: path.join(path.resolve(env.DATA_DIR), DATABASE_FILE) });
  const concurrency = env.WORKER_CONCURRENCY;
  const workerId = workerIdOf(os.hostname(), process.pid, randomBytes(3).toString('hex'));
  // one pool: a task on a run this process ran goes to the thread that ran it (it holds the
  // analysis); two threads per run in hand, so tasks rarely wait behind runs
  const threads = new WorkerPool(2 * concurrency);
  await threads.warm();
  const connection = { url: env.QUEUE_URL, maxRetriesPerRequest: null };
  const options = { connection, concurrency, lockDuration: LOCK_MS, stalledInterval: STALLED_CHECK_MS, maxStalledCount: 0 };
  const redis = redisConnection(env.QUEUE_URL);
  const beat = () => redis.set(aliveKey(workerId), String(process.pid), 'PX', ALIVE_MS).catch((err: unknown) => logger.error('heartbeat failed', err));
  await beat();
  const heartbeat = setInterval(() => void beat(), HEARTBEAT_MS);

  const runs = new Worker<{ runId: number }>(RUNS_QUEUE, async (job) => {
    logger.info(`run ${job.data.runId}: started (pid ${process.pid}, worker ${workerId})`);
    const outcome = await executeRun(dataSource, job.data.runId, threads, logger, workerId);
    // the servers send this run's analysis tasks to this worker's queue from now on
    if (outcome === 'done') await redis.set(runWorkerKey(job.data.runId), workerId, 'EX', RUN_WORKER_TTL_S).catch(() => undefined);
    logger.info(`run ${job.data.runId}: ${outcome}`);
    return outcome;
  }, options);

  const work = (queue: string) => async (job: Job<{ task: string }>) => {
    const task = decodeFromQueue<WorkerTask>(job.data.task);
    if (task.kind !== 'read') {
      const held = threads.holds(task.runId);
      logger.info(`task ${task.kind} of run ${task.runId} from ${queue}: worker ${workerId}, ${held ? 'analysis held' : 'no analysis held'}`);
    }
    // progress events in order: phases, and an export's chunks numbered from 0
    let chain: Promise<unknown> = Promise.resolve();
    let seq = 0;
    const progress = (p: TaskProgress) => {
      chain = chain.then(() => job.updateProgress(p));
    };
    const result = await threads.run(task, {
      onPhase: (phase) => progress({ phase }),
      onChunk: (data) => progress({ chunk: Buffer.from(data.buffer, data.byteOffset, data.byteLength).toString('base64'), seq: seq++ }),
    });
    await chain;
    return encodeForQueue(result);
  };
  const tasks = new Worker<{ task: string }>(TASKS_QUEUE, work('shared queue'), options);
  const own = new Worker<{ task: string }>(workerQueueName(workerId), work('own queue'), options);

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
  for (const w of [runs, tasks, own]) w.on('error', (err) => logger.error('queue error', err));

  logger.info(`Trestle worker ${workerId}: ${concurrency} run${concurrency === 1 ? '' : 's'} and ${concurrency} task${concurrency === 1 ? '' : 's'} at once from ${redactUrl(env.QUEUE_URL)}`);

  let closing = false;
  const shutdown = async (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info(`${signal}: finishing the jobs in hand`);
    // servers stop routing here; tasks still waiting in the own queue go to the shared one (their servers see this worker gone)
    clearInterval(heartbeat);
    await redis.del(aliveKey(workerId)).catch(() => undefined);
    await Promise.allSettled([runs.close(), tasks.close(), own.close(), runEvents.close()]);
    await threads.close();
    await redis.quit().catch(() => undefined);
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
