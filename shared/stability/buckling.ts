/**
 * Elastic critical load factors: the lowest α of (K + α K_G(N)) φ = 0 for every strength
 * loading, N the first-order axial forces of that loading.
 *
 * One system on the subdivided mesh (default 8 sub-elements per prismatic frame member, so that
 * the curvature between a member's ends — its own buckling — is captured: a fixed–fixed column
 * within 0.1% of 4π²EI/L², see tests/shared/stability/buckling.test.ts), one factorisation of K,
 * one block solve of every case; the axial force of every element per case (geometric.ts), and
 * per loading by superposition of the cases. Then per loading K_G(N) assembled in K's pattern and
 * the eigen solve of K φ = α (−K_G) φ reusing the same factorisation (eigen.ts: block Lanczos,
 * each loading started from the previous loading's buckled shapes; only positive α are wanted,
 * buckling under the loading as it acts). Truss members are not subdivided: their own Euler
 * buckling is left to the member checks; the frame's (and a truss system's) is found.
 *
 * A loading without compression anywhere cannot buckle: alphaCr = [Infinity]. Flexural buckling
 * only (geometric.ts: no Wagner term, so no torsional or lateral-torsional buckling).
 */
import type { Model } from '../model/types.js';
import type { FactorOptions, Factorisation, SymmetricCsc } from '../solver/types.js';
import { buildSystem, type LinearSystem } from '../engine/system.js';
import { type EigenOptions, factoriseSystem, lowestEigenpairs } from './eigen.js';
import { addElement } from '../engine/assembly.js';
import { assembleGeometricStiffness, elementAxialForces, elementGeometricGlobal, geometricScratch } from './geometric.js';
import { MAX_MODES, userShape } from './modes.js';
import type { CriticalLoadFactors } from './types.js';

/** Sub-elements per prismatic frame member for critical load factors, unless told otherwise. */
export const BUCKLING_SUBDIVISIONS = 8;

export interface BucklingOptions {
  /** loading ids (cases or combinations); default every strength loading (strengthLoadings) */
  loadings?: string[];
  /** sub-elements per prismatic frame member; default BUCKLING_SUBDIVISIONS (8) */
  subdivisions?: number;
  /** sub-elements per tapered member; default 16 (as the engine) */
  taperSegments?: number;
  /** buckled shapes on the user's nodes; default false */
  shapes?: boolean;
  /** solver options; default { ordering: 'auto', pivotTolerance: 1e-10 } */
  solver?: FactorOptions;
  factorise?: (K: SymmetricCsc, opts: FactorOptions) => Factorisation;
  /** block size, tolerances, limits (eigen.ts) */
  eigen?: EigenOptions;
  /**
   * start each loading's eigen solve from the previous loading's buckled shapes (combinations
   * of the same cases buckle alike, so this saves most of the iterations); default true
   */
  warmStart?: boolean;
  /** the clock of the timings (ms); default performance.now (the benchmark passes CPU time) */
  clock?: () => number;
}

export interface BucklingLoadingDiagnostics {
  loading: string;
  iterations: number;
  converged: boolean;
  solves: number;
  /** largest ‖Kφ + α K_G φ‖ / ‖Kφ‖ */
  residual: number;
  /** elements in compression */
  compressed: number;
}

export interface BucklingResult {
  critical: CriticalLoadFactors[];
  diagnostics: {
    freedoms: number;
    subdivisions: number;
    loadings: BucklingLoadingDiagnostics[];
    timings: Record<string, number>;
  };
}

/** A loading as cases and factors. */
export interface LoadingTerms {
  id: string;
  terms: { caseIndex: number; factor: number }[];
}

/**
 * The strength loadings of a model: its strength combinations, or every case when the model
 * has no combinations at all.
 */
export function strengthLoadings(model: Model): LoadingTerms[] {
  const caseIndex = new Map(model.cases.map((c, i) => [c.id, i]));
  if (model.combinations.length === 0) return model.cases.map((c, i) => ({ id: c.id, terms: [{ caseIndex: i, factor: 1 }] }));
  return model.combinations.filter((cb) => cb.limitState === 'strength').map((cb) => ({
    id: cb.id,
    terms: cb.terms.map((t) => {
      const ci = caseIndex.get(t.case);
      if (ci === undefined) throw new Error(`combination ${cb.id}: case ${t.case} does not exist`);
      return { caseIndex: ci, factor: t.factor };
    }),
  }));
}

function pickLoadings(model: Model, ids: string[] | undefined): LoadingTerms[] {
  if (!ids) return strengthLoadings(model);
  const caseIndex = new Map(model.cases.map((c, i) => [c.id, i]));
  return ids.map((id) => {
    const cb = model.combinations.find((c) => c.id === id);
    if (cb) {
      return {
        id, terms: cb.terms.map((t) => {
          const ci = caseIndex.get(t.case);
          if (ci === undefined) throw new Error(`combination ${cb.id}: case ${t.case} does not exist`);
          return { caseIndex: ci, factor: t.factor };
        }),
      };
    }
    const ci = caseIndex.get(id);
    if (ci === undefined) throw new Error(`critical load factors: loading ${id} is neither a case nor a combination`);
    return { id, terms: [{ caseIndex: ci, factor: 1 }] };
  });
}

/** Axial force of every element in every case (nCases × nElements), from one block solve. */
export function caseAxialForces(sys: LinearSystem, fact: Factorisation): Float64Array {
  const { mesh, nCases, nEq, eq, F, presc } = sys;
  const nEl = mesh.nElements, nDofAll = mesh.nNodes * 6;
  const out = new Float64Array(nCases * nEl);
  if (nCases === 0) return out;
  const X = nEq > 0 ? fact.solve(F, nCases) : new Float64Array(0);
  const u = new Float64Array(nDofAll);
  for (let c = 0; c < nCases; c++) {
    const p = presc[c];
    for (let g = 0; g < nDofAll; g++) u[g] = eq[g] >= 0 ? X[c * nEq + eq[g]] : p ? p[g] : 0;
    out.set(elementAxialForces(mesh, u, (e) => sys.fefOf(e, c)), c * nEl);
  }
  return out;
}

/** Element geometric stiffness matrices for a unit axial force are kept while they take at most this many numbers. */
const UNIT_MATRICES_LIMIT = 1.5e7;

/**
 * K_G(N) into a values array of K's pattern. K_G is linear in N, so the global 12×12 matrix of
 * every element for N = 1 is computed once (when it fits UNIT_MATRICES_LIMIT) and each loading
 * only scales and adds; otherwise geometric.ts assembles it afresh.
 */
function geometricAssembler(sys: LinearSystem): (N: Float64Array, out: Float64Array) => void {
  const { mesh, eq, pat } = sys;
  const nEl = mesh.nElements;
  if (nEl * 144 > UNIT_MATRICES_LIMIT) return (N, out) => { assembleGeometricStiffness(sys, N, out); };
  const unit = new Float64Array(nEl * 144), s = geometricScratch();
  for (let e = 0; e < nEl; e++) elementGeometricGlobal(mesh, e, 1, unit, e * 144, s);
  const ke = new Float64Array(144);
  return (N, out) => {
    out.fill(0);
    const target = { ...pat, K: { ...pat.K, values: out } };
    for (let e = 0; e < nEl; e++) {
      const v = N[e];
      if (v === 0) continue;
      const o = e * 144;
      for (let i = 0; i < 144; i++) ke[i] = v * unit[o + i];
      addElement(target, eq, e, mesh.elStart[e], mesh.elEnd[e], ke, 0);
    }
  };
}

/** The n lowest critical load factors of every strength loading (or of the loadings asked for). */
export function criticalLoadFactors(model: Model, n: number, options: BucklingOptions = {}): CriticalLoadFactors[] {
  return bucklingAnalysis(model, n, options).critical;
}

/**
 * Settings for the first-order stability warning, which needs only the lowest αcr of every strength
 * loading against 10 (EN 1993-1-1 5.2.1(3)) and 1/(1 − 1/αcr) against 1.5: 2 sub-elements per member
 * (a member's own buckling then comes out up to about 3% high — the four classic columns from
 * +0.05% (fixed–free) to +2.6% (fixed–pinned), see tests/shared/stability/buckling.test.ts —
 * while sway buckling of a frame, carried by the user's nodes, is barely affected) and a Lanczos
 * residual of 1e-3·|θ|: the Ritz value is then within 0.1% of an eigenvalue (|θ − μ| ≤ residual)
 * and, being a Rayleigh–Ritz value, never below the lowest αcr of the mesh (on the benchmark frame
 * it agrees with a 1e-6 residual to 5 digits, at 2–3 Lanczos blocks per warm-started loading).
 */
export const WARNING_BUCKLING_OPTIONS = { subdivisions: 2, eigen: { tolerance: 1e-3 } } as const;

/**
 * The lowest αcr of every strength loading (or of the loadings asked for), at the cost the
 * first-order warning can afford (WARNING_BUCKLING_OPTIONS unless overridden).
 */
export function lowestCriticalLoadFactors(model: Model, options: BucklingOptions = {}): BucklingResult {
  return bucklingAnalysis(model, 1, {
    ...WARNING_BUCKLING_OPTIONS, ...options, eigen: { ...WARNING_BUCKLING_OPTIONS.eigen, ...options.eigen },
  });
}

/** criticalLoadFactors with diagnostics (iterations, solves, residuals, timings). */
export function bucklingAnalysis(model: Model, n: number, options: BucklingOptions = {}): BucklingResult {
  if (!(Number.isInteger(n) && n >= 1)) throw new Error(`critical load factors: the number of modes ${n} must be a whole number of at least 1`);
  if (n > MAX_MODES) throw new Error(`critical load factors: ${n} per loading asked for (settings buckling_modes); at most ${MAX_MODES} are computed`);
  const subdivisions = Math.max(1, Math.floor(options.subdivisions ?? BUCKLING_SUBDIVISIONS));
  const loadings = pickLoadings(model, options.loadings);
  const timings: Record<string, number> = {};
  const clock = options.clock ?? (() => performance.now());
  let t0 = clock();
  const lap = (name: string) => { const t = clock(); timings[name] = (timings[name] ?? 0) + t - t0; t0 = t; };
  const sys = buildSystem(model, options.taperSegments ?? 16, {}, subdivisions);
  lap('assembly');
  const fact = factoriseSystem(sys, options);
  lap('factorisation');
  const axialByCase = caseAxialForces(sys, fact);
  lap('first order');

  const nEl = sys.mesh.nElements, nEq = sys.nEq, nUser = sys.mesh.nUserNodes;
  const K = sys.pat.K;
  const N = new Float64Array(nEl);
  const kG = new Float64Array(K.values.length);
  const B: SymmetricCsc = { n: nEq, colPtr: K.colPtr, rowIdx: K.rowIdx, values: kG };
  const critical: CriticalLoadFactors[] = [];
  const diag: BucklingLoadingDiagnostics[] = [];
  const assemble = geometricAssembler(sys);
  let previous: Float64Array | undefined;
  for (const ld of loadings) {
    N.fill(0);
    for (const { caseIndex: c, factor } of ld.terms) {
      if (factor === 0) continue;
      const o = c * nEl;
      for (let e = 0; e < nEl; e++) N[e] += factor * axialByCase[o + e];
    }
    let big = 0;
    for (let e = 0; e < nEl; e++) big = Math.max(big, Math.abs(N[e]));
    let compressed = 0;
    for (let e = 0; e < nEl; e++) if (N[e] < -1e-9 * big) compressed++;
    if (compressed === 0 || nEq === 0) {
      critical.push({ loading: ld.id, alphaCr: [Infinity], ...(options.shapes ? { shapes: [] } : {}) });
      diag.push({ loading: ld.id, iterations: 0, converged: true, solves: 0, residual: 0, compressed });
      continue;
    }
    assemble(N, kG);
    for (let i = 0; i < kG.length; i++) kG[i] = -kG[i];
    lap('geometric stiffness');
    const start = options.warmStart !== false && previous ? previous : options.eigen?.start;
    const eig = lowestEigenpairs(fact, K, B, Math.min(n, nEq), { ...options.eigen, start });
    if (eig.values.length) previous = eig.vectors;
    lap('eigen');
    const alphaCr = eig.values.length ? Array.from(eig.values) : [Infinity];
    const rec: CriticalLoadFactors = { loading: ld.id, alphaCr };
    if (options.shapes) {
      rec.shapes = [];
      for (let k = 0; k < eig.values.length; k++) rec.shapes.push(userShape(eig.vectors.subarray(k * nEq, (k + 1) * nEq), sys.eq, nUser));
    }
    critical.push(rec);
    diag.push({
      loading: ld.id, iterations: eig.iterations, converged: eig.converged, solves: eig.solves,
      residual: eig.residuals.reduce((a, b) => Math.max(a, b), 0), compressed,
    });
  }
  return { critical, diagnostics: { freedoms: nEq, subdivisions, loadings: diag, timings } };
}
