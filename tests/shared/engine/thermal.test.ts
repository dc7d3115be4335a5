import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { at, ModelBuilder, STEEL_E } from './builders.js';

const L = 5, A = 0.01, alpha = 12e-6, I = 1e-4, h = 0.3;

describe('temperature and settlement', () => {
  it('bar fixed at both ends, uniform ΔT: N = −EAαΔT, no displacement', () => {
    const dT = 30;
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'fixed').support('B', 'fixed').member('M1', 'A', 'B')
      .loadCase('T').memberLoad('T', 'M1', 'temperature', 'local_x', dT).build();
    const r = analyse(m);
    // Closed form: free strain αΔT fully restrained → N = −EAαΔT (compression). Tolerance rel 1e-9.
    for (const v of r.memberForces(0, 0).N) expect(v / (-STEEL_E * A * alpha * dT)).toBeCloseTo(1, 9);
    // the bar pushes A towards −X, so the support pushes back along +X
    expect(r.reactions(0)[0] / (STEEL_E * A * alpha * dT)).toBeCloseTo(1, 9);
  });

  it('bar on a roller, uniform ΔT: free expansion αΔTL and N = 0', () => {
    const dT = 30;
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'ux uz').support('B', 'uz').member('M1', 'A', 'B')
      .loadCase('T').memberLoad('T', 'M1', 'temperature', 'local_x', dT).build();
    const r = analyse(m);
    // Closed form: δ = αΔTL. Tolerance rel 1e-9; N ≈ 0 to 1e-6 N.
    expect(r.displacements(0)[6] / (alpha * dT * L)).toBeCloseTo(1, 9);
    for (const v of r.memberForces(0, 0).N) expect(Math.abs(v)).toBeLessThan(1e-6);
  });

  it('temperature gradient on a simply supported beam: curvature α(T1−T2)/h, δ = αΔTL²/(8h) upward, M = 0', () => {
    const T1 = 25, T2 = -15;
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'ux uz').support('B', 'uz').member('M1', 'A', 'B')
      .loadCase('T').memberLoad('T', 'M1', 'temperature_gradient', 'local_x', T1, { w2: T2 }).build();
    const r = analyse(m);
    const f = r.memberForces(0, 0);
    const k = (alpha * (T1 - T2)) / h;
    // Closed form: constant curvature κ = αΔT/h, hotter top face → hogging shape, midspan rise κL²/8;
    // end rotation κL/2; mean temperature lengthens the bar by α(T1+T2)/2·L. Tolerance rel 1e-9.
    expect(at(f.x, f.d_major, L / 2) / ((k * L * L) / 8)).toBeCloseTo(1, 9);
    expect(Math.abs(r.displacements(0)[4]) / ((k * L) / 2)).toBeCloseTo(1, 9);
    expect(r.displacements(0)[6] / ((alpha * (T1 + T2) * L) / 2)).toBeCloseTo(1, 9);
    for (const v of f.M_major) expect(Math.abs(v)).toBeLessThan(1e-6);
  });

  it('temperature gradient on a fixed–fixed beam: constant moment EIαΔT/h', () => {
    const T1 = 20, T2 = 0;
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'fixed').support('B', 'fixed').member('M1', 'A', 'B')
      .loadCase('T').memberLoad('T', 'M1', 'temperature_gradient', 'local_x', T1, { w2: T2 }).build();
    const f = analyse(m).memberForces(0, 0);
    // Closed form: total curvature M/EI − αΔT/h = 0 → M = EIαΔT/h (sagging: the restraint pulls the
    // hogging thermal curvature flat); N = −EAα(T1+T2)/2. Tolerance rel 1e-9.
    for (const v of f.M_major) expect(v / ((STEEL_E * I * alpha * (T1 - T2)) / h)).toBeCloseTo(1, 9);
    expect(f.N[0] / (-STEEL_E * A * alpha * (T1 + T2) / 2)).toBeCloseTo(1, 9);
    for (const v of f.d_major) expect(Math.abs(v)).toBeLessThan(1e-12);
  });

  it('settlement Δ of one end of a fixed–fixed beam: M = 6EIΔ/L², V = 12EIΔ/L³', () => {
    const d = 0.01;
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'fixed').support('B', 'fixed').member('M1', 'A', 'B')
      .loadCase('S').settlement('S', 'B', { uz: -d }).build();
    const r = analyse(m);
    const f = r.memberForces(0, 0);
    // AISC Manual Table 3-23 / slope-deflection with ψ = Δ/L (from memory): M = 6EIΔ/L², V = 12EIΔ/L³.
    // B drops: hogging at A, sagging at B. Tolerance rel 1e-9.
    expect(f.M_major[0] / ((-6 * STEEL_E * I * d) / (L * L))).toBeCloseTo(1, 9);
    expect(f.M_major[f.x.length - 1] / ((6 * STEEL_E * I * d) / (L * L))).toBeCloseTo(1, 9);
    expect(Math.abs(f.V_major[3]) / ((12 * STEEL_E * I * d) / L ** 3)).toBeCloseTo(1, 9);
    expect(r.displacements(0)[6 + 2]).toBe(-d);
    // reactions balance each other (no applied load)
    expect(r.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });
});
