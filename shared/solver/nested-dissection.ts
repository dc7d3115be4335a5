/**
 * Nested dissection ordering (George, SIAM J. Numer. Anal. 10 (1973) 345–363): split the
 * graph by a vertex separator, order both halves recursively and the separator last.
 * Separators come from breadth-first level structures rooted at a pseudo-peripheral vertex
 * (George & Liu, ACM TOMS 5 (1979) 284–299). Every level structure met while searching for
 * that root proposes its level with the lowest separator weight × total / (part A × part B);
 * the best proposal is trimmed by greedy vertex moves. Small parts are ordered by
 * approximate minimum degree.
 */
import { amdOrder } from './amd.js';
import { inducedSubgraph, type Graph } from './graph.js';

export interface NestedDissectionOptions {
  /** parts whose total weight is at most this are ordered by AMD; default 300 */
  leafWeight: number;
}

const defaults: NestedDissectionOptions = { leafWeight: 300 };

export function nestedDissectionOrder(
  g: Graph,
  weight?: Int32Array,
  options: Partial<NestedDissectionOptions> = {},
): Int32Array {
  const opts = { ...defaults, ...options };
  const n = g.n;
  const { ptr, adj } = g;
  const wt = weight ?? new Int32Array(n).fill(1);
  const order = new Int32Array(n);
  const stamp = new Int32Array(n).fill(-1);
  const level = new Int32Array(n);
  const queue = new Int32Array(n);
  const local = new Int32Array(n).fill(-1);
  let stampCounter = 0;

  /** BFS over vertices carrying `st`; fills queue and level, returns [reached, levels]. */
  const bfs = (root: number, st: number, visited: number): [number, number] => {
    let qh = 0;
    let qt = 0;
    queue[qt++] = root;
    stamp[root] = visited;
    level[root] = 0;
    let maxLevel = 0;
    while (qh < qt) {
      const v = queue[qh++];
      const lv = level[v] + 1;
      for (let p = ptr[v]; p < ptr[v + 1]; p++) {
        const u = adj[p];
        if (stamp[u] === st) {
          stamp[u] = visited;
          level[u] = lv;
          if (lv > maxLevel) maxLevel = lv;
          queue[qt++] = u;
        }
      }
    }
    return [qt, maxLevel + 1];
  };

  const tasks: Array<{ verts: Int32Array; lo: number }> = [{ verts: Int32Array.from({ length: n }, (_, i) => i), lo: 0 }];
  while (tasks.length > 0) {
    const { verts, lo } = tasks.pop()!;
    const m = verts.length;
    let wsum = 0;
    for (let x = 0; x < m; x++) wsum += wt[verts[x]];
    if (wsum <= opts.leafWeight || m <= 8) {
      orderLeaf(verts, lo);
      continue;
    }
    // find a pseudo-peripheral root by repeated BFS
    let st = ++stampCounter;
    for (let x = 0; x < m; x++) stamp[verts[x]] = st;
    let root = verts[0];
    let best = m;
    for (let x = 0; x < m; x++) {
      const v = verts[x];
      const d = ptr[v + 1] - ptr[v];
      if (d < best) {
        best = d;
        root = v;
      }
    }
    let visited = ++stampCounter;
    let [reached, nlev] = bfs(root, st, visited);
    if (reached < m) {
      // disconnected: order the component reached and the rest separately
      const comp = queue.slice(0, reached);
      const rest = new Int32Array(m - reached);
      let r = 0;
      for (let x = 0; x < m; x++) if (stamp[verts[x]] !== visited) rest[r++] = verts[x];
      tasks.push({ verts: comp, lo });
      tasks.push({ verts: rest, lo: lo + reached });
      continue;
    }
    // every level structure met on the way to a pseudo-peripheral root proposes a separating
    // level; keep the proposal with the lowest separator weight relative to the parts' sizes
    const levW = new Float64Array(m + 1);
    let bestCost = Infinity;
    let bestNl = 0;
    const bestPart = new Int8Array(m);
    const propose = (nl: number): void => {
      if (nl < 3) return;
      levW.fill(0, 0, nl);
      for (let x = 0; x < m; x++) levW[level[queue[x]]] += wt[queue[x]];
      let below = levW[0];
      let bl = -1;
      let bc = Infinity;
      for (let l = 1; l < nl - 1; l++) {
        const above = wsum - below - levW[l];
        const cost = (levW[l] * wsum) / (below * above);
        if (cost < bc) {
          bc = cost;
          bl = l;
        }
        below += levW[l];
      }
      if (bc < bestCost) {
        bestCost = bc;
        bestNl = nl;
        for (let x = 0; x < m; x++) {
          const lv = level[verts[x]];
          bestPart[x] = lv < bl ? 0 : lv > bl ? 1 : 2;
        }
      }
    };
    propose(nlev);
    for (let iter = 0; iter < 6; iter++) {
      // lowest-degree vertex of the last level
      let cand = -1;
      let cd = Infinity;
      for (let x = m - 1; x >= 0 && level[queue[x]] === nlev - 1; x--) {
        const v = queue[x];
        const d = ptr[v + 1] - ptr[v];
        if (d < cd) {
          cd = d;
          cand = v;
        }
      }
      st = visited;
      const trial = ++stampCounter;
      const [, nl] = bfs(cand, st, trial);
      visited = trial;
      propose(nl);
      if (nl <= nlev) break;
      nlev = nl;
    }
    if (bestNl === 0) {
      orderLeaf(verts, lo);
      continue;
    }
    const part = level;
    for (let x = 0; x < m; x++) part[verts[x]] = bestPart[x];
    const inSet = visited;
    improveSeparator(verts, part, stamp, inSet, ptr, adj, wt);
    let na = 0;
    let nb = 0;
    for (let x = 0; x < m; x++) {
      const p = part[verts[x]];
      if (p === 0) na++;
      else if (p === 1) nb++;
    }
    if (na === 0 || nb === 0) {
      orderLeaf(verts, lo);
      continue;
    }
    const A = new Int32Array(na);
    const B = new Int32Array(nb);
    let ia = 0;
    let ib = 0;
    let is = lo + na + nb;
    for (let x = 0; x < m; x++) {
      const v = verts[x];
      const p = part[v];
      if (p === 0) A[ia++] = v;
      else if (p === 1) B[ib++] = v;
      else order[is++] = v;
    }
    tasks.push({ verts: A, lo });
    tasks.push({ verts: B, lo: lo + na });
  }
  return order;

  function orderLeaf(verts: Int32Array, lo: number): void {
    const sub = inducedSubgraph(g, verts, local);
    const w = new Int32Array(verts.length);
    for (let x = 0; x < verts.length; x++) w[x] = wt[verts[x]];
    const ord = amdOrder(sub, w);
    for (let x = 0; x < verts.length; x++) order[lo + x] = verts[ord[x]];
  }
}

/**
 * Greedy vertex-separator improvement. A separator vertex with no neighbour in one part
 * joins the other part for free; otherwise moving it into part X pulls its neighbours
 * from the opposite part into the separator, which is done when that lowers the
 * separator weight and keeps the parts within balance.
 */
function improveSeparator(
  verts: Int32Array,
  part: Int32Array,
  stamp: Int32Array,
  inSet: number,
  ptr: Int32Array,
  adj: Int32Array,
  wt: Int32Array,
): void {
  const m = verts.length;
  const pw = [0, 0, 0];
  let total = 0;
  for (let x = 0; x < m; x++) {
    pw[part[verts[x]]] += wt[verts[x]];
    total += wt[verts[x]];
  }
  const maxPart = 0.6 * total;
  for (let pass = 0; pass < 4; pass++) {
    let improved = false;
    for (let x = 0; x < m; x++) {
      const v = verts[x];
      if (part[v] !== 2) continue;
      // try moving v into A (side 0) or B (side 1); cost = weight pulled in from the other side
      let pullA = 0; // weight of B-neighbours (pulled if v goes to A)
      let pullB = 0;
      for (let p = ptr[v]; p < ptr[v + 1]; p++) {
        const u = adj[p];
        if (stamp[u] !== inSet) continue;
        if (part[u] === 1) pullA += wt[u];
        else if (part[u] === 0) pullB += wt[u];
      }
      const gainA = wt[v] - pullA;
      const gainB = wt[v] - pullB;
      const side = gainA > gainB || (gainA === gainB && pw[0] <= pw[1]) ? 0 : 1;
      const gain = side === 0 ? gainA : gainB;
      const other = 1 - side;
      if (gain <= 0) continue;
      const pulled = side === 0 ? pullA : pullB;
      if (pw[side] + wt[v] > maxPart) continue;
      if (pw[other] - pulled <= 0) continue;
      part[v] = side;
      pw[side] += wt[v];
      pw[2] -= wt[v];
      for (let p = ptr[v]; p < ptr[v + 1]; p++) {
        const u = adj[p];
        if (stamp[u] === inSet && part[u] === other) {
          part[u] = 2;
          pw[other] -= wt[u];
          pw[2] += wt[u];
        }
      }
      improved = true;
    }
    if (!improved) break;
  }
}
