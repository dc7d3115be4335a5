import { describe, expect, it } from 'vitest';
import { factorise, SingularMatrixError, type SymmetricCsc } from '../../../shared/solver/index.js';
import { lowerCsc, planeFrame, relativeResidual } from './fixtures.js';

const orderings = ['amd', 'nested-dissection', 'natural'] as const;

function failure(K: SymmetricCsc, ordering: (typeof orderings)[number]): SingularMatrixError {
  try {
    factorise(K, { ordering });
  } catch (e) {
    if (e instanceof SingularMatrixError) return e;
    throw e;
  }
  throw new Error('expected a SingularMatrixError');
}

// steel-like properties in SI units (invented demo values)
const E = 210e9;
const A = 5e-3;
const I = 8e-5;

/** portal frame: columns 0–1 and 3–2, beam 1–2; bases 0 and 3 fixed */
const portal: Array<[number, number]> = [
  [0, 0],
  [0, 4],
  [6, 4],
  [6, 0],
];
const fixedBases = new Set([0, 1, 2, 9, 10, 11]);

describe('mechanisms and indefinite matrices', () => {
  it('names a free node (no member attached) with a zero pivot at its own freedom', () => {
    // node 4 is loose: its three freedoms have no stiffness at all
    const coords: Array<[number, number]> = [...portal, [3, 8]];
    const members = [
      { a: 0, b: 1, E, A, I },
      { a: 1, b: 2, E, A, I },
      { a: 3, b: 2, E, A, I },
    ];
    const { K, freedom } = planeFrame(coords, members, fixedBases);
    for (const ordering of orderings) {
      const e = failure(K, ordering);
      expect(e.kind).toBe('zero');
      expect([freedom(4, 0), freedom(4, 1), freedom(4, 2)]).toContain(e.index);
    }
  });

  it('names the axial freedom of a bar with no axial restraint', () => {
    // horizontal pin-ended bar 0–1; both ends restrained in y and rotation only: it slides along x
    const { K, freedom } = planeFrame(
      [
        [0, 0],
        [5, 0],
      ],
      [{ a: 0, b: 1, E, A, I, truss: true }],
      new Set([1, 2, 4, 5]),
    );
    for (const ordering of orderings) {
      const e = failure(K, ordering);
      expect(e.kind).toBe('zero');
      expect([freedom(0, 0), freedom(1, 0)]).toContain(e.index);
      // the pivot is roundoff of EA/L − EA/L: at most 1e-12 of the diagonal (floating point)
      expect(Math.abs(e.pivot)).toBeLessThanOrEqual(1e-12 * e.diagonal);
    }
  });

  it('names the unrestrained rotation of a node where only pin-ended bars meet', () => {
    // triangle truss on a plane frame model: node 2 (apex) joins two bars, its rotation is free
    const coords: Array<[number, number]> = [
      [0, 0],
      [4, 0],
      [2, 3],
    ];
    const members = [
      { a: 0, b: 1, E, A, I },
      { a: 0, b: 2, E, A, I, truss: true },
      { a: 1, b: 2, E, A, I, truss: true },
    ];
    // pinned at 0, roller (y) at 1; rotations of 0 and 1 restrained by the beam 0–1 and the support
    const { K, freedom } = planeFrame(coords, members, new Set([0, 1, 2, 4]));
    for (const ordering of orderings) {
      const e = failure(K, ordering);
      expect(e.kind).toBe('zero');
      expect(e.index).toBe(freedom(2, 2));
    }
  });

  it('reports a rigid-body mode of an unsupported frame as a zero pivot', () => {
    const members = [
      { a: 0, b: 1, E, A, I },
      { a: 1, b: 2, E, A, I },
      { a: 3, b: 2, E, A, I },
    ];
    const { K } = planeFrame(portal, members, new Set());
    for (const ordering of orderings) {
      const e = failure(K, ordering);
      expect(e.kind).toBe('zero');
      expect(Math.abs(e.pivot)).toBeLessThanOrEqual(1e-10 * e.diagonal);
      expect(e.index).toBeGreaterThanOrEqual(0);
      expect(e.index).toBeLessThan(K.n);
    }
  });

  it('reports a rigid-body mode of a larger unsupported frame with mixed stiffnesses', () => {
    // 6 × 5 grid of nodes, beams and columns, no supports; members alternate 1 : 1e3 in EA and EI
    const coords: Array<[number, number]> = [];
    for (let j = 0; j < 5; j++) for (let i = 0; i < 6; i++) coords.push([i * 5, j * 3.5]);
    const members = [];
    for (let j = 0; j < 5; j++) {
      for (let i = 0; i < 6; i++) {
        const v = j * 6 + i;
        const f = (i + j) % 2 === 0 ? 1 : 1e3;
        if (i + 1 < 6) members.push({ a: v, b: v + 1, E: E * f, A, I });
        if (j + 1 < 5) members.push({ a: v, b: v + 6, E: E * f, A, I });
      }
    }
    const { K } = planeFrame(coords, members, new Set());
    for (const ordering of orderings) {
      const e = failure(K, ordering);
      expect(e.kind).toBe('zero');
    }
  });

  it('names a negative pivot at the freedom where the matrix stops being positive definite', () => {
    // [[1, 2], [2, 1]] has eigenvalues 3 and −1; eliminating freedom 0 leaves 1 − 4 = −3 at freedom 1
    const K = lowerCsc(2, [
      [0, 0, 1],
      [1, 0, 2],
      [1, 1, 1],
    ]);
    const e = failure(K, 'natural');
    expect(e.kind).toBe('negative');
    expect(e.index).toBe(1);
    expect(e.pivot).toBeCloseTo(-3, 12);
    // a negative diagonal entry is itself a negative pivot at that freedom, whatever the ordering
    const D = lowerCsc(4, [
      [0, 0, 2],
      [1, 1, 3],
      [2, 2, -5],
      [3, 3, 1],
    ]);
    for (const ordering of orderings) {
      const d = failure(D, ordering);
      expect(d.kind).toBe('negative');
      expect(d.index).toBe(2);
    }
  });

  it('does not flag a supported frame whose member stiffnesses differ by 1e8', () => {
    // portal frame with a very stiff beam (E × 1e8) on flexible columns: stiff but well posed
    const members = [
      { a: 0, b: 1, E, A, I },
      { a: 1, b: 2, E: E * 1e8, A, I },
      { a: 3, b: 2, E, A, I },
    ];
    const { K } = planeFrame(portal, members, fixedBases);
    const b = Float64Array.from({ length: K.n }, (_, i) => (i % 3 === 0 ? 1e4 : -2e3));
    for (const ordering of orderings) {
      const x = factorise(K, { ordering }).solve(b, 1);
      expect(relativeResidual(K, x, b)).toBeLessThanOrEqual(1e-12);
    }
  });

  it('does not flag a soft spring hanging on a stiff one (ratio 1e8) in either elimination order', () => {
    // ground —k=1e8— u0 —k=1— u1: pivots 1e8+1 then ≈ 1, or 1 then 1e8 (closed form)
    const K = lowerCsc(2, [
      [0, 0, 1e8 + 1],
      [1, 0, -1],
      [1, 1, 1],
    ]);
    const x = factorise(K, { ordering: 'natural' }).solve(Float64Array.of(0, 1), 1);
    // a unit load at u1: u1 = 1/1 + 1/1e8, u0 = 1/1e8 (springs in series)
    expect(x[1]).toBeCloseTo(1 + 1e-8, 12);
    expect(x[0]).toBeCloseTo(1e-8, 16);
    // a chain of ten soft springs behind a stiff one: smallest pivot/diagonal ≈ 1e-9
    const t: Array<[number, number, number]> = [[0, 0, 1e8]];
    for (let i = 0; i < 10; i++) t.push([i, i, 1], [i + 1, i + 1, 1], [i + 1, i, -1]);
    t.push([10, 10, 1e8], [11, 11, 1e8], [11, 10, -1e8]);
    const C = lowerCsc(12, t);
    for (const ordering of orderings) expect(() => factorise(C, { ordering })).not.toThrow();
  });

  it('accepts a stricter or looser tolerance from the caller', () => {
    // pivot/diagonal = 1e-6 at freedom 1: [[1, 1], [1, 1 + 1e-6]] (closed form: 1 + 1e-6 − 1)
    const K = lowerCsc(2, [
      [0, 0, 1],
      [1, 0, 1],
      [1, 1, 1 + 1e-6],
    ]);
    expect(() => factorise(K, { ordering: 'natural' })).not.toThrow();
    expect(failure2(K, 1e-5).index).toBe(1);
  });
});

function failure2(K: SymmetricCsc, pivotTolerance: number): SingularMatrixError {
  try {
    factorise(K, { ordering: 'natural', pivotTolerance });
  } catch (e) {
    if (e instanceof SingularMatrixError) return e;
    throw e;
  }
  throw new Error('expected a SingularMatrixError');
}
