import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import type { Model } from '../../../shared/model/types.js';
import { at, ModelBuilder, relErr, STEEL_E } from './builders.js';

const E = STEEL_E, L = 4, P = 10e3;

/** Simpson's rule with n (even) intervals: the reference value of an integral. */
function simpson(f: (x: number) => number, a: number, b: number, n = 2000): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

function taperedCantilever(segments?: number): { model: Model; run: ReturnType<typeof analyse> } {
  const model = new ModelBuilder({ planeNormal: 'Y' })
    .section('S0', { I_major: 2e-4, A: 0.012 }).section('S1', { I_major: 0.5e-4, A: 0.006 })
    .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed')
    .member('M1', 'A', 'B', { section: 'S0', sectionEnd: 'S1' })
    .loadCase('D').nodeLoad('D', 'B', { fz: -P }).build();
  return { model, run: analyse(model, segments ? { taperSegments: segments } : {}) };
}

describe('tapered members', () => {
  // Custom sections: I varies linearly I(x) = I0 + kx, k = (I1 − I0)/L. Tip deflection by unit load:
  //   δ = ∫₀ᴸ P(L−x)²/(E I(x)) dx = P/(E k³) · [I1² ln(I1/I0) − 2 I1 (I1 − I0) + (I1² − I0²)/2]
  // (substitute u = I0 + kx). Tolerance: 0.5 % (the brief's convergence target).
  const I0 = 2e-4, I1 = 0.5e-4, k = (I1 - I0) / L;
  const exact = (P / (E * k ** 3)) * (I1 * I1 * Math.log(I1 / I0) - 2 * I1 * (I1 - I0) + (I1 * I1 - I0 * I0) / 2);

  it('linearly tapered cantilever: tip deflection within 0.5 % of the closed form', () => {
    const { run } = taperedCantilever();
    expect(relErr(-run.displacements(0)[6 + 2], exact)).toBeLessThan(0.005);
  });

  it('converges as the number of sub-elements grows', () => {
    const errs = [1, 2, 4, 16].map((n) => relErr(-taperedCantilever(n).run.displacements(0)[6 + 2], exact));
    // monotone convergence of the piecewise-uniform approximation (common practice); finest within 0.5 %
    expect(errs[3]).toBeLessThanOrEqual(errs[1]);
    expect(errs[3]).toBeLessThan(0.005);
  });

  it('reports forces and chord deflections along the whole tapered member', () => {
    const { run } = taperedCantilever();
    const f = run.memberForces(0, 0);
    expect(f.x.length).toBe(11);
    expect(f.x[10]).toBeCloseTo(L, 12);
    // statics: M(x) = −P(L − x) exactly (tolerance rel 1e-9)
    for (let i = 0; i < 11; i++) expect(f.M_major[i]).toBeCloseTo(-P * (L - f.x[i]), 4);
    // chord deflection at midspan from the elastic curve w(x) = −∫₀ˣ (x−s) P(L−s)/(E I(s)) ds minus the chord;
    // integral by Simpson (n = 2000); tolerance 0.5 %
    const w = (x: number) => -simpson((s) => ((x - s) * P * (L - s)) / (E * (I0 + k * s)), 0, x);
    const ref = w(L / 2) - w(L) / 2;
    expect(relErr(at(f.x, f.d_major, L / 2), ref)).toBeLessThan(0.005);
    expect(run.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });

  it('member loads on a tapered member are split over its pieces: UDL plus a point load at mid-length', () => {
    const w = 3e3, Pm = 4e3;
    const model = new ModelBuilder({ planeNormal: 'Y' })
      .section('S0', { I_major: I0, A: 0.012 }).section('S1', { I_major: I1, A: 0.006 })
      .node('A', 0, 0, 0).node('B', L, 0, 0).support('A', 'fixed')
      .member('M1', 'A', 'B', { section: 'S0', sectionEnd: 'S1' })
      .loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -w).memberLoad('D', 'M1', 'point', 'global_z', -Pm, { a: L / 2 }).build();
    const r = analyse(model);
    const f = r.memberForces(0, 0);
    // Statics of the cantilever: M(0) = −wL²/2 − Pm·L/2 (tolerance rel 1e-9); tip deflection by unit load
    //   δ = ∫₀ᴸ |M(x)|·(L − x)/(E I(x)) dx, M(x) = w(L−x)²/2 + Pm·⟨L/2 − x⟩ (Simpson, n = 2000); tolerance 0.5 %.
    expect(f.M_major[0] / (-(w * L * L) / 2 - (Pm * L) / 2)).toBeCloseTo(1, 9);
    const ref = simpson((x) => (((w * (L - x) ** 2) / 2 + (x < L / 2 ? Pm * (L / 2 - x) : 0)) * (L - x)) / (E * (I0 + k * x)), 0, L, 4000);
    expect(relErr(-r.displacements(0)[6 + 2], ref)).toBeLessThan(0.005);
    expect(r.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });

  it('dimensioned rectangle tapering in depth: dimensions interpolate, I = b·h(x)³/12', () => {
    const b = 0.2, h0 = 0.5, h1 = 0.25;
    const m = new ModelBuilder({ planeNormal: 'Y' }).build();
    const mkSec = (id: string, h: number) => ({
      id, shape: 'rect' as const, dims: { h, b },
      props: { A: b * h, I_major: (b * h ** 3) / 12, I_minor: (h * b ** 3) / 12, J: 1e-4, Cw: 0, S_major: 0, S_minor: 0, Z_major: 0, Z_minor: 0, Av_major: 0, Av_minor: 0, depth: h },
      given: [],
    });
    m.sections.push(mkSec('R0', h0), mkSec('R1', h1));
    m.nodes.push({ id: 'A', x: 0, y: 0, z: 0 }, { id: 'B', x: L, y: 0, z: 0 });
    m.supports.push({ node: 'A', restrained: [true, true, true, true, true, true], springs: [0, 0, 0, 0, 0, 0] });
    m.members.push({ id: 'M1', start: 'A', end: 'B', section: 'R0', sectionEnd: 'R1', material: 'steel', type: 'frame', roll: 0, releaseStart: 'fixed', releaseEnd: 'fixed', kMajor: 1, kMinor: 1 });
    m.cases.push({ id: 'D', category: 'dead', title: 'D', selfWeight: 0, mass: false });
    m.nodeLoads.push({ case: 'D', node: 'B', values: [0, 0, -P, 0, 0, 0] });
    const r = analyse(m);
    // δ = ∫₀ᴸ P(L−x)²/(E·b·h(x)³/12) dx with h linear (Simpson, n = 2000). Tolerance 0.5 %.
    const ref = simpson((x) => (P * (L - x) ** 2) / ((E * b * (h0 + ((h1 - h0) * x) / L) ** 3) / 12), 0, L);
    expect(relErr(-r.displacements(0)[6 + 2], ref)).toBeLessThan(0.005);
  });
});
