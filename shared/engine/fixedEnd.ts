/**
 * Fixed-end forces of a prismatic element under its span loads, by the flexibility method:
 * the start end forces are the unknowns, the internal forces follow from statics
 * (statics.ts), and compatibility of the end conditions fixes them:
 *   axial      ∫ (N/EA + ε) dx = 0
 *   torsion    ∫ T/GJ dx = 0
 *   bending    with M(x) = c0 + c1·x + M_L(x), curvature κ = M/EI + κ_T and d(0) = d(L) = 0:
 *              both ends fixed   ∫κ = 0 and ∫xκ = 0
 *              start released   c0 = 0 and ∫xκ = 0
 *              end released     M(L) = 0 and ∫(L−x)κ = 0
 *              both released    c0 = 0 and M(L) = 0
 * The load diagrams are piecewise polynomials of degree ≤ 3, integrated exactly by
 * three-point Gauss on each piece between load breakpoints.
 */
import type { ElementStiffness, EndReleases } from './element.js';
import { GAUSS3_T, GAUSS3_W } from './gauss.js';
import { type LoadSet, loadBreakpoints, uniqueSorted } from './loadSet.js';
import { endForcesFromStart, internalForces } from './statics.js';

const ZERO6 = new Float64Array(6);

/** Solve for (c0, c1) of one bending plane. K = EI·κ_T (a moment). */
export function bendingConstants(
  startReleased: boolean, endReleased: boolean, L: number,
  I0: number, I1: number, MLend: number, K: number,
): [number, number] {
  if (startReleased && endReleased) return [0, -MLend / L];
  if (startReleased) return [0, -(I1 + (K * L * L) / 2) / ((L * L * L) / 3)];
  if (endReleased) {
    // c0 + c1 L = −MLend ; c0 L²/2 + c1 L³/6 = −(L·I0 − I1 + K L²/2)
    const r2 = -(L * I0 - I1 + (K * L * L) / 2);
    // substitute c0 = −MLend − c1 L
    const c1 = (r2 + (MLend * L * L) / 2) / ((L * L * L) / 6 - (L * L * L) / 2);
    return [-MLend - c1 * L, c1];
  }
  // [L, L²/2; L²/2, L³/3] c = −[I0 + K L; I1 + K L²/2]
  const a11 = L, a12 = (L * L) / 2, a22 = (L * L * L) / 3;
  const b1 = -(I0 + K * L), b2 = -(I1 + (K * L * L) / 2);
  const det = a11 * a22 - a12 * a12;
  return [(b1 * a22 - a12 * b2) / det, (a11 * b2 - a12 * b1) / det];
}

/**
 * Fixed-end forces (forces the nodes apply to the element with both ends held, local axes)
 * into out12. `depth` is needed only for temperature gradients.
 */
export function fixedEndForces(
  ls: LoadSet, L: number, p: ElementStiffness, depth: number, truss: boolean, rel: EndReleases, out12: Float64Array,
): Float64Array {
  let IN = 0, IT = 0, I0maj = 0, I1maj = 0, I0min = 0, I1min = 0, MLmaj = 0, MLmin = 0;
  const d = ls.dist;
  if (d.length === 8 && ls.point.length === 0 && ls.moment.length === 0 && d[0] === 0 && d[1] === L) {
    // one linear load over the whole element (self weight, floor loads): with q(x) = q1 + (q2 − q1)x/L,
    // M_L = q1x²/2 + (q2−q1)x³/(6L) and N_L = −(q1x·x + (q2x−q1x)x²/(2L)), integrated in closed form
    const L2 = L * L, L3 = L2 * L, L4 = L3 * L;
    IN = -(d[2] * L2) / 2 - ((d[5] - d[2]) * L2) / 6;
    I0maj = (d[4] * L3) / 6 + ((d[7] - d[4]) * L3) / 24;
    I1maj = (d[4] * L4) / 8 + ((d[7] - d[4]) * L4) / 30;
    MLmaj = (d[4] * L2) / 2 + ((d[7] - d[4]) * L2) / 6;
    I0min = (d[3] * L3) / 6 + ((d[6] - d[3]) * L3) / 24;
    I1min = (d[3] * L4) / 8 + ((d[6] - d[3]) * L4) / 30;
    MLmin = (d[3] * L2) / 2 + ((d[6] - d[3]) * L2) / 6;
  } else {
    const r = integrateLoadDiagrams(ls, L);
    IN = r[0]; IT = r[1]; I0maj = r[2]; I1maj = r[3]; I0min = r[4]; I1min = r[5]; MLmaj = r[6]; MLmin = r[7];
  }
  const f1 = new Float64Array(6);
  f1[0] = IN / L + p.EA * ls.eps;
  if (!truss) f1[3] = IT / L;
  const kT = ls.grad !== 0 ? -ls.grad / depth : 0;
  const maj = bendingConstants(truss || rel.startMajor, truss || rel.endMajor, L, I0maj, I1maj, MLmaj, truss ? 0 : p.EIy * kT);
  const min = bendingConstants(truss || rel.startMinor, truss || rel.endMinor, L, I0min, I1min, MLmin, 0);
  f1[4] = maj[0];
  f1[2] = maj[1];
  f1[5] = -min[0];
  f1[1] = min[1];
  return endForcesFromStart(ls, f1, L, out12);
}

/** ∫N_L, ∫T_L, ∫M_L,maj, ∫x·M_L,maj, ∫M_L,min, ∫x·M_L,min over [0, L], then M_L,maj(L), M_L,min(L). */
function integrateLoadDiagrams(ls: LoadSet, L: number): number[] {
  const pts = uniqueSorted(loadBreakpoints(ls, L, [0, L]), L * 1e-12);
  let IN = 0, IT = 0, I0maj = 0, I1maj = 0, I0min = 0, I1min = 0;
  const s = new Float64Array(6);
  for (let k = 0; k + 1 < pts.length; k++) {
    const x0 = pts[k], h = pts[k + 1] - x0;
    for (let g = 0; g < 3; g++) {
      const x = x0 + GAUSS3_T[g] * h, w = GAUSS3_W[g] * h;
      internalForces(ls, ZERO6, x, false, s);
      IN += w * s[0];
      IT += w * s[3];
      I0maj += w * s[4];
      I1maj += w * x * s[4];
      I0min += w * s[5];
      I1min += w * x * s[5];
    }
  }
  internalForces(ls, ZERO6, L, true, s);
  return [IN, IT, I0maj, I1maj, I0min, I1min, s[4], s[5]];
}
