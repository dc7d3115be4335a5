/**
 * Forces under the axles: the true extremes of a lane member, not only those at its stations.
 *
 * With only the axles on it, a lane member's moving-load forces are piecewise linear in x
 * (M) or piecewise constant (N, V, T) with breaks at the axles, so over the member the
 * extremes of a vehicle position are at the member's ends (stations) or just left of an axle
 * (the stations' face convention: loads at x are included only at x = 0). For every vehicle
 * position this scan takes each lane member that carries an axle and evaluates its six forces
 * at every axle standing on it (an axle at an end gives that end station's value), from the
 * member's end displacements (the solved lane columns) plus its own fixed-end forces and
 * statics — the same decomposition as influence.ts.
 *
 * Between positions the moment under a given axle is a smooth function of the vehicle
 * position (a polynomial of degree ≤ 4 for a prismatic member until some axle crosses a
 * node; every such crossing is a vehicle position already). The best sample is refined when
 * it is above both neighbouring positions, the parabola through the three promises more than
 * 1e-10 of it, and the moment still rises on one side (probed 1e-6 of a step away; a kink at
 * a node crossing rises on neither): parabolic interpolation on that side, Brent's method as
 * the fallback. So the classic absolute maximum moment of a simple span (midspan bisecting the
 * distance between the critical axle and the resultant) is found to round-off whatever the
 * step. Each axle's best sample within 2 % of the member's best is refined, unless its
 * parabola promises less than 99.9 % of what is found already. N, V and T under an axle are
 * taken at the sampled positions only: between node crossings they are linear in the position
 * on a determinate lane, so their extremes are at sampled positions; on an indeterminate lane
 * a maximum between two positions is possible and is not refined (its shortfall shrinks with
 * the square of the step).
 *
 * The result: per lane member and force, the maximum (sign +1) and minimum (sign −1) under an
 * axle with the vehicle position and x, where no station of the member reaches it at that
 * position; index.ts turns each x into an extra station of that member and each refined
 * position into an extra vehicle position, so the envelope (and every design check, which
 * reads stations) carries these values exactly.
 */
import { vecToGlobal12, vecToLocal12 } from '../engine/axes.js';
import type { LoadSet } from '../engine/loadSet.js';
import { internalForces } from '../engine/statics.js';
import { elementLocal, type LinearSystem } from '../engine/system.js';
import type { Axle } from './envelope.js';
import type { LaneResponse, UnitFefMemo } from './influence.js';
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
  /** true when refinement moved the position off the sampled ones */
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

/** an axle's best sample is refined when within this fraction of the member's best */
const REFINE_WITHIN = 0.02;

export function scanAxles(
  sys: LinearSystem, lane: LaneResponse, path: LanePathGeometry, axles: Axle[], step: number,
  directions: Direction[], targets: readonly number[], stationsOf: (mi: number) => ArrayLike<number>, memo: UnitFefMemo,
): AxleScan {
  const { mesh } = sys;
  const { X, nEq, basisOf, down } = lane;
  const nSeg = path.segments.length, nAx = axles.length;
  const offsets = axles.map((a) => a.offset);
  const kl = path.segments.map((g) => elementLocal(mesh, mesh.members[g.member].firstElement, new Float64Array(144)));
  // equation number of each end freedom of each segment's member (−1: none)
  const eqEnd = new Int32Array(12 * nSeg);
  path.segments.forEach((g, k) => {
    const m = mesh.members[g.member];
    for (let j = 0; j < 12; j++) eqEnd[12 * k + j] = lane.eq[j < 6 ? m.start * 6 + j : m.end * 6 + j - 6];
  });
  // local load components of a unit load along −vertical, per segment
  const comp = new Float64Array(3 * nSeg);
  path.segments.forEach((g, k) => {
    const R = mesh.members[g.member].R;
    for (let r = 0; r < 3; r++) comp[3 * k + r] = R[3 * r] * down[0] + R[3 * r + 1] * down[1] + R[3 * r + 2] * down[2];
  });
  const fg = new Float64Array(12), ue = new Float64Array(12), ul = new Float64Array(12);
  const f1 = new Float64Array(6), out = new Float64Array(6);
  const ls: LoadSet = { dist: [], point: [], moment: [], eps: 0, grad: 0 };
  const w = new Float64Array(lane.nBasis);
  const wIdx: number[] = [];
  const pt: PathPoint = { segment: 0, a: 0 };
  // axles on the lane at the current position
  const lSeg = new Int32Array(nAx), lA = new Float64Array(nAx), lAxle = new Int32Array(nAx);
  let nLoads = 0;
  const fefSum = new Float64Array(6 * nSeg);
  const loaded = new Uint8Array(nSeg);
  let evaluations = 0;

  /** Unit-load effect at a path point: basis weights and the member's local start fixed-end forces. */
  interface Unit { segment: number; a: number; n: number; nb: Int32Array; nw: Float64Array; f6: Float64Array }
  const scratch: Unit = { segment: 0, a: 0, n: 0, nb: new Int32Array(12), nw: new Float64Array(12), f6: new Float64Array(6) };
  /** the unit effect at distance a on segment k, into `u` */
  const unitAt = (k: number, a: number, u: Unit): Unit => {
    const mi = path.segments[k].member, m = mesh.members[mi];
    const fef = memo.get(mi, a);
    vecToGlobal12(m.R, fef, fg);
    u.segment = k; u.a = a; u.n = 0;
    for (let j = 0; j < 12; j++) {
      const b = basisOf[j < 6 ? m.start * 6 + j : m.end * 6 + j - 6];
      if (b >= 0 && fg[j] !== 0) { u.nb[u.n] = b; u.nw[u.n] = -fg[j]; u.n++; }
    }
    for (let j = 0; j < 6; j++) u.f6[j] = fef[j];
    return u;
  };

  // the cache in flat pools (entry e: segment, a, count, 12 basis columns and weights, 6 forces)
  const cacheOf = new Map<number, number>();
  const CACHE_LIMIT = 2e5;
  let cSeg = new Int32Array(1024), cA = new Float64Array(1024), cN = new Int32Array(1024);
  let cB = new Int32Array(1024 * 12), cW = new Float64Array(1024 * 12), cF = new Float64Array(1024 * 6);
  let nCached = 0;
  const grow = <T extends Int32Array | Float64Array>(a: T, n: number): T => {
    if (a.length >= n) return a;
    const b = new (a.constructor as new (n: number) => T)(Math.max(n, 2 * a.length));
    b.set(a);
    return b;
  };
  const store = (u: Unit): number => {
    if (nCached >= CACHE_LIMIT) return -1;
    const e = nCached++;
    cSeg = grow(cSeg, e + 1); cA = grow(cA, e + 1); cN = grow(cN, e + 1);
    cB = grow(cB, 12 * (e + 1)); cW = grow(cW, 12 * (e + 1)); cF = grow(cF, 6 * (e + 1));
    cSeg[e] = u.segment; cA[e] = u.a; cN[e] = u.n;
    for (let j = 0; j < u.n; j++) { cB[12 * e + j] = u.nb[j]; cW[12 * e + j] = u.nw[j]; }
    for (let j = 0; j < 6; j++) cF[6 * e + j] = u.f6[j];
    return e;
  };
  const cached: Unit = { segment: 0, a: 0, n: 0, nb: new Int32Array(12), nw: new Float64Array(12), f6: new Float64Array(6) };
  const load = (e: number): Unit => {
    cached.segment = cSeg[e]; cached.a = cA[e]; cached.n = cN[e];
    for (let j = 0; j < cached.n; j++) { cached.nb[j] = cB[12 * e + j]; cached.nw[j] = cW[12 * e + j]; }
    for (let j = 0; j < 6; j++) cached.f6[j] = cF[6 * e + j];
    return cached;
  };

  /**
   * Place the vehicle at `lead`: nodal weights w, axle loads per segment with their fixed-end
   * forces summed in fefSum; then call `visit` for every axle on a member with the six forces
   * just left of it (at the start node just right of it: the stations' face convention). With
   * `only` ≥ 0 just that segment is evaluated, and an axle on one of its end nodes counts as
   * on it (same nodal loads).
   */
  const place = (direction: Direction, lead: number, visit: (k: number, axle: number, a: number, f: Float64Array) => void, only = -1) => {
    evaluations++;
    nLoads = 0;
    for (let i = 0; i < nAx; i++) {
      const s = axlePosition(direction, lead, offsets[i]);
      if (!(s >= 0 && s <= path.length)) continue;
      let u: Unit;
      if (only < 0) {
        // regular positions: unit effects cached by path position rounded to 1 nm (see envelope.ts)
        const key = Math.round(s * 1e9);
        let e = cacheOf.get(key);
        if (e === undefined) {
          if (!locate(path, s, pt)) continue;
          unitAt(pt.segment, pt.a, scratch);
          e = store(scratch);
          if (e >= 0) cacheOf.set(key, e);
        }
        u = e >= 0 ? load(e) : scratch;
      } else {
        if (!locate(path, s, pt)) continue;
        if (pt.segment !== only) {
          const g = path.segments[only], t = s - g.s0, tol = 1e-12 * path.length;
          if (t >= -tol && t <= g.L + tol) {
            const c = Math.min(g.L, Math.max(0, t));
            pt.segment = only;
            pt.a = g.reversed ? g.L - c : c;
          }
        }
        // the fixed-end forces come from the memo shared with the envelopes (index.ts)
        u = unitAt(pt.segment, pt.a, scratch);
      }
      const P = axles[i].load, k = u.segment;
      for (let j = 0; j < u.n; j++) {
        const b = u.nb[j];
        if (w[b] === 0) wIdx.push(b);
        w[b] += P * u.nw[j];
        if (w[b] === 0) w[b] = 1e-300;
      }
      if (!loaded[k]) { loaded[k] = 1; fefSum.fill(0, 6 * k, 6 * k + 6); }
      for (let j = 0; j < 6; j++) fefSum[6 * k + j] += P * u.f6[j];
      lSeg[nLoads] = k; lA[nLoads] = u.a; lAxle[nLoads] = i; nLoads++;
    }
    for (let n = 0; n < nLoads; n++) {
      const k = lSeg[n];
      if (!loaded[k] || (only >= 0 && k !== only)) continue;
      loaded[k] = 0;
      const m = mesh.members[path.segments[k].member];
      // end displacements of the member from the solved lane columns, then its start end forces
      for (let j = 0; j < 12; j++) {
        const e = eqEnd[12 * k + j];
        let v = 0;
        if (e >= 0) for (let q = 0; q < wIdx.length; q++) v += w[wIdx[q]] * X[wIdx[q] * nEq + e];
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
      for (let q = n; q < nLoads; q++) {
        if (lSeg[q] !== k) continue;
        const P = axles[lAxle[q]].load;
        ls.point.push(lA[q], P * comp[3 * k], P * comp[3 * k + 1], P * comp[3 * k + 2]);
      }
      for (let q = n; q < nLoads; q++) {
        if (lSeg[q] !== k) continue;
        internalForces(ls, f1, lA[q], lA[q] <= 0, out);
        visit(k, lAxle[q], lA[q], out);
      }
    }
    loaded.fill(0);
    for (const b of wIdx) w[b] = 0;
    wIdx.length = 0;
  };

  // best sample per (segment, row, sign, axle): value, where, and the values at the positions
  // just before and after it (−∞: the axle was not on that segment there, or not yet seen)
  const nSlot = nSeg * FORCE_ROWS * 2 * nAx;
  const best = new Float64Array(nSlot).fill(-Infinity);
  const bestP = new Int32Array(nSlot).fill(-1);
  const bestA = new Float64Array(nSlot);
  const prevV = new Float64Array(nSlot).fill(-Infinity), nextV = new Float64Array(nSlot).fill(-Infinity);
  const lastV = new Float64Array(nSlot), lastP = new Int32Array(nSlot).fill(-2);
  const leadsOf: Float64Array[] = [];
  // position indices run on across directions with a gap, so neighbours never span two directions
  const firstOf: number[] = [];
  let first = 0, gp = 0;
  const record = (k: number, axle: number, a: number, f: Float64Array) => {
    const base = k * FORCE_ROWS * 2 * nAx + axle;
    for (let q = 0; q < 2 * FORCE_ROWS; q++) {
      const r = q >> 1;
      // a force that is exactly zero here (out of the plane of a plane frame) is no extreme
      if (f[r] === 0) { q++; continue; }
      const v = (q & 1) === 0 ? f[r] : -f[r];
      const i = base + q * nAx;
      if (bestP[i] === gp - 1) nextV[i] = v;
      if (v > best[i]) {
        best[i] = v; bestP[i] = gp; bestA[i] = a;
        prevV[i] = lastP[i] === gp - 1 ? lastV[i] : -Infinity;
        nextV[i] = -Infinity;
      }
      lastV[i] = v; lastP[i] = gp;
    }
  };
  for (const direction of directions) {
    const { lead } = vehiclePositions(path.length, offsets, step, direction, targets);
    leadsOf.push(lead);
    firstOf.push(first);
    for (let p = 0; p < lead.length; p++) {
      gp = first + p;
      place(direction, lead[p], record);
    }
    first += lead.length + 1;
  }

  /** direction index, its positions and the index among them of a slot's best sample */
  const where = (slot: number) => {
    let di = 0;
    while (di + 1 < firstOf.length && bestP[slot] >= firstOf[di + 1]) di++;
    return { di, lead: leadsOf[di], p: bestP[slot] - firstOf[di] };
  };

  // sign·force under one axle on one segment at a vehicle position (−∞ when it is not there)
  const probe = (direction: Direction, lead: number, k: number, axle: number, row: number, sign: number): { v: number; a: number } => {
    let v = -Infinity, a = NaN;
    place(direction, lead, (_k, ax, x, f) => { if (ax === axle) { v = sign * f[row]; a = x; } }, k);
    return { v, a };
  };

  const weight = axles.reduce((t, a) => t + Math.abs(a.load), 0);
  const leads: Record<Direction, number[]> = { forward: [], backward: [] };
  const extremes: AxleExtreme[] = [];
  let refinements = 0;
  const cands: { i: number; peak: number }[] = [];
  for (let k = 0; k < nSeg; k++) {
    const L = path.segments[k].L, xs = stationsOf(path.segments[k].member);
    for (let r = 0; r < FORCE_ROWS; r++) {
      for (let sg = 0; sg < 2; sg++) {
        const sign = sg === 0 ? 1 : -1;
        const o = ((k * FORCE_ROWS + r) * 2 + sg) * nAx;
        let top = -Infinity;
        for (let i = 0; i < nAx; i++) top = Math.max(top, best[o + i]);
        // an extreme of the wrong sign (a minimum above zero) is never the member's extreme,
        // nor is round-off (forces below 1e-9 of the vehicle's weight, moments of it × lane length)
        if (!(top > 1e-9 * (r === 0 || r === 1 || r === 2 ? weight : weight * path.length))) continue;
        // each axle's best sample within REFINE_WITHIN of the top, by the peak its parabola promises
        cands.length = 0;
        for (let i = 0; i < nAx; i++) {
          const slot = o + i, v0 = best[slot];
          if (!(v0 >= top * (1 - REFINE_WITHIN))) continue;
          const { lead, p } = where(slot);
          let peak = v0;
          if (p > 0 && p + 1 < lead.length && prevV[slot] < v0 && nextV[slot] < v0) {
            peak = parabolaPeak(lead[p - 1], prevV[slot], lead[p], v0, lead[p + 1], nextV[slot]);
          }
          cands.push({ i, peak });
        }
        cands.sort((x, y) => y.peak - x.peak);
        let found: AxleExtreme | null = null;
        for (const { i, peak } of cands) {
          const slot = o + i, v0 = best[slot];
          // a candidate whose promise (good to the parabola's third-order error) stays below what is found already
          if (found && peak < sign * found.value * (1 - 1e-3)) continue;
          const { di, lead, p } = where(slot);
          const direction = directions[di];
          let at = lead[p], v = v0, a = bestA[slot], refined = false;
          if (p > 0 && p + 1 < lead.length) {
            // a neighbour the scan did not see on this segment (the axle on an end node) is probed
            const lo = prevV[slot] > -Infinity ? prevV[slot] : probe(direction, lead[p - 1], k, i, r, sign).v;
            const hi = nextV[slot] > -Infinity ? nextV[slot] : probe(direction, lead[p + 1], k, i, r, sign).v;
            // which side rises from the sample (none: the sample is the top, e.g. a kink where an axle is on a node)
            let side = 0, td = 0, vd = 0;
            if (r >= 4 && lo < v0 && hi < v0 && worthRefining(lead[p - 1], lo, lead[p], v0, lead[p + 1], hi)) {
              const d = 1e-6 * Math.min(Math.abs(lead[p] - lead[p - 1]), Math.abs(lead[p + 1] - lead[p]));
              const up = Math.sign(lead[p + 1] - lead[p]);
              td = lead[p] - up * d; vd = probe(direction, td, k, i, r, sign).v;
              if (vd > v0) side = -1;
              else {
                td = lead[p] + up * d; vd = probe(direction, td, k, i, r, sign).v;
                if (vd > v0) side = 1;
              }
            }
            if (side !== 0) {
              refinements++;
              const f = (t: number) => probe(direction, t, k, i, r, sign).v;
              const other = lead[p + side], vo = side < 0 ? lo : hi;
              const g = maximiseSmooth(f, [lead[p], td, other], [v0, vd, vo], 1e-9 * Math.max(1, path.length));
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
        // no station needed when a station of the member reaches the value at that same position
        // (N, V and T are constant between axles; the member's statics are left in f1 and ls)
        probe(found.direction, found.lead, k, found.axle, r, sign);
        let atStation = false;
        for (let j = 0; j < xs.length && !atStation; j++) {
          internalForces(ls, f1, xs[j], xs[j] <= 0, out);
          atStation = sign * out[r] >= sign * found.value - 1e-12 * Math.abs(found.value);
        }
        if (!found.refined && atStation) continue;
        extremes.push(found);
        if (found.refined) leads[found.direction].push(found.lead);
      }
    }
  }
  return { extremes, leads, evaluations, refinements };
}

/** Peak of the parabola through (t0, y0), (t1, y1), (t2, y2); +∞ when it is not concave (a kink). */
export function parabolaPeak(t0: number, y0: number, t1: number, y1: number, t2: number, y2: number): number {
  const d01 = (y1 - y0) / (t1 - t0), d12 = (y2 - y1) / (t2 - t1);
  const a2 = (d12 - d01) / (t2 - t0);
  if (!(a2 < 0)) return Infinity;
  const a1 = d01 - a2 * (t0 + t1);
  const tp = -a1 / (2 * a2);
  return y0 + (tp - t0) * d01 + a2 * (tp - t0) * (tp - t1);
}

/**
 * Whether the samples around a sampled maximum y1 leave room for more than 1e-10·|y1|: the
 * parabola through them estimates the peak (a smooth maximum is quadratic near its top); a
 * non-concave fit (a kink) is always refined.
 */
export function worthRefining(t0: number, y0: number, t1: number, y1: number, t2: number, y2: number): boolean {
  return parabolaPeak(t0, y0, t1, y1, t2, y2) - y1 > 1e-10 * Math.abs(y1);
}

/**
 * Maximum of a smooth f between ts[0] and ts[2] (three samples with ts[1] between them, f
 * rising from ts[0] towards ts[1]): successive parabolic interpolation — exact in one step for
 * a quadratic, a few for the quartics met here — falling back on Brent's method when a
 * parabola is not concave or leaves the bracket. Stops when a step is below tol or gains
 * nothing above round-off.
 */
export function maximiseSmooth(f: (t: number) => number, ts: number[], vs: number[], tol: number): { t: number; v: number } {
  const lo = Math.min(ts[0], ts[2]), hi = Math.max(ts[0], ts[2]);
  const t = ts.slice(), v = vs.slice();
  let bi = v[0] >= v[1] && v[0] >= v[2] ? 0 : v[1] >= v[2] ? 1 : 2;
  for (let it = 0; it < 30; it++) {
    const peakT = parabolaVertex(t[0], v[0], t[1], v[1], t[2], v[2]);
    if (!(peakT > lo && peakT < hi)) return maximise(f, lo, hi, tol);
    const step = Math.abs(peakT - t[bi]);
    const vp = f(peakT);
    // replace the lowest sample
    let wi = 0;
    for (let j = 1; j < 3; j++) if (v[j] < v[wi]) wi = j;
    const gain = vp - v[bi];
    t[wi] = peakT; v[wi] = vp;
    if (gain > 0) bi = wi;
    if (step < tol || Math.abs(gain) <= 1e-15 * Math.abs(vp)) break;
  }
  return { t: t[bi], v: v[bi] };
}

/** Abscissa of the vertex of the parabola through three points (NaN when it is not concave). */
function parabolaVertex(t0: number, y0: number, t1: number, y1: number, t2: number, y2: number): number {
  const d01 = (y1 - y0) / (t1 - t0), d12 = (y2 - y1) / (t2 - t1);
  const a2 = (d12 - d01) / (t2 - t0);
  if (!(a2 < 0)) return NaN;
  return -(d01 - a2 * (t0 + t1)) / (2 * a2);
}

/**
 * Maximum of f on [a, b] by Brent's method (parabolic steps, golden-section steps when a
 * parabola does not help; R. P. Brent, Algorithms for Minimization without Derivatives,
 * 1973, ch. 5, from memory), stopping when the bracket is below about 4·tol. f may return
 * −∞ (treated as very low). Exact for a quadratic after a few steps.
 */
export function maximise(f: (t: number) => number, a: number, b: number, tol: number): { t: number; v: number } {
  const C = (3 - Math.sqrt(5)) / 2;
  const g = (t: number) => { const v = f(t); return v === -Infinity ? Infinity : -v; };
  let x = a + C * (b - a), w = x, v = x;
  let fx = g(x), fw = fx, fv = fx;
  let d = 0, e = 0;
  for (let it = 0; it < 100; it++) {
    const m = 0.5 * (a + b), tol2 = 2 * tol;
    if (Math.abs(x - m) <= tol2 - 0.5 * (b - a)) break;
    let golden = true;
    if (Math.abs(e) > tol) {
      let r = (x - w) * (fx - fv), q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p; else q = -q;
      const eOld = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * eOld) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < m ? tol : -tol;
        golden = false;
      }
    }
    if (golden) { e = x >= m ? a - x : b - x; d = C * e; }
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = g(u);
    if (fu <= fx) {
      if (u >= x) a = x; else b = x;
      v = w; fv = fw; w = x; fw = fx; x = u; fx = fu;
    } else {
      if (u < x) a = u; else b = u;
      if (fu <= fw || w === x) { v = w; fv = fw; w = u; fw = fu; }
      else if (fu <= fv || v === x || v === w) { v = u; fv = fu; }
    }
  }
  return { t: x, v: fx === Infinity ? -Infinity : -fx };
}
