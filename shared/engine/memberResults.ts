/**
 * Member forces on demand, cheap per call. For the member asked for, the station values of a
 * load case are computed once (start end forces from the displacements, then statics along the
 * member, recovery.ts) and kept until another member is asked for; a loading is the
 * superposition of its cases' station values. Each call returns fresh arrays, carved as views
 * out of a shared slab (one small allocation per view, no backing store per call).
 */
import { vecToLocal12 } from './axes.js';
import type { Mesh } from './discretise.js';
import type { LoadSet } from './loadSet.js';
import { caseStations, memberStations, ROWS } from './recovery.js';
import { elementLocal } from './system.js';
import type { Loading, StationForces } from './types.js';

export interface MemberResultsInput {
  mesh: Mesh;
  nCases: number;
  loadSets: (LoadSet | undefined)[];
  /** full displacements, nNodes*6 per case, case after case */
  U: Float64Array;
  fefOf: (e: number, c: number) => Float64Array | undefined;
  /** adds an envelope loading's moving part to the member's rows (ROWS × stations) */
  addMoving?: (mi: number, ld: Loading, rows: Float64Array) => void;
}

/** doubles per slab; a call takes (ROWS + 1) × stations of it */
const SLAB = 8192;

export type MemberForcesFn = (mi: number, ld: Loading) => StationForces;

export function memberResults(input: MemberResultsInput): MemberForcesFn {
  const { mesh, nCases, loadSets, U, fefOf, addMoving } = input;
  const nDofAll = mesh.nNodes * 6;
  const nMembers = mesh.members.length;
  const sets: (LoadSet | undefined)[] = new Array(nCases);
  const stationsOf: (Float64Array | undefined)[] = new Array(nMembers);
  const kl = new Float64Array(144), ue = new Float64Array(12), ul = new Float64Array(12), f1 = new Float64Array(6);
  const done = new Uint8Array(nCases);
  let cur = -1, xs: Float64Array = new Float64Array(0), nSt = 0;
  let data = new Float64Array(0);
  let slab = new Float64Array(SLAB), used = 0;

  const stations = (mi: number): Float64Array => {
    let x = stationsOf[mi];
    if (x) return x;
    const L = mesh.members[mi].L;
    let loaded = false;
    for (let c = 0; c < nCases; c++) {
      const ls = loadSets[mi * nCases + c];
      sets[c] = ls;
      if (ls && (ls.point.length > 0 || ls.moment.length > 0)) loaded = true;
    }
    if (loaded) x = memberStations(L, sets);
    else {
      // the 11 evenly spaced stations (memberStations without concentrated loads)
      x = new Float64Array(11);
      for (let i = 0; i <= 10; i++) x[i] = (L * i) / 10;
      x[10] = L;
    }
    stationsOf[mi] = x;
    return x;
  };

  const select = (mi: number) => {
    if (mi === cur) return;
    xs = stations(mi);
    nSt = xs.length;
    if (data.length < nCases * ROWS * nSt) data = new Float64Array(nCases * ROWS * nSt);
    done.fill(0);
    elementLocal(mesh, mesh.members[mi].firstElement, kl);
    cur = mi;
  };

  const caseRows = (c: number): number => {
    const o = c * ROWS * nSt;
    if (done[c]) return o;
    const m = mesh.members[cur];
    const e0 = m.firstElement;
    const a = mesh.elStart[e0] * 6, b = mesh.elEnd[e0] * 6, uo = c * nDofAll;
    for (let k = 0; k < 6; k++) { ue[k] = U[uo + a + k]; ue[6 + k] = U[uo + b + k]; }
    vecToLocal12(m.R, ue, ul);
    const ls = loadSets[cur * nCases + c];
    const fef = ls ? fefOf(e0, c) : undefined;
    for (let i = 0; i < 6; i++) {
      let s = fef ? fef[i] : 0;
      const r = i * 12;
      for (let j = 0; j < 12; j++) s += kl[r + j] * ul[j];
      f1[i] = s;
    }
    caseStations(m, ls, f1, xs, data, o);
    done[c] = 1;
    return o;
  };

  return (mi: number, ld: Loading): StationForces => {
    select(mi);
    const len = (ROWS + 1) * nSt;
    if (used + len > slab.length) {
      slab = new Float64Array(Math.max(SLAB, len));
      used = 0;
    }
    const o = used;
    used += len;
    for (let i = 0; i < nSt; i++) slab[o + i] = xs[i];
    const r0 = o + nSt, n = ROWS * nSt;
    const terms = ld.terms;
    for (let t = 0; t < terms.length; t++) {
      const factor = terms[t].factor;
      if (factor === 0) continue;
      const src = caseRows(terms[t].caseIndex);
      for (let i = 0; i < n; i++) slab[r0 + i] += factor * data[src + i];
    }
    const buf = slab.buffer, B = 8 * nSt;
    if (addMoving && ld.envelope) addMoving(mi, ld, new Float64Array(buf, r0 * 8, n));
    return {
      x: new Float64Array(buf, o * 8, nSt),
      N: new Float64Array(buf, r0 * 8, nSt),
      V_major: new Float64Array(buf, r0 * 8 + B, nSt),
      V_minor: new Float64Array(buf, r0 * 8 + 2 * B, nSt),
      T: new Float64Array(buf, r0 * 8 + 3 * B, nSt),
      M_major: new Float64Array(buf, r0 * 8 + 4 * B, nSt),
      M_minor: new Float64Array(buf, r0 * 8 + 5 * B, nSt),
      d_major: new Float64Array(buf, r0 * 8 + 6 * B, nSt),
      d_minor: new Float64Array(buf, r0 * 8 + 7 * B, nSt),
    };
  };
}
