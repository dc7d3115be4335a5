/**
 * The stability issue's acceptance, from the tables a user imports: a sway portal frame read
 * with `analysis = second_order` has larger column moments than first order by the closed
 * form's amplification, and a first-order run of the same frame under EN 1993-1-1 warns by
 * combination. Demo frame of our own: fixed bases, 6 m × 4 m, a beam far stiffer than the
 * columns, 2,500 kN down each column and 40 kN sideways at the beam.
 */
import { describe, expect, it } from 'vitest';
import { readCsvFiles } from '../../../shared/reader/index.js';
import { analyseModel } from '../../../shared/stability/index.js';
import type { Model } from '../../../shared/model/types.js';

function read(settings: string): Model {
  const files: Record<string, string> = {
    'settings.csv': `key,value\nunits,metric\nvertical_axis,Y\n${settings}`,
    'sections.csv': 'section,shape,A [cm2],I_major [cm4],I_minor [cm4],J [cm4]\nRIGID,custom,500,5696000,100000,1000\n',
    'nodes.csv': 'node,x,y\nA,0,0\nB,0,4\nC,6,4\nD,6,0\n',
    'supports.csv': 'node,type\nA,fixed\nD,fixed\n',
    'members.csv': 'member,start,end,section,material\nC1,A,B,HEB200,S355\nBM,B,C,RIGID,S355\nC2,D,C,HEB200,S355\n',
    'cases.csv': 'case,category\nG,dead\nW,wind\n',
    'node_loads.csv': 'case,node,fx,fy\nG,B,,-2500\nG,C,,-2500\nW,B,40,\n',
    'combinations.csv': 'combination,case,factor,limit_state\nULS-1,G,1,strength\nULS-1,W,1,strength\n',
  };
  const r = readCsvFiles(Object.entries(files).map(([name, text]) => ({ name, text })));
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.model;
}

const columnEndMoment = (order: string): number => {
  const { analysis } = analyseModel(read(`design_code,none\nanalysis,${order}\n`));
  const l = analysis.loadings.findIndex((x) => x.id === 'ULS-1');
  const f = analysis.memberForces(analysis.memberIds.indexOf('C1'), l);
  return Math.abs(f.M_major[0]);
};

describe('sway portal frame from its tables', () => {
  it('second order amplifies the column moments by tan(u)/u (fixed–guided column, Timoshenko & Gere)', () => {
    // Each column: fixed at the base, rotation held at the top by the stiff beam, free to sway:
    // by antisymmetry two cantilevers of l = h/2 with tip shear H' = 20 kN and axial P:
    // M_end = H'·tan(k l)/k (Timoshenko & Gere, Theory of Elastic Stability, beam-column with
    // a lateral end load), first order H'·l, so the amplification is tan(u)/u, u = k·h/2,
    // k = √(P/EI). HEB200: I_y = 5696 cm4 (catalogue), E = 210 GPa (S355 built-in).
    const EI = 210e9 * 5696e-8, P = 2500e3, h = 4;
    const u = (h / 2) * Math.sqrt(P / EI);
    const expected = Math.tan(u) / u;
    const m1 = columnEndMoment('first_order');
    const m2 = columnEndMoment('second_order');
    // first order: H'·h/2 = 20 kN × 2 m (the beam is 1000× stiffer than the columns: 0.3% tolerance)
    expect(Math.abs(m1 - 40e3) / 40e3).toBeLessThan(3e-3);
    // amplification within 0.5 %
    expect(Math.abs(m2 / m1 - expected) / expected).toBeLessThan(5e-3);
    expect(m2 / m1).toBeGreaterThan(1.05);
  });

  it('a first-order run under EN 1993-1-1 warns by combination (αcr < 10, 5.2.1(3))', () => {
    // αcr ≈ Pcr/P with Pcr = π²EI/h² for the fixed–guided column (K = 1): 7,378 kN / 2,500 kN ≈ 2.95
    const { stability } = analyseModel(read('design_code,en1993-1-1\nanalysis,first_order\n'));
    expect(stability.warnings.map((w) => w.loading)).toEqual(['ULS-1']);
    const w = stability.warnings[0];
    const EI = 210e9 * 5696e-8, h = 4;
    const alphaBound = (Math.PI ** 2 * EI) / h ** 2 / 2500e3;
    expect(w.alphaCr).toBeLessThan(10);
    expect(Math.abs(w.alphaCr - alphaBound) / alphaBound).toBeLessThan(0.01);
    expect(w.message).toContain('ULS-1');
    expect(w.message).toContain('second_order');
  });
});
