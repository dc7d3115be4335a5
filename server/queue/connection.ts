/**
 * The Redis connection of the scaled mode (QUEUE_URL): one ioredis client per use, as BullMQ
 * wants it (`maxRetriesPerRequest: null` for workers and event listeners).
 */
import { Redis } from 'ioredis';

/** A URL with its password replaced by *** (for logs). */
export function redactUrl(url: string): string {
  try {
    const u = new URL(url);
    if (u.password) u.password = '***';
    return u.toString();
  } catch {
    return '(unparsable URL)';
  }
}

/** The configured queue URL (QUEUE_URL), or null in the default in-process mode. */
export function queueUrl(env: Record<string, string | undefined> = process.env): string | null {
  const v = env.QUEUE_URL?.trim();
  return v ? v : null;
}

export function redisConnection(url: string, blocking = false): Redis {
  return new Redis(url, { maxRetriesPerRequest: blocking ? null : 3, enableReadyCheck: true, lazyConnect: false });
}
