import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import type { Model } from '../../../shared/model/types.js';
import {
  analyseSecondOrder, MOVING_LOADS_REFUSED, SECOND_ORDER_DEFAULTS, SecondOrderInstabilityError,
} from '../../../shared/stability/second-order.js';
import { ModelBuilder, relErr, STEEL_E } from '../engine/builders.js';

// Steel, I_major = 1e-4 m⁴ (builder default), E = 200 GPa.
const EI = STEEL_E * 1e-4;

/** Cantilever column along Z, fixed at A, axial compression P and lateral load H (along X) at the tip B. */
function cantileverColumn(L: number, P: number, H: number): Model {
  return new ModelBuilder({ planeNormal: 'Y' })
    .node('A', 0, 0, 0).node('B', 0, 0, L).support('A', 'fixed').member('C', 'A', 'B')
    .loadCase('D').nodeLoad('D', 'B', { fz: -P, fx: H }).build();
}

/** Simply supported beam along X (Z up), axial force P at B (compression > 0), uniform load q downward. */
function beamColumn(L: number, P: number, q: number, viaReleases = false): Model {
  const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0);
  if (viaReleases) b.support('A', 'ux uy uz ry').support('B', 'uy uz ry').member('M', 'A', 'B', { releaseStart: 'pinned', releaseEnd: 'pinned' });
  else b.support('A', 'ux uy uz').support('B', 'uy uz').member('M', 'A', 'B');
  return b.loadCase('D').nodeLoad('D', 'B', { fx: -P }).memberLoad('D', 'M', 'uniform', 'global_z', -q).build();
}

describe('cantilever column with axial and lateral tip load (P-Δ)', () => {
  // Exact beam-column solution (Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., 1.11,
  // from memory): k = √(P/EI), tip deflection δ = H(tan kL − kL)/(P k), base moment M = H tan(kL)/k.
  const L = 5, Pcr = (Math.PI ** 2 * EI) / (4 * L * L);
  for (const ratio of [0.2, 0.5, 0.8]) {
    it(`P = ${ratio}·Pcr: tip deflection and base moment within 0.5 % (default ${SECOND_ORDER_DEFAULTS.subdivisions} sub-elements)`, () => {
      const P = ratio * Pcr, H = 10e3, k = Math.sqrt(P / EI);
      const r = analyseSecondOrder(cantileverColumn(L, P, H));
      const delta = (H * (Math.tan(k * L) - k * L)) / (P * k), M = (H * Math.tan(k * L)) / k;
      const u = r.analysis.displacements(0);
      expect(relErr(u[6], delta)).toBeLessThan(0.005);
      const f = r.analysis.memberForces(0, 0);
      // the base moment: hogging of the column's +z face by the sign convention; magnitude compared
      expect(relErr(Math.abs(f.M_major[0]), M)).toBeLessThan(0.005);
      // support reaction moment about Y balances the same moment (statics at the base)
      expect(relErr(Math.abs(r.analysis.reactions(0)[4]), M)).toBeLessThan(0.005);
      // the reported amplification: second- over first-order horizontal tip translation, δ / (HL³/3EI)
      expect(relErr(r.loadings[0].amplification!, delta / ((H * L ** 3) / (3 * EI)))).toBeLessThan(0.005);
      expect(r.loadings[0].converged).toBe(true);
    });
  }

  it('a "tapered" column whose two end sections are equal (16 taper pieces) gives the same exact answer (0.5 %)', () => {
    const P = 0.5 * Pcr, H = 10e3, k = Math.sqrt(P / EI);
    const model = cantileverColumn(L, P, H);
    model.sections.push({ ...model.sections[0], id: 'S2' });
    model.members[0].sectionEnd = 'S2';
    const r = analyseSecondOrder(model);
    // Timoshenko & Gere 1.11 as above
    expect(relErr(r.analysis.displacements(0)[6], (H * (Math.tan(k * L) - k * L)) / (P * k))).toBeLessThan(0.005);
    const f = r.analysis.memberForces(0, 0);
    for (let i = 0; i < f.x.length - 1; i++) {
      const exact = (H * Math.sin(k * (L - f.x[i]))) / (k * Math.cos(k * L));
      expect(Math.abs(Math.abs(f.M_major[i]) - exact)).toBeLessThanOrEqual(0.005 * exact);
    }
  });

  it('moment along the column: M(x) = H/k·[sin k(L−x)/cos kL] at every station within 0.5 %', () => {
    // same source: the deflected column y'' + k²y = k²δ − H(L−x)/EI gives M(x) = H sin(k(L−x))/(k cos kL)
    const P = 0.6 * Pcr, H = 10e3, k = Math.sqrt(P / EI);
    const f = analyseSecondOrder(cantileverColumn(L, P, H)).analysis.memberForces(0, 0);
    for (let i = 0; i < f.x.length - 1; i++) {
      const exact = (H * Math.sin(k * (L - f.x[i]))) / (k * Math.cos(k * L));
      expect(Math.abs(Math.abs(f.M_major[i]) - exact)).toBeLessThanOrEqual(0.005 * exact);
    }
    expect(Math.abs(f.M_major[f.x.length - 1])).toBeLessThan(1e-6 * H * L);
  });
});

describe('simply supported beam-column under uniform load (P-δ)', () => {
  // Exact (Timoshenko & Gere 1.11, from memory), k = √(P/EI):
  //   M(x) = q/k² · (cos k(L/2 − x) / cos(kL/2) − 1),  M_mid = q/k²·(sec(kL/2) − 1)
  //   δ_mid = q/(EI k⁴) · (sec(kL/2) − 1 − k²L²/8)
  const L = 6, Pe = (Math.PI ** 2 * EI) / (L * L), q = 10e3;
  const exactM = (P: number, x: number) => {
    const k = Math.sqrt(P / EI);
    return (q / k ** 2) * (Math.cos(k * (L / 2 - x)) / Math.cos((k * L) / 2) - 1);
  };
  const exactD = (P: number) => {
    const k = Math.sqrt(P / EI);
    return (q / (EI * k ** 4)) * (1 / Math.cos((k * L) / 2) - 1 - (k * k * L * L) / 8);
  };

  for (const viaReleases of [false, true]) {
    it(`P = 0.5·Pe${viaReleases ? ', pins by member end releases' : ''}: moment at every station and midspan deflection within 0.5 %`, () => {
      const P = 0.5 * Pe;
      const r = analyseSecondOrder(beamColumn(L, P, q, viaReleases));
      const f = r.analysis.memberForces(0, 0);
      const Mmid = exactM(P, L / 2);
      for (let i = 0; i < f.x.length; i++) {
        // tolerance 0.5 % of the midspan moment (the end values are zero)
        expect(Math.abs(f.M_major[i] - exactM(P, f.x[i]))).toBeLessThanOrEqual(0.005 * Mmid);
      }
      expect(relErr(-f.d_major[5], exactD(P))).toBeLessThan(0.005);
      // first order: qL²/8 — the second-order midspan moment is larger by about 1/(1 − P/Pe) (≈ 2)
      expect(f.M_major[5] / ((q * L * L) / 8)).toBeGreaterThan(1.9);
      // the shear normal to the deflected axis, V = dM/dx = q/k · sin k(L/2 − x) / cos(kL/2) (same
      // source, differentiated): at every station within 0.5 % of the support value
      const k = Math.sqrt(P / EI), V0 = (q / k) * Math.tan((k * L) / 2);
      for (let i = 0; i < f.x.length; i++) {
        const exact = ((q / k) * Math.sin(k * (L / 2 - f.x[i]))) / Math.cos((k * L) / 2);
        expect(Math.abs(f.V_major[i] - exact)).toBeLessThanOrEqual(0.005 * V0);
      }
      expect(f.N[5]).toBeCloseTo(-P, 6);
    });
  }

  it('converges as the member is subdivided: error of M_mid and δ_mid falls with 1, 2, 4, 8 sub-elements', () => {
    const P = 0.5 * Pe;
    const errs = [1, 2, 4, 8].map((n) => {
      const f = analyseSecondOrder(beamColumn(L, P, q), { subdivisions: n }).analysis.memberForces(0, 0);
      return [relErr(f.M_major[5], exactM(P, L / 2)), relErr(-f.d_major[5], exactD(P))];
    });
    for (let i = 1; i < errs.length; i++) {
      expect(errs[i][0]).toBeLessThan(errs[i - 1][0] / 4);
      expect(errs[i][1]).toBeLessThan(errs[i - 1][1] / 4);
    }
    // one element misses P-δ entirely (−25 %); eight agree within 0.01 %
    expect(errs[0][0]).toBeGreaterThan(0.2);
    expect(errs[3][0]).toBeLessThan(1e-4);
    expect(errs[3][1]).toBeLessThan(1e-4);
  });

  it('tension stiffens: midspan deflection and moment fall below first order, as the sech formula says', () => {
    // Same source with k² → −k² (tension T): M_mid = q/k²·(1 − sech(kL/2)), δ_mid = q/(EI k⁴)·(sech(kL/2) − 1 + k²L²/8).
    const T = 0.5 * Pe, k = Math.sqrt(T / EI), sech = 1 / Math.cosh((k * L) / 2);
    const r = analyseSecondOrder(beamColumn(L, -T, q));
    const f = r.analysis.memberForces(0, 0);
    const d1 = (5 * q * L ** 4) / (384 * EI);
    expect(-f.d_major[5]).toBeLessThan(d1);
    expect(relErr(-f.d_major[5], (q / (EI * k ** 4)) * (sech - 1 + (k * k * L * L) / 8))).toBeLessThan(0.005);
    expect(relErr(f.M_major[5], (q / k ** 2) * (1 - sech))).toBeLessThan(0.005);
    expect(r.loadings[0].converged).toBe(true);
  });
});

describe('sway portal frame (fixed bases, stiff beam)', () => {
  // Columns h = 4 m (I = 1e-4 m⁴), beam 8 m with I = 1e-1 m⁴ (1000× stiffer: the column tops
  // do not rotate), gravity P on each column top, lateral H at the beam.
  // Exact: each column is antisymmetric about mid-height, so each half is the cantilever of
  // Timoshenko & Gere (1.11) of length h/2 with tip shear H/2: end moment M = (H/2)·tan(u)/k,
  // u = k h/2, drift Δ = 2·(H/2)(tan u − u)/(P k). So the column moments grow by tan(u)/u over
  // the first-order Hh/4, and the drift by 3(tan u − u)/u³. AISC 360-22 Appendix 8 (A-8-6) B2 =
  // 1/(1 − ΣP/ΣPe,story) with Pe = π²EI/(K h)², K = 1 for a sway column with both ends fixed
  // against rotation (from memory), predicts the drift amplification (within 1 % here).
  const h = 4, b = 8, H = 10e3;
  function portal(P: number): Model {
    return new ModelBuilder({ planeNormal: 'Y' })
      .section('BEAM', { A: 0.1, I_major: 1e-1 })
      .node('A', 0, 0, 0).node('B', b, 0, 0).node('C', 0, 0, h).node('D', b, 0, h)
      .support('A', 'fixed').support('B', 'fixed')
      .member('C1', 'A', 'C').member('C2', 'B', 'D').member('BM', 'C', 'D', { section: 'BEAM' })
      .loadCase('G').loadCase('W')
      .nodeLoad('G', 'C', { fz: -P }).nodeLoad('G', 'D', { fz: -P }).nodeLoad('W', 'C', { fx: H })
      .combination('ULS-1', { G: 1, W: 1 })
      .build();
  }
  const Pe = (Math.PI ** 2 * EI) / (h * h);

  for (const ratio of [0.1, 0.3, 0.5]) {
    it(`P = ${ratio}·Pe per column: base moments × tan(u)/u within 0.5 %, drift × B2 within 1 %`, () => {
      const P = ratio * Pe, k = Math.sqrt(P / EI), u = (k * h) / 2;
      const model = portal(P);
      const first = analyse(model);
      const r = analyseSecondOrder(model);
      const l = 2; // cases G, W, then ULS-1
      expect(r.analysis.loadings[l].id).toBe('ULS-1');
      const M1 = Math.abs(first.memberForces(0, l).M_major[0]), M2 = Math.abs(r.analysis.memberForces(0, l).M_major[0]);
      expect(relErr(M1, (H * h) / 4)).toBeLessThan(0.005);
      expect(relErr(M2 / M1, Math.tan(u) / u)).toBeLessThan(0.005);
      // both columns alike (axial forces differ only by the small overturning part Hh/b)
      expect(relErr(Math.abs(r.analysis.memberForces(1, l).M_major[0]), M2)).toBeLessThan(0.005);
      const drift1 = first.displacements(l)[2 * 6], drift2 = r.analysis.displacements(l)[2 * 6];
      expect(relErr(drift2 / drift1, (3 * (Math.tan(u) - u)) / u ** 3)).toBeLessThan(0.005);
      expect(relErr(drift2 / drift1, 1 / (1 - (2 * P) / (2 * Pe)))).toBeLessThan(0.01);
      expect(relErr(r.loadings[0].amplification!, drift2 / drift1)).toBeLessThan(0.01);
      // equilibrium on the displaced geometry: residual of the order of the drift angle squared
      expect(r.analysis.diagnostics.equilibrium[l].residual).toBeLessThan(1e-4);
      // the cases keep their first-order results (not second-order loadings)
      expect(r.loadings.map((x) => x.loading)).toEqual(['ULS-1']);
      expect(relErr(r.analysis.displacements(1)[12], first.displacements(1)[12])).toBeLessThan(1e-9);
    });
  }

  it('above the critical load the combination is refused by name with αcr', () => {
    // 1.25·Pe per column: αcr = 1/1.25 = 0.80 (sway buckling of the fixed-guided columns, K = 1)
    const model = portal(1.25 * Pe);
    let caught: unknown;
    try { analyseSecondOrder(model); } catch (e) { caught = e; }
    expect(caught).toBeInstanceOf(SecondOrderInstabilityError);
    const err = caught as SecondOrderInstabilityError;
    expect(err.loading).toBe('ULS-1');
    expect(err.message).toBe(`combination ULS-1 is not stable at this load level: αcr = ${err.alphaCr.toFixed(2)}`);
    expect(err.approximate).toBe(false);
    // eigen solution of the failing K + α K_G; the stiff beam lets the tops rotate a little (≤ 0.5 %)
    expect(Math.abs(err.alphaCr - 0.8)).toBeLessThan(0.005 * 0.8);
  });
});

describe('options and contract', () => {
  const L = 5, Pcr = (Math.PI ** 2 * EI) / (4 * L * L);

  it('loadScale: analysed at α × loads, results ÷ α (AISC ASD at 1.6)', () => {
    const P = 0.4 * Pcr, H = 10e3, a = 1.6, k = Math.sqrt((a * P) / EI);
    const r = analyseSecondOrder(cantileverColumn(L, P, H), { loadScale: a });
    // exact at the scaled load, divided by α (Timoshenko & Gere 1.11 as above)
    const M = (a * H * Math.tan(k * L)) / k / a;
    expect(relErr(Math.abs(r.analysis.memberForces(0, 0).M_major[0]), M)).toBeLessThan(0.005);
    expect(relErr(r.analysis.memberForces(0, 0).N[0], -P)).toBeLessThan(1e-9);
  });

  it('stiffness factors: 0.8·EI gives the exact answer of the reduced column; the rule sees N at the analysed level', () => {
    const P = 0.4 * Pcr, H = 10e3, k = Math.sqrt(P / (0.8 * EI));
    const seen: number[] = [];
    const r = analyseSecondOrder(cantileverColumn(L, P, H), {
      loadScale: 1.6,
      stiffness: (_mi, N) => { seen.push(N); return { EA: 0.8, EI: 0.8 }; },
      loadingOptions: () => ({ loadScale: 1 }),
    });
    expect(relErr(r.analysis.displacements(0)[6], (H * (Math.tan(k * L) - k * L)) / (P * k))).toBeLessThan(0.005);
    expect(relErr(seen[0], -P)).toBeLessThan(1e-9);
  });

  it('a loading without axial force gives the first-order results exactly', () => {
    const model = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 6, 0, 0)
      .support('A', 'fixed').support('B', 'ux uy uz').member('M', 'A', 'B')
      .loadCase('D').memberLoad('D', 'M', 'point', 'global_z', -20e3, { a: 2 }).build();
    const f1 = analyse(model).memberForces(0, 0);
    const f2 = analyseSecondOrder(model).analysis.memberForces(0, 0);
    expect(Array.from(f2.x)).toEqual(Array.from(f1.x));
    for (const key of ['M_major', 'V_major', 'd_major'] as const) {
      const big = Math.max(...Array.from(f1[key], Math.abs));
      for (let i = 0; i < f1.x.length; i++) expect(Math.abs(f2[key][i] - f1[key][i])).toBeLessThanOrEqual(1e-6 * big);
    }
  });

  it('reports iterations and convergence: the sway portal converges in a few iterations, one iteration is not enough', () => {
    // the overturning part of the column axial forces grows with the sway, so N changes between iterations
    const h = 4, b = 4, P = 2e6, H = 200e3;
    const model = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', b, 0, 0).node('C', 0, 0, h).node('D', b, 0, h)
      .support('A', 'fixed').support('B', 'fixed')
      .member('C1', 'A', 'C').member('C2', 'B', 'D').member('BM', 'C', 'D')
      .loadCase('D').nodeLoad('D', 'C', { fz: -P, fx: H }).nodeLoad('D', 'D', { fz: -P }).build();
    const full = analyseSecondOrder(model).loadings[0];
    expect(full.converged).toBe(true);
    expect(full.change).toBeLessThanOrEqual(SECOND_ORDER_DEFAULTS.tolerance);
    expect(full.iterations).toBeGreaterThanOrEqual(2);
    expect(full.iterations).toBeLessThanOrEqual(6);
    const one = analyseSecondOrder(model, { maxIterations: 1 }).loadings[0];
    expect(one.converged).toBe(false);
    expect(one.iterations).toBe(1);
    expect(one.change).toBeGreaterThan(SECOND_ORDER_DEFAULTS.tolerance);
  });

  it('refuses moving loads with a message', () => {
    const m = cantileverColumn(L, 1e3, 1e3);
    expect(() => analyseSecondOrder({ ...m, movingLoads: [{} as never] })).toThrow(MOVING_LOADS_REFUSED);
  });

  it('names an unknown second-order loading', () => {
    expect(() => analyseSecondOrder(cantileverColumn(L, 1e3, 1e3), { secondOrderLoadings: ['ULS-9'] })).toThrow(/loading ULS-9 does not exist/);
  });
});

describe('truss members and prescribed displacements', () => {
  it('a leaning (truss) column adds its P-Δ shear to the cantilever that holds it, as the closed form says (0.5 %)', () => {
    // Cantilever column (fixed base, P1, H at the top) tied by a truss link to a pinned truss
    // column carrying P2: the leaning column's string stiffness gives a lateral pull P2·Δ/h on the
    // cantilever (statics of the pinned bar), so with f = (tan kh − kh)/(P1 k) (Timoshenko & Gere
    // 1.11, from memory) the sway is Δ = H f / (1 − P2 f/h) and the base moment (H + P2 Δ/h)·tan(kh)/k.
    const h = 5, b = 4, Pcr = (Math.PI ** 2 * EI) / (4 * h * h), P1 = 0.3 * Pcr, P2 = 0.3 * Pcr, H = 10e3;
    const model = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', 0, 0, h).node('C', b, 0, 0).node('D', b, 0, h)
      .support('A', 'fixed').support('C', 'ux uy uz')
      .member('COL', 'A', 'B').member('LEAN', 'C', 'D', { type: 'truss' }).member('LINK', 'B', 'D', { type: 'truss' })
      .loadCase('D').nodeLoad('D', 'B', { fz: -P1, fx: H }).nodeLoad('D', 'D', { fz: -P2 }).build();
    const k = Math.sqrt(P1 / EI), f = (Math.tan(k * h) - k * h) / (P1 * k);
    const sway = (H * f) / (1 - (P2 * f) / h);
    const r = analyseSecondOrder(model);
    expect(relErr(r.analysis.displacements(0)[6], sway)).toBeLessThan(0.005);
    const M = ((H + (P2 * sway) / h) * Math.tan(k * h)) / k;
    expect(relErr(Math.abs(r.analysis.memberForces(0, 0).M_major[0]), M)).toBeLessThan(0.005);
    // the link carries the pull P2·Δ/h (compression in the link as the leaning column pushes the cantilever)
    expect(relErr(Math.abs(r.analysis.memberForces(2, 0).N[0]), (P2 * sway) / h)).toBeLessThan(0.005);
  });

  it('a settlement that rotates a compressed pinned beam rigidly bends nothing; the supports take P·θ', () => {
    // Rigid rotation θ = s/L of a straight bar under axial P: no curvature, M = 0; the rotated axial
    // force has the transverse component P·θ (linearised statics), taken by the supports.
    const L = 6, P = 0.3 * ((Math.PI ** 2 * EI) / (L * L)), s = -0.02;
    const model = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'ux uy uz').support('B', 'uy uz').member('M', 'A', 'B')
      .loadCase('D').nodeLoad('D', 'B', { fx: -P }).settlement('D', 'B', { uz: s }).build();
    const r = analyseSecondOrder(model);
    const f = r.analysis.memberForces(0, 0);
    for (let i = 0; i < f.x.length; i++) {
      expect(Math.abs(f.M_major[i])).toBeLessThanOrEqual(1e-6 * P * Math.abs(s));
      expect(Math.abs(f.d_major[i])).toBeLessThanOrEqual(1e-9);
    }
    expect(relErr(Math.abs(r.analysis.reactions(0)[6 + 2]), (P * Math.abs(s)) / L)).toBeLessThan(1e-6);
    expect(relErr(r.analysis.displacements(0)[6 + 2], s)).toBeLessThan(1e-12);
  });
});

describe('refusal and equilibrium', () => {
  it('a case above its critical load (no combinations) is refused by name, with the load scale shown', () => {
    // cantilever column: Pcr = π²EI/(4L²) (Euler, Timoshenko & Gere 2.1); P = 0.75·Pcr at 1.6× → αcr = 1/1.2
    const L = 5, Pcr = (Math.PI ** 2 * EI) / (4 * L * L);
    let caught: unknown;
    try { analyseSecondOrder(cantileverColumn(L, 0.75 * Pcr, 1e3), { loadScale: 1.6 }); } catch (e) { caught = e; }
    const err = caught as SecondOrderInstabilityError;
    expect(err).toBeInstanceOf(SecondOrderInstabilityError);
    expect(err.message).toBe(`case D is not stable at this load level (loads × 1.6): αcr = ${err.alphaCr.toFixed(2)}`);
    expect(relErr(err.alphaCr, 1 / 1.2)).toBeLessThan(0.005);
  });

  it('a pinned column held at both ends above its Euler load buckles between its ends: refused with αcr = Pe/P', () => {
    // Euler (Timoshenko & Gere 2.1): Pe = π²EI/L²; P = 1.2·Pe → αcr = 0.83 (the 6 sub-elements: +0.01 %)
    const L = 5, Pe = (Math.PI ** 2 * EI) / (L * L);
    const model = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, L)
      .support('A', 'ux uy uz').support('B', 'ux uy').member('C', 'A', 'B')
      .loadCase('D').nodeLoad('D', 'B', { fz: -1.2 * Pe }).build();
    expect(() => analyseSecondOrder(model)).toThrow('case D is not stable at this load level: αcr = 0.83');
  });

  it('member loads, an axial point load at a sub-element node and self weight: forces balance exactly, moments on the displaced geometry to 2θ²', () => {
    const h = 4, b = 8;
    const model = new ModelBuilder({ planeNormal: 'Y' })
      .material('heavy', { density: 7850 })
      .node('A', 0, 0, 0).node('B', b, 0, 0).node('C', 0, 0, h).node('D', b, 0, h)
      .support('A', 'fixed').support('B', 'pinned')
      .member('C1', 'A', 'C', { material: 'heavy' }).member('C2', 'B', 'D', { material: 'heavy', releaseStart: 'pinned' })
      .member('BM', 'C', 'D', { material: 'heavy' })
      .loadCase('G', 1).loadCase('W')
      .memberLoad('G', 'BM', 'uniform', 'global_z', -200e3).memberLoad('W', 'C1', 'uniform', 'global_x', 5e3)
      .memberLoad('G', 'C2', 'point', 'global_z', -300e3, { a: 2 })
      .combination('ULS', { G: 1.2, W: 1.5 })
      .build();
    const r = analyseSecondOrder(model);
    const eq = r.analysis.diagnostics.equilibrium.find((e) => e.loading === 'ULS')!;
    for (let k = 0; k < 3; k++) expect(Math.abs(eq.applied[k] + eq.reactions[k])).toBeLessThanOrEqual(1e-9 * Math.abs(eq.applied[2]));
    // the linearised geometric stiffness balances moments on the displaced geometry up to terms of
    // the order of the rotations squared (θ the drift angle, here ≈ 1/40; 0.05·θ² measured, bound 0.2·θ²;
    // an axial force off by a load in one sub-element leaves ≈ 0.4·θ² here)
    const theta = r.analysis.displacements(2)[12] / h;
    expect(eq.residual).toBeLessThan(0.2 * theta * theta);
    expect(r.loadings[0].converged).toBe(true);
    // the second-order sway exceeds the first-order one
    expect(r.loadings[0].amplification!).toBeGreaterThan(1);
    // joint equilibrium about Y at C and D: the column's top moment from the statics of its deformed
    // free body (self weight along it, an axial point load in C2) equals the beam's end moment, 1e-4
    const c1 = r.analysis.memberForces(0, 2), c2 = r.analysis.memberForces(1, 2), bm = r.analysis.memberForces(2, 2);
    const top = (f: typeof c1) => f.M_major[f.x.length - 1];
    expect(relErr(top(c1), -bm.M_major[0])).toBeLessThan(1e-4);
    expect(relErr(top(c2), bm.M_major[bm.x.length - 1])).toBeLessThan(1e-4);
  });
});

describe('minor axis and any orientation in space', () => {
  it('beam-column bending about the minor axis (3D model): M_minor and d_minor within 0.5 %', () => {
    // Beam along X, Z up: local y = +Y; uniform load along −Y bends it about its minor axis (I_minor = 5e-5 m⁴).
    // Exact as above (Timoshenko & Gere 1.11, from memory) with EI_minor.
    const L = 6, EImin = STEEL_E * 5e-5, Pe = (Math.PI ** 2 * EImin) / (L * L), P = 0.5 * Pe, q = 5e3, k = Math.sqrt(P / EImin);
    const model = new ModelBuilder().node('A', 0, 0, 0).node('B', L, 0, 0)
      .support('A', 'ux uy uz rx').support('B', 'uy uz').member('M', 'A', 'B')
      .loadCase('D').nodeLoad('D', 'B', { fx: -P }).memberLoad('D', 'M', 'uniform', 'global_y', -q).build();
    const f = analyseSecondOrder(model).analysis.memberForces(0, 0);
    const Mmid = (q / k ** 2) * (1 / Math.cos((k * L) / 2) - 1);
    const dmid = (q / (EImin * k ** 4)) * (1 / Math.cos((k * L) / 2) - 1 - (k * k * L * L) / 8);
    expect(relErr(f.M_minor[5], Mmid)).toBeLessThan(0.005);
    expect(relErr(-f.d_minor[5], dmid)).toBeLessThan(0.005);
    for (const v of f.M_major) expect(Math.abs(v)).toBeLessThan(1e-6 * Mmid);
  });

  it('a cantilever column leaning along (1, 2, 2)/3 behaves as the vertical one (tip sway and base moment within 0.5 %)', () => {
    // Same section about both axes (I = 1e-4 m⁴), P along the member, H perpendicular to it:
    // Timoshenko & Gere 1.11 as for the vertical column; results independent of orientation.
    const L = 5, e = [1 / 3, 2 / 3, 2 / 3], n = [2 / Math.sqrt(5), -1 / Math.sqrt(5), 0];
    const Pcr = (Math.PI ** 2 * EI) / (4 * L * L), P = 0.5 * Pcr, H = 10e3, k = Math.sqrt(P / EI);
    const model = new ModelBuilder().section('SQ', { I_major: 1e-4, I_minor: 1e-4 })
      .node('A', 0, 0, 0).node('B', L * e[0], L * e[1], L * e[2]).support('A', 'fixed')
      .member('C', 'A', 'B', { section: 'SQ' }).loadCase('D')
      .nodeLoad('D', 'B', { fx: -P * e[0] + H * n[0], fy: -P * e[1] + H * n[1], fz: -P * e[2] + H * n[2] }).build();
    const r = analyseSecondOrder(model);
    const u = r.analysis.displacements(0);
    const sway = u[6] * n[0] + u[7] * n[1] + u[8] * n[2];
    expect(relErr(sway, (H * (Math.tan(k * L) - k * L)) / (P * k))).toBeLessThan(0.005);
    const f = r.analysis.memberForces(0, 0);
    expect(relErr(Math.hypot(f.M_major[0], f.M_minor[0]), (H * Math.tan(k * L)) / k)).toBeLessThan(0.005);
    expect(relErr(f.N[0], -P)).toBeLessThan(1e-3);
  });
});
