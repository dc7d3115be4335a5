/**
 * Building blocks for section properties: root-fillet spandrels and plastic moduli of
 * shapes made of rectangles (possibly rotated), found by cutting polygons at the
 * equal-area axis. Lengths in metres.
 */

/**
 * A root fillet (the "spandrel" between two perpendicular faces and a quarter circle of
 * radius r). Closed form, from the square minus a quarter disc:
 * area (1 − π/4)·r², centroid r·(10 − 3π)/(12 − 3π) from each face,
 * second moment about either face r⁴·(1 − 5π/16), product of inertia not needed here.
 */
export function spandrel(r: number): { area: number; offset: number; iOwn: number } {
  const area = (1 - Math.PI / 4) * r * r;
  const offset = (r * (10 - 3 * Math.PI)) / (12 - 3 * Math.PI);
  const iFace = r ** 4 * (1 - (5 * Math.PI) / 16);
  return { area, offset, iOwn: iFace - area * offset * offset };
}

/** A point in the section plane: y horizontal, z vertical (local axes). */
export type Pt = [number, number];
export type Polygon = Pt[];

/** Axis-aligned rectangle as a counter-clockwise polygon. */
export function rectangle(y0: number, z0: number, y1: number, z1: number): Polygon {
  return [[y0, z0], [y1, z0], [y1, z1], [y0, z1]];
}

/** Area, first moments and second moments (about the origin) of a simple polygon. */
export function polygonMoments(p: Polygon): { A: number; Sy: number; Sz: number; Iyy: number; Izz: number; Iyz: number } {
  // Green's theorem; y horizontal, z vertical. Sy = ∫z dA, Sz = ∫y dA,
  // Iyy = ∫z² dA, Izz = ∫y² dA, Iyz = ∫y·z dA.
  let A = 0, Sy = 0, Sz = 0, Iyy = 0, Izz = 0, Iyz = 0;
  for (let i = 0; i < p.length; i++) {
    const [y0, z0] = p[i];
    const [y1, z1] = p[(i + 1) % p.length];
    const c = y0 * z1 - y1 * z0;
    A += c;
    Sz += (y0 + y1) * c;
    Sy += (z0 + z1) * c;
    Izz += (y0 * y0 + y0 * y1 + y1 * y1) * c;
    Iyy += (z0 * z0 + z0 * z1 + z1 * z1) * c;
    Iyz += (y0 * z1 + 2 * y0 * z0 + 2 * y1 * z1 + y1 * z0) * c;
  }
  return { A: A / 2, Sy: Sy / 6, Sz: Sz / 6, Iyy: Iyy / 12, Izz: Izz / 12, Iyz: Iyz / 24 };
}

/** The part of a convex polygon where n·p ≥ c (Sutherland–Hodgman, one half-plane). */
export function clipHalfPlane(p: Polygon, n: Pt, c: number): Polygon {
  const out: Polygon = [];
  const f = (q: Pt) => n[0] * q[0] + n[1] * q[1] - c;
  for (let i = 0; i < p.length; i++) {
    const a = p[i];
    const b = p[(i + 1) % p.length];
    const fa = f(a);
    const fb = f(b);
    if (fa >= 0) out.push(a);
    if ((fa >= 0) !== (fb >= 0)) {
      const s = fa / (fa - fb);
      out.push([a[0] + s * (b[0] - a[0]), a[1] + s * (b[1] - a[1])]);
    }
  }
  return out;
}

/**
 * Plastic section modulus of a shape made of non-overlapping convex polygons, for bending
 * about an axis whose normal is the unit vector n (stress varies along n). The plastic
 * neutral axis n·p = c splits the area in halves (found by bisection);
 * Z = ∫|n·p − c| dA. Also returns c.
 */
export function plasticModulus(parts: Polygon[], n: Pt): { Z: number; c: number } {
  let lo = Infinity, hi = -Infinity;
  for (const p of parts) for (const q of p) {
    const s = n[0] * q[0] + n[1] * q[1];
    lo = Math.min(lo, s);
    hi = Math.max(hi, s);
  }
  const total = parts.reduce((s, p) => s + polygonMoments(p).A, 0);
  const above = (c: number) => parts.reduce((s, p) => s + polygonMoments(clipHalfPlane(p, n, c)).A, 0);
  let a = lo, b = hi;
  for (let k = 0; k < 200 && b - a > 1e-15 * (hi - lo + 1); k++) {
    const m = (a + b) / 2;
    if (above(m) > total / 2) a = m; else b = m;
  }
  const c = (a + b) / 2;
  let Z = 0;
  for (const p of parts) {
    const up = clipHalfPlane(p, n, c);
    const down = clipHalfPlane(p, [-n[0], -n[1]], -c);
    const mu = polygonMoments(up);
    const md = polygonMoments(down);
    // ∫(n·p − c) dA over the upper part and ∫(c − n·p) dA over the lower part
    Z += n[0] * mu.Sz + n[1] * mu.Sy - c * mu.A;
    Z += c * md.A - (n[0] * md.Sz + n[1] * md.Sy);
  }
  return { Z, c };
}
