/**
 * Member loads of one case on one member, resolved into member local axes, positions
 * measured from the member's start node. Everything inside the engine works on these.
 */
export interface LoadSet {
  /** distributed, 8 numbers each: a, b, q1x, q1y, q1z (at a), q2x, q2y, q2z (at b) — force / length */
  dist: number[];
  /** point forces, 4 each: a, Px, Py, Pz */
  point: number[];
  /** concentrated moments, 4 each: a, mx, my, mz */
  moment: number[];
  /** uniform free thermal strain α·ΔT */
  eps: number;
  /** α·(T(+z face) − T(−z face)); free curvature d'' = −grad / depth */
  grad: number;
}

export function emptyLoadSet(): LoadSet {
  return { dist: [], point: [], moment: [], eps: 0, grad: 0 };
}

export function isEmptyLoadSet(ls: LoadSet): boolean {
  return ls.dist.length === 0 && ls.point.length === 0 && ls.moment.length === 0 && ls.eps === 0 && ls.grad === 0;
}

/**
 * The part of a load set that lies on [x0, x1), shifted so that x0 becomes 0 (sub-elements of
 * tapered members). Concentrated loads at x1 go to the last piece only (`last`).
 */
export function clipLoadSet(ls: LoadSet, x0: number, x1: number, last: boolean): LoadSet {
  const out = emptyLoadSet();
  out.eps = ls.eps;
  out.grad = ls.grad;
  const d = ls.dist;
  for (let i = 0; i < d.length; i += 8) {
    const a = d[i], b = d[i + 1];
    const lo = Math.max(a, x0), hi = Math.min(b, x1);
    if (!(hi > lo) || !(b > a)) continue;
    const len = b - a;
    const ta = (lo - a) / len, tb = (hi - a) / len;
    out.dist.push(lo - x0, hi - x0);
    for (let c = 0; c < 3; c++) out.dist.push(d[i + 2 + c] + (d[i + 5 + c] - d[i + 2 + c]) * ta);
    for (let c = 0; c < 3; c++) out.dist.push(d[i + 2 + c] + (d[i + 5 + c] - d[i + 2 + c]) * tb);
  }
  const take = (src: number[], dst: number[]) => {
    for (let i = 0; i < src.length; i += 4) {
      const a = src[i];
      if (a >= x0 && (a < x1 || (last && a <= x1))) dst.push(a - x0, src[i + 1], src[i + 2], src[i + 3]);
    }
  };
  take(ls.point, out.point);
  take(ls.moment, out.moment);
  return out;
}

/** Sorted distinct positions in (0, L) where the load diagram changes form. */
export function loadBreakpoints(ls: LoadSet, L: number, into: number[]): number[] {
  const add = (s: number) => {
    if (s > 0 && s < L) into.push(s);
  };
  for (let i = 0; i < ls.dist.length; i += 8) { add(ls.dist[i]); add(ls.dist[i + 1]); }
  for (let i = 0; i < ls.point.length; i += 4) add(ls.point[i]);
  for (let i = 0; i < ls.moment.length; i += 4) add(ls.moment[i]);
  return into;
}

/** Sort ascending and drop values closer than tol to the previous one. */
export function uniqueSorted(values: number[], tol: number): number[] {
  values.sort((p, q) => p - q);
  const out: number[] = [];
  for (const v of values) if (out.length === 0 || v - out[out.length - 1] > tol) out.push(v);
  return out;
}
