/**
 * The mass matrix of a model on the engine's mesh, in the pattern of the engine's stiffness
 * (lower-triangle CSC over the free freedoms).
 *
 * - Members' own mass: CONSISTENT mass of every element from its material `density` ρ
 *   (Euler–Bernoulli cubic shape functions for bending, linear for axial and torsion):
 *   axial ρAL/6·[2 1; 1 2]; bending ρAL/420·[156 22L 54 −13L; 22L 4L² 13L −3L²; 54 13L 156 −22L;
 *   −13L −3L² −22L 4L²] in each plane (signs of θy flipped, θy = −dw/dx); torsion
 *   ρ(I_major + I_minor)L/6·[2 1; 1 2] (polar moment about the centroid). A released end
 *   moment is condensed out with the same transformation as the stiffness (the end rotation
 *   follows from the other freedoms, θr = −Σ k_ri u_i / k_rr), so M' = Tᵀ M T. Truss members:
 *   the consistent bar mass ρAL/6·[2I I; I 2I] on all three translations. Tapered members:
 *   the mean area and inertias of each piece (three-point Gauss).
 * - Loads as mass: for every case with `mass` = yes, the component of its node and member
 *   loads along gravity (−vertical axis), divided by g = 9.80665 m/s², as translational mass
 *   along X, Y and Z at the node (node loads) or at the mesh nodes of the member (member
 *   loads by the lever rule over each sub-element). The case's self weight is not counted
 *   (the members' own mass already is); moments and temperatures carry no mass. Upward parts
 *   reduce the mass at a node, never below zero.
 * Mass at restrained or eliminated freedoms is left out (it never moves).
 */
import type { Model } from '../model/types.js';
import type { SymmetricCsc } from '../solver/types.js';
import { toGlobalStiffness, localStiffness, NO_RELEASES } from '../engine/element.js';
import { condense } from '../engine/element.js';
import { GAUSS3_T, GAUSS3_W } from '../engine/gauss.js';
import { buildLoadSets } from '../engine/memberLoads.js';
import { STANDARD_GRAVITY } from '../engine/memberLoads.js';
import { addElement } from '../engine/assembly.js';
import type { LinearSystem } from '../engine/system.js';

export interface MassMatrix {
  /** same pattern as the engine's K (colPtr and rowIdx shared) */
  M: SymmetricCsc;
  /** kg: the members' own mass and the loads' mass (before restraints take their share) */
  memberMass: number;
  loadMass: number;
}

/** Consistent local 12×12 mass (row-major) of a frame element, no releases. */
export function frameMassLocal(rhoA: number, rhoIp: number, L: number, m: Float64Array): Float64Array {
  m.fill(0);
  const set = (i: number, j: number, v: number) => { m[i * 12 + j] = v; m[j * 12 + i] = v; };
  const a = (rhoA * L) / 6;
  set(0, 0, 2 * a); set(6, 6, 2 * a); set(0, 6, a);
  const t = (rhoIp * L) / 6;
  set(3, 3, 2 * t); set(9, 9, 2 * t); set(3, 9, t);
  const c = (rhoA * L) / 420;
  // v, θz (1, 5, 7, 11), θz = dv/dx
  set(1, 1, 156 * c); set(7, 7, 156 * c); set(1, 7, 54 * c);
  set(1, 5, 22 * L * c); set(1, 11, -13 * L * c); set(7, 5, 13 * L * c); set(7, 11, -22 * L * c);
  set(5, 5, 4 * L * L * c); set(11, 11, 4 * L * L * c); set(5, 11, -3 * L * L * c);
  // w, θy (2, 4, 8, 10), θy = −dw/dx
  set(2, 2, 156 * c); set(8, 8, 156 * c); set(2, 8, 54 * c);
  set(2, 4, -22 * L * c); set(2, 10, 13 * L * c); set(8, 4, -13 * L * c); set(8, 10, 22 * L * c);
  set(4, 4, 4 * L * L * c); set(10, 10, 4 * L * L * c); set(4, 10, -3 * L * L * c);
  return m;
}

/** Condense released freedom r out of the mass with the stiffness' transformation; then out of k. */
function condenseMass(k: Float64Array, m: Float64Array, r: number): void {
  const krr = k[r * 12 + r];
  if (krr !== 0) {
    const t = new Float64Array(12);
    for (let i = 0; i < 12; i++) t[i] = i === r ? 0 : -k[r * 12 + i] / krr;
    // M' = Tᵀ M T with u_r = Σ t_i u_i
    const mr = new Float64Array(12);
    for (let j = 0; j < 12; j++) mr[j] = m[r * 12 + j];
    const mrr = m[r * 12 + r];
    for (let i = 0; i < 12; i++) {
      if (i === r) continue;
      for (let j = 0; j < 12; j++) {
        if (j === r) continue;
        m[i * 12 + j] += t[i] * mr[j] + mr[i] * t[j] + t[i] * t[j] * mrr;
      }
    }
  }
  for (let i = 0; i < 12; i++) { m[i * 12 + r] = 0; m[r * 12 + i] = 0; }
  condense(k, r);
}

const RELEASE_FREEDOM = [4, 5, 10, 11];

/** Mass matrix of the system's mesh (see the file header). */
export function assembleMass(model: Model, sys: LinearSystem): MassMatrix {
  const { mesh, pat, eq } = sys;
  const Kp = pat.K;
  const M: SymmetricCsc = { n: Kp.n, colPtr: Kp.colPtr, rowIdx: Kp.rowIdx, values: new Float64Array(Kp.colPtr[Kp.n]) };
  const mpat = { ...pat, K: M };
  const ml = new Float64Array(144), mg = new Float64Array(144), tmp = new Float64Array(144), kl = new Float64Array(144);
  let memberMass = 0;
  for (let e = 0; e < mesh.nElements; e++) {
    const mi = mesh.elMember[e];
    const mem = mesh.members[mi];
    const rho = mem.material.density;
    if (!(rho > 0)) continue;
    const L = mesh.elL[e];
    let A = 0, Ip = 0;
    if (mem.tapered) {
      const t0 = mesh.elX0[e] / mem.L, t1 = (mesh.elX0[e] + L) / mem.L;
      for (let g = 0; g < 3; g++) {
        const p = mem.props(t0 + (t1 - t0) * GAUSS3_T[g]);
        A += GAUSS3_W[g] * p.A; Ip += GAUSS3_W[g] * (p.Iy + p.Iz);
      }
    } else {
      const p = mem.props(0);
      A = p.A; Ip = p.Iy + p.Iz;
    }
    memberMass += rho * A * L;
    if (mem.truss) {
      const a = (rho * A * L) / 6;
      mg.fill(0);
      for (let k = 0; k < 3; k++) {
        mg[k * 13] = mg[(6 + k) * 13] = 2 * a;
        mg[k * 12 + 6 + k] = mg[(6 + k) * 12 + k] = a;
      }
    } else {
      frameMassLocal(rho * A, rho * Ip, L, ml);
      const bits = mesh.elRel[e];
      if (bits) {
        const p = mesh.elProps;
        localStiffness({ EA: p[e * 5], EIy: p[e * 5 + 1], EIz: p[e * 5 + 2], GJ: p[e * 5 + 3] }, L, false, NO_RELEASES, kl);
        for (let b = 0; b < 4; b++) if (bits & (1 << b)) condenseMass(kl, ml, RELEASE_FREEDOM[b]);
      }
      toGlobalStiffness(ml, mem.R, mg, tmp);
    }
    addElement(mpat, eq, e, mesh.elStart[e], mesh.elEnd[e], mg, 0);
  }

  const nodeMass = loadMass(model, sys);
  let loadTotal = 0;
  for (let nd = 0; nd < nodeMass.length; nd++) {
    const mass = nodeMass[nd];
    if (!(mass > 0)) continue;
    loadTotal += mass;
    for (let k = 0; k < 3; k++) {
      const g = eq[nd * 6 + k];
      if (g >= 0) M.values[M.colPtr[g]] += mass;
    }
  }
  return { M, memberMass, loadMass: loadTotal };
}

/** Translational mass per mesh node (kg) from the loads of the cases marked `mass`. */
export function loadMass(model: Model, sys: LinearSystem): Float64Array {
  const { mesh, caseIndex } = sys;
  const out = new Float64Array(mesh.nNodes);
  const massCases = model.cases.map((c) => c.mass);
  if (!massCases.some(Boolean)) return out;
  const up = model.settings.verticalAxis === 'Y' ? 1 : 2;
  const g = STANDARD_GRAVITY;
  for (const nl of model.nodeLoads) {
    const c = caseIndex.get(nl.case);
    if (c === undefined || !massCases[c]) continue;
    const n = sys.nodeIndex.get(nl.node);
    if (n === undefined) throw new Error(`node load at node ${nl.node}: the node does not exist`);
    out[n] += -nl.values[up] / g;
  }
  // member loads in local axes, without the cases' self weight (the members' own mass counts already)
  const noSelfWeight = { ...model, cases: model.cases.map((c) => ({ ...c, selfWeight: 0 })) };
  const sets = buildLoadSets(noSelfWeight, mesh.members, caseIndex);
  const nCases = model.cases.length;
  mesh.members.forEach((m, mi) => {
    // gravity (−up) in local axes
    const gl = [-m.R[up], -m.R[3 + up], -m.R[6 + up]];
    const elNodes = (k: number) => [mesh.elStart[m.firstElement + k], mesh.elEnd[m.firstElement + k]];
    const h = m.L / m.elementCount;
    // lever rule of a force P (along gravity) at x
    const atPoint = (x: number, P: number) => {
      const k = Math.min(m.elementCount - 1, Math.max(0, Math.floor(x / h)));
      const s = (x - k * h) / h;
      const [a, b] = elNodes(k);
      out[a] += ((1 - s) * P) / g;
      out[b] += (s * P) / g;
    };
    for (let c = 0; c < nCases; c++) {
      if (!massCases[c]) continue;
      const ls = sets[mi * nCases + c];
      if (!ls) continue;
      for (let i = 0; i < ls.point.length; i += 4) {
        atPoint(ls.point[i], ls.point[i + 1] * gl[0] + ls.point[i + 2] * gl[1] + ls.point[i + 3] * gl[2]);
      }
      for (let i = 0; i < ls.dist.length; i += 8) {
        const a = ls.dist[i], b = ls.dist[i + 1];
        if (!(b > a)) continue;
        const q1 = ls.dist[i + 2] * gl[0] + ls.dist[i + 3] * gl[1] + ls.dist[i + 4] * gl[2];
        const q2 = ls.dist[i + 5] * gl[0] + ls.dist[i + 6] * gl[1] + ls.dist[i + 7] * gl[2];
        for (let k = 0; k < m.elementCount; k++) {
          const x0 = k * h, x1 = x0 + h;
          const lo = Math.max(a, x0), hi = Math.min(b, x1);
          if (!(hi > lo)) continue;
          // two-point Gauss on [lo, hi]: exact for the linear load times the linear lever
          const [na, nb] = elNodes(k);
          for (const t of [0.5 - 0.5 / Math.sqrt(3), 0.5 + 0.5 / Math.sqrt(3)]) {
            const x = lo + (hi - lo) * t;
            const q = q1 + ((q2 - q1) * (x - a)) / (b - a);
            const w = ((hi - lo) / 2) * q;
            const s = (x - x0) / h;
            out[na] += ((1 - s) * w) / g;
            out[nb] += (s * w) / g;
          }
        }
      }
    }
  });
  for (let n = 0; n < out.length; n++) if (out[n] < 0) out[n] = 0;
  return out;
}
