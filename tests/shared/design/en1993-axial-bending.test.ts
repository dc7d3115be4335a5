/**
 * EN 1993-1-1 6.2.9.1: the reported ratio under bending about one axis is MEd/MN,Rd
 * (6.31), not the (6.41) left-hand side with α = 2 applied to one axis (which would give
 * its square, e.g. 0.741 for 0.861). Hand calculations with the section tables' HE 200 B
 * (EN 10365, from memory). γM0 = 1.0. Tolerance rtol 1e-6 on the formula worked by hand
 * (the code's float arithmetic), 5e-4 on the rounded numbers written in the titles.
 */
import { describe, expect, it } from 'vitest';
import { designGeometry } from '../../../shared/design/geometry.js';
import type { EnContext } from '../../../shared/design/en1993/context.js';
import { enPlan } from '../../../shared/design/en1993/member.js';
import { axialBendingPlan, axialBendingRatio } from '../../../shared/design/en1993/axial-bending.js';
import { close, HEB200, MPA, stations } from './helpers.js';

const S235: EnContext = { E: 210e9, G: 80.77e9, fy: 235 * MPA, fu: 360 * MPA, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, hotFinished: false };
const L = 3;
const setup = { id: 'C', length: L, truss: false, LcMajor: L, LcMinor: L, Lb: L, cantilever: false };

// HE 200 B, S235, class 1 in compression and bending (flange c/t = 5.17 ≤ 9ε, web c/t = 14.9 ≤ 33ε)
const A = 7808e-6, b = 0.2, tf = 0.015, Wpl = 642.5e-6;
const NplRd = A * 235e6; // 1834.88 kN (6.6)
const MplRd = Wpl * 235e6; // 150.99 kNm (6.13)
const a = Math.min((A - 2 * b * tf) / A, 0.5); // 0.2316 (6.2.9.1(5))

describe('6.2.9.1 H-section under N + My (6.36)', () => {
  it('HE 200 B S235, NEd = 500 kN compression, My,Ed = 80 kNm: n = 0.2725, MN,y,Rd = Mpl,y,Rd(1 − n)/(1 − 0.5a) = 124.23 kNm, ratio = 80/124.23 = 0.6440', () => {
    const NEd = 500e3, MyEd = 80e3;
    const n = NEd / NplRd;
    const MNy = Math.min(MplRd, (MplRd * (1 - n)) / (1 - 0.5 * a)); // (6.36)
    const plan = enPlan(designGeometry(HEB200()), S235, setup);
    const recs = plan.records(stations(L, { N: () => -NEd, M_major: () => MyEd }), 'C1');
    const r = recs.find((q) => q?.clause === '6.2.9.1')!;
    expect(r).toBeDefined();
    expect(close(r.ratio!, MyEd / MNy, 1e-6)).toBe(true);
    expect(close(r.ratio!, 0.6440, 5e-4)).toBe(true);
    // demand / capacity in moment units: My,Ed over MN,y,Rd
    expect(r.quantity).toBe('moment');
    expect(close(r.capacity!, MNy, 1e-6)).toBe(true);
    expect(close(r.capacity! / 1e3, 124.23, 5e-4)).toBe(true);
    expect(r.demand).toBeCloseTo(MyEd, 6);
    expect(r.note).toMatch(/My,Ed\/MN,y,Rd/);
    expect(r.inputs.find((i) => i.symbol === 'MN,y,Rd')).toBeDefined();
  });

  it('uniaxial ratio is not squared: a station at 0.861 of MN,y,Rd reports 0.861, not 0.741', () => {
    const p = axialBendingPlan(designGeometry(HEB200()), 1, NplRd, MplRd, 305.8e-6 * 235e6);
    const n = 0.2;
    const MNy = Math.min(MplRd, (MplRd * (1 - n)) / (1 - 0.5 * a)); // (6.36)
    expect(close(axialBendingRatio(p, n * NplRd, 0.861 * MNy, 0), 0.861, 1e-9)).toBe(true);
  });

  it('minor-axis bending alone with N reports Mz,Ed/MN,z,Rd (6.37/6.38), not its power β = 5n', () => {
    const MplZ = 305.8e-6 * 235e6;
    const p = axialBendingPlan(designGeometry(HEB200()), 1, NplRd, MplRd, MplZ);
    const n = 0.4; // > a: MN,z,Rd = Mpl,z,Rd[1 − ((n − a)/(1 − a))²] (6.38)
    const MNz = MplZ * (1 - ((n - a) / (1 - a)) ** 2);
    expect(close(axialBendingRatio(p, n * NplRd, 0, 0.5 * MNz), 0.5, 1e-9)).toBe(true);
  });

  it('biaxial bending reports the (6.41) criterion (or a larger single-axis ratio) and the record says so', () => {
    const MplZ = 305.8e-6 * 235e6;
    const plan = enPlan(designGeometry(HEB200()), S235, setup);
    const recs = plan.records(stations(L, { N: () => -300e3, M_major: () => 80e3, M_minor: () => 40e3 }), 'C1');
    const r = recs.find((q) => q?.clause === '6.2.9.1')!;
    const n = 300e3 / NplRd;
    const MNy = Math.min(MplRd, (MplRd * (1 - n)) / (1 - 0.5 * a));
    const MNz = n <= a ? MplZ : MplZ * (1 - ((n - a) / (1 - a)) ** 2);
    const lhs = (80e3 / MNy) ** 2 + (40e3 / MNz) ** Math.max(1, 5 * n); // (6.41)
    expect(close(r.ratio!, Math.max(lhs, 80e3 / MNy, 40e3 / MNz), 1e-6)).toBe(true);
    expect(r.note).toMatch(/6\.41/);
    expect(r.quantity).toBe('ratio');
  });
});
