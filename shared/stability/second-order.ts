/**
 * Second-order elastic analysis: every second-order loading (by default each combination, or
 * each case when the model has none) solved on its own — superposition no longer holds — with
 * the linearised stiffness K + K_G(N), the geometric stiffness of every frame and truss
 * element from its axial force (geometric.ts), iterated until the axial forces converge.
 *
 * - P-Δ and P-δ: every prismatic frame member is split into `subdivisions` sub-elements
 *   (internal nodes), so the curvature between a member's ends enters K_G; the member forces
 *   at stations come from the statics of the deformed member (p-delta.ts).
 * - Iteration: N⁰ from the first-order solution of the loading; then solve (K + K_G(Nᵏ)) X = F,
 *   recompute the element axial forces Nᵏ⁺¹; stop when max|Nᵏ⁺¹ − Nᵏ| ≤ tolerance ·
 *   max|Nᵏ⁺¹|. The first iteration of a loading factorises K + K_G(N⁰); the later ones are
 *   preconditioned steps X += P⁻¹ (F − (K + K_G(Nᵏ)) X) with that factorisation P (K_G·X element
 *   by element, geometric.ts geometricProduct), which converge to the same fixed point: P differs
 *   from K + K_G(Nᵏ) only by the geometric stiffness of the second-order change of N. A step
 *   whose change of N is above SLOW_CONTRACTION of the previous one makes the next iteration
 *   factorise again. After the last step X is refined against K + K_G(N used) to a relative
 *   residual of 1e-13, so results agree with a factorisation at every iteration to rounding
 *   (test: within 1e-9). Each factorisation condenses every member's internal nodes out exactly
 *   (condensation.ts) and refactorises a system of the user's nodes only into the same memory;
 *   its ordering and symbolic analysis are done once for all loadings.
 * - Positive definiteness: a loading's factorisation at N⁰ checks K + K_G(N⁰); at the final axial
 *   forces K + K_G(N) is always factorised again (and so checked), so a loading that is stable
 *   at its first-order forces but not at its converged ones — even in a buckling mode its loads
 *   do not excite — is refused, never reported as converged. (That last factorisation costs
 *   about a quarter of the run; safety first.)
 * - Equilibrium diagnostics of a second-order loading are taken on the displaced geometry
 *   (loads and reactions at the displaced nodes); what remains is of the order of the
 *   rotations squared (the geometric stiffness is linearised).
 * - `amplification`: largest horizontal node translation, second over first order (the
 *   first order with unreduced stiffness and the same load scale).
 * - A loading at or above its critical load (a non-positive pivot of K + K_G, or axial forces
 *   that stop converging while K + K_G(N) is no longer positive definite) throws
 *   SecondOrderInstabilityError naming it with αcr of those axial forces and that stiffness
 *   (eigen solution, or bisection to 1 % shown with ≈ when that fails).
 * - `loadScale` α: loads × α before the analysis, every result ÷ α after (AISC ASD at 1.6).
 * - `stiffness`: factors on EA and EI per member from its axial force at the analysed load
 *   level (AISC direct analysis method 0.8·EA, 0.8·τb·EI); GJ is kept. Fixed-end forces of
 *   thermal loads keep the unreduced stiffness.
 * - Loadings that are not second-order loadings (the cases, when combinations are the
 *   second-order loadings) keep their first-order results, by superposition as in the engine.
 * - Not combined with moving-load envelopes (superposition does not hold): refused.
 * Not modelled: second-order torsion, torsional and lateral-torsional buckling (no Wagner
 * term), buckling of a truss member between its ends (trusses are not subdivided), large
 * displacements beyond the linearised geometric stiffness.
 */
import { type AnalysisResult, type Loading, type StationForces } from '../engine/index.js';
import { addElement, type Pattern } from '../engine/assembly.js';
import { vecToGlobal12 } from '../engine/axes.js';
import { elementReleases, PLANE, SUPPORT } from '../engine/discretise.js';
import { localStiffness, toGlobalStiffness, trussGlobalStiffness } from '../engine/element.js';
import { appliedTotals, reactionTotals } from '../engine/equilibrium.js';
import { instabilityAt } from '../engine/instability.js';
import { clipLoadSet, emptyLoadSet, type LoadSet } from '../engine/loadSet.js';
import { memberResults, stationSets } from '../engine/memberResults.js';
import { computeReactions } from '../engine/reactions.js';
import { ROWS } from '../engine/recovery.js';
import { type PhaseClock, Stopwatch } from '../engine/stopwatch.js';
import { buildSystem, type LinearSystem } from '../engine/system.js';
import type { EquilibriumCheck } from '../engine/types.js';
import type { Model } from '../model/types.js';
import { type FactorOptions, SingularMatrixError } from '../solver/types.js';
import { assembleGeometricStiffness, axialForcesWithFixed, fixedMeanAxial, geometricProduct, localGeometricStiffness } from './geometric.js';
import { type SecondOrderState, elementEndForces, hasAxialLoad, secondOrderStations } from './p-delta.js';
import { CondensedInstability, type CondensedSolver, condensedSolver } from './condensation.js';
import { symmetricProduct } from './csc-product.js';
import { type Refactorisation, refactorisation } from './refactorisation.js';
import { criticalFactor, instabilityMessage, SecondOrderInstabilityError } from './second-order-instability.js';
import type { SecondOrderLoading } from './types.js';

export { SecondOrderInstabilityError } from './second-order-instability.js';

/** Factors on a member's axial and flexural stiffness (1 = unreduced). */
export interface StiffnessFactors {
  EA: number;
  EI: number;
}

/** What may differ between loadings of one run (strength and service under a design code). */
export interface SecondOrderLoadingOptions {
  /** loads × loadScale before the analysis, results ÷ loadScale after; default 1 */
  loadScale?: number;
  /**
   * factors on EA and EI of member `memberIndex` from its axial force N (tension positive; the
   * most compressive of its sub-elements, at the analysed load level, i.e. after loadScale);
   * default 1, 1
   */
  stiffness?: (memberIndex: number, N: number) => StiffnessFactors;
}

export interface SecondOrderOptions extends SecondOrderLoadingOptions {
  /** sub-elements per prismatic frame member; default 6 (Euler loads of the four classic columns within 0.2 %) */
  subdivisions?: number;
  /** convergence: max |ΔN| ≤ tolerance · max |N| over the elements; default 1e-6 */
  tolerance?: number;
  /** factorisations per loading at most; default 30 */
  maxIterations?: number;
  /** ids of the loadings analysed to second order; default every combination, or every case when there are none */
  secondOrderLoadings?: string[];
  /** per-loading options over the common ones (e.g. a code's rule for strength loadings only) */
  loadingOptions?: (loading: Loading) => SecondOrderLoadingOptions | undefined;
  /** sub-elements per tapered member; default 16 */
  taperSegments?: number;
  /** solver options; default { ordering: 'auto', pivotTolerance: 1e-10 } */
  solver?: FactorOptions;
  clock?: PhaseClock;
}

export const SECOND_ORDER_DEFAULTS = { subdivisions: 6, tolerance: 1e-6, maxIterations: 30, loadScale: 1 } as const;

export interface SecondOrderAnalysis {
  /** the engine's result contract; second-order loadings carry their second-order results */
  analysis: AnalysisResult;
  /** per second-order loading, in the order of analysis.loadings */
  loadings: SecondOrderLoading[];
  subdivisions: number;
  tolerance: number;
}

/** a step whose change of the axial forces is above this fraction of the previous one is followed by a factorisation */
const SLOW_CONTRACTION = 0.25;
/** a converged loading whose last steps contracted more slowly than this is confirmed by a factorisation at its axial forces */
const CONFIRM_RATIO = 0.1;

export const MOVING_LOADS_REFUSED =
  'second-order analysis cannot combine with moving-load envelopes (superposition does not hold): set analysis = first_order or remove the moving loads';

interface Resolved {
  subdivisions: number;
  tolerance: number;
  maxIterations: number;
  taperSegments: number;
  solver: FactorOptions;
}

function resolve(o: SecondOrderOptions): Resolved {
  const r: Resolved = {
    subdivisions: o.subdivisions ?? SECOND_ORDER_DEFAULTS.subdivisions,
    tolerance: o.tolerance ?? SECOND_ORDER_DEFAULTS.tolerance,
    maxIterations: o.maxIterations ?? SECOND_ORDER_DEFAULTS.maxIterations,
    taperSegments: o.taperSegments ?? 16,
    solver: { ordering: 'auto', pivotTolerance: 1e-10, ...o.solver },
  };
  if (!(Number.isInteger(r.subdivisions) && r.subdivisions >= 1)) throw new Error(`second order: subdivisions ${r.subdivisions} must be a whole number ≥ 1`);
  if (!(r.tolerance > 0 && r.tolerance < 1)) throw new Error(`second order: tolerance ${r.tolerance} must lie between 0 and 1`);
  if (!(Number.isInteger(r.maxIterations) && r.maxIterations >= 1)) throw new Error(`second order: maxIterations ${r.maxIterations} must be a whole number ≥ 1`);
  return r;
}

function checkScale(s: number, id: string): number {
  if (!(Number.isFinite(s) && s > 0)) throw new Error(`second order, loading ${id}: loadScale ${s} must be a positive number`);
  return s;
}

/** Cases first, then combinations (the engine's order). */
function modelLoadings(model: Model, caseIndex: Map<string, number>): Loading[] {
  const out: Loading[] = model.cases.map((c, i) => ({ id: c.id, kind: 'case', limitState: null, terms: [{ caseIndex: i, factor: 1 }] }));
  for (const cb of model.combinations) {
    const terms = cb.terms.map((tm) => {
      const ci = caseIndex.get(tm.case);
      if (ci === undefined) throw new Error(`combination ${cb.id}: case ${tm.case} does not exist`);
      return { caseIndex: ci, factor: tm.factor };
    });
    out.push({ id: cb.id, kind: 'combination', limitState: cb.limitState, terms });
  }
  return out;
}

/** The condensed solver of every iteration, and the whole system's factorisation when αcr is wanted. */
interface Solvers {
  condensed: CondensedSolver | null;
  full: () => Refactorisation;
  /** values arrays aligned with pat.K, shared by every loading: K_G, ΔK of the stiffness rule, K + ΔK + K_G */
  KG: Float64Array;
  dK: Float64Array;
  A: Float64Array;
  sw: Stopwatch;
  /** per case: the fixed-end part of every element's mean axial force (geometric.ts fixedMeanAxial), computed on first use */
  fixedAxial: (c: number) => Float64Array;
}

/** A solved second-order loading (analysed load level) and what its results need. */
interface Solved extends SecondOrderState {
  scale: number;
  /** reactions, nNodes × 6, analysed level */
  R: Float64Array;
  report: SecondOrderLoading;
}

export function analyseSecondOrder(model: Model, options: SecondOrderOptions = {}): SecondOrderAnalysis {
  if (model.movingLoads.length > 0) throw new Error(MOVING_LOADS_REFUSED);
  const opt = resolve(options);
  const timings: Record<string, number> = {};
  const sw = new Stopwatch(timings, options.clock);
  const sys = buildSystem(model, opt.taperSegments, sw, opt.subdivisions);
  const { mesh, nCases, loadSets, eq, nEq, eqDof, pat, F, presc, nodeIndex, caseIndex } = sys;
  const nDofAll = mesh.nNodes * 6;
  const loadings = modelLoadings(model, caseIndex);

  const wanted = options.secondOrderLoadings ?? (model.combinations.length > 0 ? model.combinations.map((c) => c.id) : model.cases.map((c) => c.id));
  const selected = new Set<number>();
  for (const id of wanted) {
    const hits = loadings.map((l, i) => (l.id === id ? i : -1)).filter((i) => i >= 0);
    if (hits.length === 0) throw new Error(`second order: loading ${id} does not exist`);
    // a combination and a case of the same id: the combination is meant
    selected.add(hits[hits.length - 1]);
  }

  // first order of every case: the start of each loading's iteration and the results of the others
  // every solve goes through the user's nodes, the members' internal nodes condensed out
  // (condensation.ts); the whole subdivided system is factorised only to find αcr of a refused loading
  let condensed: CondensedSolver | null = null;
  let fullRefac: Refactorisation | null = null;
  const solvers: Solvers = {
    condensed: null,
    full: () => (fullRefac ??= refactorisation(pat.K, opt.solver)),
    KG: new Float64Array(pat.K.values.length),
    dK: new Float64Array(pat.K.values.length),
    A: new Float64Array(pat.K.values.length),
    sw,
    fixedAxial: caseFixedAxial(sys),
  };
  let X1: Float64Array = new Float64Array(0);
  if (nEq > 0) {
    condensed = solvers.condensed = condensedSolver(sys, opt.solver);
    sw.fine('condensation setup');
    condensed.phase = (name) => sw.fine(name);
    try {
      X1 = nCases > 0 ? condensed.solve(pat.K.values, F, nCases) : X1;
      sw.fine(`first order (${nCases} cases)`);
    } catch (err) {
      if (err instanceof CondensedInstability || err instanceof SingularMatrixError) {
        const g = eqDof[err.index];
        throw instabilityAt(mesh.nodeNames[Math.floor(g / 6)], g % 6);
      }
      throw err;
    }
  }
  sw.lap('first order');
  const U1 = new Float64Array(nDofAll * nCases);
  for (let c = 0; c < nCases; c++) {
    const u = presc[c];
    for (let g = 0; g < nDofAll; g++) U1[c * nDofAll + g] = eq[g] >= 0 ? X1[c * nEq + eq[g]] : u ? u[g] : 0;
  }
  const R1 = computeReactions(model, sys, U1);
  const applied = appliedTotals(model, mesh, nodeIndex, caseIndex, loadSets);
  const reactSums = model.cases.map((_, c) => reactionTotals(mesh, R1, c * nDofAll));

  // second-order loadings, one after another
  const solved = new Map<number, Solved>();
  for (const l of [...selected].sort((a, b) => a - b)) {
    const ld = loadings[l];
    const own = options.loadingOptions?.(ld);
    const scale = checkScale(own?.loadScale ?? options.loadScale ?? SECOND_ORDER_DEFAULTS.loadScale, ld.id);
    const stiffness = own?.stiffness ?? options.stiffness;
    solved.set(l, solveLoading(model, sys, solvers, U1, ld, scale, stiffness, opt));
  }
  sw.lap('second order');

  // equilibrium per loading: second-order ones on the displaced geometry
  const equilibrium: EquilibriumCheck[] = loadings.map((ld, l) => {
    const a = [0, 0, 0, 0, 0, 0], r = [0, 0, 0, 0, 0, 0];
    for (const { caseIndex: c, factor } of ld.terms) {
      for (let k = 0; k < 6; k++) a[k] += factor * applied[c * 6 + k];
    }
    const s = solved.get(l);
    if (s) displacedTotals(model, sys, ld, s, a, r);
    else for (const { caseIndex: c, factor } of ld.terms) for (let k = 0; k < 6; k++) r[k] += factor * reactSums[c][k];
    const scaleN = Math.max(1, Math.hypot(a[0], a[1], a[2]), Math.hypot(a[3], a[4], a[5]));
    let residual = 0;
    for (let k = 0; k < 6; k++) residual = Math.max(residual, Math.abs(a[k] + r[k]) / scaleN);
    return { loading: ld.id, applied: a, reactions: r, residual };
  });
  sw.lap('recovery');

  const result = buildResult(model, sys, loadings, U1, R1, solved, equilibrium, timings, condensed ? condensed.nnzFactor : 0);
  return {
    analysis: result,
    loadings: [...solved.keys()].sort((a, b) => a - b).map((l) => solved.get(l)!.report),
    subdivisions: opt.subdivisions,
    tolerance: opt.tolerance,
  };
}

/** Σ factor · scale · (per case array), the loading's combination. */
function combineCases(src: Float64Array, stride: number, ld: Loading, scale: number): Float64Array {
  const out = new Float64Array(stride);
  for (const { caseIndex: c, factor } of ld.terms) {
    const f = factor * scale, o = c * stride;
    if (f !== 0) for (let i = 0; i < stride; i++) out[i] += f * src[o + i];
  }
  return out;
}

/** The member's load sets of the loading's cases as one, factored and scaled. */
function combineLoadSets(sets: (LoadSet | undefined)[], nCases: number, mi: number, ld: Loading, scale: number): LoadSet | undefined {
  let out: LoadSet | undefined;
  for (const { caseIndex: c, factor } of ld.terms) {
    const ls = sets[mi * nCases + c];
    const f = factor * scale;
    if (!ls || f === 0) continue;
    const o = (out ??= emptyLoadSet());
    for (let i = 0; i < ls.dist.length; i += 8) o.dist.push(ls.dist[i], ls.dist[i + 1], ...ls.dist.slice(i + 2, i + 8).map((v) => f * v));
    for (let i = 0; i < ls.point.length; i += 4) o.point.push(ls.point[i], f * ls.point[i + 1], f * ls.point[i + 2], f * ls.point[i + 3]);
    for (let i = 0; i < ls.moment.length; i += 4) o.moment.push(ls.moment[i], f * ls.moment[i + 1], f * ls.moment[i + 2], f * ls.moment[i + 3]);
    o.eps += f * ls.eps;
    o.grad += f * ls.grad;
  }
  return out;
}

function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

/**
 * Largest horizontal node translation (perpendicular to the vertical axis) among the user's
 * nodes: the sway that second order amplifies (the vertical shortening of the columns is not).
 */
function maxSway(u: Float64Array, nUser: number, vertical: 'Y' | 'Z'): number {
  const a = vertical === 'Y' ? 2 : 1;
  let m = 0;
  for (let n = 0; n < nUser; n++) m = Math.max(m, Math.hypot(u[n * 6], u[n * 6 + a]));
  return m;
}

/** K_e(factors) − K_e of every element whose factors differ from 1, assembled (aligned with pat.K). */
function assembleStiffnessChange(sys: LinearSystem, ea: Float64Array, ei: Float64Array, out: Float64Array): void {
  const { mesh, eq, pat } = sys;
  out.fill(0);
  const target: Pattern = { ...pat, K: { ...pat.K, values: out } };
  const kl = new Float64Array(144), tmp = new Float64Array(144), kg = new Float64Array(144);
  const p = mesh.elProps;
  for (let e = 0; e < mesh.nElements; e++) {
    const da = ea[e] - 1, di = ei[e] - 1;
    if (da === 0 && di === 0) continue;
    const m = mesh.members[mesh.elMember[e]];
    if (m.truss) trussGlobalStiffness((da * p[e * 5]) / mesh.elL[e], m.R, kg, 0);
    else {
      localStiffness({ EA: da * p[e * 5], EIy: di * p[e * 5 + 1], EIz: di * p[e * 5 + 2], GJ: 0 }, mesh.elL[e], false, elementReleases(mesh.elRel[e]), kl);
      toGlobalStiffness(kl, m.R, kg, tmp);
    }
    addElement(target, eq, e, mesh.elStart[e], mesh.elEnd[e], kg, 0);
  }
}

/** Per case, the fixed-end part of each element's mean axial force, cached (see Solvers.fixedAxial). */
function caseFixedAxial(sys: LinearSystem): (c: number) => Float64Array {
  const { mesh, nCases, loadSets, fefOf } = sys;
  const cache: (Float64Array | undefined)[] = [];
  return (c) => {
    let out = cache[c];
    if (out) return out;
    out = cache[c] = new Float64Array(mesh.nElements);
    for (let e = 0; e < mesh.nElements; e++) {
      const mi = mesh.elMember[e], ls = loadSets[mi * nCases + c];
      if (!ls) continue;
      const f = fefOf(e, c);
      if (!f) continue;
      let part: LoadSet | undefined;
      if (hasAxialLoad(ls)) {
        const m = mesh.members[mi], x0 = mesh.elX0[e];
        part = m.elementCount > 1 ? clipLoadSet(ls, x0, x0 + mesh.elL[e], e === m.firstElement + m.elementCount - 1) : ls;
      }
      out[e] = fixedMeanAxial(f, part, mesh.elL[e]);
    }
    return out;
  };
}

/** Per element EA and EI factors from the stiffness rule and the current axial forces. */
function stiffnessFactors(
  sys: LinearSystem, N: Float64Array, rule: (mi: number, N: number) => StiffnessFactors, ea: Float64Array, ei: Float64Array,
): void {
  const { mesh } = sys;
  mesh.members.forEach((m, mi) => {
    let nMin = Infinity;
    for (let k = 0; k < m.elementCount; k++) nMin = Math.min(nMin, N[m.firstElement + k]);
    const f = rule(mi, nMin);
    if (!(f.EA > 0 && f.EI > 0 && Number.isFinite(f.EA) && Number.isFinite(f.EI))) {
      throw new Error(`second order: stiffness factors of member ${m.id} must be positive numbers (EA ${f.EA}, EI ${f.EI})`);
    }
    for (let k = 0; k < m.elementCount; k++) { ea[m.firstElement + k] = f.EA; ei[m.firstElement + k] = f.EI; }
  });
}

function solveLoading(
  model: Model, sys: LinearSystem, solvers: Solvers, U1: Float64Array, ld: Loading, scale: number,
  rule: ((mi: number, N: number) => StiffnessFactors) | undefined, opt: Resolved,
): Solved {
  const { mesh, nCases, loadSets, eq, nEq, F, presc, fefOf, pat } = sys;
  const nDofAll = mesh.nNodes * 6, nEl = mesh.nElements;
  const Fl = combineCases(F, nEq, ld, scale);
  let pl: Float64Array | undefined;
  for (const { caseIndex: c, factor } of ld.terms) {
    const u = presc[c];
    if (!u || factor === 0) continue;
    pl ??= new Float64Array(nDofAll);
    for (let g = 0; g < nDofAll; g++) pl[g] += factor * scale * u[g];
  }
  const fefCache: (Float64Array | null | undefined)[] = new Array(mesh.nElements);
  const fef = (e: number): Float64Array | undefined => {
    let f = fefCache[e];
    if (f === undefined) {
      f = null;
      const mi = mesh.elMember[e];
      for (const { caseIndex: c, factor } of ld.terms) {
        if (!loadSets[mi * nCases + c] || factor === 0) continue;
        const fc = fefOf(e, c);
        if (!fc) continue;
        f ??= new Float64Array(12);
        for (let i = 0; i < 12; i++) f[i] += factor * scale * fc[i];
      }
      fefCache[e] = f;
    }
    return f ?? undefined;
  };
  const lsCache = new Map<number, LoadSet | undefined>();
  const loadSet = (mi: number): LoadSet | undefined => {
    if (!lsCache.has(mi)) lsCache.set(mi, combineLoadSets(loadSets, nCases, mi, ld, scale));
    return lsCache.get(mi);
  };
  const u1 = combineCases(U1, nDofAll, ld, scale);
  // the fixed-end part of the mean axial forces, the factored sum of the cases' (linear in the loads)
  const fixed = new Float64Array(nEl);
  for (const { caseIndex: c, factor } of ld.terms) {
    if (factor === 0) continue;
    const fc = solvers.fixedAxial(c), f = factor * scale;
    for (let e = 0; e < nEl; e++) fixed[e] += f * fc[e];
  }
  let N = axialForcesWithFixed(mesh, u1, fixed, undefined, new Float64Array(nEl));
  const ea = new Float64Array(nEl).fill(1), ei = new Float64Array(nEl).fill(1);
  const { KG, dK, A, sw } = solvers;
  dK.fill(0);
  sw.fine('loading setup');
  const K0 = pat.K.values;
  let u = u1, used = N, iterations = 0, change = Infinity, converged = false;
  // K_G assembled only where a factorisation (or αcr of a refused loading) needs it; kgOf: its axial forces
  let kgOf: Float64Array | null = null;
  const assembleAt = (Nx: Float64Array): void => {
    if (kgOf !== Nx) { assembleGeometricStiffness(sys, Nx, KG); kgOf = Nx; }
    for (let i = 0; i < A.length; i++) A[i] = K0[i] + dK[i] + KG[i];
  };
  // αcr of the axial forces that failed (their K + K_G is not positive definite, so αcr ≤ 1)
  const instability = (Nx: Float64Array): SecondOrderInstabilityError => {
    if (kgOf !== Nx) { assembleGeometricStiffness(sys, Nx, KG); kgOf = Nx; }
    for (let i = 0; i < A.length; i++) A[i] = K0[i] + dK[i];
    const { alpha, approximate } = nEq > 0 ? criticalFactor(solvers.full(), pat.K, A, KG) : { alpha: Infinity, approximate: true };
    const shown = Math.min(alpha, 1);
    return new SecondOrderInstabilityError(ld.id, shown, approximate, instabilityMessage(ld.kind, ld.id, shown, approximate, scale));
  };
  // y = A(Nx)·x = (K + ΔK)·x + K_G(Nx)·x, K_G element by element
  const product = (Nx: Float64Array, x: Float64Array, y: Float64Array): void => {
    if (rule) {
      for (let i = 0; i < A.length; i++) A[i] = K0[i] + dK[i];
      symmetricProduct(pat.K, A, x, y);
    } else symmetricProduct(pat.K, K0, x, y);
    geometricProduct(mesh, eq, Nx, x, y);
  };
  // X: the loading's free displacements, from its first-order solution; a step factorises
  // A(Nᵏ) and solves exactly, or (preconditioned step) X += P⁻¹ (rhs(Nᵏ) − A(Nᵏ) X) with the
  // factorisation P of an earlier iterate, while the steps contract (see the file header)
  let X: Float64Array = new Float64Array(nEq);
  for (let g = 0; g < nDofAll; g++) if (eq[g] >= 0) X[eq[g]] = u1[g];
  const AX = new Float64Array(nEq);
  let factoredHere = false, refactor = true, lastRatio = 0, prevChange = Infinity, exactLast = true;
  let rhsUsed: Float64Array = new Float64Array(0);
  while (iterations < opt.maxIterations && nEq > 0) {
    if (rule) {
      stiffnessFactors(sys, N, rule, ea, ei);
      assembleStiffnessChange(sys, ea, ei, dK);
    }
    const rhs = Fl.slice();
    if (pl) subtractPrescribed(sys, pl, N, ea, ei, rhs);
    rhsUsed = rhs.slice();
    exactLast = refactor;
    try {
      if (refactor) {
        assembleAt(N);
        sw.fine('K_G assembly');
        solvers.condensed!.factor(A);
        factoredHere = true;
        refactor = false;
        X = solvers.condensed!.solveFactored(rhs, 1);
      } else {
        product(N, X, AX);
        for (let i = 0; i < nEq; i++) rhs[i] -= AX[i];
        sw.fine('residual');
        const dX = solvers.condensed!.solveFactored(rhs, 1);
        for (let i = 0; i < nEq; i++) X[i] += dX[i];
      }
    } catch (err) {
      if (err instanceof CondensedInstability) throw instability(N);
      throw err;
    }
    iterations++;
    const un = new Float64Array(nDofAll);
    for (let g = 0; g < nDofAll; g++) un[g] = eq[g] >= 0 ? X[eq[g]] : pl ? pl[g] : 0;
    const Nn = axialForcesWithFixed(mesh, un, fixed, rule ? ea : undefined, new Float64Array(nEl));
    sw.fine('axial forces');
    let d = 0;
    for (let e = 0; e < nEl; e++) d = Math.max(d, Math.abs(Nn[e] - N[e]));
    const big = maxAbs(Nn);
    change = big > 0 ? d / big : 0;
    u = un;
    used = N;
    N = Nn;
    if (!Number.isFinite(change)) throw instability(used);
    if (change <= opt.tolerance) { converged = true; break; }
    lastRatio = change / prevChange;
    prevChange = change;
    // steps that contract slowly: factorise at the current axial forces next time
    if (lastRatio > SLOW_CONTRACTION) refactor = true;
  }
  if (converged && !exactLast) {
    // the last step was preconditioned: refine X against A(N used) until its residual is at rounding level
    const usedN = used;
    X = refine((x, y) => product(usedN, x, y), rhsUsed, X, solvers.condensed!, AX);
    for (let g = 0; g < nDofAll; g++) u[g] = eq[g] >= 0 ? X[eq[g]] : pl ? pl[g] : 0;
    sw.fine('refinement');
  }
  if (nEq === 0) { converged = true; change = 0; }
  if (nEq > 0 && (!converged || !factoredHere || lastRatio > CONFIRM_RATIO || iterations > 1)) {
    // confirm at the final axial forces: unstable when K + K_G(N) is no longer positive definite
    // (skipped only when the single iteration factorised at N⁰ and N⁰ is the final N to tolerance)
    assembleAt(N);
    try {
      solvers.condensed!.factor(A);
    } catch (err) {
      if (err instanceof CondensedInstability) throw instability(N);
      throw err;
    }
  }
  sw.fine('iterations');
  const st: SecondOrderState = { mesh, u, axial: used, eaFactor: rule ? ea : undefined, eiFactor: rule ? ei : undefined, loadSet, fef };
  const R = secondOrderReactions(model, sys, st, ld, scale);
  sw.fine('reactions');
  const vertical = model.settings.verticalAxis;
  const t1 = maxSway(u1, mesh.nUserNodes, vertical), t2 = maxSway(u, mesh.nUserNodes, vertical);
  const report: SecondOrderLoading = { loading: ld.id, iterations, converged, change };
  if (t1 > 0) report.amplification = t2 / t1;
  return { ...st, scale, R, report };
}

/** relative residual ‖b − A x‖∞ / ‖b‖∞ at which the refinement of a preconditioned step stops */
const REFINED = 1e-13;

/**
 * Iterative refinement of A x = b with the factorisation of a nearby matrix: x += P⁻¹ (b − A x)
 * until the relative residual is REFINED or stops falling tenfold (rounding), at most 8 steps.
 */
function refine(product: (x: Float64Array, y: Float64Array) => void, b: Float64Array, x: Float64Array, P: CondensedSolver, Ax: Float64Array): Float64Array {
  const n = b.length, bn = maxAbs(b) || 1;
  const r = new Float64Array(n);
  let last = Infinity;
  for (let step = 0; step < 8; step++) {
    product(x, Ax);
    for (let i = 0; i < n; i++) r[i] = b[i] - Ax[i];
    const rn = maxAbs(r) / bn;
    if (rn <= REFINED || rn > 0.1 * last) break;
    last = rn;
    const dx = P.solveFactored(r, 1);
    for (let i = 0; i < n; i++) x[i] += dx[i];
  }
  return x;
}

/**
 * rhs −= (ΔK + K_G)·u_p: the load block holds −K0·u_p for prescribed displacements u_p; the
 * prescribed freedoms are eliminated, so element by element.
 */
function subtractPrescribed(
  sys: LinearSystem, up: Float64Array, N: Float64Array, ea: Float64Array, ei: Float64Array, rhs: Float64Array,
): void {
  const { mesh, eq } = sys;
  const kl = new Float64Array(144), kgl = new Float64Array(144), kg = new Float64Array(144), tmp = new Float64Array(144);
  const ue = new Float64Array(12), p = mesh.elProps;
  for (let e = 0; e < mesh.nElements; e++) {
    const a = mesh.elStart[e] * 6, b = mesh.elEnd[e] * 6;
    let any = false;
    for (let k = 0; k < 6; k++) { ue[k] = up[a + k]; ue[6 + k] = up[b + k]; any ||= ue[k] !== 0 || ue[6 + k] !== 0; }
    if (!any) continue;
    const m = mesh.members[mesh.elMember[e]], rel = elementReleases(mesh.elRel[e]);
    localStiffness({ EA: (ea[e] - 1) * p[e * 5], EIy: (ei[e] - 1) * p[e * 5 + 1], EIz: (ei[e] - 1) * p[e * 5 + 2], GJ: 0 }, mesh.elL[e], m.truss, rel, kl);
    localGeometricStiffness(N[e], mesh.elL[e], m.truss, rel, kgl);
    for (let i = 0; i < 144; i++) kl[i] += kgl[i];
    toGlobalStiffness(kl, m.R, kg, tmp);
    for (let i = 0; i < 12; i++) {
      const g = i < 6 ? a + i : b + i - 6;
      if (eq[g] < 0) continue;
      let s = 0;
      for (let j = 0; j < 12; j++) s += kg[i * 12 + j] * ue[j];
      rhs[eq[g]] -= s;
    }
  }
}

/** Reactions (nNodes × 6, analysed level) from element end forces with K_G, node loads and springs. */
function secondOrderReactions(model: Model, sys: LinearSystem, st: SecondOrderState, ld: Loading, scale: number): Float64Array {
  const { mesh, status, eq } = sys;
  const nDofAll = mesh.nNodes * 6;
  const R = new Float64Array(nDofAll);
  const restrained = (g: number) => status[g] === SUPPORT || status[g] === PLANE;
  const fl = new Float64Array(12), fg = new Float64Array(12), k1 = new Float64Array(144), k2 = new Float64Array(144);
  for (let e = 0; e < mesh.nElements; e++) {
    const a = mesh.elStart[e] * 6, b = mesh.elEnd[e] * 6;
    let any = false;
    for (let k = 0; k < 6 && !any; k++) any = restrained(a + k) || restrained(b + k);
    if (!any) continue;
    elementEndForces(st, e, fl, k1, k2);
    vecToGlobal12(mesh.members[mesh.elMember[e]].R, fl, fg);
    for (let k = 0; k < 6; k++) {
      if (restrained(a + k)) R[a + k] += fg[k];
      if (restrained(b + k)) R[b + k] += fg[6 + k];
    }
  }
  const factors = new Map<number, number>();
  for (const { caseIndex: c, factor } of ld.terms) factors.set(c, (factors.get(c) ?? 0) + factor * scale);
  for (const nl of model.nodeLoads) {
    const n = sys.nodeIndex.get(nl.node)!, f = factors.get(sys.caseIndex.get(nl.case)!);
    if (!f) continue;
    for (let k = 0; k < 6; k++) if (restrained(n * 6 + k)) R[n * 6 + k] -= f * nl.values[k];
  }
  for (let g = 0; g < nDofAll; g++) {
    const k = mesh.springs[g];
    if (k !== 0 && eq[g] >= 0) R[g] = -k * st.u[g];
  }
  return R;
}

function addCross(out: number[], r0: number, r1: number, r2: number, f0: number, f1: number, f2: number): void {
  out[3] += r1 * f2 - r2 * f1;
  out[4] += r2 * f0 - r0 * f2;
  out[5] += r0 * f1 - r1 * f0;
}

/**
 * Equilibrium of a second-order loading on the displaced geometry: to the applied totals
 * (undeformed, unscaled, in `a`) the moments u × F of the node loads and of the member loads'
 * equivalent end forces at the displaced nodes; the reactions' moments about the origin at
 * the displaced supports (into `r`). What remains is of the order of the rotations squared.
 */
function displacedTotals(model: Model, sys: LinearSystem, ld: Loading, s: Solved, a: number[], r: number[]): void {
  const { mesh, nodeIndex, caseIndex, nCases, loadSets } = sys;
  const inv = 1 / s.scale, u = s.u;
  const factors = new Map<number, number>();
  for (const { caseIndex: c, factor } of ld.terms) factors.set(c, (factors.get(c) ?? 0) + factor);
  for (const nl of model.nodeLoads) {
    const f = factors.get(caseIndex.get(nl.case)!);
    if (!f) continue;
    const g = nodeIndex.get(nl.node)! * 6;
    addCross(a, u[g] * inv, u[g + 1] * inv, u[g + 2] * inv, f * nl.values[0], f * nl.values[1], f * nl.values[2]);
  }
  const fg = new Float64Array(12);
  for (let e = 0; e < mesh.nElements; e++) {
    const mi = mesh.elMember[e];
    let loaded = false;
    for (const { caseIndex: c } of ld.terms) loaded ||= loadSets[mi * nCases + c] !== undefined;
    const f = loaded ? s.fef(e) : undefined;
    if (!f) continue;
    vecToGlobal12(mesh.members[mi].R, f, fg);
    const g0 = mesh.elStart[e] * 6, g1 = mesh.elEnd[e] * 6;
    addCross(a, u[g0] * inv, u[g0 + 1] * inv, u[g0 + 2] * inv, -fg[0] * inv, -fg[1] * inv, -fg[2] * inv);
    addCross(a, u[g1] * inv, u[g1 + 1] * inv, u[g1 + 2] * inv, -fg[6] * inv, -fg[7] * inv, -fg[8] * inv);
  }
  const c = mesh.coords, R = s.R;
  for (let n = 0; n < mesh.nNodes; n++) {
    const g = n * 6;
    if (R[g] === 0 && R[g + 1] === 0 && R[g + 2] === 0 && R[g + 3] === 0 && R[g + 4] === 0 && R[g + 5] === 0) continue;
    for (let k = 0; k < 6; k++) r[k] += R[g + k] * inv;
    addCross(r, c[3 * n] + u[g] * inv, c[3 * n + 1] + u[g + 1] * inv, c[3 * n + 2] + u[g + 2] * inv, R[g] * inv, R[g + 1] * inv, R[g + 2] * inv);
  }
}

function scaled(src: Float64Array, n: number, inv: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = src[i] * inv;
  return out;
}

/** second-order member results kept for asking again (member × loading) */
const RECENT_MEMBER_FORCES = 256;

function buildResult(
  model: Model, sys: LinearSystem, loadings: Loading[], U1: Float64Array<ArrayBuffer>, R1: Float64Array, solved: Map<number, Solved>,
  equilibrium: EquilibriumCheck[], timings: Record<string, number>, nnzFactor: number,
): AnalysisResult {
  const { mesh, nCases, loadSets, fefOf, nEq, pat } = sys;
  const nDofAll = mesh.nNodes * 6, nUser = mesh.nUserNodes;
  // the engine's stations (settings.stations, concentrated loads, result points), one set per member
  const stationsOf = stationSets(model, mesh, nCases, loadSets);
  const firstOrder = memberResults({ mesh, nCases, loadSets, U: U1, fefOf, stations: stationsOf });
  const combine = (src: Float64Array, ld: Loading): Float64Array => {
    const out = new Float64Array(nUser * 6);
    for (const { caseIndex: c, factor } of ld.terms) {
      const o = c * nDofAll;
      for (let i = 0; i < out.length; i++) out[i] += factor * src[o + i];
    }
    return out;
  };
  const checkLoading = (l: number): Loading => {
    if (!(l >= 0 && l < loadings.length)) throw new Error(`loading index ${l} out of range`);
    return loadings[l];
  };
  const dispCache = new Map<number, Float64Array>(), reactCache = new Map<number, Float64Array>();
  // the second-order station rows asked for last (design checks, exports and screens ask again)
  const recent = new Map<number, Float64Array>();
  return {
    nodeIds: model.nodes.map((n) => n.id),
    memberIds: model.members.map((m) => m.id),
    loadings,
    supportedNodes: mesh.supportedNodes,
    displacements(l: number): Float64Array {
      let v = dispCache.get(l);
      if (!v) {
        const ld = checkLoading(l), s = solved.get(l);
        v = s ? scaled(s.u, nUser * 6, 1 / s.scale) : combine(U1, ld);
        dispCache.set(l, v);
      }
      return v;
    },
    reactions(l: number): Float64Array {
      let v = reactCache.get(l);
      if (!v) {
        const ld = checkLoading(l), s = solved.get(l);
        v = s ? scaled(s.R, nUser * 6, 1 / s.scale) : combine(R1, ld);
        reactCache.set(l, v);
      }
      return v;
    },
    memberForces(mi: number, l: number): StationForces {
      if (!(mi >= 0 && mi < mesh.members.length)) throw new Error(`member index ${mi} out of range`);
      const ld = checkLoading(l), s = solved.get(l);
      if (!s) return firstOrder(mi, ld);
      const x = stationsOf(mi), nSt = x.length;
      const key = mi * loadings.length + l;
      let cached = recent.get(key);
      if (!cached) {
        cached = new Float64Array(ROWS * nSt);
        secondOrderStations(s, mi, x, cached);
        const inv = 1 / s.scale;
        for (let i = 0; i < cached.length; i++) cached[i] *= inv;
        recent.set(key, cached);
        if (recent.size > RECENT_MEMBER_FORCES) recent.delete(recent.keys().next().value!);
      }
      // fresh arrays on every call (callers may keep or change them)
      const rows = cached.slice();
      const row = (r: number) => rows.subarray(r * nSt, (r + 1) * nSt);
      return {
        x: x.slice(), N: row(0), V_major: row(1), V_minor: row(2), T: row(3), M_major: row(4), M_minor: row(5), d_major: row(6), d_minor: row(7),
      };
    },
    memberLength: (mi: number) => mesh.members[mi].L,
    diagnostics: {
      nodes: nUser,
      members: model.members.length,
      freedoms: nEq,
      cases: nCases,
      nnzK: pat.K.colPtr[nEq],
      nnzFactor,
      timings,
      equilibrium,
    },
  };
}
