/**
 * How many exports may be in flight: per server (EXPORT_WORKERS building, EXPORT_MAX_QUEUED
 * more waiting for a thread) and per user (EXPORT_MAX_PER_USER). Past either bound the
 * request is refused at once with 429, `Retry-After` and the standard error body, before any
 * work is done. Scaled mode (QUEUE_URL): the per-user count is kept in Redis
 * (`trestle:exports:user:<id>`, INCR on entry, DECR when over, expiring USER_COUNT_TTL_MS after
 * the last entry as a safety net for a server that dies mid-export), so all servers together
 * keep EXPORT_MAX_PER_USER; the per-server bound stays per server (it protects that server).
 */
import type { Redis } from 'ioredis';
import { AppError } from '../errors/app-error.js';
import { sharedRedis } from '../queue/rate-store.js';

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

const userBusy = (mine: number, limits: ExportLimits) =>
  new AppError(429, 'rate_limited', `You have ${mine} export${mine === 1 ? '' : 's'} in progress (at most ${limits.perUser} at once, EXPORT_MAX_PER_USER); try again when one has finished`, { retryAfterSeconds: 5, limit: limits.perUser });

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
    if (mine >= this.limits.perUser) throw userBusy(mine, this.limits);
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

/** A user's in-flight count lives this long after their last export began (a dead server's count runs out). */
export const USER_COUNT_TTL_MS = 10 * 60_000;
const userKey = (userId: number) => `trestle:exports:user:${userId}`;

/** Either gate: the router awaits `enter`. */
export interface ExportAdmission {
  enter(userId: number): (() => void) | Promise<() => void>;
  readonly active: number;
}

/** Scaled mode: the per-user count shared by every server through Redis; this server's own bound kept here. */
export class SharedExportGate implements ExportAdmission {
  private readonly local: ExportGate;
  constructor(readonly limits: ExportLimits, private readonly redis: Redis) {
    this.local = new ExportGate({ ...limits, perUser: Number.MAX_SAFE_INTEGER });
  }

  get active(): number {
    return this.local.active;
  }

  async enter(userId: number): Promise<() => void> {
    const leaveServer = this.local.enter(userId);
    let mine: number;
    try {
      const replies = await this.redis.multi().incr(userKey(userId)).pexpire(userKey(userId), USER_COUNT_TTL_MS).exec();
      const [err, count] = replies?.[0] ?? [new Error('no reply from Redis'), null];
      if (err) throw err;
      mine = Number(count);
    } catch (err) {
      leaveServer();
      throw err;
    }
    let left = false;
    const leave = () => {
      if (left) return;
      left = true;
      leaveServer();
      // never below zero (the key may have run out meanwhile)
      void this.redis
        .decr(userKey(userId))
        .then((n) => (n <= 0 ? this.redis.del(userKey(userId)) : 0))
        .catch(() => undefined);
    };
    if (mine > this.limits.perUser) {
      leave();
      throw userBusy(mine - 1, this.limits);
    }
    return leave;
  }
}

let shared: ExportAdmission | null = null;

/** The process-wide gate (limits read from the environment on first use); shared per user through Redis with QUEUE_URL. */
export function exportGate(): ExportAdmission {
  if (!shared) {
    const redis = sharedRedis();
    shared = redis ? new SharedExportGate(exportLimitsFromEnv(), redis) : new ExportGate(exportLimitsFromEnv());
  }
  return shared;
}
