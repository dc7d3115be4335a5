/**
 * setupFile of the `scaled-api` project: puts the engines the globalSetup started
 * (tests/scaled/api-setup.ts) into this test process's environment before any server module
 * is loaded. QUEUE_URL makes the server code in this process (the two web-server instances
 * of each test app) send runs and tasks to the worker processes and keep rate limits, export
 * counts and calculation packages in Redis; TRESTLE_TEST_DATABASE_URL makes createTestApp
 * open PostgreSQL instead of an in-memory SQLite.
 */
import { afterAll, inject } from 'vitest';

const ctx = inject('scaledApi');
process.env.QUEUE_URL = ctx.queueUrl;
process.env.TRESTLE_TEST_DATABASE_URL = ctx.databaseUrl;

afterAll(async () => {
  // the Redis clients this file's server code opened (rate limits, queue); loaded late so the env above is in place
  const [{ closeRateStore }, { closeRunsQueue }] = await Promise.all([import('../../server/queue/rate-store.js'), import('../../server/queue/task-queue.js')]);
  await closeRateStore();
  await closeRunsQueue();
});
