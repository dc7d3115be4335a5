import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import type { AnalysisResult } from '../../../shared/engine/types.js';
import { ModelBuilder } from '../engine/builders.js';
import { maximise, maximiseSmooth } from '../../../shared/moving/axles.js';
import { addMoving, extreme, loadingIndex, simpleSpan } from './helpers.js';

// Forces under the axles (shared/moving/axles.ts): the true extremes between stations.
// Loads act along −Z (Z up); relative tolerance |a − b| ≤ rtol·|b| as stated per expectation.
const kN = 1e3;
// A three-axle vehicle of our own: A1 50 kN leading, A2 150 kN at 4.3 m, A3 150 kN at 9.1 m.
const P1 = 50 * kN, P2 = 150 * kN, P3 = 150 * kN, o2 = 4.3, o3 = 9.1;
const vehicle = [{ offset: 0, load: P1 }, { offset: o2, load: P2 }, { offset: o3, load: P3 }];

/** Path position of axle `i` for the vehicle position reported. */
function axleAt(at: { direction: 'forward' | 'backward'; lead: number }, offset: number): number {
  return at.direction === 'forward' ? at.lead - offset : at.lead + offset;
}

/** Moment at x of a simple span L under point loads (statics: R_A = Σ P(L − a)/L). */
function simpleMoment(L: number, x: number, loads: { a: number; P: number }[]): number {
  let m = 0;
  for (const { a, P } of loads) if (a >= 0 && a <= L) m += a <= x ? (P * a * (L - x)) / L : (P * x * (L - a)) / L;
  return m;
}

/** Largest moment under any axle over vehicle positions on a grid of `h` (forward travel). */
function scanUnderAxles(L: number, h: number, moment: (x: number, loads: { a: number; P: number }[]) => number): number {
  let best = -Infinity;
  for (let lead = 0; lead <= L + o3; lead += h) {
    const loads = vehicle.map((v) => ({ a: lead - v.offset, P: v.load }));
    for (const { a } of loads) if (a > 0 && a < L) best = Math.max(best, moment(a, loads));
  }
  return best;
}

function withStations(b: ModelBuilder, n: number): ModelBuilder {
  b.model.settings.stations = n;
  return b;
}

describe('moving loads: the absolute maximum under an axle, not only at stations', () => {
  it('three-axle vehicle on a 20 m simple span: the classic rule, exact to 1e-9 (the stations alone are 0.7 % low)', () => {
    const L = 20;
    // ONE member of 20 m: with 11 stations they are 2 m apart and the critical axle stands between two of them
    const { b, members } = simpleSpan(L, 1);
    const m = addMoving(withStations(b, 11), vehicle, members).build();
    const r = analyse(m);
    // Classic rule for the absolute maximum moment of a simple span under a train of
    // concentrated loads (e.g. Hibbeler, Structural Analysis, "absolute maximum moment",
    // from memory): the maximum occurs under the axle nearest the resultant when midspan
    // bisects the distance between that axle and the resultant. Here R = 350 kN acts
    // x̄ = (P2·o2 + P3·o3)/R = 5.742857 m behind A1, so the critical axle is A2 with
    // e = x̄ − o2 = 1.442857 m. Travelling towards B, A2 stands at x_c = L/2 + e/2 and the
    // resultant at L/2 − e/2; with R_B = R(L/2 − e/2)/L and A1 (4.3 m ahead of A2) between A2
    // and B: M = R_B(L − x_c) − P1·o2 = R(L/2 − e/2)²/L − P1·o2 = 1291.608 kNm.
    // All three axles are on the span then (A1 at 15.02 m, A3 at 5.92 m).
    const R = P1 + P2 + P3, xbar = (P2 * o2 + P3 * o3) / R, e = xbar - o2;
    const xc = L / 2 + e / 2;
    const exact = (R * (L / 2 - e / 2) ** 2) / L - P1 * o2;
    expect(xc + o2).toBeLessThanOrEqual(L);
    expect(xc - (o3 - o2)).toBeGreaterThanOrEqual(0);
    // cross-check of the rule (not of the program): a 1 mm scan of positions by statics never
    // exceeds it and comes within the grid's loss (R·h²/L = 1.75e-2 N·m)
    const scan = scanUnderAxles(L, 1e-3, (x, loads) => simpleMoment(L, x, loads));
    expect(scan).toBeLessThanOrEqual(exact * (1 + 1e-12));
    expect(exact - scan).toBeLessThan((R * 1e-6) / L + 1e-9 * exact);

    const ext = r.moving!.memberExtremes(0, 0).M_major.max;
    expect(Math.abs(ext.value - exact) / exact).toBeLessThan(1e-9);
    // the critical position is not a regular one (0.1 m steps, axles on nodes and stations): it was found by refinement
    expect(r.moving!.diagnostics.refined).toBeGreaterThan(0);
    // where: A2 at x_c, or at L − x_c travelling the other way (tolerance 1e-6 m: the position
    // is found by a search on values, which resolves it to ~1e-8 of the lane)
    expect([xc, L - xc].some((x) => Math.abs(ext.x - x) < 1e-6)).toBe(true);
    expect(Math.abs(axleAt(ext.at!, o2) - ext.x)).toBeLessThan(1e-6);
    expect(Math.abs(ext.at!.lead - (ext.at!.direction === 'forward' ? xc + o2 : L - xc - o2))).toBeLessThan(1e-6);

    // the design code reads stations: the envelope loading carries the value at a station at x
    const lmax = loadingIndex(r, 'LM', 'max');
    const f = r.memberForces(0, lmax);
    expect(Math.abs(f.M_major[ext.station] - exact) / exact).toBeLessThan(1e-9);
    expect(f.x[ext.station]).toBe(ext.x);
    expect(r.moving!.memberPosition(0, lmax, 'M_major', ext.station)).toEqual(ext.at);
    // what the stations alone gave (the maximum before this change): the best station is
    // midspan with A2 on it, M = R_B·L/2 − P1·o2 with R_B = R(L/2 + o2 − x̄)/L — 1282.5 kNm
    // by statics, 0.705 % below the true maximum
    const mid = Array.from(f.x).findIndex((x) => Math.abs(x - L / 2) < 1e-9);
    const atStations = ((R * (L / 2 + o2 - xbar)) / L) * (L / 2) - P1 * o2;
    expect(Math.abs(f.M_major[mid] - atStations) / atStations).toBeLessThan(1e-9);
    expect(1 - atStations / exact).toBeGreaterThan(0.007);
  });

  it('finds the same maximum whatever the step (positions refined between the regular ones)', () => {
    const L = 20;
    const R = P1 + P2 + P3, e = (P2 * o2 + P3 * o3) / R - o2;
    const exact = (R * (L / 2 - e / 2) ** 2) / L - P1 * o2; // classic rule, as above
    for (const step of [1.7, 0.37]) {
      const { b, members } = simpleSpan(L, 1);
      const r = analyse(addMoving(withStations(b, 11), vehicle, members, { step }).build());
      const ext = r.moving!.memberExtremes(0, 0).M_major.max;
      expect(Math.abs(ext.value - exact) / exact).toBeLessThan(1e-9);
    }
  });

  it('a single heavy axle governs a short span: M = P·L/4 at midspan, the other axles off the span', () => {
    const L = 4;
    // 10 stations: midspan is not one of them
    const { b, members } = simpleSpan(L, 1);
    const m = addMoving(withStations(b, 10), vehicle, members).build();
    const r = analyse(m);
    // the axles are 4.3 m and 4.8 m apart, more than the span: one axle at a time, the
    // heaviest (150 kN) at midspan gives M = P·L/4 = 150 kNm (statics)
    const exact = (P2 * L) / 4;
    const ext = r.moving!.memberExtremes(0, 0).M_major.max;
    expect(Math.abs(ext.value - exact) / exact).toBeLessThan(1e-9);
    expect(Math.abs(ext.x - L / 2)).toBeLessThan(1e-6);
    // a 150 kN axle stands there; every other axle is off the span
    const on = vehicle.map((v) => axleAt(ext.at!, v.offset)).filter((s) => s >= 0 && s <= L);
    expect(on).toHaveLength(1);
    expect([o2, o3].some((o) => Math.abs(axleAt(ext.at!, o) - L / 2) < 1e-6)).toBe(true);
    // the largest over the stations of the envelope loading is the same value (design reads it)
    const best = extreme(m, r, loadingIndex(r, 'LM', 'max'), 'M_major', 1);
    expect(Math.abs(best.value - exact) / exact).toBeLessThan(1e-9);
    // before: the stations nearest midspan (16/9 m, 20/9 m) gave P·x(L − x)/L = 148.1 kNm, 1.2 % low
    const f = r.memberForces(0, loadingIndex(r, 'LM', 'max'));
    const k = Array.from(f.x).findIndex((x) => Math.abs(x - (4 * L) / 9) < 1e-9);
    expect(Math.abs(f.M_major[k] - (P2 * (4 * L / 9) * (5 * L / 9)) / L) / exact).toBeLessThan(1e-9);
  });

  it('two-span continuous beam: the sagging maximum under an axle matches a fine scan by the three-moment equation', () => {
    const L = 8;
    const b = new ModelBuilder({ planeNormal: 'Y' })
      .node('A', 0, 0, 0).node('B', L, 0, 0).node('C', 2 * L, 0, 0)
      .support('A', 'ux uz').support('B', 'uz').support('C', 'uz')
      .member('S1', 'A', 'B').member('S2', 'B', 'C');
    const m = addMoving(withStations(b, 11), vehicle, ['S1', 'S2'], { step: 0.25 }).build();
    const r = analyse(m);
    // span 1 moment at x for loads at path positions a: simple-span moment plus (x/L)·M_B,
    // M_B = −Σ P·x'(L² − x'²)/(4L²) with x' the distance from the end support (three-moment
    // equation, M_A = M_C = 0, equal spans)
    const span1 = (x: number, loads: { a: number; P: number }[]) => {
      let MB = 0;
      for (const { a, P } of loads) {
        if (a < 0 || a > 2 * L) continue;
        const xp = a <= L ? a : 2 * L - a;
        MB -= (P * xp * (L * L - xp * xp)) / (4 * L * L);
      }
      return simpleMoment(L, x, loads) + (x / L) * MB;
    };
    let scan = -Infinity;
    for (let lead = 0; lead <= 2 * L + o3; lead += 1e-3) {
      const loads = vehicle.map((v) => ({ a: lead - v.offset, P: v.load }));
      for (const { a } of loads) if (a > 0 && a < L) scan = Math.max(scan, span1(a, loads));
    }
    const ext = r.moving!.memberExtremes(0, 0).M_major.max;
    // the program's maximum is a true value (never above the continuous optimum, which the
    // 1 mm scan approaches from below within ~R·h²/L) and at least the scan's
    expect(ext.value).toBeGreaterThanOrEqual(scan * (1 - 1e-9));
    expect(ext.value - scan).toBeLessThan(1e-6 * scan);
    // the same moment computed at that position by the closed form (tolerance 1e-9 relative)
    const loads = vehicle.map((v) => ({ a: axleAt(ext.at!, v.offset), P: v.load }));
    expect(Math.abs(span1(ext.x, loads) - ext.value) / ext.value).toBeLessThan(1e-9);
    // and it is the largest of every station of the envelope
    const f = r.memberForces(0, loadingIndex(r, 'LM', 'max'));
    for (let i = 0; i < f.x.length; i++) expect(f.M_major[i]).toBeLessThanOrEqual(ext.value * (1 + 1e-12));
  });

  it('reports each force with its x and vehicle position; deflections stay at stations', () => {
    const { b, members } = simpleSpan(20, 1);
    const m = addMoving(b, vehicle, members).build();
    const r: AnalysisResult = analyse(m);
    const ex = r.moving!.memberExtremes(0, 0);
    expect(Object.keys(ex)).toEqual(['N', 'V_major', 'V_minor', 'T', 'M_major', 'M_minor']);
    // shear of a simple span: largest with the train's heaviest end over a support, R = 350 kN
    // in total; the shear just right of A is R_A ≤ R (statics)
    expect(ex.V_major.max.value).toBeLessThanOrEqual(350 * kN * (1 + 1e-12));
    expect(ex.V_major.max.at).not.toBeNull();
    // nothing in the plane's normal direction (tolerance: 1e-9 of the vehicle's weight)
    expect(Math.abs(ex.M_minor.max.value)).toBeLessThan(1e-9 * 350 * kN);
    expect(r.moving!.diagnostics.extraStations).toBeGreaterThan(0);
  });
});

describe('one-dimensional maximisers used between vehicle positions', () => {
  it('parabolic interpolation finds the vertex of a parabola in one step (closed form t* = 0.37)', () => {
    let calls = 0;
    const f = (t: number) => { calls++; return 5 - 3 * (t - 0.37) ** 2; };
    const g = maximiseSmooth(f, [0, 1e-7, 1], [f(0), f(1e-7), f(1)], 1e-12);
    // tolerance: 1e-9 in t (the parabola's own vertex), 1e-15 relative in value
    expect(Math.abs(g.t - 0.37)).toBeLessThan(1e-9);
    expect(Math.abs(g.v - 5) / 5).toBeLessThan(1e-15);
    expect(calls).toBeLessThan(8);
  });

  it("Brent's method finds the maximum of a quartic and of a kinked function", () => {
    // f = −(t − 0.3)⁴ + 2: maximum 2 at t = 0.3 (closed form); tolerance 1e-12 in value
    expect(Math.abs(maximise((t) => 2 - (t - 0.3) ** 4, 0, 1, 1e-9).v - 2)).toBeLessThan(1e-12);
    // a roof with its ridge at t = 0.6: maximum 1 (closed form); tolerance 1e-8 (the bracket)
    const roof = maximise((t) => 1 - Math.abs(t - 0.6), 0, 1, 1e-9);
    expect(Math.abs(roof.t - 0.6)).toBeLessThan(1e-8);
  });
});
