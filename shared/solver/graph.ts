/**
 * Adjacency graphs used by the orderings: the symmetric pattern of a matrix without its
 * diagonal, and its compression into supervariables (freedoms with identical closed
 * neighbourhoods, typically the six freedoms of one frame node).
 */
import type { SymmetricCsc } from './types.js';

/** Undirected graph in compressed form: neighbours of v are adj[ptr[v] .. ptr[v+1]). */
export interface Graph {
  n: number;
  ptr: Int32Array;
  adj: Int32Array;
}

/** Full symmetric adjacency (both triangles, no self loops) of a lower-triangle CSC pattern. */
export function graphFromLower(K: SymmetricCsc): Graph {
  const { n, colPtr, rowIdx } = K;
  const deg = new Int32Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowIdx[p];
      if (i !== j) {
        deg[i]++;
        deg[j]++;
      }
    }
  }
  const ptr = new Int32Array(n + 1);
  for (let v = 0; v < n; v++) ptr[v + 1] = ptr[v] + deg[v];
  const adj = new Int32Array(ptr[n]);
  const fill = ptr.slice(0, n);
  for (let j = 0; j < n; j++) {
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowIdx[p];
      if (i !== j) {
        adj[fill[i]++] = j;
        adj[fill[j]++] = i;
      }
    }
  }
  return dedupe({ n, ptr, adj });
}

/** Removes repeated neighbours (a pattern may carry duplicate entries). */
function dedupe(g: Graph): Graph {
  const { n, ptr, adj } = g;
  const mark = new Int32Array(n).fill(-1);
  const out = new Int32Array(adj.length);
  const optr = new Int32Array(n + 1);
  let q = 0;
  for (let v = 0; v < n; v++) {
    optr[v] = q;
    for (let p = ptr[v]; p < ptr[v + 1]; p++) {
      const u = adj[p];
      if (mark[u] !== v) {
        mark[u] = v;
        out[q++] = u;
      }
    }
  }
  optr[n] = q;
  return { n, ptr: optr, adj: q === adj.length ? out : out.slice(0, q) };
}

/** A graph of supervariables: vertex s stands for members[memberPtr[s] .. memberPtr[s+1]). */
export interface CompressedGraph {
  graph: Graph;
  weight: Int32Array;
  memberPtr: Int32Array;
  members: Int32Array;
}

/**
 * Merges vertices whose closed neighbourhoods are identical. Eliminating any one of them
 * eliminates the others with no extra fill, so orderings may work on the smaller graph.
 */
export function compressGraph(g: Graph): CompressedGraph {
  const { n, ptr, adj } = g;
  const hash = new Float64Array(n);
  for (let v = 0; v < n; v++) {
    let h = v;
    for (let p = ptr[v]; p < ptr[v + 1]; p++) h += adj[p];
    hash[v] = h * 1024 + (ptr[v + 1] - ptr[v]);
  }
  const order = new Int32Array(n);
  for (let v = 0; v < n; v++) order[v] = v;
  order.sort((a, b) => hash[a] - hash[b] || a - b);

  const rep = new Int32Array(n).fill(-1);
  const mark = new Int32Array(n).fill(-1);
  for (let a = 0; a < n; ) {
    let b = a + 1;
    while (b < n && hash[order[b]] === hash[order[a]]) b++;
    for (let x = a; x < b; x++) {
      const v = order[x];
      if (rep[v] !== -1) continue;
      rep[v] = v;
      if (b - a === 1) continue;
      mark[v] = v;
      for (let p = ptr[v]; p < ptr[v + 1]; p++) mark[adj[p]] = v;
      const dv = ptr[v + 1] - ptr[v];
      for (let y = x + 1; y < b; y++) {
        const u = order[y];
        if (rep[u] !== -1 || ptr[u + 1] - ptr[u] !== dv || mark[u] !== v) continue;
        let same = true;
        for (let p = ptr[u]; p < ptr[u + 1]; p++) {
          if (mark[adj[p]] !== v) {
            same = false;
            break;
          }
        }
        if (same) rep[u] = v;
      }
    }
    a = b;
  }

  // number the supervariables in order of their representative
  const id = new Int32Array(n).fill(-1);
  let m = 0;
  for (let v = 0; v < n; v++) if (rep[v] === v) id[v] = m++;
  const weight = new Int32Array(m);
  for (let v = 0; v < n; v++) weight[id[rep[v]]]++;
  const memberPtr = new Int32Array(m + 1);
  for (let s = 0; s < m; s++) memberPtr[s + 1] = memberPtr[s] + weight[s];
  const members = new Int32Array(n);
  const fill = memberPtr.slice(0, m);
  for (let v = 0; v < n; v++) members[fill[id[rep[v]]]++] = v;

  // edges between supervariables
  const cptr = new Int32Array(m + 1);
  const cmark = new Int32Array(m).fill(-1);
  const cadjParts = new Int32Array(adj.length);
  let q = 0;
  for (let s = 0; s < m; s++) {
    cptr[s] = q;
    const v = members[memberPtr[s]];
    cmark[s] = s;
    for (let p = ptr[v]; p < ptr[v + 1]; p++) {
      const t = id[rep[adj[p]]];
      if (cmark[t] !== s) {
        cmark[t] = s;
        cadjParts[q++] = t;
      }
    }
  }
  cptr[m] = q;
  return { graph: { n: m, ptr: cptr, adj: cadjParts.slice(0, q) }, weight, memberPtr, members };
}

/** Expands an ordering of supervariables into an ordering of the original vertices. */
export function expandOrdering(c: CompressedGraph, order: Int32Array): Int32Array {
  const perm = new Int32Array(c.members.length);
  let k = 0;
  for (let x = 0; x < order.length; x++) {
    const s = order[x];
    for (let p = c.memberPtr[s]; p < c.memberPtr[s + 1]; p++) perm[k++] = c.members[p];
  }
  return perm;
}

/** The subgraph induced by `vertices` (local numbering follows the array). */
export function inducedSubgraph(g: Graph, vertices: Int32Array, local: Int32Array): Graph {
  // local[v] must be -1 for vertices outside the set; it is set and restored here
  const m = vertices.length;
  for (let x = 0; x < m; x++) local[vertices[x]] = x;
  const ptr = new Int32Array(m + 1);
  let q = 0;
  for (let x = 0; x < m; x++) {
    const v = vertices[x];
    for (let p = g.ptr[v]; p < g.ptr[v + 1]; p++) if (local[g.adj[p]] >= 0) q++;
    ptr[x + 1] = q;
  }
  const adj = new Int32Array(q);
  q = 0;
  for (let x = 0; x < m; x++) {
    const v = vertices[x];
    for (let p = g.ptr[v]; p < g.ptr[v + 1]; p++) {
      const l = local[g.adj[p]];
      if (l >= 0) adj[q++] = l;
    }
  }
  for (let x = 0; x < m; x++) local[vertices[x]] = -1;
  return { n: m, ptr, adj };
}

/**
 * Widest level of a breadth-first level structure rooted at a pseudo-peripheral vertex
 * (a few sweeps, each from the last vertex reached by the one before), over the component
 * of vertex 0. Long slender structures have narrow levels however long they are; bulky
 * ones have levels that grow with the model.
 */
export function levelWidth(g: Graph): { levels: number; width: number } {
  const { n, ptr, adj } = g;
  if (n === 0) return { levels: 0, width: 0 };
  const level = new Int32Array(n);
  const queue = new Int32Array(n);
  let root = 0;
  let levels = 0;
  let width = 0;
  for (let sweep = 0; sweep < 3; sweep++) {
    level.fill(-1);
    let head = 0;
    let tail = 0;
    queue[tail++] = root;
    level[root] = 0;
    while (head < tail) {
      const v = queue[head++];
      for (let p = ptr[v]; p < ptr[v + 1]; p++) {
        const u = adj[p];
        if (level[u] < 0) {
          level[u] = level[v] + 1;
          queue[tail++] = u;
        }
      }
    }
    const last = queue[tail - 1];
    levels = level[last] + 1;
    const count = new Int32Array(levels);
    for (let i = 0; i < tail; i++) count[level[queue[i]]]++;
    width = 0;
    for (let l = 0; l < levels; l++) width = Math.max(width, count[l]);
    if (last === root) break;
    root = last;
  }
  return { levels, width };
}
