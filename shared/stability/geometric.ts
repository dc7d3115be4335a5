/**
 * Geometric stiffness of frame and truss elements from their axial force N (tension
 * positive), the part of the linearised second-order stiffness K + K_G(N) that the axial
 * force adds, and its assembly into the engine's lower-triangle CSC pattern.
 *
 * Frame element (Euler–Bernoulli, the cubic Hermite shapes of element.ts): the consistent
 * geometric stiffness K_G = N ∫ N'ᵀ N' dx in each bending plane,
 *   (N / 30L) · [ 36   3L  −36   3L ;  3L  4L²  −3L  −L² ; −36  −3L  36  −3L ;  3L  −L²  −3L  4L² ]
 * on (v1, θz1, v2, θz2) (θz = dv/dx), and the same with the w–θy couplings of opposite sign on
 * (w1, θy1, w2, θy2) because θy = −dw/dx (the sign pattern of element.ts). Axial and torsional
 * rows carry nothing: no Wagner (torsional-flexural) term, so torsional and lateral-torsional
 * buckling are not captured; flexural buckling and P-Δ / P-δ are.
 * Truss element: the string stiffness N/L · (I − e eᵀ) on the transverse translations.
 *
 * End releases: the released rotation is condensed out with the element's elastic stiffness,
 * u_r = −K_rr⁻¹ K_rc u_c, and K_G becomes Tᵀ K_G T with that map T — the consistent geometric
 * stiffness of the released element's own shapes. It stays linear in N (so (K + α K_G) φ = 0 is
 * a linear eigenproblem) and its released rows and columns are zero, as in the elastic matrix.
 * The map does not depend on EI (both rows of a plane scale with it), so no properties are needed.
 */
import { addElement, type Pattern } from '../engine/assembly.js';
import type { Mesh } from '../engine/discretise.js';
import { elementReleases } from '../engine/discretise.js';
import { type EndReleases, localStiffness, toGlobalStiffness } from '../engine/element.js';
import type { LoadSet } from '../engine/loadSet.js';

const UNIT = { EA: 1, EIy: 1, EIz: 1, GJ: 1 };
const NONE: EndReleases = { startMajor: false, startMinor: false, endMajor: false, endMinor: false };

/** Local 12×12 geometric stiffness (row-major) of a frame or truss element into k (zeroed here). */
export function localGeometricStiffness(N: number, L: number, truss: boolean, rel: EndReleases, k: Float64Array): Float64Array {
  k.fill(0);
  if (N === 0) return k;
  const set = (i: number, j: number, v: number) => {
    k[i * 12 + j] = v;
    k[j * 12 + i] = v;
  };
  const c = N / L;
  if (truss) {
    set(1, 1, c); set(7, 7, c); set(1, 7, -c);
    set(2, 2, c); set(8, 8, c); set(2, 8, -c);
    return k;
  }
  const a = (6 / 5) * c, b = (L / 10) * c, d = ((2 * L * L) / 15) * c, e = (-(L * L) / 30) * c;
  // minor-axis plane: v (1, 7), θz (5, 11)
  set(1, 1, a); set(7, 7, a); set(1, 7, -a);
  set(1, 5, b); set(1, 11, b); set(7, 5, -b); set(7, 11, -b);
  set(5, 5, d); set(11, 11, d); set(5, 11, e);
  // major-axis plane: w (2, 8), θy (4, 10); θy = −dw/dx flips the w–θ couplings
  set(2, 2, a); set(8, 8, a); set(2, 8, -a);
  set(2, 4, -b); set(2, 10, -b); set(8, 4, b); set(8, 10, b);
  set(4, 4, d); set(10, 10, d); set(4, 10, e);
  if (rel.startMajor || rel.startMinor || rel.endMajor || rel.endMinor) condenseGeometric(k, L, rel);
  return k;
}

/** K_G ← Tᵀ K_G T, T the elastic condensation map of the released rotations (see the file header). */
function condenseGeometric(kG: Float64Array, L: number, rel: EndReleases): void {
  const r: number[] = [];
  if (rel.startMajor) r.push(4);
  if (rel.startMinor) r.push(5);
  if (rel.endMajor) r.push(10);
  if (rel.endMinor) r.push(11);
  const ke = localStiffness(UNIT, L, false, NONE, new Float64Array(144));
  // T = I with rows r replaced by −K_rr⁻¹ K_rc (columns r zero): Gauss–Jordan on [K_rr | K_r,all]
  const m = r.length;
  const A = r.map((i) => r.map((j) => ke[i * 12 + j]));
  const B = r.map((i) => Array.from({ length: 12 }, (_, j) => (r.includes(j) ? 0 : -ke[i * 12 + j])));
  for (let p = 0; p < m; p++) {
    const piv = A[p][p];
    for (let j = 0; j < m; j++) A[p][j] /= piv;
    for (let j = 0; j < 12; j++) B[p][j] /= piv;
    for (let q = 0; q < m; q++) {
      if (q === p || A[q][p] === 0) continue;
      const f = A[q][p];
      for (let j = 0; j < m; j++) A[q][j] -= f * A[p][j];
      for (let j = 0; j < 12; j++) B[q][j] -= f * B[p][j];
    }
  }
  const T = new Float64Array(144);
  for (let i = 0; i < 12; i++) T[i * 13] = 1;
  r.forEach((i, p) => { for (let j = 0; j < 12; j++) T[i * 12 + j] = B[p][j]; });
  // kG ← Tᵀ (kG T)
  const KT = new Float64Array(144);
  for (let i = 0; i < 12; i++) {
    for (let j = 0; j < 12; j++) {
      let s = 0;
      for (let q = 0; q < 12; q++) s += kG[i * 12 + q] * T[q * 12 + j];
      KT[i * 12 + j] = s;
    }
  }
  for (let i = 0; i < 12; i++) {
    for (let j = 0; j < 12; j++) {
      let s = 0;
      for (let q = 0; q < 12; q++) s += T[q * 12 + i] * KT[q * 12 + j];
      kG[i * 12 + j] = s;
    }
  }
  // exact zeros on the released rows and columns (rounding)
  for (const i of r) for (let j = 0; j < 12; j++) { kG[i * 12 + j] = 0; kG[j * 12 + i] = 0; }
}

/** Scratch for elementGeometricGlobal (two 144-long arrays). */
export interface GeometricScratch {
  kl: Float64Array;
  tmp: Float64Array;
}

export function geometricScratch(): GeometricScratch {
  return { kl: new Float64Array(144), tmp: new Float64Array(144) };
}

/** Global 12×12 geometric stiffness (row-major) of mesh element e for axial force N into kg at off. */
export function elementGeometricGlobal(mesh: Mesh, e: number, N: number, kg: Float64Array, off: number, s: GeometricScratch): void {
  const m = mesh.members[mesh.elMember[e]];
  if (mesh.elRel[e] === 0 || m.truss) {
    unreleasedGeometricGlobal(N, mesh.elL[e], m.truss, m.R, kg, off);
    return;
  }
  localGeometricStiffness(N, mesh.elL[e], m.truss, elementReleases(mesh.elRel[e]), s.kl);
  toGlobalStiffness(s.kl, m.R, kg, s.tmp, off);
}

/**
 * The rotated local matrix in closed form, for an element without releases: with x the
 * element axis (global), Q = I − x xᵀ and M r = r × x (the local [0, θz, −θy] couplings),
 * blocks on (t1, r1, t2, r2): tt ±(6/5)(N/L)·Q, tr ±(N/10)·M, r1r1 = r2r2 = (2L/15)N·Q,
 * r1r2 = −(L/30)N·Q; a truss only ±(N/L)·Q on the translations.
 */
function unreleasedGeometricGlobal(N: number, L: number, truss: boolean, R: ArrayLike<number>, kg: Float64Array, off: number): void {
  kg.fill(0, off, off + 144);
  if (N === 0) return;
  const x0 = R[0], x1 = R[1], x2 = R[2], c = N / L;
  const a = truss ? c : (6 / 5) * c, b = (L / 10) * c, d = ((2 * L * L) / 15) * c, e = (-(L * L) / 30) * c;
  const x = [x0, x1, x2];
  const M = [0, x2, -x1, -x2, 0, x0, x1, -x0, 0];
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      const q = (i === j ? 1 : 0) - x[i] * x[j];
      const t1 = off + i * 12, t2 = off + (6 + i) * 12;
      kg[t1 + j] = a * q; kg[t1 + 6 + j] = -a * q; kg[t2 + j] = -a * q; kg[t2 + 6 + j] = a * q;
      if (truss) continue;
      const r1 = off + (3 + i) * 12, r2 = off + (9 + i) * 12;
      kg[r1 + 3 + j] = d * q; kg[r2 + 9 + j] = d * q; kg[r1 + 9 + j] = e * q; kg[r2 + 3 + j] = e * q;
      const bm = b * M[i * 3 + j];
      kg[t1 + 3 + j] = bm; kg[t1 + 9 + j] = bm; kg[t2 + 3 + j] = -bm; kg[t2 + 9 + j] = -bm;
      kg[off + (3 + j) * 12 + i] = bm; kg[off + (9 + j) * 12 + i] = bm; kg[off + (3 + j) * 12 + 6 + i] = -bm; kg[off + (9 + j) * 12 + 6 + i] = -bm;
    }
  }
}

/**
 * Σ K_G,e(N_e) over the mesh's elements, as a values array aligned with `pat.K` (same
 * lower-triangle CSC pattern as the engine's stiffness; zero-filled here). `axial[e]` is the
 * axial force of element e (tension positive), e.g. from `elementAxialForces`.
 */
export function assembleGeometricStiffness(
  sys: { mesh: Mesh; eq: Int32Array; pat: Pattern }, axial: ArrayLike<number>, out?: Float64Array,
): Float64Array {
  const { mesh, eq, pat } = sys;
  const values = out ?? new Float64Array(pat.K.values.length);
  values.fill(0);
  const target: Pattern = { ...pat, K: { ...pat.K, values } };
  const kg = new Float64Array(144), s = geometricScratch();
  for (let e = 0; e < mesh.nElements; e++) {
    const N = axial[e];
    if (N === 0) continue;
    elementGeometricGlobal(mesh, e, N, kg, 0, s);
    addElement(target, eq, e, mesh.elStart[e], mesh.elEnd[e], kg, 0);
  }
  return values;
}

/**
 * y += K_G(N)·x element by element, without assembling K_G: x and y indexed by equation (`eq`,
 * prescribed freedoms read as 0). Unreleased frame and truss elements in local axes from the
 * closed form above; elements with end releases through their global matrix.
 */
export function geometricProduct(mesh: Mesh, eq: Int32Array, axial: ArrayLike<number>, x: Float64Array, y: Float64Array): void {
  const ug = new Float64Array(12), ul = new Float64Array(12), fl = new Float64Array(12), fg = new Float64Array(12);
  const kg = new Float64Array(144), s = geometricScratch();
  const { elStart, elEnd, elMember, elRel, elL, members } = mesh;
  for (let e = 0; e < mesh.nElements; e++) {
    const N = axial[e];
    if (N === 0) continue;
    const a = elStart[e] * 6, b = elEnd[e] * 6;
    for (let k = 0; k < 6; k++) {
      const ea = eq[a + k], eb = eq[b + k];
      ug[k] = ea >= 0 ? x[ea] : 0;
      ug[6 + k] = eb >= 0 ? x[eb] : 0;
    }
    const m = members[elMember[e]];
    if (elRel[e] !== 0 && !m.truss) {
      elementGeometricGlobal(mesh, e, N, kg, 0, s);
      for (let i = 0; i < 12; i++) {
        let t = 0;
        for (let j = 0; j < 12; j++) t += kg[i * 12 + j] * ug[j];
        fg[i] = t;
      }
    } else {
      const R = m.R, L = elL[e], c = N / L;
      for (let o = 0; o < 12; o += 3) {
        const p = ug[o], q = ug[o + 1], r = ug[o + 2];
        ul[o] = R[0] * p + R[1] * q + R[2] * r;
        ul[o + 1] = R[3] * p + R[4] * q + R[5] * r;
        ul[o + 2] = R[6] * p + R[7] * q + R[8] * r;
      }
      fl.fill(0);
      if (m.truss) {
        fl[1] = c * (ul[1] - ul[7]); fl[7] = -fl[1];
        fl[2] = c * (ul[2] - ul[8]); fl[8] = -fl[2];
      } else {
        const A = (6 / 5) * c, B = (L / 10) * c, D = ((2 * L * L) / 15) * c, E = (-(L * L) / 30) * c;
        const v1 = ul[1], tz1 = ul[5], v2 = ul[7], tz2 = ul[11];
        fl[1] = A * (v1 - v2) + B * (tz1 + tz2);
        fl[7] = -fl[1];
        fl[5] = B * (v1 - v2) + D * tz1 + E * tz2;
        fl[11] = B * (v1 - v2) + E * tz1 + D * tz2;
        const w1 = ul[2], ty1 = ul[4], w2 = ul[8], ty2 = ul[10];
        fl[2] = A * (w1 - w2) - B * (ty1 + ty2);
        fl[8] = -fl[2];
        fl[4] = -B * (w1 - w2) + D * ty1 + E * ty2;
        fl[10] = -B * (w1 - w2) + E * ty1 + D * ty2;
      }
      for (let o = 0; o < 12; o += 3) {
        const p = fl[o], q = fl[o + 1], r = fl[o + 2];
        fg[o] = R[0] * p + R[3] * q + R[6] * r;
        fg[o + 1] = R[1] * p + R[4] * q + R[7] * r;
        fg[o + 2] = R[2] * p + R[5] * q + R[8] * r;
      }
    }
    for (let k = 0; k < 6; k++) {
      const ea = eq[a + k], eb = eq[b + k];
      if (ea >= 0) y[ea] += fg[k];
      if (eb >= 0) y[eb] += fg[6 + k];
    }
  }
}

/**
 * Axial force of every element (tension positive) from full node displacements `u` (nNodes × 6,
 * global) and the element's fixed-end forces (local, may be undefined): its mean along the
 * element, N̄ = (1/h)∫N dx, so an element under an axial span load carries its average.
 * Without `axialLoads` the mean of the two end values (exact for uniform axial loads); with the
 * element's own load set (local, positions from the element start, as clipLoadSet gives) the
 * exact mean, N̄ = −f1x − (1/h)·(Σ Px·(h − s) + ∫ (h − s)·qx ds) — which matters for a point load
 * at a sub-element's start (it belongs wholly to that element).
 * `eaFactor[e]`, when given, multiplies the element's EA (reduced stiffness of a design method).
 */
export function elementAxialForces(
  mesh: Mesh, u: ArrayLike<number>, fef?: (e: number) => ArrayLike<number> | undefined, eaFactor?: ArrayLike<number>,
  axialLoads?: (e: number) => LoadSet | undefined,
): Float64Array {
  const out = new Float64Array(mesh.nElements);
  for (let e = 0; e < mesh.nElements; e++) {
    const R = mesh.members[mesh.elMember[e]].R;
    const a = mesh.elStart[e] * 6, b = mesh.elEnd[e] * 6;
    const du = R[0] * (u[b] - u[a]) + R[1] * (u[b + 1] - u[a + 1]) + R[2] * (u[b + 2] - u[a + 2]);
    let N = ((eaFactor ? eaFactor[e] : 1) * mesh.elProps[e * 5] / mesh.elL[e]) * du;
    const f = fef?.(e);
    const ls = f ? axialLoads?.(e) : undefined;
    if (f && ls) N += meanFixedAxial(ls, f[0], mesh.elL[e]);
    else if (f) N += (f[6] - f[0]) / 2;
    out[e] = N;
  }
  return out;
}

/**
 * The fixed-end part of elementAxialForces for one element: f its fixed-end forces (local),
 * ls its own load set when that carries axial loads (exact mean), otherwise the mean of the ends.
 */
export function fixedMeanAxial(f: ArrayLike<number>, ls: LoadSet | undefined, h: number): number {
  return ls ? meanFixedAxial(ls, f[0], h) : (f[6] - f[0]) / 2;
}

/**
 * elementAxialForces with the fixed-end part given per element (`fixed[e]`, from
 * fixedMeanAxial; linear in the loads, so a combination's is the factored sum of its cases'),
 * into `out`.
 */
export function axialForcesWithFixed(mesh: Mesh, u: ArrayLike<number>, fixed: Float64Array, eaFactor: ArrayLike<number> | undefined, out: Float64Array): Float64Array {
  const { elStart, elEnd, elMember, elProps, elL, members } = mesh;
  for (let e = 0; e < mesh.nElements; e++) {
    const R = members[elMember[e]].R;
    const a = elStart[e] * 6, b = elEnd[e] * 6;
    const du = R[0] * (u[b] - u[a]) + R[1] * (u[b + 1] - u[a + 1]) + R[2] * (u[b + 2] - u[a + 2]);
    out[e] = ((eaFactor ? eaFactor[e] : 1) * elProps[e * 5] / elL[e]) * du + fixed[e];
  }
  return out;
}

/** (1/h)∫₀ʰ N dx of the fixed-end state: N(x) = −f1x − Σ_{s<x} Px − ∫₀ˣ qx. */
function meanFixedAxial(ls: LoadSet, f1x: number, h: number): number {
  let m = 0;
  for (let i = 0; i < ls.point.length; i += 4) m += ls.point[i + 1] * (h - ls.point[i]);
  const d = ls.dist;
  for (let i = 0; i < d.length; i += 8) {
    const a = d[i], b = d[i + 1];
    if (!(b > a)) continue;
    // ∫ₐᵇ (h − s)(q1 + (q2 − q1)(s − a)/(b − a)) ds, exact by Simpson (quadratic integrand)
    const qa = d[i + 2], qb = d[i + 5], mid = (a + b) / 2;
    m += ((b - a) / 6) * ((h - a) * qa + 4 * (h - mid) * ((qa + qb) / 2) + (h - b) * qb);
  }
  return -f1x - m / h;
}
