import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { factorise, fillReducingOrder } from '../../../shared/solver/index.js';
import { amdOrder } from '../../../shared/solver/amd.js';
import { compressGraph, graphFromLower } from '../../../shared/solver/graph.js';
import { nestedDissectionOrder } from '../../../shared/solver/nested-dissection.js';
import { gridLaplacian, lowerCsc } from './fixtures.js';

function isPermutation(p: Int32Array, n: number): boolean {
  if (p.length !== n) return false;
  const seen = new Uint8Array(n);
  for (const v of p) {
    if (v < 0 || v >= n || seen[v]) return false;
    seen[v] = 1;
  }
  return true;
}

const randomPattern = fc
  .tuple(fc.integer({ min: 0, max: 120 }), fc.array(fc.tuple(fc.nat(), fc.nat()), { maxLength: 500 }))
  .map(([n, edges]) => {
    const t: Array<[number, number, number]> = [];
    for (let i = 0; i < n; i++) t.push([i, i, 1]);
    if (n > 0) for (const [a, b] of edges) if (a % n !== b % n) t.push([a % n, b % n, 1]);
    return lowerCsc(n, t);
  });

describe('fill-reducing orderings', () => {
  it('are permutations of the freedoms for random patterns, including disconnected ones', () => {
    fc.assert(
      fc.property(randomPattern, (K) => {
        for (const ordering of ['amd', 'nested-dissection', 'natural'] as const) {
          expect(isPermutation(fillReducingOrder(K, ordering), K.n)).toBe(true);
        }
        const g = graphFromLower(K);
        expect(isPermutation(amdOrder(g), K.n)).toBe(true);
        expect(isPermutation(nestedDissectionOrder(g, undefined, { leafWeight: 4 }), K.n)).toBe(true);
      }),
      { numRuns: 80 },
    );
  });

  it('compresses the six freedoms of each frame node into one supervariable', () => {
    // 4 nodes in a chain, each node's 6 freedoms fully coupled to its own and its neighbours'
    const t: Array<[number, number, number]> = [];
    for (let a = 0; a < 4; a++) {
      for (const b of [a, a + 1]) {
        if (b > 3) continue;
        for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) t.push([a * 6 + i, b * 6 + j, a === b && i === j ? 10 : 1]);
      }
    }
    const c = compressGraph(graphFromLower(lowerCsc(24, t)));
    expect(c.graph.n).toBe(4);
    expect(Array.from(c.weight)).toEqual([6, 6, 6, 6]);
  });

  it('give far fewer factor nonzeros than the natural numbering on 2D and 3D grid Laplacians', () => {
    // measured on this code (not a published figure): 40×40 natural 64,039, AMD 20,771, ND 22,883;
    // 12×12×12 natural 231,419, AMD 76,038, ND 65,067. The test asserts a clear margin only.
    for (const dims of [[40, 40], [12, 12, 12]]) {
      const K = gridLaplacian(dims);
      const natural = factorise(K, { ordering: 'natural' }).nnzFactor;
      const amd = factorise(K, { ordering: 'amd' }).nnzFactor;
      const nd = factorise(K, { ordering: 'nested-dissection' }).nnzFactor;
      expect(amd).toBeLessThan(0.6 * natural);
      expect(nd).toBeLessThan(0.6 * natural);
    }
  });

  it('counts the factor nonzeros exactly on a small case (tridiagonal: 2n − 1)', () => {
    // a path graph has no fill in natural or minimum degree order: nnz(L) = n + (n − 1) (closed form)
    const n = 50;
    const t: Array<[number, number, number]> = [];
    for (let i = 0; i < n; i++) t.push([i, i, 2]);
    for (let i = 0; i + 1 < n; i++) t.push([i + 1, i, -1]);
    const K = lowerCsc(n, t);
    expect(factorise(K, { ordering: 'natural' }).nnzFactor).toBe(2 * n - 1);
    expect(factorise(K, { ordering: 'amd' }).nnzFactor).toBe(2 * n - 1);
  });
});

describe('automatic ordering choice', () => {
  it('picks, from the graph alone, whichever of AMD and nested dissection needs fewer operations', () => {
    // a plate (ND 1.4× fewer operations), a cube (ND 2.6×), long strips and a long box (AMD 1.6–2.7×),
    // as measured with both orderings; the choice is made before computing either
    for (const dims of [[110, 100], [22, 22, 22], [1000, 11], [400, 30], [200, 8, 8]]) {
      const K = gridLaplacian(dims);
      const auto = factorise(K);
      const amd = factorise(K, { ordering: 'amd' });
      const nd = factorise(K, { ordering: 'nested-dissection' });
      expect(auto.flops).toBe(Math.min(amd.flops, nd.flops));
    }
    expect(factorise(gridLaplacian([20, 20])).ordering).toBe('amd');
  });
});

describe('symbolic analysis from the supervariable tree', () => {
  it('gives the same factor structure as the analysis of the full matrix', async () => {
    const { analyse } = await import('../../../shared/solver/symbolic.js');
    const { expandPostordered, orderingFlops } = await import('../../../shared/solver/supervariable-tree.js');
    const { planeFrame } = await import('./fixtures.js');
    // a 2D grid of frame nodes (3 freedoms each, identical neighbourhoods → supervariables of 3)
    const nx = 9;
    const ny = 7;
    const coords: Array<[number, number]> = [];
    for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) coords.push([i * 4, j * 3]);
    const members = [];
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const a = j * nx + i;
        if (i + 1 < nx) members.push({ a, b: a + 1, E: 2e11, A: 1e-2, I: 1e-4 });
        if (j + 1 < ny) members.push({ a, b: a + nx, E: 2e11, A: 1e-2, I: 1e-4 });
      }
    }
    const { K } = planeFrame(coords, members, new Set([0, 1, 2]));
    const c = compressGraph(graphFromLower(K));
    for (const order of [amdOrder(c.graph, c.weight), nestedDissectionOrder(c.graph, c.weight)]) {
      const tree = expandPostordered(c, order);
      const fast = analyse(K, tree.perm, undefined, tree);
      const full = analyse(K, tree.perm);
      expect(Array.from(fast.perm)).toEqual(Array.from(full.perm));
      expect(fast.nnzL).toBe(full.nnzL);
      expect(fast.flops).toBe(full.flops);
      expect(orderingFlops(c.graph, c.weight, order)).toBe(full.flops);
      expect(Array.from(fast.superFirst)).toEqual(Array.from(full.superFirst));
      expect(Array.from(fast.superRows)).toEqual(Array.from(full.superRows));
    }
  });
});
