import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { localAxes } from '../../../shared/engine/axes.js';
import { factoriseDense } from '../../../shared/engine/denseSolver.js';
import { localStiffness, toGlobalStiffness } from '../../../shared/engine/element.js';
import { fixedEndForces } from '../../../shared/engine/fixedEnd.js';
import { analyse } from '../../../shared/engine/index.js';
import { buildSystem } from '../../../shared/engine/system.js';
import type { Model } from '../../../shared/model/types.js';
import { ModelBuilder } from './builders.js';

/** A small 3D two-storey frame with a brace, a release, a roll and mixed loads (demo geometry). */
function frame(loads: number[]): Model {
  // columns are square (I_major = I_minor): a vertical member's axes stay tied to global X
  // (conventions.md), so only then is the structure itself unchanged by a rotation about Z
  const b = new ModelBuilder().section('SQ', { I_major: 8e-5, I_minor: 8e-5 });
  const pts = [[0, 0], [5, 0], [5, 4], [0, 4]];
  pts.forEach(([x, y], i) => {
    b.node(`G${i}`, x, y, 0).node(`F${i}`, x, y, 3).node(`R${i}`, x, y, 6).support(`G${i}`, 'fixed');
  });
  for (let i = 0; i < 4; i++) {
    b.member(`C${i}a`, `G${i}`, `F${i}`, { section: 'SQ' }).member(`C${i}b`, `F${i}`, `R${i}`, { section: 'SQ', roll: i === 2 ? 0.3 : 0 });
    const j = (i + 1) % 4;
    b.member(`B${i}a`, `F${i}`, `F${j}`, { releaseEnd: i === 1 ? 'pinned' : 'fixed' }).member(`B${i}b`, `R${i}`, `R${j}`);
  }
  b.member('X1', 'G0', 'F1', { type: 'truss' }).member('X2', 'F3', 'R2', { releaseStart: 'pinned_minor' });
  const [p1, p2, p3, p4, p5, p6] = loads;
  b.loadCase('D', 1).loadCase('W')
    .memberLoad('D', 'B0a', 'uniform', 'global_z', -p1 * 1e3)
    .memberLoad('D', 'B1b', 'linear', 'local_z', -p2 * 1e3, { a: 1, b: 3.5, w2: -p3 * 1e3 })
    .memberLoad('W', 'B3b', 'point', 'local_y', p4 * 1e3, { a: 1.2 })
    .memberLoad('W', 'B2a', 'moment', 'local_y', p5 * 1e3, { a: 2 })
    .memberLoad('W', 'X2', 'temperature_gradient', 'local_x', 10, { w2: -5 })
    .nodeLoad('W', 'R1', { fx: p6 * 1e3, fy: -p4 * 1e3, mz: p2 * 1e3 })
    .combination('C1', { D: 1.35, W: 1.5 });
  return b.build();
}
const loadsArb = fc.array(fc.double({ min: 0.5, max: 20, noNaN: true }), { minLength: 6, maxLength: 6 });

function symmetricTimes(K: { n: number; colPtr: Int32Array; rowIdx: Int32Array; values: Float64Array }, x: Float64Array, off: number): Float64Array {
  const y = new Float64Array(K.n);
  for (let j = 0; j < K.n; j++) {
    for (let p = K.colPtr[j]; p < K.colPtr[j + 1]; p++) {
      const i = K.rowIdx[p], v = K.values[p];
      y[i] += v * x[off + j];
      if (i !== j) y[j] += v * x[off + i];
    }
  }
  return y;
}

describe('invariants', () => {
  it('element stiffness is symmetric and rigid-body motions produce no end forces', () => {
    fc.assert(fc.property(
      fc.record({
        L: fc.double({ min: 0.5, max: 20, noNaN: true }),
        dx: fc.double({ min: -1, max: 1, noNaN: true }), dy: fc.double({ min: -1, max: 1, noNaN: true }), dz: fc.double({ min: -1, max: 1, noNaN: true }),
        roll: fc.double({ min: -3, max: 3, noNaN: true }),
        rel: fc.integer({ min: 0, max: 15 }), truss: fc.boolean(),
      }),
      ({ L, dx, dy, dz, roll, rel, truss }) => {
        const n = Math.hypot(dx, dy, dz);
        fc.pre(n > 0.1);
        const R = localAxes([0, 0, 0], [(dx / n) * L, (dy / n) * L, (dz / n) * L], roll, 'Z');
        const kl = localStiffness({ EA: 2e9, EIy: 2e7, EIz: 8e6, GJ: 3e6 }, L, truss,
          { startMajor: (rel & 1) > 0, startMinor: (rel & 2) > 0, endMajor: (rel & 4) > 0, endMinor: (rel & 8) > 0 }, new Float64Array(144));
        const kg = toGlobalStiffness(kl, R, new Float64Array(144), new Float64Array(144));
        const scale = Math.max(...kg.map(Math.abs));
        for (let i = 0; i < 12; i++) for (let j = 0; j < i; j++) expect(Math.abs(kg[i * 12 + j] - kg[j * 12 + i])).toBeLessThan(1e-12 * scale);
        // rigid translation along (1, 2, 3) and rigid rotation about global Z through the origin:
        // node 2 at (L·x̂) moves by ω × r. Exact rigid modes → zero forces (tolerance 1e-9 of the scale).
        const xe = [R[0] * L, R[1] * L, R[2] * L];
        const modes = [
          [1, 2, 3, 0, 0, 0, 1, 2, 3, 0, 0, 0],
          [0, 0, 0, 0, 0, 1, -xe[1], xe[0], 0, 0, 0, 1],
        ];
        for (const u of modes) {
          for (let i = 0; i < 12; i++) {
            let s = 0;
            for (let j = 0; j < 12; j++) s += kg[i * 12 + j] * u[j];
            expect(Math.abs(s)).toBeLessThan(1e-9 * scale * Math.max(1, L));
          }
        }
      },
    ), { numRuns: 60 });
  });

  it('K·u − f ≈ 0 for the assembled system', () => {
    const sys = buildSystem(frame([3, 4, 5, 6, 7, 8]), 16, {});
    const X = factoriseDense(sys.pat.K).solve(sys.F, sys.nCases);
    for (let c = 0; c < sys.nCases; c++) {
      const Ku = symmetricTimes(sys.pat.K, X, c * sys.nEq);
      let r = 0, f = 0;
      for (let i = 0; i < sys.nEq; i++) { r = Math.max(r, Math.abs(Ku[i] - sys.F[c * sys.nEq + i])); f = Math.max(f, Math.abs(sys.F[c * sys.nEq + i])); }
      // direct solver on a well-conditioned system: residual ≤ 1e-9 of the largest load (common practice)
      expect(r).toBeLessThan(1e-9 * f);
    }
  });

  it('reactions balance the applied loads (forces and moments about the origin) for any loads', () => {
    fc.assert(fc.property(loadsArb, (loads) => {
      const r = analyse(frame(loads));
      // statics: Σ loads + Σ reactions = 0 per loading; tolerance 1e-9 relative
      for (const eqm of r.diagnostics.equilibrium) expect(eqm.residual).toBeLessThan(1e-9);
      const a = r.diagnostics.equilibrium[0].applied;
      expect(Math.abs(a[2])).toBeGreaterThan(0); // self weight + gravity load are counted
    }), { numRuns: 8 });
  });

  it('results do not depend on the order of nodes and members', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 1e9 }), (seed) => {
      const m1 = frame([3, 4, 5, 6, 7, 8]);
      const m2 = frame([3, 4, 5, 6, 7, 8]);
      let s = seed;
      const rnd = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
      const shuffle = <T>(a: T[]) => { for (let i = a.length - 1; i > 0; i--) { const j = Math.floor(rnd() * (i + 1)); [a[i], a[j]] = [a[j], a[i]]; } };
      shuffle(m2.nodes);
      shuffle(m2.members);
      const r1 = analyse(m1), r2 = analyse(m2);
      // same structure → same numbers (tolerance rel 1e-8 of the largest value)
      const u1 = r1.displacements(2), u2 = r2.displacements(2);
      const umax = Math.max(...u1.map(Math.abs));
      m1.nodes.forEach((n, i) => {
        const j = m2.nodes.findIndex((x) => x.id === n.id);
        for (let k = 0; k < 6; k++) expect(Math.abs(u1[i * 6 + k] - u2[j * 6 + k])).toBeLessThan(1e-7 * umax);
      });
      m1.members.forEach((mb, i) => {
        const j = m2.members.findIndex((x) => x.id === mb.id);
        const f1 = r1.memberForces(i, 2), f2 = r2.memberForces(j, 2);
        for (let q = 0; q < f1.x.length; q++) expect(Math.abs(f1.M_major[q] - f2.M_major[q])).toBeLessThan(1e-6 * (1 + Math.abs(f1.M_major[q])));
      });
    }), { numRuns: 4 });
  });

  it('a rigid rotation of the whole model about the vertical axis rotates displacements and keeps member forces', () => {
    fc.assert(fc.property(fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), (phi) => {
      const m1 = frame([3, 4, 5, 6, 7, 8]);
      const m2 = frame([3, 4, 5, 6, 7, 8]);
      const c = Math.cos(phi), s = Math.sin(phi);
      for (const n of m2.nodes) { const x = n.x, y = n.y; n.x = c * x - s * y; n.y = s * x + c * y; }
      for (const nl of m2.nodeLoads) {
        const v = nl.values;
        [v[0], v[1]] = [c * v[0] - s * v[1], s * v[0] + c * v[1]];
        [v[3], v[4]] = [c * v[3] - s * v[4], s * v[3] + c * v[4]];
      }
      const ra = analyse(m1), rb = analyse(m2);
      // Displacements rotate by φ (tolerance 1e-7 of the largest). Member forces: a horizontal or inclined
      // member keeps its local axes (they follow "up"); a vertical member's local z is always global +X
      // (conventions.md), so compare what does not depend on the roll of its axes: N, T and the resultant
      // bending moment √(M_major² + M_minor²). Tolerance 1e-7 of the member's largest value.
      const ua = ra.displacements(2), ub = rb.displacements(2);
      const umax = Math.max(...ua.map(Math.abs));
      for (let i = 0; i < m1.nodes.length; i++) {
        for (const o of [0, 3]) {
          const x = ua[i * 6 + o], y = ua[i * 6 + o + 1];
          expect(Math.abs(c * x - s * y - ub[i * 6 + o])).toBeLessThan(1e-7 * umax);
          expect(Math.abs(s * x + c * y - ub[i * 6 + o + 1])).toBeLessThan(1e-7 * umax);
          expect(Math.abs(ua[i * 6 + o + 2] - ub[i * 6 + o + 2])).toBeLessThan(1e-7 * umax);
        }
      }
      for (let i = 0; i < m1.members.length; i++) {
        const fa = ra.memberForces(i, 2), fb = rb.memberForces(i, 2);
        const res = (f: typeof fa, q: number) => Math.hypot(f.M_major[q], f.M_minor[q]);
        const scale = 1 + Math.max(...fa.N.map(Math.abs), ...fa.M_major.map(Math.abs), ...fa.M_minor.map(Math.abs), ...fa.T.map(Math.abs));
        for (let q = 0; q < fa.x.length; q++) {
          expect(Math.abs(fa.N[q] - fb.N[q])).toBeLessThan(1e-7 * scale);
          expect(Math.abs(fa.T[q] - fb.T[q])).toBeLessThan(1e-7 * scale);
          expect(Math.abs(res(fa, q) - res(fb, q))).toBeLessThan(1e-7 * scale);
        }
      }
    }), { numRuns: 5 });
  });
  it('fixed-end forces of a full-length linear load equal those of the same load in two pieces', () => {
    fc.assert(fc.property(
      fc.record({
        L: fc.double({ min: 0.5, max: 12, noNaN: true }), rel: fc.integer({ min: 0, max: 15 }), truss: fc.boolean(),
        q: fc.array(fc.double({ min: -5e3, max: 5e3, noNaN: true }), { minLength: 3, maxLength: 3 }),
        q2: fc.array(fc.double({ min: -5e3, max: 5e3, noNaN: true }), { minLength: 3, maxLength: 3 }),
      }),
      ({ L, q, q2, rel, truss }) => {
        const p = { EA: 2e9, EIy: 2e7, EIz: 8e6, GJ: 3e6 };
        const r = { startMajor: (rel & 1) > 0, startMinor: (rel & 2) > 0, endMajor: (rel & 4) > 0, endMinor: (rel & 8) > 0 };
        const mid = q.map((v, i) => (v + q2[i]) / 2);
        const one = { dist: [0, L, ...q, ...q2], point: [], moment: [], eps: 0, grad: 0 };
        const two = { dist: [0, L / 2, ...q, ...mid, L / 2, L, ...mid, ...q2], point: [], moment: [], eps: 0, grad: 0 };
        const a = fixedEndForces(one, L, p, 0.3, truss, r, new Float64Array(12));
        const b = fixedEndForces(two, L, p, 0.3, truss, r, new Float64Array(12));
        // the closed form (uniform) and the Gauss path (pieces) agree; tolerance 1e-9 of qL²
        const scale = 1 + Math.max(...q.map(Math.abs), ...q2.map(Math.abs)) * L * L;
        for (let i = 0; i < 12; i++) expect(Math.abs(a[i] - b[i])).toBeLessThan(1e-9 * scale);
      },
    ), { numRuns: 50 });
  });
});

describe('local axes of a member leaning less than the vertical tolerance', () => {
  it('are orthonormal (a rotation), with local z as close to global +X as the member allows', () => {
    // conventions.md: local x within 0.001 rad of vertical → local z = global +X; here the member
    // leans 1e-8 rad, so z must be +X made perpendicular to x. Orthonormal to 1e-15 (rounding).
    const R = localAxes([0, 0, 0], [1.0416666666666669e-9, 0, 0.10000000000000002], 0, 'Z');
    const row = (i: number) => [R[3 * i], R[3 * i + 1], R[3 * i + 2]];
    const dot = (a: number[], b: number[]) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(dot(row(i), row(j)) - (i === j ? 1 : 0))).toBeLessThan(1e-15);
    expect(row(2)[0]).toBeGreaterThan(1 - 1e-15);
  });
});
