/**
 * Operation count of the Cholesky factor for an ordering of a graph of supervariables
 * (graph.ts compressGraph): elimination tree by Liu's algorithm and column counts by row
 * subtrees, on the compressed graph. Members of one supervariable share their structure, so
 * supervariable s of weight w with c rows below and including its first column contributes
 * Σ_{i<w} (c − i)² — the same count as on the full matrix, at a fraction of the cost.
 */
import type { Graph } from './graph.js';

export function orderingFlops(g: Graph, weight: Int32Array, order: Int32Array): number {
  const { n, ptr, adj } = g;
  const pinv = new Int32Array(n);
  for (let k = 0; k < n; k++) pinv[order[k]] = k;
  // elimination tree in elimination positions
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
  // weighted column counts: row k (weight of order[k]) lies in every column of its row subtree
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
  let flops = 0;
  for (let k = 0; k < n; k++) {
    const c = count[k];
    const w = weight[order[k]];
    // Σ_{i=0}^{w−1} (c − i)²
    for (let i = 0; i < w; i++) flops += (c - i) * (c - i);
  }
  return flops;
}
