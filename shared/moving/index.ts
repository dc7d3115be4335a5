/**
 * Moving loads (vehicles crossing a deck): lane paths, vehicle positions, influence lines
 * by one block solve, and per quantity the envelope over all positions. The engine calls
 * `computeMoving` when the model has moving loads and exposes the result as
 * `AnalysisResult.moving`; loadings that include a moving-load case come twice, with
 * `envelope: 'max'` and `'min'` (see `expandLoadings`).
 *
 * True extremes (issue 11): a force of a lane member peaks under an axle, between stations.
 * The choice made here: before the envelopes, a scan evaluates every lane member under every
 * axle at every vehicle position (axles.ts); each x where a force has its extreme under an
 * axle (and no station reaches it) is added to that member's stations — for every loading, so
 * the engine's member forces, the design checks (which search every station) and the exports
 * all read it — and each position found by refinement between the regular ones is added to
 * the vehicle positions, so the one envelope pass carries the exact value at that station.
 * `memberExtremes` then reports each force's absolute max and min with x and position.
 */
import type { ForceKey, Loading } from '../engine/types.js';
import { FORCE_KEYS } from '../engine/types.js';
import type { Model } from '../model/types.js';
import { type Envelope, laneTargets, movingEnvelope } from './envelope.js';
import { type AxleScan, scanAxles } from './axles.js';
import { UnitFefMemo, buildInfluenceBasis, type InfluenceBasis, type InfluenceInput, UnitLoadEffect } from './influence.js';
import { buildLanePath, type LanePathGeometry, locate, type PathPoint } from './path.js';
import type { Direction } from './positions.js';
import { type InfluenceLine, type MemberExtremes, type MemberQuantity, MOVING_FORCE_KEYS, type MovingResults, type VehicleAt } from './types.js';

export type { ForceExtreme, InfluenceLine, MemberExtremes, MemberQuantity, MovingForceKey, MovingResults, VehicleAt } from './types.js';
export { MOVING_FORCE_KEYS } from './types.js';
export { buildLanePath, locate, pathPosition } from './path.js';
export { vehiclePositions, axlePosition } from './positions.js';

export interface MovingComputation {
  basis: InfluenceBasis;
  paths: Map<string, LanePathGeometry>;
  /** per model.movingLoads row */
  envelopes: Envelope[];
  /** per model.movingLoads row: the extremes found under the axles (axles.ts) */
  axleScans: AxleScan[];
  /** case index -> rows of model.movingLoads */
  rowsOfCase: Map<number, number[]>;
  /** stations added to lane members at the governing axle positions */
  extraStations: number;
  /** time spent in the scan under the axles (included in milliseconds) */
  axleMs: number;
  milliseconds: number;
}

export type MovingInput = Omit<InfluenceInput, 'laneMembers'>;

/**
 * Lane paths, the scan under the axles, the influence basis and the envelopes. The member
 * stations of the result are the engine's stations plus, on lane members, every x where a
 * force's extreme under an axle occurs (axles.ts), and the vehicle positions include those
 * where the extreme occurs: so the station envelope — and every design check that reads
 * stations — carries the true extremes of the vehicle, not only those at stations.
 */
export function computeMoving(inp: MovingInput): MovingComputation {
  const t0 = performance.now();
  const { model, sys } = inp;
  const paths = new Map<string, LanePathGeometry>();
  const laneMembers = new Set<number>();
  for (const ml of model.movingLoads) {
    if (paths.has(ml.lane)) continue;
    const p = buildLanePath(model, ml.lane, (mi) => sys.mesh.members[mi].L);
    paths.set(ml.lane, p);
    for (const g of p.segments) laneMembers.add(g.member);
  }
  const rowsOfCase = new Map<number, number[]>();
  const runs = model.movingLoads.map((ml, j) => {
    const where = `moving load${ml.row !== undefined ? ` (row ${ml.row})` : ''} of case ${ml.case}`;
    const c = sys.caseIndex.get(ml.case);
    if (c === undefined) throw new Error(`${where}: the case does not exist`);
    const axles = model.vehicles.filter((v) => v.vehicle === ml.vehicle).map((v) => ({ offset: v.offset, load: v.load }));
    if (axles.length === 0) throw new Error(`${where}: vehicle ${ml.vehicle} has no axles`);
    const path = paths.get(ml.lane)!;
    const step = ml.step ?? path.length / 200;
    const dirs: Direction[] = ml.direction === 'both' ? ['forward', 'backward'] : [ml.direction];
    const list = rowsOfCase.get(c) ?? [];
    list.push(j);
    rowsOfCase.set(c, list);
    // vehicle positions target the engine's stations (not the extra ones: those come with their own positions)
    return { axles, path, step, dirs, targets: laneTargets(path, inp.stations) };
  });
  const axleScans: AxleScan[] = [];
  let extraStations = 0, axleMs = 0;
  const memo = new UnitFefMemo(sys, model.settings.verticalAxis === 'Y' ? [0, -1, 0] : [0, 0, -1]);
  const basis = buildInfluenceBasis({ ...inp, laneMembers }, (lane) => {
    const extra = new Map<number, number[]>();
    const ta = performance.now();
    for (const r of runs) {
      const scan = scanAxles(sys, lane, r.path, r.axles, r.step, r.dirs, r.targets, inp.stations, memo);
      axleScans.push(scan);
      for (const e of scan.extremes) {
        const list = extra.get(e.member) ?? [];
        list.push(e.x);
        extra.set(e.member, list);
      }
    }
    axleMs = performance.now() - ta;
    return extra;
  });
  for (const mi of laneMembers) extraStations += basis.memberStations[mi].length - inp.stations(mi).length;
  const envelopes = runs.map((r, j) =>
    movingEnvelope(sys, basis, r.path, r.axles, r.step, r.dirs, { targets: r.targets, extraLeads: axleScans[j].leads, memo }));
  return { basis, paths, envelopes, axleScans, rowsOfCase, extraStations, axleMs, milliseconds: performance.now() - t0 };
}

/** Loadings with every one that includes a moving-load case split into a max and a min envelope. */
export function expandLoadings(loadings: Loading[], comp: MovingComputation): Loading[] {
  const out: Loading[] = [];
  for (const ld of loadings) {
    if (ld.terms.some((t) => comp.rowsOfCase.has(t.caseIndex))) {
      out.push({ ...ld, envelope: 'max' }, { ...ld, envelope: 'min' });
    } else out.push(ld);
  }
  return out;
}

/**
 * Add the moving part of an envelope loading to out[i] for full-layout indices
 * from..from+out.length: Σ over terms of factor × (the extreme that raises the max or
 * lowers the min), each moving load's extreme taken per quantity.
 */
export function addMovingPart(comp: MovingComputation, ld: Loading, from: number, out: Float64Array): void {
  if (!ld.envelope) return;
  const wantMax = ld.envelope === 'max';
  for (const { caseIndex, factor } of ld.terms) {
    const rows = comp.rowsOfCase.get(caseIndex);
    if (!rows || factor === 0) continue;
    for (const j of rows) {
      const env = comp.envelopes[j];
      const src = (factor > 0) === wantMax ? env.max : env.min;
      for (let i = 0; i < out.length; i++) out[i] += factor * src[from + i];
    }
  }
}

/** The moving load whose factored extreme contributes most to full quantity f of an envelope loading. */
function governingAt(comp: MovingComputation, model: Model, ld: Loading, f: number): VehicleAt | null {
  if (!ld.envelope) return null;
  const wantMax = ld.envelope === 'max';
  let best: VehicleAt | null = null, bestMag = 0;
  for (const { caseIndex, factor } of ld.terms) {
    const rows = comp.rowsOfCase.get(caseIndex);
    if (!rows || factor === 0) continue;
    for (const j of rows) {
      const env = comp.envelopes[j];
      const useMax = (factor > 0) === wantMax;
      const v = Math.abs(factor * (useMax ? env.max[f] : env.min[f]));
      const pos = useMax ? env.posMax[f] : env.posMin[f];
      const dir = useMax ? env.dirMax[f] : env.dirMin[f];
      if (pos === pos && (best === null || v > bestMag)) {
        const ml = model.movingLoads[j];
        best = { movingLoad: j, lane: ml.lane, vehicle: ml.vehicle, direction: dir ? 'backward' : 'forward', lead: pos };
        bestMag = v;
      }
    }
  }
  return best;
}

const ROW_OF: Record<ForceKey, number> = Object.fromEntries(FORCE_KEYS.map((k, i) => [k, i])) as Record<ForceKey, number>;

/** The public view (types.ts) over a computation. */
export function movingResults(model: Model, comp: MovingComputation, loadings: Loading[], inp: MovingInput): MovingResults {
  const { basis } = comp;
  const vehicles: MovingResults['vehicles'] = {};
  for (const v of model.vehicles) (vehicles[v.vehicle] ??= []).push({ axle: v.axle, offset: v.offset, load: v.load });
  const effect = new UnitLoadEffect(inp.sys, basis);
  const memberFull = (mi: number, key: ForceKey, station: number) => {
    const nSt = basis.memberStations[mi].length;
    if (!(station >= 0 && station < nSt)) throw new Error(`station ${station} out of range`);
    return basis.memberOff[mi] + ROW_OF[key] * nSt + station;
  };
  return {
    lanes: [...comp.paths.values()].map((p) => ({
      lane: p.lane, length: p.length,
      segments: p.segments.map((g) => ({ member: g.memberId, reversed: g.reversed, s0: g.s0, L: g.L })),
    })),
    vehicles,
    isEnvelope: (l) => loadings[l]?.envelope !== undefined,
    memberPosition: (mi, l, key, station) => governingAt(comp, model, loadings[l], memberFull(mi, key, station)),
    nodePosition: (n, l, kind, k) => governingAt(comp, model, loadings[l], (kind === 'reaction' ? basis.nUser * 6 : 0) + n * 6 + k),
    influenceLine(j: number, q: MemberQuantity): InfluenceLine {
      const ml = model.movingLoads[j];
      if (!ml) throw new Error(`moving load ${j} does not exist`);
      const path = comp.paths.get(ml.lane)!;
      const f = memberFull(q.member, q.key, q.station);
      const full = basis.constantN[q.member] && q.key === 'N' ? basis.memberOff[q.member] : f;
      const pts = laneTargets(path, basis);
      for (let i = 0; i <= 200; i++) pts.push((path.length * i) / 200);
      pts.sort((a, b) => a - b);
      const s = Float64Array.from(pts.filter((v, i) => i === 0 || v - pts[i - 1] > 1e-9 * path.length));
      const value = new Float64Array(s.length);
      const d = basis.denseOf[full], nDense = basis.denseFull.length;
      const pt: PathPoint = { segment: 0, a: 0 };
      for (let i = 0; i < s.length; i++) {
        if (!locate(path, s[i], pt)) continue;
        let v = 0;
        effect.apply(path.segments[pt.segment].member, pt.a, 1, path.segments[pt.segment].member === q.member,
          (b, w) => { if (d >= 0) v += w * basis.QU[b * nDense + d]; },
          (g, x) => { if (g === full) v += x; });
        value[i] = v;
      }
      return { s, value };
    },
    memberEnvelope(j, mi) {
      const env = comp.envelopes[j];
      if (!env) throw new Error(`moving load ${j} does not exist`);
      const xs = basis.memberStations[mi];
      const nSt = xs.length, o = basis.memberOff[mi];
      const max = {} as Record<ForceKey, Float64Array>, min = {} as Record<ForceKey, Float64Array>;
      FORCE_KEYS.forEach((k, r) => {
        max[k] = env.max.slice(o + r * nSt, o + (r + 1) * nSt);
        min[k] = env.min.slice(o + r * nSt, o + (r + 1) * nSt);
      });
      return { x: xs.slice(), max, min };
    },
    memberExtremes(j, mi) {
      const env = comp.envelopes[j];
      if (!env) throw new Error(`moving load ${j} does not exist`);
      if (!(mi >= 0 && mi < basis.memberStations.length)) throw new Error(`member index ${mi} out of range`);
      const xs = basis.memberStations[mi];
      const nSt = xs.length, o = basis.memberOff[mi];
      const ml = model.movingLoads[j];
      const at = (pos: number, dir: number): VehicleAt | null => (pos === pos
        ? { movingLoad: j, lane: ml.lane, vehicle: ml.vehicle, direction: dir ? 'backward' : 'forward', lead: pos } : null);
      const out = {} as MemberExtremes;
      for (const key of MOVING_FORCE_KEYS) {
        const f = o + ROW_OF[key] * nSt;
        let iMax = 0, iMin = 0;
        for (let i = 1; i < nSt; i++) {
          if (env.max[f + i] > env.max[f + iMax]) iMax = i;
          if (env.min[f + i] < env.min[f + iMin]) iMin = i;
        }
        out[key] = {
          max: { value: env.max[f + iMax], x: xs[iMax], station: iMax, at: at(env.posMax[f + iMax], env.dirMax[f + iMax]) },
          min: { value: env.min[f + iMin], x: xs[iMin], station: iMin, at: at(env.posMin[f + iMin], env.dirMin[f + iMin]) },
        };
      }
      return out;
    },
    diagnostics: {
      basis: basis.nBasis,
      quantities: basis.denseFull.length,
      positions: comp.envelopes.reduce((n, e) => n + e.positions, 0),
      extraStations: comp.extraStations,
      refined: comp.axleScans.reduce((n, a) => n + a.leads.forward.length + a.leads.backward.length, 0),
      axleMilliseconds: comp.axleMs,
      milliseconds: comp.milliseconds,
    },
  };
}
