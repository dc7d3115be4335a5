/**
 * Internal forces and chord deflections at stations along a member, for one case.
 *
 * Forces: statics of the free body from the start end forces plus the member loads
 * (statics.ts) — exact for the loads applied.
 * Deflections relative to the chord: with the curvature κ(x) = M(x)/EI(x) + κ_T(x) and
 * d(0) = d(L) = 0,
 *   d(x) = ∫₀ˣ (x−s) κ(s) ds − (x/L) ∫₀ᴸ (L−s) κ(s) ds = x·A(x) − B(x) − (x/L)(L·A(L) − B(L)),
 * A(x) = ∫₀ˣ κ, B(x) = ∫₀ˣ s κ. Between breakpoints κ is a polynomial of degree ≤ 3 for a
 * prismatic member, so three-point Gauss per piece is exact. Releases need no special
 * treatment (the moment is zero there), and a tapered member uses EI(x) along its length.
 */
import type { MemberInfo } from './discretise.js';
import { GAUSS3_T, GAUSS3_W } from './gauss.js';
import { emptyLoadSet, type LoadSet, loadBreakpoints, uniqueSorted } from './loadSet.js';
import { internalForces } from './statics.js';

/** Rows of the per-case block: N, V_major, V_minor, T, M_major, M_minor, d_major, d_minor. */
export const ROWS = 8;
const EMPTY = emptyLoadSet();

/** Default number of equally spaced stations (tables.md settings `stations`). */
export const DEFAULT_STATIONS = 11;

/**
 * The member's result stations: `count` equally spaced (both ends included; settings
 * `stations`), every concentrated load position of any case, and the exact positions `points`
 * (table `result_points`), sorted. Positions closer than 1e-9·L merge; an exact position
 * (load or result point) wins over an equally spaced one, so x = 1.0 is read at 1.0 and
 * not at 10·0.1.
 */
export function memberStations(L: number, sets: (LoadSet | undefined)[], count = DEFAULT_STATIONS, points: readonly number[] = []): Float64Array {
  if (!(Number.isInteger(count) && count >= 2)) throw new Error(`stations per member must be a whole number of at least 2 (got ${count})`);
  const n = count - 1;
  const exact: number[] = [...points];
  for (const ls of sets) {
    if (!ls) continue;
    for (let i = 0; i < ls.point.length; i += 4) exact.push(ls.point[i]);
    for (let i = 0; i < ls.moment.length; i += 4) exact.push(ls.moment[i]);
  }
  const xs = new Float64Array(count);
  for (let i = 0; i <= n; i++) xs[i] = (L * i) / n;
  xs[n] = L;
  if (exact.length === 0) return xs;
  // exact positions sit after the equally spaced ones; a stable sort keeps that order on ties
  const tagged = Array.from(xs, (x) => [x, 0] as [number, number]);
  for (const x of exact) tagged.push([Math.min(Math.max(x, 0), L), 1]);
  tagged.sort((p, q) => p[0] - q[0]);
  const tol = L * 1e-9;
  const out: number[] = [];
  let exactLast = false;
  for (const [x, isExact] of tagged) {
    if (out.length > 0 && x - out[out.length - 1] <= tol) {
      if (isExact && !exactLast) { out[out.length - 1] = x; exactLast = true; }
      continue;
    }
    out.push(x);
    exactLast = isExact === 1;
  }
  out[0] = 0;
  out[out.length - 1] = L;
  return Float64Array.from(out);
}

/**
 * Fill out[row * nSt + i] for the 8 rows at the given stations, for start end forces f1
 * (local, forces the start node applies to the member).
 */
export function caseStations(m: MemberInfo, lsIn: LoadSet | undefined, f1: ArrayLike<number>, xs: Float64Array, out: Float64Array, outOff: number): void {
  const nSt = xs.length;
  const L = m.L;
  if (!lsIn && !m.tapered) {
    unloadedStations(m, f1, xs, out, outOff);
    return;
  }
  const ls = lsIn ?? EMPTY;
  const s = new Float64Array(6);
  for (let i = 0; i < nSt; i++) {
    internalForces(ls, f1, xs[i], xs[i] <= 0, s);
    for (let r = 0; r < 6; r++) out[outOff + r * nSt + i] = s[r];
  }
  // deflections
  const E = m.material.E;
  const pts = [...xs];
  loadBreakpoints(ls, L, pts);
  if (m.tapered) for (let k = 1; k < 32; k++) pts.push((L * k) / 32);
  const P = uniqueSorted(pts, L * 1e-12);
  const nP = P.length;
  const Amaj = new Float64Array(nP), Bmaj = new Float64Array(nP), Amin = new Float64Array(nP), Bmin = new Float64Array(nP);
  const constProps = m.tapered ? null : m.props(0);
  for (let k = 0; k + 1 < nP; k++) {
    const x0 = P[k], h = P[k + 1] - x0;
    let a1 = 0, b1 = 0, a2 = 0, b2 = 0;
    for (let g = 0; g < 3; g++) {
      const x = x0 + GAUSS3_T[g] * h, w = GAUSS3_W[g] * h;
      const pr = constProps ?? m.props(x / L);
      internalForces(ls, f1, x, false, s);
      const kmaj = s[4] / (E * pr.Iy) + (ls.grad !== 0 ? -ls.grad / pr.depth : 0);
      const kmin = s[5] / (E * pr.Iz);
      a1 += w * kmaj; b1 += w * x * kmaj;
      a2 += w * kmin; b2 += w * x * kmin;
    }
    Amaj[k + 1] = Amaj[k] + a1; Bmaj[k + 1] = Bmaj[k] + b1;
    Amin[k + 1] = Amin[k] + a2; Bmin[k + 1] = Bmin[k] + b2;
  }
  const cMaj = (L * Amaj[nP - 1] - Bmaj[nP - 1]) / L;
  const cMin = (L * Amin[nP - 1] - Bmin[nP - 1]) / L;
  let k = 0;
  for (let i = 0; i < nSt; i++) {
    const x = xs[i];
    while (k + 1 < nP && Math.abs(P[k + 1] - x) <= Math.abs(P[k] - x)) k++;
    out[outOff + 6 * nSt + i] = i === 0 || i === nSt - 1 ? 0 : x * Amaj[k] - Bmaj[k] - x * cMaj;
    out[outOff + 7 * nSt + i] = i === 0 || i === nSt - 1 ? 0 : x * Amin[k] - Bmin[k] - x * cMin;
  }
}

/**
 * A prismatic member without span loads: constant N, V, T; linear M; and with the linear
 * curvature κ(x) = κ0 + (κL − κ0)x/L the chord deflection
 *   d(x) = κ0 x²/2 + (κL − κ0) x³/(6L) − x L (2κ0 + κL)/6.
 */
function unloadedStations(m: MemberInfo, f1: ArrayLike<number>, xs: Float64Array, out: Float64Array, o: number): void {
  const nSt = xs.length, L = m.L;
  const p = m.props(0), E = m.material.E;
  const k0maj = f1[4] / (E * p.Iy), kLmaj = (f1[4] + L * f1[2]) / (E * p.Iy);
  const k0min = -f1[5] / (E * p.Iz), kLmin = (-f1[5] + L * f1[1]) / (E * p.Iz);
  for (let i = 0; i < nSt; i++) {
    const x = xs[i];
    out[o + i] = -f1[0];
    out[o + nSt + i] = f1[2];
    out[o + 2 * nSt + i] = f1[1];
    out[o + 3 * nSt + i] = -f1[3];
    out[o + 4 * nSt + i] = f1[4] + x * f1[2];
    out[o + 5 * nSt + i] = -f1[5] + x * f1[1];
    const end = i === 0 || i === nSt - 1;
    out[o + 6 * nSt + i] = end ? 0 : (k0maj * x * x) / 2 + ((kLmaj - k0maj) * x * x * x) / (6 * L) - (x * L * (2 * k0maj + kLmaj)) / 6;
    out[o + 7 * nSt + i] = end ? 0 : (k0min * x * x) / 2 + ((kLmin - k0min) * x * x * x) / (6 * L) - (x * L * (2 * k0min + kLmin)) / 6;
  }
}
