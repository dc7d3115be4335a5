/**
 * The linear system of a model: mesh, element matrices, freedom numbering, the global
 * stiffness (lower-triangle CSC) and the load block of every case (column-major
 * nEq × nCases), including fixed-end forces of member loads and prescribed settlements.
 */
import type { Model } from '../model/types.js';
import { addElement, addSprings, buildPattern, numberEquations, type Pattern } from './assembly.js';
import { vecToGlobal12 } from './axes.js';
import { buildMesh, elementReleases, FREE, type Mesh, NO_STIFFNESS } from './discretise.js';
import { localStiffness, toGlobalStiffness, trussGlobalStiffness } from './element.js';
import { fixedEndForces } from './fixedEnd.js';
import { instabilityAt } from './instability.js';
import { findSpinModes } from './spinModes.js';
import { Stopwatch } from './stopwatch.js';
import { clipLoadSet, type LoadSet } from './loadSet.js';
import { buildLoadSets } from './memberLoads.js';


export interface LinearSystem {
  mesh: Mesh;
  nodeIndex: Map<string, number>;
  caseIndex: Map<string, number>;
  nCases: number;
  loadSets: (LoadSet | undefined)[];
  /** global element matrices, 144 per element, row-major; computed on first use (elementGlobal gives one) */
  readonly kgAll: Float64Array;
  status: Uint8Array;
  eq: Int32Array;
  nEq: number;
  eqDof: Int32Array;
  pat: Pattern;
  /** load block, column-major nEq × nCases */
  F: Float64Array;
  /** prescribed displacements per case (nNodes × 6), where any */
  presc: (Float64Array | undefined)[];
  /** fixed-end forces (local) of element e in case c, cached; undefined when unloaded */
  fefOf: (e: number, c: number) => Float64Array | undefined;
}

/** Local (condensed) stiffness of element e. */
export function elementLocal(mesh: Mesh, e: number, kl: Float64Array): Float64Array {
  const p = mesh.elProps;
  const m = mesh.members[mesh.elMember[e]];
  return localStiffness(
    { EA: p[e * 5], EIy: p[e * 5 + 1], EIz: p[e * 5 + 2], GJ: p[e * 5 + 3] },
    mesh.elL[e], m.truss, elementReleases(mesh.elRel[e]), kl,
  );
}

/** Global 12×12 stiffness (row-major) of element e into kg at off; kl and tmp are 144-long scratch. */
export function elementGlobal(mesh: Mesh, e: number, kg: Float64Array, off: number, kl: Float64Array, tmp: Float64Array): void {
  const m = mesh.members[mesh.elMember[e]];
  if (m.truss) trussGlobalStiffness(mesh.elProps[e * 5] / mesh.elL[e], m.R, kg, off);
  else {
    elementLocal(mesh, e, kl);
    toGlobalStiffness(kl, m.R, kg, tmp, off);
  }
}

/** `subdivisions`: sub-elements per prismatic frame member (MeshOptions); default 1. */
export function buildSystem(model: Model, taperSegments: number, timing: Stopwatch | Record<string, number>, subdivisions = 1): LinearSystem {
  const sw = timing instanceof Stopwatch ? timing : new Stopwatch(timing);

  const mesh = buildMesh(model, { taperSegments, subdivisions });
  sw.fine('mesh');
  const nodeIndex = new Map<string, number>(model.nodes.map((n, i) => [n.id, i]));
  const caseIndex = new Map<string, number>();
  model.cases.forEach((c, i) => {
    if (caseIndex.has(c.id)) throw new Error(`case ${c.id}: duplicate id`);
    caseIndex.set(c.id, i);
  });
  const nCases = model.cases.length;
  const loadSets = buildLoadSets(model, mesh.members, caseIndex);
  const nNodes = mesh.nNodes, nDofAll = nNodes * 6, nEl = mesh.nElements;
  sw.lap('model');

  // element matrices in global axes, one at a time (never all stored: first touch of a large
  // fresh array costs more than computing a matrix again): diagonal and rotation blocks here,
  // the global matrix in a second pass once the freedoms are numbered
  const kl = new Float64Array(144), tmp = new Float64Array(144), ke = new Float64Array(144);
  const diag = Float64Array.from(mesh.springs);
  const rotBlocks = new Float64Array(nNodes * 9);
  for (let e = 0; e < nEl; e++) {
    elementGlobal(mesh, e, ke, 0, kl, tmp);
    const a = mesh.elStart[e] * 6, b = mesh.elEnd[e] * 6;
    for (let k = 0; k < 6; k++) {
      diag[a + k] += ke[k * 13];
      diag[b + k] += ke[(6 + k) * 13];
    }
    if (mesh.members[mesh.elMember[e]].truss) continue;
    const ra = mesh.elStart[e] * 9, rb = mesh.elEnd[e] * 9;
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        rotBlocks[ra + i * 3 + j] += ke[(3 + i) * 12 + 3 + j];
        rotBlocks[rb + i * 3 + j] += ke[(9 + i) * 12 + 9 + j];
      }
    }
  }
  sw.fine('element matrices');
  const status = mesh.status;
  // pin joints: every member meeting the node is a truss or has both bending moments released
  // there. Torsion cannot pass a pin, so the node's rotations carry nothing: they are removed
  // (a node moment there is an instability, caught with the node loads).
  const momentJoint = new Uint8Array(nNodes), connected = new Uint8Array(nNodes);
  for (let e = 0; e < nEl; e++) {
    const truss = mesh.members[mesh.elMember[e]].truss, bits = mesh.elRel[e];
    connected[mesh.elStart[e]] = connected[mesh.elEnd[e]] = 1;
    if (!truss && (bits & 3) !== 3) momentJoint[mesh.elStart[e]] = 1;
    if (!truss && (bits & 12) !== 12) momentJoint[mesh.elEnd[e]] = 1;
  }
  for (let n = 0; n < nNodes; n++) {
    if (!connected[n] || momentJoint[n]) continue;
    for (let k = 3; k < 6; k++) if (status[n * 6 + k] === FREE && mesh.springs[n * 6 + k] === 0) status[n * 6 + k] = NO_STIFFNESS;
  }
  for (let g = 0; g < nDofAll; g++) {
    if (status[g] !== FREE || diag[g] !== 0) continue;
    if (g % 6 >= 3) status[g] = NO_STIFFNESS;
    else throw instabilityAt(mesh.nodeNames[Math.floor(g / 6)], g % 6);
  }
  sw.fine('free freedoms');
  const spins = findSpinModes(mesh, rotBlocks, status);
  sw.fine('spin modes');
  const { eq, nEq, eqDof } = numberEquations(status);
  const pat = buildPattern(nNodes, mesh.elStart, mesh.elEnd, eq, nEq);
  sw.fine('pattern');
  for (let e = 0; e < nEl; e++) {
    elementGlobal(mesh, e, ke, 0, kl, tmp);
    addElement(pat, eq, e, mesh.elStart[e], mesh.elEnd[e], ke, 0);
  }
  addSprings(pat, eq, mesh.springs);
  for (const sp of spins) {
    // k·v·vᵀ on the node's free rotations (lower triangle of its own block)
    sp.dofs.forEach((dc, c) => {
      const ec = eq[sp.node * 6 + dc];
      sp.dofs.forEach((dr, r) => {
        const er = eq[sp.node * 6 + dr];
        if (er >= ec) pat.K.values[pat.K.colPtr[ec] + (er - ec)] += sp.k * sp.v[r] * sp.v[c];
      });
    });
  }
  sw.lap('assembly');

  // fixed-end forces (local) per loaded element and case
  const fefCache: (Float64Array | undefined)[] = new Array(nEl * nCases);
  const fefOf = (e: number, c: number): Float64Array | undefined => {
    const key = e * nCases + c;
    const hit = fefCache[key];
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
    fefCache[key] = f;
    return f;
  };

  // load block, column-major nEq × nCases
  const F = new Float64Array(nEq * nCases);
  // spin modes by node (usually none)
  const spinsAt = new Map<number, typeof spins>();
  for (const sp of spins) spinsAt.set(sp.node, [...(spinsAt.get(sp.node) ?? []), sp]);
  for (const nl of model.nodeLoads) {
    const where = () => `node load${nl.row !== undefined ? ` (row ${nl.row})` : ''} at node ${nl.node}`;
    const n = nodeIndex.get(nl.node);
    if (n === undefined) throw new Error(`${where()}: the node does not exist`);
    const c = caseIndex.get(nl.case);
    if (c === undefined) throw new Error(`${where()}: case ${nl.case} does not exist`);
    for (let k = 0; k < 6; k++) {
      const v = nl.values[k];
      if (v === 0) continue;
      const g = n * 6 + k;
      if (eq[g] >= 0) F[c * nEq + eq[g]] += v;
      else if (status[g] === NO_STIFFNESS) throw instabilityAt(mesh.nodeNames[n], k);
    }
    const atNode = spins.length ? spinsAt.get(n) : undefined;
    if (atNode) for (const sp of atNode) {
      let dot = 0, norm = 0, big = 0;
      sp.dofs.forEach((d, i) => {
        dot += nl.values[d] * sp.v[i];
        norm += nl.values[d] ** 2;
        if (Math.abs(sp.v[i]) > Math.abs(sp.v[big])) big = i;
      });
      if (Math.abs(dot) > 1e-9 * Math.sqrt(norm)) throw instabilityAt(mesh.nodeNames[n], sp.dofs[big]);
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
      elementGlobal(mesh, e, ke, 0, kl, tmp);
      for (let i = 0; i < 12; i++) {
        const gi = i < 6 ? a + i : b + i - 6;
        if (eq[gi] < 0) continue;
        let s = 0;
        for (let j = 0; j < 12; j++) s += ke[i * 12 + j] * ue[j];
        F[c * nEq + eq[gi]] -= s;
      }
    }
  }
  sw.lap('loads');
  let kgCache: Float64Array | undefined;
  return {
    mesh, nodeIndex, caseIndex, nCases, loadSets, status, eq, nEq, eqDof, pat, F, presc, fefOf,
    get kgAll(): Float64Array {
      if (!kgCache) {
        kgCache = new Float64Array(nEl * 144);
        for (let e = 0; e < nEl; e++) elementGlobal(mesh, e, kgCache, e * 144, kl, tmp);
      }
      return kgCache;
    },
  };
}
