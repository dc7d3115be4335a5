import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Matrix, solve as denseSolve } from 'ml-matrix';
import { factorise, type SymmetricCsc } from '../../../shared/solver/index.js';
import { fromDense, lowerCsc, multiply, relativeResidual } from './fixtures.js';

const orderings = ['amd', 'nested-dissection', 'natural', 'auto'] as const;

/** deterministic pseudo-random numbers (mulberry32) so failures reproduce */
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

describe('factorise and solve', () => {
  it('matches a dense solve (ml-matrix) on small SPD systems within 1e-10 relative', () => {
    const rand = rng(7);
    for (const n of [1, 2, 5, 12, 30]) {
      // A = M Mᵀ + n I is symmetric positive definite (closed form)
      const M = Matrix.rand(n, n, { random: rand });
      const A = M.mmul(M.transpose()).add(Matrix.eye(n).mul(n));
      const b = Matrix.rand(n, 1, { random: rand });
      const expected = denseSolve(A, b).getColumn(0);
      const K = fromDense(A.to2DArray());
      for (const ordering of orderings) {
        const x = factorise(K, { ordering }).solve(Float64Array.from(b.getColumn(0)), 1);
        const scale = Math.max(...expected.map(Math.abs));
        for (let i = 0; i < n; i++) {
          // |x − x_dense| ≤ 1e-10 · max|x_dense|
          expect(Math.abs(x[i] - expected[i])).toBeLessThanOrEqual(1e-10 * scale);
        }
        expect(relativeResidual(K, x, Float64Array.from(b.getColumn(0)))).toBeLessThanOrEqual(1e-10);
      }
    }
  });

  it('solves K·x = b for random sparse SPD matrices with every ordering (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 80 }),
        fc.array(fc.tuple(fc.nat(), fc.nat(), fc.double({ min: 0.01, max: 100, noNaN: true })), { maxLength: 300 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer(),
        (n, edges, nrhs, seed) => {
          // weighted graph Laplacian plus a positive diagonal: symmetric, strictly diagonally
          // dominant with positive diagonal, hence positive definite (Gershgorin)
          const t: Array<[number, number, number]> = [];
          const rand = rng(seed);
          for (let i = 0; i < n; i++) t.push([i, i, 0.1 + rand()]);
          for (const [a, b, w] of edges) {
            const i = a % n;
            const j = b % n;
            if (i === j) continue;
            t.push([i, j, -w], [i, i, w], [j, j, w]);
          }
          const K = lowerCsc(n, t);
          const B = new Float64Array(n * nrhs).map(() => rand() * 2 - 1);
          for (const ordering of orderings) {
            const f = factorise(K, { ordering });
            const X = f.solve(B, nrhs);
            for (let q = 0; q < nrhs; q++) expect(relativeResidual(K, X, B, q)).toBeLessThanOrEqual(1e-10);
          }
        },
      ),
      { numRuns: 60 },
    );
  });

  it('solves several right-hand sides as one block, each equal to its own solve', () => {
    const n = 40;
    const t: Array<[number, number, number]> = [];
    for (let i = 0; i < n; i++) {
      t.push([i, i, 4]);
      if (i + 1 < n) t.push([i + 1, i, -1]);
      if (i + 7 < n) t.push([i + 7, i, -1]);
    }
    const K = lowerCsc(n, t);
    const nrhs = 5;
    const rand = rng(3);
    const B = new Float64Array(n * nrhs).map(() => rand());
    const f = factorise(K, { ordering: 'amd' });
    const X = f.solve(B, nrhs);
    for (let q = 0; q < nrhs; q++) {
      const single = f.solve(B.slice(q * n, (q + 1) * n), 1);
      for (let i = 0; i < n; i++) expect(X[q * n + i]).toBeCloseTo(single[i], 12);
      expect(relativeResidual(K, X, B, q)).toBeLessThanOrEqual(1e-12);
    }
  });

  it('returns an exact solution for a diagonal system and handles an empty one', () => {
    // x_i = b_i / d_i (closed form)
    const K = lowerCsc(3, [[0, 0, 2], [1, 1, 4], [2, 2, 8]]);
    const x = factorise(K).solve(Float64Array.of(2, 2, 2), 1);
    [1, 0.5, 0.25].forEach((v, i) => expect(x[i]).toBeCloseTo(v, 15));
    const empty: SymmetricCsc = { n: 0, colPtr: Int32Array.of(0), rowIdx: new Int32Array(0), values: new Float64Array(0) };
    expect(factorise(empty).solve(new Float64Array(0), 4)).toHaveLength(0);
  });

  it('keeps the residual small on a frame-like chain with stiffness ratios of 1e8', () => {
    // springs alternating k = 1 and k = 1e8 between consecutive freedoms, freedom 0 tied to ground;
    // ten soft springs in series keep every pivot above 1e-10 of its diagonal
    const n = 20;
    const t: Array<[number, number, number]> = [[0, 0, 1]];
    for (let i = 0; i + 1 < n; i++) {
      const k = i % 2 === 0 ? 1e8 : 1;
      t.push([i, i, k], [i + 1, i + 1, k], [i + 1, i, -k]);
    }
    const K = lowerCsc(n, t);
    const b = new Float64Array(n).fill(1);
    for (const ordering of orderings) {
      const x = factorise(K, { ordering }).solve(b, 1);
      expect(relativeResidual(K, x, b)).toBeLessThanOrEqual(1e-12);
      // a unit load at every freedom: freedom 0 carries n units through its ground spring, u0 = n / 1 (statics)
      expect(x[0]).toBeCloseTo(n, 4);
    }
  });

  it('rejects malformed matrices and right-hand sides with a message naming the fault', () => {
    const upper: SymmetricCsc = { n: 2, colPtr: Int32Array.of(0, 1, 3), rowIdx: Int32Array.of(0, 0, 1), values: Float64Array.of(1, 1, 1) };
    expect(() => factorise(upper)).toThrow(/entry \(0, 1\) is not in the lower triangle/);
    const nan: SymmetricCsc = { n: 1, colPtr: Int32Array.of(0, 1), rowIdx: Int32Array.of(0), values: Float64Array.of(NaN) };
    expect(() => factorise(nan)).toThrow(/is NaN/);
    const f = factorise(lowerCsc(2, [[0, 0, 1], [1, 1, 1]]));
    expect(() => f.solve(new Float64Array(3), 2)).toThrow(/expected 4/);
  });

  it('multiplies back: K·x reproduces b for a dense 8×8 SPD matrix (sanity of the fixture)', () => {
    const A = [...Array(8)].map((_, i) => [...Array(8)].map((__, j) => (i === j ? 10 : 1 / (1 + i + j))));
    const K = fromDense(A);
    const b = Float64Array.from({ length: 8 }, (_, i) => i + 1);
    const x = factorise(K).solve(b, 1);
    const kx = multiply(K, x);
    for (let i = 0; i < 8; i++) expect(kx[i]).toBeCloseTo(b[i], 10);
  });
});
