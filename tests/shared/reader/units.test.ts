import { describe, expect, it } from 'vitest';
import { model } from './helpers.js';

// tolerance: |a − b| ≤ 1e-12 · max(1, |a|, |b|) — the conversions are exact products of defined factors
const close = (a: number, b: number, rtol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rtol * Math.max(1, Math.abs(a), Math.abs(b)));

// 1 ft = 0.3048 m and 1 in = 0.0254 m exactly (International Yard and Pound Agreement, 1959);
// 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N, so 1 kip = 4448.2216152605 N
// (definitions of the pound and of standard gravity, NIST SP 811 Appendix B).
const FT = 0.3048;
const IN = 0.0254;
const KIP = 4448.2216152605;

describe('header units and unit systems', () => {
  it('converts unbracketed coordinates in the us system from feet', () => {
    const m = model({ settings: 'key,value\nunits,us\n' });
    close(m.nodes.find((n) => n.id === 'N3')!.x, 6 * FT);
    close(m.nodes.find((n) => n.id === 'N2')!.y, 4 * FT);
  });

  it('converts bracketed units whatever the unit system', () => {
    const m = model({
      settings: 'key,value\nunits,us\n',
      nodes: 'node,x [mm],y [cm]\nN1,0,0\nN2,0,400\nN3,6000,400\nN4,6000,0\n',
      materials: 'material,E [GPa],fy [MPa],density [kg/m3],alpha [1/C]\nSTEEL,210,355,7850,1.2e-5\n',
    });
    close(m.nodes.find((n) => n.id === 'N3')!.x, 6);
    close(m.nodes.find((n) => n.id === 'N2')!.y, 4);
    close(m.materials[0].E, 210e9);
    close(m.materials[0].fy!, 355e6);
  });

  it('reads kip, kip-ft, kip/ft and ksi against the definition of the pound-force', () => {
    const m = model({
      settings: 'key,value\nunits,us\n',
      materials: 'material,E,fy\nSTEEL,29000,50\n',
      node_loads: 'case,node,fx,mz\nW,N2,10,5\n',
      member_loads: 'case,member,kind,direction,w1\nD,M2,uniform,global_y,-2\n',
    });
    close(m.nodeLoads[0].values[0], 10 * KIP);
    close(m.nodeLoads[0].values[5], 5 * KIP * FT);
    close(m.memberLoads[0].w1, (-2 * KIP) / FT);
    close(m.materials[0].E, (29000 * KIP) / IN ** 2);
    close(m.materials[0].fy!, (50 * KIP) / IN ** 2);
  });

  it('reads section properties in the metric defaults (mm2, mm4) and bracketed cm units', () => {
    const m = model({ sections: 'section,shape,A [cm2],I_major,I_minor [cm4],J\nC1,custom,50,8e7,2000,3e5\n' });
    const s = m.sections[0];
    close(s.props.A, 50e-4);
    close(s.props.I_major, 8e7 * 1e-12);
    close(s.props.I_minor, 2000e-8);
    expect(s.given).toEqual(['A', 'I_major', 'I_minor', 'J']);
  });

  it('reads member load magnitudes by kind: moment, temperature change in F', () => {
    const m = model({
      settings: 'key,value\nunits,us\n',
      member_loads: 'case,member,kind,direction,a,w1\nD,M2,moment,global_z,3,4\nD,M2,temperature,,,9\n',
    });
    close(m.memberLoads[0].w1, 4 * KIP * FT);
    close(m.memberLoads[0].a, 3 * FT);
    close(m.memberLoads[0].b, 3 * FT); // a concentrated load acts at a
    // a change of 9 °F is a change of 5 K (1 °F = 5/9 K, ISO 80000-5)
    close(m.memberLoads[1].w1, 5);
  });

  it('reads springs in kN/m and kNm/rad, roll in degrees', () => {
    const m = model({
      supports: 'node,type,k_uy [kN/mm],k_rz\nN1,pinned,,200\nN4,,5,\n',
      members: 'member,start,end,section,material,roll\nM1,N1,N2,C1,STEEL,90\nM2,N2,N3,C1,STEEL,\nM3,N3,N4,C1,STEEL,\n',
    });
    close(m.supports[0].springs[5], 200e3);
    close(m.supports[1].springs[1], 5e6);
    close(m.members[0].roll, Math.PI / 2);
  });

  it('defaults member load positions: a = 0 and b = the member length', () => {
    const m = model();
    expect(m.memberLoads[0].a).toBe(0);
    close(m.memberLoads[0].b, 6);
  });

  it('reads text ids 12 and 12.0 as the same id, and a decimal comma in semicolon CSV', () => {
    const m = model({
      nodes: 'node;x;y\n12;0;0\nN2;0;4,5\nN3;6;4,5\nN4;6;0\n',
      supports: 'node,type\n12.0,fixed\nN4,pinned\n',
      members: 'member,start,end,section,material\nM1,12.0,N2,C1,STEEL\nM2,N2,N3,C1,STEEL\nM3,N3,N4,C1,STEEL\n',
    });
    expect(m.nodes[0].id).toBe('12');
    expect(m.supports[0].node).toBe('12');
    expect(m.members[0].start).toBe('12');
    close(m.nodes[1].y, 4.5);
  });

  it('matches table and column names regardless of case, spaces, dashes and underscores', () => {
    const m = model({
      member_loads: null,
      'Member Loads': 'CASE, Member ,KIND,Direction,W1\nD,M2,Uniform,Global-Y,-5\n',
      members: 'member,start,end,section,material,Release-End\nM1,N1,N2,C1,STEEL,pinned major\nM2,N2,N3,C1,STEEL,\nM3,N3,N4,C1,STEEL,\n',
    });
    expect(m.memberLoads[0].direction).toBe('global_y');
    expect(m.members[0].releaseEnd).toBe('pinned_major');
  });

  it('derives G from E and nu (default 0.3) when G is not given', () => {
    const m = model({ materials: 'material,E,fy\nSTEEL,210000,355\n' });
    // G = E / (2(1 + ν)) — isotropic elasticity, tables.md "materials"
    close(m.materials[0].G, 210e9 / 2.6);
    expect(m.materials[0].nu).toBe(0.3);
  });
});
