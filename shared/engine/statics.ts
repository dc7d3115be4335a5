/**
 * Internal forces at a section of a member from the statics of the free body [0, x]:
 * the start end forces f1 (forces and moments that the start node applies to the member,
 * local axes) plus the member loads between 0 and x. Signs per conventions.md:
 *   N = −f1x − ΣPx                      (tension positive)
 *   V_major = f1z + ΣPz                 (= dM_major/dx)
 *   V_minor = f1y + ΣPy                 (= dM_minor/dx)
 *   T = −M1x − Σmx
 *   M_major = M1y + x·f1z + Σ(x−s)Pz + Σmy   (sagging positive, tension on −z face)
 *   M_minor = −M1z + x·f1y + Σ(x−s)Py − Σmz  (tension on −y face)
 */
import type { LoadSet } from './loadSet.js';

export const N_ = 0, VMAJ = 1, VMIN = 2, T_ = 3, MMAJ = 4, MMIN = 5;

/**
 * out[0..5] = N, V_major, V_minor, T, M_major, M_minor at x. Concentrated loads at s < x are
 * included; those at s = x too when `inclusive` (the face just right of x).
 */
export function internalForces(ls: LoadSet, f1: ArrayLike<number>, x: number, inclusive: boolean, out: Float64Array): Float64Array {
  let Px = 0, Py = 0, Pz = 0, mx = 0, my = 0, mz = 0, armY = 0, armZ = 0;
  const d = ls.dist;
  for (let i = 0; i < d.length; i += 8) {
    const a = d[i], b = d[i + 1];
    if (!(x > a) || !(b > a)) continue;
    const u = (x < b ? x : b) - a;
    const len = b - a;
    const xa = x - a, u2 = (u * u) / 2, u3 = (u * u * u) / 3;
    // component y
    {
      const q1 = d[i + 3], k = (d[i + 6] - q1) / len;
      const F = q1 * u + k * u2;
      Py += F;
      armY += xa * F - (q1 * u2 + k * u3);
    }
    {
      const q1 = d[i + 4], k = (d[i + 7] - q1) / len;
      const F = q1 * u + k * u2;
      Pz += F;
      armZ += xa * F - (q1 * u2 + k * u3);
    }
    {
      const q1 = d[i + 2], k = (d[i + 5] - q1) / len;
      Px += q1 * u + k * u2;
    }
  }
  const p = ls.point;
  for (let i = 0; i < p.length; i += 4) {
    const s = p[i];
    if (s < x || (inclusive && s <= x)) {
      Px += p[i + 1]; Py += p[i + 2]; Pz += p[i + 3];
      armY += (x - s) * p[i + 2];
      armZ += (x - s) * p[i + 3];
    }
  }
  const m = ls.moment;
  for (let i = 0; i < m.length; i += 4) {
    const s = m[i];
    if (s < x || (inclusive && s <= x)) {
      mx += m[i + 1]; my += m[i + 2]; mz += m[i + 3];
    }
  }
  out[0] = -f1[0] - Px;
  out[1] = f1[2] + Pz;
  out[2] = f1[1] + Py;
  out[3] = -f1[3] - mx;
  out[4] = f1[4] + x * f1[2] + armZ + my;
  out[5] = -f1[5] + x * f1[1] + armY - mz;
  return out;
}

/** End forces at the end node (forces the end node applies to the member, local) from statics. */
export function endForcesFromStart(ls: LoadSet, f1: ArrayLike<number>, L: number, out12: Float64Array): Float64Array {
  const s = internalForces(ls, f1, L, true, new Float64Array(6));
  for (let i = 0; i < 6; i++) out12[i] = f1[i];
  out12[6] = s[0];
  out12[7] = -s[2];
  out12[8] = -s[1];
  out12[9] = s[3];
  out12[10] = -s[4];
  out12[11] = s[5];
  return out12;
}
