import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { nodeIndexOf } from '../engine/builders.js';
import { addMoving, extreme, loadingIndex, simpleSpan } from './helpers.js';

// Simply supported span L = 20 m made of 20 frame members of 1 m (nodes every metre, stations
// every 0.1 m). Loads act along −Z (Z up). Tolerances: relative 1e-9 (the engine is exact for
// point loads; the vehicle positions include every position where an axle is on a node/station).
const L = 20, kN = 1e3;

describe('simple span under a moving axle train', () => {
  // Train A: two equal axles P = 100 kN, spacing d = 4 m.
  const P = 100 * kN, d = 4;
  const trainA = [{ offset: 0, load: P }, { offset: d, load: P }];

  it('maximum midspan moment: one axle at midspan, the other at d from it', () => {
    const { b, members } = simpleSpan(L, 20);
    const m = addMoving(b, trainA, members, { step: 0.5 }).build();
    const r = analyse(m);
    const lmax = loadingIndex(r, 'LM', 'max');
    // Influence line of M at midspan: η(x) = x/2 for x ≤ L/2 (statics: R_B·L/2 = (x/L)·L/2).
    // Max: P·η(L/2) + P·η(L/2 − d) = P·L/4 + P·(L/2 − d)/2 = 5P + 3P = 8P.
    const f = r.memberForces(9, lmax); // member M10 ends at midspan (x = 10 m)
    const mid = f.M_major[f.x.length - 1];
    expect(Math.abs(mid - 8 * P) / (8 * P)).toBeLessThan(1e-9);
    // its vehicle position: the leading axle at midspan (other axle behind at 6 m) or at 14 m
    const at = r.moving!.memberPosition(9, lmax, 'M_major', f.x.length - 1)!;
    const axles = at.direction === 'forward' ? [at.lead, at.lead - d] : [at.lead, at.lead + d];
    expect(axles.some((s) => Math.abs(s - L / 2) < 1e-9)).toBe(true);
    // the min envelope of a sagging-only influence line is zero (vehicle off the span)
    const fmin = r.memberForces(9, loadingIndex(r, 'LM', 'min'));
    expect(Math.abs(fmin.M_major[fmin.x.length - 1])).toBeLessThan(1e-6 * P);
  });

  it('absolute maximum moment by the classic rule (midspan bisects axle–resultant distance)', () => {
    const { b, members } = simpleSpan(L, 20);
    // a poor step on purpose: exact positions come from axles standing on nodes and stations
    const m = addMoving(b, trainA, members, { step: 3.7 }).build();
    const r = analyse(m);
    // Classic rule (e.g. Hibbeler, Structural Analysis, "absolute maximum moment", from memory):
    // resultant R = 2P at e = d/2 from either axle; the critical axle stands at
    // x* = L/2 − e/2 = L/2 − d/4 = 9 m, and M_abs = R·(L/2 − e/2)²/L = (P/(2L))·(L − d/2)² = 8.1·P.
    const ext = extreme(m, r, loadingIndex(r, 'LM', 'max'), 'M_major', 1);
    expect(Math.abs(ext.value - 8.1 * P) / (8.1 * P)).toBeLessThan(1e-9);
    // at x* = 9 m or, by symmetry of the two directions / the equal axles, at L − 9 = 11 m
    expect([9, 11].some((x) => Math.abs(ext.x - x) < 1e-9)).toBe(true);
  });

  it('a single heavy axle alone governs when the light axle is far behind', () => {
    const { b, members } = simpleSpan(L, 20);
    // Train B: 200 kN + 20 kN at 16 m. Both on the span by the classic rule: R = 220 kN,
    // e = 20·16/220 = 1.4545 m, M = R(L/2 − e/2)²/L = 945.8 kNm < P1·L/4 = 1000 kNm (heavy axle
    // alone at midspan, light axle off the span at 26 m or −6 m). Closed form, simple statics.
    const P1 = 200 * kN, P2 = 20 * kN;
    const m = addMoving(b, [{ offset: 0, load: P1 }, { offset: 16, load: P2 }], members, { step: 1.3 }).build();
    const r = analyse(m);
    const lmax = loadingIndex(r, 'LM', 'max');
    const both = (220 * kN * (L / 2 - 1.4545454545454546 / 2) ** 2) / L;
    expect(both).toBeLessThan((P1 * L) / 4);
    const ext = extreme(m, r, lmax, 'M_major', 1);
    expect(Math.abs(ext.value - (P1 * L) / 4) / ((P1 * L) / 4)).toBeLessThan(1e-9);
    expect(Math.abs(ext.x - L / 2)).toBeLessThan(1e-9);
  });

  it('maximum end reactions: the leading axle over the support, the train on the span', () => {
    const { b, members } = simpleSpan(L, 20);
    const m = addMoving(b, trainA, members, { step: 0.7 }).build();
    const r = analyse(m);
    const lmax = loadingIndex(r, 'LM', 'max');
    // Influence line of R_A: η = 1 − x/L. Max: P·1 + P·(1 − d/L) = 1.8P (statics), upward (+Z).
    const A = nodeIndexOf(m, 'N0'), B = nodeIndexOf(m, 'N20');
    const rx = r.reactions(lmax);
    expect(Math.abs(rx[A * 6 + 2] - 1.8 * P) / (1.8 * P)).toBeLessThan(1e-9);
    expect(Math.abs(rx[B * 6 + 2] - 1.8 * P) / (1.8 * P)).toBeLessThan(1e-9);
    // the vehicle position that produced R_A: an axle over A
    const at = r.moving!.nodePosition(A, lmax, 'reaction', 2)!;
    const axles = at.direction === 'forward' ? [at.lead, at.lead - d] : [at.lead, at.lead + d];
    expect(axles.some((s) => Math.abs(s) < 1e-9)).toBe(true);
    // maximum deflection at midspan, downward: the min envelope of uz at N10. The midspan
    // deflection influence line δ(x) = x(3L² − 4x²)/(48EI) (x ≤ L/2, Roark table 8.1 case 1e,
    // from memory) is symmetric and concave, so two equal axles govern placed symmetrically,
    // at x = L/2 ∓ d/2 = 8 m and 12 m: δ = 2P·8(3L² − 4·8²)/(48EI).
    const EI = 200e9 * 1e-4;
    const dmax = (2 * P * 8 * (3 * L * L - 4 * 64)) / 48 / EI;
    const uz = r.displacements(loadingIndex(r, 'LM', 'min'))[nodeIndexOf(m, 'N10') * 6 + 2];
    expect(Math.abs(-uz - dmax) / dmax).toBeLessThan(1e-9);
  });

  it('axles off the lane carry nothing; one direction only steps one way', () => {
    const { b, members } = simpleSpan(L, 20);
    // a 30 m train: axles 30 m apart never stand on the 20 m span together
    const m = addMoving(b, [{ offset: 0, load: P }, { offset: 30, load: P }], members, { direction: 'forward', step: 1 }).build();
    const r = analyse(m);
    const lmax = loadingIndex(r, 'LM', 'max');
    const ext = extreme(m, r, lmax, 'M_major', 1);
    // one axle at a time: P·L/4 (statics)
    expect(Math.abs(ext.value - (P * L) / 4) / ((P * L) / 4)).toBeLessThan(1e-9);
    const last = r.memberForces(9, lmax).x.length - 1; // M10's end, midspan
    expect(r.moving!.memberPosition(9, lmax, 'M_major', last)!.direction).toBe('forward');
  });

  it('the influence ordinates equal a static analysis of a unit point load (all station rows)', () => {
    const { b, members } = simpleSpan(L, 20);
    // continuity at the lane's members: a fixed-ended frame, unit load at a = 0.5 m on M10 (s = 9.5 m)
    b.loadCase('UNIT').memberLoad('UNIT', 'M10', 'point', 'global_z', -1, { a: 0.5 });
    const m = addMoving(b, [{ offset: 0, load: 1 }], members).build();
    const r = analyse(m);
    const unit = loadingIndex(r, 'UNIT');
    for (const mi of [8, 9, 10]) {
      const f = r.memberForces(mi, unit);
      for (const key of ['N', 'V_major', 'M_major', 'd_major'] as const) {
        for (let st = 0; st < f.x.length; st++) {
          const line = r.moving!.influenceLine(0, { member: mi, key, station: st });
          const k = line.s.findIndex((v) => Math.abs(v - 9.5) < 1e-9);
          // superposition is exact: tolerance 1e-9 of the scale (1 N, 1 N·m, EI-scaled deflection)
          const scale = key === 'd_major' ? 1 / (200e9 * 1e-4) : 1;
          expect(Math.abs(line.value[k] - f[key][st])).toBeLessThan(1e-9 * scale);
        }
      }
    }
  });

  it('a combination with a moving case has max and min envelopes: static part plus the factored extreme', () => {
    const { b, members } = simpleSpan(L, 20);
    b.loadCase('D');
    for (const id of members) b.memberLoad('D', id, 'uniform', 'global_z', -10 * kN);
    b.combination('ULS', { D: 1.35, LM: 1.5 });
    b.combination('UPLIFT', { D: 1.0, LM: -0.5 });
    const m = addMoving(b, trainA, members, { step: 0.5 }).build();
    const r = analyse(m);
    const d = loadingIndex(r, 'D'), lmax = loadingIndex(r, 'LM', 'max'), lmin = loadingIndex(r, 'LM', 'min');
    // loadings: D, LM(max), LM(min), ULS(max), ULS(min), UPLIFT(max), UPLIFT(min)
    expect(r.loadings.map((l) => `${l.id}${l.envelope ? `:${l.envelope}` : ''}`)).toEqual(
      ['D', 'LM:max', 'LM:min', 'ULS:max', 'ULS:min', 'UPLIFT:max', 'UPLIFT:min']);
    const st = (l: number) => { const f = r.memberForces(9, l); return f.M_major[f.x.length - 1]; }; // midspan
    // superposition, definition of the envelope (issue 7): factor > 0 takes the same extreme, < 0 the opposite
    expect(st(loadingIndex(r, 'ULS', 'max'))).toBeCloseTo(1.35 * st(d) + 1.5 * st(lmax), 3);
    expect(st(loadingIndex(r, 'ULS', 'min'))).toBeCloseTo(1.35 * st(d) + 1.5 * st(lmin), 3);
    expect(st(loadingIndex(r, 'UPLIFT', 'max'))).toBeCloseTo(st(d) - 0.5 * st(lmin), 3);
    expect(st(loadingIndex(r, 'UPLIFT', 'min'))).toBeCloseTo(st(d) - 0.5 * st(lmax), 3);
  });
});
