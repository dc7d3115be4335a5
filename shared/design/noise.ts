/**
 * Numerical noise in results: a force below NOISE_RELATIVE (1e-9) of the model's largest
 * force is zero for classification (EN Table 5.2 stress distribution, AISC compression or
 * tension, flexure), warnings and exports. Written once here; the design checks and the
 * exports use it.
 *
 * The model's largest force is the largest reaction component (fx, fy, fz) over the
 * loadings considered — every load path of a supported model ends in a reaction. A
 * loading that is self-equilibrated (no reactions at all) then gives a floor of zero, so
 * nothing is treated as noise (the safe side). Moments use the force floor times the
 * model's extent (the diagonal of the box around its nodes, at least 1 m).
 */
import type { AnalysisResult, StationForces } from '../engine/types.js';
import type { Model } from '../model/types.js';

export const NOISE_RELATIVE = 1e-9;

export interface NoiseFloor {
  /** N (forces below are zero) */
  force: number;
  /** N·m (moments below are zero) */
  moment: number;
}

/** Diagonal of the box around the model's nodes (m), at least 1. */
export function modelExtent(model: Pick<Model, 'nodes'>): number {
  if (!model.nodes.length) return 1;
  let x0 = Infinity, y0 = Infinity, z0 = Infinity, x1 = -Infinity, y1 = -Infinity, z1 = -Infinity;
  for (const n of model.nodes) {
    if (n.x < x0) x0 = n.x; if (n.x > x1) x1 = n.x;
    if (n.y < y0) y0 = n.y; if (n.y > y1) y1 = n.y;
    if (n.z < z0) z0 = n.z; if (n.z > z1) z1 = n.z;
  }
  const d = Math.hypot(x1 - x0, y1 - y0, z1 - z0);
  return Number.isFinite(d) && d > 1 ? d : 1;
}

/**
 * Floors already worked out, by analysis, then model, then loadings: the member page asks for
 * one member at a time, and each floor reads every reaction of the loadings (a result never
 * changes once made, so the objects themselves are the keys).
 */
const floors = new WeakMap<object, WeakMap<object, Map<string, NoiseFloor>>>();

/** The noise floor over the given loadings (all loadings when omitted). */
export function noiseFloor(model: Pick<Model, 'nodes'>, analysis: Pick<AnalysisResult, 'reactions' | 'loadings' | 'supportedNodes'>, loadings?: number[]): NoiseFloor {
  let byModel = floors.get(analysis);
  if (!byModel) floors.set(analysis, (byModel = new WeakMap()));
  let byLoadings = byModel.get(model);
  if (!byLoadings) byModel.set(model, (byLoadings = new Map()));
  const key = loadings ? loadings.join(',') : '*';
  let floor = byLoadings.get(key);
  if (!floor) {
    floor = computeNoiseFloor(model, analysis, loadings);
    if (byLoadings.size < 1000) byLoadings.set(key, floor);
  }
  return floor;
}

function computeNoiseFloor(model: Pick<Model, 'nodes'>, analysis: Pick<AnalysisResult, 'reactions' | 'loadings' | 'supportedNodes'>, loadings?: number[]): NoiseFloor {
  const ls = loadings ?? analysis.loadings.map((_, i) => i);
  let fmax = 0;
  for (const l of ls) {
    const r = analysis.reactions(l);
    for (const n of analysis.supportedNodes) {
      for (let k = 0; k < 3; k++) {
        const v = Math.abs(r[n * 6 + k]);
        if (v > fmax && Number.isFinite(v)) fmax = v;
      }
    }
  }
  return { force: NOISE_RELATIVE * fmax, moment: NOISE_RELATIVE * fmax * modelExtent(model) };
}

/** A value with noise removed: 0 when |v| < floor. */
export function clean(v: number, floor: number): number {
  return v < floor && v > -floor ? 0 : v;
}

/** Whether some value is noise (non-zero and below the floor). */
function noisy(v: Float64Array, floor: number): boolean {
  for (let i = 0; i < v.length; i++) { const a = v[i]; if (a !== 0 && a < floor && a > -floor) return true; }
  return false;
}

/** noisy() over N, V (force floor) and T, M (moment floor) in one pass (a loop per call is the cost here). */
function anyNoisy(sf: StationForces, f: number, m: number): boolean {
  const N = sf.N, Vy = sf.V_major, Vz = sf.V_minor, T = sf.T, My = sf.M_major, Mz = sf.M_minor;
  const n = sf.x.length;
  if (N.length !== n || Vy.length !== n || Vz.length !== n || T.length !== n || My.length !== n || Mz.length !== n) {
    return noisy(N, f) || noisy(Vy, f) || noisy(Vz, f) || noisy(T, m) || noisy(My, m) || noisy(Mz, m);
  }
  for (let i = 0; i < n; i++) {
    let a = N[i];
    if (a !== 0 && a < f && a > -f) return true;
    a = Vy[i];
    if (a !== 0 && a < f && a > -f) return true;
    a = Vz[i];
    if (a !== 0 && a < f && a > -f) return true;
    a = T[i];
    if (a !== 0 && a < m && a > -m) return true;
    a = My[i];
    if (a !== 0 && a < m && a > -m) return true;
    a = Mz[i];
    if (a !== 0 && a < m && a > -m) return true;
  }
  return false;
}

function cleanInto(src: Float64Array, dst: Float64Array, floor: number): void {
  for (let i = 0; i < src.length; i++) { const v = src[i]; dst[i] = v < floor && v > -floor ? 0 : v; }
}

/**
 * Station forces with noise removed (N, V, T, M; deflections unchanged). Returns `sf`
 * itself when the floor is zero or nothing is noise (the usual case: no copy); otherwise a
 * fresh copy, or `into` when given with the same number of stations (a buffer the caller
 * owns — never the engine's arrays).
 */
export function denoise(sf: StationForces, floor: NoiseFloor, into?: StationForces): StationForces {
  if (!(floor.force > 0)) return sf;
  if (!anyNoisy(sf, floor.force, floor.moment)) return sf;
  const n = sf.x.length;
  const o = into && into.x.length === n && into !== sf ? into : emptyForces(n);
  o.x.set(sf.x);
  cleanInto(sf.N, o.N, floor.force);
  cleanInto(sf.V_major, o.V_major, floor.force);
  cleanInto(sf.V_minor, o.V_minor, floor.force);
  cleanInto(sf.T, o.T, floor.moment);
  cleanInto(sf.M_major, o.M_major, floor.moment);
  cleanInto(sf.M_minor, o.M_minor, floor.moment);
  o.d_major.set(sf.d_major);
  o.d_minor.set(sf.d_minor);
  return o;
}

function emptyForces(n: number): StationForces {
  return {
    x: new Float64Array(n), N: new Float64Array(n), V_major: new Float64Array(n), V_minor: new Float64Array(n), T: new Float64Array(n),
    M_major: new Float64Array(n), M_minor: new Float64Array(n), d_major: new Float64Array(n), d_minor: new Float64Array(n),
  };
}

/**
 * A cleaner with its own buffer, reused call after call (the result is valid until the
 * next call): for loops over many members and loadings.
 */
export function noiseCleaner(floor: NoiseFloor): (sf: StationForces) => StationForces {
  const buffers = new Map<number, StationForces>();
  return (sf) => {
    const n = sf.x.length;
    let b = buffers.get(n);
    if (!b) { b = emptyForces(n); buffers.set(n, b); }
    return denoise(sf, floor, b);
  };
}
