/**
 * An unusable header is reported once, with the hint that units go in square brackets, and
 * the problems that would only follow from it are left out (issue 13); messages give lengths
 * in the model's unit system.
 */
import { describe, expect, it } from 'vitest';
import { errors, problems } from './helpers.js';

const EN = 'key,value\ntitle,Header test\ndesign_code,en1993-1-1\n';
const IPE = 'section,shape,d,bf,tf,tw\nC1,i,300,150,10.7,7.1\n';

describe('unusable headers', () => {
  it('reports fy (MPa) once with the square-bracket hint, not "no fy" on the material rows', () => {
    const list = problems({
      settings: EN,
      sections: IPE,
      materials: 'material,E,nu,fy (MPa),density\nSTEEL,210000,0.3,355,7850\nS2,210000,0.3,275,7850\n',
      members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N2,N3,C1,S2\nM3,N3,N4,C1,STEEL\n',
    });
    const onMaterials = list.filter((p) => p.table === 'materials');
    expect(onMaterials).toHaveLength(1);
    expect(onMaterials[0]).toMatchObject({ severity: 'error', row: 1, column: 'fy (MPa)' });
    expect(onMaterials[0].message).toContain('units go in square brackets, as in fy [MPa]');
    expect(list.some((p) => /has no fy/.test(p.message))).toBe(false);
  });

  it('reports a required column written x (m) once, not also as missing', () => {
    const list = errors({ nodes: 'node,x (m),y\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\n' });
    expect(list.map((p) => [p.table, p.row, p.column])).toEqual([['nodes', 1, 'x (m)']]);
    expect(list[0].message).toMatch(/units go in square brackets, as in x \[m\]/);
  });

  it('reports y [kN] once: no coincident nodes nor zero-length members follow from it', () => {
    const list = problems({ nodes: 'node,x,y [kN]\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\n' });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ severity: 'error', table: 'nodes', row: 1, column: 'y' });
    expect(list[0].message).toContain('unit [kN] is not a unit of length');
    expect(list[0].message).toContain('y [m]');
    expect(list[0].message).toContain('square brackets');
  });

  it('leaves out every follow-on problem of a section property with an unknown unit', () => {
    // the custom section's A is unreadable: "custom section C1 needs A" would only repeat it
    const list = errors({ sections: 'section,shape,A [furlong2],I_major,I_minor,J\nC1,custom,5000,8e7,2e7,3e5\n' });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ table: 'sections', row: 1, column: 'A' });
    expect(list[0].message).toContain('unknown unit [furlong2]');
  });

  it('still reports problems of other columns of the same table', () => {
    const list = errors({ nodes: 'node,x,y [kN]\nN1,0,0\nN1,0,4\nN3,6,4\nN4,6,0\n' });
    expect(list.filter((p) => p.table === 'nodes').map((p) => [p.row, p.column, p.message])).toEqual([
      [1, 'y', expect.stringContaining('unit [kN]')],
      [3, 'node', 'node N1 is defined twice (first on row 2)'],
    ]);
  });

  it('leaves out "unknown node" on every row that names a node when the node column itself was unusable', () => {
    const list = errors({ nodes: 'node [m],x,y\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\n' });
    expect(list.map((p) => [p.table, p.row, p.column])).toEqual([['nodes', 1, 'node']]);
    expect(list[0].message).toContain('is not a quantity and takes no unit');
  });

  it('leaves out "unknown case" when the case column was unusable', () => {
    const list = errors({ cases: 'case (id),category,title,self_weight\nD,dead,Dead load,1\nW,wind,Wind,\n' });
    expect(list.map((p) => [p.table, p.column])).toEqual([['cases', 'case (id)']]);
  });

  it('reads a unit in square brackets as before', () => {
    expect(errors({ materials: 'material,E [GPa],nu,fy [MPa],density\nSTEEL,210,0.3,355,7850\n' })).toEqual([]);
  });
});

describe('lengths in messages follow the unit system', () => {
  const US = {
    settings: 'key,value\nunits,us\n',
    nodes: 'node,x,y\nN1,0,0\nN2,0,12\nN3,20,12\nN4,20,0\n',
    materials: 'material,E,nu,fy,density\nSTEEL,29000,0.3,50,490\n',
    member_loads: 'case,member,kind,direction,w1,a,b\nD,M2,uniform,global_y,-1,0,25\nD,M2,point,global_y,-5,21,\n',
  };

  it('gives a load position beyond the member in feet in a US model (20 ft member)', () => {
    const list = errors(US);
    expect(list.map((p) => p.message)).toEqual([
      'b = 25 ft is beyond the end of member M2, whose length is 20 ft',
      'a = 21 ft is beyond the end of member M2, whose length is 20 ft',
    ]);
    expect(list.some((p) => / m\b/.test(p.message))).toBe(false);
  });

  it('gives a result point beyond the member in feet', () => {
    const list = errors({ ...US, member_loads: null, result_points: 'member,x\nM2,30\n' });
    expect(list.map((p) => p.message)).toEqual(['x = 30 ft is beyond the end of member M2, whose length is 20 ft']);
  });

  it('gives it in the metric system in metres', () => {
    const list = errors({ member_loads: 'case,member,kind,direction,w1,a\nD,M2,point,global_y,-5,7.5\n' });
    expect(list.map((p) => p.message)).toEqual(['a = 7.5 m is beyond the end of member M2, whose length is 6 m']);
  });
});
