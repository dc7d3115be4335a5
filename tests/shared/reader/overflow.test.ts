/**
 * Numbers that are not numbers (issue 11 item 6): a value that overflows on parsing (`1e309`)
 * or in unit conversion (`1e308 ksi` → Pa) is an error naming table, row and column — never
 * stored as empty, never read as zero. CSV and XLSX paths.
 */
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { readWorkbook } from '../../../shared/reader/index.js';
import { BASE, errors } from './helpers.js';

describe('overflowing numbers (CSV)', () => {
  it('refuses 1e309 in a number column', () => {
    expect(errors({ nodes: 'node,x,y\nN1,0,0\nN2,0,1e309\nN3,6,4\nN4,6,0\n' })).toEqual([
      { severity: 'error', table: 'nodes', row: 3, column: 'y', message: '"1e309" is too large to be a number (overflows)' },
    ]);
  });

  it('refuses a value that overflows in unit conversion (1e308 ksi)', () => {
    const list = errors({ materials: 'material,E,nu,fy [ksi],density,alpha\nSTEEL,210000,0.3,1e308,7850,0.000012\n' });
    expect(list).toEqual([expect.objectContaining({ table: 'materials', row: 2, column: 'fy' })]);
    expect(list[0].message).toContain('overflows when converted to SI');
  });

  it('refuses w1 of a member load that overflows with its kind unit (1e308 kN/m)', () => {
    const list = errors({ member_loads: 'case,member,kind,direction,w1\nD,M2,uniform,global_y,-1e308\n' });
    expect(list).toEqual([expect.objectContaining({ table: 'member_loads', row: 2, column: 'w1' })]);
  });

  it('refuses w2 of a linear load that overflows', () => {
    const list = errors({ member_loads: 'case,member,kind,direction,w1,w2\nD,M2,linear,global_y,0,1e308\n' });
    expect(list).toEqual([expect.objectContaining({ table: 'member_loads', row: 2, column: 'w2' })]);
  });

  it('refuses an overflowing setting, combination factor and vehicle load', () => {
    expect(errors({ settings: 'key,value\ndeflection_limit,1e400\n' })).toEqual([
      expect.objectContaining({ table: 'settings', row: 2, column: 'value' }),
    ]);
    expect(errors({ combinations: 'combination,D,W\nC1,1e309,1\n' })).toEqual([
      expect.objectContaining({ table: 'combinations', row: 2, column: 'D' }),
    ]);
    const moving = errors({
      cases: 'case,category\nD,dead\nV,live\n', node_loads: null, member_loads: null,
      vehicles: 'vehicle,axle,offset,load\nT,1,0,1e308\n',
      lanes: 'lane,seq,member\nL1,1,M2\n',
      moving_loads: 'case,vehicle,lane\nV,T,L1\n',
    });
    expect(moving[0]).toMatchObject({ table: 'vehicles', row: 2, column: 'load' });
  });

  it('refuses section dimensions whose properties overflow', () => {
    // rect h = b = 1e100 mm = 1e97 m: I = b·h³/12 ≈ 1e388/12 m4 overflows double precision (max ≈ 1.8e308)
    const list = errors({
      sections: 'section,shape,h,b\nR1,rect,1e100,1e100\n',
      members: 'member,start,end,section,material\nM1,N1,N2,R1,STEEL\nM2,N2,N3,R1,STEEL\nM3,N3,N4,R1,STEEL\n',
    });
    expect(list[0]).toMatchObject({ table: 'sections', row: 2 });
    expect(list[0].message).toContain('overflows');
  });
});

/** The BASE CSV tables written as an XLSX workbook; `cells` sets sheet cells after. */
async function workbook(cells: Record<string, Record<string, ExcelJS.CellValue>>): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  for (const [name, text] of Object.entries(BASE)) {
    const ws = wb.addWorksheet(name);
    for (const line of text.trim().split('\n')) {
      ws.addRow(line.split(',').map((c) => (c !== '' && !Number.isNaN(Number(c)) ? Number(c) : c === '' ? null : c)));
    }
  }
  for (const [sheet, set] of Object.entries(cells)) {
    for (const [addr, value] of Object.entries(set)) wb.getWorksheet(sheet)!.getCell(addr).value = value;
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}

describe('overflowing numbers (XLSX)', () => {
  it('refuses text 1e309 in a number column', async () => {
    const r = await readWorkbook(await workbook({ nodes: { C3: '1e309' } }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toEqual([expect.objectContaining({ table: 'nodes', row: 3, column: 'y' })]);
  });

  it('refuses a number cell of 1e308 under a ksi header', async () => {
    const r = await readWorkbook(await workbook({ materials: { D1: 'fy [ksi]', D2: 1e308 } }));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems).toEqual([expect.objectContaining({ table: 'materials', row: 2, column: 'fy' })]);
      expect(r.problems[0].message).toContain('overflows');
    }
  });
});
