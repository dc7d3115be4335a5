/** Built result payloads kept per server (server/runs/payload-cache.ts) and the grid route using them. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { gridPayloads, PayloadCache } from '../../../server/runs/payload-cache.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, onlyEmbedded, type TestApp } from '../helpers/test-app.js';
import { importDemo, newProject } from '../models/fixture.js';
import { settle } from './poll.js';

const bytes = (n: number) => new Uint8Array(n);

describe('PayloadCache', () => {
  it('builds a key once: concurrent requests wait for the build, later ones get the kept bytes', async () => {
    const cache = new PayloadCache(1000);
    let builds = 0;
    let open!: () => void;
    const gate = new Promise<void>((r) => (open = r));
    const build = async () => { builds++; await gate; return bytes(10); };
    const a = cache.get('k', build), b = cache.get('k', build);
    open();
    const [x, y] = await Promise.all([a, b]);
    expect(x).toBe(y);
    expect(await cache.get('k', build)).toBe(x);
    expect(builds).toBe(1);
    expect(cache.stats).toEqual({ built: 1, hits: 2 });
  });

  it('keeps at most its budget, least recently used out first, and never keeps a failed build', async () => {
    const cache = new PayloadCache(25);
    await cache.get('a', async () => bytes(10));
    await cache.get('b', async () => bytes(10));
    await cache.get('a', async () => bytes(10)); // a is now the most recent
    await cache.get('c', async () => bytes(10)); // b goes
    expect(cache.size).toEqual({ entries: 2, bytes: 20 });
    let rebuilt = false;
    await cache.get('b', async () => { rebuilt = true; return bytes(10); });
    expect(rebuilt).toBe(true);
    await cache.get('huge', async () => bytes(100)); // larger than the budget: not kept
    expect(cache.size.bytes).toBeLessThanOrEqual(25);
    await expect(cache.get('bad', async () => { throw new Error('worker stopped'); })).rejects.toThrow('worker stopped');
    expect(await cache.get('bad', async () => bytes(1))).toHaveLength(1);
  });
});

describe('grid payload through the cache', () => {
  let t: TestApp;
  let runId: number;
  beforeAll(async () => {
    t = await createTestApp();
    const modelId = await importDemo(t, await newProject(t));
    runId = (await t.as('engineer').post(`/api/models/${modelId}/runs`).send({})).body.id;
    expect((await settle(t, runId)).status).toBe('done');
  }, 120_000);
  afterAll(async () => {
    await closeRunPool();
    await t.close();
  });

  it.skipIf(onlyEmbedded('runs are saved by worker processes there (no payload comes with them), and each web-server instance keeps its own cache'))(
    'sends the payload built with the run on the first load, and builds any other layout once', async () => {
    const cache = gridPayloads(t.dataSource);
    const before = { ...cache.stats };
    // the run's worker built the column layout (gzip) with the results: loads of it are hits
    const first = await t.as('engineer').get(`/api/runs/${runId}/members?layout=table`).set('Accept-Encoding', 'gzip');
    expect(first.status).toBe(200);
    expect(cache.stats.built - before.built).toBe(0);
    expect(cache.stats.hits - before.hits).toBe(1);
    // the same layout without gzip is another key: built once from the stored blobs, then kept
    const plain = await t.as('engineer').get(`/api/runs/${runId}/members?layout=table`).set('Accept-Encoding', 'identity');
    const again = await t.as('engineer').get(`/api/runs/${runId}/members?layout=table`).set('Accept-Encoding', 'identity');
    expect(again.body).toEqual(plain.body);
    expect(cache.stats.built - before.built).toBe(1);
    expect(cache.stats.hits - before.hits).toBe(2);
    // another database (another test app) has its own cache
    expect(gridPayloads({})).not.toBe(cache);
  });

  it('answers the same grid payload whichever way it was built', async () => {
    const first = await t.as('engineer').get(`/api/runs/${runId}/members?layout=table`).set('Accept-Encoding', 'gzip');
    expect(first.status).toBe(200);
    const second = await t.as('viewer').get(`/api/runs/${runId}/members?layout=table`);
    expect(second.status).toBe(404); // a viewer who is not on the project is refused (as if the run did not exist) before any payload
    const plain = await t.as('engineer').get(`/api/runs/${runId}/members?layout=table`).set('Accept-Encoding', 'identity');
    expect(plain.body).toEqual(first.body);
    const rows = await t.as('engineer').get(`/api/runs/${runId}/members`).set('Accept-Encoding', 'identity');
    expect(rows.body.members).toHaveLength(first.body.count);
  });
});
