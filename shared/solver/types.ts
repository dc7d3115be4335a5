/**
 * Contract of the sparse symmetric solver used by the engine.
 *
 * The matrix is given as its LOWER triangle (diagonal included) in compressed sparse
 * column form with 0-based Int32Array indices; row indices within a column ascending.
 */
export interface SymmetricCsc {
  n: number;
  colPtr: Int32Array; // length n+1
  rowIdx: Int32Array; // length nnz
  values: Float64Array; // length nnz
}

export interface FactorOptions {
  /** 'auto' picks the ordering by size; default 'auto' */
  ordering?: 'auto' | 'amd' | 'nested-dissection' | 'natural';
  /** a pivot below pivotTolerance × the original diagonal is treated as zero; default 1e-10 */
  pivotTolerance?: number;
}

export interface Factorisation {
  n: number;
  /** nonzeros of the factor L (strictly lower plus diagonal) */
  nnzFactor: number;
  /** milliseconds: ordering, symbolic, numeric */
  timings: { ordering: number; symbolic: number; numeric: number };
  /**
   * Solve K X = B for a block of right-hand sides stored column after column
   * (B[j*n + i] = row i of column j). Returns a new array of the same layout.
   */
  solve(B: Float64Array, nrhs: number): Float64Array;
  /**
   * Factorises new values of the same pattern (aligned with its rowIdx) into this
   * factorisation's memory, reusing its ordering and symbolic analysis; later solves use
   * the new factor. After a SingularMatrixError, solve refuses until a refactorisation
   * succeeds. Optional: solvers that cannot reuse their analysis leave it out.
   */
  refactorise?(values: Float64Array): void;
  /**
   * Declares the factorisation no longer needed: its memory goes to the next factorisation of
   * the same analysed pattern (fresh memory costs page faults on every analysis). Solving or
   * refactorising afterwards throws. Optional, like refactorise.
   */
  release?(): void;
}

/** A zero, tiny or negative pivot: `index` is the freedom (original numbering) at fault. */
export class SingularMatrixError extends Error {
  constructor(
    readonly index: number,
    readonly kind: 'zero' | 'negative',
    readonly pivot: number,
    readonly diagonal: number,
  ) {
    super(`matrix is singular at freedom ${index} (${kind} pivot ${pivot} against diagonal ${diagonal})`);
    this.name = 'SingularMatrixError';
  }
}
