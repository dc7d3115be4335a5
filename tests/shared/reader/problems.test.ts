import { describe, expect, it } from 'vitest';
import { readTables } from '../../../shared/reader/index.js';
import { errors, problems, read } from './helpers.js';

/** Finds the one problem at table/row/column; fails the test when it is not there. */
function at(list: ReturnType<typeof problems>, table: string, row: number | undefined, column: string | undefined) {
  const hit = list.filter((p) => p.table === table && p.row === row && p.column === column);
  expect(hit, `expected a problem at ${table} ${row} ${column}, got ${JSON.stringify(list)}`).toHaveLength(1);
  return hit[0];
}

describe('reader problems name table, row and column', () => {
  it('reads the base model without problems', () => {
    const r = read();
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.warnings).toEqual([]);
    expect(r.counts).toMatchObject({ nodes: 4, members: 3, supports: 2, cases: 2, node_loads: 1, member_loads: 1, settings: 1 });
  });

  it('reports a duplicate node id on the second row', () => {
    const p = at(errors({ nodes: 'node,x,y\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\nN2,9,9\n' }), 'nodes', 6, 'node');
    expect(p.message).toMatch(/N2.*twice.*row 3/);
  });

  it('reports duplicate member, section, material and case ids', () => {
    const list = errors({
      members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N2,N3,C1,STEEL\nM3,N3,N4,C1,STEEL\nM1,N1,N3,C1,STEEL\n',
      sections: 'section,shape,A,I_major,I_minor,J\nC1,custom,5000,8e7,2e7,3e5\nC1,custom,1,1,1,1\n',
      materials: 'material,E,fy\nSTEEL,210000,355\nSTEEL,200000,235\n',
      cases: 'case,category\nD,dead\nW,wind\nD,live\n',
    });
    at(list, 'members', 5, 'member');
    at(list, 'sections', 3, 'section');
    at(list, 'materials', 3, 'material');
    at(list, 'cases', 4, 'case');
  });

  it('reports the row and column of a missing node', () => {
    const p = at(errors({ members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N2,N9,C1,STEEL\nM3,N3,N4,C1,STEEL\n' }), 'members', 3, 'end');
    expect(p.message).toContain('unknown node N9');
  });

  it('reports unknown section, material, case and member references', () => {
    const list = errors({
      members: 'member,start,end,section,material\nM1,N1,N2,NOPE,STEEL\nM2,N2,N3,C1,UNOBTAINIUM\nM3,N3,N4,C1,STEEL\n',
      node_loads: 'case,node,fx\nX,N2,1\n',
      member_loads: 'case,member,kind,direction,w1\nD,M7,uniform,global_y,-5\n',
    });
    expect(at(list, 'members', 2, 'section').message).toContain('unknown section NOPE');
    expect(at(list, 'members', 3, 'material').message).toContain('unknown material UNOBTAINIUM');
    expect(at(list, 'node_loads', 2, 'case').message).toContain('unknown case X');
    expect(at(list, 'member_loads', 2, 'member').message).toContain('unknown member M7');
  });

  it('reports a zero-length member and warns about coincident nodes', () => {
    const list = problems({
      nodes: 'node,x,y\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\nN5,6,4\n',
      members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N2,N3,C1,STEEL\nM3,N3,N4,C1,STEEL\nM4,N3,N5,C1,STEEL\n',
    });
    expect(at(list, 'members', 5, 'end').severity).toBe('error');
    const w = at(list, 'nodes', 6, 'node');
    expect(w.severity).toBe('warning');
    expect(w.message).toContain('N3');
  });

  it('reports non-numeric and negative values', () => {
    const list = errors({
      nodes: 'node,x,y\nN1,0,0\nN2,zero,4\nN3,6,4\nN4,6,0\n',
      materials: 'material,E,fy\nSTEEL,-210000,355\n',
      sections: 'section,shape,A,I_major,I_minor,J\nC1,custom,5000,-8e7,2e7,3e5\n',
    });
    expect(at(list, 'nodes', 3, 'x').message).toContain('"zero" is not a number');
    expect(at(list, 'materials', 2, 'E').message).toContain('greater than zero');
    expect(at(list, 'sections', 2, 'I_major').message).toContain('zero or more');
  });

  it('reports negative and impossible section dimensions through the section validator', () => {
    const list = errors({ sections: 'section,shape,h,b,t\nC1,rhs,200,-100,8\n' });
    expect(at(list, 'sections', 2, 'b').message).toContain('C1');
  });

  it('reports an unknown unit and a unit of the wrong dimension naming the column', () => {
    const list = errors({ nodes: 'node,x [furlong],y [kN]\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\n' });
    expect(at(list, 'nodes', 1, 'x').message).toContain('unknown unit [furlong]');
    expect(at(list, 'nodes', 1, 'y').message).toMatch(/not a unit of length/);
  });

  it('reports an unknown enum value listing the allowed ones', () => {
    const p = at(errors({ members: 'member,start,end,section,material,release_end\nM1,N1,N2,C1,STEEL,hinged\nM2,N2,N3,C1,STEEL,\nM3,N3,N4,C1,STEEL,\n' }), 'members', 2, 'release_end');
    expect(p.message).toBe('"hinged" is not one of fixed, pinned, pinned_major, pinned_minor');
  });

  it('reports a missing required column on the header row', () => {
    const p = at(errors({ members: 'member,start,section,material\nM1,N1,C1,STEEL\n' }), 'members', 1, 'end');
    expect(p.message).toContain('required column end is missing');
  });

  it('warns about unknown tables and columns without failing', () => {
    const r = read({ colours: 'member,colour\nM1,red\n', nodes: 'node,x,y,colour\nN1,0,0,red\nN2,0,4,\nN3,6,4,\nN4,6,0,\n' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.warnings.find((p) => p.table === 'colours')?.message).toContain('unknown table');
    expect(at(r.warnings, 'nodes', 1, 'colour').message).toContain('unknown column');
  });

  it('refuses a material without fy when a design code is set', () => {
    const list = errors({
      settings: 'key,value\ndesign_code,en1993-1-1\n',
      materials: 'material,E\nSTEEL,210000\n',
      sections: 'section,shape,d,bf,tf,tw\nC1,i,300,150,10.7,7.1\n',
    });
    expect(at(list, 'materials', 2, 'fy').message).toContain('en1993-1-1');
  });

  it('refuses a design code that none of the model\'s shapes can use, naming the first member row', () => {
    const list = errors({ settings: 'key,value\ndesign_code,aisc360-lrfd\n' });
    expect(list).toHaveLength(1);
    expect(at(list, 'members', 2, 'section').message).toContain('custom');
  });

  it('warns about a custom section among checkable ones under a design code', () => {
    const r = read({
      settings: 'key,value\ndesign_code,en1993-1-1\n',
      sections: 'section,shape,A,I_major,I_minor,J\nC1,custom,5000,8e7,2e7,3e5\n',
      members: 'member,start,end,section,material\nM1,N1,N2,IPE300,STEEL\nM2,N2,N3,C1,STEEL\nM3,N3,N4,IPE300,STEEL\n',
    });
    expect(r.ok).toBe(true);
    if (r.ok) expect(at(r.warnings, 'members', 3, 'section').message).toContain('not checked');
  });

  it('refuses a combination sharing its id with a case', () => {
    const p = at(errors({ combinations: 'combination,case,factor\nD,D,1.35\n' }), 'combinations', 2, 'combination');
    expect(p.message).toContain('same id as a case');
  });

  it('refuses a member load beyond the member end and a linear load without w2', () => {
    const list = errors({ member_loads: 'case,member,kind,direction,a,b,w1,w2\nD,M2,uniform,global_y,0,7,-5,\nD,M2,linear,global_y,0,3,-5,\n' });
    expect(at(list, 'member_loads', 2, 'b').message).toContain('beyond the end');
    at(list, 'member_loads', 3, 'w2');
  });

  it('refuses a bracketed unit on w1', () => {
    at(errors({ member_loads: 'case,member,kind,direction,w1 [kN/m]\nD,M2,uniform,global_y,-5\n' }), 'member_loads', 1, 'w1');
  });

  it('refuses a settlement on a free freedom', () => {
    const p = at(errors({ settlements: 'case,node,uy,rz\nD,N4,-10,0.001\n' }), 'settlements', 2, 'rz');
    expect(p.message).toContain('not restrained in rz');
  });

  it('refuses a tapered member whose end section has another shape', () => {
    const list = errors({
      sections: 'section,shape,A,I_major,I_minor,J,h,b,t\nC1,custom,5000,8e7,2e7,3e5,,,\nR1,rhs,,,,,200,100,8\n',
      members: 'member,start,end,section,material,section_end\nM1,N1,N2,C1,STEEL,R1\nM2,N2,N3,C1,STEEL,\nM3,N3,N4,C1,STEEL,\n',
    });
    expect(list.some((p) => p.table === 'members' && p.row === 2 && p.column === 'section_end')).toBe(true);
  });

  it('counts CSV lines as the user sees them, blank lines included', () => {
    const p = at(errors({ nodes: 'node,x,y\nN1,0,0\n\nN2,0,4\n,,\nN3,6,4\nN4,6,oops\n' }), 'nodes', 7, 'y');
    expect(p.message).toContain('oops');
  });

  it('collects every problem instead of stopping at the first', () => {
    const list = errors({
      nodes: 'node,x,y\nN1,0,0\nN2,a,4\nN3,6,b\nN4,6,0\n',
      members: 'member,start,end,section,material\nM1,N1,N2,C9,STEEL\nM2,N2,N3,C1,S9\nM3,N3,N8,C1,STEEL\n',
    });
    expect(list.length).toBeGreaterThanOrEqual(5);
  });

  it('never throws on malformed input', () => {
    const junk = [
      { name: 'nodes', rows: [[null], [1, 2, 3], ['node'], [{} as unknown as string]], source: 'csv' as const },
      { name: 'members', rows: [], source: 'csv' as const },
      { name: '', rows: [[undefined, undefined]], source: 'xlsx' as const },
      { name: 'settings', rows: [['key', 'value'], ['units', 42], [null, 'x']], source: 'csv' as const },
      { name: 'combinations', rows: [['combination', 'D'], ['C1', 'x']], source: 'csv' as const },
    ];
    const r = readTables(junk);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems.length).toBeGreaterThan(0);
  });
});
