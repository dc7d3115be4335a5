import { readCsvFiles } from '../../../shared/reader/index.js';
import type { Model, Problem, ReadResult } from '../../../shared/model/types.js';

/** A small valid plane model as CSV texts, table name → text; tests override tables. */
export const BASE: Record<string, string> = {
  settings: 'key,value\ntitle,Test frame\n',
  nodes: 'node,x,y\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\n',
  supports: 'node,type\nN1,fixed\nN4,pinned\n',
  materials: 'material,E,nu,fy,density,alpha\nSTEEL,210000,0.3,355,7850,0.000012\n',
  sections: 'section,shape,A,I_major,I_minor,J\nC1,custom,5000,8e7,2e7,3e5\n',
  members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N2,N3,C1,STEEL\nM3,N3,N4,C1,STEEL\n',
  cases: 'case,category,title,self_weight\nD,dead,Dead load,1\nW,wind,Wind,\n',
  node_loads: 'case,node,fx,fy\nW,N2,10,0\n',
  member_loads: 'case,member,kind,direction,w1\nD,M2,uniform,global_y,-5\n',
};

export function read(overrides: Record<string, string | null> = {}): ReadResult {
  const tables = { ...BASE, ...overrides };
  return readCsvFiles(
    Object.entries(tables)
      .filter(([, t]) => t !== null)
      .map(([name, text]) => ({ name: `${name}.csv`, text: text as string })),
  );
}

export function model(overrides: Record<string, string | null> = {}): Model {
  const r = read(overrides);
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.table} ${p.row} ${p.column}: ${p.message}`).join('\n'));
  return r.model;
}

export function problems(overrides: Record<string, string | null> = {}): Problem[] {
  const r = read(overrides);
  return r.ok ? r.warnings : r.problems;
}

export function errors(overrides: Record<string, string | null> = {}): Problem[] {
  return problems(overrides).filter((p) => p.severity === 'error');
}
