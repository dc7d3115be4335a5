import { describe, expect, it } from 'vitest';
import { factorise } from '../../../shared/solver/index.js';
import type { SymmetricCsc } from '../../../shared/solver/types.js';
import { lowestEigenpairs, symmetricProduct } from '../../../shared/stability/eigen.js';

/** Lower-triangle CSC from (row, col, value) with row ≥ col. */
function csc(n: number, entries: [number, number, number][]): SymmetricCsc {
  const cols: [number, number][][] = Array.from({ length: n }, () => []);
  for (const [i, j, v] of entries) cols[j].push([i, v]);
  const colPtr = new Int32Array(n + 1), rowIdx: number[] = [], values: number[] = [];
  cols.forEach((c, j) => {
    c.sort((a, b) => a[0] - b[0]);
    for (const [i, v] of c) { rowIdx.push(i); values.push(v); }
    colPtr[j + 1] = rowIdx.length;
  });
  return { n, colPtr, rowIdx: Int32Array.from(rowIdx), values: Float64Array.from(values) };
}

/** Chain of unit springs between fixed ends (N free points): tridiag(−1, 2, −1), in `copies` separate copies. */
function chain(N: number, copies = 1): SymmetricCsc {
  const e: [number, number, number][] = [];
  for (let c = 0; c < copies; c++) {
    for (let i = 0; i < N; i++) {
      e.push([c * N + i, c * N + i, 2]);
      if (i + 1 < N) e.push([c * N + i + 1, c * N + i, -1]);
    }
  }
  return csc(N * copies, e);
}
const diagonal = (d: number[]) => csc(d.length, d.map((v, i) => [i, i, v] as [number, number, number]));
const identity = (n: number) => diagonal(new Array(n).fill(1));
// closed form of the chain: λ_k = 4 sin²(kπ / (2(N + 1))) (e.g. Strang, Linear Algebra, the second-difference matrix, from memory)
const chainValue = (N: number, k: number) => 4 * Math.sin((k * Math.PI) / (2 * (N + 1))) ** 2;

describe.each(['lanczos', 'subspace'] as const)('lowest eigenpairs (%s)', (method) => {
  it('the second-difference matrix with B = I: six lowest λ to rel 1e-9, B-orthonormal vectors', () => {
    const N = 200, K = chain(N), B = identity(N);
    const r = lowestEigenpairs(factorise(K), K, B, 6, { method, tolerance: 1e-8, subspaceTolerance: 1e-12 });
    expect(r.converged).toBe(true);
    expect(r.values.length).toBe(6);
    for (let k = 0; k < 6; k++) expect(Math.abs(r.values[k] - chainValue(N, k + 1)) / chainValue(N, k + 1)).toBeLessThan(1e-9);
    const BX = symmetricProduct(B, r.vectors, 6);
    for (let a = 0; a < 6; a++) {
      for (let b = 0; b < 6; b++) {
        let s = 0;
        for (let i = 0; i < N; i++) s += r.vectors[a * N + i] * BX[b * N + i];
        expect(Math.abs(s - (a === b ? 1 : 0))).toBeLessThan(1e-6);
      }
    }
    for (const res of r.residuals) expect(res).toBeLessThan(1e-6);
  });

  it('B indefinite: only positive λ, even beside negative ones of much smaller magnitude', () => {
    // K = I, B = diag(d): λ = 1/d for d > 0 → 1/4, 1/2, 1; the negative d = −100, −50, −40, −30 give λ = −0.01 …
    const d = [-100, 1, -50, 2, -40, 4, -30, 0.001, 0.0005];
    const K = identity(d.length);
    const r = lowestEigenpairs(factorise(K), K, diagonal(d), 3, { method, subspace: 3, subspaceTolerance: 1e-12 });
    expect(Array.from(r.values)).toEqual([0.25, 0.5, 1].map((v) => expect.closeTo(v, 9))); // exact values 1/d; tolerance 5e-10
  });

  it('B of rank 2 gives two pairs however many are asked for', () => {
    const K = chain(30);
    const b = new Array(30).fill(0); b[10] = 1; b[20] = 3;
    const r = lowestEigenpairs(factorise(K), K, diagonal(b), 5, { method });
    expect(r.values.length).toBe(2);
    for (const res of r.residuals) expect(res).toBeLessThan(1e-8);
  });

  it('finds both copies of a double eigenvalue (two identical chains)', () => {
    const N = 50, K = chain(N, 2), B = identity(2 * N);
    const r = lowestEigenpairs(factorise(K), K, B, 4, { method });
    const want = [1, 1, 2, 2].map((k) => chainValue(N, k));
    for (let k = 0; k < 4; k++) expect(Math.abs(r.values[k] - want[k]) / want[k]).toBeLessThan(1e-8);
  });
});
