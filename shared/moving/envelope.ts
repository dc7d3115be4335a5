/**
 * Envelope of one moving load (a vehicle on a lane): every quantity's maximum and minimum
 * over all vehicle positions and the position that produced each. For every position the
 * axles on the lane give a sparse vector of basis weights w (influence.ts); the dense
 * quantities are QUᵀ·w, the lane members' own statics are added on top, then compared.
 */
import type { InfluenceBasis } from './influence.js';
import { type UnitFefMemo, UnitLoadEffect } from './influence.js';
import type { LinearSystem } from '../engine/system.js';
import { type LanePathGeometry, locate, type PathPoint } from './path.js';
import { axlePosition, type Direction, vehiclePositions } from './positions.js';

export interface Axle { offset: number; load: number }

export interface Envelope {
  /** full layout (influence.ts) */
  max: Float64Array;
  min: Float64Array;
  /** leading-axle position of each extreme (NaN: never reached by the vehicle) */
  posMax: Float64Array;
  posMin: Float64Array;
  /** 0 forward, 1 backward */
  dirMax: Uint8Array;
  dirMin: Uint8Array;
  positions: number;
}

/** Path positions of every node and station of the lane (targets for exact axle placement). */
export function laneTargets(path: LanePathGeometry, basis: InfluenceBasis | ((mi: number) => ArrayLike<number>)): number[] {
  const stations = typeof basis === 'function' ? basis : (mi: number) => basis.memberStations[mi];
  const t: number[] = [...path.nodes];
  for (const g of path.segments) {
    const xs = stations(g.member);
    for (let i = 0; i < xs.length; i++) t.push(g.s0 + (g.reversed ? g.L - xs[i] : xs[i]));
  }
  return t;
}

export function movingEnvelope(
  sys: LinearSystem, basis: InfluenceBasis, path: LanePathGeometry, axles: Axle[], step: number, directions: Direction[],
  opts: { targets?: readonly number[]; extraLeads?: Partial<Record<Direction, readonly number[]>>; memo?: UnitFefMemo } = {},
): Envelope {
  const { nFull, nBasis, QU, denseFull, denseOf } = basis;
  const nDense = denseFull.length;
  const dMax = new Float64Array(nDense).fill(-Infinity), dMin = new Float64Array(nDense).fill(Infinity);
  const dPosMax = new Float64Array(nDense).fill(NaN), dPosMin = new Float64Array(nDense).fill(NaN);
  const dDirMax = new Uint8Array(nDense), dDirMin = new Uint8Array(nDense);
  // local-only quantities: 0 while no axle is on their member
  const max = new Float64Array(nFull), min = new Float64Array(nFull);
  const posMax = new Float64Array(nFull).fill(NaN), posMin = new Float64Array(nFull).fill(NaN);
  const dirMax = new Uint8Array(nFull), dirMin = new Uint8Array(nFull);

  const effect = new UnitLoadEffect(sys, basis, opts.memo);
  const w = new Float64Array(nBasis);
  const wIdx: number[] = [];
  const scratch = new Float64Array(nFull);
  const touched: number[] = [];
  const r = new Float64Array(nDense);
  const nodal = (b: number, v: number) => { if (w[b] === 0) wIdx.push(b); w[b] += v; if (w[b] === 0) w[b] = 1e-300; };
  const fullAdd = (f: number, v: number) => { if (scratch[f] === 0) touched.push(f); scratch[f] += v; if (scratch[f] === 0) scratch[f] = 1e-300; };
  // effects of a unit load per path position, cached: axles of a vehicle whose offsets are
  // multiples of the step stand on the same positions one after another. Key: the position
  // rounded to 1 nm (the effect is then taken at a point within 1 nm, relative change ~1e-12).
  const cache = new Map<number, { nb: Int32Array; nw: Float64Array; fi: Int32Array; fv: Float64Array; di: Int32Array; dv: Float64Array }>();
  let cached = 0;
  const CACHE_LIMIT = 4e6;
  const cb: number[] = [], cw: number[] = [], cf: number[] = [], cv: number[] = [];
  const recNodal = (b: number, v: number) => { cb.push(b); cw.push(v); };
  const recFull = (f: number, v: number) => { cf.push(f); cv.push(v); };
  const axleEffect = (s: number, P: number) => {
    const key = Math.round(s * 1e9);
    let e = cache.get(key);
    if (!e) {
      if (!locate(path, s, pt)) return;
      cb.length = cw.length = cf.length = cv.length = 0;
      effect.apply(path.segments[pt.segment].member, pt.a, 1, true, recNodal, recFull);
      // split the direct entries into dense quantities (added to r) and local-only ones
      const fi: number[] = [], fv: number[] = [], di: number[] = [], dv: number[] = [];
      cf.forEach((f, i) => { if (denseOf[f] >= 0) { di.push(denseOf[f]); dv.push(cv[i]); } else { fi.push(f); fv.push(cv[i]); } });
      e = { nb: Int32Array.from(cb), nw: Float64Array.from(cw), fi: Int32Array.from(fi), fv: Float64Array.from(fv), di: Int32Array.from(di), dv: Float64Array.from(dv) };
      if (cached < CACHE_LIMIT) { cache.set(key, e); cached += cb.length + cf.length + 4; }
    }
    for (let i = 0; i < e.nb.length; i++) nodal(e.nb[i], P * e.nw[i]);
    for (let i = 0; i < e.fi.length; i++) fullAdd(e.fi[i], P * e.fv[i]);
    for (let i = 0; i < e.di.length; i++) { extraD.push(e.di[i]); extraV.push(P * e.dv[i]); }
  };
  const extraD: number[] = [], extraV: number[] = [];
  const pt: PathPoint = { segment: 0, a: 0 };
  const targets = opts.targets ?? laneTargets(path, basis);
  const offsets = axles.map((a) => a.offset);
  let positions = 0;
  let first = true;

  for (const direction of directions) {
    const dirCode = direction === 'forward' ? 0 : 1;
    const { lead } = vehiclePositions(path.length, offsets, step, direction, targets, opts.extraLeads?.[direction]);
    positions += lead.length;
    for (let p = 0; p < lead.length; p++) {
      const L0 = lead[p];
      for (const ax of axles) {
        const s = axlePosition(direction, L0, ax.offset);
        if (s >= 0 && s <= path.length) axleEffect(s, ax.load);
      }
      // dense part r = QUᵀ·w, two basis rows per pass; the last pass fused with the comparison
      const k = wIdx.length;
      let i = 0, started = false;
      while (k - i > 2) {
        const oa = wIdx[i] * nDense, ob = wIdx[i + 1] * nDense, wa = w[wIdx[i]], wb = w[wIdx[i + 1]];
        if (started) for (let d = 0; d < nDense; d++) r[d] += wa * QU[oa + d] + wb * QU[ob + d];
        else for (let d = 0; d < nDense; d++) r[d] = wa * QU[oa + d] + wb * QU[ob + d];
        started = true;
        i += 2;
      }
      if (!started) r.fill(0);
      for (let j = 0; j < extraD.length; j++) r[extraD[j]] += extraV[j];
      extraD.length = extraV.length = 0;
      const oa = k - i >= 1 ? wIdx[i] * nDense : 0, wa = k - i >= 1 ? w[wIdx[i]] : 0;
      const ob = k - i >= 2 ? wIdx[i + 1] * nDense : 0, wb = k - i >= 2 ? w[wIdx[i + 1]] : 0;
      if (first) {
        for (let d = 0; d < nDense; d++) {
          const v = r[d] + wa * QU[oa + d] + wb * QU[ob + d];
          dMax[d] = dMin[d] = v; dPosMax[d] = dPosMin[d] = L0; dDirMax[d] = dDirMin[d] = dirCode;
        }
        first = false;
      } else {
        for (let d = 0; d < nDense; d++) {
          const v = r[d] + wa * QU[oa + d] + wb * QU[ob + d];
          if (v > dMax[d]) { dMax[d] = v; dPosMax[d] = L0; dDirMax[d] = dirCode; }
          else if (v < dMin[d]) { dMin[d] = v; dPosMin[d] = L0; dDirMin[d] = dirCode; }
        }
      }
      for (const b of wIdx) w[b] = 0;
      wIdx.length = 0;
      for (const f of touched) {
        const v = scratch[f];
        scratch[f] = 0;
        if (v > max[f]) { max[f] = v; posMax[f] = L0; dirMax[f] = dirCode; }
        if (v < min[f]) { min[f] = v; posMin[f] = L0; dirMin[f] = dirCode; }
      }
      touched.length = 0;
    }
  }
  for (let d = 0; d < nDense; d++) {
    const f = denseFull[d];
    max[f] = dMax[d]; min[f] = dMin[d];
    posMax[f] = dPosMax[d]; posMin[f] = dPosMin[d];
    dirMax[f] = dDirMax[d]; dirMin[f] = dDirMin[d];
  }
  // constant-N members: copy station 0 along the member
  for (let mi = 0; mi < basis.constantN.length; mi++) {
    if (!basis.constantN[mi]) continue;
    const o = basis.memberOff[mi], nSt = basis.memberStations[mi].length;
    for (let i = 1; i < nSt; i++) {
      max[o + i] = max[o]; min[o + i] = min[o];
      posMax[o + i] = posMax[o]; posMin[o + i] = posMin[o];
      dirMax[o + i] = dirMax[o]; dirMin[o + i] = dirMin[o];
    }
  }
  return { max, min, posMax, posMin, dirMax, dirMin, positions };
}
