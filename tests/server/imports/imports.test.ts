/** Import: preview with row/column problems, nothing saved while errors remain, commit, limits, templates. */
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { CSV, newProject, upload, withFile } from '../models/fixture.js';

let t: TestApp;
let projectId: number;
beforeAll(async () => {
  process.env.IMPORT_MAX_MB = '0.05';
  process.env.IMPORT_MAX_ROWS = '500';
  t = await createTestApp();
  delete process.env.IMPORT_MAX_MB;
  delete process.env.IMPORT_MAX_ROWS;
  projectId = await newProject(t);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

describe('POST /api/projects/:id/imports', () => {
  it('previews a valid upload with counts, settings and the inferred plane frame', async () => {
    const res = await upload(t, projectId, CSV);
    expect(res.status).toBe(201);
    expect(res.body.canCommit).toBe(true);
    expect(res.body.errorCount).toBe(0);
    expect(res.body.counts.members).toBe(2);
    expect(res.body.counts.nodes).toBe(3);
    expect(res.body.settings.units).toBe('metric');
    expect(res.body.settings.verticalAxis).toBe('Y');
    expect(res.body.inferences.verticalAxisInferred).toBe(true);
    expect(res.body.inferences.planeFrame).not.toBeNull();
  });

  it('reports a missing node with its table, row and column, and refuses the commit', async () => {
    const bad = withFile('members.csv', 'member,start,end,section,material\nM1,N1,N2,B300,Steel355\nM2,N2,N9,B300,Steel355\n');
    const res = await upload(t, projectId, bad);
    expect(res.status).toBe(201);
    expect(res.body.canCommit).toBe(false);
    const err = res.body.problems.find((p: { severity: string }) => p.severity === 'error');
    expect(err).toMatchObject({ table: 'members', row: 3, column: 'end' });
    expect(err.message).toMatch(/N9/);
    const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${res.body.id}/commit`).send({});
    expect(commit.status).toBe(400);
    expect(commit.body.error.message).toMatch(/error/);
    const models = await t.as('engineer').get(`/api/projects/${projectId}/models`);
    expect(models.body).toEqual([]);
  });

  it('commits a valid import as version 1 of a new model and forgets the pending import', async () => {
    const res = await upload(t, projectId, CSV, { name: 'Beam A' });
    const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${res.body.id}/commit`).send({});
    expect(commit.status).toBe(201);
    expect(commit.body.version).toBe(1);
    expect(commit.body.model).toMatchObject({ name: 'Beam A', currentVersion: 1, designCode: 'en1993-1-1', units: 'metric' });
    const again = await t.as('engineer').post(`/api/projects/${projectId}/imports/${res.body.id}/commit`).send({});
    expect(again.status).toBe(404);
    const versions = await t.as('engineer').get(`/api/models/${commit.body.model.id}/versions`);
    expect(versions.body).toHaveLength(1);
    expect(versions.body[0]).toMatchObject({ version: 1, origin: 'import' });
  });

  it('imports into an existing model as its next version', async () => {
    const first = await upload(t, projectId, CSV);
    const c1 = await t.as('engineer').post(`/api/projects/${projectId}/imports/${first.body.id}/commit`).send({});
    const modelId = c1.body.model.id;
    const second = await upload(t, projectId, CSV, { modelId: String(modelId) });
    expect(second.body.modelId).toBe(modelId);
    const c2 = await t.as('engineer').post(`/api/projects/${projectId}/imports/${second.body.id}/commit`).send({});
    expect(c2.status).toBe(201);
    expect(c2.body.version).toBe(2);
  });

  it('refuses an upload over the size limit with 413 naming the limit', async () => {
    const big = withFile('nodes.csv', 'node,x,y\n' + 'N,0,0\n'.repeat(12_000));
    const res = await upload(t, projectId, big);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/IMPORT_MAX_MB/);
  });

  it('refuses an upload over the row limit with 413 naming the limit', async () => {
    const many = withFile('nodes.csv', 'node,x,y\n' + Array.from({ length: 600 }, (_, i) => `N${i},${i},0`).join('\n'));
    const res = await upload(t, projectId, many);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/IMPORT_MAX_ROWS/);
  });

  it('refuses other file types and an empty upload with 400', async () => {
    const res = await t.as('engineer').post(`/api/projects/${projectId}/imports`).attach('files', Buffer.from('x'), 'notes.txt');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/notes\.txt/);
    const empty = await t.as('engineer').post(`/api/projects/${projectId}/imports`).send({});
    expect(empty.status).toBe(400);
  });

  it('does not let a viewer import', async () => {
    const res = await t.as('viewer').post(`/api/projects/${projectId}/imports`).attach('files', Buffer.from(CSV['nodes.csv']), 'nodes.csv');
    expect(res.status).toBe(403);
  });
});

describe('templates', () => {
  it('gives a workbook with the instructions as a note (no sheet that is not a table) and headers carrying default units', async () => {
    const res = await t.as('viewer').get('/api/templates/model.xlsx?units=us').buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as unknown as ArrayBuffer);
    expect(wb.getWorksheet('instructions')).toBeUndefined();
    expect(String(wb.getWorksheet('settings')!.getCell('A1').note)).toContain('How to fill in this workbook');
    const nodes = wb.getWorksheet('nodes')!;
    expect(nodes.getRow(1).values).toEqual([undefined, 'node', 'x [ft]', 'y [ft]', 'z [ft]']);
    const members = wb.getWorksheet('members')!;
    expect((members.getRow(1).values as string[]).includes('lb [ft]')).toBe(true);
  });
});
