/**
 * Influence basis of the lanes: ONE factorisation, one block of right-hand sides.
 *
 * A unit load along −vertical at distance a on a lane member is, for the rest of the
 * structure, exactly its fixed-end forces reversed at the member's end nodes; on the member
 * itself it adds the fixed-ended member's own statics (recovery.ts). So every response R to a
 * load at path position s is
 *   R(s) = Σ_k (−f_k(a)) · R_k + R_local(a),
 * where R_k is the response to a unit nodal load on freedom k of a lane node (solved once,
 * as one block of right-hand sides with the engine's factorisation) and f(a) the member's
 * fixed-end forces in global axes (fixedEnd.ts). Evaluated at any s this is exact — the
 * influence line is never interpolated.
 *
 * Quantities ("full layout"): node displacements (nUser·6), reactions (nUser·6), then per
 * member its station table (8 rows × stations, rows N, V_major, V_minor, T, M_major,
 * M_minor, d_major, d_minor). A prismatic truss member carries a constant N (unless a lane's
 * vertical load has an axial part on it), so only its first station is a quantity for N (the
 * rest copy it afterwards); its other rows come from its own loads only.
 */
import type { Model } from '../model/types.js';
import { vecToGlobal12, vecToLocal12 } from '../engine/axes.js';
import { elementReleases, PLANE, SUPPORT } from '../engine/discretise.js';
import { fixedEndForces } from '../engine/fixedEnd.js';
import { type LoadSet, uniqueSorted } from '../engine/loadSet.js';
import { caseStations, ROWS } from '../engine/recovery.js';
import { internalForces } from '../engine/statics.js';
import { elementLocal, type LinearSystem } from '../engine/system.js';

export interface InfluenceInput {
  model: Model;
  sys: LinearSystem;
  /** the engine's factorisation: solve K X = B for nrhs columns (column-major) */
  solve: (B: Float64Array, nrhs: number) => Float64Array;
  /** the stations of member mi, as the engine's memberForces uses them */
  stations: (mi: number) => Float64Array;
  /** model indices of the members on any lane */
  laneMembers: Set<number>;
}

/** The lanes' unit-load columns: what a load on a lane member does before any result quantity is laid out. */
export interface LaneBasis {
  nUser: number;
  /** basis column of each mesh freedom (−1: none) */
  basisOf: Int32Array;
  nBasis: number;
  /** unit downward vector in global axes */
  down: [number, number, number];
  /** mesh freedom restrained (reaction there) */
  restrained: Uint8Array;
}

/** A lane basis with its solved columns: the displacement of mesh freedom g under basis column b is X[b·nEq + eq[g]] (0 when eq[g] < 0). */
export interface LaneResponse extends LaneBasis {
  X: Float64Array;
  eq: Int32Array;
  nEq: number;
}

export interface InfluenceBasis extends LaneBasis {
  /** offset of each member's station table in the full layout */
  memberOff: Int32Array;
  memberStations: Float64Array[];
  nFull: number;
  /** members whose N row is constant and stored at station 0 only */
  constantN: Uint8Array;
  /** dense quantities: full index of each, and QU (nBasis × nDense, row-major) */
  denseFull: Int32Array;
  denseOf: Int32Array;
  QU: Float64Array;
}

/**
 * `extend` (optional) is called once the lane columns are solved and returns extra stations
 * per member (m from the start node); the layout then uses the member's stations plus these.
 */
export function buildInfluenceBasis(inp: InfluenceInput, extend?: (r: LaneResponse) => Map<number, number[]>): InfluenceBasis {
  const { model, sys, laneMembers } = inp;
  const { mesh, eq, nEq, status, kgAll } = sys;
  const nUser = mesh.nUserNodes, nDofAll = mesh.nNodes * 6;
  const nMem = mesh.members.length;
  const restrained = new Uint8Array(nDofAll);
  for (let g = 0; g < nDofAll; g++) restrained[g] = status[g] === SUPPORT || status[g] === PLANE ? 1 : 0;

  // basis: free freedoms of the end nodes of lane members that a vertical load on the member
  // can load (its fixed-end forces are cubic in a, so two interior positions show the pattern)
  const basisOf = new Int32Array(nDofAll).fill(-1);
  const down: [number, number, number] = model.settings.verticalAxis === 'Y' ? [0, -1, 0] : [0, 0, -1];
  const probe = new Float64Array(12), probeG = new Float64Array(12);
  let nBasis = 0;
  for (const mi of laneMembers) {
    const m = mesh.members[mi];
    if (m.elementCount !== 1) throw new Error(`member ${m.id}: a tapered member cannot carry a moving load (it is on a lane)`);
    const used = new Uint8Array(12);
    for (const t of [0.2113, 0.7887]) {
      unitFef(sys, mi, t * m.L, 1, down, probe);
      vecToGlobal12(m.R, probe, probeG);
      for (let i = 0; i < 12; i++) if (Math.abs(probeG[i]) > 1e-12) used[i] = 1;
    }
    for (let i = 0; i < 12; i++) {
      const g = i < 6 ? m.start * 6 + i : m.end * 6 + i - 6;
      if (used[i] && eq[g] >= 0 && basisOf[g] < 0) basisOf[g] = nBasis++;
    }
  }
  // refuse before solving when the base stations alone are already too many (checked exactly below)
  const constantN = new Uint8Array(nMem);
  let baseCand = nUser * 6;
  for (let mi = 0; mi < nMem; mi++) {
    const m = mesh.members[mi];
    // a prismatic truss member carries a constant N unless a vertical load on it has an axial part
    const axialLoad = Math.abs(m.R[0] * down[0] + m.R[1] * down[1] + m.R[2] * down[2]) > 1e-12;
    if (m.truss && m.elementCount === 1 && !(laneMembers.has(mi) && axialLoad)) constantN[mi] = 1;
    baseCand += constantN[mi] ? 1 : ROWS * inp.stations(mi).length;
  }
  guardSize(nBasis, baseCand);
  // one block solve
  const B = new Float64Array(nEq * nBasis);
  for (let g = 0; g < nDofAll; g++) if (basisOf[g] >= 0) B[basisOf[g] * nEq + eq[g]] = 1;
  const X = nBasis > 0 ? inp.solve(B, nBasis) : new Float64Array(0);
  const extra = extend?.({ nUser, basisOf, nBasis, down, restrained, X, eq, nEq });

  // full layout
  const memberOff = new Int32Array(nMem + 1);
  const memberStations: Float64Array[] = [];
  let off = nUser * 12;
  for (let mi = 0; mi < nMem; mi++) {
    const add = extra?.get(mi);
    const xs = add && add.length > 0 ? withStations(inp.stations(mi), add, mesh.members[mi].L) : inp.stations(mi);
    memberStations.push(xs);
    memberOff[mi] = off;
    off += ROWS * xs.length;
  }
  memberOff[nMem] = off;
  const nFull = off;

  // candidate quantities (full indices)
  const cand: number[] = [];
  for (let i = 0; i < nUser * 6; i++) cand.push(i);
  for (const n of mesh.supportedNodes) for (let k = 0; k < 6; k++) {
    const g = n * 6 + k;
    if (restrained[g] || mesh.springs[g] !== 0) cand.push(nUser * 6 + g);
  }
  for (let mi = 0; mi < nMem; mi++) {
    if (constantN[mi]) { cand.push(memberOff[mi]); continue; }
    for (let q = memberOff[mi]; q < memberOff[mi + 1]; q++) cand.push(q);
  }
  const nCand = cand.length;
  guardSize(nBasis, nCand);
  const candVals = new Float64Array(nBasis * nCand);
  const nonZero = new Uint8Array(nCand);

  // reaction elements: those touching a supported node (plane-frame restraints elsewhere carry nothing in plane)
  const supported = new Uint8Array(mesh.nNodes);
  for (const n of mesh.supportedNodes) supported[n] = 1;
  const rxEl: number[] = [];
  for (let e = 0; e < mesh.nElements; e++) if (supported[mesh.elStart[e]] || supported[mesh.elEnd[e]]) rxEl.push(e);
  const full = new Float64Array(nFull);
  const U = new Float64Array(nDofAll);
  const kl = new Float64Array(144), ue = new Float64Array(12), ul = new Float64Array(12), f1 = new Float64Array(6);
  const klOf: Float64Array[] = [];
  for (let mi = 0; mi < nMem; mi++) klOf.push(elementLocal(mesh, mesh.members[mi].firstElement, new Float64Array(144)));
  void kl;
  for (let b = 0; b < nBasis; b++) {
    for (let g = 0; g < nDofAll; g++) U[g] = eq[g] >= 0 ? X[b * nEq + eq[g]] : 0;
    for (let i = 0; i < nUser * 6; i++) full[i] = U[i];
    // reactions
    for (let i = nUser * 6; i < nUser * 12; i++) full[i] = 0;
    for (const e of rxEl) {
      const ni = mesh.elStart[e], nj = mesh.elEnd[e];
      for (let k = 0; k < 6; k++) { ue[k] = U[ni * 6 + k]; ue[6 + k] = U[nj * 6 + k]; }
      for (let i = 0; i < 12; i++) {
        const g = i < 6 ? ni * 6 + i : nj * 6 + i - 6;
        if (!restrained[g] || g >= nUser * 6 || !supported[Math.floor(g / 6)]) continue;
        let s = 0;
        const ko = e * 144 + i * 12;
        for (let j = 0; j < 12; j++) s += kgAll[ko + j] * ue[j];
        full[nUser * 6 + g] += s;
      }
    }
    for (const n of mesh.supportedNodes) for (let k = 0; k < 6; k++) {
      const g = n * 6 + k, kk = mesh.springs[g];
      if (kk !== 0 && eq[g] >= 0) full[nUser * 6 + g] = -kk * U[g];
    }
    // members
    for (let mi = 0; mi < nMem; mi++) {
      const m = mesh.members[mi];
      const e0 = m.firstElement;
      const ni = mesh.elStart[e0], nj = mesh.elEnd[e0];
      let any = false;
      for (let k = 0; k < 6; k++) { ue[k] = U[ni * 6 + k]; ue[6 + k] = U[nj * 6 + k]; any ||= ue[k] !== 0 || ue[6 + k] !== 0; }
      const o = memberOff[mi];
      if (!any && m.elementCount === 1) {
        full.fill(0, o, memberOff[mi + 1]);
        continue;
      }
      vecToLocal12(m.R, ue, ul);
      const k12 = klOf[mi];
      for (let i = 0; i < 6; i++) {
        let s = 0;
        for (let j = 0; j < 12; j++) s += k12[i * 12 + j] * ul[j];
        f1[i] = s;
      }
      if (constantN[mi]) { full[o] = -f1[0]; continue; }
      caseStations(m, undefined, f1, memberStations[mi], full, o);
    }
    const row = b * nCand;
    for (let c = 0; c < nCand; c++) {
      const v = full[cand[c]];
      candVals[row + c] = v;
      if (v !== 0) nonZero[c] = 1;
    }
  }
  // keep the candidates with any non-zero value
  const keep: number[] = [];
  for (let c = 0; c < nCand; c++) if (nonZero[c]) keep.push(c);
  const nDense = keep.length;
  const QU = new Float64Array(nBasis * nDense);
  const denseFull = new Int32Array(nDense);
  const denseOf = new Int32Array(nFull).fill(-1);
  keep.forEach((c, d) => { denseFull[d] = cand[c]; denseOf[cand[c]] = d; });
  for (let b = 0; b < nBasis; b++) {
    const src = b * nCand, dst = b * nDense;
    for (let d = 0; d < nDense; d++) QU[dst + d] = candVals[src + keep[d]];
  }
  return { nUser, memberOff, memberStations, nFull, constantN, basisOf, nBasis, denseFull, denseOf, QU, down, restrained };
}

/**
 * The influence matrix holds every result quantity for every lane freedom: refuse plainly
 * rather than exhaust memory (4·10^7 numbers = 320 MB).
 */
function guardSize(nBasis: number, nCand: number): void {
  if (nBasis * nCand > 4e7) {
    throw new Error(`moving loads: ${nCand} result quantities × ${nBasis} lane freedoms is more than this version can hold (4·10^7 influence values); use shorter lanes or fewer frame members`);
  }
}

/** A member's stations with extra positions merged in (ascending, duplicates within 1e-9·L dropped, ends exact). */
export function withStations(xs: Float64Array, extra: readonly number[], L: number): Float64Array {
  const u = uniqueSorted([...xs, ...extra.filter((x) => x > 0 && x < L)], L * 1e-9);
  u[0] = 0;
  u[u.length - 1] = L;
  return Float64Array.from(u);
}

/** A load set of one point load P along `down` at distance a on member mi (local components). */
function pointSet(sys: LinearSystem, mi: number, a: number, P: number, down: readonly number[], ls?: LoadSet): LoadSet {
  const R = sys.mesh.members[mi].R;
  const set = ls ?? { dist: [], point: [0, 0, 0, 0], moment: [], eps: 0, grad: 0 };
  set.point[0] = a;
  set.point[1] = P * (R[0] * down[0] + R[1] * down[1] + R[2] * down[2]);
  set.point[2] = P * (R[3] * down[0] + R[4] * down[1] + R[5] * down[2]);
  set.point[3] = P * (R[6] * down[0] + R[7] * down[1] + R[8] * down[2]);
  return set;
}

/**
 * Unit-load fixed-end forces by member and position, computed once (positions rounded to
 * 1 nm, as the envelope's own cache): the scan under the axles and the envelopes stand axles
 * on the same points, and the fixed-end forces are the costly part of a unit-load effect.
 */
export class UnitFefMemo {
  private byMember = new Map<number, Map<number, Float64Array>>();
  private size = 0;
  constructor(private sys: LinearSystem, private down: readonly number[], private limit = 2e5) {}

  /** local fixed-end forces (12) of a unit load along −vertical at distance a on member mi; do not modify */
  get(mi: number, a: number): Float64Array {
    let byA = this.byMember.get(mi);
    if (!byA) { byA = new Map(); this.byMember.set(mi, byA); }
    const key = Math.round(a * 1e9);
    let f = byA.get(key);
    if (!f) {
      f = new Float64Array(12);
      unitFef(this.sys, mi, a, 1, this.down, f);
      if (this.size < this.limit) { byA.set(key, f); this.size++; }
    }
    return f;
  }
}

/** Local fixed-end forces of a load P along `down` at distance a on prismatic member mi (into out12). */
export function unitFef(sys: LinearSystem, mi: number, a: number, P: number, down: readonly number[], out12: Float64Array, ls?: LoadSet): LoadSet {
  const { mesh } = sys;
  const m = mesh.members[mi];
  const set = pointSet(sys, mi, a, P, down, ls);
  const e = m.firstElement;
  const p = mesh.elProps;
  fixedEndForces(set, m.L, { EA: p[e * 5], EIy: p[e * 5 + 1], EIz: p[e * 5 + 2], GJ: p[e * 5 + 3] }, p[e * 5 + 4], m.truss, elementReleases(mesh.elRel[e]), out12);
  return set;
}

/**
 * Station table (8 rows) of a prismatic member under one point load with start end forces f1:
 * forces by statics (statics.ts); chord deflections d(x) = x·A(x) − B(x) − (x/L)(L·A(L) − B(L))
 * with A = ∫κ, B = ∫sκ and κ = M/EI piecewise linear (kinks only at the load), so the
 * trapezoid-type integrals below are exact. Same result as recovery.ts, without quadrature.
 */
function pointLoadStations(ls: LoadSet, f1: ArrayLike<number>, L: number, EIy: number, EIz: number, xs: Float64Array, out: Float64Array, work: Float64Array): void {
  const nSt = xs.length;
  const s = work.subarray(0, 6);
  for (let i = 0; i < nSt; i++) {
    internalForces(ls, f1, xs[i], xs[i] <= 0, s);
    for (let r = 0; r < 6; r++) out[r * nSt + i] = s[r];
  }
  const a = ls.point[0];
  internalForces(ls, f1, a, false, s);
  const MaY = s[4], MaZ = s[5];
  // integrate piecewise between consecutive points of {stations} ∪ {a}
  let A1 = 0, B1 = 0, A2 = 0, B2 = 0;
  let x0 = 0, m0y = out[4 * nSt], m0z = out[5 * nSt];
  const Ax = work.subarray(6, 6 + nSt), Bx = work.subarray(6 + nSt, 6 + 2 * nSt);
  const Az = work.subarray(6 + 2 * nSt, 6 + 3 * nSt), Bz = work.subarray(6 + 3 * nSt, 6 + 4 * nSt);
  Ax[0] = Bx[0] = Az[0] = Bz[0] = 0;
  const piece = (x1: number, m1y: number, m1z: number) => {
    const h = x1 - x0;
    if (h > 0) {
      A1 += (h * (m0y + m1y)) / 2; B1 += (h * (x0 * (2 * m0y + m1y) + x1 * (m0y + 2 * m1y))) / 6;
      A2 += (h * (m0z + m1z)) / 2; B2 += (h * (x0 * (2 * m0z + m1z) + x1 * (m0z + 2 * m1z))) / 6;
    }
    x0 = x1; m0y = m1y; m0z = m1z;
  };
  for (let i = 1; i < nSt; i++) {
    if (a > xs[i - 1] && a < xs[i]) piece(a, MaY, MaZ);
    piece(xs[i], out[4 * nSt + i], out[5 * nSt + i]);
    Ax[i] = A1; Bx[i] = B1; Az[i] = A2; Bz[i] = B2;
  }
  const cY = (L * A1 - B1) / L, cZ = (L * A2 - B2) / L;
  for (let i = 0; i < nSt; i++) {
    const x = xs[i], end = i === 0 || i === nSt - 1;
    out[6 * nSt + i] = end ? 0 : (x * Ax[i] - Bx[i] - x * cY) / EIy;
    out[7 * nSt + i] = end ? 0 : (x * Az[i] - Bz[i] - x * cZ) / EIz;
  }
}

/**
 * The effect of a load P along −vertical at distance a on member mi (a lane member):
 * equivalent nodal loads on basis columns (wB), reactions at restrained end freedoms and the
 * member's own station table with its ends held (local). Calls `nodal(b, w)` for every
 * basis weight, `reaction(full, v)` and `local(full, v)` for the rest.
 */
export class UnitLoadEffect {
  private ls: LoadSet = { dist: [], point: [0, 0, 0, 0], moment: [], eps: 0, grad: 0 };
  private fef = new Float64Array(12);
  private fg = new Float64Array(12);
  private tmp = new Float64Array(0);
  constructor(private sys: LinearSystem, private basis: InfluenceBasis, private memo?: UnitFefMemo) {}

  private work = new Float64Array(0);
  apply(
    mi: number, a: number, P: number, withLocal: boolean,
    nodal: (b: number, w: number) => void,
    fullAdd: (full: number, v: number) => void,
  ): void {
    const { mesh } = this.sys;
    const m = mesh.members[mi];
    let ls: LoadSet;
    if (this.memo) {
      const u = this.memo.get(mi, a);
      for (let i = 0; i < 12; i++) this.fef[i] = P * u[i];
      ls = pointSet(this.sys, mi, a, P, this.basis.down, this.ls);
    } else ls = unitFef(this.sys, mi, a, P, this.basis.down, this.fef, this.ls);
    vecToGlobal12(m.R, this.fef, this.fg);
    const nU6 = this.basis.nUser * 6;
    for (let i = 0; i < 12; i++) {
      const v = this.fg[i];
      if (v === 0) continue;
      const g = i < 6 ? m.start * 6 + i : m.end * 6 + i - 6;
      const b = this.basis.basisOf[g];
      if (b >= 0) nodal(b, -v);
      else if (this.basis.restrained[g] && g < nU6) fullAdd(nU6 + g, v);
    }
    if (!withLocal) return;
    const xs = this.basis.memberStations[mi];
    const n = ROWS * xs.length;
    if (this.tmp.length < n) this.tmp = new Float64Array(n);
    if (this.work.length < 6 + 4 * xs.length) this.work = new Float64Array(6 + 4 * xs.length);
    const e = m.firstElement, E = mesh.elProps;
    pointLoadStations(ls, this.fef, m.L, E[e * 5 + 1], E[e * 5 + 2], xs, this.tmp, this.work);
    const o = this.basis.memberOff[mi];
    for (let i = 0; i < n; i++) if (this.tmp[i] !== 0) fullAdd(o + i, this.tmp[i]);
  }
}
