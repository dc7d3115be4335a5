import { describe, expect, it } from 'vitest';
import { errors, model, problems } from './helpers.js';

const DECK = {
  nodes: 'node,x,y\nN1,0,0\nN2,4,0\nN3,8,0\nN4,12,0\n',
  supports: 'node,type,ux\nN1,pinned,\nN4,pinned,0\n',
  members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N3,N2,C1,STEEL\nM3,N3,N4,C1,STEEL\n',
  node_loads: null,
  member_loads: null,
  cases: 'case,category\nD,dead\nV,live\n',
};

describe('moving-load tables (issue 7 import contract)', () => {
  it('reads vehicles, lanes and moving loads in SI with defaults', () => {
    const m = model({
      ...DECK,
      vehicles: 'vehicle,axle,offset,load\nTRUCK,1,0,50\nTRUCK,2,3.5,80\n',
      lanes: 'lane,seq,member\nL1,1,M1\nL1,2,M2\nL1,3,M3\n',
      moving_loads: 'case,vehicle,lane,step\nV,TRUCK,L1,\n',
    });
    expect(m.vehicles).toEqual([
      { vehicle: 'TRUCK', axle: '1', offset: 0, load: 50e3, row: 2 },
      { vehicle: 'TRUCK', axle: '2', offset: 3.5, load: 80e3, row: 3 },
    ]);
    expect(m.lanes.map((l) => l.member)).toEqual(['M1', 'M2', 'M3']);
    expect(m.movingLoads).toEqual([{ case: 'V', vehicle: 'TRUCK', lane: 'L1', step: undefined, direction: 'both', row: 2 }]);
  });

  it('reports lane members that do not connect, naming the row', () => {
    const list = errors({ ...DECK, lanes: 'lane,seq,member\nL1,1,M1\nL1,2,M3\n' });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ table: 'lanes', row: 3, column: 'member' });
  });

  it('reports unknown vehicles, lanes, cases and a negative offset', () => {
    const list = errors({
      ...DECK,
      vehicles: 'vehicle,axle,offset,load\nTRUCK,1,-1,50\n',
      lanes: 'lane,seq,member\nL1,1,M1\n',
      moving_loads: 'case,vehicle,lane,direction\nX,CAR,L9,sideways\n',
    });
    const at = (t: string, r: number, c: string) => list.find((p) => p.table === t && p.row === r && p.column === c);
    expect(at('vehicles', 2, 'offset')).toBeDefined();
    expect(at('moving_loads', 2, 'case')?.message).toContain('unknown case X');
    expect(at('moving_loads', 2, 'direction')?.message).toContain('forward, backward, both');
  });
});

describe('settlements and springs', () => {
  it('reads prescribed displacements of restrained freedoms, blank = not prescribed', () => {
    const m = model({ settlements: 'case,node,uy [mm],rz\nD,N4,-12,\n' });
    expect(m.settlements[0].values).toEqual([null, -0.012, null, null, null, null]);
  });

  it('warns about a spring on a restrained freedom', () => {
    const list = problems({ supports: 'node,type,k_uy\nN1,fixed,100\nN4,pinned,\n' });
    expect(list.find((p) => p.table === 'supports' && p.row === 2 && p.column === 'k_uy')?.severity).toBe('warning');
  });

  it('reports problems in table order, then by row', () => {
    const list = errors({
      members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N2,N3,C1,STEEL\nM3,N3,N9,C1,STEEL\n',
      nodes: 'node,x,y\nN1,0,0\nN2,0,x\nN3,6,4\nN4,6,0\n',
      settings: 'key,value\nunits,imperial\n',
    });
    expect(list.map((p) => p.table)).toEqual(['settings', 'nodes', 'members']);
  });
});
