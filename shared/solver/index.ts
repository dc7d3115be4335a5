/**
 * Sparse symmetric positive definite solver: fill-reducing ordering (approximate minimum
 * degree or nested dissection), symbolic analysis with supernodes, supernodal Cholesky
 * with pivot checks, and block forward/back substitution for many load cases at once.
 */
import { amdOrder } from './amd.js';
import { blockSolve } from './block-solve.js';
import { compressGraph, graphFromLower } from './graph.js';
import { nestedDissectionOrder } from './nested-dissection.js';
import { factorNumeric } from './numeric.js';
import { expandPostordered, orderingFlops, type PostorderedOrdering } from './supervariable-tree.js';
import { analyse } from './symbolic.js';
import type { Factorisation, FactorOptions, SymmetricCsc } from './types.js';

export * from './types.js';

/**
 * From this many freedoms up, 'auto' tries nested dissection beside AMD. Measured on the
 * synthetic building frames of bench/solver.ts: equal work below ~10k freedoms, ND 1.5×
 * fewer operations at 22k and 2.6× fewer at 106k; on a long box truss AMD stays better.
 */
export const NESTED_DISSECTION_FROM = 10000;

export type Ordering = NonNullable<FactorOptions['ordering']>;

/**
 * Fill-reducing ordering: order[k] is the freedom eliminated k-th. 'auto' takes AMD for
 * small systems; from NESTED_DISSECTION_FROM freedoms it computes both AMD and nested
 * dissection and keeps the one whose factor needs fewer operations (long trusses and
 * other slender structures favour AMD, bulky 3D frames favour nested dissection). The
 * comparison and the elimination tree of the chosen ordering are computed on the graph of
 * supervariables (supervariable-tree.ts), which is exact and several times smaller.
 */
export function fillReducingOrder(K: SymmetricCsc, ordering: Ordering = 'auto'): Int32Array {
  return chooseOrdering(K, ordering).order;
}

interface Chosen {
  order: Int32Array;
  used: Exclude<Ordering, 'auto'>;
  /** the order postordered, with elimination tree and column counts (from the supervariables) */
  tree?: PostorderedOrdering;
}

function chooseOrdering(K: SymmetricCsc, ordering: Ordering): Chosen {
  const n = K.n;
  if (ordering === 'natural') return { order: Int32Array.from({ length: n }, (_, i) => i), used: 'natural' };
  const c = compressGraph(graphFromLower(K));
  const chosen = (order: Int32Array, used: Exclude<Ordering, 'auto'>): Chosen => {
    const tree = expandPostordered(c, order);
    return { order: tree.perm, used, tree };
  };
  if (ordering === 'amd' || (ordering === 'auto' && n < NESTED_DISSECTION_FROM)) return chosen(amdOrder(c.graph, c.weight), 'amd');
  const nd = nestedDissectionOrder(c.graph, c.weight);
  if (ordering === 'nested-dissection') return chosen(nd, 'nested-dissection');
  const amd = amdOrder(c.graph, c.weight);
  return orderingFlops(c.graph, c.weight, nd) < orderingFlops(c.graph, c.weight, amd) ? chosen(nd, 'nested-dissection') : chosen(amd, 'amd');
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

  let t = performance.now();
  const { order, used, tree } = chooseOrdering(K, ordering);
  const tOrder = performance.now() - t;

  t = performance.now();
  const sym = analyse(K, order, undefined, tree);
  const tSymbolic = performance.now() - t;

  t = performance.now();
  const factor = factorNumeric(K.values, sym, pivotTolerance);
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
      return blockSolve(sym, factor, B, nrhs);
    },
  };
}
