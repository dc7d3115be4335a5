/**
 * Forward and back substitution with a supernodal Cholesky factor for a block of
 * right-hand sides at once. The work array is row-major (the nrhs values of one freedom
 * are adjacent) so every inner loop runs over the load cases.
 */
import type { SymbolicFactor } from './symbolic.js';

export function blockSolve(sym: SymbolicFactor, Lx: Float64Array, B: Float64Array, nrhs: number): Float64Array {
  const { n, perm, nsuper, superFirst, superRowPtr, superRows, superValPtr } = sym;
  const X = new Float64Array(n * nrhs);
  for (let q = 0; q < nrhs; q++) {
    const bq = q * n;
    for (let k = 0; k < n; k++) X[k * nrhs + q] = B[bq + perm[k]];
  }

  // L Y = B
  for (let s = 0; s < nsuper; s++) {
    const f = superFirst[s];
    const nc = superFirst[s + 1] - f;
    const r0 = superRowPtr[s];
    const nr = superRowPtr[s + 1] - r0;
    const os = superValPtr[s];
    for (let i = 0; i < nc; i++) {
      const rowI = os + i * nc;
      const xi = (f + i) * nrhs;
      for (let k = 0; k < i; k++) {
        const l = Lx[rowI + k];
        const xk = (f + k) * nrhs;
        for (let q = 0; q < nrhs; q++) X[xi + q] -= l * X[xk + q];
      }
      const inv = 1 / Lx[rowI + i];
      for (let q = 0; q < nrhs; q++) X[xi + q] *= inv;
    }
    for (let r = nc; r < nr; r++) {
      const rowR = os + r * nc;
      const xr = superRows[r0 + r] * nrhs;
      for (let k = 0; k < nc; k++) {
        const l = Lx[rowR + k];
        if (l === 0) continue;
        const xk = (f + k) * nrhs;
        for (let q = 0; q < nrhs; q++) X[xr + q] -= l * X[xk + q];
      }
    }
  }

  // Lᵀ X = Y
  for (let s = nsuper - 1; s >= 0; s--) {
    const f = superFirst[s];
    const nc = superFirst[s + 1] - f;
    const r0 = superRowPtr[s];
    const nr = superRowPtr[s + 1] - r0;
    const os = superValPtr[s];
    for (let r = nc; r < nr; r++) {
      const rowR = os + r * nc;
      const xr = superRows[r0 + r] * nrhs;
      for (let k = 0; k < nc; k++) {
        const l = Lx[rowR + k];
        if (l === 0) continue;
        const xk = (f + k) * nrhs;
        for (let q = 0; q < nrhs; q++) X[xk + q] -= l * X[xr + q];
      }
    }
    for (let i = nc - 1; i >= 0; i--) {
      const rowI = os + i * nc;
      const xi = (f + i) * nrhs;
      const inv = 1 / Lx[rowI + i];
      for (let q = 0; q < nrhs; q++) X[xi + q] *= inv;
      for (let k = 0; k < i; k++) {
        const l = Lx[rowI + k];
        const xk = (f + k) * nrhs;
        for (let q = 0; q < nrhs; q++) X[xk + q] -= l * X[xi + q];
      }
    }
  }

  const out = new Float64Array(n * nrhs);
  for (let q = 0; q < nrhs; q++) {
    const bq = q * n;
    for (let k = 0; k < n; k++) out[bq + perm[k]] = X[k * nrhs + q];
  }
  return out;
}
