/**
 * Supernodal left-looking Cholesky factorisation PKPᵀ = LLᵀ. Each supernode is a dense
 * row-major block (its rows × its columns); updates from descendant supernodes are computed
 * as dense products and scattered through a row map. Pivots are checked against the
 * original diagonal so that mechanisms are reported instead of producing garbage.
 */
import type { SymbolicFactor } from './symbolic.js';
import { SingularMatrixError } from './types.js';

export function factorNumeric(values: Float64Array, sym: SymbolicFactor, pivotTolerance: number): Float64Array {
  const { n, perm, cPtr, cRow, cVal, nsuper, superFirst, superRowPtr, superRows, superValPtr, colToSuper } = sym;
  const Lx = new Float64Array(superValPtr[nsuper]);
  const origDiag = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = cPtr[j]; p < cPtr[j + 1]; p++) if (cRow[p] === j) origDiag[j] += values[cVal[p]];
  }
  const map = new Int32Array(n);
  const head = new Int32Array(nsuper).fill(-1);
  const nextD = new Int32Array(nsuper);
  const posD = new Int32Array(nsuper);

  for (let s = 0; s < nsuper; s++) {
    const f = superFirst[s];
    const l = superFirst[s + 1];
    const nc = l - f;
    const r0 = superRowPtr[s];
    const nr = superRowPtr[s + 1] - r0;
    const os = superValPtr[s];
    for (let t = 0; t < nr; t++) map[superRows[r0 + t]] = t;

    // load the columns of K
    for (let j = f; j < l; j++) {
      const c = os + j - f;
      for (let p = cPtr[j]; p < cPtr[j + 1]; p++) Lx[c + map[cRow[p]] * nc] += values[cVal[p]];
    }

    // updates from every descendant whose structure meets these columns
    let d = head[s];
    while (d !== -1) {
      const dNext = nextD[d];
      const r0d = superRowPtr[d];
      const nrd = superRowPtr[d + 1] - r0d;
      const p1 = posD[d];
      let p2 = p1;
      while (p2 < nrd && superRows[r0d + p2] < l) p2++;
      updateFrom(Lx, superValPtr[d], superFirst[d + 1] - superFirst[d], superRows, r0d, nrd, p1, p2, os, nc, f, map);
      posD[d] = p2;
      if (p2 < nrd) {
        const t = colToSuper[superRows[r0d + p2]];
        nextD[d] = head[t];
        head[t] = d;
      }
      d = dNext;
    }

    factorBlock(Lx, os, nc, nr, f, origDiag, perm, pivotTolerance);

    if (nr > nc) {
      const t = colToSuper[superRows[r0 + nc]];
      posD[s] = nc;
      nextD[s] = head[t];
      head[t] = s;
    }
  }
  return Lx;
}

/**
 * Subtracts L_d[p1:nrd, :] · L_d[p1:p2, :]ᵀ (lower part) from the target block.
 * Rows and columns of the product are placed through `map` and the target's first column.
 */
function updateFrom(
  Lx: Float64Array,
  od: number,
  w: number,
  rows: Int32Array,
  r0d: number,
  nrd: number,
  p1: number,
  p2: number,
  os: number,
  nc: number,
  f: number,
  map: Int32Array,
): void {
  for (let r = p1; r < nrd; r++) {
    const rowR = od + r * w;
    const tbase = os + map[rows[r0d + r]] * nc - f;
    const cEnd = r < p2 ? r + 1 : p2;
    let c = p1;
    for (; c + 1 < cEnd; c += 2) {
      const rowC = od + c * w;
      const rowC1 = rowC + w;
      let s0 = 0;
      let s1 = 0;
      for (let k = 0; k < w; k++) {
        const a = Lx[rowR + k];
        s0 += a * Lx[rowC + k];
        s1 += a * Lx[rowC1 + k];
      }
      Lx[tbase + rows[r0d + c]] -= s0;
      Lx[tbase + rows[r0d + c + 1]] -= s1;
    }
    if (c < cEnd) {
      const rowC = od + c * w;
      let s0 = 0;
      for (let k = 0; k < w; k++) s0 += Lx[rowR + k] * Lx[rowC + k];
      Lx[tbase + rows[r0d + c]] -= s0;
    }
  }
}

/** Dense Cholesky of the diagonal block and triangular solve for the rows below it. */
function factorBlock(
  Lx: Float64Array,
  os: number,
  nc: number,
  nr: number,
  f: number,
  origDiag: Float64Array,
  perm: Int32Array,
  tol: number,
): void {
  for (let i = 0; i < nc; i++) {
    const rowI = os + i * nc;
    for (let j = 0; j < i; j++) {
      const rowJ = os + j * nc;
      let s = Lx[rowI + j];
      for (let k = 0; k < j; k++) s -= Lx[rowI + k] * Lx[rowJ + k];
      Lx[rowI + j] = s / Lx[rowJ + j];
    }
    let s = Lx[rowI + i];
    for (let k = 0; k < i; k++) s -= Lx[rowI + k] * Lx[rowI + k];
    const dj = origDiag[f + i];
    const thr = tol * Math.abs(dj);
    if (!(s > thr)) {
      throw new SingularMatrixError(perm[f + i], s < -thr ? 'negative' : 'zero', s, dj);
    }
    Lx[rowI + i] = Math.sqrt(s);
  }
  for (let r = nc; r < nr; r++) {
    const rowR = os + r * nc;
    for (let j = 0; j < nc; j++) {
      const rowJ = os + j * nc;
      let s = Lx[rowR + j];
      for (let k = 0; k < j; k++) s -= Lx[rowR + k] * Lx[rowJ + k];
      Lx[rowR + j] = s / Lx[rowJ + j];
    }
  }
}
