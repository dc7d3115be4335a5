/**
 * The contract between the analysis engine and everything that reads its results
 * (design checks, exports, the server, the screens). All values SI, global axes for
 * node results, member local axes for internal forces (conventions.md).
 */
import type { LimitState } from '../model/types.js';
import type { MovingResults } from '../moving/types.js';

/** Internal forces and local deflections at stations along one member. */
export interface StationForces {
  /** distance from the start node (m), ascending, both ends included */
  x: Float64Array;
  N: Float64Array;
  V_major: Float64Array;
  V_minor: Float64Array;
  T: Float64Array;
  M_major: Float64Array;
  M_minor: Float64Array;
  /** deflection along local z / local y relative to the chord (m) */
  d_major: Float64Array;
  d_minor: Float64Array;
}

export const FORCE_KEYS = ['N', 'V_major', 'V_minor', 'T', 'M_major', 'M_minor', 'd_major', 'd_minor'] as const;
export type ForceKey = (typeof FORCE_KEYS)[number];

/** A load case or a combination: results exist for both. */
export interface Loading {
  id: string;
  kind: 'case' | 'combination';
  /** combinations only */
  limitState: LimitState | null;
  /** case index -> factor (a case is itself with factor 1) */
  terms: { caseIndex: number; factor: number }[];
  /**
   * Moving loads (shared/moving): a loading that includes a moving-load case appears twice,
   * with the same id, as its `max` and its `min` envelope — the static part plus, per
   * quantity, the factored extreme of the moving part over all vehicle positions. Absent on
   * every other loading.
   */
  envelope?: 'max' | 'min';
}

export interface EquilibriumCheck {
  loading: string;
  /** sum of applied loads, global (fx, fy, fz, mx, my, mz about the origin) */
  applied: number[];
  /** sum of reactions, same order */
  reactions: number[];
  /** |applied + reactions| / max(1, |applied|), largest component */
  residual: number;
}

export interface AnalysisDiagnostics {
  nodes: number;
  members: number;
  freedoms: number;
  cases: number;
  nnzK: number;
  nnzFactor: number;
  /** milliseconds per phase: assembly, ordering, factorisation, solve, recovery */
  timings: Record<string, number>;
  equilibrium: EquilibriumCheck[];
}

export interface AnalysisResult {
  nodeIds: string[];
  memberIds: string[];
  /** cases first (in model order), then combinations */
  loadings: Loading[];
  /** node displacements, nNodes*6 (ux,uy,uz,rx,ry,rz per node), m and rad */
  displacements(loading: number): Float64Array;
  /** support reactions, nNodes*6 (zero at free nodes), N and N·m */
  reactions(loading: number): Float64Array;
  /** indices of nodes that carry a support or spring */
  supportedNodes: number[];
  /**
   * Station forces of one member for one loading. Stations are the same for every loading
   * of a member (settings `stations` evenly spaced + every point-load position of any case +
   * its result_points; on a lane member also every x where a moving-load force has its
   * extreme under an axle, shared/moving/axles.ts), so results of different loadings can be
   * compared and superposed station by station.
   */
  memberForces(member: number, loading: number): StationForces;
  /**
   * The same values as memberForces, written into the caller's buffer `into` (an array is
   * replaced by a fresh one when its length is not the member's station count) and `into`
   * returned: no allocation per call, for loops over many members and loadings (design
   * checks). Valid until the buffer is used again. Optional: without it callers use
   * memberForces.
   */
  memberForcesInto?(member: number, loading: number, into: StationForces): StationForces;
  /** member length (m) */
  memberLength(member: number): number;
  diagnostics: AnalysisDiagnostics;
  /** present when the model has moving loads: lanes, vehicle positions, influence lines */
  moving?: MovingResults;
}

/** An unstable model: the engine names the node and freedom in an engineer's words. */
export class InstabilityError extends Error {
  constructor(
    message: string,
    readonly node: string,
    readonly freedom: string,
  ) {
    super(message);
    this.name = 'InstabilityError';
  }
}
