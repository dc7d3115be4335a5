/**
 * The settings, columns and table added for issues 10 and 11 (../shared/spec/tables.md):
 * stations, analysis, buckling_modes, modes, stability_warning; cases mass; net area An, U,
 * Ae on sections and members; lb = 0; result_points.
 */
import { describe, expect, it } from 'vitest';
import { errors, model, problems } from './helpers.js';

const settings = (rows: string) => ({ settings: `key,value\ntitle,Test frame\n${rows}` });

describe('new settings', () => {
  it('takes the documented defaults when they are absent', () => {
    const s = model().settings;
    expect(s).toMatchObject({ stations: 11, analysis: 'first_order', bucklingModes: 0, modes: 0, stabilityWarning: true });
    expect(model().inferred.defaulted).toEqual(expect.arrayContaining(['stations', 'analysis', 'buckling_modes', 'modes', 'stability_warning']));
  });

  it('reads stations, analysis, buckling_modes, modes and stability_warning', () => {
    const s = model(settings('stations,21\nanalysis,Second Order\nbuckling_modes,3\nmodes,10\nstability_warning,off\n')).settings;
    expect(s).toMatchObject({ stations: 21, analysis: 'second_order', bucklingModes: 3, modes: 10, stabilityWarning: false });
  });

  it('accepts 3 and 201 stations and refuses 2, 202 and 10.5 on the settings row', () => {
    expect(model(settings('stations,3\n')).settings.stations).toBe(3);
    expect(model(settings('stations,201\n')).settings.stations).toBe(201);
    for (const bad of ['2', '202', '10.5', 'many']) {
      const list = errors(settings(`stations,${bad}\n`));
      expect(list).toEqual([expect.objectContaining({ table: 'settings', row: 3, column: 'value' })]);
      expect(list[0].message).toContain('stations must be a whole number from 3 to 201');
    }
  });

  it('bounds buckling_modes and modes to 0–50', () => {
    expect(model(settings('buckling_modes,0\nmodes,50\n')).settings.modes).toBe(50);
    const list = errors(settings('buckling_modes,51\nmodes,-1\n'));
    expect(list.map((p) => [p.row, p.column])).toEqual([[3, 'value'], [4, 'value']]);
    expect(list[0].message).toContain('buckling_modes must be a whole number from 0 to 50');
    expect(list[1].message).toContain('modes must be a whole number from 0 to 50');
  });

  it('refuses an unknown analysis order or stability_warning value', () => {
    const list = errors(settings('analysis,third_order\nstability_warning,maybe\n'));
    expect(list[0]).toMatchObject({ row: 3, message: 'analysis: "third_order" is not one of first_order, second_order' });
    expect(list[1]).toMatchObject({ row: 4, message: 'stability_warning: "maybe" is not one of on, off' });
  });

  it('refuses second_order together with moving loads on the analysis row, naming both', () => {
    const list = errors({
      ...settings('analysis,second_order\n'),
      cases: 'case,category\nD,dead\nV,live\n',
      node_loads: null,
      member_loads: null,
      vehicles: 'vehicle,axle,offset,load\nT,1,0,50\n',
      lanes: 'lane,seq,member\nL1,1,M2\n',
      moving_loads: 'case,vehicle,lane\nV,T,L1\n',
    });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ table: 'settings', row: 3, column: 'value' });
    expect(list[0].message).toMatch(/second_order.*moving loads/);
  });
});

describe('cases mass', () => {
  it('reads yes/no with default no', () => {
    const cs = model({ cases: 'case,category,mass\nD,dead,yes\nW,wind,\n' }).cases;
    expect(cs.map((c) => c.mass)).toEqual([true, false]);
  });

  it('refuses other values naming the row and column', () => {
    expect(errors({ cases: 'case,category,mass\nD,dead,heavy\nW,wind,no\n' })).toEqual([
      expect.objectContaining({ table: 'cases', row: 2, column: 'mass' }),
    ]);
  });
});

describe('tension net area', () => {
  // C1 in the base model is custom with A = 5000 mm2
  it('reads An, U and Ae on sections and members in SI (member values kept on the member)', () => {
    const m = model({
      sections: 'section,shape,A,I_major,I_minor,J,An,U\nC1,custom,5000,8e7,2e7,3e5,4200,0.85\n',
      members: 'member,start,end,section,material,Ae [cm2]\nM1,N1,N2,C1,STEEL,\nM2,N2,N3,C1,STEEL,30\nM3,N3,N4,C1,STEEL,\n',
    });
    // 4200 mm2 = 4.2e-3 m2; 30 cm2 = 3.0e-3 m2 (unit definitions); tolerance 1e-12 relative
    expect(m.sections[0].net!.An).toBeCloseTo(4.2e-3, 12);
    expect(m.sections[0].net!.U).toBe(0.85);
    expect(m.members[0].net).toBeUndefined();
    expect(m.members[1].net!.Ae).toBeCloseTo(3.0e-3, 12);
  });

  it('refuses An or Ae above the gross area, naming table, row and column', () => {
    const list = errors({
      sections: 'section,shape,A,I_major,I_minor,J,An\nC1,custom,5000,8e7,2e7,3e5,5001\n',
      members: 'member,start,end,section,material,Ae\nM1,N1,N2,C1,STEEL,6000\nM2,N2,N3,C1,STEEL,\nM3,N3,N4,C1,STEEL,\n',
    });
    expect(list.map((p) => [p.table, p.row, p.column])).toEqual([['sections', 2, 'An'], ['members', 2, 'Ae']]);
    expect(list[0].message).toBe('section C1: An = 5001 mm2 exceeds the gross area A = 5000 mm2');
  });

  it('checks against a computed gross area of a dimensioned section', () => {
    // rect 100 × 10 mm: A = 1000 mm2 (b·h)
    const list = errors({
      sections: 'section,shape,h,b,An\nR1,rect,100,10,1001\n',
      members: 'member,start,end,section,material\nM1,N1,N2,R1,STEEL\nM2,N2,N3,R1,STEEL\nM3,N3,N4,R1,STEEL\n',
    });
    expect(list).toEqual([expect.objectContaining({ table: 'sections', row: 2, column: 'An' })]);
  });

  it('refuses U outside 0 < U ≤ 1 and U given with Ae', () => {
    const list = errors({
      sections: 'section,shape,A,I_major,I_minor,J,U,Ae\nC1,custom,5000,8e7,2e7,3e5,1.2,\nC2,custom,5000,8e7,2e7,3e5,0,\nC3,custom,5000,8e7,2e7,3e5,0.9,4000\n',
    });
    expect(list.map((p) => [p.row, p.column])).toEqual([[2, 'U'], [3, 'U'], [4, 'Ae']]);
    expect(list[0].message).toBe('U must be at most 1 (got 1.2)');
    expect(list[2].message).toContain('either U');
  });
});

describe('lb = 0', () => {
  it('is read as continuously braced while l_major = 0 stays an error', () => {
    const m = model({ members: 'member,start,end,section,material,lb\nM1,N1,N2,C1,STEEL,0\nM2,N2,N3,C1,STEEL,\nM3,N3,N4,C1,STEEL,\n' });
    expect(m.members[0].lb).toBe(0);
    const list = errors({ members: 'member,start,end,section,material,l_major,l_minor\nM1,N1,N2,C1,STEEL,0,0\nM2,N2,N3,C1,STEEL,,\nM3,N3,N4,C1,STEEL,,\n' });
    expect(list.map((p) => [p.row, p.column])).toEqual([[2, 'l_major'], [2, 'l_minor']]);
  });
});

describe('result_points', () => {
  it('reads member and x in the length unit', () => {
    // M2 runs N2 (0,4) → N3 (6,4): L = 6 m
    const m = model({ result_points: 'member,x [mm]\nM2,1000\nM2,6000\nM1,0\n' });
    expect(m.resultPoints).toEqual([
      { member: 'M2', x: 1, row: 2 },
      { member: 'M2', x: 6, row: 3 },
      { member: 'M1', x: 0, row: 4 },
    ]);
  });

  it('reports an unknown member and an x beyond the member, naming row and column', () => {
    const list = errors({ result_points: 'member,x\nM9,1\nM2,6.5\nM2,-1\nM2,\n' });
    expect(list.map((p) => [p.table, p.row, p.column])).toEqual([
      ['result_points', 2, 'member'], ['result_points', 3, 'x'], ['result_points', 4, 'x'], ['result_points', 5, 'x'],
    ]);
    expect(list[0].message).toBe('unknown member M9');
    expect(list[1].message).toBe('x = 6.5 m is beyond the end of member M2, whose length is 6 m');
  });

  it('warns about an unknown column', () => {
    expect(problems({ result_points: 'member,x,note\nM2,1,here\n' })).toEqual([
      expect.objectContaining({ severity: 'warning', table: 'result_points', column: 'note' }),
    ]);
  });
});
