// Load generator for the results bench (bench/api.ts): N clients, each reading the run status
// and one member's page per round, in a thread of its own so that the clients' own work
// (fetch) does not sit in the server's event loop. Replies { status, member, errors } in ms.
import { parentPort, workerData } from 'node:worker_threads';
import { performance } from 'node:perf_hooks';

const { base, cookie, runId, members, rounds } = workerData;
const latencies = { status: [], member: [] };
let errors = 0;
await Promise.all(members.map(async (m) => {
  for (let round = 0; round < rounds; round++) {
    for (const [kind, path] of [['status', `/api/runs/${runId}`], ['member', `/api/runs/${runId}/members/${encodeURIComponent(m)}`]]) {
      const t = performance.now();
      try {
        const r = await fetch(`${base}${path}`, { headers: { cookie } });
        await r.arrayBuffer();
        if (r.status !== 200) errors++;
      } catch {
        errors++;
      }
      latencies[kind].push(performance.now() - t);
    }
  }
}));
parentPort.postMessage({ ...latencies, errors });
