/**
 * Direct stiffness analysis of a validated model: every load case solved as one block
 * after a single factorisation, combinations by superposition, member forces recovered
 * exactly at stations on demand. See conventions.md for axes and signs.
 */
import type { Model } from '../model/types.js';
import { type FactorOptions, type Factorisation, SingularMatrixError, type SymmetricCsc } from '../solver/types.js';
import { addElement, addSprings, buildPattern, numberEquations } from './assembly.js';
import { vecToGlobal12, vecToLocal12 } from './axes.js';
import { buildMesh, elementReleases, FREE, type Mesh, NO_STIFFNESS } from './discretise.js';
import { localStiffness, toGlobalStiffness } from './element.js';
import { appliedTotals, reactionTotals } from './equilibrium.js';
import { fixedEndForces } from './fixedEnd.js';
import { instabilityAt } from './instability.js';
import { clipLoadSet, type LoadSet } from './loadSet.js';
import { buildLoadSets } from './memberLoads.js';
import { caseStations, memberStations, ROWS } from './recovery.js';
import { factorise as defaultFactorise } from './solverBridge.js';
import type { AnalysisResult, EquilibriumCheck, Loading, StationForces } from './types.js';

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
}

const now = () => performance.now();

/** Local (condensed) stiffness of element e. */
function elementLocal(mesh: Mesh, e: number, kl: Float64Array): Float64Array {
  const p = mesh.elProps;
  const m = mesh.members[mesh.elMember[e]];
  return localStiffness(
    { EA: p[e * 5], EIy: p[e * 5 + 1], EIz: p[e * 5 + 2], GJ: p[e * 5 + 3] },
    mesh.elL[e], m.truss, elementReleases(mesh.elRel[e]), kl,
  );
}

export function analyse(model: Model, options: AnalyseOptions = {}): AnalysisResult {
  const taperSegments = options.taperSegments ?? 16;
  const solverOpts: FactorOptions = { ordering: 'auto', pivotTolerance: 1e-10, ...options.solver };
  const factorise = options.factorise ?? defaultFactorise;
  const timings: Record<string, number> = {};
  let t = now();

  const mesh = buildMesh(model, { taperSegments });
  const nodeIndex = new Map<string, number>(model.nodes.map((n, i) => [n.id, i]));
  const caseIndex = new Map<string, number>();
  model.cases.forEach((c, i) => {
    if (caseIndex.has(c.id)) throw new Error(`case ${c.id}: duplicate id`);
    caseIndex.set(c.id, i);
  });
  const nCases = model.cases.length;
  const loadSets = buildLoadSets(model, mesh.members, caseIndex);
  const nNodes = mesh.nNodes, nDofAll = nNodes * 6, nEl = mesh.nElements;
  timings.model = now() - t;
  t = now();

  // element matrices in global axes
  const kgAll = new Float64Array(nEl * 144);
  const kl = new Float64Array(144), tmp = new Float64Array(144);
  for (let e = 0; e < nEl; e++) {
    elementLocal(mesh, e, kl);
    toGlobalStiffness(kl, mesh.members[mesh.elMember[e]].R, kgAll.subarray(e * 144, e * 144 + 144), tmp);
  }
  // freedoms without any stiffness
  const diag = Float64Array.from(mesh.springs);
  for (let e = 0; e < nEl; e++) {
    const a = mesh.elStart[e] * 6, b = mesh.elEnd[e] * 6, o = e * 144;
    for (let k = 0; k < 6; k++) {
      diag[a + k] += kgAll[o + k * 13];
      diag[b + k] += kgAll[o + (6 + k) * 13];
    }
  }
  const status = mesh.status;
  for (let g = 0; g < nDofAll; g++) {
    if (status[g] !== FREE || diag[g] !== 0) continue;
    if (g % 6 >= 3) status[g] = NO_STIFFNESS;
    else throw instabilityAt(mesh.nodeNames[Math.floor(g / 6)], g % 6);
  }
  const { eq, nEq, eqDof } = numberEquations(status);
  const pat = buildPattern(nNodes, mesh.elStart, mesh.elEnd, eq, nEq);
  for (let e = 0; e < nEl; e++) addElement(pat, eq, e, mesh.elStart[e], mesh.elEnd[e], kgAll, e * 144);
  addSprings(pat, eq, mesh.springs);
  timings.assembly = now() - t;
  t = now();

  // fixed-end forces (local) per loaded element and case
  const fefCache = new Map<number, Float64Array>();
  const fefOf = (e: number, c: number): Float64Array | undefined => {
    const key = e * nCases + c;
    const hit = fefCache.get(key);
    if (hit) return hit;
    const mi = mesh.elMember[e];
    const ls = loadSets[mi * nCases + c];
    if (!ls) return undefined;
    const m = mesh.members[mi];
    const x0 = mesh.elX0[e], L = mesh.elL[e];
    const part = m.elementCount > 1 ? clipLoadSet(ls, x0, x0 + L, e === m.firstElement + m.elementCount - 1) : ls;
    const p = mesh.elProps;
    const f = fixedEndForces(
      part, L, { EA: p[e * 5], EIy: p[e * 5 + 1], EIz: p[e * 5 + 2], GJ: p[e * 5 + 3] }, p[e * 5 + 4],
      m.truss, elementReleases(mesh.elRel[e]), new Float64Array(12),
    );
    fefCache.set(key, f);
    return f;
  };

  // load block, column-major nEq × nCases
  const F = new Float64Array(nEq * nCases);
  for (const nl of model.nodeLoads) {
    const where = `node load${nl.row !== undefined ? ` (row ${nl.row})` : ''} at node ${nl.node}`;
    const n = nodeIndex.get(nl.node);
    if (n === undefined) throw new Error(`${where}: the node does not exist`);
    const c = caseIndex.get(nl.case);
    if (c === undefined) throw new Error(`${where}: case ${nl.case} does not exist`);
    for (let k = 0; k < 6; k++) {
      const v = nl.values[k];
      if (v === 0) continue;
      const g = n * 6 + k;
      if (eq[g] >= 0) F[c * nEq + eq[g]] += v;
      else if (status[g] === NO_STIFFNESS) throw instabilityAt(mesh.nodeNames[n], k);
    }
  }
  const fg = new Float64Array(12);
  for (let e = 0; e < nEl; e++) {
    const mi = mesh.elMember[e];
    for (let c = 0; c < nCases; c++) {
      if (!loadSets[mi * nCases + c]) continue;
      const f = fefOf(e, c)!;
      vecToGlobal12(mesh.members[mi].R, f, fg);
      const a = mesh.elStart[e] * 6, b = mesh.elEnd[e] * 6;
      for (let k = 0; k < 6; k++) {
        if (eq[a + k] >= 0) F[c * nEq + eq[a + k]] -= fg[k];
        if (eq[b + k] >= 0) F[c * nEq + eq[b + k]] -= fg[6 + k];
      }
    }
  }
  // prescribed displacements (settlements) per case
  const presc: (Float64Array | undefined)[] = new Array(nCases);
  for (const st of model.settlements) {
    const where = `settlement${st.row !== undefined ? ` (row ${st.row})` : ''} at node ${st.node}`;
    const n = nodeIndex.get(st.node);
    if (n === undefined) throw new Error(`${where}: the node does not exist`);
    const c = caseIndex.get(st.case);
    if (c === undefined) throw new Error(`${where}: case ${st.case} does not exist`);
    for (let k = 0; k < 6; k++) {
      const v = st.values[k];
      if (v === null || v === 0) continue;
      if (eq[n * 6 + k] >= 0 || status[n * 6 + k] === NO_STIFFNESS) {
        throw new Error(`${where}: freedom ${['ux', 'uy', 'uz', 'rx', 'ry', 'rz'][k]} is not restrained, so it cannot be prescribed`);
      }
      (presc[c] ??= new Float64Array(nDofAll))[n * 6 + k] = v;
    }
  }
  const ue = new Float64Array(12);
  for (let c = 0; c < nCases; c++) {
    const u = presc[c];
    if (!u) continue;
    for (let e = 0; e < nEl; e++) {
      const a = mesh.elStart[e] * 6, b = mesh.elEnd[e] * 6;
      let any = false;
      for (let k = 0; k < 6; k++) { ue[k] = u[a + k]; ue[6 + k] = u[b + k]; any ||= ue[k] !== 0 || ue[6 + k] !== 0; }
      if (!any) continue;
      const o = e * 144;
      for (let i = 0; i < 12; i++) {
        const gi = i < 6 ? a + i : b + i - 6;
        if (eq[gi] < 0) continue;
        let s = 0;
        for (let j = 0; j < 12; j++) s += kgAll[o + i * 12 + j] * ue[j];
        F[c * nEq + eq[gi]] -= s;
      }
    }
  }
  timings.loads = now() - t;

  // factorise once, solve all cases as one block
  let X: Float64Array = new Float64Array(0);
  let nnzFactor = 0;
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
    timings.ordering = fact.timings.ordering;
    timings.factorisation = fact.timings.symbolic + fact.timings.numeric;
    nnzFactor = fact.nnzFactor;
    t = now();
    X = nCases > 0 ? fact.solve(F, nCases) : X;
    timings.solve = now() - t;
  } else {
    timings.ordering = timings.factorisation = timings.solve = 0;
  }
  t = now();

  // full displacement vectors
  const U = new Float64Array(nDofAll * nCases);
  for (let c = 0; c < nCases; c++) {
    const u = presc[c];
    for (let g = 0; g < nDofAll; g++) U[c * nDofAll + g] = eq[g] >= 0 ? X[c * nEq + eq[g]] : u ? u[g] : 0;
  }

  // reactions at restrained freedoms and springs
  const Rall = new Float64Array(nDofAll * nCases);
  const reactive = new Uint8Array(nNodes);
  for (let g = 0; g < nDofAll; g++) if ((status[g] !== FREE && status[g] !== NO_STIFFNESS) || mesh.springs[g] !== 0) reactive[Math.floor(g / 6)] = 1;
  const fl = new Float64Array(12);
  for (let e = 0; e < nEl; e++) {
    const ni = mesh.elStart[e], nj = mesh.elEnd[e];
    if (!reactive[ni] && !reactive[nj]) continue;
    const R = mesh.members[mesh.elMember[e]].R;
    const o = e * 144;
    for (let c = 0; c < nCases; c++) {
      const uo = c * nDofAll;
      for (let k = 0; k < 6; k++) { ue[k] = U[uo + ni * 6 + k]; ue[6 + k] = U[uo + nj * 6 + k]; }
      const fef = fefOf(e, c);
      if (fef) vecToGlobal12(R, fef, fg);
      else fg.fill(0);
      for (let i = 0; i < 12; i++) {
        const g = i < 6 ? ni * 6 + i : nj * 6 + i - 6;
        if (!reactive[Math.floor(g / 6)] || status[g] === FREE || status[g] === NO_STIFFNESS) continue;
        let s = fg[i];
        for (let j = 0; j < 12; j++) s += kgAll[o + i * 12 + j] * ue[j];
        Rall[uo + g] += s;
      }
    }
  }
  void fl;
  for (const nl of model.nodeLoads) {
    const n = nodeIndex.get(nl.node)!, c = caseIndex.get(nl.case)!;
    for (let k = 0; k < 6; k++) {
      const g = n * 6 + k;
      if (status[g] !== FREE && status[g] !== NO_STIFFNESS) Rall[c * nDofAll + g] -= nl.values[k];
    }
  }
  for (let g = 0; g < nDofAll; g++) {
    const k = mesh.springs[g];
    if (k !== 0 && eq[g] >= 0) for (let c = 0; c < nCases; c++) Rall[c * nDofAll + g] = -k * U[c * nDofAll + g];
  }

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
  timings.recovery = now() - t;

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

  // member recovery: all cases of the last member asked for
  let cacheMember = -1;
  let cacheX: Float64Array = new Float64Array(0);
  let cacheData: Float64Array = new Float64Array(0);
  const f1 = new Float64Array(6), ul = new Float64Array(12);
  const memberCases = (mi: number) => {
    if (mi === cacheMember) return;
    const m = mesh.members[mi];
    const sets = Array.from({ length: nCases }, (_, c) => loadSets[mi * nCases + c]);
    const xs = memberStations(m.L, sets);
    const nSt = xs.length;
    const data = new Float64Array(nCases * ROWS * nSt);
    const e0 = m.firstElement;
    elementLocal(mesh, e0, kl);
    const ni = mesh.elStart[e0], nj = mesh.elEnd[e0];
    for (let c = 0; c < nCases; c++) {
      const uo = c * nDofAll;
      for (let k = 0; k < 6; k++) { ue[k] = U[uo + ni * 6 + k]; ue[6 + k] = U[uo + nj * 6 + k]; }
      vecToLocal12(m.R, ue, ul);
      const fef = fefOf(e0, c);
      for (let i = 0; i < 6; i++) {
        let s = fef ? fef[i] : 0;
        for (let j = 0; j < 12; j++) s += kl[i * 12 + j] * ul[j];
        f1[i] = s;
      }
      caseStations(m, sets[c] as LoadSet | undefined, f1, xs, data, c * ROWS * nSt);
    }
    cacheMember = mi;
    cacheX = xs;
    cacheData = data;
  };

  const dispCache = new Map<number, Float64Array>();
  const reactCache = new Map<number, Float64Array>();
  return {
    nodeIds: model.nodes.map((n) => n.id),
    memberIds: model.members.map((m) => m.id),
    loadings,
    supportedNodes: mesh.supportedNodes,
    displacements(l: number): Float64Array {
      let v = dispCache.get(l);
      if (!v) dispCache.set(l, (v = combine(U, checkLoading(l))));
      return v;
    },
    reactions(l: number): Float64Array {
      let v = reactCache.get(l);
      if (!v) reactCache.set(l, (v = combine(Rall, checkLoading(l))));
      return v;
    },
    memberForces(mi: number, l: number): StationForces {
      if (!(mi >= 0 && mi < mesh.members.length)) throw new Error(`member index ${mi} out of range`);
      const ld = checkLoading(l);
      memberCases(mi);
      const nSt = cacheX.length;
      const rows = Array.from({ length: ROWS }, () => new Float64Array(nSt));
      for (const { caseIndex: c, factor } of ld.terms) {
        const o = c * ROWS * nSt;
        for (let r = 0; r < ROWS; r++) {
          const dst = rows[r];
          for (let i = 0; i < nSt; i++) dst[i] += factor * cacheData[o + r * nSt + i];
        }
      }
      return {
        x: cacheX.slice(), N: rows[0], V_major: rows[1], V_minor: rows[2], T: rows[3],
        M_major: rows[4], M_minor: rows[5], d_major: rows[6], d_minor: rows[7],
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
