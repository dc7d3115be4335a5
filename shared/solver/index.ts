/**
 * Sparse symmetric positive definite solver: fill-reducing ordering (approximate minimum
 * degree or nested dissection), symbolic analysis with supernodes, supernodal Cholesky
 * with pivot checks, and block forward/back substitution for many load cases at once.
 */
import { amdOrder } from './amd.js';
import { blockSolve } from './block-solve.js';
import { compressGraph, expandOrdering, graphFromLower } from './graph.js';
import { nestedDissectionOrder } from './nested-dissection.js';
import { factorNumeric } from './numeric.js';
import { analyse } from './symbolic.js';
import type { Factorisation, FactorOptions, SymmetricCsc } from './types.js';

export * from './types.js';

/** 'auto' uses nested dissection from this many freedoms up (measured in bench/solver.ts). */
export const NESTED_DISSECTION_FROM = 20000;

export type Ordering = NonNullable<FactorOptions['ordering']>;

/** Fill-reducing ordering: order[k] is the freedom eliminated k-th. */
export function fillReducingOrder(K: SymmetricCsc, ordering: Ordering = 'auto'): Int32Array {
  const n = K.n;
  if (ordering === 'natural') return Int32Array.from({ length: n }, (_, i) => i);
  const method = ordering === 'auto' ? (n >= NESTED_DISSECTION_FROM ? 'nested-dissection' : 'amd') : ordering;
  const c = compressGraph(graphFromLower(K));
  const order = method === 'amd' ? amdOrder(c.graph, c.weight) : nestedDissectionOrder(c.graph, c.weight);
  return expandOrdering(c, order);
}

/** Checks the shape of a lower-triangle CSC matrix; throws an Error naming the fault. */
export function checkSymmetricCsc(K: SymmetricCsc): void {
  const { n, colPtr, rowIdx, values } = K;
  if (!Number.isInteger(n) || n < 0) throw new Error(`solver: matrix size ${n} is not a non-negative integer`);
  if (colPtr.length !== n + 1) throw new Error(`solver: colPtr has length ${colPtr.length}, expected ${n + 1}`);
  if (colPtr[0] !== 0) throw new Error('solver: colPtr[0] must be 0');
  const nnz = colPtr[n];
  if (rowIdx.length < nnz || values.length < nnz) {
    throw new Error(`solver: colPtr announces ${nnz} entries but rowIdx/values hold ${rowIdx.length}/${values.length}`);
  }
  for (let j = 0; j < n; j++) {
    if (colPtr[j + 1] < colPtr[j]) throw new Error(`solver: colPtr decreases at column ${j}`);
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowIdx[p];
      if (i < j || i >= n) throw new Error(`solver: entry (${i}, ${j}) is not in the lower triangle of a ${n}×${n} matrix`);
      if (!Number.isFinite(values[p])) throw new Error(`solver: entry (${i}, ${j}) is ${values[p]}`);
    }
  }
}

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
}

/**
 * Factorises the symmetric matrix K (lower triangle) as PKPᵀ = LLᵀ.
 * Throws SingularMatrixError (original freedom index) for a zero, tiny or negative pivot.
 */
export function factorise(K: SymmetricCsc, options: FactorOptions = {}): SupernodalFactorisation {
  checkSymmetricCsc(K);
  const ordering = options.ordering ?? 'auto';
  const pivotTolerance = options.pivotTolerance ?? 1e-10;
  const n = K.n;
  const used: Exclude<Ordering, 'auto'> =
    ordering === 'auto' ? (n >= NESTED_DISSECTION_FROM ? 'nested-dissection' : 'amd') : ordering;

  let t = performance.now();
  const order = fillReducingOrder(K, used);
  const tOrder = performance.now() - t;

  t = performance.now();
  const sym = analyse(K, order);
  const tSymbolic = performance.now() - t;

  t = performance.now();
  const Lx = factorNumeric(K.values, sym, pivotTolerance);
  const tNumeric = performance.now() - t;

  return {
    n,
    nnzFactor: sym.nnzL,
    timings: { ordering: tOrder, symbolic: tSymbolic, numeric: tNumeric },
    perm: sym.perm,
    supernodes: sym.nsuper,
    storedEntries: sym.storedEntries,
    flops: sym.flops,
    ordering: used,
    solve(B: Float64Array, nrhs: number): Float64Array {
      if (!Number.isInteger(nrhs) || nrhs < 0) throw new Error(`solver: nrhs ${nrhs} is not a non-negative integer`);
      if (B.length !== n * nrhs) throw new Error(`solver: right-hand side has ${B.length} values, expected ${n * nrhs}`);
      return blockSolve(sym, Lx, B, nrhs);
    },
  };
}
