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
import type { Redis } from 'ioredis';
import { decodeFromQueue, encodeForQueue } from './codec.js';
import { redisConnection } from './connection.js';

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

/**
 * Worker affinity: each worker process (id from `workerIdOf`) also takes tasks from its own
 * queue `trestle-tasks-<id>` and keeps `trestle:worker:<id>` alive in Redis (set every
 * HEARTBEAT_MS, expiring after ALIVE_MS, deleted on shutdown). A worker that finishes a run
 * records itself on the run (`runs.workerId`) and under `trestle:run-worker:<runId>`, which
 * the servers read to send that run's analysis tasks to its queue while it lives.
 */
export const HEARTBEAT_MS = 5_000;
export const ALIVE_MS = 15_000;
export const workerQueueName = (workerId: string) => `${TASKS_QUEUE}-${workerId}`;
export const aliveKey = (workerId: string) => `trestle:worker:${workerId}`;
export const runWorkerKey = (runId: number) => `trestle:run-worker:${runId}`;
/** How long a run's worker is remembered (its analysis is long gone from the threads after that). */
export const RUN_WORKER_TTL_S = 7 * 24 * 3600;

/** A worker id usable in a queue name (no ':'). */
export function workerIdOf(host: string, pid: number, salt: string): string {
  return `${host}-${pid}-${salt}`.replace(/[^A-Za-z0-9._-]/g, '_').slice(0, 120);
}

/** Tasks that need a run's analysis (its worker still holds it); upload reads and stored-table exports do not. */
const AFFINE = new Set<WorkerTask['kind']>(['member', 'forces', 'checks', 'export', 'suggest']);

interface Waiting {
  hooks: TaskHooks;
  resolve: (v: unknown) => void;
  reject: (e: Error) => void;
  started: boolean;
  nextChunk: number;
  /** the worker whose own queue has it, or null for the shared queue */
  holder: string | null;
  watch?: ReturnType<typeof setInterval>;
  task: string;
  name: WorkerTask['kind'];
}

const connection = (url: string) => ({ url, maxRetriesPerRequest: null });

/**
 * Tasks sent to worker processes through `trestle-tasks`; the same interface as the thread
 * pool. `affine` is the same runner sending the tasks that need a run's analysis to the
 * queue of the worker that ran it, when it lives (runPool() in scaled mode).
 */
export class QueueTaskRunner implements TaskRunner {
  private readonly queues = new Map<string, Queue>();
  private readonly events = new Map<string, Promise<QueueEvents>>();
  private readonly pending = new Map<string, Waiting>();
  private readonly redis: Redis;
  private closed = false;
  readonly affine: TaskRunner;

  constructor(readonly url: string) {
    this.redis = redisConnection(url);
    void this.eventsOf(TASKS_QUEUE).catch(() => undefined);
    const self = this;
    this.affine = {
      run: (task, hooks) => self.run(task, hooks, true),
      warm: () => self.warm(),
      get waiting() {
        return self.waiting;
      },
      close: () => self.close(),
    };
  }

  private queueOf(name: string): Queue {
    let q = this.queues.get(name);
    if (!q) {
      q = new Queue(name, { connection: connection(this.url), defaultJobOptions: JOB_DEFAULTS });
      this.queues.set(name, q);
    }
    return q;
  }

  /**
   * The event stream of one queue, read from Redis's clock at creation: a job added after
   * this resolves has all its events read, however late the stream reader starts.
   */
  private eventsOf(name: string): Promise<QueueEvents> {
    let e = this.events.get(name);
    if (!e) {
      e = this.redis.time().then(async ([s, us]) => {
        const since = Number(s) * 1000 + Math.floor(Number(us) / 1000) - 1;
        const events = new QueueEvents(name, { connection: connection(this.url), lastEventId: `${since}-0` });
        this.listen(events);
        await events.waitUntilReady();
        return events;
      });
      this.events.set(name, e);
      e.catch(() => this.events.delete(name));
    }
    return e;
  }

  private listen(events: QueueEvents): void {
    events.on('active', ({ jobId }) => this.started(jobId));
    events.on('progress', ({ jobId, data }) => {
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
    events.on('completed', ({ jobId, returnvalue }) => {
      const w = this.settle(jobId);
      if (!w) return;
      try {
        w.resolve(decodeFromQueue(typeof returnvalue === 'string' ? returnvalue : JSON.stringify(returnvalue)));
      } catch (err) {
        w.reject(err as Error);
      }
    });
    events.on('failed', ({ jobId, failedReason }) => this.settle(jobId)?.reject(new Error(stalledText(failedReason))));
  }

  private settle(jobId: string): Waiting | undefined {
    const w = this.pending.get(jobId);
    if (!w) return undefined;
    this.pending.delete(jobId);
    if (w.watch) clearInterval(w.watch);
    return w;
  }

  private started(jobId: string): void {
    const w = this.pending.get(jobId);
    if (w && !w.started) {
      w.started = true;
      w.hooks.onStart?.();
    }
  }

  /** The live worker that ran this run (it holds the analysis), or null. */
  private async holderOf(runId: number): Promise<string | null> {
    try {
      const id = await this.redis.get(runWorkerKey(runId));
      return id && (await this.alive(id)) ? id : null;
    } catch {
      return null; // no affinity is never wrong, only slower
    }
  }

  private async alive(workerId: string): Promise<boolean> {
    return (await this.redis.exists(aliveKey(workerId))) === 1;
  }

  async run<T extends WorkerTask>(task: T, hooks: TaskHooks = {}, affine = false): Promise<TaskResult<T>> {
    if (this.closed) throw new Error('the task queue is closed');
    const holder = affine && task.runId > 0 && AFFINE.has(task.kind) ? await this.holderOf(task.runId) : null;
    const name = holder ? workerQueueName(holder) : TASKS_QUEUE;
    await this.eventsOf(name);
    const jobId = randomUUID();
    const data = encodeForQueue(task);
    const done = new Promise<unknown>((resolve, reject) =>
      this.pending.set(jobId, { hooks, resolve, reject, started: false, nextChunk: 0, holder, task: data, name: task.kind }),
    );
    try {
      await this.queueOf(name).add(task.kind, { task: data }, { jobId });
    } catch (err) {
      this.settle(jobId);
      throw err;
    }
    if (holder) this.watch(jobId, holder);
    return done as Promise<TaskResult<T>>;
  }

  /**
   * A task on a worker's own queue: no other worker checks it for stalling, so this server
   * does. When the worker is gone, a task it had not started goes to the shared queue; one it
   * had started fails as a stalled job would.
   */
  private watch(jobId: string, holder: string): void {
    const w = this.pending.get(jobId);
    if (!w) return;
    let checking = false;
    w.watch = setInterval(() => {
      if (checking || !this.pending.has(jobId)) return;
      checking = true;
      void (async () => {
        if (await this.alive(holder).catch(() => true)) return;
        const removed = w.started ? 0 : await this.queueOf(workerQueueName(holder)).remove(jobId).catch(() => 0);
        if (!this.pending.has(jobId)) return;
        if (!removed) {
          this.settle(jobId)?.reject(new Error(stalledText('stalled')));
          return;
        }
        clearInterval(w.watch);
        w.watch = undefined;
        w.holder = null;
        await this.eventsOf(TASKS_QUEUE);
        await this.queueOf(TASKS_QUEUE).add(w.name, { task: w.task }, { jobId });
      })()
        .catch((err: unknown) => this.settle(jobId)?.reject(err as Error))
        .finally(() => (checking = false));
    }, STALLED_CHECK_MS);
    w.watch.unref?.();
  }

  /** Nothing to start here: the workers are other processes. */
  async warm(): Promise<void> {
    await this.eventsOf(TASKS_QUEUE);
  }

  /** Tasks of this server not yet answered. */
  get waiting(): number {
    return this.pending.size;
  }

  async close(): Promise<void> {
    if (this.closed) return;
    this.closed = true;
    for (const w of this.pending.values()) {
      if (w.watch) clearInterval(w.watch);
      w.reject(new Error('the server is shutting down'));
    }
    this.pending.clear();
    const events = await Promise.allSettled([...this.events.values()]);
    await Promise.allSettled([
      ...events.map((e) => (e.status === 'fulfilled' ? e.value.close() : undefined)),
      ...[...this.queues.values()].map((q) => q.close()),
    ]);
    await this.redis.quit().catch(() => undefined);
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
