/**
 * Symbolic analysis of PKPᵀ for a Cholesky factor: the permuted matrix, elimination tree
 * (Liu's algorithm with path compression), postorder, column counts (row subtrees), and
 * supernodes (fundamental ones merged by relaxed amalgamation) with their row structures.
 */
import type { PostorderedOrdering } from './supervariable-tree.js';
import type { SymmetricCsc } from './types.js';
import { postorder } from './postorder.js';

export interface SymbolicFactor {
  n: number;
  /** perm[k] = original freedom eliminated k-th */
  perm: Int32Array;
  /** lower triangle of PKPᵀ by column; cVal[p] is the index into K.values (summed on load) */
  cPtr: Int32Array;
  cRow: Int32Array;
  cVal: Int32Array;
  nsuper: number;
  /** supernode s holds columns superFirst[s] .. superFirst[s+1]-1 */
  superFirst: Int32Array;
  /** rows of supernode s: superRows[superRowPtr[s] .. superRowPtr[s+1]), ascending */
  superRowPtr: Int32Array;
  superRows: Int32Array;
  /** dense row-major block of supernode s starts at superValPtr[s] (rows × columns) */
  superValPtr: Int32Array;
  colToSuper: Int32Array;
  /** nonzeros of L counted exactly (diagonal included) */
  nnzL: number;
  /** entries stored in the supernodal blocks (includes zeros from amalgamation) */
  storedEntries: number;
  /** floating-point operations of the numeric factorisation (multiply-adds counted as 2) */
  flops: number;
}

interface Permuted {
  cPtr: Int32Array;
  cRow: Int32Array;
  cVal: Int32Array;
  /** strictly upper part by column = strictly lower part by row */
  uPtr: Int32Array;
  uRow: Int32Array;
}

function permute(K: SymmetricCsc, pinv: Int32Array, withLower: boolean): Permuted {
  const { n, colPtr, rowIdx } = K;
  const lcnt = new Int32Array(n + 1);
  const ucnt = new Int32Array(n + 1);
  for (let j = 0; j < n; j++) {
    const pj = pinv[j];
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const pi = pinv[rowIdx[p]];
      const lo = pi < pj ? pi : pj;
      const hi = pi < pj ? pj : pi;
      lcnt[lo + 1]++;
      if (hi !== lo) ucnt[hi + 1]++;
    }
  }
  for (let k = 0; k < n; k++) {
    lcnt[k + 1] += lcnt[k];
    ucnt[k + 1] += ucnt[k];
  }
  const uPtr = ucnt.slice();
  const uRow = new Int32Array(ucnt[n]);
  const cPtr = lcnt.slice();
  const cRow = new Int32Array(withLower ? lcnt[n] : 0);
  const cVal = new Int32Array(withLower ? lcnt[n] : 0);
  for (let j = 0; j < n; j++) {
    const pj = pinv[j];
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const pi = pinv[rowIdx[p]];
      const lo = pi < pj ? pi : pj;
      const hi = pi < pj ? pj : pi;
      if (withLower) {
        const q = lcnt[lo]++;
        cRow[q] = hi;
        cVal[q] = p;
      }
      if (hi !== lo) uRow[ucnt[hi]++] = lo;
    }
  }
  return { cPtr, cRow, cVal, uPtr, uRow };
}

function etree(n: number, uPtr: Int32Array, uRow: Int32Array): Int32Array {
  const parent = new Int32Array(n).fill(-1);
  const ancestor = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) {
    for (let p = uPtr[k]; p < uPtr[k + 1]; p++) {
      let i = uRow[p];
      while (i !== -1 && i < k) {
        const inext = ancestor[i];
        ancestor[i] = k;
        if (inext === -1) parent[i] = k;
        i = inext;
      }
    }
  }
  return parent;
}


/**
 * Operation count of the Cholesky factor for an ordering (Σ column count², from the
 * elimination tree and row subtrees), without building anything else.
 */
export function factorFlops(K: SymmetricCsc, order: Int32Array): number {
  const n = K.n;
  const pinv = new Int32Array(n);
  for (let k = 0; k < n; k++) pinv[order[k]] = k;
  const { uPtr, uRow } = permute(K, pinv, false);
  const parent = etree(n, uPtr, uRow);
  const count = new Int32Array(n);
  const mark = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    mark[i] = i;
    count[i]++;
    for (let p = uPtr[i]; p < uPtr[i + 1]; p++) {
      let j = uRow[p];
      while (mark[j] !== i) {
        mark[j] = i;
        count[j]++;
        j = parent[j];
      }
    }
  }
  let flops = 0;
  for (let j = 0; j < n; j++) flops += count[j] * count[j];
  return flops;
}

/** column counts of L by row subtrees */
function columnCounts(n: number, uPtr: Int32Array, uRow: Int32Array, parent: Int32Array): Int32Array {
  const count = new Int32Array(n);
  const mark = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    mark[i] = i;
    count[i]++;
    for (let p = uPtr[i]; p < uPtr[i + 1]; p++) {
      let j = uRow[p];
      while (mark[j] !== i) {
        mark[j] = i;
        count[j]++;
        j = parent[j];
      }
    }
  }
  return count;
}

export interface AmalgamationOptions {
  /** merge freely while a supernode has at most this many columns */
  smallColumns: number;
  /** [columns, allowed fraction of explicit zeros] pairs, checked in order */
  relax: Array<[number, number]>;
}

const defaultAmalgamation: AmalgamationOptions = {
  smallColumns: 8,
  relax: [
    [24, 0.6],
    [64, 0.15],
    [Infinity, 0.05],
  ],
};

export function analyse(
  K: SymmetricCsc,
  order: Int32Array,
  amalgamation: AmalgamationOptions = defaultAmalgamation,
  tree?: PostorderedOrdering,
): SymbolicFactor {
  const n = K.n;
  let perm: Int32Array;
  let parent: Int32Array;
  let count: Int32Array;
  let permuted: Permuted;
  if (tree) {
    // ordering already postordered, with its tree and counts (supervariable-tree.ts)
    perm = tree.perm;
    const pinv = new Int32Array(n);
    for (let k = 0; k < n; k++) pinv[perm[k]] = k;
    permuted = permute(K, pinv, true);
    parent = tree.parent;
    count = tree.count;
  } else {
    // etree of the ordered matrix, then postorder it (same fill, contiguous subtrees)
    let pinv = new Int32Array(n);
    for (let k = 0; k < n; k++) pinv[order[k]] = k;
    const first = permute(K, pinv, false);
    const parent0 = etree(n, first.uPtr, first.uRow);
    const post = postorder(parent0);
    perm = new Int32Array(n);
    for (let k = 0; k < n; k++) perm[k] = order[post[k]];
    pinv = new Int32Array(n);
    for (let k = 0; k < n; k++) pinv[perm[k]] = k;
    permuted = permute(K, pinv, true);
    parent = etree(n, permuted.uPtr, permuted.uRow);
    count = columnCounts(n, permuted.uPtr, permuted.uRow, parent);
  }
  const { cPtr, cRow, cVal, uPtr, uRow } = permuted;

  let nnzL = 0;
  let flops = 0;
  for (let j = 0; j < n; j++) {
    nnzL += count[j];
    flops += count[j] * count[j];
  }

  // fundamental supernodes
  const nchild = new Int32Array(n);
  for (let j = 0; j < n; j++) if (parent[j] !== -1) nchild[parent[j]]++;
  const fundFirst: number[] = [];
  for (let j = 0; j < n; j++) {
    const extend = j > 0 && parent[j - 1] === j && count[j - 1] === count[j] + 1 && nchild[j] === 1;
    if (!extend) fundFirst.push(j);
  }
  const nf = fundFirst.length;
  fundFirst.push(n);
  const colToFund = new Int32Array(n);
  for (let f = 0; f < nf; f++) for (let j = fundFirst[f]; j < fundFirst[f + 1]; j++) colToFund[j] = f;
  const fundParent = new Int32Array(nf);
  for (let f = 0; f < nf; f++) {
    const p = parent[fundFirst[f + 1] - 1];
    fundParent[f] = p === -1 ? -1 : colToFund[p];
  }

  // relaxed amalgamation of a supernode with the group that follows it (its parent's group)
  const gCols = new Float64Array(nf);
  const gRows = new Float64Array(nf);
  const gZeros = new Float64Array(nf);
  const gEnd = new Int32Array(nf); // last fundamental supernode of the group headed here
  const isHead = new Uint8Array(nf).fill(1);
  for (let f = 0; f < nf; f++) {
    gCols[f] = fundFirst[f + 1] - fundFirst[f];
    gRows[f] = count[fundFirst[f]];
    gEnd[f] = f;
  }
  const stored = (c: number, r: number): number => c * r - (c * (c - 1)) / 2;
  for (let f = nf - 2; f >= 0; f--) {
    const h = f + 1;
    const pf = fundParent[f];
    if (pf < h || pf > gEnd[h]) continue;
    const cols = gCols[f] + gCols[h];
    const rows = gCols[f] + gRows[h];
    const actual = stored(gCols[f], gRows[f]) - gZeros[f] + stored(gCols[h], gRows[h]) - gZeros[h];
    const total = stored(cols, rows);
    const zeros = total - actual;
    let merge = cols <= amalgamation.smallColumns;
    if (!merge) {
      for (const [c, z] of amalgamation.relax) {
        if (cols <= c) {
          merge = zeros / total < z;
          break;
        }
      }
    }
    if (!merge) continue;
    gCols[f] = cols;
    gRows[f] = rows;
    gZeros[f] = zeros;
    gEnd[f] = gEnd[h];
    isHead[h] = 0;
  }
  let nsuper = 0;
  for (let f = 0; f < nf; f++) if (isHead[f]) nsuper++;
  const superFirst = new Int32Array(nsuper + 1);
  {
    let s = 0;
    for (let f = 0; f < nf; f++) if (isHead[f]) superFirst[s++] = fundFirst[f];
    superFirst[nsuper] = n;
  }
  const colToSuper = new Int32Array(n);
  for (let s = 0; s < nsuper; s++) {
    for (let j = superFirst[s]; j < superFirst[s + 1]; j++) colToSuper[j] = s;
  }
  const superParent = new Int32Array(nsuper);
  for (let s = 0; s < nsuper; s++) {
    const p = parent[superFirst[s + 1] - 1];
    superParent[s] = p === -1 ? -1 : colToSuper[p];
  }

  // row structures: union of the column structures of each supernode
  const smark = new Int32Array(nsuper).fill(-1);
  const rcount = new Int32Array(nsuper + 1);
  let superRows = new Int32Array(0);
  for (let pass = 0; pass < 2; pass++) {
    smark.fill(-1);
    const fill = pass === 0 ? rcount : rcount.slice();
    for (let i = 0; i < n; i++) {
      const si = colToSuper[i];
      smark[si] = i;
      if (pass === 0) fill[si]++;
      else superRows[fill[si]++] = i;
      for (let p = uPtr[i]; p < uPtr[i + 1]; p++) {
        let s = colToSuper[uRow[p]];
        while (smark[s] !== i) {
          smark[s] = i;
          if (pass === 0) fill[s]++;
          else superRows[fill[s]++] = i;
          s = superParent[s];
        }
      }
    }
    if (pass === 0) {
      // counts → offsets
      let acc = 0;
      for (let s = 0; s < nsuper; s++) {
        const c = rcount[s];
        rcount[s] = acc;
        acc += c;
      }
      rcount[nsuper] = acc;
      superRows = new Int32Array(acc);
    }
  }
  const superRowPtr = rcount;
  const superValPtr = new Int32Array(nsuper + 1);
  let storedEntries = 0;
  let offset = 0;
  for (let s = 0; s < nsuper; s++) {
    const nc = superFirst[s + 1] - superFirst[s];
    const nr = superRowPtr[s + 1] - superRowPtr[s];
    offset += nc * nr;
    if (offset > 0x7fffffff) throw new Error(`solver: the factor needs ${offset} or more entries, too many to hold`);
    superValPtr[s + 1] = offset;
    storedEntries += stored(nc, nr);
  }
  return {
    n,
    perm,
    cPtr,
    cRow,
    cVal,
    nsuper,
    superFirst,
    superRowPtr,
    superRows,
    superValPtr,
    colToSuper,
    nnzL,
    storedEntries,
    flops,
  };
}
