import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { ModelBuilder, nodeIndexOf } from './builders.js';

// Two-panel Warren truss in the XZ plane: bottom A(0,0) B(3,0) C(6,0), top D(1.5,2) E(4.5,2).
// Diagonals 2.5 m long: sin θ = 0.8, cos θ = 0.6. Load P down at B.
function warren(E: number) {
  const b = new ModelBuilder({ planeNormal: 'Y' }).material('mat', { E })
    .node('A', 0, 0, 0).node('B', 3, 0, 0).node('C', 6, 0, 0).node('D', 1.5, 0, 2).node('E', 4.5, 0, 2)
    .support('A', 'ux uz').support('C', 'uz');
  for (const [id, s, e] of [['AB', 'A', 'B'], ['BC', 'B', 'C'], ['DE', 'D', 'E'], ['AD', 'A', 'D'], ['DB', 'D', 'B'], ['BE', 'B', 'E'], ['EC', 'E', 'C']]) {
    b.member(id, s, e, { type: 'truss', material: 'mat' });
  }
  return b.loadCase('P').nodeLoad('P', 'B', { fz: -100e3 }).build();
}

describe('trusses', () => {
  it('determinate Warren truss: member forces by the method of joints', () => {
    const P = 100e3;
    const m = warren(200e9);
    const r = analyse(m);
    const N = (id: string) => r.memberForces(m.members.findIndex((x) => x.id === id), 0).N[3];
    // Method of joints (worked in the file header): joint A: N_AD·0.8 = −P/2 → N_AD = −0.625P,
    // N_AB = 0.375P; joint D: N_DB = +0.625P, N_DE = 0.6(N_AD − N_DB) = −0.75P; symmetry for the rest.
    // Tolerance rel 1e-9.
    expect(N('AD') / (-0.625 * P)).toBeCloseTo(1, 9);
    expect(N('AB') / (0.375 * P)).toBeCloseTo(1, 9);
    expect(N('DB') / (0.625 * P)).toBeCloseTo(1, 9);
    expect(N('DE') / (-0.75 * P)).toBeCloseTo(1, 9);
    expect(N('BE') / (0.625 * P)).toBeCloseTo(1, 9);
    expect(N('EC') / (-0.625 * P)).toBeCloseTo(1, 9);
    // truss members carry no moment
    for (let i = 0; i < m.members.length; i++) for (const v of r.memberForces(i, 0).M_major) expect(Math.abs(v)).toBeLessThan(1e-6);
  });

  it('determinate truss forces do not change with E, displacements scale with 1/E', () => {
    const a = analyse(warren(200e9)), b = analyse(warren(70e9));
    // Statics alone fixes the forces of a determinate truss; δ ∝ 1/E (virtual work). Tol rel 1e-9.
    for (let i = 0; i < 7; i++) expect(b.memberForces(i, 0).N[0] / a.memberForces(i, 0).N[0]).toBeCloseTo(1, 9);
    const B = 1 * 6 + 2;
    expect(b.displacements(0)[B] / a.displacements(0)[B]).toBeCloseTo(200 / 70, 9);
  });

  it('three-bar indeterminate truss: F_vertical = P/(1 + 2cos³θ)', () => {
    // Three bars from a ceiling to joint O: one vertical (length h), two at θ from vertical, same EA.
    // Compatibility (Timoshenko, Strength of Materials Part I, three-bar problem, from memory):
    // F_v = P/(1 + 2cos³θ), F_i = P cos²θ/(1 + 2cos³θ). Tolerance rel 1e-9.
    const h = 3, th = Math.PI / 6, P = 50e3;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('O', 0, 0, 0).node('L', -h * Math.tan(th), 0, h).node('C', 0, 0, h).node('R', h * Math.tan(th), 0, h)
      .support('L', 'pinned').support('C', 'pinned').support('R', 'pinned')
      .member('BL', 'L', 'O', { type: 'truss' }).member('BC', 'C', 'O', { type: 'truss' }).member('BR', 'R', 'O', { type: 'truss' })
      .loadCase('P').nodeLoad('P', 'O', { fz: -P }).build();
    const r = analyse(m);
    const c = Math.cos(th);
    expect(r.memberForces(1, 0).N[0] / (P / (1 + 2 * c ** 3))).toBeCloseTo(1, 9);
    expect(r.memberForces(0, 0).N[0] / ((P * c * c) / (1 + 2 * c ** 3))).toBeCloseTo(1, 9);
    expect(r.memberForces(2, 0).N[0] / ((P * c * c) / (1 + 2 * c ** 3))).toBeCloseTo(1, 9);
    // vertical displacement of O = F_v·h/EA
    expect(r.displacements(0)[nodeIndexOf(m, 'O') * 6 + 2] / (-(P / (1 + 2 * c ** 3)) * h / (200e9 * 0.01))).toBeCloseTo(1, 9);
  });

  it('a truss member under a transverse UDL acts as a simple span between its nodes', () => {
    const w = 2e3;
    const m = warren(200e9);
    m.memberLoads.push({ case: 'P', member: 'DE', kind: 'uniform', direction: 'global_z', a: 0, b: 3, w1: -w, w2: -w });
    const f = analyse(m).memberForces(2, 0);
    // Simply supported span: M(L/2) = wL²/8, L = 3 m, ends zero. Tolerance rel 1e-9.
    expect(f.M_major[5] / ((w * 9) / 8)).toBeCloseTo(1, 9);
    expect(Math.abs(f.M_major[0])).toBeLessThan(1e-6);
  });

  it('a transverse load on a chord that ends at a support reaches the reactions (equilibrium)', () => {
    const w = 2e3;
    const m = warren(200e9);
    m.memberLoads.push({ case: 'P', member: 'AB', kind: 'uniform', direction: 'global_z', a: 0, b: 3, w1: -w, w2: -w });
    const r = analyse(m);
    // statics: total vertical reaction = P + w·3 (tolerance rel 1e-9); equilibrium residual below 1e-9
    expect((r.reactions(0)[2] + r.reactions(0)[2 * 6 + 2]) / (100e3 + 3 * w)).toBeCloseTo(1, 9);
    expect(r.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });
});
