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
import { STATIONS_MAX, STATIONS_MIN } from '../model/defaults.js';
import type { Model } from '../model/types.js';
import { caseStations, memberStations, ROWS } from './recovery.js';
import { elementLocal } from './system.js';
import type { Loading, StationForces } from './types.js';

/**
 * The station set of every member, built on first use and kept: `settings.stations` equally
 * spaced (both ends), every concentrated load position of any case, and the member's
 * `result_points` (recovery.ts memberStations). Member forces, the moving-load layout, design
 * checks and exports all read this one set.
 */
export function stationSets(model: Model, mesh: Mesh, nCases: number, loadSets: (LoadSet | undefined)[]): (mi: number) => Float64Array {
  const count = model.settings.stations;
  const lo = STATIONS_MIN, hi = STATIONS_MAX;
  if (!(Number.isInteger(count) && count >= lo && count <= hi)) {
    throw new Error(`settings stations must be a whole number from ${lo} to ${hi} (got ${count})`);
  }
  const points = new Map<string, number[]>();
  for (const p of model.resultPoints ?? []) {
    const list = points.get(p.member);
    if (list) list.push(p.x); else points.set(p.member, [p.x]);
  }
  const cache: (Float64Array | undefined)[] = new Array(mesh.members.length);
  const sets: (LoadSet | undefined)[] = new Array(nCases);
  return (mi: number): Float64Array => {
    let x = cache[mi];
    if (x) return x;
    const m = mesh.members[mi];
    for (let c = 0; c < nCases; c++) sets[c] = loadSets[mi * nCases + c];
    x = memberStations(m.L, sets, count, points.get(m.id));
    cache[mi] = x;
    return x;
  };
}

export interface MemberResultsInput {
  mesh: Mesh;
  nCases: number;
  loadSets: (LoadSet | undefined)[];
  /** full displacements, nNodes*6 per case, case after case */
  U: Float64Array;
  fefOf: (e: number, c: number) => Float64Array | undefined;
  /** adds an envelope loading's moving part to the member's rows (ROWS × stations) */
  addMoving?: (mi: number, ld: Loading, rows: Float64Array) => void;
  /** the member's stations (stationSets) */
  stations: (mi: number) => Float64Array;
}

/** doubles per slab; a call takes (ROWS + 1) × stations of it */
const SLAB = 8192;

export type MemberForcesFn = ((mi: number, ld: Loading) => StationForces) & {
  /** the same values written into the caller's buffer (AnalysisResult.memberForcesInto) */
  into: (mi: number, ld: Loading, out: StationForces) => StationForces;
};

/** Gives `out` arrays of nSt stations where they have another length (views of one fresh block). */
function fitForces(out: StationForces, nSt: number): void {
  if (out.x.length === nSt && out.N.length === nSt && out.V_major.length === nSt && out.V_minor.length === nSt && out.T.length === nSt
    && out.M_major.length === nSt && out.M_minor.length === nSt && out.d_major.length === nSt && out.d_minor.length === nSt) return;
  const b = new Float64Array((ROWS + 1) * nSt);
  const v = (r: number) => b.subarray(r * nSt, (r + 1) * nSt);
  out.x = v(0); out.N = v(1); out.V_major = v(2); out.V_minor = v(3); out.T = v(4);
  out.M_major = v(5); out.M_minor = v(6); out.d_major = v(7); out.d_minor = v(8);
}

export function memberResults(input: MemberResultsInput): MemberForcesFn {
  const { mesh, nCases, loadSets, U, fefOf, addMoving, stations } = input;
  const nDofAll = mesh.nNodes * 6;
  const kl = new Float64Array(144), ue = new Float64Array(12), ul = new Float64Array(12), f1 = new Float64Array(6);
  const done = new Uint8Array(nCases);
  let cur = -1, xs: Float64Array = new Float64Array(0), nSt = 0;
  let data = new Float64Array(0);
  let slab = new Float64Array(SLAB), used = 0;

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

  const forces = (mi: number, ld: Loading): StationForces => {
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

  // the loading's rows: 0 + Σ factor·case rows, term after term in the order of the terms (the
  // same roundings as above, so the same bits), in one flat loop per term over a scratch
  // block, then copied to the caller's arrays; plain loops, no builtins per call
  let comb = new Float64Array(0);
  const copyRow = (dst: Float64Array, c: Float64Array, o: number): void => {
    for (let i = 0; i < nSt; i++) dst[i] = c[o + i];
  };
  const into = (mi: number, ld: Loading, out: StationForces): StationForces => {
    if (addMoving && ld.envelope) {
      // an envelope adds its moving part to contiguous rows: through the plain path
      const sf = forces(mi, ld);
      fitForces(out, sf.x.length);
      out.x.set(sf.x); out.N.set(sf.N); out.V_major.set(sf.V_major); out.V_minor.set(sf.V_minor); out.T.set(sf.T);
      out.M_major.set(sf.M_major); out.M_minor.set(sf.M_minor); out.d_major.set(sf.d_major); out.d_minor.set(sf.d_minor);
      return out;
    }
    select(mi);
    fitForces(out, nSt);
    const n = ROWS * nSt;
    if (comb.length < n) comb = new Float64Array(n);
    const c = comb;
    const terms = ld.terms;
    let first = true;
    for (let t = 0; t < terms.length; t++) {
      const f = terms[t].factor;
      if (f === 0) continue;
      const src = caseRows(terms[t].caseIndex);
      const d = data;
      if (first) {
        for (let i = 0; i < n; i++) c[i] = 0 + f * d[src + i];
        first = false;
      } else {
        for (let i = 0; i < n; i++) c[i] += f * d[src + i];
      }
    }
    if (first) for (let i = 0; i < n; i++) c[i] = 0;
    const x = out.x;
    for (let i = 0; i < nSt; i++) x[i] = xs[i];
    copyRow(out.N, c, 0);
    copyRow(out.V_major, c, nSt);
    copyRow(out.V_minor, c, 2 * nSt);
    copyRow(out.T, c, 3 * nSt);
    copyRow(out.M_major, c, 4 * nSt);
    copyRow(out.M_minor, c, 5 * nSt);
    copyRow(out.d_major, c, 6 * nSt);
    copyRow(out.d_minor, c, 7 * nSt);
    return out;
  };
  return Object.assign(forces, { into });
}
