/**
 * Reading a moment diagram given at stations: values at any point (quadratic through the
 * three nearest stations, exact for the parabola of a uniform load), the largest absolute
 * moment in a segment, and the quarter-point moments used by AISC 360-22 F1-1 (Cb) and the
 * shape factors of EN 1993-1-1 (C1, Cm). Allocation-free: results go into a caller's array.
 */

/** Index layout of the `out` array filled by segmentMoments. */
export const SEG_MMAX = 0, SEG_MA = 1, SEG_MB = 2, SEG_MC = 3, SEG_M0 = 4, SEG_M1 = 5, SEG_XMAX = 6, SEG_MS = 7;
export const SEG_SA = 8, SEG_SB = 9, SEG_SC = 10;
export const SEG_SIZE = 11;

/** Moment at x, quadratic through the three stations nearest to x (linear with two stations). */
export function momentAt(xs: Float64Array, M: Float64Array, x: number): number {
  const n = xs.length;
  if (n === 1) return M[0];
  let i = 0;
  while (i < n - 1 && xs[i + 1] < x) i++;
  // i: last station with xs[i] < x (or 0); choose three stations around x
  if (n === 2) {
    const t = (x - xs[0]) / (xs[1] - xs[0] || 1);
    return M[0] + t * (M[1] - M[0]);
  }
  if (x <= xs[0]) return M[0];
  if (x >= xs[n - 1]) return M[n - 1];
  // exact station hits
  if (xs[i + 1] === x) return M[i + 1];
  if (xs[i] === x) return M[i];
  let a = i - 1, b = i, c = i + 1;
  if (a < 0) { a = 0; b = 1; c = 2; } else if (c + 1 < n && x - xs[b] > xs[c] - x) { a = b; b = c; c = c + 1; }
  const x0 = xs[a], x1 = xs[b], x2 = xs[c];
  // coincident stations (a point load station duplicated) fall back to linear
  if (x0 === x1 || x1 === x2 || x0 === x2) {
    const t = (x - xs[i]) / (xs[i + 1] - xs[i] || 1);
    return M[i] + t * (M[i + 1] - M[i]);
  }
  const l0 = ((x - x1) * (x - x2)) / ((x0 - x1) * (x0 - x2));
  const l1 = ((x - x0) * (x - x2)) / ((x1 - x0) * (x1 - x2));
  const l2 = ((x - x0) * (x - x1)) / ((x2 - x0) * (x2 - x1));
  return l0 * M[a] + l1 * M[b] + l2 * M[c];
}

/**
 * Moments of the segment [a, b]: out[SEG_MMAX] largest |M| at stations inside the segment
 * and at its ends, out[SEG_MA..SEG_MC] |M| at the quarter, centre and three-quarter points,
 * out[SEG_M0], out[SEG_M1] signed end moments, out[SEG_XMAX] where |M| is largest,
 * out[SEG_SA..SEG_SC] the signed quarter-point moments,
 * out[SEG_MS] signed moment of largest magnitude strictly inside the segment (at stations,
 * or the larger quarter-point moment when no station lies inside).
 */
export function segmentMoments(xs: Float64Array, M: Float64Array, a: number, b: number, out: Float64Array): void {
  const m0 = momentAt(xs, M, a);
  const m1 = momentAt(xs, M, b);
  let mmax = Math.abs(m0), xmax = a;
  if (Math.abs(m1) > mmax) { mmax = Math.abs(m1); xmax = b; }
  const L = b - a;
  const tol = 1e-9 * Math.max(1, L);
  let ms = 0;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    if (x < a - tol || x > b + tol) continue;
    const v = M[i];
    const av = Math.abs(v);
    if (av > mmax) { mmax = av; xmax = x; }
    if (x > a + tol && x < b - tol && av > Math.abs(ms)) ms = v;
  }
  const ma = momentAt(xs, M, a + 0.25 * L);
  const mb = momentAt(xs, M, a + 0.5 * L);
  const mc = momentAt(xs, M, a + 0.75 * L);
  if (Math.abs(mb) > Math.abs(ms)) ms = mb;
  if (Math.abs(ma) > Math.abs(ms)) ms = ma;
  if (Math.abs(mc) > Math.abs(ms)) ms = mc;
  out[SEG_MMAX] = mmax;
  out[SEG_MA] = Math.abs(ma);
  out[SEG_MB] = Math.abs(mb);
  out[SEG_MC] = Math.abs(mc);
  out[SEG_M0] = m0;
  out[SEG_M1] = m1;
  out[SEG_XMAX] = xmax;
  out[SEG_MS] = ms;
  out[SEG_SA] = ma;
  out[SEG_SB] = mb;
  out[SEG_SC] = mc;
}

/**
 * AISC 360-22 Eq. F1-1: Cb = 12.5·Mmax / (2.5·Mmax + 3·MA + 4·MB + 3·MC), absolute values
 * within the unbraced segment. Limited to 3.0 (conservative cap). 1.0 when Mmax = 0.
 */
export function cbF11(mmax: number, ma: number, mb: number, mc: number): number {
  if (!(mmax > 0)) return 1;
  const cb = (12.5 * mmax) / (2.5 * mmax + 3 * ma + 4 * mb + 3 * mc);
  return cb > 3 ? 3 : cb;
}

/**
 * Whether a segment's diagram is linear between its end moments: the quarter and centre
 * moments differ from linear interpolation by at most 1 % of the largest moment.
 */
export function isLinearSegment(seg: Float64Array): boolean {
  const m0 = seg[SEG_M0], m1 = seg[SEG_M1];
  const tol = 0.01 * Math.max(seg[SEG_MMAX], 1e-300);
  return Math.abs(seg[SEG_SA] - (0.75 * m0 + 0.25 * m1)) <= tol
    && Math.abs(seg[SEG_SB] - 0.5 * (m0 + m1)) <= tol
    && Math.abs(seg[SEG_SC] - (0.25 * m0 + 0.75 * m1)) <= tol
    && Math.max(Math.abs(m0), Math.abs(m1)) >= seg[SEG_MMAX] - tol;
}
