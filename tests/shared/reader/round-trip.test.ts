/**
 * Model → the importer's tables → model (issue 13 item 2): every sample, read from its
 * workbook and from its CSV folder, comes back identical.
 *
 * "Identical" is deep equality with two stated exceptions and no float tolerance:
 * - `row` (where a record stood in the user's file) is left out: the written workbook has
 *   its own rows (no blank rows, combinations in long form);
 * - `inferred.defaulted` and `inferred.verticalAxisInferred`: the written settings table
 *   states every setting, so the re-read model has none defaulted and the axis given.
 * Numbers are written so that the reader's own conversion gives the SI value back bit for
 * bit where some decimal does (`writtenNumber`). One that the user gave in another unit than
 * the system's (`I_major [cm4]` in a metric model, written back in mm4) may have no decimal
 * that converts back exactly: those come back within a few units in the last place, so
 * numbers compare with |a − b| ≤ 4·ε·max(|a|, |b|) (ε = 2.2e-16, IEEE double), everything
 * else exactly.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCsvFiles, readTables, readWorkbook } from '../../../shared/reader/index.js';
import { asRawTables, modelTables, tableCsv, writtenNumber } from '../../../shared/reader/workbook-writer.js';
import type { Model, Problem } from '../../../shared/model/types.js';
import { model as baseModel } from './helpers.js';
import { comparable, expectSame } from './model-compare.js';

const SAMPLES = join(__dirname, '../../../samples');

const withoutRow = (list: Problem[]) => list.map(({ row: _row, ...p }) => p);

/** Write and read back; the warnings are the ones the original gave (less their rows). */
function reread(m: Model, warnings: Problem[] = []): Model {
  const r = readTables(asRawTables(modelTables(m)));
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.table} ${p.row} ${p.column}: ${p.message}`).join('\n'));
  expect(withoutRow(r.warnings)).toEqual(withoutRow(warnings));
  return r.model;
}

const samples = readdirSync(SAMPLES).filter((d) => !d.startsWith('.'));

describe('model → tables → model', () => {
  it('finds the samples', () => {
    expect(samples.length).toBeGreaterThanOrEqual(5);
  });

  for (const name of samples) {
    it(`gives back the ${name} sample read from its workbook`, async () => {
      const r = await readWorkbook(readFileSync(join(SAMPLES, name, `${name}.xlsx`)), { fileName: name });
      if (!r.ok) throw new Error(JSON.stringify(r.problems));
      expectSame(comparable(reread(r.model, r.warnings)), comparable(r.model));
    });

    it(`gives back the ${name} sample read from its CSV files`, () => {
      const dir = join(SAMPLES, name, 'csv');
      const r = readCsvFiles(readdirSync(dir).map((f) => ({ name: f, text: readFileSync(join(dir, f), 'utf8') })), { fileName: name });
      if (!r.ok) throw new Error(JSON.stringify(r.problems));
      expectSame(comparable(reread(r.model, r.warnings)), comparable(r.model));
    });
  }

  it('writes CSV text that reads back to the same model', () => {
    const m = baseModel();
    const files = modelTables(m).map((t) => ({ name: `${t.name}.csv`, text: tableCsv(t) }));
    const back = readCsvFiles(files);
    if (!back.ok) throw new Error(JSON.stringify(back.problems));
    expect(comparable(back.model)).toEqual(comparable(m));
  });

  it('writes header units of the model unit system and every setting', () => {
    const us = baseModel({
      settings: 'key,value\ntitle,US frame\nunits,us\nstations,21\nanalysis,second_order\nbuckling_modes,2\nmodes,3\nstability_warning,off\n',
      cases: 'case,category,title,self_weight,mass\nD,dead,Dead load,1,yes\nW,wind,Wind,,\n',
    });
    const tables = Object.fromEntries(modelTables(us).map((t) => [t.name, t.rows]));
    expect(tables.nodes[0]).toEqual(['node', 'x [ft]', 'y [ft]', 'z [ft]']);
    expect(tables.materials[0]).toContain('E [ksi]');
    expect(tables.members[0]).toContain('roll [deg]');
    expect(tables.settings).toEqual(expect.arrayContaining([
      ['stations', 21], ['analysis', 'second_order'], ['buckling_modes', 2], ['modes', 3], ['stability_warning', 'off'], ['units', 'us'],
    ]));
    expect(tables.cases[1]).toEqual(['D', 'dead', 'Dead load', 1, 'yes']);
    expectSame(comparable(reread(us)), comparable(us));
  });

  it('keeps sections, net areas, supports with springs, settlements, result points and a generated rule', () => {
    const m = baseModel({
      settings: 'key,value\ntitle,Everything\ndesign_code,en1993-1-1\ncombination_rule,en1990-6.10\n',
      nodes: 'node,x,y,z\nN1,0,0,0\nN2,0,4,0\nN3,6,4,0\nN4,6,0,0\nN5,6,4,5\n',
      supports: 'node,type,ux,rz,k_uy,k_rx\nN1,fixed,,,,\nN4,pinned,,1,,\nN5,,1,,2000,50\n',
      sections: 'section,shape,d,bf,tf,tw,r,t,A,An,U\nI1,i,300,150,10.7,7.1,15,,,4800,0.9\nP1,chs,168.3,,,,,7.1,,,\nC9,custom,,,,,,,2500,,\n',
      members: 'member,start,end,section,material,type,roll,release_end,group,k_major,lb,cb,deflection_limit,Ae\nM1,N1,N2,I1,S355,frame,90,pinned,cols,0.7,0,1.2,250,3000\nM2,N2,N3,IPE300,S355,,,,beams,,,,,\nM3,N3,N4,I1,STEEL,,,,,,,,,\nM4,N3,N5,P1,S355,truss,,,,,,,,\n',
      cases: 'case,category,title,self_weight\nD,dead,Dead load,1\nL,live,Imposed,\nT,temperature,Heat,\n',
      node_loads: 'case,node,fx,fy,mz\nL,N2,10,-3.5,1.25\n',
      member_loads: 'case,member,kind,direction,a,b,w1,w2\nD,M2,uniform,global_y,,,-5,\nL,M2,linear,projected_y,1,4,-2,-6\nL,M2,point,local_z,2.5,,-12,\nL,M1,moment,local_y,1,,3,\nT,M3,temperature,,,,20,\n',
      settlements: 'case,node,uy,rz\nD,N1,-0.01,0.002\n',
      result_points: 'member,x\nM2,1.5\n',
    });
    expectSame(comparable(reread(m)), comparable(m));
  });

  it('keeps a planar model with explicit out-of-plane restraints a space frame', () => {
    // every node in the X–Y plane, but the user restrained uz, rx, ry in their own columns: 3D intent
    const m = baseModel({ supports: 'node,ux,uy,uz,rx,ry,rz\nN1,1,1,1,1,1,1\nN4,1,1,1,0,0,0\n' });
    expect(m.inferred.planeFrame).toBeNull();
    const back = reread(m);
    expect(back.inferred.planeFrame).toBeNull();
    expectSame(comparable(back), comparable(m));
    // the same supports by type are a plane frame, and stay one
    const p = baseModel();
    expect(p.inferred.planeFrame).not.toBeNull();
    expect(Object.fromEntries(modelTables(p).map((t) => [t.name, t.rows])).supports).toEqual([
      ['node', 'type', 'ux', 'uy', 'uz', 'rx', 'ry', 'rz', 'k_ux [kN/m]', 'k_uy [kN/m]', 'k_uz [kN/m]', 'k_rx [kNm/rad]', 'k_ry [kNm/rad]', 'k_rz [kNm/rad]'],
      ['N1', 'fixed', null, null, null, null, null, null, null, null, null, null, null, null],
      ['N4', 'pinned', null, null, null, null, null, null, null, null, null, null, null, null],
    ]);
    expectSame(comparable(reread(p)), comparable(p));
  });

  it('writes combinations out when they are not what the rule generates', () => {
    const m = baseModel();
    m.combinations = [{ id: 'ULS', limitState: 'strength', terms: [{ case: 'D', factor: 1.35 }, { case: 'W', factor: 1.5 }] }];
    const tables = Object.fromEntries(modelTables(m).map((t) => [t.name, t.rows]));
    expect(tables.combinations).toEqual([['combination', 'limit_state', 'case', 'factor'], ['ULS', 'strength', 'D', 1.35], ['ULS', 'strength', 'W', 1.5]]);
    expectSame(comparable(reread(m)), comparable(m));
  });

  it('writes the shortest decimal that converts back bit for bit', () => {
    // 300 mm = 0.3 m; 0.3 / 0.001 is 299.99999999999994 in binary floating point
    expect(writtenNumber(0.3, 0.001)).toBe(300);
    for (const x of [0.3048 * 17.25, 1 / 3, 2.1e11, 1e-7 * 7, 123.456e3]) {
      for (const f of [0.3048, 0.0254 ** 4, 4448.2216152605, 1e-6, 5 / 9]) expect(writtenNumber(x, f) * f).toBe(x);
    }
  });
});
