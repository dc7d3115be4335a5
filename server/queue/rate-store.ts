/**
 * Rate-limit counters every web server shares (scaled mode): with QUEUE_URL each
 * express-rate-limit limiter keeps its counts in Redis (rate-limit-redis) under its own
 * prefix; without it, in the process's memory (express-rate-limit's default).
 */
import { RedisStore, type RedisReply } from 'rate-limit-redis';
import type { Redis } from 'ioredis';
import { queueUrl, redisConnection } from './connection.js';

let client: Redis | null = null;

/**
 * The server's one Redis client for shared state (rate limits, export counts, calculation
 * packages), or null without QUEUE_URL; closed by closeRateStore at shutdown.
 */
export function sharedRedis(): Redis | null {
  const url = queueUrl();
  if (!url) return null;
  client ??= redisConnection(url);
  return client;
}

/** A store for one limiter (`name` keeps limiters apart), or undefined for the in-memory default. */
export function sharedRateStore(name: string): RedisStore | undefined {
  const c = sharedRedis();
  if (!c) return undefined;
  return new RedisStore({
    prefix: `trestle:rl:${name}:`,
    sendCommand: (command: string, ...args: string[]) => c.call(command, ...args) as Promise<RedisReply>,
  });
}

export async function closeRateStore(): Promise<void> {
  const c = client;
  client = null;
  await c?.quit().catch(() => undefined);
}
