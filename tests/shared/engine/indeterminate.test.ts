import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { at, ModelBuilder, nodeIndexOf, STEEL_E } from './builders.js';

const L = 6, EI = STEEL_E * 1e-4;

describe('statically indeterminate beams', () => {
  it('propped cantilever, UDL: prop reaction 3wL/8, fixed-end moment −wL²/8', () => {
    const w = 10e3;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed').support('B', 'uz').member('M1', 'A', 'B')
      .loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -w).build();
    const r = analyse(m);
    // AISC Manual Table 3-23 case 12 (from memory): R_prop = 3wL/8, R_fixed = 5wL/8, M_fixed = wL²/8. Tol rel 1e-9.
    expect(r.reactions(0)[6 + 2] / ((3 * w * L) / 8)).toBeCloseTo(1, 9);
    expect(r.reactions(0)[2] / ((5 * w * L) / 8)).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    expect(f.M_major[0] / ((-w * L * L) / 8)).toBeCloseTo(1, 9);
    // moment at 3L/8 is the maximum positive moment 9wL²/128 (same table); 3L/8 = 2.25 is no station,
    // so check M(L/2) = 3wL/8·L/2 − w(L/2)²/2 = wL²/16 by statics
    expect(at(f.x, f.M_major, L / 2) / ((w * L * L) / 16)).toBeCloseTo(1, 9);
  });

  it('fixed–fixed beam, UDL: ends −wL²/12, midspan wL²/24, δ = wL⁴/384EI', () => {
    const w = 10e3;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed').support('B', 'fixed').member('M1', 'A', 'B')
      .loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -w).build();
    const f = analyse(m).memberForces(0, 0);
    // AISC Manual Table 3-23 case 15 (from memory). Tol rel 1e-9.
    expect(f.M_major[0] / ((-w * L * L) / 12)).toBeCloseTo(1, 9);
    expect(f.M_major[f.x.length - 1] / ((-w * L * L) / 12)).toBeCloseTo(1, 9);
    expect(at(f.x, f.M_major, L / 2) / ((w * L * L) / 24)).toBeCloseTo(1, 9);
    expect(at(f.x, f.d_major, L / 2) / (-(w * L ** 4) / (384 * EI))).toBeCloseTo(1, 9);
  });

  it('fixed–fixed beam, central point load: ends −PL/8, midspan PL/8, δ = PL³/192EI', () => {
    const P = 30e3;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed').support('B', 'fixed').member('M1', 'A', 'B')
      .loadCase('D').memberLoad('D', 'M1', 'point', 'global_z', -P, { a: L / 2 }).build();
    const f = analyse(m).memberForces(0, 0);
    // AISC Manual Table 3-23 case 16 (from memory). Tol rel 1e-9.
    expect(f.M_major[0] / ((-P * L) / 8)).toBeCloseTo(1, 9);
    expect(at(f.x, f.M_major, L / 2) / ((P * L) / 8)).toBeCloseTo(1, 9);
    expect(at(f.x, f.d_major, L / 2) / (-(P * L ** 3) / (192 * EI))).toBeCloseTo(1, 9);
  });

  it('fixed–fixed beam, off-centre point load: end moments Pab²/L² and Pa²b/L²', () => {
    const P = 20e3, a = 1.5, b = L - a;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed').support('B', 'fixed').member('M1', 'A', 'B')
      .loadCase('D').memberLoad('D', 'M1', 'point', 'global_z', -P, { a }).build();
    const f = analyse(m).memberForces(0, 0);
    // AISC Manual Table 3-23 case 18 (from memory): M1 = Pab²/L², M2 = Pa²b/L². Tol rel 1e-9.
    expect(f.M_major[0] / ((-P * a * b * b) / (L * L))).toBeCloseTo(1, 9);
    expect(f.M_major[f.x.length - 1] / ((-P * a * a * b) / (L * L))).toBeCloseTo(1, 9);
  });

  it('two equal spans, UDL: middle reaction 1.25wL, moment over the support −wL²/8', () => {
    const w = 10e3;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L, 0, 0).node('C', 2 * L, 0, 0)
      .support('A', 'ux uz').support('B', 'uz').support('C', 'uz')
      .member('M1', 'A', 'B').member('M2', 'B', 'C')
      .loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -w).memberLoad('D', 'M2', 'uniform', 'global_z', -w).build();
    const r = analyse(m);
    // AISC Manual Table 3-23 case 29 (from memory): R_end = 3wL/8, R_mid = 10wL/8, M_mid = −wL²/8. Tol rel 1e-9.
    expect(r.reactions(0)[nodeIndexOf(m, 'B') * 6 + 2] / (1.25 * w * L)).toBeCloseTo(1, 9);
    expect(r.reactions(0)[2] / ((3 * w * L) / 8)).toBeCloseTo(1, 9);
    const f1 = r.memberForces(0, 0);
    expect(f1.M_major[f1.x.length - 1] / ((-w * L * L) / 8)).toBeCloseTo(1, 9);
    const f2 = r.memberForces(1, 0);
    expect(f2.M_major[0] / ((-w * L * L) / 8)).toBeCloseTo(1, 9);
  });

  it('internal hinge by release: fixed–hinge–roller beam is determinate', () => {
    const w = 6e3, L1 = 3, L2 = 5;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L1, 0, 0).node('C', L1 + L2, 0, 0)
      .support('A', 'fixed').support('C', 'uz')
      .member('M1', 'A', 'B', { releaseEnd: 'pinned' }).member('M2', 'B', 'C')
      .loadCase('D').memberLoad('D', 'M2', 'uniform', 'global_z', -w).build();
    const r = analyse(m);
    // Statics: BC is simply supported on the hinge and C: R_C = wL2/2, hinge shear wL2/2 loads the
    // cantilever AB at its tip → M_A = −(wL2/2)·L1, δ_B = (wL2/2)·L1³/(3EI). Tol rel 1e-9.
    const V = (w * L2) / 2;
    expect(r.reactions(0)[nodeIndexOf(m, 'C') * 6 + 2] / V).toBeCloseTo(1, 9);
    const f1 = r.memberForces(0, 0);
    expect(f1.M_major[0] / (-V * L1)).toBeCloseTo(1, 9);
    expect(Math.abs(f1.M_major[f1.x.length - 1])).toBeLessThan(1e-6);
    expect(r.displacements(0)[nodeIndexOf(m, 'B') * 6 + 2] / (-(V * L1 ** 3) / (3 * EI))).toBeCloseTo(1, 9);
    const f2 = r.memberForces(1, 0);
    expect(at(f2.x, f2.M_major, L2 / 2) / ((w * L2 * L2) / 8)).toBeCloseTo(1, 9);
  });

  it('hinge at the start of a member (release_start) gives the same result as at the end of the previous one', () => {
    const w = 6e3, L1 = 3, L2 = 5;
    const build = (first: boolean) => new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L1, 0, 0).node('C', L1 + L2, 0, 0)
      .support('A', 'fixed').support('C', 'uz')
      .member('M1', 'A', 'B', first ? { releaseEnd: 'pinned_major' } : {})
      .member('M2', 'B', 'C', first ? {} : { releaseStart: 'pinned_major' })
      .loadCase('D').memberLoad('D', 'M2', 'uniform', 'global_z', -w).build();
    const r1 = analyse(build(true)), r2 = analyse(build(false));
    // Same determinate structure (statics as above): equal reactions and moments. Tol rel 1e-9.
    expect(r2.reactions(0)[4] / r1.reactions(0)[4]).toBeCloseTo(1, 9);
    expect(r2.memberForces(1, 0).M_major[5] / r1.memberForces(1, 0).M_major[5]).toBeCloseTo(1, 9);
  });
});
