/**
 * Member forces of a second-order loading at the member's stations, with P-δ: the statics of
 * the deformed free body [0, x].
 *
 * Element end forces (local, undeformed member axes) are f_e = (K_e + K_G,e(N_e)) u_e + f_fixed,e,
 * the forces of the linearised second-order equilibrium. From the first sub-element's start
 * forces f1 (forces the start node applies to the member) and the member loads, with the
 * transverse displacements v(x), w(x) of the deformed axis (local y, z):
 *   M_major(x) = M_major,1st(x) + (w(0) − w(x))·f1x + Σ_{s<x} (w(s) − w(x))·Px(s) + ∫₀ˣ (w(s) − w(x)) qx(s) ds
 *   M_minor(x) = M_minor,1st(x) + (v(0) − v(x))·f1x + (the same axial-load terms with v)
 * (M_1st from statics.ts: first-order statics of the same forces; the added terms are the
 * moments of the axial forces about the displaced section, signs per conventions.md), and
 *   V_major = dM_major/dx = V_1st + N(x)·w'(x),  V_minor = V_1st + N(x)·v'(x)
 * — the shear normal to the deflected axis. N and T are the first-order statics of the same
 * forces (no second-order torsion).
 *
 * The displaced axis between sub-element nodes: the element chord from its node translations
 * plus the element's own deflection relative to its chord under its end forces and span loads
 * (recovery.ts caseStations on the sub-element), so releases and span loads need no special
 * treatment. w' by a central difference of that deflection. d_major, d_minor: w, v relative to
 * the member chord. All at the analysed load level; the caller divides by the load scale.
 */
import { vecToLocal12 } from '../engine/axes.js';
import { elementReleases, type MemberInfo, type Mesh } from '../engine/discretise.js';
import { localStiffness } from '../engine/element.js';
import { GAUSS3_T, GAUSS3_W } from '../engine/gauss.js';
import { clipLoadSet, emptyLoadSet, type LoadSet, uniqueSorted } from '../engine/loadSet.js';
import { caseStations, ROWS } from '../engine/recovery.js';
import { internalForces } from '../engine/statics.js';
import { localGeometricStiffness } from './geometric.js';

/** One solved second-order loading, at the analysed load level. */
export interface SecondOrderState {
  mesh: Mesh;
  /** full node displacements, nNodes × 6, global */
  u: Float64Array;
  /** axial force of every element in its geometric stiffness */
  axial: Float64Array;
  /** factors on EA and EI per element (the stiffness rule); 1 when absent */
  eaFactor?: Float64Array;
  eiFactor?: Float64Array;
  /** the member's load set of this loading (factored, scaled), undefined when unloaded */
  loadSet: (mi: number) => LoadSet | undefined;
  /** fixed-end forces (local) of element e in this loading, undefined when unloaded */
  fef: (e: number) => ArrayLike<number> | undefined;
}

const EMPTY = emptyLoadSet();

/** Local end forces (12) of element e: (K_e + K_G,e) u_e + f_fixed. `k`, `kg` are 144-long scratch. */
export function elementEndForces(st: SecondOrderState, e: number, out: Float64Array, k = new Float64Array(144), kg = new Float64Array(144)): Float64Array {
  const { mesh, u } = st;
  const m = mesh.members[mesh.elMember[e]];
  const p = mesh.elProps, L = mesh.elL[e];
  const a = st.eaFactor ? st.eaFactor[e] : 1, b = st.eiFactor ? st.eiFactor[e] : 1;
  const rel = elementReleases(mesh.elRel[e]);
  localStiffness({ EA: a * p[e * 5], EIy: b * p[e * 5 + 1], EIz: b * p[e * 5 + 2], GJ: p[e * 5 + 3] }, L, m.truss, rel, k);
  localGeometricStiffness(st.axial[e], L, m.truss, rel, kg);
  const ug = new Float64Array(12), ul = new Float64Array(12);
  const s0 = mesh.elStart[e] * 6, s1 = mesh.elEnd[e] * 6;
  for (let i = 0; i < 6; i++) { ug[i] = u[s0 + i]; ug[6 + i] = u[s1 + i]; }
  vecToLocal12(m.R, ug, ul);
  const f = st.fef(e);
  for (let i = 0; i < 12; i++) {
    let s = f ? f[i] : 0;
    for (let j = 0; j < 12; j++) s += (k[i * 12 + j] + kg[i * 12 + j]) * ul[j];
    out[i] = s;
  }
  return out;
}

/** Relative step of the central difference for slopes, as a fraction of the sub-element length. */
const SLOPE_STEP = 1e-4;

/**
 * The displaced axis of member mi: v(x), w(x) (local) at any points, from the sub-elements'
 * chords and their own deflections.
 */
class DeformedAxis {
  private readonly m: MemberInfo;
  private readonly chordV: Float64Array; // per element node: v, w at nodes 0..n
  private readonly chordW: Float64Array;
  private readonly f1s: Float64Array[]; // per element: start end forces (6) for its own deflection
  private readonly parts: (LoadSet | undefined)[];
  private readonly infos: MemberInfo[];
  readonly startForces: Float64Array;

  constructor(private readonly st: SecondOrderState, mi: number) {
    const { mesh, u } = st;
    const m = (this.m = mesh.members[mi]);
    const n = m.elementCount;
    this.chordV = new Float64Array(n + 1);
    this.chordW = new Float64Array(n + 1);
    const R = m.R;
    const nodeAt = (k: number) => (k < n ? mesh.elStart[m.firstElement + k] : mesh.elEnd[m.firstElement + n - 1]);
    for (let k = 0; k <= n; k++) {
      const g = nodeAt(k) * 6;
      this.chordV[k] = R[3] * u[g] + R[4] * u[g + 1] + R[5] * u[g + 2];
      this.chordW[k] = R[6] * u[g] + R[7] * u[g + 1] + R[8] * u[g + 2];
    }
    const ls = st.loadSet(mi);
    const f = new Float64Array(12), k1 = new Float64Array(144), k2 = new Float64Array(144);
    this.f1s = [];
    this.parts = [];
    this.infos = [];
    let start = f;
    for (let k = 0; k < n; k++) {
      const e = m.firstElement + k;
      elementEndForces(st, e, f, k1, k2);
      if (k === 0) start = f.slice(0, 6);
      const x0 = mesh.elX0[e], h = mesh.elL[e];
      // the element's own deflection from the statics of its deformed free body: the axial force
      // about the rotated chord adds −s·t·f1x to the moments (s the chord slope), i.e. f1y, f1z
      // less s·f1x; the curvature between its ends (P-δ within one sub-element) is left out
      const f1 = f.slice(0, 6);
      f1[1] -= ((this.chordV[k + 1] - this.chordV[k]) / h) * f[0];
      f1[2] -= ((this.chordW[k + 1] - this.chordW[k]) / h) * f[0];
      this.f1s.push(f1);
      this.parts.push(ls && n > 1 ? clipLoadSet(ls, x0, x0 + h, k === n - 1) : ls);
      const b = st.eiFactor ? st.eiFactor[e] : 1;
      this.infos.push({
        ...m, L: h, elementCount: 1, firstElement: e,
        material: b === 1 ? m.material : { ...m.material, E: b * m.material.E },
        props: m.tapered ? (t: number) => m.props((x0 + t * h) / m.L) : m.props,
      });
    }
    this.startForces = start;
  }

  /** v, w at the member's start and end (the end nodes' translations, local) */
  endTranslations(): [number, number, number, number] {
    const n = this.m.elementCount;
    return [this.chordV[0], this.chordW[0], this.chordV[n], this.chordW[n]];
  }

  private elementOf(x: number): number {
    const { mesh } = this.st;
    const m = this.m, n = m.elementCount;
    for (let k = 0; k < n - 1; k++) if (x < mesh.elX0[m.firstElement + k + 1]) return k;
    return n - 1;
  }

  /** v, w at the points (any order), and with `slopes` also v', w'. */
  evaluate(xs: ArrayLike<number>, slopes: boolean): { v: Float64Array; w: Float64Array; dv: Float64Array; dw: Float64Array } {
    const { mesh } = this.st;
    const m = this.m, nP = xs.length;
    const v = new Float64Array(nP), w = new Float64Array(nP), dv = new Float64Array(nP), dw = new Float64Array(nP);
    const byEl: number[][] = Array.from({ length: m.elementCount }, () => []);
    for (let i = 0; i < nP; i++) byEl[this.elementOf(xs[i])].push(i);
    byEl.forEach((idx, k) => {
      if (idx.length === 0) return;
      const e = m.firstElement + k, x0 = mesh.elX0[e], h = mesh.elL[e];
      const dx = SLOPE_STEP * h;
      const clamp = (t: number) => Math.min(Math.max(t, 0), h);
      // ascending local points, 0 and h first and last (caseStations zeroes those two)
      const want: number[] = [0, h];
      for (const i of idx) {
        const t = clamp(xs[i] - x0);
        want.push(t);
        if (slopes) want.push(clamp(t - dx), clamp(t + dx));
      }
      const pts = Float64Array.from(uniqueSorted(want, 0));
      const nS = pts.length;
      const out = new Float64Array(ROWS * nS);
      caseStations(this.infos[k], this.parts[k], this.f1s[k], pts, out, 0);
      const find = (t: number): number => {
        let lo = 0, hi = nS - 1;
        while (lo < hi) {
          const mid = (lo + hi) >> 1;
          if (pts[mid] < t) lo = mid + 1;
          else hi = mid;
        }
        return lo;
      };
      const dMaj = (j: number) => (j === 0 || j === nS - 1 ? 0 : out[6 * nS + j]);
      const dMin = (j: number) => (j === 0 || j === nS - 1 ? 0 : out[7 * nS + j]);
      const sv = (this.chordV[k + 1] - this.chordV[k]) / h, sw = (this.chordW[k + 1] - this.chordW[k]) / h;
      for (const i of idx) {
        const t = clamp(xs[i] - x0), j = find(t);
        v[i] = this.chordV[k] + sv * t + dMin(j);
        w[i] = this.chordW[k] + sw * t + dMaj(j);
        if (slopes) {
          // central difference; one-sided at a sub-element end
          const ta = clamp(t - dx), tb = clamp(t + dx), ja = find(ta), jb = find(tb);
          dv[i] = sv + (dMin(jb) - dMin(ja)) / (tb - ta);
          dw[i] = sw + (dMaj(jb) - dMaj(ja)) / (tb - ta);
        }
      }
    });
    return { v, w, dv, dw };
  }
}

/** Whether a load set has any load along the member axis. */
export function hasAxialLoad(ls: LoadSet | undefined): boolean {
  if (!ls) return false;
  for (let i = 0; i < ls.dist.length; i += 8) if (ls.dist[i + 2] !== 0 || ls.dist[i + 5] !== 0) return true;
  for (let i = 0; i < ls.point.length; i += 4) if (ls.point[i + 1] !== 0) return true;
  return false;
}

/**
 * The 8 station rows (N, V_major, V_minor, T, M_major, M_minor, d_major, d_minor) of member mi at
 * stations xs into out[row * nSt + i], at the analysed load level.
 */
export function secondOrderStations(st: SecondOrderState, mi: number, xs: Float64Array, out: Float64Array): void {
  const m = st.mesh.members[mi];
  const L = m.L, nSt = xs.length;
  const axis = new DeformedAxis(st, mi);
  const f1 = axis.startForces;
  const ls = st.loadSet(mi) ?? EMPTY;
  const at = axis.evaluate(xs, true);
  const [v0, w0, vL, wL] = axis.endTranslations();
  // moments of the axial span loads about each station: Σ_{s<x} (w(s) − w(x))·Px + ∫₀ˣ (w(s) − w(x)) qx ds
  const axMaj = new Float64Array(nSt), axMin = new Float64Array(nSt);
  if (hasAxialLoad(ls)) axialLoadMoments(axis, ls, st.mesh, m, xs, at, axMaj, axMin);
  const s = new Float64Array(6);
  for (let i = 0; i < nSt; i++) {
    const x = xs[i];
    internalForces(ls, f1, x, x <= 0, s);
    const N = s[0];
    out[i] = N;
    out[nSt + i] = s[1] + N * at.dw[i];
    out[2 * nSt + i] = s[2] + N * at.dv[i];
    out[3 * nSt + i] = s[3];
    out[4 * nSt + i] = s[4] + (w0 - at.w[i]) * f1[0] + axMaj[i];
    out[5 * nSt + i] = s[5] + (v0 - at.v[i]) * f1[0] + axMin[i];
    const end = i === 0 || i === nSt - 1;
    out[6 * nSt + i] = end ? 0 : at.w[i] - w0 - (x / L) * (wL - w0);
    out[7 * nSt + i] = end ? 0 : at.v[i] - v0 - (x / L) * (vL - v0);
  }
}

function axialLoadMoments(
  axis: DeformedAxis, ls: LoadSet, mesh: Mesh, m: MemberInfo, xs: Float64Array,
  at: { v: Float64Array; w: Float64Array }, axMaj: Float64Array, axMin: Float64Array,
): void {
  const nSt = xs.length;
  // concentrated axial loads
  const pts: number[] = [];
  for (let i = 0; i < ls.point.length; i += 4) if (ls.point[i + 1] !== 0) pts.push(ls.point[i]);
  if (pts.length) {
    const d = axis.evaluate(pts, false);
    let q = 0;
    for (let i = 0; i < ls.point.length; i += 4) {
      const Px = ls.point[i + 1];
      if (Px === 0) continue;
      const sPos = ls.point[i];
      for (let j = 0; j < nSt; j++) {
        if (!(sPos < xs[j])) continue;
        axMaj[j] += (d.w[q] - at.w[j]) * Px;
        axMin[j] += (d.v[q] - at.v[j]) * Px;
      }
      q++;
    }
  }
  // distributed axial loads: cumulative ∫ w qx, ∫ v qx, ∫ qx by 3-point Gauss between breakpoints
  const dist = ls.dist;
  let anyDist = false;
  for (let i = 0; i < dist.length; i += 8) if (dist[i + 2] !== 0 || dist[i + 5] !== 0) anyDist = true;
  if (!anyDist) return;
  const bp: number[] = [...xs];
  for (let k = 1; k < m.elementCount; k++) bp.push(mesh.elX0[m.firstElement + k]);
  for (let i = 0; i < dist.length; i += 8) bp.push(dist[i], dist[i + 1]);
  const P = uniqueSorted(bp.filter((x) => x >= 0 && x <= m.L), m.L * 1e-12);
  const gx: number[] = [];
  for (let k = 0; k + 1 < P.length; k++) for (let g = 0; g < 3; g++) gx.push(P[k] + GAUSS3_T[g] * (P[k + 1] - P[k]));
  const d = axis.evaluate(gx, false);
  const qx = (x: number): number => {
    let q = 0;
    for (let i = 0; i < dist.length; i += 8) {
      const a = dist[i], b = dist[i + 1];
      if (x >= a && x <= b && b > a) q += dist[i + 2] + ((dist[i + 5] - dist[i + 2]) * (x - a)) / (b - a);
    }
    return q;
  };
  const cW = new Float64Array(P.length), cV = new Float64Array(P.length), cQ = new Float64Array(P.length);
  for (let k = 0; k + 1 < P.length; k++) {
    let sw = 0, sv = 0, sq = 0;
    const h = P[k + 1] - P[k];
    for (let g = 0; g < 3; g++) {
      const wgt = GAUSS3_W[g] * h, q = qx(gx[k * 3 + g]);
      sw += wgt * q * d.w[k * 3 + g];
      sv += wgt * q * d.v[k * 3 + g];
      sq += wgt * q;
    }
    cW[k + 1] = cW[k] + sw; cV[k + 1] = cV[k] + sv; cQ[k + 1] = cQ[k] + sq;
  }
  let k = 0;
  for (let j = 0; j < nSt; j++) {
    while (k + 1 < P.length && Math.abs(P[k + 1] - xs[j]) <= Math.abs(P[k] - xs[j])) k++;
    axMaj[j] += cW[k] - at.w[j] * cQ[k];
    axMin[j] += cV[k] - at.v[j] * cQ[k];
  }
}
