/**
 * A member's design plan: its checks (slots), evaluated for many loadings with plain
 * numbers and no allocation, and turned into full records only when asked (the governing
 * loading of each slot, or the member-detail view).
 *
 * evaluate() writes per slot: ratio (NaN = not checked: the check is outside the
 * implemented scope and the loading puts demand on it; −1 = not applicable in this loading,
 * e.g. no demand on a check outside scope, or no torsion) and the position x of the
 * governing demand.
 */
import type { StationForces } from '../engine/types.js';
import type { CheckFamily, CheckRecord } from './types.js';

export interface Slot {
  family: CheckFamily;
  /** stable key within the member: "D2(a)", "E3", "bending_major" … */
  key: string;
}

export interface MemberPlan {
  member: string;
  slots: Slot[];
  evaluate(sf: StationForces, ratio: Float64Array, x: Float64Array): void;
  /**
   * Records aligned with slots (null where not applicable, or not wanted when `want` is
   * given: only slots with want[s] non-zero are built). `member` overrides the member id
   * (plans are shared by members with identical data).
   */
  records(sf: StationForces, combination: string, want?: ArrayLike<number>, member?: string): (CheckRecord | null)[];
}

/** What the orchestration knows about a member before any code-specific work (SI). */
export interface MemberSetup {
  id: string;
  length: number;
  truss: boolean;
  /** effective lengths K·L about the major and minor axes */
  LcMajor: number;
  LcMinor: number;
  /** laterally unbraced length (≤ length); 0 = continuously braced (no lateral-torsional buckling) */
  Lb: number;
  /** given Cb / C1, or undefined = from the moment diagram */
  cb?: number;
  /** one end free and unsupported */
  cantilever: boolean;
  /** tension net-area data (member's, else section's; empty = An = Ag, U = 1 assumed) */
  net?: import('../model/types.js').NetArea;
  /** where the net-area data came from ("member M3", "section S1"), for the record */
  netSource?: string;
}

/** Largest |v| over stations and where it occurs; writes [value, x] into out. */
export function absMax(v: Float64Array, xs: Float64Array, out: Float64Array, k: number): void {
  let m = 0, at = 0;
  for (let i = 0; i < v.length; i++) {
    const a = v[i] < 0 ? -v[i] : v[i];
    if (a > m) { m = a; at = xs[i]; }
  }
  out[k] = m;
  out[k + 1] = at;
}

/**
 * Number of unbraced segments for lateral-torsional buckling: segments of length Lb from
 * the start. Lb = 0 (continuously braced) is one segment with no lateral-torsional buckling.
 */
export function segmentCount(L: number, Lb: number): number {
  if (!(Lb < L) || !(Lb > 0)) return 1;
  return Math.max(1, Math.ceil(L / Lb - 1e-9));
}

/**
 * Largest torsional moment treated as negligible: the one giving a St Venant shear stress
 * of 2 % of the shear yield stress 0.6·Fy (our rule, common practice for incidental
 * torsion in frames). τ = T·tmax/J for open sections and solid bars (T·(D/2)/J for round
 * bars and tubes), τ = T/(2·t·Am) for rectangular hollow sections (Bredt).
 * Custom sections: 1e-6·Fy·Z_major (numerical noise only).
 */
export function negligibleTorsion(g: import('./geometry.js').DesignGeometry, Fy: number): number {
  const tau = 0.02 * 0.6 * Fy;
  switch (g.shape) {
    case 'i': case 'channel': case 'tee': return (tau * g.J) / Math.max(g.tf, g.tw);
    case 'angle': return (tau * g.J) / g.t;
    case 'rect': return (tau * g.J) / Math.min(g.h, g.b);
    case 'round': case 'chs': return (tau * g.J) / (g.D / 2);
    case 'rhs': return tau * 2 * g.t * (g.b - g.t) * (g.h - g.t);
    default: return 1e-6 * Fy * g.Zmaj;
  }
}
