/**
 * Body of a run worker thread (loaded by worker.mjs through tsx). Takes one task at a
 * time from the HTTP thread, reports the phase it reaches, replies with the result.
 */
import { parentPort } from 'node:worker_threads';
import type { WorkerReply, WorkerRequest } from './worker-protocol.js';
import { runWorkerTask, transferList } from './worker-tasks.js';
import { COLLECT_AFTER_MS, exposedGc } from './garbage.js';

if (!parentPort) throw new Error('worker.ts must run in a worker thread');
const port = parentPort;

const gc = exposedGc();

port.on('message', async ({ id, task }: WorkerRequest) => {
  const started = performance.now();
  try {
    const result = await runWorkerTask(
      task,
      (phase) => port.postMessage({ id, type: 'progress', phase } satisfies WorkerReply),
      (data) => port.postMessage({ id, type: 'chunk', data } satisfies WorkerReply, [data.buffer as ArrayBuffer]),
    );
    port.postMessage({ id, type: 'done', result } satisfies WorkerReply, transferList(result));
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    port.postMessage({ id, type: 'error', message } satisfies WorkerReply);
  }
  // after the reply is on its way: the garbage of a long task goes back to the system now (garbage.ts)
  if (gc && performance.now() - started > COLLECT_AFTER_MS) setImmediate(gc);
});

port.postMessage({ id: 0, type: 'ready' } satisfies WorkerReply);
