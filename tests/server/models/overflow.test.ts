/**
 * Numbers that are not numbers on every write path (issue 11 item 6): grid edits answer 400
 * naming the member and the field, an import previews the error with table, row and column
 * and cannot be committed, and a model holding a non-finite number is never stored.
 * Also lb = 0 (continuously braced) through the grid.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findNonFinite } from '../../../server/models/finite-numbers.js';
import { applyMemberEdits } from '../../../server/models/member-edits.js';
import { encodeModel } from '../../../server/models/model-codec.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { model as readModel } from '../../shared/reader/helpers.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { CSV, importDemo, newProject, upload, withFile } from './fixture.js';

let t: TestApp;
let projectId: number;
let modelId: number;
beforeAll(async () => {
  t = await createTestApp();
  projectId = await newProject(t);
  modelId = await importDemo(t, projectId);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

const version = async () => (await t.as('engineer').get(`/api/models/${modelId}`)).body.currentVersion as number;

describe('grid edits (PATCH /api/models/:id/members)', () => {
  it('refuses 1e309 typed as text with 400 naming the member and the field, saving nothing', async () => {
    const before = await version();
    const res = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: before,
      edits: [{ member: 'M1', field: 'k_major', value: 0.8 }, { member: 'M1', field: 'l_major', value: '1e309' }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details.problems).toEqual([
      { member: 'M1', field: 'l_major', message: 'member M1, l_major: "1e309" is not a finite number (too large or not a number)' },
    ]);
    expect(await version()).toBe(before);
  });

  it('refuses a JSON number that overflows on parsing (1e400) naming the field', async () => {
    const before = await version();
    const res = await t.as('engineer').patch(`/api/models/${modelId}/members`)
      .set('Content-Type', 'application/json')
      .send(`{"baseVersion":${before},"edits":[{"member":"M2","field":"cb","value":1e400}]}`);
    expect(res.status).toBe(400);
    expect(res.body.error.details.problems[0]).toMatchObject({ member: 'M2', field: 'cb' });
    expect(res.body.error.message).toContain('member M2, cb');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/); // no stack trace
    expect(await version()).toBe(before);
  });

  it('accepts lb = 0 (continuously braced) and still refuses l_major = 0', async () => {
    const before = await version();
    const bad = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: before, edits: [{ member: 'M1', field: 'l_major', value: 0 }],
    });
    expect(bad.status).toBe(400);
    const ok = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: before, edits: [{ member: 'M1', field: 'lb', value: 0 }],
    });
    expect(ok.status).toBe(200);
    const rows = await t.as('engineer').get(`/api/models/${modelId}/members`);
    expect(rows.body.members.find((m: { member: string }) => m.member === 'M1').lb).toBe(0);
  });
});

describe('imports', () => {
  it('previews an overflowing number as an error naming table, row and column, and refuses to commit it', async () => {
    const files = withFile('nodes.csv', 'node,x [m],y [m]\nN1,0,0\nN2,6,0\nN3,1e309,0\n');
    const preview = await upload(t, projectId, files);
    expect(preview.status).toBe(201);
    expect(preview.body.canCommit).toBe(false);
    expect(preview.body.problems).toEqual([expect.objectContaining({ severity: 'error', table: 'nodes', row: 4, column: 'x' })]);
    const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(400);
  });

  it('previews a value that overflows in unit conversion (1e308 ksi)', async () => {
    const files = withFile('materials.csv', CSV['materials.csv'].replace('fy [MPa]', 'fy [ksi]').replace(',355,', ',1e308,'));
    const preview = await upload(t, projectId, files);
    expect(preview.body.canCommit).toBe(false);
    expect(preview.body.problems).toEqual([expect.objectContaining({ table: 'materials', row: 2, column: 'fy' })]);
  });
});

describe('import preview of the new settings', () => {
  it('shows stations, analysis, buckling_modes, modes and stability_warning, and counts result_points', async () => {
    const files = {
      ...withFile('settings.csv', `${CSV['settings.csv']}stations,21\nanalysis,second_order\nbuckling_modes,2\nmodes,4\nstability_warning,off\n`),
      'result_points.csv': 'member,x [m]\nM1,2.25\n',
    };
    const preview = await upload(t, projectId, files);
    expect(preview.body.problems).toEqual([]);
    expect(preview.body.settings).toMatchObject({ stations: 21, analysis: 'second_order', bucklingModes: 2, modes: 4, stabilityWarning: false });
    expect(preview.body.counts.result_points).toBe(1);
  });
});

describe('the stored model', () => {
  it('finds a non-finite number and names its table, row and column', () => {
    const m = readModel();
    expect(findNonFinite(m)).toBeNull();
    m.members[1] = { ...m.members[1], lMajor: Infinity };
    expect(findNonFinite(m)).toMatchObject({ table: 'members', row: 3, column: 'l_major' });
    const m2 = readModel();
    m2.nodeLoads[0].values[2] = Number.NaN;
    expect(findNonFinite(m2)).toMatchObject({ table: 'node_loads', row: 2, column: 'fz' });
  });

  it('is never encoded with a non-finite number (400, not a null in the JSON)', () => {
    const m = readModel();
    m.sections[0].props.A = Infinity;
    expect(() => encodeModel(m)).toThrow(/sections row 2, A: the value is not a finite number/);
  });

  it('member edits refuse a non-finite number given directly (a caller other than the route)', () => {
    const out = applyMemberEdits(readModel(), [{ member: 'M1', field: 'deflection_limit', value: Infinity }]);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]).toMatchObject({ member: 'M1', field: 'deflection_limit' });
  });
});
