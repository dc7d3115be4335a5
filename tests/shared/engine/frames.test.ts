import { describe, expect, it } from 'vitest';
import { analyse, STANDARD_GRAVITY } from '../../../shared/engine/index.js';
import { at, ModelBuilder, nodeIndexOf, STEEL_E } from './builders.js';

const E = STEEL_E, G = E / 2.6;

describe('portal frames', () => {
  it('fixed-base portal under a lateral load: sway and moments by slope–deflection', () => {
    // Columns h = 4 m (I_c = 1e-4), beam L = 6 m (I_b = 2e-4); axial strain made negligible (A = 10 m²).
    // Lateral load H/2 at each knee (antisymmetric). Slope–deflection (clockwise positive), antisymmetric sway ψ = Δ/h, θ_B = θ_C = θ:
    //   M_AB = 2k_c(θ − 3ψ), M_BA = 2k_c(2θ − 3ψ), M_BC = 6k_b θ
    //   joint B: M_BA + M_BC = 0 → θ = 3k_c ψ / (2k_c + 3k_b)
    //   storey shear: 4k_c(6ψ − 3θ)/h = H
    // with k_c = EI_c/h, k_b = EI_b/L. Tolerance rel 1e-4 (axial deformation neglected by the formula).
    const h = 4, L = 6, Ic = 1e-4, Ib = 2e-4, H = 50e3;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .section('C', { A: 10, I_major: Ic }).section('B', { A: 10, I_major: Ib })
      .node('A', 0, 0, 0).node('B', 0, 0, h).node('C', L, 0, h).node('D', L, 0, 0)
      .support('A', 'fixed').support('D', 'fixed')
      .member('AB', 'A', 'B', { section: 'C' }).member('BC', 'B', 'C', { section: 'B' }).member('DC', 'D', 'C', { section: 'C' })
      .loadCase('W').nodeLoad('W', 'B', { fx: H / 2 }).nodeLoad('W', 'C', { fx: H / 2 }).build();
    const r = analyse(m);
    const kc = (E * Ic) / h, kb = (E * Ib) / L;
    const ratio = (3 * kc) / (2 * kc + 3 * kb); // θ = ratio · ψ
    const psi = (H * h) / (4 * kc * (6 - 3 * ratio));
    const theta = ratio * psi;
    expect(r.displacements(0)[nodeIndexOf(m, 'B') * 6] / (psi * h)).toBeCloseTo(1, 4);
    const fAB = r.memberForces(0, 0);
    expect(Math.abs(fAB.M_major[0]) / Math.abs(2 * kc * (theta - 3 * psi))).toBeCloseTo(1, 4);
    expect(Math.abs(fAB.M_major[fAB.x.length - 1]) / Math.abs(2 * kc * (2 * theta - 3 * psi))).toBeCloseTo(1, 4);
    // each column takes half the storey shear by antisymmetry (exact)
    expect(r.reactions(0)[0] / (-H / 2)).toBeCloseTo(1, 9);
  });

  it('pinned-base portal under a lateral load: H/2 at each base, knee moment Hh/2, uplift Hh/L', () => {
    // Symmetric frame, antisymmetric load (H/2 at each knee) → equal horizontal reactions (antisymmetry); statics gives the
    // vertical reactions ±Hh/L and the knee moments (H/2)·h. Tolerance rel 1e-9.
    const h = 4, L = 6, H = 20e3;
    const m = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', 0, 0, h).node('C', L, 0, h).node('D', L, 0, 0)
      .support('A', 'pinned').support('D', 'pinned')
      .member('AB', 'A', 'B').member('BC', 'B', 'C').member('DC', 'D', 'C')
      .loadCase('W').nodeLoad('W', 'B', { fx: H / 2 }).nodeLoad('W', 'C', { fx: H / 2 }).build();
    const r = analyse(m);
    const R = r.reactions(0), d = nodeIndexOf(m, 'D') * 6;
    expect(R[0] / (-H / 2)).toBeCloseTo(1, 9);
    expect(R[d] / (-H / 2)).toBeCloseTo(1, 9);
    expect(R[2] / ((-H * h) / L)).toBeCloseTo(1, 9);
    expect(R[d + 2] / ((H * h) / L)).toBeCloseTo(1, 9);
    const fAB = r.memberForces(0, 0);
    expect(Math.abs(fAB.M_major[0])).toBeLessThan(1e-6);
    expect(Math.abs(fAB.M_major[fAB.x.length - 1]) / ((H * h) / 2)).toBeCloseTo(1, 9);
  });
});

describe('3D members', () => {
  it('cantilever with biaxial bending and torsion: PL³/3EI about both axes, TL/GJ', () => {
    const L = 3, Iy = 1e-4, Iz = 4e-5, J = 2e-5, Py = 4e3, Pz = -7e3, T = 2e3;
    const m = new ModelBuilder().section('S3', { I_major: Iy, I_minor: Iz, J })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed').member('M1', 'A', 'B', { section: 'S3' })
      .loadCase('D').nodeLoad('D', 'B', { fy: Py, fz: Pz, mx: T }).build();
    const r = analyse(m);
    const u = r.displacements(0);
    // Closed forms: δ = PL³/(3EI) per axis (Roark table 8.1 case 1a, from memory), φ = TL/(GJ). Tol rel 1e-9.
    expect(u[6 + 1] / ((Py * L ** 3) / (3 * E * Iz))).toBeCloseTo(1, 9);
    expect(u[6 + 2] / ((Pz * L ** 3) / (3 * E * Iy))).toBeCloseTo(1, 9);
    expect(u[6 + 3] / ((T * L) / (G * J))).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    // local y = +Y, z = +Z: M_minor(0) = Py·L (tension on −y), M_major(0) = Pz·L, T = applied torque
    expect(f.M_minor[0] / (Py * L)).toBeCloseTo(1, 9);
    expect(f.M_major[0] / (Pz * L)).toBeCloseTo(1, 9);
    expect(f.V_minor[0] / -Py).toBeCloseTo(1, 9);
    for (const v of f.T) expect(v / T).toBeCloseTo(1, 9);
    // chord deflection at midspan from v(x) = P x²(3L − x)/(6EI): v(L/2) − v(L)/2
    const v = (P: number, I: number, x: number) => (P * x * x * (3 * L - x)) / (6 * E * I);
    expect(at(f.x, f.d_minor, L / 2) / (v(Py, Iz, L / 2) - v(Py, Iz, L) / 2)).toBeCloseTo(1, 9);
    expect(at(f.x, f.d_major, L / 2) / (v(Pz, Iy, L / 2) - v(Pz, Iy, L) / 2)).toBeCloseTo(1, 9);
  });

  it('roll of 90° turns a vertical load into minor-axis bending', () => {
    const L = 3, Iz = 4e-5, P = 5e3;
    const m = new ModelBuilder().section('S3', { I_minor: Iz })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed').member('M1', 'A', 'B', { section: 'S3', roll: Math.PI / 2 })
      .loadCase('D').nodeLoad('D', 'B', { fz: -P }).build();
    const r = analyse(m);
    // conventions.md: roll rotates y towards z, so local y = global Z; δ = PL³/(3EI_minor). Tol rel 1e-9.
    expect(r.displacements(0)[6 + 2] / (-(P * L ** 3) / (3 * E * Iz))).toBeCloseTo(1, 9);
    expect(r.memberForces(0, 0).M_minor[0] / (-P * L)).toBeCloseTo(1, 9);
  });

  it('vertical column: local z is global +X, so a load along X bends it about its major axis', () => {
    const h = 3, P = 2e3, Iy = 1e-4;
    const m = new ModelBuilder().node('A', 0, 0, 0).node('B', 0, 0, h).support('A', 'fixed').member('C1', 'A', 'B')
      .loadCase('W').nodeLoad('W', 'B', { fx: P }).build();
    const r = analyse(m);
    // conventions.md: vertical member → z = +X. Cantilever δ = Ph³/(3EI_major). Tol rel 1e-9.
    expect(r.displacements(0)[6] / ((P * h ** 3) / (3 * E * Iy))).toBeCloseTo(1, 9);
    expect(r.memberForces(0, 0).M_major[0] / (P * h)).toBeCloseTo(1, 9);
  });
});

describe('inclined member with global, projected and local loads', () => {
  // Member A(0,0,0) → B(3,0,4), L = 5, pinned at A, vertical roller at B. Local x = (0.6, 0, 0.8),
  // local z = (−0.8, 0, 0.6). Loads of w = 1 kN/m pointing down / along −z.
  const w = 1e3, L = 5;
  const build = (dir: 'global_z' | 'projected_z' | 'local_z') =>
    new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 3, 0, 4).support('A', 'ux uz').support('B', 'uz')
      .member('M1', 'A', 'B').loadCase('D').memberLoad('D', 'M1', 'uniform', dir, -w).build();

  it('global load per member length: W = wL, midspan moment (0.6w)L²/8', () => {
    const r = analyse(build('global_z'));
    // Resolving: perpendicular component 0.6w per member length → M = 0.6wL²/8; reactions W/2 each by
    // moments about A (resultant at horizontal 1.5 m of 3 m). Tolerance rel 1e-9.
    expect(r.reactions(0)[6 + 2] / ((w * L) / 2)).toBeCloseTo(1, 9);
    expect(at(r.memberForces(0, 0).x, r.memberForces(0, 0).M_major, L / 2) / ((0.6 * w * L * L) / 8)).toBeCloseTo(1, 9);
  });

  it('projected load: W = w × horizontal projection (3 m), midspan moment 0.36wL²/8', () => {
    const r = analyse(build('projected_z'));
    // per member length w·sin θ = 0.6w (θ = angle to Z, cos θ = 0.8) vertical; perpendicular 0.6·0.6w.
    // Tolerance rel 1e-9.
    expect((r.reactions(0)[2] + r.reactions(0)[6 + 2]) / (3 * w)).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    expect(at(f.x, f.M_major, L / 2) / ((0.36 * w * L * L) / 8)).toBeCloseTo(1, 9);
  });

  it('local load: perpendicular w, midspan moment wL²/8, roller reaction by moments about A', () => {
    const r = analyse(build('local_z'));
    // Resultant wL along −z = w·5·(0.8, 0, −0.6) at the midpoint (1.5, 2): moment about A (Y) = 2·4w + 1.5·3w
    // = 12.5w, balanced by R_B·3 → R_B = 12.5w/3; horizontal reaction at A = −4w. Tolerance rel 1e-9.
    expect(r.reactions(0)[6 + 2] / ((12.5 * w) / 3)).toBeCloseTo(1, 9);
    expect(r.reactions(0)[0] / (-4 * w)).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    expect(at(f.x, f.M_major, L / 2) / ((w * L * L) / 8)).toBeCloseTo(1, 9);
  });
});

describe('springs, self weight, combinations', () => {
  it('cantilever on a tip spring: δ = P/(k + 3EI/L³), spring reaction −kδ', () => {
    const L = 4, k = 2e6, P = 10e3, EI = E * 1e-4;
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'fixed').support('B', '', { uz: k }).member('M1', 'A', 'B')
      .loadCase('D').nodeLoad('D', 'B', { fz: -P }).build();
    const r = analyse(m);
    // Springs in parallel (tip stiffness of a cantilever 3EI/L³, Roark table 8.1 case 1a). Tol rel 1e-9.
    const d = -P / (k + (3 * EI) / L ** 3);
    expect(r.displacements(0)[6 + 2] / d).toBeCloseTo(1, 9);
    expect(r.reactions(0)[6 + 2] / (-k * d)).toBeCloseTo(1, 9);
    expect(r.supportedNodes).toEqual([0, 1]);
    expect(r.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });

  it('self weight: w = ρ·A·g × factor along −vertical (g = 9.80665 m/s²)', () => {
    const L = 6, rho = 7850, A = 0.01;
    const m = new ModelBuilder({ planeNormal: 'Y' }).material('heavy', { density: rho })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'ux uz').support('B', 'uz')
      .member('M1', 'A', 'B', { material: 'heavy' }).loadCase('SW', 1.5).build();
    const r = analyse(m);
    const w = rho * A * STANDARD_GRAVITY * 1.5;
    // Simple span under its own weight: R = wL/2, M = wL²/8. Tolerance rel 1e-9.
    expect(STANDARD_GRAVITY).toBe(9.80665);
    expect(r.reactions(0)[2] / ((w * L) / 2)).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    expect(at(f.x, f.M_major, L / 2) / ((w * L * L) / 8)).toBeCloseTo(1, 9);
  });

  it('self weight with vertical axis Y acts along −Y', () => {
    const L = 6, rho = 7850, A = 0.01;
    const m = new ModelBuilder({ vertical: 'Y', planeNormal: 'Z' }).material('heavy', { density: rho })
      .node('A', 0, 0).node('B', L, 0).support('A', 'ux uy').support('B', 'uy')
      .member('M1', 'A', 'B', { material: 'heavy' }).loadCase('SW', 1).build();
    const r = analyse(m);
    // Same closed form, reactions along +Y. Tolerance rel 1e-9.
    expect(r.reactions(0)[1] / ((rho * A * STANDARD_GRAVITY * L) / 2)).toBeCloseTo(1, 9);
    const f = r.memberForces(0, 0);
    expect(at(f.x, f.M_major, L / 2) / ((rho * A * STANDARD_GRAVITY * L * L) / 8)).toBeCloseTo(1, 9);
  });

  it('a combination equals the analysis of the factored loads (superposition)', () => {
    const mk = (f1: number, f2: number, withCombo: boolean) => {
      const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 5, 0, 0).node('C', 5, 0, -3)
        .support('A', 'fixed').support('C', 'pinned').member('M1', 'A', 'B').member('M2', 'C', 'B')
        .loadCase('D').loadCase('L')
        .memberLoad('D', 'M1', 'uniform', 'global_z', -4e3 * f1)
        .memberLoad('L', 'M1', 'point', 'global_z', -9e3 * f2, { a: 2 })
        .nodeLoad('L', 'B', { fx: 3e3 * f2 });
      if (withCombo) b.combination('ULS', { D: 1.2, L: 1.6 });
      return b.build();
    };
    const a = analyse(mk(1, 1, true));
    const b = analyse(mk(1.2, 1.6, false));
    expect(a.loadings.map((l) => l.id)).toEqual(['D', 'L', 'ULS']);
    // Linear elasticity: results of 1.2D + 1.6L equal the sum of factored case results. Tol rel 1e-9.
    const fa = a.memberForces(0, 2), fb1 = b.memberForces(0, 0), fb2 = b.memberForces(0, 1);
    for (let i = 0; i < fa.x.length; i++) expect(fa.M_major[i]).toBeCloseTo(fb1.M_major[i] + fb2.M_major[i], 3);
    const ua = a.displacements(2), ub1 = b.displacements(0), ub2 = b.displacements(1);
    for (let i = 0; i < ua.length; i++) expect(ua[i]).toBeCloseTo(ub1[i] + ub2[i], 12);
    expect(a.diagnostics.equilibrium[2].residual).toBeLessThan(1e-9);
  });
});
