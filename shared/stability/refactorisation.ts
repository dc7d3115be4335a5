/**
 * Factorisations of many matrices with one sparsity pattern (K, K + K_G(N) of every iteration
 * and loading): the fill-reducing ordering and the symbolic analysis are done once, each
 * new set of values costs only the numeric factorisation. The project's sparse solver
 * (shared/solver) does the work; a non-positive pivot throws its SingularMatrixError.
 */
import { fillReducingOrder } from '../solver/index.js';
import { blockSolve } from '../solver/block-solve.js';
import { factorNumeric } from '../solver/numeric.js';
import { analyse, type SymbolicFactor } from '../solver/symbolic.js';
import type { FactorOptions, SymmetricCsc } from '../solver/types.js';

export interface NumericSolve {
  /** Solve A X = B for nrhs right-hand sides stored column after column. */
  solve(B: Float64Array, nrhs: number): Float64Array;
}

export interface Refactorisation {
  /** nonzeros of the factor */
  nnzFactor: number;
  /** milliseconds of the ordering and the symbolic analysis */
  setupMs: number;
  /** factorise the matrix with these values (aligned with the pattern's rowIdx) */
  factor(values: Float64Array): NumericSolve;
}

export function refactorisation(pattern: SymmetricCsc, options: FactorOptions = {}): Refactorisation {
  const t0 = performance.now();
  const order = fillReducingOrder(pattern, options.ordering ?? 'auto');
  const sym: SymbolicFactor = analyse(pattern, order);
  const pivotTolerance = options.pivotTolerance ?? 1e-10;
  const n = pattern.n;
  return {
    nnzFactor: sym.nnzL,
    setupMs: performance.now() - t0,
    factor(values: Float64Array): NumericSolve {
      if (values.length < pattern.colPtr[n]) throw new Error(`refactorisation: ${values.length} values for ${pattern.colPtr[n]} entries`);
      const f = factorNumeric(values, sym, pivotTolerance);
      return {
        solve(B: Float64Array, nrhs: number): Float64Array {
          if (B.length !== n * nrhs) throw new Error(`refactorisation: right-hand side has ${B.length} values, expected ${n * nrhs}`);
          return blockSolve(sym, f, B, nrhs);
        },
      };
    },
  };
}
