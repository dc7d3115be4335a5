/**
 * Supernodal left-looking Cholesky factorisation PKPᵀ = LLᵀ. Each supernode is a dense
 * row-major block (its rows × its columns); updates from descendant supernodes are computed
 * as dense products and scattered through a row map. Pivots are checked against the
 * original diagonal so that mechanisms are reported instead of producing garbage.
 *
 * The dense kernels are dot products over rows held contiguously, tiled so the reused rows
 * stay in cache. They run as WebAssembly SIMD (simd-kernels.ts: four rows by two columns,
 * two products per instruction) with the factor in the kernels' memory; where that is not
 * available, the TypeScript kernels below (two rows by two columns) do the same work.
 */
import { MAX_BYTES, simdKernels, type SimdKernels } from './simd-kernels.js';
import type { SymbolicFactor } from './symbolic.js';
import { SingularMatrixError } from './types.js';

/** column block width of the dense factorisation inside a supernode */
const NB = 48;

/** the factor, the scatter maps (also as byte addresses) and the SIMD kernels if available */
interface Kernel {
  Lx: Float64Array;
  simd: SimdKernels | null;
  tRow: Int32Array;
  tCol: Int32Array;
  tRowB: number;
  tColB: number;
}

/** load cases whose substitution work array the factor's memory holds from the start (more grow it) */
const SOLVE_RESERVE = 32;

/** reciprocals of the diagonal of the current column block */
const inv = new Float64Array(NB);

/**
 * The factor: Lx holds the supernode blocks. With SIMD kernels it lives in their memory,
 * followed by a copy of the supernode row lists at byte rowsB; bytes from freeB are free for
 * the substitution's work array.
 */
export interface NumericFactor {
  Lx: Float64Array;
  simd: SimdKernels | null;
  rowsB: number;
  freeB: number;
  /** the analysis this factor belongs to and its scratch arrays, kept for refactorisation */
  sym?: SymbolicFactor;
  work?: Workspace;
}

/** scratch of the numeric factorisation, allocated once per factor and reused */
interface Workspace {
  maxRows: number;
  origDiag: Float64Array;
  map: Int32Array;
  head: Int32Array;
  nextD: Int32Array;
  posD: Int32Array;
  /** plain scatter maps when there are no SIMD kernels */
  tRow: Int32Array;
  tCol: Int32Array;
  ident: Int32Array;
}

/** The factor's memory (in the SIMD kernels' memory when they exist) and its scratch. */
function allocate(sym: SymbolicFactor): NumericFactor {
  const { n, nsuper, superFirst, superRowPtr, superRows, superValPtr } = sym;
  let maxRows = 0;
  for (let s = 0; s < nsuper; s++) maxRows = Math.max(maxRows, superRowPtr[s + 1] - superRowPtr[s]);
  // the factor and the scatter maps share one WebAssembly memory when SIMD kernels exist
  const nL = superValPtr[nsuper];
  const nRows = superRowPtr[nsuper];
  const rowsB = nL * 8 + 3 * 4 * maxRows;
  const freeB = Math.ceil((rowsB + 4 * nRows) / 16) * 16;
  // room for the substitution's work array of up to SOLVE_RESERVE load cases from the start:
  // growing the memory on the first solve detaches its buffer, which costs fresh pages then
  // and, the first time in a process, the optimised code of every typed-array loop
  let below = 0;
  for (let s = 0; s < nsuper; s++) below = Math.max(below, superRowPtr[s + 1] - superRowPtr[s] - (superFirst[s + 1] - superFirst[s]));
  const reserved = freeB + (n + below) * SOLVE_RESERVE * 8;
  const simd = simdKernels(reserved <= MAX_BYTES ? reserved : freeB);
  const buf = simd ? simd.memory.buffer : null;
  const Lx = buf ? new Float64Array(buf, 0, nL) : new Float64Array(nL);
  if (buf) new Int32Array(buf, rowsB, nRows).set(superRows.subarray(0, nRows));
  const plain = (): Int32Array => new Int32Array(buf ? 0 : maxRows);
  const work: Workspace = {
    maxRows,
    origDiag: new Float64Array(n),
    map: new Int32Array(n),
    head: new Int32Array(nsuper),
    nextD: new Int32Array(nsuper),
    posD: new Int32Array(nsuper),
    tRow: plain(),
    tCol: plain(),
    ident: plain(),
  };
  return { Lx, simd, rowsB, freeB, sym, work };
}

/**
 * Numeric factorisation of the matrix with these values (aligned with the analysed
 * pattern's rowIdx). With `into` (a factor of the same analysis) the values are factorised
 * into its memory and scratch, which replaces its previous factor; otherwise a new factor
 * is allocated.
 */
export function factorNumeric(values: Float64Array, sym: SymbolicFactor, pivotTolerance: number, into?: NumericFactor): NumericFactor {
  const { n, perm, cPtr, cRow, cVal, nsuper, superFirst, superRowPtr, superRows, superValPtr, colToSuper } = sym;
  const factor = into && into.sym === sym && into.work ? into : allocate(sym);
  const work = factor.work!;
  const { maxRows, origDiag, map, head, nextD, posD } = work;
  const simd = factor.simd;
  const nL = superValPtr[nsuper];
  // views are taken afresh: a solve may have grown (and so detached) the kernels' memory
  const buf = simd ? simd.memory.buffer : null;
  const Lx = buf ? new Float64Array(buf, 0, nL) : factor.Lx;
  factor.Lx = Lx;
  if (factor === into) Lx.fill(0);
  const tRowB = nL * 8;
  const tColB = tRowB + 4 * maxRows;
  const identB = tColB + 4 * maxRows;
  const tRow = buf ? new Int32Array(buf, tRowB, maxRows) : work.tRow;
  const tCol = buf ? new Int32Array(buf, tColB, maxRows) : work.tCol;
  const ident = buf ? new Int32Array(buf, identB, maxRows) : work.ident;
  const k: Kernel = { Lx, simd, tRow, tCol, tRowB, tColB };
  const kd: Kernel = { Lx, simd, tRow, tCol: ident, tRowB, tColB: identB };
  origDiag.fill(0);
  for (let j = 0; j < n; j++) {
    for (let p = cPtr[j]; p < cPtr[j + 1]; p++) if (cRow[p] === j) origDiag[j] += values[cVal[p]];
  }
  head.fill(-1);
  for (let i = 0; i < maxRows; i++) ident[i] = i;

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
      for (let r = p1; r < nrd; r++) {
        const row = superRows[r0d + r];
        tRow[r] = os + map[row] * nc - f;
        tCol[r] = row;
      }
      lowerProduct(k, superValPtr[d], superFirst[d + 1] - superFirst[d], p1, nrd, p1, p2, 0, superFirst[d + 1] - superFirst[d]);
      posD[d] = p2;
      if (p2 < nrd) {
        const t = colToSuper[superRows[r0d + p2]];
        nextD[d] = head[t];
        head[t] = d;
      }
      d = dNext;
    }

    for (let r = 0; r < nr; r++) tRow[r] = os + r * nc;
    factorBlock(kd, os, nc, nr, f, origDiag, perm, pivotTolerance);

    if (nr > nc) {
      const t = colToSuper[superRows[r0 + nc]];
      posD[s] = nc;
      nextD[s] = head[t];
      head[t] = s;
    }
  }
  return factor;
}

/**
 * Dense Cholesky of a supernode's nr × nc row-major block (diagonal block on top, rows below
 * solved against it), left-looking over column blocks of width NB.
 */
function factorBlock(
  k: Kernel,
  os: number,
  nc: number,
  nr: number,
  f: number,
  origDiag: Float64Array,
  perm: Int32Array,
  tol: number,
): void {
  const Lx = k.Lx;
  for (let j0 = 0; j0 < nc; j0 += NB) {
    const j1 = Math.min(nc, j0 + NB);
    if (j0 > 0) lowerProduct(k, os, nc, j0, nr, j0, j1, 0, j0);
    // diagonal block columns j0..j1-1
    for (let i = j0; i < j1; i++) {
      const rowI = os + i * nc;
      for (let j = j0; j < i; j++) {
        const rowJ = os + j * nc;
        let s = Lx[rowI + j];
        for (let k = j0; k < j; k++) s -= Lx[rowI + k] * Lx[rowJ + k];
        Lx[rowI + j] = s / Lx[rowJ + j];
      }
      let s = Lx[rowI + i];
      for (let k = j0; k < i; k++) s -= Lx[rowI + k] * Lx[rowI + k];
      const dj = origDiag[f + i];
      const thr = tol * Math.abs(dj);
      if (!(s > thr)) {
        throw new SingularMatrixError(perm[f + i], s < -thr ? 'negative' : 'zero', s, dj);
      }
      Lx[rowI + i] = Math.sqrt(s);
    }
    // rows below the diagonal block, columns j0..j1-1
    for (let j = j0; j < j1; j++) inv[j - j0] = 1 / Lx[os + j * nc + j];
    if (k.simd) k.simd.trsm(os, nc, nr, j0, j1);
    else trsmRows(Lx, os, nc, nr, j0, j1, inv);
  }
}

/**
 * Solves rows j1..nr-1 of columns j0..j1-1 against the factored diagonal block
 * (L[r, j] = (L[r, j] − Σ_{j0≤k<j} L[r, k]·L[j, k]) / L[j, j]), two rows by two columns at a time.
 */
function trsmRows(Lx: Float64Array, os: number, nc: number, nr: number, j0: number, j1: number, inv: Float64Array): void {
  let r = j1;
  for (; r + 1 < nr; r += 2) {
    const a0 = os + r * nc;
    const a1 = a0 + nc;
    let j = j0;
    for (; j + 1 < j1; j += 2) {
      const b0 = os + j * nc;
      const b1 = b0 + nc;
      let s00 = Lx[a0 + j];
      let s01 = Lx[a0 + j + 1];
      let s10 = Lx[a1 + j];
      let s11 = Lx[a1 + j + 1];
      for (let k = j0; k < j; k++) {
        const x0 = Lx[a0 + k];
        const x1 = Lx[a1 + k];
        const y0 = Lx[b0 + k];
        const y1 = Lx[b1 + k];
        s00 -= x0 * y0;
        s01 -= x0 * y1;
        s10 -= x1 * y0;
        s11 -= x1 * y1;
      }
      const l00 = s00 * inv[j - j0];
      const l10 = s10 * inv[j - j0];
      const c = Lx[b1 + j];
      Lx[a0 + j] = l00;
      Lx[a1 + j] = l10;
      Lx[a0 + j + 1] = (s01 - l00 * c) * inv[j + 1 - j0];
      Lx[a1 + j + 1] = (s11 - l10 * c) * inv[j + 1 - j0];
    }
    if (j < j1) {
      const b0 = os + j * nc;
      let s00 = Lx[a0 + j];
      let s10 = Lx[a1 + j];
      for (let k = j0; k < j; k++) {
        const y0 = Lx[b0 + k];
        s00 -= Lx[a0 + k] * y0;
        s10 -= Lx[a1 + k] * y0;
      }
      Lx[a0 + j] = s00 * inv[j - j0];
      Lx[a1 + j] = s10 * inv[j - j0];
    }
  }
  if (r < nr) {
    const a0 = os + r * nc;
    for (let j = j0; j < j1; j++) {
      const b0 = os + j * nc;
      let s = Lx[a0 + j];
      for (let k = j0; k < j; k++) s -= Lx[a0 + k] * Lx[b0 + k];
      Lx[a0 + j] = s * inv[j - j0];
    }
  }
}

/** cache blocking of the update products: columns per block and dot-product chunk */
const CB = 64;
const KC = 384;

/**
 * Lower-triangular product with scatter, blocked for the cache:
 * for rows rLo ≤ r < rHi and columns cLo ≤ c < cHi with c ≤ r,
 * Lx[tRow[r] + tCol[c]] −= Σ_{kLo≤k<kHi} L[ob + r·w + k] · L[ob + c·w + k].
 */
function lowerProduct(k: Kernel, ob: number, w: number, rLo: number, rHi: number, cLo: number, cHi: number, kLo: number, kHi: number): void {
  const simd = k.simd;
  for (let k0 = kLo; k0 < kHi; k0 += KC) {
    const k1 = Math.min(kHi, k0 + KC);
    for (let c0 = cLo; c0 < cHi; c0 += CB) {
      const c1 = Math.min(cHi, c0 + CB);
      if (simd) simd.update(ob, w, Math.max(rLo, c0), rHi, c0, c1, k0, k1, k.tRowB, k.tColB);
      else productKernel(k.Lx, ob, w, Math.max(rLo, c0), rHi, c0, c1, k0, k1, k.tRow, k.tCol);
    }
  }
}

/** The unblocked kernel of lowerProduct, two rows by two columns at a time. */
function productKernel(
  Lx: Float64Array,
  ob: number,
  w: number,
  rLo: number,
  rHi: number,
  cLo: number,
  cHi: number,
  kLo: number,
  kHi: number,
  tRow: Int32Array,
  tCol: Int32Array,
): void {
  let r = rLo;
  for (; r + 1 < rHi; r += 2) {
    const a0 = ob + r * w;
    const a1 = a0 + w;
    const t0 = tRow[r];
    const t1 = tRow[r + 1];
    const cEnd0 = r < cHi ? r + 1 : cHi;
    const cEnd1 = r + 1 < cHi ? r + 2 : cHi;
    let c = cLo;
    for (; c + 1 < cEnd0; c += 2) {
      const b0 = ob + c * w;
      const b1 = b0 + w;
      let s00 = 0;
      let s01 = 0;
      let s10 = 0;
      let s11 = 0;
      for (let k = kLo; k < kHi; k++) {
        const x0 = Lx[a0 + k];
        const x1 = Lx[a1 + k];
        const y0 = Lx[b0 + k];
        const y1 = Lx[b1 + k];
        s00 += x0 * y0;
        s01 += x0 * y1;
        s10 += x1 * y0;
        s11 += x1 * y1;
      }
      const c0 = tCol[c];
      const c1 = tCol[c + 1];
      Lx[t0 + c0] -= s00;
      Lx[t0 + c1] -= s01;
      Lx[t1 + c0] -= s10;
      Lx[t1 + c1] -= s11;
    }
    if (c < cEnd0) {
      const b0 = ob + c * w;
      let s00 = 0;
      let s10 = 0;
      for (let k = kLo; k < kHi; k++) {
        const y0 = Lx[b0 + k];
        s00 += Lx[a0 + k] * y0;
        s10 += Lx[a1 + k] * y0;
      }
      const c0 = tCol[c];
      Lx[t0 + c0] -= s00;
      Lx[t1 + c0] -= s10;
      c++;
    }
    for (; c < cEnd1; c++) {
      const b0 = ob + c * w;
      let s10 = 0;
      for (let k = kLo; k < kHi; k++) s10 += Lx[a1 + k] * Lx[b0 + k];
      Lx[t1 + tCol[c]] -= s10;
    }
  }
  if (r < rHi) {
    const a0 = ob + r * w;
    const t0 = tRow[r];
    const cEnd0 = r < cHi ? r + 1 : cHi;
    for (let c = cLo; c < cEnd0; c++) {
      const b0 = ob + c * w;
      let s00 = 0;
      for (let k = kLo; k < kHi; k++) s00 += Lx[a0 + k] * Lx[b0 + k];
      Lx[t0 + tCol[c]] -= s00;
    }
  }
}
