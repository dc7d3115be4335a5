/**
 * How many exports may be in flight: per server (EXPORT_WORKERS building, EXPORT_MAX_QUEUED
 * more waiting for a thread) and per user (EXPORT_MAX_PER_USER). Past either bound the
 * request is refused at once with 429, `Retry-After` and the standard error body, before any
 * work is done.
 */
import { AppError } from '../errors/app-error.js';

export interface ExportLimits {
  /** threads building exports of stored results (the export pool's size) */
  workers: number;
  /** exports waiting for a thread beyond those being built */
  queued: number;
  /** exports one user may have in flight (building or waiting) */
  perUser: number;
}

const positive = (v: string | undefined, fallback: number) => {
  const n = Number(v);
  return v !== undefined && v !== '' && Number.isInteger(n) && n > 0 ? n : fallback;
};

export function exportLimitsFromEnv(env: Record<string, string | undefined> = process.env): ExportLimits {
  return {
    workers: positive(env.EXPORT_WORKERS, 1),
    queued: positive(env.EXPORT_MAX_QUEUED, 4),
    perUser: positive(env.EXPORT_MAX_PER_USER, 2),
  };
}

export class ExportGate {
  private inFlight = 0;
  private readonly byUser = new Map<number, number>();
  constructor(readonly limits: ExportLimits) {}

  get active(): number {
    return this.inFlight;
  }

  /** A place for one export of `userId`, or 429; call the returned function once it is over. */
  enter(userId: number): () => void {
    const mine = this.byUser.get(userId) ?? 0;
    if (mine >= this.limits.perUser) {
      throw new AppError(429, 'rate_limited', `You have ${mine} export${mine === 1 ? '' : 's'} in progress (at most ${this.limits.perUser} at once, EXPORT_MAX_PER_USER); try again when one has finished`, { retryAfterSeconds: 5, limit: this.limits.perUser });
    }
    const room = this.limits.workers + this.limits.queued;
    if (this.inFlight >= room) {
      throw new AppError(429, 'rate_limited', `The server is building ${this.inFlight} exports (at most ${room} at once); try again in a few seconds`, { retryAfterSeconds: 10, limit: room });
    }
    this.inFlight++;
    this.byUser.set(userId, mine + 1);
    let left = false;
    return () => {
      if (left) return;
      left = true;
      this.inFlight--;
      const now = (this.byUser.get(userId) ?? 1) - 1;
      if (now > 0) this.byUser.set(userId, now);
      else this.byUser.delete(userId);
    };
  }
}

let shared: ExportGate | null = null;

/** The process-wide gate (limits read from the environment on first use). */
export function exportGate(): ExportGate {
  shared ??= new ExportGate(exportLimitsFromEnv());
  return shared;
}
