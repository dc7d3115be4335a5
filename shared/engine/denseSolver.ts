/**
 * A small dense LDLᵀ behind the solver contract (shared/solver/types.ts), for tests and as
 * a fallback on tiny systems. Quadratic memory: not for large models.
 */
import { type FactorOptions, type Factorisation, SingularMatrixError, type SymmetricCsc } from '../solver/types.js';

export function factoriseDense(K: SymmetricCsc, opts: FactorOptions = {}): Factorisation {
  const t0 = performance.now();
  const n = K.n;
  const tol = opts.pivotTolerance ?? 1e-10;
  const A = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    for (let p = K.colPtr[j]; p < K.colPtr[j + 1]; p++) {
      const i = K.rowIdx[p];
      A[i * n + j] += K.values[p];
      if (i !== j) A[j * n + i] += K.values[p];
    }
  }
  const diag0 = new Float64Array(n);
  for (let i = 0; i < n; i++) diag0[i] = A[i * n + i];
  const D = new Float64Array(n);
  // in place: L below diagonal (row-major), D separately
  for (let j = 0; j < n; j++) {
    let d = A[j * n + j];
    for (let k = 0; k < j; k++) d -= A[j * n + k] * A[j * n + k] * D[k];
    const ref = Math.abs(diag0[j]);
    if (!(d > tol * ref) || ref === 0) throw new SingularMatrixError(j, d < 0 && Math.abs(d) > tol * ref ? 'negative' : 'zero', d, diag0[j]);
    D[j] = d;
    for (let i = j + 1; i < n; i++) {
      let s = A[i * n + j];
      for (let k = 0; k < j; k++) s -= A[i * n + k] * A[j * n + k] * D[k];
      A[i * n + j] = s / d;
    }
  }
  const t1 = performance.now();
  return {
    n,
    nnzFactor: (n * (n + 1)) / 2,
    timings: { ordering: 0, symbolic: 0, numeric: t1 - t0 },
    solve(B: Float64Array, nrhs: number): Float64Array {
      const X = Float64Array.from(B);
      for (let c = 0; c < nrhs; c++) {
        const o = c * n;
        for (let i = 0; i < n; i++) {
          let s = X[o + i];
          for (let k = 0; k < i; k++) s -= A[i * n + k] * X[o + k];
          X[o + i] = s;
        }
        for (let i = 0; i < n; i++) X[o + i] /= D[i];
        for (let i = n - 1; i >= 0; i--) {
          let s = X[o + i];
          for (let k = i + 1; k < n; k++) s -= A[k * n + i] * X[o + k];
          X[o + i] = s;
        }
      }
      return X;
    },
  };
}
