/**
 * Supernodal left-looking Cholesky factorisation PKPᵀ = LLᵀ. Each supernode is a dense
 * row-major block (its rows × its columns); updates from descendant supernodes are computed
 * as dense products and scattered through a row map. Pivots are checked against the
 * original diagonal so that mechanisms are reported instead of producing garbage.
 *
 * The dense kernels are dot products over rows held contiguously, blocked two rows by two
 * columns so that each loaded value is used twice.
 */
import type { SymbolicFactor } from './symbolic.js';
import { SingularMatrixError } from './types.js';

/** column block width of the dense factorisation inside a supernode */
const NB = 48;

/** reciprocals of the diagonal of the current column block */
const inv = new Float64Array(NB);

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
 * Row r of the product lands in target row map[rows[r]], column c in target column rows[c] − f.
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
  let r = p1;
  for (; r + 1 < nrd; r += 2) {
    const a0 = od + r * w;
    const a1 = a0 + w;
    const t0 = os + map[rows[r0d + r]] * nc - f;
    const t1 = os + map[rows[r0d + r + 1]] * nc - f;
    const cEnd0 = r < p2 ? r + 1 : p2;
    const cEnd1 = r + 1 < p2 ? r + 2 : p2;
    let c = p1;
    for (; c + 1 < cEnd0; c += 2) {
      const b0 = od + c * w;
      const b1 = b0 + w;
      let s00 = 0;
      let s01 = 0;
      let s10 = 0;
      let s11 = 0;
      for (let k = 0; k < w; k++) {
        const x0 = Lx[a0 + k];
        const x1 = Lx[a1 + k];
        const y0 = Lx[b0 + k];
        const y1 = Lx[b1 + k];
        s00 += x0 * y0;
        s01 += x0 * y1;
        s10 += x1 * y0;
        s11 += x1 * y1;
      }
      const c0 = rows[r0d + c];
      const c1 = rows[r0d + c + 1];
      Lx[t0 + c0] -= s00;
      Lx[t0 + c1] -= s01;
      Lx[t1 + c0] -= s10;
      Lx[t1 + c1] -= s11;
    }
    if (c < cEnd0) {
      const b0 = od + c * w;
      let s00 = 0;
      let s10 = 0;
      for (let k = 0; k < w; k++) {
        const y0 = Lx[b0 + k];
        s00 += Lx[a0 + k] * y0;
        s10 += Lx[a1 + k] * y0;
      }
      const c0 = rows[r0d + c];
      Lx[t0 + c0] -= s00;
      Lx[t1 + c0] -= s10;
      c++;
    }
    for (; c < cEnd1; c++) {
      const b0 = od + c * w;
      let s10 = 0;
      for (let k = 0; k < w; k++) s10 += Lx[a1 + k] * Lx[b0 + k];
      Lx[t1 + rows[r0d + c]] -= s10;
    }
  }
  if (r < nrd) {
    const a0 = od + r * w;
    const t0 = os + map[rows[r0d + r]] * nc - f;
    const cEnd0 = r < p2 ? r + 1 : p2;
    for (let c = p1; c < cEnd0; c++) {
      const b0 = od + c * w;
      let s00 = 0;
      for (let k = 0; k < w; k++) s00 += Lx[a0 + k] * Lx[b0 + k];
      Lx[t0 + rows[r0d + c]] -= s00;
    }
  }
}

/**
 * Dense Cholesky of a supernode's nr × nc row-major block (diagonal block on top, rows below
 * solved against it), left-looking over column blocks of width NB.
 */
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
  for (let j0 = 0; j0 < nc; j0 += NB) {
    const j1 = Math.min(nc, j0 + NB);
    if (j0 > 0) blockUpdate(Lx, os, nc, nr, j0, j1);
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
    trsmRows(Lx, os, nc, nr, j0, j1, inv);
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

/** L[r, c] −= L[r, 0:j0] · L[c, 0:j0] for rows r ≥ j0 and columns j0 ≤ c < j1, c ≤ r. */
function blockUpdate(Lx: Float64Array, os: number, nc: number, nr: number, j0: number, j1: number): void {
  let r = j0;
  for (; r + 1 < nr; r += 2) {
    const a0 = os + r * nc;
    const a1 = a0 + nc;
    const cEnd0 = r < j1 ? r + 1 : j1;
    const cEnd1 = r + 1 < j1 ? r + 2 : j1;
    let c = j0;
    for (; c + 1 < cEnd0; c += 2) {
      const b0 = os + c * nc;
      const b1 = b0 + nc;
      let s00 = 0;
      let s01 = 0;
      let s10 = 0;
      let s11 = 0;
      for (let k = 0; k < j0; k++) {
        const x0 = Lx[a0 + k];
        const x1 = Lx[a1 + k];
        const y0 = Lx[b0 + k];
        const y1 = Lx[b1 + k];
        s00 += x0 * y0;
        s01 += x0 * y1;
        s10 += x1 * y0;
        s11 += x1 * y1;
      }
      Lx[a0 + c] -= s00;
      Lx[a0 + c + 1] -= s01;
      Lx[a1 + c] -= s10;
      Lx[a1 + c + 1] -= s11;
    }
    if (c < cEnd0) {
      const b0 = os + c * nc;
      let s00 = 0;
      let s10 = 0;
      for (let k = 0; k < j0; k++) {
        const y0 = Lx[b0 + k];
        s00 += Lx[a0 + k] * y0;
        s10 += Lx[a1 + k] * y0;
      }
      Lx[a0 + c] -= s00;
      Lx[a1 + c] -= s10;
      c++;
    }
    for (; c < cEnd1; c++) {
      const b0 = os + c * nc;
      let s10 = 0;
      for (let k = 0; k < j0; k++) s10 += Lx[a1 + k] * Lx[b0 + k];
      Lx[a1 + c] -= s10;
    }
  }
  if (r < nr) {
    const a0 = os + r * nc;
    const cEnd0 = r < j1 ? r + 1 : j1;
    for (let c = j0; c < cEnd0; c++) {
      const b0 = os + c * nc;
      let s00 = 0;
      for (let k = 0; k < j0; k++) s00 += Lx[a0 + k] * Lx[b0 + k];
      Lx[a0 + c] -= s00;
    }
  }
}
