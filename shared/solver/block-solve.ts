/**
 * Forward and back substitution with a supernodal Cholesky factor for a block of
 * right-hand sides at once. The work array is row-major (the nrhs values of one freedom
 * are adjacent); the products with the rows below each diagonal block are accumulated in
 * registers two factor rows (or columns) by four load cases at a time. With the SIMD kernels
 * each supernode is one kernel call per pass instead (solve-kernels.ts).
 */
import type { NumericFactor } from './numeric.js';
import type { SymbolicFactor } from './symbolic.js';

export function blockSolve(sym: SymbolicFactor, factor: NumericFactor, B: Float64Array, nrhs: number): Float64Array {
  if (factor.simd && nrhs > 0) {
    const X = simdBlockSolve(sym, factor, B, nrhs);
    if (X) return X;
  }
  const Lx = factor.Lx;
  const { n, perm, nsuper, superFirst, superRowPtr, superRows, superValPtr } = sym;
  const X = new Float64Array(n * nrhs);
  for (let q = 0; q < nrhs; q++) {
    const bq = q * n;
    for (let k = 0; k < n; k++) X[k * nrhs + q] = B[bq + perm[k]];
  }
  const q4 = nrhs - (nrhs % 4);

  // L Y = B
  for (let s = 0; s < nsuper; s++) {
    const f = superFirst[s];
    const nc = superFirst[s + 1] - f;
    const r0 = superRowPtr[s];
    const nr = superRowPtr[s + 1] - r0;
    const os = superValPtr[s];
    const xf = f * nrhs;
    for (let i = 0; i < nc; i++) {
      const rowI = os + i * nc;
      const xi = xf + i * nrhs;
      for (let k = 0; k < i; k++) {
        const l = Lx[rowI + k];
        if (l === 0) continue;
        const xk = xf + k * nrhs;
        for (let q = 0; q < nrhs; q++) X[xi + q] -= l * X[xk + q];
      }
      const inv = 1 / Lx[rowI + i];
      for (let q = 0; q < nrhs; q++) X[xi + q] *= inv;
    }
    let r = nc;
    for (; r + 1 < nr; r += 2) {
      const a0 = os + r * nc;
      const a1 = a0 + nc;
      const y0 = superRows[r0 + r] * nrhs;
      const y1 = superRows[r0 + r + 1] * nrhs;
      for (let q = 0; q < q4; q += 4) {
        let s00 = 0, s01 = 0, s02 = 0, s03 = 0, s10 = 0, s11 = 0, s12 = 0, s13 = 0;
        for (let k = 0, xk = xf + q; k < nc; k++, xk += nrhs) {
          const l0 = Lx[a0 + k];
          const l1 = Lx[a1 + k];
          const x0 = X[xk], x1 = X[xk + 1], x2 = X[xk + 2], x3 = X[xk + 3];
          s00 += l0 * x0; s01 += l0 * x1; s02 += l0 * x2; s03 += l0 * x3;
          s10 += l1 * x0; s11 += l1 * x1; s12 += l1 * x2; s13 += l1 * x3;
        }
        X[y0 + q] -= s00; X[y0 + q + 1] -= s01; X[y0 + q + 2] -= s02; X[y0 + q + 3] -= s03;
        X[y1 + q] -= s10; X[y1 + q + 1] -= s11; X[y1 + q + 2] -= s12; X[y1 + q + 3] -= s13;
      }
      for (let q = q4; q < nrhs; q++) {
        let s0 = 0, s1 = 0;
        for (let k = 0, xk = xf + q; k < nc; k++, xk += nrhs) {
          s0 += Lx[a0 + k] * X[xk];
          s1 += Lx[a1 + k] * X[xk];
        }
        X[y0 + q] -= s0;
        X[y1 + q] -= s1;
      }
    }
    if (r < nr) {
      const a0 = os + r * nc;
      const y0 = superRows[r0 + r] * nrhs;
      for (let q = 0; q < nrhs; q++) {
        let s0 = 0;
        for (let k = 0, xk = xf + q; k < nc; k++, xk += nrhs) s0 += Lx[a0 + k] * X[xk];
        X[y0 + q] -= s0;
      }
    }
  }

  // Lᵀ X = Y
  for (let s = nsuper - 1; s >= 0; s--) {
    const f = superFirst[s];
    const nc = superFirst[s + 1] - f;
    const r0 = superRowPtr[s];
    const nr = superRowPtr[s + 1] - r0;
    const os = superValPtr[s];
    const xf = f * nrhs;
    // X1 −= L21ᵀ · Y, reading L21 by rows: two rows at a time, four load cases in registers
    let r = nc;
    for (; r + 1 < nr; r += 2) {
      const a0 = os + r * nc;
      const a1 = a0 + nc;
      const y0 = superRows[r0 + r] * nrhs;
      const y1 = superRows[r0 + r + 1] * nrhs;
      for (let q = 0; q < q4; q += 4) {
        const u0 = X[y0 + q], u1 = X[y0 + q + 1], u2 = X[y0 + q + 2], u3 = X[y0 + q + 3];
        const v0 = X[y1 + q], v1 = X[y1 + q + 1], v2 = X[y1 + q + 2], v3 = X[y1 + q + 3];
        for (let k = 0, xk = xf + q; k < nc; k++, xk += nrhs) {
          const l0 = Lx[a0 + k];
          const l1 = Lx[a1 + k];
          X[xk] -= l0 * u0 + l1 * v0;
          X[xk + 1] -= l0 * u1 + l1 * v1;
          X[xk + 2] -= l0 * u2 + l1 * v2;
          X[xk + 3] -= l0 * u3 + l1 * v3;
        }
      }
      for (let q = q4; q < nrhs; q++) {
        const u = X[y0 + q];
        const v = X[y1 + q];
        for (let k = 0, xk = xf + q; k < nc; k++, xk += nrhs) X[xk] -= Lx[a0 + k] * u + Lx[a1 + k] * v;
      }
    }
    if (r < nr) {
      const a0 = os + r * nc;
      const y0 = superRows[r0 + r] * nrhs;
      for (let q = 0; q < nrhs; q++) {
        const u = X[y0 + q];
        for (let k = 0, xk = xf + q; k < nc; k++, xk += nrhs) X[xk] -= Lx[a0 + k] * u;
      }
    }
    for (let i = nc - 1; i >= 0; i--) {
      const rowI = os + i * nc;
      const xi = xf + i * nrhs;
      const inv = 1 / Lx[rowI + i];
      for (let q = 0; q < nrhs; q++) X[xi + q] *= inv;
      for (let k = 0; k < i; k++) {
        const l = Lx[rowI + k];
        if (l === 0) continue;
        const xk = xf + k * nrhs;
        for (let q = 0; q < nrhs; q++) X[xk + q] -= l * X[xi + q];
      }
    }
  }

  const out = new Float64Array(n * nrhs);
  for (let q = 0; q < nrhs; q++) {
    const bq = q * n;
    for (let k = 0; k < n; k++) out[bq + perm[k]] = X[k * nrhs + q];
  }
  return out;
}

/**
 * The same substitution with the SIMD kernels (solve-kernels.ts), one call per supernode and
 * pass. The work array (rows padded to an even number of load cases) and the scratch of the
 * backward pass lie in the kernels' memory after the factor (grown when needed). The
 * permutations in and out stay JavaScript loops: staging the right-hand sides in the kernels'
 * memory cost more in fresh pages than the loops (measured, pratt_10k first solve 30 vs 8 ms);
 * they run in the freedoms' original order (sequential streams of every load case).
 * Returns null if the memory cannot grow.
 */
function simdBlockSolve(sym: SymbolicFactor, factor: NumericFactor, B: Float64Array, nrhs: number): Float64Array | null {
  const simd = factor.simd!;
  const { n, nsuper, superFirst, superRowPtr, superValPtr } = sym;
  let below = 0;
  for (let s = 0; s < nsuper; s++) below = Math.max(below, superRowPtr[s + 1] - superRowPtr[s] - (superFirst[s + 1] - superFirst[s]));
  const ld = nrhs + (nrhs & 1);
  const ld8 = ld * 8;
  const xB = factor.freeB;
  const eB = xB + n * ld8;
  const need = eB + below * ld8;
  const have = simd.memory.buffer.byteLength;
  if (need > have) {
    try {
      simd.memory.grow(Math.ceil((need - have) / 65536));
    } catch {
      return null;
    }
    // growing detaches the old views
    factor.Lx = new Float64Array(simd.memory.buffer, 0, factor.Lx.length);
  }
  const X = new Float64Array(simd.memory.buffer, xB, n * ld);
  // in the original order of the freedoms: every load case read (and, below, written) as a
  // sequential stream, each row of X written (read) whole, once
  const pinv = inversePermutation(sym);
  for (let i = 0; i < n; i++) {
    const xr = pinv[i] * ld;
    for (let q = 0, b = i; q < nrhs; q++, b += n) X[xr + q] = B[b];
    if (ld !== nrhs) X[xr + nrhs] = 0;
  }
  const { solveForward, solveBackward } = simd;
  const rowsB = factor.rowsB;
  for (let s = 0; s < nsuper; s++) {
    const f = superFirst[s];
    const r0 = superRowPtr[s];
    solveForward(superValPtr[s] * 8, superFirst[s + 1] - f, superRowPtr[s + 1] - r0, xB + f * ld8, ld8, rowsB + r0 * 4, xB);
  }
  for (let s = nsuper - 1; s >= 0; s--) {
    const f = superFirst[s];
    const r0 = superRowPtr[s];
    solveBackward(superValPtr[s] * 8, superFirst[s + 1] - f, superRowPtr[s + 1] - r0, xB + f * ld8, ld8, rowsB + r0 * 4, xB, eB);
  }
  const out = new Float64Array(n * nrhs);
  for (let i = 0; i < n; i++) {
    const xr = pinv[i] * ld;
    for (let q = 0, o = i; q < nrhs; q++, o += n) out[o] = X[xr + q];
  }
  return out;
}

/** pinv[i] = the step at which freedom i is eliminated, kept per analysis */
const inverses = new WeakMap<SymbolicFactor, Int32Array>();

function inversePermutation(sym: SymbolicFactor): Int32Array {
  let pinv = inverses.get(sym);
  if (!pinv) {
    const { n, perm } = sym;
    pinv = new Int32Array(n);
    for (let k = 0; k < n; k++) pinv[perm[k]] = k;
    inverses.set(sym, pinv);
  }
  return pinv;
}
