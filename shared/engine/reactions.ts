/**
 * Support reactions: at a restrained freedom, the sum of the end forces (global) of the
 * elements meeting there minus the node load applied there; at a spring, −k·u.
 */
import type { Model } from '../model/types.js';
import { vecToGlobal12 } from './axes.js';
import { PLANE, SUPPORT } from './discretise.js';
import { elementGlobal, type LinearSystem } from './system.js';

/** Reactions of every case, nNodes × 6 per case, case after case. */
export function computeReactions(model: Model, sys: LinearSystem, U: Float64Array): Float64Array {
  const { mesh, status, nCases, loadSets, fefOf, eq } = sys;
  const nDofAll = mesh.nNodes * 6;
  const R = new Float64Array(nDofAll * nCases);
  const restrained = (g: number) => status[g] === SUPPORT || status[g] === PLANE;
  const rows = new Int32Array(12);
  const ue = new Float64Array(12), fg = new Float64Array(12);
  const ke = new Float64Array(144), kl = new Float64Array(144), tmp = new Float64Array(144);
  for (let e = 0; e < mesh.nElements; e++) {
    const ni = mesh.elStart[e], nj = mesh.elEnd[e];
    let any = false;
    for (let k = 0; k < 6 && !any; k++) any = restrained(ni * 6 + k) || restrained(nj * 6 + k);
    if (!any) continue;
    elementGlobal(mesh, e, ke, 0, kl, tmp);
    let nr = 0;
    const mi = mesh.elMember[e];
    let loaded = false;
    for (let c = 0; c < nCases && !loaded; c++) loaded = loadSets[mi * nCases + c] !== undefined;
    // a zero diagonal means a zero stiffness row (K is positive semi-definite): only span loads add there
    for (let i = 0; i < 12; i++) {
      if (restrained(i < 6 ? ni * 6 + i : nj * 6 + i - 6) && (loaded || ke[i * 13] !== 0)) rows[nr++] = i;
    }
    if (nr === 0) continue;
    const Rm = mesh.members[mi].R;
    for (let c = 0; c < nCases; c++) {
      const uo = c * nDofAll;
      for (let k = 0; k < 6; k++) { ue[k] = U[uo + ni * 6 + k]; ue[6 + k] = U[uo + nj * 6 + k]; }
      const fef = loadSets[mi * nCases + c] ? fefOf(e, c) : undefined;
      if (fef) vecToGlobal12(Rm, fef, fg);
      for (let r = 0; r < nr; r++) {
        const i = rows[r];
        let s = fef ? fg[i] : 0;
        const ko = i * 12;
        for (let j = 0; j < 12; j++) s += ke[ko + j] * ue[j];
        R[uo + (i < 6 ? ni * 6 + i : nj * 6 + i - 6)] += s;
      }
    }
  }
  for (const nl of model.nodeLoads) {
    const n = sys.nodeIndex.get(nl.node)!, c = sys.caseIndex.get(nl.case)!;
    for (let k = 0; k < 6; k++) if (restrained(n * 6 + k)) R[c * nDofAll + n * 6 + k] -= nl.values[k];
  }
  for (let g = 0; g < nDofAll; g++) {
    const k = mesh.springs[g];
    if (k !== 0 && eq[g] >= 0) for (let c = 0; c < nCases; c++) R[c * nDofAll + g] = -k * U[c * nDofAll + g];
  }
  return R;
}
