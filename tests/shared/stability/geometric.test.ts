import { describe, expect, it } from 'vitest';
import { NO_RELEASES, type EndReleases } from '../../../shared/engine/element.js';
import { buildSystem } from '../../../shared/engine/system.js';
import { factorise } from '../../../shared/solver/index.js';
import { SingularMatrixError } from '../../../shared/solver/types.js';
import type { Release } from '../../../shared/model/types.js';
import {
  assembleGeometricStiffness, elementAxialForces, elementGeometricGlobal, geometricScratch, localGeometricStiffness,
} from '../../../shared/stability/geometric.js';
import { clipLoadSet } from '../../../shared/engine/loadSet.js';
import { SECOND_ORDER_DEFAULTS } from '../../../shared/stability/second-order.js';
import { ModelBuilder, STEEL_E } from '../engine/builders.js';

const ALL_RELEASES: EndReleases[] = [
  NO_RELEASES,
  { startMajor: true, startMinor: false, endMajor: false, endMinor: false },
  { startMajor: false, startMinor: true, endMajor: false, endMinor: true },
  { startMajor: true, startMinor: true, endMajor: true, endMinor: true },
];

function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

/** the lowest α with K + α K_G singular, by bisection on the Cholesky factorisation (1e-6 relative). */
function criticalFactor(K: Float64Array, KG: Float64Array, pat: { K: { n: number; colPtr: Int32Array; rowIdx: Int32Array } }): number {
  const A = new Float64Array(K.length);
  const positive = (alpha: number): boolean => {
    for (let i = 0; i < A.length; i++) A[i] = K[i] + alpha * KG[i];
    try {
      factorise({ ...pat.K, values: A }, { ordering: 'amd' });
      return true;
    } catch (err) {
      if (err instanceof SingularMatrixError) return false;
      throw err;
    }
  };
  let lo = 0, hi = 1;
  while (positive(hi)) { lo = hi; hi *= 2; }
  while (hi - lo > 1e-6 * hi) {
    const mid = (lo + hi) / 2;
    if (positive(mid)) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe('geometric stiffness of one element', () => {
  it('is symmetric, local and global, with and without releases', () => {
    const k = new Float64Array(144);
    for (const rel of ALL_RELEASES) {
      for (const truss of [false, true]) {
        localGeometricStiffness(-1234.5, 2.7, truss, rel, k);
        for (let i = 0; i < 12; i++) for (let j = 0; j < 12; j++) expect(k[i * 12 + j]).toBeCloseTo(k[j * 12 + i], 9);
      }
    }
    const m = new ModelBuilder().node('A', 0, 0, 0).node('B', 1, 2, 3).member('M', 'A', 'B', { releaseStart: 'pinned' }).build();
    const sys = buildSystem(m, 16, {});
    const kg = new Float64Array(144);
    elementGeometricGlobal(sys.mesh, 0, -5e3, kg, 0, geometricScratch());
    // symmetry to rounding: |k_ij − k_ji| ≤ 1e-12 · max|k|
    const big = maxAbs(kg);
    for (let i = 0; i < 12; i++) for (let j = 0; j < 12; j++) expect(Math.abs(kg[i * 12 + j] - kg[j * 12 + i])).toBeLessThanOrEqual(1e-12 * big);
  });

  it('is zero for N = 0', () => {
    const k = new Float64Array(144);
    for (const rel of ALL_RELEASES) expect(maxAbs(localGeometricStiffness(0, 3, false, rel, k))).toBe(0);
  });

  it('gives no force for a rigid-body translation (global, skew member)', () => {
    const m = new ModelBuilder().node('A', 0, 0, 0).node('B', 1, 2, 3).member('M', 'A', 'B', { releaseEnd: 'pinned_major' })
      .member('T', 'A', 'B', { type: 'truss' }).build();
    const sys = buildSystem(m, 16, {});
    const kg = new Float64Array(144), s = geometricScratch();
    for (let e = 0; e < 2; e++) {
      elementGeometricGlobal(sys.mesh, e, 7e4, kg, 0, s);
      const big = maxAbs(kg);
      for (const t of [[1, 0, 0], [0, 1, 0], [0, 0, 1], [0.3, -0.7, 0.2]]) {
        const u = [...t, 0, 0, 0, ...t, 0, 0, 0];
        for (let i = 0; i < 12; i++) {
          let f = 0;
          for (let j = 0; j < 12; j++) f += kg[i * 12 + j] * u[j];
          expect(Math.abs(f)).toBeLessThanOrEqual(1e-12 * big);
        }
      }
    }
  });

  it('truss: N/L on the transverse translations, nothing along the axis', () => {
    const k = localGeometricStiffness(10, 2, true, NO_RELEASES, new Float64Array(144));
    // string stiffness N/L (I − e eᵀ), closed form
    expect(k[1 * 12 + 1]).toBeCloseTo(5, 12);
    expect(k[2 * 12 + 8]).toBeCloseTo(-5, 12);
    expect(k[0]).toBe(0);
  });
});

// Euler column, Z up, bending in the X–Z plane about the major axis; L = 5 m, I_major = 1e-4 m⁴.
const L = 5, EI = STEEL_E * 1e-4;
function column(base: string, top: string, releases: [Release, Release] = ['fixed', 'fixed']) {
  return new ModelBuilder({ planeNormal: 'Y' })
    .node('A', 0, 0, 0).node('B', 0, 0, L)
    .support('A', base).support('B', top)
    .member('C', 'A', 'B', { releaseStart: releases[0], releaseEnd: releases[1] })
    .build();
}

/** αcr for a unit compression (N = −1 in every element): the critical load itself. */
function eulerLoad(model: ReturnType<typeof column>, subdivisions: number): number {
  const sys = buildSystem(model, 16, {}, subdivisions);
  const KG = assembleGeometricStiffness(sys, new Float64Array(sys.mesh.nElements).fill(-1));
  return criticalFactor(sys.pat.K.values, KG, sys.pat);
}

describe('Euler loads from K + α K_G (8 sub-elements)', () => {
  // Euler (Timoshenko & Gere, Theory of Elastic Stability, 2.1–2.5): P = π²EI/(K L)², K the
  // effective length factor (1, 2, 0.699 (π²·2.046 EI/L²), 0.5). Tolerance 0.5 % relative.
  const pe = (Math.PI ** 2 * EI) / L ** 2;
  const cases: [string, ReturnType<typeof column>, number][] = [
    ['pinned–pinned', column('ux uy uz', 'ux uy'), pe],
    ['pinned–pinned by member end releases on fixed supports', column('fixed', 'ux uy ry', ['pinned', 'pinned']), pe],
    ['fixed–free', column('fixed', 'uy'), pe / 4],
    ['fixed–pinned', column('fixed', 'ux uy'), 2.0457 * pe],
    ['fixed–fixed (top slides vertically)', column('fixed', 'ux uy ry'), 4 * pe],
  ];
  for (const [name, model, exact] of cases) {
    it(`${name}: within 0.5 % (8 sub-elements, and the second-order default ${SECOND_ORDER_DEFAULTS.subdivisions})`, () => {
      for (const n of [8, SECOND_ORDER_DEFAULTS.subdivisions]) {
        const p = eulerLoad(model, n);
        expect(Math.abs(p - exact) / exact).toBeLessThan(0.005);
      }
    });
  }

  it('converges from above as the column is subdivided (pinned–pinned: 1, 2, 4, 8)', () => {
    const m = column('ux uy uz', 'ux uy');
    const errs = [1, 2, 4, 8].map((n) => (eulerLoad(m, n) - pe) / pe);
    // Rayleigh–Ritz with cubic shapes bounds from above; one element gives 12EI/L² (+21.6 %, closed form)
    expect(errs[0]).toBeCloseTo(12 / Math.PI ** 2 - 1, 4);
    for (let i = 1; i < errs.length; i++) { expect(errs[i]).toBeGreaterThan(0); expect(errs[i]).toBeLessThan(errs[i - 1]); }
  });
});

describe('element axial forces', () => {
  it('an axial point load at a sub-element node belongs wholly to the element that starts there (mean N by statics)', () => {
    // column of 2 sub-elements, Z up, axial point load P down at mid-height (the start of the upper
    // element); with u = 0 (the fixed state: the node at mid-height holds the load) no element
    // carries it: N̄ = −f1x − (1/h)Σ Px (h − s) = 0 by statics of the element (closed form)
    const P = 1000, L = 4;
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, L).support('A', 'fixed')
      .member('C', 'A', 'B').loadCase('D').memberLoad('D', 'C', 'point', 'global_z', -P, { a: L / 2 }).build();
    const sys = buildSystem(m, 16, {}, 2);
    const u = new Float64Array(sys.mesh.nNodes * 6);
    const fef = (e: number) => sys.fefOf(e, 0);
    const part = (e: number) => clipLoadSet(sys.loadSets[0]!, sys.mesh.elX0[e], sys.mesh.elX0[e] + sys.mesh.elL[e], e === 1);
    const exact = elementAxialForces(sys.mesh, u, fef, undefined, part);
    const ends = elementAxialForces(sys.mesh, u, fef);
    // the element that starts at the load: the load sits at its start, so along it N = 0 (tolerance 1e-9·P)
    const upper = 1;
    expect(Math.abs(exact[upper])).toBeLessThanOrEqual(1e-9 * P);
    // the mean of the end values would give half the load to it
    expect(Math.abs(ends[upper])).toBeCloseTo(P / 2, 6);
  });
});
