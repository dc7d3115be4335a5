/**
 * The scaled mode's queue (QUEUE_URL, BullMQ on Redis), web-server side.
 *
 * - `trestle-runs`: one job per run (`{ runId }`, job id `run-<id>`). A worker process
 *   (server/worker.ts) analyses it and writes phase, progress, results and failure to the
 *   database rows every web server reads; nothing of a run lives in a web server's memory.
 * - `trestle-tasks`: the work the in-process mode does in threads (reading uploads, member
 *   detail and forces, exports): the task as data, its result as the job's return value, and
 *   on the way `{ phase }` or `{ chunk }` progress events (an export's file, in order),
 *   which reach the server that asked through BullMQ's event stream.
 *
 * Failure, not retry: a job whose worker dies is failed by BullMQ's stalled-job check
 * (`maxStalledCount: 0`, lock renewed every LOCK_MS/2 while the worker lives); a failed run
 * job marks its run failed (server/queue/run-job.ts). Attempts: 1.
 */
import { randomUUID } from 'node:crypto';
import { Queue, QueueEvents, type JobsOptions } from 'bullmq';
import type { RunPhase } from '../../shared/schemas/runs.js';
import type { TaskHooks, TaskRunner } from '../runs/worker-pool.js';
import type { TaskResult, WorkerTask } from '../runs/worker-protocol.js';
import { decodeFromQueue, encodeForQueue } from './codec.js';

export const RUNS_QUEUE = 'trestle-runs';
export const TASKS_QUEUE = 'trestle-tasks';
/** A worker holds a job's lock this long; it renews it at half that while alive. */
export const LOCK_MS = 10_000;
/** How often workers look for jobs whose lock ran out (their worker died). */
export const STALLED_CHECK_MS = 5_000;

export const JOB_DEFAULTS: JobsOptions = {
  attempts: 1,
  removeOnComplete: { age: 3600, count: 1000 },
  removeOnFail: { age: 24 * 3600, count: 5000 },
};

/** Progress a task job reports. */
export type TaskProgress = { phase: RunPhase } | { chunk: string; seq: number };

interface Waiting {
  hooks: TaskHooks;
  resolve: (v: unknown) => void;
  reject: (e: Error) => void;
  started: boolean;
  nextChunk: number;
}

const connection = (url: string) => ({ url, maxRetriesPerRequest: null });

/** Tasks sent to worker processes through `trestle-tasks`; the same interface as the thread pool. */
export class QueueTaskRunner implements TaskRunner {
  private readonly queue: Queue;
  private readonly events: QueueEvents;
  private readonly pending = new Map<string, Waiting>();
  private readonly ready: Promise<void>;
  private closed = false;

  constructor(readonly url: string) {
    this.queue = new Queue(TASKS_QUEUE, { connection: connection(url), defaultJobOptions: JOB_DEFAULTS });
    this.events = new QueueEvents(TASKS_QUEUE, { connection: connection(url) });
    this.events.on('active', ({ jobId }) => this.started(jobId));
    this.events.on('progress', ({ jobId, data }) => {
      const w = this.pending.get(jobId);
      if (!w) return;
      this.started(jobId);
      const p = data as TaskProgress;
      if ('phase' in p) w.hooks.onPhase?.(p.phase);
      else if ('chunk' in p && p.seq === w.nextChunk) {
        w.nextChunk++;
        w.hooks.onChunk?.(new Uint8Array(Buffer.from(p.chunk, 'base64')));
      }
    });
    this.events.on('completed', ({ jobId, returnvalue }) => {
      const w = this.pending.get(jobId);
      if (!w) return;
      this.pending.delete(jobId);
      try {
        w.resolve(decodeFromQueue(typeof returnvalue === 'string' ? returnvalue : JSON.stringify(returnvalue)));
      } catch (err) {
        w.reject(err as Error);
      }
    });
    this.events.on('failed', ({ jobId, failedReason }) => {
      const w = this.pending.get(jobId);
      if (!w) return;
      this.pending.delete(jobId);
      w.reject(new Error(stalledText(failedReason)));
    });
    this.ready = this.events.waitUntilReady().then(() => undefined);
  }

  private started(jobId: string): void {
    const w = this.pending.get(jobId);
    if (w && !w.started) {
      w.started = true;
      w.hooks.onStart?.();
    }
  }

  async run<T extends WorkerTask>(task: T, hooks: TaskHooks = {}): Promise<TaskResult<T>> {
    if (this.closed) throw new Error('the task queue is closed');
    await this.ready;
    const jobId = randomUUID();
    const done = new Promise<unknown>((resolve, reject) => this.pending.set(jobId, { hooks, resolve, reject, started: false, nextChunk: 0 }));
    try {
      await this.queue.add(task.kind, { task: encodeForQueue(task) }, { jobId });
    } catch (err) {
      this.pending.delete(jobId);
      throw err;
    }
    return done as Promise<TaskResult<T>>;
  }

  /** Nothing to start here: the workers are other processes. */
  warm(): Promise<void> {
    return this.ready;
  }

  /** Tasks of this server not yet answered. */
  get waiting(): number {
    return this.pending.size;
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const w of this.pending.values()) w.reject(new Error('the server is shutting down'));
    this.pending.clear();
    await Promise.allSettled([this.events.close(), this.queue.close()]);
  }
}

/** BullMQ's words for a job whose worker died, in ours. */
export function stalledText(reason: string | undefined): string {
  if (!reason) return 'the worker stopped';
  return /stalled/i.test(reason) ? 'the worker running it stopped (its process ended or lost its connection)' : reason;
}

let runsQueue: Queue | null = null;

/** Puts a run on `trestle-runs` (job id `run-<id>`: a run is queued once). */
export async function enqueueRun(url: string, runId: number): Promise<void> {
  runsQueue ??= new Queue(RUNS_QUEUE, { connection: connection(url), defaultJobOptions: JOB_DEFAULTS });
  await runsQueue.add('run', { runId }, { jobId: `run-${runId}` });
}

export async function closeRunsQueue(): Promise<void> {
  const q = runsQueue;
  runsQueue = null;
  await q?.close();
}
