/**
 * Member local axes (conventions.md "Member local axes").
 *
 * Returns the rotation matrix R as 9 numbers, rows = local x, y, z expressed in global
 * axes, so that v_local = R · v_global.
 */
import type { VerticalAxis } from '../model/types.js';

/** A member within this angle (rad) of the vertical axis counts as vertical. */
export const VERTICAL_TOLERANCE = 0.001;

export function localAxes(
  start: readonly [number, number, number],
  end: readonly [number, number, number],
  roll: number,
  vertical: VerticalAxis,
): Float64Array {
  const dx = end[0] - start[0];
  const dy = end[1] - start[1];
  const dz = end[2] - start[2];
  const L = Math.hypot(dx, dy, dz);
  if (!(L > 0)) throw new Error('localAxes: zero-length member');
  const x0 = dx / L, x1 = dy / L, x2 = dz / L;
  const up = vertical === 'Y' ? [0, 1, 0] : [0, 0, 1];
  const cosUp = x0 * up[0] + x1 * up[1] + x2 * up[2];
  let z0: number, z1: number, z2: number;
  if (Math.abs(cosUp) >= Math.cos(VERTICAL_TOLERANCE)) {
    // vertical member: local z = global +X, made perpendicular to x (a member leaning by less
    // than the tolerance has x0 ≠ 0; without this the rotation would not be orthonormal)
    z0 = 1 - x0 * x0; z1 = -x0 * x1; z2 = -x0 * x2;
    const n = Math.hypot(z0, z1, z2);
    z0 /= n; z1 /= n; z2 /= n;
  } else {
    z0 = up[0] - cosUp * x0;
    z1 = up[1] - cosUp * x1;
    z2 = up[2] - cosUp * x2;
    const n = Math.hypot(z0, z1, z2);
    z0 /= n; z1 /= n; z2 /= n;
  }
  // y = z × x
  let y0 = z1 * x2 - z2 * x1;
  let y1 = z2 * x0 - z0 * x2;
  let y2 = z0 * x1 - z1 * x0;
  if (roll !== 0) {
    const c = Math.cos(roll), s = Math.sin(roll);
    const ny0 = c * y0 + s * z0, ny1 = c * y1 + s * z1, ny2 = c * y2 + s * z2;
    const nz0 = -s * y0 + c * z0, nz1 = -s * y1 + c * z1, nz2 = -s * y2 + c * z2;
    y0 = ny0; y1 = ny1; y2 = ny2; z0 = nz0; z1 = nz1; z2 = nz2;
  }
  return Float64Array.of(x0, x1, x2, y0, y1, y2, z0, z1, z2);
}

/** out = R · v (global → local) for a 3-vector at offset. */
export function toLocal3(R: ArrayLike<number>, v: ArrayLike<number>, vo: number, out: Float64Array | number[], oo: number): void {
  const a = v[vo], b = v[vo + 1], c = v[vo + 2];
  out[oo] = R[0] * a + R[1] * b + R[2] * c;
  out[oo + 1] = R[3] * a + R[4] * b + R[5] * c;
  out[oo + 2] = R[6] * a + R[7] * b + R[8] * c;
}

/** out = Rᵀ · v (local → global) for a 3-vector at offset. */
export function toGlobal3(R: ArrayLike<number>, v: ArrayLike<number>, vo: number, out: Float64Array | number[], oo: number): void {
  const a = v[vo], b = v[vo + 1], c = v[vo + 2];
  out[oo] = R[0] * a + R[3] * b + R[6] * c;
  out[oo + 1] = R[1] * a + R[4] * b + R[7] * c;
  out[oo + 2] = R[2] * a + R[5] * b + R[8] * c;
}

/** 12-vector global → local (four 3-blocks). */
export function vecToLocal12(R: ArrayLike<number>, g: ArrayLike<number>, out: Float64Array): Float64Array {
  for (let b = 0; b < 12; b += 3) toLocal3(R, g, b, out, b);
  return out;
}

/** 12-vector local → global. */
export function vecToGlobal12(R: ArrayLike<number>, l: ArrayLike<number>, out: Float64Array): Float64Array {
  for (let b = 0; b < 12; b += 3) toGlobal3(R, l, b, out, b);
  return out;
}
