import { setFlagsFromString } from 'node:v8';
import { afterEach, describe, expect, it } from 'vitest';
import { factorise, SingularMatrixError, type SymmetricCsc } from '../../../shared/solver/index.js';
import { hasFusedMultiplyAdd, simdKernels, useFusedMultiplyAdd, useSimdKernels } from '../../../shared/solver/simd-kernels.js';
import { BLOCKED_FROM } from '../../../shared/solver/solve-kernels.js';

// relaxed SIMD (fused multiply-add) is behind a flag in Node 20: on, so that both kernel
// variants are tested (the flag must be set before the first kernels are built)
setFlagsFromString('--experimental-wasm-relaxed-simd');
import { fromDense, gridLaplacian, relativeResidual } from './fixtures.js';

/** deterministic pseudo-random numbers (mulberry32) */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** a dense symmetric matrix with off-diagonal entries in (−1, 1) and diagonal n + 1: diagonally dominant, SPD (Gershgorin) */
function denseSpd(n: number, seed: number): SymmetricCsc {
  const rand = rng(seed);
  const A = [...Array(n)].map(() => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    A[i][i] = n + 1;
    for (let j = 0; j < i; j++) A[i][j] = A[j][i] = rand() * 2 - 1;
  }
  return fromDense(A);
}

function solveBoth(K: SymmetricCsc, nrhs: number): { simd: Float64Array; plain: Float64Array; B: Float64Array } {
  const rand = rng(11);
  const B = new Float64Array(K.n * nrhs).map(() => rand() * 2 - 1);
  useSimdKernels(true);
  const simd = factorise(K).solve(B, nrhs);
  useSimdKernels(false);
  const plain = factorise(K).solve(B, nrhs);
  useSimdKernels(true);
  return { simd, plain, B };
}

describe('dense kernels of the factorisation', () => {
  afterEach(() => useSimdKernels(true));

  it('has WebAssembly SIMD kernels on this platform', () => {
    expect(simdKernels(1024)).not.toBeNull();
  });

  // sizes chosen to exercise the odd and even dot-product lengths, the 4-row blocks and their
  // remainders, and more columns than one panel of the blocked dense factorisation
  for (const n of [1, 3, 7, 50, 131]) {
    it(`SIMD and TypeScript kernels agree on a dense ${n}×${n} system (1e-12 relative residual)`, () => {
      const K = denseSpd(n, n);
      const { simd, plain, B } = solveBoth(K, 5);
      for (let q = 0; q < 5; q++) {
        expect(relativeResidual(K, simd, B, q)).toBeLessThanOrEqual(1e-12);
        expect(relativeResidual(K, plain, B, q)).toBeLessThanOrEqual(1e-12);
      }
      // the solution is well conditioned (diagonally dominant), so both agree closely
      for (let i = 0; i < simd.length; i++) expect(Math.abs(simd[i] - plain[i])).toBeLessThanOrEqual(1e-12 * (1 + Math.abs(plain[i])));
    });
  }

  it('SIMD and TypeScript kernels agree on a 3D grid Laplacian with many supernodes', () => {
    const K = gridLaplacian([9, 8, 7], 0.1);
    const { simd, plain, B } = solveBoth(K, 3);
    for (let q = 0; q < 3; q++) expect(relativeResidual(K, simd, B, q)).toBeLessThanOrEqual(1e-12);
    for (let i = 0; i < simd.length; i++) expect(Math.abs(simd[i] - plain[i])).toBeLessThanOrEqual(1e-9 * (1 + Math.abs(plain[i])));
  });

  for (const nrhs of [1, 2, 3, 20]) {
    it(`SIMD block substitution of ${nrhs} load case(s) agrees with the TypeScript one (1e-12)`, () => {
      // a 3D grid: supernodes of every size, rows below each diagonal block in 4-row blocks and remainders
      const K = gridLaplacian([11, 10, 9], 0.05);
      const { simd, plain, B } = solveBoth(K, nrhs);
      for (let q = 0; q < nrhs; q++) expect(relativeResidual(K, simd, B, q)).toBeLessThanOrEqual(1e-12);
      // |x_simd − x_plain| ≤ 1e-12 · max(1, |x_plain|) (same factor values, other summation order)
      let worst = 0;
      for (let i = 0; i < simd.length; i++) worst = Math.max(worst, Math.abs(simd[i] - plain[i]) / Math.max(1, Math.abs(plain[i])));
      expect(worst).toBeLessThanOrEqual(1e-12);
    });
  }

  // a dense matrix is one supernode, so its substitution is all triangle: the blocked triangle
  // kernels (four rows at a time, then the remainder rows one by one; the backward pass blocked
  // from BLOCKED_FROM columns, column by column below) against the plain loops, for every
  // remainder of the size by 4, both sides of BLOCKED_FROM and odd and even numbers of load cases
  for (const n of [4, 9, 10, 11, BLOCKED_FROM - 1, BLOCKED_FROM, BLOCKED_FROM + 5, 64]) {
    for (const nrhs of [1, 3, 20]) {
      it(`blocked triangle substitution of a dense ${n}×${n} system, ${nrhs} load case(s), fused and unfused, agrees with the TypeScript one (1e-12)`, () => {
        const K = denseSpd(n, 100 + n);
        const rand = rng(23);
        const B = new Float64Array(n * nrhs).map(() => rand() * 2 - 1);
        useSimdKernels(false);
        const plain = factorise(K).solve(B, nrhs);
        useSimdKernels(true);
        for (const fused of [true, false]) {
          useFusedMultiplyAdd(fused);
          const x = factorise(K).solve(B, nrhs);
          useFusedMultiplyAdd(true);
          for (let q = 0; q < nrhs; q++) expect(relativeResidual(K, x, B, q)).toBeLessThanOrEqual(1e-12);
          // |x − x_plain| ≤ 1e-12 · max(1, |x_plain|): same factor, other summation order
          let worst = 0;
          for (let i = 0; i < x.length; i++) worst = Math.max(worst, Math.abs(x[i] - plain[i]) / Math.max(1, Math.abs(plain[i])));
          expect(worst).toBeLessThanOrEqual(1e-12);
        }
      });
    }
  }

  it('still names the freedom of a zero pivot inside a large dense block with SIMD kernels', () => {
    // freedom 60 of a 90×90 dense SPD matrix is made an exact copy of freedom 20 (rows and
    // columns), so K is singular and the later of the two in the elimination gets a zero pivot
    const n = 90;
    const base = denseSpd(n, 5);
    const A = [...Array(n)].map(() => new Array<number>(n).fill(0));
    for (let j = 0; j < n; j++) for (let p = base.colPtr[j]; p < base.colPtr[j + 1]; p++) A[base.rowIdx[p]][j] = A[j][base.rowIdx[p]] = base.values[p];
    for (let j = 0; j < n; j++) A[60][j] = A[j][60] = A[20][j];
    A[60][60] = A[20][20];
    A[60][20] = A[20][60] = A[20][20];
    let caught: unknown;
    try {
      factorise(fromDense(A));
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(SingularMatrixError);
    expect([20, 60]).toContain((caught as SingularMatrixError).index);
  });
});

describe('kernels with and without fused multiply-add', () => {
  afterEach(() => {
    useFusedMultiplyAdd(true);
    useSimdKernels(true);
  });

  it('builds the fused kernels where the runtime has relaxed SIMD', () => {
    expect(hasFusedMultiplyAdd()).toBe(true);
    expect(simdKernels(1024)?.fused).toBe(true);
    useFusedMultiplyAdd(false);
    expect(simdKernels(1024)?.fused).toBe(false);
  });

  const cases: Array<[string, () => SymmetricCsc, number]> = [
    ['a dense 131×131 system', () => denseSpd(131, 131), 20],
    ['a dense 50×50 system', () => denseSpd(50, 50), 1],
    ['a 3D grid Laplacian', () => gridLaplacian([11, 10, 9], 0.05), 20],
    ['a 3D grid Laplacian, one load case', () => gridLaplacian([11, 10, 9], 0.05), 1],
  ];
  for (const [name, make, nrhs] of cases) {
    it(`fused, unfused SIMD and TypeScript kernels agree on ${name} (1e-12)`, () => {
      const K = make();
      const rand = rng(17);
      const B = new Float64Array(K.n * nrhs).map(() => rand() * 2 - 1);
      useFusedMultiplyAdd(true);
      const fused = factorise(K).solve(B, nrhs);
      useFusedMultiplyAdd(false);
      const unfused = factorise(K).solve(B, nrhs);
      useSimdKernels(false);
      const plain = factorise(K).solve(B, nrhs);
      for (let q = 0; q < nrhs; q++) expect(relativeResidual(K, fused, B, q)).toBeLessThanOrEqual(1e-12);
      // |x − x_plain| ≤ 1e-12 · max(1, |x_plain|): same algorithm, roundings of products only
      for (const x of [fused, unfused]) {
        let worst = 0;
        for (let i = 0; i < x.length; i++) worst = Math.max(worst, Math.abs(x[i] - plain[i]) / Math.max(1, Math.abs(plain[i])));
        expect(worst).toBeLessThanOrEqual(1e-12);
      }
    });
  }
});
