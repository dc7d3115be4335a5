/**
 * The analysis of one sparsity pattern, kept for every factorisation of that pattern: the
 * fill-reducing ordering, elimination tree, supernode partition and column counts are
 * computed once; each set of values then costs only the numeric factorisation, and a
 * factorisation can refactorise new values into its own memory and solve workspace.
 */
import { blockSolve } from './block-solve.js';
import { factorNumeric, type NumericFactor } from './numeric.js';
import { chooseOrdering, type Ordering } from './ordering.js';
import { analyse, type SymbolicFactor } from './symbolic.js';
import type { Factorisation, FactorOptions, SymmetricCsc } from './types.js';

export interface SupernodalFactorisation extends Factorisation {
  /** freedom eliminated k-th */
  perm: Int32Array;
  /** number of supernodes and entries stored in their dense blocks */
  supernodes: number;
  storedEntries: number;
  /** floating-point operations of the numeric factorisation */
  flops: number;
  /** the ordering actually used */
  ordering: Exclude<Ordering, 'auto'>;
  /** the pattern's analysis this factorisation was computed with */
  analysis: PatternAnalysis;
  /** true when the factor went into the memory of a released factorisation of this analysis */
  memoryReused: boolean;
  refactorise(values: Float64Array): void;
  release(): void;
}

/** released factor memories an analysis keeps for reuse */
const KEEP_RELEASED = 2;

export interface PatternAnalysis {
  n: number;
  /** nonzeros of the factor L (strictly lower plus diagonal) */
  nnzFactor: number;
  perm: Int32Array;
  supernodes: number;
  storedEntries: number;
  flops: number;
  ordering: Exclude<Ordering, 'auto'>;
  /** milliseconds spent once on the ordering and the symbolic analysis */
  timings: { ordering: number; symbolic: number };
  /** the symbolic factor (supernodes and their row structures) */
  symbolic: SymbolicFactor;
  /** True when K has exactly the analysed pattern (same size, colPtr and rowIdx). */
  matches(K: SymmetricCsc): boolean;
  /**
   * Numeric factorisation of values aligned with the analysed pattern's rowIdx, in memory of
   * its own: that of a released factorisation of this analysis when there is one (no fresh
   * pages to fault in), else new. Throws SingularMatrixError for a zero, tiny or negative pivot.
   */
  factorise(values: Float64Array, pivotTolerance?: number): SupernodalFactorisation;
}

/** Checks the shape of a lower-triangle CSC pattern; throws an Error naming the fault. */
export function checkPattern(K: { n: number; colPtr: Int32Array; rowIdx: Int32Array }): void {
  const { n, colPtr, rowIdx } = K;
  if (!Number.isInteger(n) || n < 0) throw new Error(`solver: matrix size ${n} is not a non-negative integer`);
  if (colPtr.length !== n + 1) throw new Error(`solver: colPtr has length ${colPtr.length}, expected ${n + 1}`);
  if (colPtr[0] !== 0) throw new Error('solver: colPtr[0] must be 0');
  const nnz = colPtr[n];
  if (rowIdx.length < nnz) throw new Error(`solver: colPtr announces ${nnz} entries but rowIdx holds ${rowIdx.length}`);
  for (let j = 0; j < n; j++) {
    if (colPtr[j + 1] < colPtr[j]) throw new Error(`solver: colPtr decreases at column ${j}`);
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowIdx[p];
      if (i < j || i >= n) throw new Error(`solver: entry (${i}, ${j}) is not in the lower triangle of a ${n}×${n} matrix`);
    }
  }
}

/** Checks that values are as many as the pattern's entries and finite; names the first bad one. */
export function checkValues(K: { n: number; colPtr: Int32Array; rowIdx: Int32Array }, values: Float64Array): void {
  const { n, colPtr, rowIdx } = K;
  const nnz = colPtr[n];
  if (values.length < nnz) throw new Error(`solver: colPtr announces ${nnz} entries but values holds ${values.length}`);
  for (let p = 0; p < nnz; p++) {
    if (!Number.isFinite(values[p])) {
      let j = 0;
      while (colPtr[j + 1] <= p) j++;
      throw new Error(`solver: entry (${rowIdx[p]}, ${j}) is ${values[p]}`);
    }
  }
}

/**
 * Orders and analyses the pattern of K (lower triangle; values are not read). The pattern's
 * arrays are referenced, not copied: change them only through a new analysis.
 */
export function analysePattern(K: SymmetricCsc, options: FactorOptions = {}): PatternAnalysis {
  const ordering = options.ordering ?? 'auto';
  const defaultTolerance = options.pivotTolerance ?? 1e-10;
  checkPattern(K);
  const { n, colPtr, rowIdx } = K;

  let t = performance.now();
  const { order, used, tree } = chooseOrdering(K, ordering);
  const tOrder = performance.now() - t;
  t = performance.now();
  const sym = analyse(K, order, undefined, tree);
  const tSymbolic = performance.now() - t;

  /** memory of released factorisations, handed to the next ones */
  const released: NumericFactor[] = [];
  const analysis: PatternAnalysis = {
    n,
    nnzFactor: sym.nnzL,
    perm: sym.perm,
    supernodes: sym.nsuper,
    storedEntries: sym.storedEntries,
    flops: sym.flops,
    ordering: used,
    timings: { ordering: tOrder, symbolic: tSymbolic },
    symbolic: sym,
    matches(other: SymmetricCsc): boolean {
      if (other.n !== n) return false;
      const a = other.colPtr;
      const b = other.rowIdx;
      if (a === colPtr && b === rowIdx) return true;
      if (a.length < n + 1 || a[n] !== colPtr[n]) return false;
      for (let j = 0; j <= n; j++) if (a[j] !== colPtr[j]) return false;
      for (let p = 0; p < colPtr[n]; p++) if (b[p] !== rowIdx[p]) return false;
      return true;
    },
    factorise(values: Float64Array, pivotTolerance = defaultTolerance): SupernodalFactorisation {
      checkValues(K, values);
      const t0 = performance.now();
      const spare = released.pop();
      let factor: NumericFactor;
      try {
        factor = factorNumeric(values, sym, pivotTolerance, spare);
      } catch (e) {
        if (spare) released.push(spare);
        throw e;
      }
      let state: 'usable' | 'failed' | 'released' = 'usable';
      const timings = { ordering: 0, symbolic: 0, numeric: performance.now() - t0 };
      const check = (): void => {
        if (state === 'failed') throw new Error('solver: the last refactorisation failed; refactorise before solving');
        if (state === 'released') throw new Error('solver: this factorisation was released');
      };
      return {
        n,
        nnzFactor: sym.nnzL,
        timings,
        perm: sym.perm,
        supernodes: sym.nsuper,
        storedEntries: sym.storedEntries,
        flops: sym.flops,
        ordering: used,
        analysis,
        memoryReused: spare !== undefined,
        solve(B: Float64Array, nrhs: number): Float64Array {
          if (!Number.isInteger(nrhs) || nrhs < 0) throw new Error(`solver: nrhs ${nrhs} is not a non-negative integer`);
          if (B.length !== n * nrhs) throw new Error(`solver: right-hand side has ${B.length} values, expected ${n * nrhs}`);
          check();
          return blockSolve(sym, factor, B, nrhs);
        },
        refactorise(next: Float64Array): void {
          if (state === 'released') check();
          checkValues(K, next);
          const t1 = performance.now();
          state = 'failed';
          factor = factorNumeric(next, sym, pivotTolerance, factor);
          state = 'usable';
          timings.numeric = performance.now() - t1;
        },
        release(): void {
          if (state === 'released') return;
          state = 'released';
          if (released.length < KEEP_RELEASED) released.push(factor);
        },
      };
    },
  };
  return analysis;
}
