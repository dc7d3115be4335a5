import { describe, expect, it } from 'vitest';
import { errors } from '../reader/helpers.js';

describe('moving-load tables: lanes the engine cannot drive on', () => {
  it('reports a tapered lane member with its lanes row and the member column', () => {
    const list = errors({
      nodes: 'node,x,y\nN1,0,0\nN2,4,0\nN3,8,0\n',
      supports: 'node,type,ux\nN1,pinned,\nN3,pinned,0\n',
      sections: 'section,shape,A,I_major,I_minor,J\nC1,custom,5000,8e7,2e7,3e5\nC2,custom,6000,9e7,2e7,3e5\n',
      members: 'member,start,end,section,material,section_end\nM1,N1,N2,C1,STEEL,\nM2,N2,N3,C1,STEEL,C2\n',
      node_loads: null,
      member_loads: null,
      cases: 'case,category\nV,live\n',
      vehicles: 'vehicle,axle,offset,load\nTRUCK,1,0,50\n',
      lanes: 'lane,seq,member\nL1,1,M1\nL1,2,M2\n',
      moving_loads: 'case,vehicle,lane\nV,TRUCK,L1\n',
    });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ table: 'lanes', row: 3, column: 'member' });
    expect(list[0].message).toContain('tapered');
  });
});
