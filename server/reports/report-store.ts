/**
 * Calculation packages in scaled mode (QUEUE_URL): the job's state and its file kept in Redis,
 * so any web server answers progress and download. The server that started a job still
 * writes it (gathering through the queue, layout in its own report thread) and copies each
 * step here: the file's chunks to a list (`trestle:report:<id>:file`) first, then the state
 * (`trestle:report:<id>`, JSON). While the job works, both expire RUNNING_TTL_MS after its
 * last step or heartbeat (a job whose server died disappears: 404); once settled, after
 * REPORT_TTL_MS as in the default mode. Without QUEUE_URL nothing here is used.
 */
import type { ReportJob } from '../../shared/schemas/reports.js';
import { sharedRedis } from '../queue/rate-store.js';

/** A working job's keys live this long after its last step or heartbeat. */
export const RUNNING_TTL_MS = 60_000;
export const HEARTBEAT_MS = 10_000;
/** How often a reader on another server looks for the next chunks. */
export const POLL_MS = 200;

const stateKey = (id: string) => `trestle:report:${id}`;
const fileKey = (id: string) => `trestle:report:${id}:file`;

/** Whether packages are kept in Redis (scaled mode). */
export const sharedReports = (): boolean => sharedRedis() !== null;

/** The writer side of one job: writes in order, one after the other. */
export class ReportMirror {
  private chain: Promise<unknown> = Promise.resolve();
  /** the state write at the end of the chain, not yet begun (later states replace its content) */
  private tail: { job: ReportJob } | null = null;
  private readonly heartbeat: ReturnType<typeof setInterval>;

  /** `settledTtlMs`: how long a finished job stays readable */
  constructor(readonly id: string, private readonly settledTtlMs: number) {
    this.heartbeat = setInterval(() => {
      this.tail = null; // a later state (maybe the last) goes after it
      this.enqueue((r) => r.multi().pexpire(stateKey(id), RUNNING_TTL_MS).pexpire(fileKey(id), RUNNING_TTL_MS).exec());
    }, HEARTBEAT_MS);
    this.heartbeat.unref();
  }

  private enqueue(step: (r: NonNullable<ReturnType<typeof sharedRedis>>) => Promise<unknown>): void {
    const r = sharedRedis();
    if (!r) return;
    this.chain = this.chain.then(() => step(r)).catch(() => undefined);
  }

  chunk(data: Uint8Array): void {
    const buf = Buffer.from(data.buffer, data.byteOffset, data.byteLength);
    this.tail = null;
    this.enqueue((r) => r.multi().rpush(fileKey(this.id), buf).pexpire(fileKey(this.id), RUNNING_TTL_MS).exec());
  }

  /** Settles when every write asked for so far is done. */
  async flush(): Promise<void> {
    await this.chain;
  }

  /** The job's state, after every chunk before it; bursts of progress collapse into one write. */
  state(job: ReportJob): void {
    if (job.phase === 'done' || job.phase === 'failed') clearInterval(this.heartbeat);
    if (this.tail) {
      this.tail.job = job;
      return;
    }
    const step = { job };
    this.tail = step;
    this.enqueue(async (r) => {
      if (this.tail === step) this.tail = null;
      const s = step.job;
      const ttl = s.phase === 'done' || s.phase === 'failed' ? this.settledTtlMs : RUNNING_TTL_MS;
      await r.multi().set(stateKey(this.id), JSON.stringify(s), 'PX', ttl).pexpire(fileKey(this.id), ttl).exec();
    });
  }
}

export async function readState(id: string): Promise<ReportJob | null> {
  const r = sharedRedis();
  if (!r) return null;
  const text = await r.get(stateKey(id));
  return text ? (JSON.parse(text) as ReportJob) : null;
}

/** Chunks of the file from `from` on. */
export async function readChunks(id: string, from: number): Promise<Buffer[]> {
  const r = sharedRedis();
  if (!r) return [];
  return r.lrangeBuffer(fileKey(id), from, -1);
}
