import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { at, ModelBuilder, nodeIndexOf, STEEL_E } from './builders.js';

// Simply supported beam along X, Z up, plane frame in XZ. L = 6 m, E = 200 GPa, I = 1e-4 m4.
const L = 6, I = 1e-4, EI = STEEL_E * I;

function simpleBeam() {
  return new ModelBuilder({ planeNormal: 'Y' })
    .node('A', 0, 0, 0).node('B', L, 0, 0)
    .support('A', 'ux uz').support('B', 'uz')
    .member('M1', 'A', 'B');
}

describe('simply supported beam', () => {
  it('UDL: reactions wL/2, midspan moment wL²/8, deflection 5wL⁴/384EI', () => {
    const w = 10e3; // N/m downward
    const m = simpleBeam().loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -w).build();
    const r = analyse(m);
    const f = r.memberForces(0, 0);
    // Closed form (statics): R = wL/2; M(L/2) = wL²/8; δ = 5wL⁴/(384EI). Tolerance rel 1e-9.
    const RA = r.reactions(0)[nodeIndexOf(m, 'A') * 6 + 2];
    expect(RA).toBeCloseTo((w * L) / 2, 6);
    expect(at(f.x, f.M_major, L / 2) / ((w * L * L) / 8)).toBeCloseTo(1, 9);
    // conventions.md: sagging positive, V_major positive near the start, negative near the end
    expect(at(f.x, f.V_major, 0)).toBeCloseTo((w * L) / 2, 6);
    expect(at(f.x, f.V_major, L)).toBeCloseTo((-w * L) / 2, 6);
    const dmid = (5 * w * L ** 4) / (384 * EI);
    expect(at(f.x, f.d_major, L / 2) / -dmid).toBeCloseTo(1, 9);
    // d_major is relative to the chord; supports do not move, so it equals the node-free deflection
    expect(f.d_major[0]).toBe(0);
    // end rotation wL³/24EI (Roark's Formulas table 8.1 case 2e, from memory); θy = −dw/dx so +θ at A
    expect(r.displacements(0)[4] / ((w * L ** 3) / (24 * EI))).toBeCloseTo(1, 9);
  });

  it('midspan point load: M = PL/4, δ = PL³/48EI', () => {
    const P = 20e3;
    const m = simpleBeam().loadCase('D').memberLoad('D', 'M1', 'point', 'global_z', -P, { a: L / 2 }).build();
    const r = analyse(m);
    const f = r.memberForces(0, 0);
    // Closed form: M_max = PL/4, δ = PL³/(48EI). Tolerance rel 1e-9.
    expect(at(f.x, f.M_major, L / 2) / ((P * L) / 4)).toBeCloseTo(1, 9);
    expect(at(f.x, f.d_major, L / 2) / (-(P * L ** 3) / (48 * EI))).toBeCloseTo(1, 9);
  });

  it('off-centre point load: reactions Pb/L, Pa/L, M = Pab/L, deflection under the load Pa²b²/3EIL', () => {
    const P = 15e3, a = 2, b = L - a;
    const m = simpleBeam().loadCase('D').memberLoad('D', 'M1', 'point', 'global_z', -P, { a }).build();
    const r = analyse(m);
    const f = r.memberForces(0, 0);
    // AISC Manual Table 3-23 case 8 (from memory): R1 = Pb/L, R2 = Pa/L, Mmax = Pab/L, Δa = Pa²b²/(3EIL). Tol rel 1e-9.
    expect(r.reactions(0)[2] / ((P * b) / L)).toBeCloseTo(1, 9);
    expect(r.reactions(0)[8] / ((P * a) / L)).toBeCloseTo(1, 9);
    expect(f.x).toContain(a);
    expect(at(f.x, f.M_major, a) / ((P * a * b) / L)).toBeCloseTo(1, 9);
    expect(at(f.x, f.d_major, a) / (-(P * a * a * b * b) / (3 * EI * L))).toBeCloseTo(1, 9);
  });
});

describe('simply supported beam, partial and triangular loads', () => {
  it('partial UDL from a to b: reactions and moment by statics', () => {
    const w = 8e3, a = 1, b = 4, c = b - a;
    const m = simpleBeam().loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -w, { a, b }).build();
    const r = analyse(m);
    const f = r.memberForces(0, 0);
    // Statics: R_A = w·c·(L − (a + c/2))/L; M(3) = R_A·3 − w(3 − a)²/2. Tolerance rel 1e-9.
    const RA = (w * c * (L - (a + c / 2))) / L;
    expect(r.reactions(0)[2] / RA).toBeCloseTo(1, 9);
    expect(r.reactions(0)[8] / (w * c - RA)).toBeCloseTo(1, 9);
    expect(at(f.x, f.M_major, 3) / (RA * 3 - (w * (3 - a) ** 2) / 2)).toBeCloseTo(1, 9);
    // shear is constant on the unloaded part: V = R_A on [0, a]
    expect(at(f.x, f.V_major, 0.6) / RA).toBeCloseTo(1, 9);
  });

  it('triangular load 0 → w: reactions wL/6 and wL/3, M(L/2) = wL²/16, δ(L/2) = 5wL⁴/768EI', () => {
    const w = 12e3;
    const m = simpleBeam().loadCase('D').memberLoad('D', 'M1', 'linear', 'global_z', 0, { w2: -w }).build();
    const r = analyse(m);
    const f = r.memberForces(0, 0);
    // AISC Manual Table 3-23 case 2 (from memory): R1 = W/3 … here R_A = wL/6, R_B = wL/3;
    // M(x) = R_A·x − w x³/(6L) → M(L/2) = wL²/16. Midspan deflection: two mirrored triangles make a
    // UDL, so δ = ½ · 5wL⁴/(384EI) = 5wL⁴/(768EI). Tolerance rel 1e-9.
    expect(r.reactions(0)[2] / ((w * L) / 6)).toBeCloseTo(1, 9);
    expect(r.reactions(0)[8] / ((w * L) / 3)).toBeCloseTo(1, 9);
    expect(at(f.x, f.M_major, L / 2) / ((w * L * L) / 16)).toBeCloseTo(1, 9);
    expect(at(f.x, f.d_major, L / 2) / (-(5 * w * L ** 4) / (768 * EI))).toBeCloseTo(1, 9);
  });
});
