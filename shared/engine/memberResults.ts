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

export type MemberForcesFn = (mi: number, ld: Loading) => StationForces;

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
