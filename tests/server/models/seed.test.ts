/** A new demo database holds the samples as models, each with a finished run. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listSamples } from '../../../server/samples/sample.router.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ seed: 'demo' });
}, 180_000);
afterAll(() => t.close());

describe('demo seed', () => {
  it('adds every sample as a model with one done run', async () => {
    const samples = listSamples();
    const models: { id: number; name: string }[] = await t.dataSource.query('SELECT id, name FROM models');
    expect(models.length).toBe(samples.length);
    const runs: { modelId: number; status: string; passCount: number | null }[] = await t.sql('SELECT "modelId", status, "passCount" FROM runs');
    for (const m of models) {
      const run = runs.find((r) => r.modelId === m.id);
      expect(run?.status, m.name).toBe('done');
    }
  });

  it('keeps the stability summary of a seeded second-order run (analysis order, αcr, modes)', async () => {
    const [m] = await t.dataSource.query("SELECT id FROM models WHERE name LIKE '%second order%'");
    const [run] = await t.sql('SELECT id FROM runs WHERE "modelId" = ?', [m.id]);
    const r = await t.as('engineer').get(`/api/runs/${run.id}`);
    expect(r.status).toBe(200);
    expect(r.body.stability.analysis).toBe('second_order');
    expect(r.body.stability.modes.length).toBe(4);
    expect(r.body.stability.critical.length).toBeGreaterThan(0);
  });

  it('serves the samples list and a sample workbook', async () => {
    const list = await t.as('viewer').get('/api/samples');
    expect(list.status).toBe(200);
    expect(list.body.length).toBe(listSamples().length);
    if (list.body.length > 0) {
      const file = await t.as('viewer').get(list.body[0].xlsx);
      expect(file.status).toBe(200);
      expect(file.headers['content-type']).toMatch(/spreadsheetml/);
    }
  });
});
