/**
 * checks.md: "ratio = demand / capacity, linear in the load: doubling every load doubles
 * it". Property test (fast-check) over every check of both codes' member plans, for
 * I-shapes, a channel, rectangular and round hollow sections and a solid bar under random
 * force fields: doubling every force doubles every ratio, |r(2F) − 2·r(F)| ≤ 1e-9·max(1,
 * |r(2F)|, |2r(F)|) (closed form: each ratio is demand / a capacity that does not depend on
 * the load). "not checked" (NaN) and "not applicable" (−1) stay as they are.
 *
 * Stated exceptions — the code itself makes the resistance depend on a co-existing force
 * or writes the criterion with exponents; the record says which form is reported:
 *  - EN 6.2.8: M_V,Rd is reduced when VEd > 0.5·Vpl,Rd (tested where VEd ≤ 0.5·Vpl,Rd at 2F);
 *  - EN 6.2.9.1: MN,Rd depends on n = NEd/Npl,Rd (tested with N = 0; with N held fixed,
 *    doubling a single-axis moment doubles the ratio MEd/MN,Rd); (6.41) biaxial exponents;
 *  - EN 6.3.3: the k factors of Annex B depend on NEd;
 *  - EN 6.2.7: Vpl,T,Rd is reduced by the torsional shear stress (6.28);
 *  - AISC H1-1a/H1-1b: each is linear; doubling across Pr/Pc = 0.2 changes the equation
 *    (tested where both loadings stay on one side);
 *  - torsion present / absent (a threshold, not a ratio) and the slenderness warning (no load).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designGeometry } from '../../../shared/design/geometry.js';
import { aiscContext } from '../../../shared/design/aisc360/context.js';
import { aiscPlan } from '../../../shared/design/aisc360/member.js';
import { enPlan } from '../../../shared/design/en1993/member.js';
import type { EnContext } from '../../../shared/design/en1993/context.js';
import { shearResistance } from '../../../shared/design/en1993/shear.js';
import { axialBendingLast, axialBendingPlan, axialBendingRatio } from '../../../shared/design/en1993/axial-bending.js';
import { deflectionRecord } from '../../../shared/design/deflection.js';
import type { MemberPlan } from '../../../shared/design/plan.js';
import type { StationForces } from '../../../shared/engine/types.js';
import { catalogueSection } from '../../../shared/sections/index.js';
import { sectionProperties } from '../../../shared/sections/properties.js';
import type { Section, SectionDims, ShapeKind } from '../../../shared/model/types.js';
import { HEA300, HEB200, IPE300, KSI, MPA, section, W18X50 } from './helpers.js';

const L = 5;
const dimensioned = (id: string, shape: ShapeKind, dims: SectionDims): Section => ({ id, shape, dims, props: sectionProperties(shape, dims), given: [] });
const SECTIONS: Section[] = [
  W18X50(), IPE300(), HEB200(), HEA300(),
  dimensioned('C200', 'channel', { d: 0.2, bf: 0.075, tf: 0.0115, tw: 0.0085 }),
  catalogueSection('HSS8X4X3/8')!,
  catalogueSection('HSS8.625X0.322')!,
  dimensioned('RHS', 'rhs', { h: 0.2, b: 0.1, t: 0.008 }),
  dimensioned('CHS', 'chs', { D: 0.1683, t: 0.0071 }),
  dimensioned('BAR', 'rect', { h: 0.1, b: 0.03 }),
  // welded I 1000×300×15×6: class 4 web (EN effective section, AISC slender web F5 / E7)
  section('i', { d: 1000, bf: 300, tf: 15, tw: 6 }, { A: 14820, I_major: 2.6395115e9, I_minor: 6.752e7, J: 7.4e5, Cw: 1.6e13, S_major: 5.279023e6, S_minor: 4.5e5, Z_major: 6.0e6, Z_minor: 6.9e5 }, 0.001, 'W1000'),
];
const aisc = aiscContext('lrfd', 29000 * KSI, 11200 * KSI, 50 * KSI, 65 * KSI);
const en: EnContext = { E: 210e9, G: 80.77e9, fy: 355 * MPA, fu: 490 * MPA, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, hotFinished: false };

interface Field { n0: number; n1: number; m0: number; m1: number; m2: number; mz0: number; mz1: number; v0: number; vz: number; t: number }

/** Station forces of a field; factor scales every force (not x). */
function forces(f: Field, factor: number, n = 11): StationForces {
  const x = Float64Array.from({ length: n }, (_, i) => (L * i) / (n - 1));
  const map = (g: (x: number) => number) => Float64Array.from(x, (v) => factor * g(v));
  return {
    x, N: map((s) => f.n0 + f.n1 * s), V_major: map((s) => f.v0 + f.m1 + 2 * f.m2 * s), V_minor: map(() => f.vz), T: map(() => f.t),
    M_major: map((s) => f.m0 + f.m1 * s + f.m2 * s * s), M_minor: map((s) => f.mz0 + f.mz1 * s),
    d_major: new Float64Array(n), d_minor: new Float64Array(n),
  };
}

// values far below the forces of the field (denormals such as 5e-324 included) are numerical noise that
// shared/design/noise.ts treats as zero at one scale and perhaps not at the other: draw them as 0
const force = (scale: number) => fc.oneof(fc.constant(0), fc.double({ min: -scale, max: scale, noNaN: true }).map((v) => (Math.abs(v) < 1e-6 * scale ? 0 : v)));
const field = (withT: boolean): fc.Arbitrary<Field> => fc.record({
  n0: force(800e3), n1: force(50e3), m0: force(100e3), m1: force(40e3), m2: force(10e3), mz0: force(20e3), mz1: force(5e3), v0: force(50e3), vz: force(20e3),
  t: withT ? force(5e3) : fc.constant(0),
});

function closeTo(a: number, b: number): boolean {
  if (Number.isNaN(a) || Number.isNaN(b)) return Number.isNaN(a) && Number.isNaN(b);
  if (!Number.isFinite(a) || !Number.isFinite(b)) return a === b;
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
}

function ratios(plan: MemberPlan, sf: StationForces): Float64Array {
  const r = new Float64Array(plan.slots.length);
  plan.evaluate(sf, r, new Float64Array(plan.slots.length));
  return r;
}

/** Why doubling may not double this slot's ratio for this field (a stated exception), or null. */
function exception(code: 'aisc' | 'en', plan: MemberPlan, s: number, f: Field, sec: Section): string | null {
  const key = plan.slots[s].key;
  const f1 = forces(f, 1), f2 = forces(f, 2);
  if (key === 'torsion' || key === '6.2.7') return 'torsion: threshold and 6.28';
  if (code === 'en') {
    if (key === '6.3.3') return 'Annex B k factors depend on NEd';
    if (key === '6.2.9') {
      const rec = plan.records(f1, 'C', undefined)[s];
      const linear = !rec || rec.status === 'not checked' || rec.clause !== '6.2.9.1';
      if (linear) return null;
      if (f1.N.some((v) => v !== 0)) return 'MN,Rd depends on n (6.36–6.40)';
      if (f1.M_major.some((v, i) => v !== 0 && f1.M_minor[i] !== 0)) return '(6.41) biaxial exponents';
      return null;
    }
    if (key === '6.2.5 major' || key === '6.2.5 minor') {
      const g = designGeometry(sec);
      const major = key === '6.2.5 major';
      const Vpl = shearResistance(g, en, major ? 'major' : 'minor').capacity;
      const V = f2[major ? 'V_major' : 'V_minor'];
      return Vpl === Vpl && V.some((v) => Math.abs(v) > 0.5 * Vpl) ? '6.2.8 shear reduction' : null;
    }
  }
  if (code === 'aisc' && key === 'H1') {
    const rec = plan.records(f1, 'C', undefined)[s];
    if (!rec || rec.status === 'not checked') return null;
    // which equation holds at every station for F and 2F
    const Pc = Number(rec.inputs.find((i) => i.symbol === 'Pc')!.value);
    const side = (sf: StationForces) => new Set(Array.from(sf.N, (v) => Math.abs(v) / Pc >= 0.2));
    const a = side(f1), b = side(f2);
    return a.size === 1 && b.size === 1 && [...a][0] === [...b][0] ? null : 'H1-1a/H1-1b switch at Pr/Pc = 0.2';
  }
  return null;
}

function check(code: 'aisc' | 'en', sec: Section, f: Field, Lb: number): void {
  const g = designGeometry(sec);
  const setup = { id: 'P', length: L, truss: false, LcMajor: L, LcMinor: L, Lb, cantilever: false };
  const plan = code === 'aisc' ? aiscPlan(g, aisc, setup) : enPlan(g, en, setup);
  const r1 = ratios(plan, forces(f, 1));
  const r2 = ratios(plan, forces(f, 2));
  for (let s = 0; s < r1.length; s++) {
    if (exception(code, plan, s, f, sec)) continue;
    const expected = r1[s] < 0 || Number.isNaN(r1[s]) ? r1[s] : 2 * r1[s];
    expect(closeTo(r2[s], expected), `${code} ${sec.id} slot ${plan.slots[s].key}: r(F) = ${r1[s]}, r(2F) = ${r2[s]}`).toBe(true);
  }
}

describe('doubling every force doubles every ratio (checks.md), stated exceptions aside', () => {
  for (const sec of SECTIONS) {
    it(`AISC 360-22 plan, ${sec.id}`, () => {
      fc.assert(fc.property(field(false), fc.constantFrom(L, L / 2, 0), (f, Lb) => { check('aisc', sec, f, Lb); }), { numRuns: 60 });
    });
    it(`EN 1993-1-1 plan, ${sec.id}`, () => {
      fc.assert(fc.property(field(true), fc.constantFrom(L, L / 2, 0), (f, Lb) => { check('en', sec, f, Lb); }), { numRuns: 60 });
    });
  }

  it('deflection: δ/(L/N) doubles with δ', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 0.1, noNaN: true }), (d) => {
      const a = deflectionRecord('M', 'en1993-1-1', 'S', d, 1, 6, 300, false).ratio!;
      const b = deflectionRecord('M', 'en1993-1-1', 'S', 2 * d, 1, 6, 300, false).ratio!;
      expect(closeTo(b, 2 * a)).toBe(true);
    }));
  });

  it('EN 6.2.9.1 exception, what still holds: with NEd fixed, doubling a single-axis moment doubles MEd/MN,Rd (MN,Rd depends on n only)', () => {
    const g = designGeometry(HEB200());
    const NRd = g.A * en.fy;
    const p = axialBendingPlan(g, 1, NRd, g.Zmaj * en.fy, g.Zmin * en.fy);
    fc.assert(fc.property(fc.double({ min: 0, max: 0.95, noNaN: true }), fc.double({ min: 0.001, max: 1, noNaN: true }), fc.boolean(), (n, m, major) => {
      const M = m * (major ? g.Zmaj : g.Zmin) * en.fy * 0.5;
      const r1 = major ? axialBendingRatio(p, n * NRd, M, 0) : axialBendingRatio(p, n * NRd, 0, M);
      expect(axialBendingLast.form).toBe(major ? 'major' : 'minor');
      const r2 = major ? axialBendingRatio(p, n * NRd, 2 * M, 0) : axialBendingRatio(p, n * NRd, 0, 2 * M);
      expect(closeTo(r2, 2 * r1)).toBe(true);
    }));
  });
});
