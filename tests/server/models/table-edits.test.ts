/** Model tables: every table shown in the model's units; cases, loads and combinations edited as one new version. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { importDemo, newProject } from './fixture.js';

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

type Table = { name: string; editable: boolean; columns: { name: string; header: string }[]; rows: { row: number; cells: unknown[] }[]; generated?: boolean; note?: string };
async function tables(): Promise<{ version: number; tables: Table[] }> {
  const res = await t.as('engineer').get(`/api/models/${modelId}/tables`);
  expect(res.status).toBe(200);
  return res.body;
}
const table = (all: Table[], name: string) => all.find((x) => x.name === name)!;
const col = (tb: Table, name: string) => tb.columns.findIndex((c) => c.name === name);
async function version(): Promise<number> {
  return (await t.as('engineer').get(`/api/models/${modelId}`)).body.currentVersion as number;
}

describe('model tables', () => {
  it('lists every table with units in the headers, in the model unit system', async () => {
    const body = await tables();
    expect(body.tables.map((x) => x.name)).toEqual([
      'settings', 'nodes', 'supports', 'materials', 'sections', 'members', 'cases', 'node_loads', 'member_loads', 'settlements', 'combinations',
    ]);
    const nodes = table(body.tables, 'nodes');
    expect(nodes.columns.map((c) => c.header)).toEqual(['node', 'x [m]', 'y [m]', 'z [m]']);
    // the fixture's N2 is at x = 6 m (fixture.ts)
    expect(nodes.rows[1].cells.slice(0, 2)).toEqual(['N2', 6]);
    const sections = table(body.tables, 'sections');
    expect(sections.columns.find((c) => c.name === 'd')!.header).toBe('d [mm]');
    const loads = table(body.tables, 'member_loads');
    expect(loads.editable).toBe(true);
    // fixture: D on M1 is -5 kN/m
    expect(loads.rows[0].cells[col(loads, 'w1')]).toBe(-5);
    const combos = table(body.tables, 'combinations');
    expect(combos.columns.map((c) => c.name)).toEqual(['combination', 'limit_state', 'case', 'factor', 'source']);
    expect(combos.rows[0].cells.slice(0, 4)).toEqual(['ULS', 'strength', 'D', 1.35]);
    expect(table(body.tables, 'nodes').editable).toBe(false);
  });

  it('changes a member load, adds a node load and deletes a case row as one new version', async () => {
    const base = await version();
    const res = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({
      baseVersion: base,
      edits: [
        { action: 'change', table: 'member_loads', row: 1, column: 'w1', value: '-7.5' },
        { action: 'add', table: 'node_loads', values: { case: 'L', node: 'N2', fy: -20 } },
        { action: 'add', table: 'cases', values: { case: 'W', category: 'wind', title: 'Wind' } },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.currentVersion).toBe(base + 1);
    const body = await tables();
    expect(body.version).toBe(base + 1);
    const loads = table(body.tables, 'member_loads');
    expect(loads.rows[0].cells[col(loads, 'w1')]).toBe(-7.5);
    const nl = table(body.tables, 'node_loads');
    expect(nl.rows).toHaveLength(1);
    expect(nl.rows[0].cells.slice(0, 2)).toEqual(['L', 'N2']);
    expect(nl.rows[0].cells[col(nl, 'fy')]).toBe(-20);
    expect(table(body.tables, 'cases').rows.map((r) => r.cells[0])).toEqual(['D', 'L', 'W']);
    const versions = await t.as('engineer').get(`/api/models/${modelId}/versions`);
    expect(versions.body[0]).toMatchObject({ version: base + 1, origin: 'edit' });

    const del = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({
      baseVersion: base + 1, edits: [{ action: 'delete', table: 'cases', row: 3 }, { action: 'delete', table: 'node_loads', row: 1 }],
    });
    expect(del.status).toBe(200);
    const after = await tables();
    expect(table(after.tables, 'cases').rows).toHaveLength(2);
    expect(table(after.tables, 'node_loads').rows).toHaveLength(0);
  });

  it('edits combinations: a factor changed, a term added', async () => {
    const base = await version();
    const res = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({
      baseVersion: base,
      edits: [
        { action: 'change', table: 'combinations', row: 1, column: 'factor', value: 1.2 },
        { action: 'add', table: 'combinations', values: { combination: 'ULS2', limit_state: 'strength', case: 'D', factor: 1 } },
      ],
    });
    expect(res.status).toBe(200);
    const detail = await t.as('engineer').get(`/api/models/${modelId}`);
    expect(detail.body.loadings.map((l: { id: string }) => l.id)).toEqual(['D', 'L', 'ULS', 'SLS', 'ULS2']);
    const combos = table((await tables()).tables, 'combinations');
    expect(combos.rows[0].cells[3]).toBe(1.2);
  });

  it('refuses a bad value with 400 naming table, row and column, and saves nothing', async () => {
    const base = await version();
    const res = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({
      baseVersion: base,
      edits: [
        { action: 'change', table: 'member_loads', row: 2, column: 'w1', value: 'abc' },
        { action: 'change', table: 'member_loads', row: 1, column: 'w1', value: -9 },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/member_loads row 2, w1: "abc" is not a number/);
    expect(res.body.error.details.problems[0]).toMatchObject({ table: 'member_loads', row: 2, column: 'w1' });
    expect(await version()).toBe(base);
    const loads = table((await tables()).tables, 'member_loads');
    expect(loads.rows[0].cells[col(loads, 'w1')]).toBe(-7.5);
  });

  it('refuses a load on a case that does not exist and a case deleted while loads use it', async () => {
    const base = await version();
    const unknown = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({
      baseVersion: base, edits: [{ action: 'add', table: 'member_loads', values: { case: 'X', member: 'M1', kind: 'point', direction: 'global_y', a: 2, w1: -10 } }],
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details.problems[0]).toMatchObject({ table: 'member_loads', row: 5, column: 'case' });
    const deleted = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({
      baseVersion: base, edits: [{ action: 'delete', table: 'cases', row: 1 }],
    });
    expect(deleted.status).toBe(400);
    expect(deleted.body.error.details.problems.some((p: { table: string }) => p.table === 'member_loads')).toBe(true);
    expect(await version()).toBe(base);
  });

  it('refuses an unknown row or column, and a stale base version with 409', async () => {
    const base = await version();
    const row = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({ baseVersion: base, edits: [{ action: 'delete', table: 'cases', row: 99 }] });
    expect(row.status).toBe(400);
    expect(row.body.error.message).toMatch(/cases row 99: cases has no row 99/);
    const column = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({ baseVersion: base, edits: [{ action: 'change', table: 'cases', row: 1, column: 'colour', value: 'red' }] });
    expect(column.status).toBe(400);
    expect(column.body.error.details.problems[0]).toMatchObject({ table: 'cases', row: 1, column: 'colour' });
    const stale = await t.as('engineer').patch(`/api/models/${modelId}/tables`).send({ baseVersion: base - 1, edits: [{ action: 'change', table: 'cases', row: 1, column: 'title', value: 'x' }] });
    expect(stale.status).toBe(409);
    expect(await version()).toBe(base);
  });

  it('refuses edits from a viewer', async () => {
    const res = await t.as('viewer').patch(`/api/models/${modelId}/tables`).send({ baseVersion: await version(), edits: [{ action: 'delete', table: 'cases', row: 1 }] });
    expect([403, 404]).toContain(res.status);
  });
});
