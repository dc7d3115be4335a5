/**
 * Elimination tree and column counts of the Cholesky factor computed on a graph of
 * supervariables (graph.ts compressGraph): Liu's algorithm for the tree and row subtrees for
 * the counts. Members of one supervariable are eliminated together and share their
 * structure, so everything the full matrix needs follows exactly at a fraction of the cost:
 * the operation count that compares orderings, and a postordered full ordering with its
 * elimination tree and column counts for the symbolic analysis.
 */
import type { CompressedGraph, Graph } from './graph.js';
import { postorder } from './postorder.js';

export interface SupervariableTree {
  /** parent[k] = elimination position of the parent of position k, or −1 */
  parent: Int32Array;
  /** weighted column count of position k (its own weight included) */
  count: Float64Array;
}

export function supervariableTree(g: Graph, weight: Int32Array, order: Int32Array): SupervariableTree {
  const { n, ptr, adj } = g;
  const pinv = new Int32Array(n);
  for (let k = 0; k < n; k++) pinv[order[k]] = k;
  const parent = new Int32Array(n).fill(-1);
  const ancestor = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) {
    const v = order[k];
    for (let p = ptr[v]; p < ptr[v + 1]; p++) {
      let i = pinv[adj[p]];
      while (i !== -1 && i < k) {
        const next = ancestor[i];
        ancestor[i] = k;
        if (next === -1) parent[i] = k;
        i = next;
      }
    }
  }
  // row k (weight of order[k]) lies in every column of its row subtree
  const count = new Float64Array(n);
  const mark = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) {
    const v = order[k];
    const wk = weight[v];
    mark[k] = k;
    count[k] += wk;
    for (let p = ptr[v]; p < ptr[v + 1]; p++) {
      let j = pinv[adj[p]];
      if (j > k) continue;
      while (mark[j] !== k) {
        mark[j] = k;
        count[j] += wk;
        j = parent[j];
      }
    }
  }
  return { parent, count };
}

/** Operation count of the factor: supervariable s of weight w and count c gives Σ_{i<w} (c − i)². */
export function orderingFlops(g: Graph, weight: Int32Array, order: Int32Array): number {
  const { count } = supervariableTree(g, weight, order);
  let flops = 0;
  for (let k = 0; k < g.n; k++) {
    const c = count[k];
    const w = weight[order[k]];
    for (let i = 0; i < w; i++) flops += (c - i) * (c - i);
  }
  return flops;
}

/** The full ordering, postordered, with the elimination tree and column counts of every column. */
export interface PostorderedOrdering {
  perm: Int32Array;
  parent: Int32Array;
  count: Int32Array;
}

export function expandPostordered(c: CompressedGraph, order: Int32Array): PostorderedOrdering {
  const m = order.length;
  const { parent, count } = supervariableTree(c.graph, c.weight, order);
  // postorder of the supervariable tree (children in elimination order)
  const post = postorder(parent);
  // full positions: supervariable at new position x starts at start[x]
  const start = new Int32Array(m + 1);
  for (let x = 0; x < m; x++) start[x + 1] = start[x] + c.weight[order[post[x]]];
  const newPos = new Int32Array(m);
  for (let x = 0; x < m; x++) newPos[post[x]] = x;
  const n = start[m];
  const perm = new Int32Array(n);
  const fullParent = new Int32Array(n);
  const fullCount = new Int32Array(n);
  for (let x = 0; x < m; x++) {
    const old = post[x];
    const s = order[old];
    const w = c.weight[s];
    const p0 = start[x];
    for (let i = 0; i < w; i++) {
      perm[p0 + i] = c.members[c.memberPtr[s] + i];
      fullCount[p0 + i] = count[old] - i;
      fullParent[p0 + i] = p0 + i + 1;
    }
    fullParent[p0 + w - 1] = parent[old] === -1 ? -1 : start[newPos[parent[old]]];
  }
  return { perm, parent: fullParent, count: fullCount };
}
