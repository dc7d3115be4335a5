/**
 * y = A x for a symmetric matrix stored as its lower triangle in CSC (the engine's pattern,
 * values aligned with its rowIdx): each stored off-diagonal entry acts twice. The residuals of
 * the second-order iteration's preconditioned steps (second-order.ts).
 */
import type { SymmetricCsc } from '../solver/types.js';

export function symmetricProduct(K: Pick<SymmetricCsc, 'n' | 'colPtr' | 'rowIdx'>, values: Float64Array, x: Float64Array, y: Float64Array): Float64Array {
  const { n, colPtr, rowIdx } = K;
  y.fill(0, 0, n);
  for (let j = 0; j < n; j++) {
    const xj = x[j];
    let s = 0;
    const p1 = colPtr[j + 1];
    for (let p = colPtr[j]; p < p1; p++) {
      const i = rowIdx[p], v = values[p];
      if (i === j) s += v * xj;
      else {
        y[i] += v * xj;
        s += v * x[i];
      }
    }
    y[j] += s;
  }
  return y;
}
