/** Model tab: rows with pending edits, the reader's checks as you type, the store's save. */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { readCsvFiles } from '../../shared/reader/csv.js';
import { applyTableEditsToModel, checkCell, checkTableEdits, modelTablesView } from '../../shared/reader/table-edits.js';
import type { Model } from '../../shared/model/types.js';
import { problemIndex, shownRows, withEdit } from '../../src/components/model/tableRows.js';
import { useModelTablesStore } from '../../src/stores/modelTables.js';
import { buildSketch, project } from '../../src/components/model/sketch.js';
import { CSV } from '../server/models/fixture.js';

function demo(files: Record<string, string> = CSV): Model {
  const r = readCsvFiles(Object.entries(files).map(([name, text]) => ({ name, text })));
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.model;
}

function sample(dir: string): Model {
  const folder = join('samples', dir, 'csv');
  const r = readCsvFiles(readdirSync(folder).filter((f) => f.endsWith('.csv')).map((name) => ({ name, text: readFileSync(join(folder, name), 'utf8') })));
  if (!r.ok) throw new Error(`${dir}: ${JSON.stringify(r.problems.slice(0, 3))}`);
  return r.model;
}

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => vi.unstubAllGlobals());

describe('model tables view and rows', () => {
  const view = modelTablesView(demo(), 1, 1);
  const loads = view.tables.find((t) => t.name === 'member_loads')!;

  it('shows pending changes, added and deleted rows numbered as the reader numbers them', () => {
    const edits = [
      { action: 'change' as const, table: 'member_loads' as const, row: 2, column: 'w1', value: -6 },
      { action: 'delete' as const, table: 'member_loads' as const, row: 1 },
      { action: 'add' as const, table: 'member_loads' as const, values: { case: 'L', member: 'M1', kind: 'point', a: 2, w1: -10 } },
    ];
    const rows = shownRows(loads, edits);
    expect(rows.map((r) => r.row)).toEqual([2, 3, 4, 5]);
    expect(rows[0].changed).toEqual(['w1']);
    expect(rows[3]).toMatchObject({ row: 5, added: true });
    // the added point load has no direction: the reader asks for one on that row
    const problems = checkTableEdits(view, edits);
    expect(problems.length).toBeGreaterThan(0);
    expect(problems.every((p) => p.table === 'member_loads' && p.row === 5)).toBe(true);
  });

  it('drops a change back to the loaded value and replaces a second change of one cell', () => {
    const one = withEdit(loads, [], { action: 'change', table: 'member_loads', row: 1, column: 'w1', value: -8 });
    const two = withEdit(loads, one, { action: 'change', table: 'member_loads', row: 1, column: 'w1', value: -9 });
    expect(two).toHaveLength(1);
    expect(withEdit(loads, two, { action: 'change', table: 'member_loads', row: 1, column: 'w1', value: '-5' })).toEqual([]);
  });

  it('checks a cell as you type with the reader rules and names the table, row and column of a bad value', () => {
    const col = (name: string) => loads.columns.find((c) => c.name === name)!;
    expect(checkCell('member_loads', col('w1'), 'abc', 'metric')).toMatch(/"abc" is not a number/);
    expect(checkCell('member_loads', col('a'), -1, 'metric')).toMatch(/zero or more/);
    expect(checkCell('member_loads', col('kind'), 'sideways', 'metric')).toMatch(/not one of point, moment/);
    expect(checkCell('member_loads', col('w1'), '-4.5', 'metric')).toBeNull();
    const problems = checkTableEdits(view, [{ action: 'change', table: 'member_loads', row: 3, column: 'case', value: 'Q' }]);
    expect(problems[0]).toMatchObject({ table: 'member_loads', row: 3, column: 'case' });
    expect(problemIndex(problems).has('member_loads:3:case')).toBe(true);
  });

  it('shows a US model in its own units and reads an edit in them', () => {
    const us = demo({
      ...CSV,
      'settings.csv': 'key,value\ntitle,US beam\nunits,us\n',
      'nodes.csv': 'node,x,y\nN1,0,0\nN2,20,0\nN3,40,0\n',
      'member_loads.csv': 'case,member,kind,direction,w1\nD,M1,uniform,global_y,-0.5\n',
    });
    const v = modelTablesView(us, 1, 1);
    expect(v.tables.find((t) => t.name === 'nodes')!.columns[1].header).toBe('x [ft]');
    const n2 = v.tables.find((t) => t.name === 'nodes')!.rows[1].cells[1] as number;
    expect(n2).toBeCloseTo(20, 9);
    const out = applyTableEditsToModel(us, [{ action: 'change', table: 'member_loads', row: 1, column: 'w1', value: -1 }]);
    expect(out.ok).toBe(true);
    // 1 kip/ft = 4448.2216152605 N / 0.3048 m = 14593.90293720636 N/m (exact definitions of lbf and ft)
    if (out.ok) expect(Math.abs(out.model.memberLoads[0].w1 + 14593.90293720636)).toBeLessThanOrEqual(1e-9 * 14593.9);
  });

  it.each(readdirSync('samples'))('keeps cases, loads and combinations of sample %s when an edit changes nothing', (dir) => {
    const model = sample(dir);
    const view2 = modelTablesView(model, 1, 1);
    const cases = view2.tables.find((t) => t.name === 'cases')!;
    const edits = cases.rows.length ? [{ action: 'change' as const, table: 'cases' as const, row: 1, column: 'title', value: cases.rows[0].cells[2] }] : [];
    if (!edits.length) return;
    const out = applyTableEditsToModel(model, edits);
    if (!out.ok) throw new Error(JSON.stringify(out.problems.slice(0, 3)));
    const strip = <T extends { row?: number }>(xs: T[]) => xs.map(({ row: _row, ...rest }) => rest);
    expect(strip(out.model.cases)).toEqual(strip(model.cases));
    expect(strip(out.model.nodeLoads)).toEqual(strip(model.nodeLoads));
    expect(strip(out.model.memberLoads)).toEqual(strip(model.memberLoads));
    expect(strip(out.model.combinations)).toEqual(strip(model.combinations));
  });
});

describe('model tables store', () => {
  it('loads, refuses to save with a problem, saves edits as one new version', async () => {
    const view = modelTablesView(demo(), 7, 1);
    const calls: { method: string; url: string; body: unknown }[] = [];
    vi.stubGlobal('fetch', vi.fn(async (url: string, init: RequestInit) => {
      const body = init.body ? JSON.parse(String(init.body)) : undefined;
      calls.push({ method: init.method ?? 'GET', url, body });
      if ((init.method ?? 'GET') === 'PATCH') return new Response(JSON.stringify({ id: 7, currentVersion: 2 }), { status: 200 });
      return new Response(JSON.stringify(view), { status: 200 });
    }));
    const store = useModelTablesStore();
    await store.load(7);
    expect(store.view?.tables.length).toBe(11);
    store.change('member_loads', 1, 'w1', 'abc');
    expect(store.problems[0]).toMatchObject({ table: 'member_loads', row: 1, column: 'w1' });
    store.undo();
    store.change('member_loads', 1, 'w1', -7.5);
    expect(store.problems).toEqual([]);
    const saved = await store.save();
    expect(saved?.currentVersion).toBe(2);
    const patch = calls.find((c) => c.method === 'PATCH')!;
    expect(patch.url).toBe('/api/models/7/tables');
    expect(patch.body).toEqual({ baseVersion: 1, edits: [{ action: 'change', table: 'member_loads', row: 1, column: 'w1', value: -7.5 }] });
    expect(store.editCount).toBe(0);
  });
});

describe('model sketch before a run', () => {
  it('draws members, supports by kind and the loads of one case pointing the way they act', () => {
    const view = modelTablesView(demo(), 1, 1);
    const sketch = buildSketch(view.tables, 'D', 'XY', 900, 520);
    expect(sketch.nodes.map((n) => n.id)).toEqual(['N1', 'N2', 'N3']);
    expect(sketch.members).toHaveLength(2);
    // fixture supports: N1 ux, uy (pinned in the plane), N2 and N3 uy only (rollers)
    expect(sketch.supports.map((s) => s.kind)).toEqual(['pinned', 'roller', 'roller']);
    // case D: two uniform loads along −global_y, three arrows each, pointing down the screen
    expect(sketch.arrows).toHaveLength(6);
    expect(sketch.arrows.every((a) => a.dy > 0 && Math.abs(a.dx) < 1e-12)).toBe(true);
    // +x runs to the right in a plane frame (not mirrored)
    expect(sketch.nodes[2].x).toBeGreaterThan(sketch.nodes[0].x);
    expect(buildSketch(view.tables, null, 'XY').arrows).toHaveLength(0);
    // a horizontal member along +x with Y vertical: local x along +x (right), local z = +Y (conventions.md), up the screen
    const [x, , z] = sketch.members[0].axes!;
    expect(x[0]).toBeCloseTo(1, 12);
    expect(z[1]).toBeCloseTo(-1, 12);
  });

  it('projects a plane frame face-on with +x to the right and the vertical axis up', () => {
    expect(project([1, 0, 0], 'XZ', 'Z')).toEqual([1, -0]);
    expect(project([0, 0, 2], 'XZ', 'Z')).toEqual([0, -2]);
    const [, up] = project([0, 0, 1], null, 'Z');
    expect(up).toBeLessThan(0);
  });
});
