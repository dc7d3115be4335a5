/**
 * Approximate minimum degree ordering (Amestoy, Davis & Duff, SIAM J. Matrix Anal. Appl. 17
 * (1996) 886–905; the compact formulation of Davis, "Direct Methods for Sparse Linear
 * Systems", SIAM 2006, ch. 7). Works on the quotient graph: eliminated variables become
 * elements, elements adjacent to the pivot are absorbed, degrees are approximated from
 * element set differences, indistinguishable variables are merged into supervariables and
 * variables left with no external degree are eliminated with the pivot (mass elimination).
 *
 * Vertices may carry weights (a vertex standing for several identical freedoms).
 */
import type { Graph } from './graph.js';

const flip = (i: number): number => -i - 2;

/**
 * Returns `order`, where order[k] is the vertex eliminated k-th.
 * `weight[v]` (default 1) is the number of freedoms vertex v stands for.
 */
export function amdOrder(g: Graph, weight?: Int32Array): Int32Array {
  const n = g.n;
  if (n === 0) return new Int32Array(0);
  const gp = g.ptr;
  const gi = g.adj;
  let total = 0;
  for (let v = 0; v < n; v++) total += weight ? weight[v] : 1;

  let cnz = gp[n];
  const nzmax = cnz + Math.floor(cnz / 5) + 2 * n + 16;
  const Ci = new Int32Array(nzmax);
  Ci.set(gi.subarray(0, cnz));
  const Cp = new Int32Array(n + 1);
  Cp.set(gp.subarray(0, n + 1));

  const len = new Int32Array(n + 1);
  const nv = new Int32Array(n + 1);
  const next = new Int32Array(n + 1).fill(-1);
  const last = new Int32Array(n + 1).fill(-1);
  const head = new Int32Array(total + 1).fill(-1);
  const elen = new Int32Array(n + 1);
  const degree = new Int32Array(n + 1);
  const w = new Int32Array(n + 1).fill(1);
  const hhead = new Int32Array(n + 1).fill(-1);

  let dense = Math.max(16, 10 * Math.sqrt(total));
  dense = Math.min(total - 2, dense);

  for (let k = 0; k < n; k++) {
    len[k] = Cp[k + 1] - Cp[k];
    nv[k] = weight ? weight[k] : 1;
  }
  for (let k = 0; k < n; k++) {
    let d = 0;
    for (let p = Cp[k]; p < Cp[k + 1]; p++) d += nv[gi[p]];
    degree[k] = d;
  }
  len[n] = 0;
  nv[n] = 1;
  let mark = clearW(0, 0, w, n);
  elen[n] = -2;
  Cp[n] = -1;
  w[n] = 0;

  let nel = 0;
  for (let i = 0; i < n; i++) {
    const d = degree[i];
    if (len[i] === 0) {
      elen[i] = -2;
      nel += nv[i];
      Cp[i] = -1;
      w[i] = 0;
    } else if (d > dense) {
      nel += nv[i];
      nv[i] = 0;
      elen[i] = -1;
      Cp[i] = flip(n);
      nv[n]++;
    } else {
      if (head[d] !== -1) last[head[d]] = i;
      next[i] = head[d];
      head[d] = i;
    }
  }

  let mindeg = 0;
  let lemax = 0;
  while (nel < total) {
    // select a variable of minimum approximate degree
    let k = -1;
    for (; mindeg < total && (k = head[mindeg]) === -1; mindeg++);
    if (k === -1) break; // only dense variables remain
    if (next[k] !== -1) last[next[k]] = -1;
    head[mindeg] = next[k];
    const elenk = elen[k];
    let nvk = nv[k];
    nel += nvk;

    // garbage collection
    if (elenk > 0 && cnz + mindeg >= nzmax) {
      for (let j = 0; j < n; j++) {
        const p = Cp[j];
        if (p >= 0) {
          Cp[j] = Ci[p];
          Ci[p] = flip(j);
        }
      }
      let q = 0;
      for (let p = 0; p < cnz; ) {
        const j = flip(Ci[p++]);
        if (j >= 0) {
          Ci[q] = Cp[j];
          Cp[j] = q++;
          for (let k3 = 0; k3 < len[j] - 1; k3++) Ci[q++] = Ci[p++];
        }
      }
      cnz = q;
    }

    // construct the new element
    let dk = 0;
    nv[k] = -nvk;
    let p = Cp[k];
    const pk1 = elenk === 0 ? p : cnz;
    let pk2 = pk1;
    for (let k1 = 1; k1 <= elenk + 1; k1++) {
      let e: number;
      let pj: number;
      let ln: number;
      if (k1 > elenk) {
        e = k;
        pj = p;
        ln = len[k] - elenk;
      } else {
        e = Ci[p++];
        pj = Cp[e];
        ln = len[e];
      }
      for (let k2 = 1; k2 <= ln; k2++) {
        const i = Ci[pj++];
        const nvi = nv[i];
        if (nvi <= 0) continue;
        dk += nvi;
        nv[i] = -nvi;
        Ci[pk2++] = i;
        if (next[i] !== -1) last[next[i]] = last[i];
        if (last[i] !== -1) next[last[i]] = next[i];
        else head[degree[i]] = next[i];
      }
      if (e !== k) {
        Cp[e] = flip(k); // element e is absorbed into k
        w[e] = 0;
      }
    }
    if (elenk !== 0) cnz = pk2;
    degree[k] = dk;
    Cp[k] = pk1;
    len[k] = pk2 - pk1;
    elen[k] = -2;

    // set differences |Le \ Lk| for the elements adjacent to the new element
    mark = clearW(mark, lemax, w, n);
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk];
      const eln = elen[i];
      if (eln <= 0) continue;
      const nvi = -nv[i];
      const wnvi = mark - nvi;
      for (let q = Cp[i]; q <= Cp[i] + eln - 1; q++) {
        const e = Ci[q];
        if (w[e] >= mark) w[e] -= nvi;
        else if (w[e] !== 0) w[e] = degree[e] + wnvi;
      }
    }

    // degree update and element absorption
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk];
      const p1 = Cp[i];
      const p2 = p1 + elen[i] - 1;
      let pn = p1;
      let h = 0;
      let d = 0;
      for (let q = p1; q <= p2; q++) {
        const e = Ci[q];
        if (w[e] !== 0) {
          const dext = w[e] - mark;
          if (dext > 0) {
            d += dext;
            Ci[pn++] = e;
            h += e;
          } else {
            Cp[e] = flip(k); // aggressive absorption
            w[e] = 0;
          }
        }
      }
      elen[i] = pn - p1 + 1;
      const p3 = pn;
      const p4 = p1 + len[i];
      for (let q = p2 + 1; q < p4; q++) {
        const j = Ci[q];
        const nvj = nv[j];
        if (nvj <= 0) continue;
        d += nvj;
        Ci[pn++] = j;
        h += j;
      }
      if (d === 0) {
        // mass elimination: i is eliminated together with k
        Cp[i] = flip(k);
        const nvi = -nv[i];
        dk -= nvi;
        nvk += nvi;
        nel += nvi;
        nv[i] = 0;
        elen[i] = -1;
      } else {
        degree[i] = Math.min(degree[i], d);
        Ci[pn] = Ci[p3];
        Ci[p3] = Ci[p1];
        Ci[p1] = k;
        len[i] = pn - p1 + 1;
        h = h % n;
        next[i] = hhead[h];
        hhead[h] = i;
        last[i] = h;
      }
    }
    degree[k] = dk;
    lemax = Math.max(lemax, dk);
    mark = clearW(mark + lemax, lemax, w, n);

    // supervariable detection
    for (let pk = pk1; pk < pk2; pk++) {
      let i = Ci[pk];
      if (nv[i] >= 0) continue;
      const h = last[i];
      i = hhead[h];
      hhead[h] = -1;
      for (; i !== -1 && next[i] !== -1; i = next[i], mark++) {
        const ln = len[i];
        const eln = elen[i];
        for (let q = Cp[i] + 1; q <= Cp[i] + ln - 1; q++) w[Ci[q]] = mark;
        let jlast = i;
        for (let j = next[i]; j !== -1; ) {
          let ok = len[j] === ln && elen[j] === eln;
          for (let q = Cp[j] + 1; ok && q <= Cp[j] + ln - 1; q++) {
            if (w[Ci[q]] !== mark) ok = false;
          }
          if (ok) {
            Cp[j] = flip(i);
            nv[i] += nv[j];
            nv[j] = 0;
            elen[j] = -1;
            j = next[j];
            next[jlast] = j;
          } else {
            jlast = j;
            j = next[j];
          }
        }
      }
    }

    // finalise the new element
    let q = pk1;
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk];
      const nvi = -nv[i];
      if (nvi <= 0) continue;
      nv[i] = nvi;
      let d = degree[i] + dk - nvi;
      d = Math.min(d, total - nel - nvi);
      if (head[d] !== -1) last[head[d]] = i;
      next[i] = head[d];
      last[i] = -1;
      head[d] = i;
      mindeg = Math.min(mindeg, d);
      degree[i] = d;
      Ci[q++] = i;
    }
    nv[k] = nvk;
    len[k] = q - pk1;
    if (len[k] === 0) {
      Cp[k] = -1;
      w[k] = 0;
    }
    if (elenk !== 0) cnz = q;
  }

  // postorder the assembly tree
  for (let i = 0; i < n; i++) Cp[i] = flip(Cp[i]);
  head.fill(-1, 0, n + 1);
  for (let j = n; j >= 0; j--) {
    if (nv[j] > 0) continue;
    next[j] = head[Cp[j]];
    head[Cp[j]] = j;
  }
  for (let e = n; e >= 0; e--) {
    if (nv[e] <= 0) continue;
    if (Cp[e] !== -1) {
      next[e] = head[Cp[e]];
      head[Cp[e]] = e;
    }
  }
  const post = new Int32Array(n + 1);
  let k = 0;
  for (let i = 0; i <= n; i++) {
    if (Cp[i] === -1) k = treeDfs(i, k, head, next, post, w);
  }
  const order = new Int32Array(n);
  let m = 0;
  for (let x = 0; x < k; x++) if (post[x] !== n) order[m++] = post[x];
  if (m !== n) throw new Error(`amd: internal error, ordered ${m} of ${n} vertices`);
  return order;
}

function clearW(mark: number, lemax: number, w: Int32Array, n: number): number {
  if (mark < 2 || mark + lemax > 0x3fffffff) {
    for (let k = 0; k < n; k++) if (w[k] !== 0) w[k] = 1;
    return 2;
  }
  return mark;
}

/** Depth-first postorder of the tree rooted at j (children listed by head/next). */
function treeDfs(
  j: number,
  k: number,
  head: Int32Array,
  next: Int32Array,
  post: Int32Array,
  stack: Int32Array,
): number {
  let top = 0;
  stack[0] = j;
  while (top >= 0) {
    const p = stack[top];
    const i = head[p];
    if (i === -1) {
      top--;
      post[k++] = p;
    } else {
      head[p] = next[i];
      stack[++top] = i;
    }
  }
  return k;
}
