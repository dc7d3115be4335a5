import { afterEach, describe, expect, it } from 'vitest';
import { analysePattern, factorise, SingularMatrixError, type SymmetricCsc } from '../../../shared/solver/index.js';
import { factorise as bridgeFactorise, forgetPatterns } from '../../../shared/engine/solverBridge.js';
import { gridLaplacian, planeFrame, relativeResidual } from './fixtures.js';

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

/** a portal-frame grid (3 freedoms per node), fixed at the base; `extra` adds diagonal braces */
function gridFrame(nx: number, ny: number, I: number, extra: Array<[number, number]> = []): SymmetricCsc {
  const coords: Array<[number, number]> = [];
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) coords.push([i * 6, j * 3.5]);
  const members = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const a = j * nx + i;
      if (i + 1 < nx && j > 0) members.push({ a, b: a + 1, E: 2.1e11, A: 5e-3, I });
      if (j + 1 < ny) members.push({ a, b: a + nx, E: 2.1e11, A: 8e-3, I: 2 * I });
    }
  }
  for (const [a, b] of extra) members.push({ a, b, E: 2.1e11, A: 2e-3, I: 0, truss: true });
  const restrained = new Set<number>();
  for (let i = 0; i < nx; i++) for (let d = 0; d < 3; d++) restrained.add(i * 3 + d);
  return planeFrame(coords, members, restrained).K;
}

/** |a − b| ≤ rtol · max(1, |a|, |b|) entry by entry */
function expectClose(a: Float64Array, b: Float64Array, rtol: number): void {
  expect(a.length).toBe(b.length);
  for (let i = 0; i < a.length; i++) expect(Math.abs(a[i] - b[i])).toBeLessThanOrEqual(rtol * Math.max(1, Math.abs(a[i]), Math.abs(b[i])));
}

function loads(n: number, nrhs: number, seed: number): Float64Array {
  const rand = rng(seed);
  return new Float64Array(n * nrhs).map(() => rand() * 2e3 - 1e3);
}

describe('reuse of the analysis of a pattern', () => {
  afterEach(() => forgetPatterns());

  it('refactorises new values into the same factorisation with the answers of a fresh one (1e-12)', () => {
    const K1 = gridFrame(9, 12, 1e-4);
    const K2 = gridFrame(9, 12, 3.7e-4); // same connectivity, other sections
    expect(Array.from(K2.rowIdx)).toEqual(Array.from(K1.rowIdx));
    const B = loads(K1.n, 4, 1);
    const f = factorise(K1);
    const first = f.solve(B, 4);
    f.refactorise(K2.values);
    expectClose(f.solve(B, 4), factorise(K2).solve(B, 4), 1e-12);
    // and back again: no trace of the previous values is left in the reused memory
    f.refactorise(K1.values);
    expectClose(f.solve(B, 4), first, 1e-12);
    for (let q = 0; q < 4; q++) expect(relativeResidual(K1, f.solve(B, 4), B, q)).toBeLessThanOrEqual(1e-12);
  });

  it('factorises many value sets of one analysed pattern, each equal to a fresh factorisation (1e-12)', () => {
    const K = gridLaplacian([14, 13, 12], 0.05);
    const a = analysePattern(K);
    const rand = rng(5);
    const B = loads(K.n, 3, 2);
    for (let trial = 0; trial < 3; trial++) {
      const values = K.values.map((v) => v * (1 + 0.3 * rand()));
      for (let j = 0; j < K.n; j++) values[K.colPtr[j]] += 10; // keeps it positive definite (diagonal first in each column)
      const Kv: SymmetricCsc = { ...K, values };
      expectClose(a.factorise(values).solve(B, 3), factorise(Kv).solve(B, 3), 1e-12);
    }
  });

  it('hands the memory of a released factorisation to the next one of the pattern, with the answers of a fresh one (1e-12)', () => {
    const K1 = gridFrame(8, 10, 1e-4);
    const K2 = gridFrame(8, 10, 5e-4);
    const a = analysePattern(K1);
    const B = loads(K1.n, 20, 8);
    const f1 = a.factorise(K1.values);
    f1.solve(B, 20); // grows its memory for the solve workspace too
    f1.release();
    expect(() => f1.solve(B, 20)).toThrow(/released/);
    const f2 = a.factorise(K2.values);
    expect(f2.memoryReused).toBe(true);
    expectClose(f2.solve(B, 20), factorise(K2).solve(B, 20), 1e-12);
    // nothing released now: the next one gets memory of its own, and f2 stays valid beside it
    const f3 = a.factorise(K1.values);
    expect(f3.memoryReused).toBe(false);
    expectClose(f3.solve(B, 20), factorise(K1).solve(B, 20), 1e-12);
    expectClose(f2.solve(B, 20), factorise(K2).solve(B, 20), 1e-12);
  });

  it('engine bridge: the same connectivity reuses the analysis, new values give fresh answers', () => {
    const K1 = gridFrame(7, 9, 1e-4);
    const K2 = gridFrame(7, 9, 2e-4);
    const f1 = bridgeFactorise(K1);
    const f2 = bridgeFactorise({ ...K2, colPtr: K2.colPtr.slice(), rowIdx: K2.rowIdx.slice() });
    expect(f2.analysis).toBe(f1.analysis);
    const B = loads(K2.n, 2, 3);
    expectClose(f2.solve(B, 2), factorise(K2).solve(B, 2), 1e-12);
    // the first factorisation keeps its own memory
    expectClose(f1.solve(B, 2), factorise(K1).solve(B, 2), 1e-12);
  });

  it('engine bridge: a new member (changed pattern) never reuses a stale analysis', () => {
    const K1 = gridFrame(7, 9, 1e-4);
    // a brace from the first storey's left node to the top right node: entries no pattern held
    const K2 = gridFrame(7, 9, 1e-4, [[7, 7 * 9 - 1]]);
    expect(K2.n).toBe(K1.n);
    expect(K2.colPtr[K2.n]).toBeGreaterThan(K1.colPtr[K1.n]);
    const f1 = bridgeFactorise(K1);
    const f2 = bridgeFactorise(K2);
    expect(f2.analysis).not.toBe(f1.analysis);
    const B = loads(K2.n, 2, 4);
    for (let q = 0; q < 2; q++) expect(relativeResidual(K2, f2.solve(B, 2), B, q)).toBeLessThanOrEqual(1e-12);
  });

  it('engine bridge: a pattern edited in place in the same arrays is analysed again', () => {
    // same n and entry count, one entry moved to another row: only an entry-by-entry comparison sees it
    const K = gridLaplacian([6, 5, 4]);
    // diagonal raised by 1 so the matrix stays diagonally dominant (SPD by Gershgorin) after the edit
    for (let j = 0; j < K.n; j++) K.values[K.colPtr[j]] += 1;
    const f1 = bridgeFactorise(K);
    const j = 3;
    const p = K.colPtr[j + 1] - 1;
    expect(K.rowIdx[p] + 1).toBeLessThan(K.n);
    K.rowIdx[p] += 1; // the last row of column 3 moves one row down (column 3 holds no entry there)
    const f2 = bridgeFactorise(K);
    expect(f2.analysis).not.toBe(f1.analysis);
    const B = loads(K.n, 1, 6);
    expect(relativeResidual(K, f2.solve(B, 1), B)).toBeLessThanOrEqual(1e-12);
  });

  it('refuses to solve after a refactorisation hit a zero pivot, and recovers with good values', () => {
    const K = gridFrame(5, 6, 1e-4);
    const f = factorise(K);
    const zero = K.values.slice().fill(0);
    expect(() => f.refactorise(zero)).toThrow(SingularMatrixError);
    const B = loads(K.n, 1, 7);
    expect(() => f.solve(B, 1)).toThrow(/refactorise before solving/);
    f.refactorise(K.values);
    expect(relativeResidual(K, f.solve(B, 1), B)).toBeLessThanOrEqual(1e-12);
  });
});
