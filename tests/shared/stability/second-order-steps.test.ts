import { describe, expect, it } from 'vitest';
import { buildSystem } from '../../../shared/engine/system.js';
import { factorise } from '../../../shared/solver/index.js';
import { symmetricProduct } from '../../../shared/stability/csc-product.js';
import { assembleGeometricStiffness, elementAxialForces, geometricProduct } from '../../../shared/stability/geometric.js';
import { analyseSecondOrder } from '../../../shared/stability/second-order.js';
import { ModelBuilder } from '../engine/builders.js';

/** A two-bay sway frame, skew brace as a truss, a pinned beam end; two loadings (gravity and wind). */
function frame() {
  return new ModelBuilder({ planeNormal: 'Y' })
    .node('A', 0, 0, 0).node('B', 6, 0, 0).node('C', 12, 0, 0)
    .node('D', 0, 0, 4).node('E', 6, 0, 4).node('F', 12, 0, 4)
    .support('A', 'fixed').support('B', 'fixed').support('C', 'pinned')
    .member('C1', 'A', 'D').member('C2', 'B', 'E').member('C3', 'C', 'F')
    .member('B1', 'D', 'E').member('B2', 'E', 'F', { releaseEnd: 'pinned' })
    .member('T', 'B', 'F', { type: 'truss' })
    .loadCase('G').nodeLoad('G', 'D', { fz: -900e3 }).nodeLoad('G', 'E', { fz: -1400e3 }).nodeLoad('G', 'F', { fz: -700e3 })
    .loadCase('W').nodeLoad('W', 'D', { fx: 40e3, fy: 5e3 })
    .combination('U1', { G: 1.2, W: 1.6 }).combination('U2', { G: 1.4, W: 0.5 })
    .build();
}

describe('second-order iteration steps', () => {
  it('K_G(N)·x element by element equals the assembled K_G times x (frame, released and truss elements), 1e-12', () => {
    const sys = buildSystem(frame(), 16, {}, 6);
    const N = Float64Array.from({ length: sys.mesh.nElements }, (_, e) => -1e5 * (1 + (e % 7)) + 3e4 * (e % 3));
    const x = Float64Array.from({ length: sys.nEq }, (_, i) => Math.sin(1.7 * i + 0.3) * 1e-3);
    const KG = assembleGeometricStiffness(sys, N);
    const ref = symmetricProduct(sys.pat.K, KG, x, new Float64Array(sys.nEq));
    const y = new Float64Array(sys.nEq);
    geometricProduct(sys.mesh, sys.eq, N, x, y);
    let err = 0, big = 0;
    for (let i = 0; i < sys.nEq; i++) { err = Math.max(err, Math.abs(y[i] - ref[i])); big = Math.max(big, Math.abs(ref[i])); }
    expect(err).toBeLessThanOrEqual(1e-12 * big);
  });

  it('preconditioned steps reach the fixed point of factorising K + K_G(N) at every iteration: displacements within 1e-9', () => {
    // reference: the plain iteration (factorise the whole subdivided K + K_G(Nᵏ), solve, new N) to 1e-13
    const model = frame(), subdivisions = 6;
    const r = analyseSecondOrder(model, { tolerance: 1e-12, subdivisions });
    const sys = buildSystem(model, 16, {}, subdivisions);
    const nDof = sys.mesh.nNodes * 6;
    for (const id of ['U1', 'U2']) {
      const l = r.analysis.loadings.findIndex((x) => x.id === id);
      const terms = r.analysis.loadings[l].terms;
      const F = new Float64Array(sys.nEq);
      for (const { caseIndex: c, factor } of terms) for (let i = 0; i < sys.nEq; i++) F[i] += factor * sys.F[c * sys.nEq + i];
      const full = (X: Float64Array) => Float64Array.from({ length: nDof }, (_, g) => (sys.eq[g] >= 0 ? X[sys.eq[g]] : 0));
      let X = factorise(sys.pat.K).solve(F, 1);
      let N = elementAxialForces(sys.mesh, full(X));
      for (let k = 0; k < 50; k++) {
        const KG = assembleGeometricStiffness(sys, N);
        const A = Float64Array.from(sys.pat.K.values, (v, i) => v + KG[i]);
        X = factorise({ ...sys.pat.K, values: A }).solve(F, 1);
        const Nn = elementAxialForces(sys.mesh, full(X));
        let d = 0, big = 0;
        for (let e = 0; e < N.length; e++) { d = Math.max(d, Math.abs(Nn[e] - N[e])); big = Math.max(big, Math.abs(Nn[e])); }
        N = Nn;
        if (d <= 1e-13 * big) break;
      }
      const u = r.analysis.displacements(l), uRef = full(X);
      let err = 0, big = 0;
      for (let i = 0; i < u.length; i++) { err = Math.max(err, Math.abs(u[i] - uRef[i])); big = Math.max(big, Math.abs(uRef[i])); }
      expect(err).toBeLessThanOrEqual(1e-9 * big);
      expect(r.loadings.find((x) => x.loading === id)!.converged).toBe(true);
    }
  });
});

describe('geometric stiffness in global axes', () => {
  it('the closed form of an unreleased element equals the rotated local matrix (skew frame and truss members), 1e-12', async () => {
    const { localGeometricStiffness } = await import('../../../shared/stability/geometric.js');
    const { toGlobalStiffness } = await import('../../../shared/engine/element.js');
    const { elementGeometricGlobal, geometricScratch } = await import('../../../shared/stability/geometric.js');
    const model = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', 3, 2, 4).node('C', -1, 5, 2)
      .support('A', 'fixed').support('B', 'fixed').support('C', 'fixed')
      .member('F', 'A', 'B', { roll: 30 }).member('T', 'B', 'C', { type: 'truss' }).member('G', 'C', 'A')
      .loadCase('D').nodeLoad('D', 'B', { fz: -1 }).build();
    const sys = buildSystem(model, 16, {}, 1);
    const none = { startMajor: false, startMinor: false, endMajor: false, endMinor: false };
    const s = geometricScratch(), fast = new Float64Array(144), kl = new Float64Array(144), ref = new Float64Array(144), tmp = new Float64Array(144);
    for (let e = 0; e < sys.mesh.nElements; e++) {
      const m = sys.mesh.members[sys.mesh.elMember[e]];
      elementGeometricGlobal(sys.mesh, e, -2.5e5, fast, 0, s);
      localGeometricStiffness(-2.5e5, sys.mesh.elL[e], m.truss, none, kl);
      toGlobalStiffness(kl, m.R, ref, tmp, 0);
      let err = 0, big = 0;
      for (let i = 0; i < 144; i++) { err = Math.max(err, Math.abs(fast[i] - ref[i])); big = Math.max(big, Math.abs(ref[i])); }
      expect(err).toBeLessThanOrEqual(1e-12 * big);
    }
  });
});
