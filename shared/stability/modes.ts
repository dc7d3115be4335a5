/**
 * Natural frequencies and mode shapes: the n lowest pairs of K φ = ω² M φ (undamped, about the
 * unloaded state) by block Lanczos on the factorisation of K (eigen.ts), with the consistent
 * mass of mass.ts. No geometric stiffness: the frequencies of the unloaded frame.
 *
 * Frame members are subdivided (default 4 sub-elements per prismatic member, internal nodes
 * after the user's) so that the members' own modes are captured: with consistent mass, 4
 * cubic elements give a simply supported member's first bending frequency 0.03% high and its
 * second 0.4% high, a cantilever's first 0.004% high (tests/shared/stability/modes.test.ts
 * shows the convergence; 8 sub-elements: 0.002% and 0.03%).
 *
 * Effective modal mass ratio along d (X, Y, Z): Γ_d² / (r_dᵀ M r_d), Γ_d = φᵀ M r_d with
 * φᵀ M φ = 1 and r_d the unit translation along d of every free freedom; the denominator is
 * the mass free to move along d (returned as totalMass), so the ratios of all modes add up to 1.
 */
import type { Model } from '../model/types.js';
import type { FactorOptions, Factorisation, SymmetricCsc } from '../solver/types.js';
import { buildSystem } from '../engine/system.js';
import { type EigenOptions, factoriseSystem, lowestEigenpairs, symmetricProduct } from './eigen.js';
import { assembleMass } from './mass.js';
import type { NaturalMode } from './types.js';

/** Sub-elements per prismatic frame member for natural modes, unless told otherwise. */
export const MODES_SUBDIVISIONS = 4;

/** Most modes (and critical load factors per loading) computed: the Lanczos basis grows as 3n + 60 vectors. */
export const MAX_MODES = 200;

export interface ModesOptions {
  /** sub-elements per prismatic frame member; default MODES_SUBDIVISIONS (4) */
  subdivisions?: number;
  /** sub-elements per tapered member; default 16 (as the engine) */
  taperSegments?: number;
  /** solver options; default { ordering: 'auto', pivotTolerance: 1e-10 } */
  solver?: FactorOptions;
  factorise?: (K: SymmetricCsc, opts: FactorOptions) => Factorisation;
  /** method, block size, tolerances, limits (eigen.ts) */
  eigen?: EigenOptions;
  /** the clock of the timings (ms); default performance.now (the benchmark passes CPU time) */
  clock?: () => number;
}

export interface ModesResult {
  modes: NaturalMode[];
  /** mass free to move along X, Y, Z (kg): the denominators of the mass ratios */
  totalMass: [number, number, number];
  diagnostics: {
    freedoms: number;
    /** members' own mass and loads' mass (kg) before restraints take their share */
    memberMass: number;
    loadMass: number;
    iterations: number;
    converged: boolean;
    solves: number;
    /** largest ‖Kφ − ω²Mφ‖ / ‖Kφ‖ */
    residual: number;
    timings: Record<string, number>;
  };
}

/** The n lowest natural modes of the model (fewer when the mass has fewer freedoms). */
export function naturalModes(model: Model, n: number, options: ModesOptions = {}): ModesResult {
  if (!(Number.isInteger(n) && n >= 1)) throw new Error(`natural modes: the number of modes ${n} must be a whole number of at least 1`);
  if (n > MAX_MODES) throw new Error(`natural modes: ${n} modes asked for (settings modes); at most ${MAX_MODES} are computed`);
  const subdivisions = Math.max(1, Math.floor(options.subdivisions ?? MODES_SUBDIVISIONS));
  const timings: Record<string, number> = {};
  const clock = options.clock ?? (() => performance.now());
  let t0 = clock();
  const lap = (name: string) => { const t = clock(); timings[name] = t - t0; t0 = t; };
  const sys = buildSystem(model, options.taperSegments ?? 16, {}, subdivisions);
  lap('assembly');
  const { M, memberMass, loadMass } = assembleMass(model, sys);
  if (!(memberMass + loadMass > 0)) {
    throw new Error('natural modes need mass: give the materials a density, or mark a case whose loads act along gravity with mass = yes in the cases table');
  }
  const nEq = sys.nEq, nDofAll = sys.mesh.nNodes * 6, nUser = sys.mesh.nUserNodes;
  // unit translations of the free freedoms and the mass free to move along each axis
  const R = new Float64Array(nEq * 3);
  for (let g = 0; g < nDofAll; g++) if (sys.eq[g] >= 0 && g % 6 < 3) R[(g % 6) * nEq + sys.eq[g]] = 1;
  const MR = symmetricProduct(M, R, 3);
  const totalMass: [number, number, number] = [0, 0, 0];
  for (let d = 0; d < 3; d++) for (let i = 0; i < nEq; i++) totalMass[d] += R[d * nEq + i] * MR[d * nEq + i];
  if (!(totalMass[0] + totalMass[1] + totalMass[2] > 0)) {
    throw new Error('natural modes need mass that can move: all the mass sits on restrained freedoms');
  }
  lap('mass');
  const fact = factoriseSystem(sys, options);
  lap('factorisation');
  const eig = lowestEigenpairs(fact, sys.pat.K, M, Math.min(n, nEq), options.eigen);
  lap('eigen');

  const modes: NaturalMode[] = [];
  for (let k = 0; k < eig.values.length; k++) {
    const phi = eig.vectors.subarray(k * nEq, (k + 1) * nEq); // φᵀ M φ = 1
    const omega = Math.sqrt(eig.values[k]);
    const massRatio: [number, number, number] = [0, 0, 0];
    for (let d = 0; d < 3; d++) {
      if (!(totalMass[d] > 0)) continue;
      let gamma = 0;
      for (let i = 0; i < nEq; i++) gamma += phi[i] * MR[d * nEq + i];
      massRatio[d] = (gamma * gamma) / totalMass[d];
    }
    const frequency = omega / (2 * Math.PI);
    modes.push({ mode: k + 1, frequency, period: 1 / frequency, massRatio, shape: userShape(phi, sys.eq, nUser) });
  }
  lap('shapes');
  return {
    modes, totalMass,
    diagnostics: {
      freedoms: nEq, memberMass, loadMass, iterations: eig.iterations, converged: eig.converged, solves: eig.solves,
      residual: eig.residuals.reduce((a, b) => Math.max(a, b), 0), timings,
    },
  };
}

/**
 * A mode on the user's nodes (× 6, ux…rz), scaled so that its largest translation over the whole
 * mesh (internal nodes of subdivided members included) is 1 — or its largest rotation, when
 * nothing translates — with that component positive.
 */
export function userShape(phi: ArrayLike<number>, eq: Int32Array, nUser: number): Float64Array {
  let big = 0, sign = 1;
  for (let pass = 0; pass < 2 && big === 0; pass++) {
    for (let g = 0; g < eq.length; g++) {
      if (eq[g] < 0 || (pass === 0 && g % 6 >= 3)) continue;
      const v = phi[eq[g]];
      if (Math.abs(v) > big) { big = Math.abs(v); sign = v < 0 ? -1 : 1; }
    }
  }
  const out = new Float64Array(nUser * 6);
  const f = big > 0 ? sign / big : 0;
  for (let g = 0; g < out.length; g++) if (eq[g] >= 0) out[g] = phi[eq[g]] * f;
  return out;
}
