/**
 * Forces under the axles: the true extremes of a lane member, not only those at its stations.
 *
 * With only the axles on it, a lane member's moving-load forces are piecewise linear in x
 * (M) or piecewise constant (N, V, T) with breaks at the axles, so over the member the
 * extremes of a vehicle position are at the member's ends (stations) or just left of an axle
 * (the stations' face convention: loads at x are included only at x = 0). For every vehicle
 * position this scan takes each lane member that carries an axle and evaluates its six forces
 * at every axle standing on it (an axle at an end gives that end station's value), from the member's end displacements (the solved lane
 * columns) plus its own fixed-end forces and statics (the same decomposition as
 * influence.ts).
 *
 * Between positions the force under a given axle is a smooth function of the vehicle
 * position (a polynomial of degree ≤ 4 for a prismatic member until some axle crosses a
 * node; every such crossing is a vehicle position already), so the best sample is refined by
 * golden-section search between its neighbouring positions when it is an interior maximum
 * there — e.g. the classic absolute maximum moment of a simple span, with midspan bisecting
 * the distance between the critical axle and the resultant, is found to round-off whatever
 * the step. Each axle's best sample within 2 % of the member's best is refined.
 *
 * The result: per lane member and force, the maximum (sign +1) and minimum (sign −1) under an
 * axle with the vehicle position and x; index.ts turns each x into an extra station of that
 * member and each refined position into an extra vehicle position, so the envelope (and every
 * design check, which reads stations) carries these values exactly.
 */
import { vecToGlobal12, vecToLocal12 } from '../engine/axes.js';
import type { LoadSet } from '../engine/loadSet.js';
import { internalForces } from '../engine/statics.js';
import { elementLocal, type LinearSystem } from '../engine/system.js';
import type { Axle } from './envelope.js';
import type { LaneResponse } from './influence.js';
import { unitFef } from './influence.js';
import { type LanePathGeometry, locate, type PathPoint } from './path.js';
import { axlePosition, type Direction, vehiclePositions } from './positions.js';

/** The six force rows of the station table (N, V_major, V_minor, T, M_major, M_minor). */
export const FORCE_ROWS = 6;

export interface AxleExtreme {
  /** model index of the member */
  member: number;
  /** station-table row 0..5 */
  row: number;
  /** +1 maximum, −1 minimum */
  sign: 1 | -1;
  value: number;
  /** leading-axle path position and direction of travel */
  lead: number;
  direction: Direction;
  /** distance of the axle from the member's start node (m) */
  x: number;
  /** index of the axle in the vehicle */
  axle: number;
  /** true when golden-section refinement moved the position off the sampled ones */
  refined: boolean;
}

export interface AxleScan {
  extremes: AxleExtreme[];
  /** vehicle positions found by refinement, per direction, to add to the regular ones */
  leads: Record<Direction, number[]>;
  /** counts for diagnostics */
  evaluations: number;
  refinements: number;
}

const GOLD = (Math.sqrt(5) - 1) / 2;
/** an axle's best sample is refined when within this fraction of the member's best */
const REFINE_WITHIN = 0.02;

interface AxleLoad { segment: number; a: number; load: number; axle: number }

export function scanAxles(
  sys: LinearSystem, lane: LaneResponse, path: LanePathGeometry, axles: Axle[], step: number,
  directions: Direction[], targets: readonly number[],
): AxleScan {
  const { mesh } = sys;
  const nSeg = path.segments.length, nAx = axles.length;
  const offsets = axles.map((a) => a.offset);
  const kl = path.segments.map((g) => elementLocal(mesh, mesh.members[g.member].firstElement, new Float64Array(144)));
  const fef = new Float64Array(12), fg = new Float64Array(12), ue = new Float64Array(12), ul = new Float64Array(12);
  const f1 = new Float64Array(6), out = new Float64Array(6);
  const ls: LoadSet = { dist: [], point: [], moment: [], eps: 0, grad: 0 };
  const one: LoadSet = { dist: [], point: [0, 0, 0, 0], moment: [], eps: 0, grad: 0 };
  const w = new Float64Array(lane.nBasis);
  const wIdx: number[] = [];
  const pt: PathPoint = { segment: 0, a: 0 };
  const loads: AxleLoad[] = [];
  const fefSum = new Float64Array(6 * nSeg);
  const loaded = new Uint8Array(nSeg);
  let evaluations = 0;

  /**
   * Place the vehicle at `lead`: nodal weights w, axle loads per segment with their fixed-end
   * forces summed in fefSum; then call `visit` for every axle on a member with the six forces
   * just left of it (at the start node just right of it: the stations' face convention).
   */
  const place = (direction: Direction, lead: number, visit: (ld: AxleLoad, f: Float64Array) => void, only = -1) => {
    evaluations++;
    loads.length = 0;
    for (let i = 0; i < nAx; i++) {
      const s = axlePosition(direction, lead, offsets[i]);
      if (!(s >= 0 && s <= path.length) || !locate(path, s, pt)) continue;
      if (only >= 0 && pt.segment !== only) {
        // an axle on an end node of the segment asked for counts as on it (same nodal loads)
        const g = path.segments[only], t = s - g.s0, tol = 1e-12 * path.length;
        if (t >= -tol && t <= g.L + tol) {
          const c = Math.min(g.L, Math.max(0, t));
          pt.segment = only;
          pt.a = g.reversed ? g.L - c : c;
        }
      }
      const k = pt.segment, mi = path.segments[k].member, m = mesh.members[mi];
      const P = axles[i].load;
      unitFef(sys, mi, pt.a, P, lane.down, fef, one);
      vecToGlobal12(m.R, fef, fg);
      for (let j = 0; j < 12; j++) {
        const b = lane.basisOf[j < 6 ? m.start * 6 + j : m.end * 6 + j - 6];
        if (b < 0 || fg[j] === 0) continue;
        if (w[b] === 0) wIdx.push(b);
        w[b] -= fg[j];
        if (w[b] === 0) w[b] = 1e-300;
      }
      if (!loaded[k]) { loaded[k] = 1; fefSum.fill(0, 6 * k, 6 * k + 6); }
      for (let j = 0; j < 6; j++) fefSum[6 * k + j] += fef[j];
      loads.push({ segment: k, a: pt.a, load: P, axle: i });
    }
    for (let n = 0; n < loads.length; n++) {
      const k = loads[n].segment;
      if (!loaded[k] || (only >= 0 && k !== only)) continue;
      loaded[k] = 0;
      const g = path.segments[k], m = mesh.members[g.member];
      // end displacements of the member from the solved lane columns, then its start end forces
      for (let j = 0; j < 12; j++) {
        const gd = j < 6 ? m.start * 6 + j : m.end * 6 + j - 6;
        let v = 0;
        for (const b of wIdx) v += w[b] * lane.disp(b, gd);
        ue[j] = v;
      }
      vecToLocal12(m.R, ue, ul);
      const K = kl[k];
      for (let i = 0; i < 6; i++) {
        let v = fefSum[6 * k + i];
        for (let j = 0; j < 12; j++) v += K[i * 12 + j] * ul[j];
        f1[i] = v;
      }
      ls.point.length = 0;
      for (const l of loads) {
        if (l.segment !== k) continue;
        const R = m.R, d = lane.down, P = l.load;
        ls.point.push(l.a, P * (R[0] * d[0] + R[1] * d[1] + R[2] * d[2]), P * (R[3] * d[0] + R[4] * d[1] + R[5] * d[2]), P * (R[6] * d[0] + R[7] * d[1] + R[8] * d[2]));
      }
      for (const l of loads) {
        if (l.segment !== k) continue;
        internalForces(ls, f1, l.a, l.a <= 0, out);
        visit(l, out);
      }
    }
    loaded.fill(0);
    for (const b of wIdx) w[b] = 0;
    wIdx.length = 0;
  };

  // best sample per (segment, row, sign, axle): value, position index, direction
  const nSlot = nSeg * FORCE_ROWS * 2 * nAx;
  const best = new Float64Array(nSlot).fill(-Infinity);
  const bestP = new Int32Array(nSlot).fill(-1);
  const bestD = new Uint8Array(nSlot);
  const leadsOf: Float64Array[] = [];
  directions.forEach((direction, di) => {
    const { lead } = vehiclePositions(path.length, offsets, step, direction, targets);
    leadsOf.push(lead);
    for (let p = 0; p < lead.length; p++) {
      place(direction, lead[p], (l, f) => {
        const base = (l.segment * FORCE_ROWS) * 2 * nAx;
        for (let r = 0; r < FORCE_ROWS; r++) {
          const v = f[r];
          if (v === 0) continue;
          const iMax = base + (r * 2) * nAx + l.axle, iMin = iMax + nAx;
          if (v > best[iMax]) { best[iMax] = v; bestP[iMax] = p; bestD[iMax] = di; }
          if (-v > best[iMin]) { best[iMin] = -v; bestP[iMin] = p; bestD[iMin] = di; }
        }
      });
    }
  });

  // sign·force under one axle on one segment at a vehicle position (−∞ when it is not inside)
  const probe = (direction: Direction, lead: number, k: number, axle: number, row: number, sign: number): { v: number; a: number } => {
    let v = -Infinity, a = NaN;
    place(direction, lead, (l, f) => { if (l.axle === axle) { v = sign * f[row]; a = l.a; } }, k);
    return { v, a };
  };

  const weight = axles.reduce((t, a) => t + Math.abs(a.load), 0);
  const leads: Record<Direction, number[]> = { forward: [], backward: [] };
  const extremes: AxleExtreme[] = [];
  let refinements = 0;
  for (let k = 0; k < nSeg; k++) {
    const L = path.segments[k].L;
    for (let r = 0; r < FORCE_ROWS; r++) {
      for (let sg = 0; sg < 2; sg++) {
        const sign = sg === 0 ? 1 : -1;
        const o = ((k * FORCE_ROWS + r) * 2 + sg) * nAx;
        let top = -Infinity;
        for (let i = 0; i < nAx; i++) top = Math.max(top, best[o + i]);
        // an extreme of the wrong sign (a minimum above zero) is never the member's extreme,
        // nor is round-off (forces below 1e-9 of the vehicle's weight, moments of it × lane length)
        if (!(top > 1e-9 * (r === 0 || r === 1 || r === 2 ? weight : weight * path.length))) continue;
        let found: AxleExtreme | null = null;
        for (let i = 0; i < nAx; i++) {
          const v0 = best[o + i];
          if (!(v0 >= top * (1 - REFINE_WITHIN))) continue;
          const di = bestD[o + i], direction = directions[di], lead = leadsOf[di], p = bestP[o + i];
          let at = lead[p], v = v0, a = probe(direction, at, k, i, r, sign).a, refined = false;
          if (p > 0 && p + 1 < lead.length) {
            const lo = probe(direction, lead[p - 1], k, i, r, sign).v, hi = probe(direction, lead[p + 1], k, i, r, sign).v;
            if (lo < v0 && hi < v0) {
              refinements++;
              const t0 = Math.min(lead[p - 1], lead[p + 1]), t1 = Math.max(lead[p - 1], lead[p + 1]);
              const g = golden((t) => probe(direction, t, k, i, r, sign).v, t0, t1, 1e-9 * Math.max(1, path.length));
              if (g.v > v) {
                const q = probe(direction, g.t, k, i, r, sign);
                // keep the sample unless refining gains more than round-off (a sample on a target is exact)
                if (q.v > v + 1e-12 * Math.abs(v)) { v = q.v; at = g.t; a = q.a; refined = true; }
              }
            }
          }
          if (!found || v > sign * found.value) {
            found = { member: path.segments[k].member, row: r, sign, value: sign * v, lead: at, direction, x: a, axle: i, refined };
          }
        }
        if (!found || !(found.x > 0 && found.x < L)) continue;
        extremes.push(found);
        if (found.refined) leads[found.direction].push(found.lead);
      }
    }
  }
  return { extremes, leads, evaluations, refinements };
}

/** Maximum of f on [a, b] by golden-section search, stopping when the bracket is below tol. */
export function golden(f: (t: number) => number, a: number, b: number, tol: number): { t: number; v: number } {
  let c = b - GOLD * (b - a), d = a + GOLD * (b - a);
  let fc = f(c), fd = f(d);
  for (let it = 0; it < 200 && b - a > tol; it++) {
    if (fc > fd) { b = d; d = c; fd = fc; c = b - GOLD * (b - a); fc = f(c); }
    else { a = c; c = d; fc = fd; d = a + GOLD * (b - a); fd = f(d); }
  }
  return fc > fd ? { t: c, v: fc } : { t: d, v: fd };
}
