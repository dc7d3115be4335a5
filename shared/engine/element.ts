/**
 * Element stiffness: 3D Euler–Bernoulli frame (12 freedoms) and truss (axial only), in
 * member local axes, with end releases by static condensation, and the transformation
 * to global axes. Local freedom order per end: u, v, w, θx, θy, θz (v along local y,
 * w along local z); θy = −dw/dx, θz = dv/dx.
 */

export interface ElementStiffness {
  EA: number;
  /** E · I_major (bending about local y, deflection along local z) */
  EIy: number;
  /** E · I_minor (bending about local z, deflection along local y) */
  EIz: number;
  GJ: number;
}

/** Which bending moments are released (zero) at each end. */
export interface EndReleases {
  startMajor: boolean;
  startMinor: boolean;
  endMajor: boolean;
  endMinor: boolean;
}

export const NO_RELEASES: EndReleases = { startMajor: false, startMinor: false, endMajor: false, endMinor: false };

/** Local 12×12 stiffness (row-major) into `k` (zeroed here). */
export function localStiffness(p: ElementStiffness, L: number, truss: boolean, rel: EndReleases, k: Float64Array): Float64Array {
  k.fill(0);
  const set = (i: number, j: number, v: number) => {
    k[i * 12 + j] = v;
    k[j * 12 + i] = v;
  };
  const ea = p.EA / L;
  set(0, 0, ea); set(6, 6, ea); set(0, 6, -ea);
  if (truss) return k;
  const gj = p.GJ / L;
  set(3, 3, gj); set(9, 9, gj); set(3, 9, -gj);
  // minor-axis bending: v (1, 7), θz (5, 11), EIz
  {
    const c = p.EIz / (L * L * L);
    set(1, 1, 12 * c); set(7, 7, 12 * c); set(1, 7, -12 * c);
    set(1, 5, 6 * L * c); set(1, 11, 6 * L * c); set(7, 5, -6 * L * c); set(7, 11, -6 * L * c);
    set(5, 5, 4 * L * L * c); set(11, 11, 4 * L * L * c); set(5, 11, 2 * L * L * c);
  }
  // major-axis bending: w (2, 8), θy (4, 10), EIy
  {
    const c = p.EIy / (L * L * L);
    set(2, 2, 12 * c); set(8, 8, 12 * c); set(2, 8, -12 * c);
    set(2, 4, -6 * L * c); set(2, 10, -6 * L * c); set(8, 4, 6 * L * c); set(8, 10, 6 * L * c);
    set(4, 4, 4 * L * L * c); set(10, 10, 4 * L * L * c); set(4, 10, 2 * L * L * c);
  }
  if (rel.startMajor) condense(k, 4);
  if (rel.startMinor) condense(k, 5);
  if (rel.endMajor) condense(k, 10);
  if (rel.endMinor) condense(k, 11);
  return k;
}

/** Static condensation of freedom r (its end force is zero): row and column r become zero. */
export function condense(k: Float64Array, r: number): void {
  const krr = k[r * 12 + r];
  if (krr !== 0) {
    for (let i = 0; i < 12; i++) {
      if (i === r) continue;
      const kir = k[i * 12 + r];
      if (kir === 0) continue;
      const f = kir / krr;
      for (let j = 0; j < 12; j++) if (j !== r) k[i * 12 + j] -= f * k[r * 12 + j];
    }
  }
  for (let i = 0; i < 12; i++) {
    k[i * 12 + r] = 0;
    k[r * 12 + i] = 0;
  }
}

/** Global element stiffness kg = Tᵀ kl T, T = diag(R, R, R, R). */
export function toGlobalStiffness(kl: Float64Array, R: ArrayLike<number>, kg: Float64Array, tmp: Float64Array, off = 0): Float64Array {
  // tmp = kl · T  (each 3×3 block times R)
  for (let i = 0; i < 12; i++) {
    for (let bj = 0; bj < 12; bj += 3) {
      const a = kl[i * 12 + bj], b = kl[i * 12 + bj + 1], c = kl[i * 12 + bj + 2];
      tmp[i * 12 + bj] = a * R[0] + b * R[3] + c * R[6];
      tmp[i * 12 + bj + 1] = a * R[1] + b * R[4] + c * R[7];
      tmp[i * 12 + bj + 2] = a * R[2] + b * R[5] + c * R[8];
    }
  }
  // kg = Tᵀ · tmp
  for (let bi = 0; bi < 12; bi += 3) {
    for (let j = 0; j < 12; j++) {
      const a = tmp[bi * 12 + j], b = tmp[(bi + 1) * 12 + j], c = tmp[(bi + 2) * 12 + j];
      kg[off + bi * 12 + j] = R[0] * a + R[3] * b + R[6] * c;
      kg[off + (bi + 1) * 12 + j] = R[1] * a + R[4] * b + R[7] * c;
      kg[off + (bi + 2) * 12 + j] = R[2] * a + R[5] * b + R[8] * c;
    }
  }
  return kg;
}

/** Global truss stiffness directly: k·[c cᵀ, −c cᵀ; −c cᵀ, c cᵀ] on the translations, c = local x. */
export function trussGlobalStiffness(k: number, R: ArrayLike<number>, kg: Float64Array, off: number): void {
  kg.fill(0, off, off + 144);
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      const v = k * R[i] * R[j];
      kg[off + i * 12 + j] = v;
      kg[off + (6 + i) * 12 + 6 + j] = v;
      kg[off + i * 12 + 6 + j] = -v;
      kg[off + (6 + i) * 12 + j] = -v;
    }
  }
}
