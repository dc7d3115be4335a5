/**
 * Direct stiffness analysis of a validated model: every load case solved as one block
 * after a single factorisation, combinations by superposition, member forces recovered
 * exactly at stations on demand. See conventions.md for axes and signs.
 */
import type { Model } from '../model/types.js';
import { type FactorOptions, type Factorisation, SingularMatrixError, type SymmetricCsc } from '../solver/types.js';
import { appliedTotals, reactionTotals } from './equilibrium.js';
import { instabilityAt } from './instability.js';
import { computeReactions } from './reactions.js';
import { memberResults, stationSets } from './memberResults.js';
import { factorise as defaultFactorise } from './solverBridge.js';
import { type PhaseClock, Stopwatch } from './stopwatch.js';
import { buildSystem } from './system.js';
import type { AnalysisResult, EquilibriumCheck, Loading, StationForces } from './types.js';
import { addMovingPart, computeMoving, expandLoadings, type MovingComputation, type MovingInput, movingResults } from '../moving/index.js';

export { InstabilityError } from './types.js';
export type { AnalysisResult, Loading, StationForces } from './types.js';
export { STANDARD_GRAVITY } from './memberLoads.js';

export interface AnalyseOptions {
  /** sub-elements per tapered member; default 16 */
  taperSegments?: number;
  /** solver options; default { ordering: 'auto', pivotTolerance: 1e-10 } */
  solver?: FactorOptions;
  /** the factorisation to use; default the project's sparse solver */
  factorise?: (K: SymmetricCsc, opts: FactorOptions) => Factorisation;
  /** a second clock (e.g. CPU time) and the record of finer phases it fills; the benchmark uses it */
  clock?: PhaseClock;
}


export function analyse(model: Model, options: AnalyseOptions = {}): AnalysisResult {
  const taperSegments = options.taperSegments ?? 16;
  const solverOpts: FactorOptions = { ordering: 'auto', pivotTolerance: 1e-10, ...options.solver };
  const factorise = options.factorise ?? defaultFactorise;
  const timings: Record<string, number> = {};
  const sw = new Stopwatch(timings, options.clock);
  const sys = buildSystem(model, taperSegments, sw);
  const { mesh, nCases, loadSets, eq, nEq, eqDof, pat, F, presc, fefOf, nodeIndex, caseIndex } = sys;
  const nNodes = mesh.nNodes, nDofAll = nNodes * 6;
  // every member's stations: settings.stations, concentrated loads, result_points
  const stationsOf = stationSets(model, mesh, nCases, loadSets);

  // factorise once, solve all cases as one block
  let X: Float64Array = new Float64Array(0);
  let nnzFactor = 0;
  let moving: MovingComputation | null = null;
  let movingInput: MovingInput | null = null;
  if (nEq > 0) {
    let fact: Factorisation;
    try {
      fact = factorise(pat.K, solverOpts);
    } catch (err) {
      if (err instanceof SingularMatrixError) {
        const g = eqDof[err.index];
        throw instabilityAt(mesh.nodeNames[Math.floor(g / 6)], g % 6);
      }
      throw err;
    }
    const solverMs = sw.lap('ordering+factorisation', false);
    timings.ordering = fact.timings.ordering;
    // everything the solver spent besides its ordering (symbolic, numeric, checks, permutation)
    timings.factorisation = solverMs - fact.timings.ordering;
    nnzFactor = fact.nnzFactor;
    X = nCases > 0 ? fact.solve(F, nCases) : X;
    sw.lap('solve');
    if (model.movingLoads.length > 0) {
      // influence basis of the lanes with the same factorisation, then the envelopes
      movingInput = { model, sys, solve: (B, n) => fact.solve(B, n), stations: stationsOf };
      moving = computeMoving(movingInput);
      sw.lap('moving');
    }
  } else {
    timings.ordering = timings.factorisation = timings.solve = 0;
  }

  // full displacement vectors
  const U = new Float64Array(nDofAll * nCases);
  for (let c = 0; c < nCases; c++) {
    const u = presc[c];
    for (let g = 0; g < nDofAll; g++) U[c * nDofAll + g] = eq[g] >= 0 ? X[c * nEq + eq[g]] : u ? u[g] : 0;
  }

  sw.fine('displacements');
  // reactions at restrained freedoms and springs
  const Rall = computeReactions(model, sys, U);
  sw.fine('reactions');

  // loadings: cases, then combinations
  const loadings: Loading[] = model.cases.map((c, i) => ({ id: c.id, kind: 'case', limitState: null, terms: [{ caseIndex: i, factor: 1 }] }));
  for (const cb of model.combinations) {
    const terms = cb.terms.map((tm) => {
      const ci = caseIndex.get(tm.case);
      if (ci === undefined) throw new Error(`combination ${cb.id}: case ${tm.case} does not exist`);
      return { caseIndex: ci, factor: tm.factor };
    });
    loadings.push({ id: cb.id, kind: 'combination', limitState: cb.limitState, terms });
  }
  if (moving) {
    const expanded = expandLoadings(loadings, moving);
    loadings.length = 0;
    loadings.push(...expanded);
  }

  // equilibrium per loading
  const applied = appliedTotals(model, mesh, nodeIndex, caseIndex, loadSets);
  const reactSums = model.cases.map((_, c) => reactionTotals(mesh, Rall, c * nDofAll));
  const equilibrium: EquilibriumCheck[] = loadings.map((ld) => {
    const a = [0, 0, 0, 0, 0, 0], r = [0, 0, 0, 0, 0, 0];
    for (const { caseIndex: c, factor } of ld.terms) {
      for (let k = 0; k < 6; k++) { a[k] += factor * applied[c * 6 + k]; r[k] += factor * reactSums[c][k]; }
    }
    const scale = Math.max(1, Math.hypot(a[0], a[1], a[2]), Math.hypot(a[3], a[4], a[5]));
    let residual = 0;
    for (let k = 0; k < 6; k++) residual = Math.max(residual, Math.abs(a[k] + r[k]) / scale);
    return { loading: ld.id, applied: a, reactions: r, residual };
  });
  sw.lap('recovery');

  const nUser = mesh.nUserNodes;
  const combine = (src: Float64Array, ld: Loading): Float64Array => {
    const out = new Float64Array(nUser * 6);
    for (const { caseIndex: c, factor } of ld.terms) {
      const o = c * nDofAll;
      for (let i = 0; i < out.length; i++) out[i] += factor * src[o + i];
    }
    return out;
  };
  const checkLoading = (l: number) => {
    if (!(l >= 0 && l < loadings.length)) throw new Error(`loading index ${l} out of range`);
    return loadings[l];
  };

  // member recovery: station values per case of the member asked for, loadings by superposition
  const forcesOf = memberResults({
    // with moving loads, lane members also have stations where an extreme under an axle occurs (shared/moving)
    mesh, nCases, loadSets, U, fefOf, stations: moving ? (mi) => moving!.basis.memberStations[mi] : stationsOf,
    addMoving: moving ? (mi, ld, rows) => addMovingPart(moving!, ld, moving!.basis.memberOff[mi], rows) : undefined,
  });

  const dispCache = new Map<number, Float64Array>();
  const reactCache = new Map<number, Float64Array>();
  return {
    nodeIds: model.nodes.map((n) => n.id),
    memberIds: model.members.map((m) => m.id),
    loadings,
    supportedNodes: mesh.supportedNodes,
    displacements(l: number): Float64Array {
      let v = dispCache.get(l);
      if (!v) {
        const ld = checkLoading(l);
        v = combine(U, ld);
        if (moving && ld.envelope) addMovingPart(moving, ld, 0, v);
        dispCache.set(l, v);
      }
      return v;
    },
    reactions(l: number): Float64Array {
      let v = reactCache.get(l);
      if (!v) {
        const ld = checkLoading(l);
        v = combine(Rall, ld);
        if (moving && ld.envelope) addMovingPart(moving, ld, nUser * 6, v);
        reactCache.set(l, v);
      }
      return v;
    },
    memberForces(mi: number, l: number): StationForces {
      if (!(mi >= 0 && mi < mesh.members.length)) throw new Error(`member index ${mi} out of range`);
      return forcesOf(mi, checkLoading(l));
    },
    memberForcesInto(mi: number, l: number, into: StationForces): StationForces {
      if (!(mi >= 0 && mi < mesh.members.length)) throw new Error(`member index ${mi} out of range`);
      return forcesOf.into(mi, checkLoading(l), into);
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
    ...(moving && movingInput ? { moving: movingResults(model, moving, loadings, movingInput) } : {}),
  };
}
