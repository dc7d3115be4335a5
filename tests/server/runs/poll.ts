import type { TestApp } from '../helpers/test-app.js';

/** Polls GET /api/runs/:id until the run is done or failed. */
export async function settle(t: TestApp, runId: number, timeoutMs = 60_000): Promise<Record<string, unknown>> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await t.as('engineer').get(`/api/runs/${runId}`);
    if (res.body.status === 'done' || res.body.status === 'failed') return res.body;
    if (Date.now() > until) throw new Error(`run ${runId} still ${res.body.status ?? `${res.status} ${JSON.stringify(res.body)}`}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
