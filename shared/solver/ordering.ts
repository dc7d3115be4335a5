/**
 * Choice of the fill-reducing ordering: approximate minimum degree for small or slender
 * systems, nested dissection for bulky ones, decided from the graph before either is
 * computed. The elimination tree and column counts of the chosen ordering come from the
 * graph of supervariables (supervariable-tree.ts), which is exact and several times smaller.
 */
import { amdOrder } from './amd.js';
import { compressGraph, graphFromLower, levelWidth, type CompressedGraph } from './graph.js';
import { nestedDissectionOrder } from './nested-dissection.js';
import { expandPostordered, type PostorderedOrdering } from './supervariable-tree.js';
import type { FactorOptions, SymmetricCsc } from './types.js';

/**
 * From this many freedoms up, 'auto' may take nested dissection. Measured on the synthetic
 * building frames of bench/solver.ts: equal work below ~10k freedoms, ND 1.5× fewer
 * operations at 22k and 2.6× fewer at 106k.
 */
export const NESTED_DISSECTION_FROM = 10000;

/**
 * 'auto' takes nested dissection only when the widest breadth-first level of the
 * supervariable graph holds at least √(BULK · vertices) supervariables. Measured
 * (width² / vertices): building frames of ../shared/perf 3.4 (1k members) and 4.0 (10k
 * members, where ND needs 1.5× fewer operations than AMD); a 110 × 100 plate grid 0.91 (ND
 * 1.4× fewer); the long Pratt truss 0.002 (AMD needs 0.34× the operations of ND).
 */
export const BULK = 0.5;

export type Ordering = NonNullable<FactorOptions['ordering']>;

export interface Chosen {
  order: Int32Array;
  used: Exclude<Ordering, 'auto'>;
  /** the order postordered, with elimination tree and column counts (from the supervariables) */
  tree?: PostorderedOrdering;
}

/** True when nested dissection is expected to pay on this (compressed) graph. */
export function prefersNestedDissection(n: number, c: CompressedGraph): boolean {
  if (n < NESTED_DISSECTION_FROM) return false;
  const { width } = levelWidth(c.graph);
  return width * width >= BULK * c.graph.n;
}

export function chooseOrdering(K: SymmetricCsc, ordering: Ordering): Chosen {
  const n = K.n;
  if (ordering === 'natural') return { order: Int32Array.from({ length: n }, (_, i) => i), used: 'natural' };
  const c = compressGraph(graphFromLower(K));
  const chosen = (order: Int32Array, used: Exclude<Ordering, 'auto'>): Chosen => {
    const tree = expandPostordered(c, order);
    return { order: tree.perm, used, tree };
  };
  const nd = ordering === 'nested-dissection' || (ordering === 'auto' && prefersNestedDissection(n, c));
  return nd ? chosen(nestedDissectionOrder(c.graph, c.weight), 'nested-dissection') : chosen(amdOrder(c.graph, c.weight), 'amd');
}

/** Fill-reducing ordering: order[k] is the freedom eliminated k-th (postordered). */
export function fillReducingOrder(K: SymmetricCsc, ordering: Ordering = 'auto'): Int32Array {
  return chooseOrdering(K, ordering).order;
}
