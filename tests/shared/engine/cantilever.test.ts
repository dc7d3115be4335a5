import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { at, ModelBuilder, STEEL_E } from './builders.js';

// Cantilever along X fixed at A, free at B; Z up; L = 4 m, I_major = 1e-4 m4.
const L = 4, EI = STEEL_E * 1e-4;
const cantilever = () =>
  new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed').member('M1', 'A', 'B');

describe('cantilever', () => {
  it('tip point load: δ = PL³/3EI, θ = PL²/2EI, root moment −PL', () => {
    const P = 10e3;
    const m = cantilever().loadCase('D').nodeLoad('D', 'B', { fz: -P }).build();
    const r = analyse(m);
    const u = r.displacements(0);
    // Closed form (Roark's Formulas table 8.1 case 1a, from memory): δ = PL³/(3EI), θ = PL²/(2EI). Tol rel 1e-9.
    expect(u[6 + 2] / (-(P * L ** 3) / (3 * EI))).toBeCloseTo(1, 9);
    expect(u[6 + 4] / ((P * L * L) / (2 * EI))).toBeCloseTo(1, 9); // θy = −dw/dx > 0
    const f = r.memberForces(0, 0);
    expect(f.M_major[0] / (-P * L)).toBeCloseTo(1, 9); // hogging at the root
    expect(f.V_major[0] / P).toBeCloseTo(1, 9); // V = dM/dx = +P
    expect(r.reactions(0)[2] / P).toBeCloseTo(1, 9);
    expect(r.reactions(0)[4] / (-P * L)).toBeCloseTo(1, 9); // support moment about +Y
  });

  it('UDL: δ = wL⁴/8EI, root moment −wL²/2', () => {
    const w = 5e3;
    const m = cantilever().loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -w).build();
    const r = analyse(m);
    // Closed form (Roark table 8.1 case 2a, from memory): δ = wL⁴/(8EI), θ = wL³/(6EI), M = wL²/2. Tol rel 1e-9.
    expect(r.displacements(0)[8] / (-(w * L ** 4) / (8 * EI))).toBeCloseTo(1, 9);
    expect(r.displacements(0)[10] / ((w * L ** 3) / (6 * EI))).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    expect(f.M_major[0] / ((-w * L * L) / 2)).toBeCloseTo(1, 9);
    // chord deflection at midspan: w(L/2) from the elastic curve w(x) = −w x²(6L² − 4Lx + x²)/(24EI),
    // minus the chord x/L · w(L): AISC Manual Table 3-23 case 22 (from memory).
    const wx = (x: number) => (-w * x * x * (6 * L * L - 4 * L * x + x * x)) / (24 * EI);
    expect(at(f.x, f.d_major, L / 2) / (wx(L / 2) - 0.5 * wx(L))).toBeCloseTo(1, 9);
  });

  it('tip moment: θ = ML/EI, δ = ML²/2EI, constant hogging moment', () => {
    const M0 = 8e3;
    const m = cantilever().loadCase('D').nodeLoad('D', 'B', { my: M0 }).build();
    const r = analyse(m);
    // Closed form (Roark table 8.1 case 3a, from memory): θ = ML/(EI), δ = ML²/(2EI). Tol rel 1e-9.
    expect(r.displacements(0)[10] / ((M0 * L) / EI)).toBeCloseTo(1, 9);
    expect(r.displacements(0)[8] / (-(M0 * L * L) / (2 * EI))).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    for (const v of f.M_major) expect(v / -M0).toBeCloseTo(1, 9);
    for (const v of f.V_major) expect(Math.abs(v)).toBeLessThan(1e-6);
  });

  it('concentrated moment member load at midspan: tip rotation M(L/2)/EI', () => {
    const M0 = 6e3;
    const m = cantilever().loadCase('D').memberLoad('D', 'M1', 'moment', 'global_y', M0, { a: L / 2 }).build();
    const r = analyse(m);
    // Closed form: only [0, L/2] bends, κ = M/EI; θ_tip = M(L/2)/EI, δ_tip = −M(L/2)²/(2EI) − θ·L/2. Tol rel 1e-9.
    const th = (M0 * L) / 2 / EI;
    expect(r.displacements(0)[10] / th).toBeCloseTo(1, 9);
    expect(r.displacements(0)[8] / (-(M0 * (L / 2) ** 2) / (2 * EI) - th * (L / 2))).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    expect(f.x).toContain(L / 2);
    expect(f.M_major[0] / -M0).toBeCloseTo(1, 9);
    expect(Math.abs(f.M_major[f.x.length - 1])).toBeLessThan(1e-6);
  });
});
