/**
 * A run with natural modes and elastic critical load factors over the API: the summary on
 * GET /api/runs/:id, shapes for the picture, stability.csv and modes.csv with the columns of
 * tables.md, and the method named in the XLSX header block.
 */
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { newProject, upload } from '../models/fixture.js';
import { settle } from './poll.js';
import { PORTAL } from './stability-fixture.js';

const withSettings = (extra: string, files = PORTAL) => ({ ...files, 'settings.csv': files['settings.csv'] + extra });

let t: TestApp;
let projectId = 0;
let runId = 0;

/** Imports the files as a new model and starts its run; returns the run id. */
async function importAndRun(files: Record<string, string>): Promise<number> {
  const preview = await upload(t, projectId, files);
  if (preview.status !== 201 || !preview.body.canCommit) throw new Error(`preview: ${preview.status} ${JSON.stringify(preview.body)}`);
  const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
  const start = await t.as('engineer').post(`/api/models/${commit.body.model.id}/runs`).send({});
  return start.body.id as number;
}

beforeAll(async () => {
  t = await createTestApp();
  projectId = await newProject(t, 'Stability');
  runId = await importAndRun(PORTAL);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

describe('a run with modes = 3 and buckling_modes = 2', () => {
  it('serves the stability summary with the run: order, method, αcr per strength combination, modes', async () => {
    const run = await settle(t, runId);
    expect(run.status, String(run.message)).toBe('done');
    const s = run.stability as {
      analysis: string; method: string; critical: { loading: string; alphaCr: (number | null)[]; shapes: number }[];
      modes: { mode: number; frequency: number; period: number; massRatio: number[] }[]; warnings: unknown[];
    };
    expect(s.analysis).toBe('first_order');
    expect(s.method).toMatch(/first.order/i);
    expect(s.critical.map((c) => c.loading)).toEqual(['ULS-1']);
    expect(s.critical[0].alphaCr).toHaveLength(2);
    expect(s.critical[0].alphaCr[0]!).toBeLessThanOrEqual(s.critical[0].alphaCr[1]!);
    expect(s.modes.map((m) => m.mode)).toEqual([1, 2, 3]);
    for (const m of s.modes) {
      // period = 1 / frequency (definition), tolerance 1e-9 relative
      expect(Math.abs(m.period * m.frequency - 1)).toBeLessThan(1e-9);
      expect(m.massRatio).toHaveLength(3);
    }
    expect(s.modes[0].frequency).toBeLessThanOrEqual(s.modes[1].frequency);
  });

  it('serves a mode shape and a buckled shape for the picture (nodes × 6), and names what is missing', async () => {
    const mode = await t.as('engineer').get(`/api/runs/${runId}/shapes?kind=mode&index=1`);
    expect(mode.status).toBe(200);
    expect(mode.body).toMatchObject({ runId, kind: 'mode', index: 1, loading: '' });
    expect(mode.body.displacements).toHaveLength(4 * 6);
    const buckled = await t.as('engineer').get(`/api/runs/${runId}/shapes?kind=buckling&index=1&loading=ULS-1`);
    expect(buckled.status).toBe(200);
    expect(buckled.body.label).toMatch(/^ULS-1 buckling mode 1: αcr = /);
    const missing = await t.as('engineer').get(`/api/runs/${runId}/shapes?kind=mode&index=9`);
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe('mode 9 does not exist: this run has 3 natural modes');
    const bad = await t.as('engineer').get(`/api/runs/${runId}/shapes?kind=wobble`);
    expect(bad.status).toBe(400);
  });

  it('exports stability.csv and modes.csv with exactly the columns of tables.md', async () => {
    const stab = await t.as('engineer').get(`/api/runs/${runId}/exports/stability.csv`);
    expect(stab.status).toBe(200);
    expect(stab.headers['content-type']).toMatch(/text\/csv/);
    const stabLines = stab.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(stabLines[0]).toBe('loading,mode,alpha_cr');
    expect(stabLines.slice(1).map((l) => l.split(',').slice(0, 2).join(','))).toEqual(['ULS-1,1', 'ULS-1,2']);
    const modes = await t.as('engineer').get(`/api/runs/${runId}/exports/modes.csv`);
    expect(modes.status).toBe(200);
    const modeLines = modes.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(modeLines[0]).toBe('mode,frequency [Hz],period [s],mass_x,mass_y,mass_z');
    expect(modeLines.slice(1).map((l) => l.split(',')[0])).toEqual(['1', '2', '3']);
  });

  it('names the analysis method in the XLSX header block', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/modes.xlsx`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as unknown as ArrayBuffer);
    const ws = wb.worksheets[0];
    const rows: string[] = [];
    ws.eachRow((row) => rows.push(String(row.getCell(1).value)));
    const at = rows.indexOf('Analysis');
    expect(at).toBeGreaterThan(0);
    expect(String(ws.getRow(at + 1).getCell(2).value)).toMatch(/first.order/i);
    const util = await t.as('engineer').get(`/api/runs/${runId}/exports/utilisation.xlsx`);
    expect(util.status).toBe(200);
  });
});

describe('a second-order run', () => {
  it('states the order, the method and the iterations per loading; member detail says second order', async () => {
    const id = await importAndRun(withSettings('analysis,second_order\n'));
    const run = await settle(t, id);
    expect(run.status, String(run.message)).toBe('done');
    const s = run.stability as { analysis: string; method: string; secondOrder: { loading: string; iterations: number; converged: boolean }[] };
    expect(s.analysis).toBe('second_order');
    expect(s.method).toMatch(/second.order/i);
    expect(s.secondOrder.length).toBeGreaterThan(0);
    for (const l of s.secondOrder) {
      expect(l.converged).toBe(true);
      expect(l.iterations).toBeGreaterThan(0);
    }
    const history = await t.as('engineer').get(`/api/models/${run.modelId}/runs`);
    expect(history.body[0]).toMatchObject({ id, analysis: 'second_order' });
    const detail = await t.as('engineer').get(`/api/runs/${id}/members/C1`);
    expect(detail.status).toBe(200);
    expect(detail.body).toMatchObject({ analysis: 'second_order' });
    // every loading the analysis ran (with the code's added variants) can be drawn
    for (const l of detail.body.loadings as { id: string; envelope?: string }[]) {
      const g = await t.as('engineer').get(`/api/runs/${id}/model?loading=${encodeURIComponent(l.id)}`);
      expect(g.status, l.id).toBe(200);
    }
  });

  it('fails with a plain message naming the combination when it is not stable at its load level', async () => {
    const heavy = withSettings('analysis,second_order\n', { ...PORTAL, 'member_loads.csv': 'case,member,kind,direction,w1\nG,B1,uniform,global_y,-5000\n' });
    const run = await settle(t, await importAndRun(heavy));
    expect(run.status).toBe('failed');
    expect(run.message).toMatch(/^The run failed: combination ULS-1\b.* is not stable at this load level.*: αcr [=≈] \d/);
    expect(run.message).not.toMatch(/\.ts\b|\n\s+at /);
  });
});
