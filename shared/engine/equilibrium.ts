/**
 * Totals of the applied loads and of the reactions, forces and moments about the global
 * origin, for the equilibrium check of each case.
 */
import type { Model } from '../model/types.js';
import { toGlobal3 } from './axes.js';
import type { Mesh } from './discretise.js';
import type { LoadSet } from './loadSet.js';

function addMomentOf(out: Float64Array, r0: number, r1: number, r2: number, f: ArrayLike<number>): void {
  out[3] += r1 * f[2] - r2 * f[1];
  out[4] += r2 * f[0] - r0 * f[2];
  out[5] += r0 * f[1] - r1 * f[0];
}

/** Applied load totals per case: nCases × 6. */
export function appliedTotals(model: Model, mesh: Mesh, nodeIndex: Map<string, number>, caseIndex: Map<string, number>, sets: (LoadSet | undefined)[]): Float64Array {
  const nCases = model.cases.length;
  const out = new Float64Array(nCases * 6);
  for (const nl of model.nodeLoads) {
    const n = nodeIndex.get(nl.node)!, c = caseIndex.get(nl.case)!;
    const o = out.subarray(c * 6, c * 6 + 6);
    const v = nl.values;
    for (let k = 0; k < 6; k++) o[k] += v[k];
    addMomentOf(o, mesh.coords[3 * n], mesh.coords[3 * n + 1], mesh.coords[3 * n + 2], v);
  }
  const Fl = [0, 0, 0], Gl = [0, 0, 0], Fg = [0, 0, 0], Gg = [0, 0, 0];
  mesh.members.forEach((m, mi) => {
    const s0 = mesh.coords[3 * m.start], s1 = mesh.coords[3 * m.start + 1], s2 = mesh.coords[3 * m.start + 2];
    const R = m.R;
    for (let c = 0; c < nCases; c++) {
      const ls = sets[mi * nCases + c];
      if (!ls) continue;
      const o = out.subarray(c * 6, c * 6 + 6);
      // resultant F (local) and first moment G = ∫ s q ds (local)
      Fl[0] = Fl[1] = Fl[2] = Gl[0] = Gl[1] = Gl[2] = 0;
      for (let i = 0; i < ls.dist.length; i += 8) {
        const a = ls.dist[i], b = ls.dist[i + 1], len = b - a;
        for (let k = 0; k < 3; k++) {
          const q1 = ls.dist[i + 2 + k], q2 = ls.dist[i + 5 + k];
          Fl[k] += ((q1 + q2) / 2) * len;
          // ∫ s (q1 + (q2−q1)(s−a)/len) ds over [a, b]
          Gl[k] += q1 * (b * b - a * a) / 2 + (q2 - q1) * ((b * b * b - a * a * a) / 3 - (a * (b * b - a * a)) / 2) / len;
        }
      }
      for (let i = 0; i < ls.point.length; i += 4) {
        for (let k = 0; k < 3; k++) { Fl[k] += ls.point[i + 1 + k]; Gl[k] += ls.point[i] * ls.point[i + 1 + k]; }
      }
      toGlobal3(R, Fl, 0, Fg, 0);
      toGlobal3(R, Gl, 0, Gg, 0);
      for (let k = 0; k < 3; k++) o[k] += Fg[k];
      // ∫ (start + s·x̂) × q ds = start × F + x̂ × G
      addMomentOf(o, s0, s1, s2, Fg);
      addMomentOf(o, R[0], R[1], R[2], Gg);
      for (let i = 0; i < ls.moment.length; i += 4) {
        toGlobal3(R, ls.moment, i + 1, Fg, 0);
        for (let k = 0; k < 3; k++) o[3 + k] += Fg[k];
      }
    }
  });
  return out;
}

/** Reaction totals of one case from the full reaction vector (nNodes × 6). */
export function reactionTotals(mesh: Mesh, R: Float64Array, off: number): number[] {
  const o = new Float64Array(6);
  for (let n = 0; n < mesh.nNodes; n++) {
    const b = off + n * 6;
    if (R[b] === 0 && R[b + 1] === 0 && R[b + 2] === 0 && R[b + 3] === 0 && R[b + 4] === 0 && R[b + 5] === 0) continue;
    for (let k = 0; k < 6; k++) o[k] += R[b + k];
    addMomentOf(o, mesh.coords[3 * n], mesh.coords[3 * n + 1], mesh.coords[3 * n + 2], R.subarray(b, b + 3));
  }
  return [...o];
}
