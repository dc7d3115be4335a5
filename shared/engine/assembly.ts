/**
 * Global stiffness in lower-triangle compressed sparse columns. The pattern is built once
 * from the node connectivity (node blocks), then element matrices are added by direct
 * position arithmetic: no searching while filling.
 *
 * Equations are numbered node by node, freedom by freedom, skipping eliminated freedoms, so
 * a column of node n holds its own later freedoms first (diagonal first), then the free
 * freedoms of each higher-numbered neighbour in ascending order.
 */
import type { SymmetricCsc } from '../solver/types.js';

export interface Pattern {
  K: SymmetricCsc;
  /** first equation of each node */
  firstEq: Int32Array;
  /** number of free freedoms per node */
  nFree: Int32Array;
  /** per element: offset of the higher node's block inside the lower node's columns */
  elOffset: Int32Array;
}

/** Equation number per node freedom (−1 = eliminated). */
export function numberEquations(status: Uint8Array): { eq: Int32Array; nEq: number; eqDof: Int32Array } {
  const eq = new Int32Array(status.length);
  let n = 0;
  for (let g = 0; g < status.length; g++) eq[g] = status[g] === 0 ? n++ : -1;
  const eqDof = new Int32Array(n);
  for (let g = 0; g < status.length; g++) if (eq[g] >= 0) eqDof[eq[g]] = g;
  return { eq, nEq: n, eqDof };
}

export function buildPattern(nNodes: number, elStart: Int32Array, elEnd: Int32Array, eq: Int32Array, nEq: number): Pattern {
  const nEl = elStart.length;
  const firstEq = new Int32Array(nNodes);
  const nFree = new Int32Array(nNodes);
  let next = 0;
  for (let n = 0; n < nNodes; n++) {
    firstEq[n] = next;
    let c = 0;
    for (let k = 0; k < 6; k++) if (eq[n * 6 + k] >= 0) c++;
    nFree[n] = c;
    next += c;
  }
  // higher-numbered neighbours of each node (CSR), sorted and unique
  const cnt = new Int32Array(nNodes + 1);
  for (let e = 0; e < nEl; e++) cnt[Math.min(elStart[e], elEnd[e]) + 1]++;
  for (let n = 0; n < nNodes; n++) cnt[n + 1] += cnt[n];
  const nbRaw = new Int32Array(nEl);
  const fillPos = cnt.slice(0, nNodes);
  for (let e = 0; e < nEl; e++) {
    const lo = Math.min(elStart[e], elEnd[e]), hi = Math.max(elStart[e], elEnd[e]);
    nbRaw[fillPos[lo]++] = hi;
  }
  const nbPtr = new Int32Array(nNodes + 1);
  const nbIdx = new Int32Array(nEl);
  const nbOff = new Int32Array(nEl); // offset (in rows) of each neighbour block in a column
  let w = 0;
  for (let n = 0; n < nNodes; n++) {
    nbPtr[n] = w;
    const seg = nbRaw.subarray(cnt[n], cnt[n + 1]).sort();
    let off = 0;
    for (let i = 0; i < seg.length; i++) {
      if (i > 0 && seg[i] === seg[i - 1]) continue;
      nbIdx[w] = seg[i];
      nbOff[w] = off;
      off += nFree[seg[i]];
      w++;
    }
  }
  nbPtr[nNodes] = w;
  // column pointers and row indices
  const colPtr = new Int32Array(nEq + 1);
  let nnz = 0;
  for (let n = 0; n < nNodes; n++) {
    let nbRows = 0;
    for (let p = nbPtr[n]; p < nbPtr[n + 1]; p++) nbRows += nFree[nbIdx[p]];
    for (let r = 0; r < nFree[n]; r++) {
      const col = firstEq[n] + r;
      colPtr[col] = nnz;
      nnz += nFree[n] - r + nbRows;
    }
  }
  colPtr[nEq] = nnz;
  const rowIdx = new Int32Array(nnz);
  for (let n = 0; n < nNodes; n++) {
    for (let r = 0; r < nFree[n]; r++) {
      let q = colPtr[firstEq[n] + r];
      for (let s = r; s < nFree[n]; s++) rowIdx[q++] = firstEq[n] + s;
      for (let p = nbPtr[n]; p < nbPtr[n + 1]; p++) {
        const m = nbIdx[p];
        for (let s = 0; s < nFree[m]; s++) rowIdx[q++] = firstEq[m] + s;
      }
    }
  }
  // element → neighbour block offset
  const elOffset = new Int32Array(nEl);
  for (let e = 0; e < nEl; e++) {
    const lo = Math.min(elStart[e], elEnd[e]), hi = Math.max(elStart[e], elEnd[e]);
    let a = nbPtr[lo], b = nbPtr[lo + 1] - 1;
    while (a < b) {
      const mid = (a + b) >> 1;
      if (nbIdx[mid] < hi) a = mid + 1;
      else b = mid;
    }
    elOffset[e] = nbOff[a];
  }
  return { K: { n: nEq, colPtr, rowIdx, values: new Float64Array(nnz) }, firstEq, nFree, elOffset };
}

/** Add one element's global 12×12 matrix (row-major, at kgOff in kg). */
export function addElement(
  pat: Pattern, eq: Int32Array, e: number, ni: number, nj: number, kg: Float64Array, kgOff: number,
): void {
  const { colPtr, values } = pat.K;
  const { firstEq, nFree } = pat;
  const lo = ni < nj ? ni : nj, hi = ni < nj ? nj : ni;
  const loBase = lo === ni ? 0 : 6, hiBase = lo === ni ? 6 : 0;
  const off = pat.elOffset[e];
  const nfLo = nFree[lo];
  // self blocks
  addSelfBlock(values, colPtr, eq, firstEq[lo], lo, loBase, kg, kgOff);
  addSelfBlock(values, colPtr, eq, firstEq[hi], hi, hiBase, kg, kgOff);
  // coupling block: columns of lo, rows of hi
  const fLo = firstEq[lo], fHi = firstEq[hi];
  for (let kc = 0; kc < 6; kc++) {
    const ec = eq[lo * 6 + kc];
    if (ec < 0) continue;
    const start = colPtr[ec] + (nfLo - (ec - fLo)) + off;
    for (let kr = 0; kr < 6; kr++) {
      const er = eq[hi * 6 + kr];
      if (er < 0) continue;
      values[start + (er - fHi)] += kg[kgOff + (hiBase + kr) * 12 + loBase + kc];
    }
  }
}

/** The lower triangle of one node's own 6×6 block of an element matrix (rows/columns base..base+5). */
function addSelfBlock(
  values: Float64Array, colPtr: Int32Array, eq: Int32Array, f0: number, node: number, base: number, kg: Float64Array, kgOff: number,
): void {
  for (let kc = 0; kc < 6; kc++) {
    const ec = eq[node * 6 + kc];
    if (ec < 0) continue;
    const rc = ec - f0;
    const cp = colPtr[ec];
    for (let kr = kc; kr < 6; kr++) {
      const er = eq[node * 6 + kr];
      if (er < 0) continue;
      values[cp + (er - f0) - rc] += kg[kgOff + (base + kr) * 12 + base + kc];
    }
  }
}

/** Add springs on the diagonal (the first entry of each column). */
export function addSprings(pat: Pattern, eq: Int32Array, springs: Float64Array): void {
  for (let g = 0; g < springs.length; g++) {
    if (springs[g] !== 0 && eq[g] >= 0) pat.K.values[pat.K.colPtr[eq[g]]] += springs[g];
  }
}
