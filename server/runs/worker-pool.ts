/**
 * A small pool of worker threads for runs and the work that needs an analysis (member
 * detail, member-force exports), so the HTTP thread stays responsive. Tasks queue in
 * arrival order; a task for a run prefers the worker that last handled that run (it
 * still holds the analysis). A worker that dies fails its task and is replaced.
 *
 * The entry is worker.mjs, which registers tsx in the thread and loads worker-main.ts; it works
 * under vitest, `npm start` and `npm run dev` alike.
 */
import os from 'node:os';
import { Worker } from 'node:worker_threads';
import type { RunPhase } from '../../shared/schemas/runs.js';
import { QueueTaskRunner } from '../queue/task-queue.js';
import type { TaskResult, WorkerReply, WorkerTask } from './worker-protocol.js';

/** How long a task waits for the busy worker that holds its run's analysis before another re-analyses. */
const HOLDER_WAIT_MS = 3000;
/** Tasks that work on a run's analysis (an export needs it for member forces and recomputed checks). */
const USES_ANALYSIS = new Set<WorkerTask['kind']>(['member', 'forces', 'checks', 'export', 'suggest']);
/**
 * Short tasks a worker answers synchronously, one message after the other: several may be
 * sent to the worker holding their run while it answers one (up to PIPELINE_DEPTH), so fifty
 * readers of one big run are not held up by a round trip through the HTTP thread per page.
 */
const PIPELINED = new Set<WorkerTask['kind']>(['member']);
const PIPELINE_DEPTH = 8;

interface Pending {
  id: number;
  queuedAt: number;
  task: WorkerTask;
  onStart?: () => void;
  onPhase?: (phase: RunPhase) => void;
  onChunk?: (data: Uint8Array) => void;
  resolve: (value: unknown) => void;
  reject: (err: Error) => void;
}

interface Slot {
  /** null after a crash: a new worker starts when the next task needs this slot */
  worker: Worker | null;
  /** tasks sent and not yet answered, in the order sent (more than one only for PIPELINED tasks) */
  inFlight: Pending[];
  /** runs whose analysis this worker holds, newest last */
  runs: number[];
  /** settled when the worker has loaded its modules */
  ready?: Promise<void>;
  onReady?: () => void;
}

export interface TaskHooks {
  onStart?: () => void;
  onPhase?: (phase: RunPhase) => void;
  /** export tasks: each piece of the file, in order */
  onChunk?: (data: Uint8Array) => void;
}

/**
 * What runs a task: the thread pool below (default), or the BullMQ queue of the scaled mode
 * (server/queue/task-queue.ts, when QUEUE_URL is set), whose worker processes run the same
 * task code in their own thread pools.
 */
export interface TaskRunner {
  run<T extends WorkerTask>(task: T, hooks?: TaskHooks): Promise<TaskResult<T>>;
  /** start what can be started before the first task */
  warm(): Promise<void>;
  /** tasks waiting */
  readonly waiting: number;
  close(): Promise<void>;
}

export class WorkerPool implements TaskRunner {
  private readonly slots: Slot[] = [];
  private readonly queue: Pending[] = [];
  private nextId = 1;
  /** the most tasks one worker had in flight at once (1 unless member tasks were pipelined) */
  peakInFlight = 0;
  private closed = false;
  private retry: ReturnType<typeof setTimeout> | null = null;

  constructor(readonly size = Math.max(1, Math.min(2, os.availableParallelism?.() ?? os.cpus().length))) {
    for (let i = 0; i < size; i++) this.slots.push({ worker: null, inFlight: [], runs: [] });
  }

  /** Start every worker now (module loading and TypeScript transpiling happen before the first run). */
  warm(): Promise<void> {
    for (const slot of this.slots) if (!slot.worker && !this.closed) this.spawn(slot);
    return Promise.all(this.slots.map((s) => s.ready)).then(() => undefined);
  }

  private spawn(slot: Slot): Worker {
    const worker = new Worker(new URL('./worker.mjs', import.meta.url));
    worker.unref();
    slot.worker = worker;
    slot.runs = [];
    slot.ready = new Promise((resolve) => (slot.onReady = resolve));
    worker.on('message', (reply: WorkerReply) => this.onReply(slot, reply));
    worker.on('error', (err) => this.onCrash(slot, worker, err));
    worker.on('exit', (code) => {
      if (!this.closed) this.onCrash(slot, worker, new Error(`the analysis worker stopped (exit code ${code})`));
    });
    return worker;
  }

  run<T extends WorkerTask>(task: T, hooks: TaskHooks = {}): Promise<TaskResult<T>> {
    if (this.closed) return Promise.reject(new Error('the worker pool is closed'));
    return new Promise((resolve, reject) => {
      this.queue.push({ id: this.nextId++, queuedAt: Date.now(), task, ...hooks, resolve: resolve as (v: unknown) => void, reject });
      this.pump();
    });
  }

  /** Tasks waiting for a worker. */
  get waiting(): number {
    return this.queue.length;
  }

  /** Whether a live thread last handled this run (it holds the analysis unless it crashed since). */
  holds(runId: number): boolean {
    return this.slots.some((s) => s.worker && s.runs.includes(runId));
  }

  /** Whether the slot can take the task now: idle, or answering only pipelined tasks with room for one more. */
  private canTake(slot: Slot, task: WorkerTask): boolean {
    if (slot.inFlight.length === 0) return true;
    return PIPELINED.has(task.kind) && slot.inFlight.length < PIPELINE_DEPTH && slot.inFlight.every((p) => PIPELINED.has(p.task.kind));
  }

  private pump(): void {
    for (let i = 0; i < this.queue.length; ) {
      const next = this.queue[i];
      const holder = USES_ANALYSIS.has(next.task.kind) ? this.slots.find((s) => s.runs.includes(next.task.runId)) : undefined;
      let slot: Slot | undefined = holder && this.canTake(holder, next.task) ? holder : undefined;
      if (!slot) {
        const idle = this.slots.filter((s) => s.inFlight.length === 0);
        if (idle.length === 0) {
          i++;
          continue;
        }
        // a task that needs a run's analysis waits a little for the busy worker holding it
        // rather than re-analysing the model on an idle one (HOLDER_WAIT_MS at most)
        if (holder && Date.now() - next.queuedAt < HOLDER_WAIT_MS) {
          if (!this.retry) this.retry = setTimeout(() => {
            this.retry = null;
            this.pump();
          }, HOLDER_WAIT_MS).unref();
          i++;
          continue;
        }
        slot = idle.find((s) => s.runs.includes(next.task.runId)) ?? idle[0];
      }
      this.queue.splice(i, 1);
      slot.inFlight.push(next);
      this.peakInFlight = Math.max(this.peakInFlight, slot.inFlight.length);
      slot.runs = [...slot.runs.filter((r) => r !== next.task.runId), next.task.runId].slice(-2);
      next.onStart?.();
      const worker = slot.worker ?? this.spawn(slot);
      worker.ref();
      worker.postMessage({ id: next.id, task: next.task });
    }
  }

  private finish(slot: Slot, pending: Pending): void {
    slot.inFlight = slot.inFlight.filter((p) => p !== pending);
    if (slot.inFlight.length === 0) slot.worker?.unref();
  }

  private onReply(slot: Slot, reply: WorkerReply): void {
    if (reply.type === 'ready') {
      slot.onReady?.();
      return;
    }
    const pending = slot.inFlight.find((p) => p.id === reply.id);
    if (!pending) return;
    if (reply.type === 'progress') {
      pending.onPhase?.(reply.phase);
      return;
    }
    if (reply.type === 'chunk') {
      pending.onChunk?.(reply.data);
      return;
    }
    this.finish(slot, pending);
    if (reply.type === 'done') pending.resolve(reply.result);
    else pending.reject(new Error(reply.message));
    this.pump();
  }

  private onCrash(slot: Slot, worker: Worker, err: Error): void {
    if (slot.worker !== worker) return; // already handled (error then exit)
    const lost = slot.inFlight;
    slot.inFlight = [];
    slot.onReady?.();
    slot.worker = null;
    slot.runs = [];
    void worker.terminate();
    for (const pending of lost) pending.reject(err);
    if (!this.closed) this.pump();
  }

  async close(): Promise<void> {
    this.closed = true;
    if (this.retry) clearTimeout(this.retry);
    for (const p of this.queue.splice(0)) p.reject(new Error('the server is shutting down'));
    await Promise.all(this.slots.map((s) => s.worker?.terminate()));
  }
}

let shared: TaskRunner | null = null;
let queued: QueueTaskRunner | null = null;

/** Scaled mode: the queue to the worker processes (one per process), else null. */
function queueRunner(): QueueTaskRunner | null {
  const url = process.env.QUEUE_URL?.trim();
  if (!url) return null;
  queued ??= new QueueTaskRunner(url);
  return queued;
}

/**
 * The process-wide pool (created on first use; size from RUN_WORKERS or min(2, cpus)); with
 * QUEUE_URL, the queue to the worker processes (a run's analysis tasks to the worker that ran it).
 */
export function runPool(): TaskRunner {
  const q = queueRunner();
  // analysis tasks go to the queue of the worker process that ran their run, while it lives
  if (q) return q.affine;
  if (!shared) {
    const configured = Number(process.env.RUN_WORKERS);
    shared = Number.isInteger(configured) && configured > 0 ? new WorkerPool(configured) : new WorkerPool();
  }
  return shared;
}

let exports_: TaskRunner | null = null;

/**
 * Exports of stored results build in their own threads (EXPORT_WORKERS, default 1), so a run
 * never waits behind one; with QUEUE_URL, in the worker processes.
 */
export function exportPool(): TaskRunner {
  const q = queueRunner();
  if (q) return q;
  if (!exports_) {
    const configured = Number(process.env.EXPORT_WORKERS);
    exports_ = new WorkerPool(Number.isInteger(configured) && configured > 0 ? configured : 1);
  }
  return exports_;
}

let results_: TaskRunner | null = null;

/** The grid's payloads build in their own thread (RESULTS_WORKERS, default 1): never behind a run or an export. */
export function resultsPool(): TaskRunner {
  if (!results_) {
    const configured = Number(process.env.RESULTS_WORKERS);
    results_ = new WorkerPool(Number.isInteger(configured) && configured > 0 ? configured : 1);
  }
  return results_;
}

export async function closeRunPool(): Promise<void> {
  const pools = [shared, exports_, results_, queued];
  queued = null;
  shared = null;
  exports_ = null;
  results_ = null;
  await Promise.all(pools.map((p) => p?.close()));
}
