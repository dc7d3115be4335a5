import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { ModelBuilder } from '../engine/builders.js';
import { addMoving, loadingIndex } from './helpers.js';

// Two equal spans L = 8 m, continuous over B, A and C on rollers (A also holds ux), one frame
// member per span, Z up, XZ plane.
const L = 8;
function twoSpan() {
  return new ModelBuilder({ planeNormal: 'Y' })
    .node('A', 0, 0, 0).node('B', L, 0, 0).node('C', 2 * L, 0, 0)
    .support('A', 'ux uz').support('B', 'uz').support('C', 'uz')
    .member('S1', 'A', 'B').member('S2', 'B', 'C');
}

// Three-moment equation (Clapeyron) with M_A = M_C = 0 and L1 = L2 = L, unit load at distance
// x from A in span 1: M_A·L1 + 2·M_B(L1 + L2) + M_C·L2 = −P·x(L1² − x²)/L1, so
// M_B = −x(L² − x²)/(4L²) (hogging negative); in span 2, by symmetry with b = 2L − s from C.
// Its extreme −L/(6√3)·... at x = L/√3: M_B = −(2/(12√3))·L = −0.0962·L (the tabulated
// two-span ordinate, from memory).
function ilMB(s: number): number {
  const x = s <= L ? s : 2 * L - s;
  return -(x * (L * L - x * x)) / (4 * L * L);
}
// Reaction at B by statics of span 1 with M_B known: R_B = x/L − 2·M_B/L (span 1 gives x/L
// plus the hogging moment's couple on both spans).
function ilRB(s: number): number {
  const x = s <= L ? s : 2 * L - s;
  return x / L - (2 * ilMB(s)) / L;
}

describe('two-span continuous beam: influence lines against the three-moment equation', () => {
  it('moment over the middle support at every lane position', () => {
    const m = addMoving(twoSpan(), [{ offset: 0, load: 1e5 }], ['S1', 'S2']).build();
    const r = analyse(m);
    const last = r.memberForces(0, 0).x.length - 1; // S1's last station, x = L
    const line = r.moving!.influenceLine(0, { member: 0, key: 'M_major', station: last });
    for (let i = 0; i < line.s.length; i++) {
      // tolerance 1e-9·L
      expect(Math.abs(line.value[i] - ilMB(line.s[i]))).toBeLessThan(1e-9 * L);
    }
    // the same quantity seen from S2's start station
    const line2 = r.moving!.influenceLine(0, { member: 1, key: 'M_major', station: 0 });
    for (let i = 0; i < line2.s.length; i++) expect(Math.abs(line2.value[i] - ilMB(line2.s[i]))).toBeLessThan(1e-9 * L);
  });

  it('envelope of the middle reaction and the hogging moment under a two-axle vehicle', () => {
    const P = 1e5, e = 2;
    const m = addMoving(twoSpan(), [{ offset: 0, load: P }, { offset: e, load: P }], ['S1', 'S2'], { step: 0.05 }).build();
    const r = analyse(m);
    const lmax = loadingIndex(r, 'LM', 'max'), lmin = loadingIndex(r, 'LM', 'min');
    // R_B: its influence line is symmetric about B and smooth there (no kink: the beam is
    // continuous), so two equal axles govern placed symmetrically, at L ∓ e/2:
    // max = 2P·η(L − e/2) — confirmed by a fine scan of the closed form below. The lead
    // position L + e/2 = 9 m is on the 0.05 m grid, so the engine finds it exactly.
    const B = m.nodes.findIndex((n) => n.id === 'B');
    const want = 2 * P * ilRB(L - e / 2);
    let scan = 0;
    for (let s = 0; s <= 2 * L + e; s += 1e-3) {
      let v = 0;
      for (const o of [0, e]) { const x = s - o; if (x >= 0 && x <= 2 * L) v += P * ilRB(x); }
      scan = Math.max(scan, v);
    }
    expect(want).toBeGreaterThanOrEqual(scan - 1e-9 * want);
    expect(Math.abs(r.reactions(lmax)[B * 6 + 2] - want) / want).toBeLessThan(1e-9);
    // M_B: the vehicle's min over a 0.05 m grid is within the grid error of the continuous
    // optimum, found here by a fine scan of the closed form (bound: |dη/dx| ≤ 0.25, so the
    // grid loses at most 2·P·0.25·0.025).
    let best = 0;
    for (let s = 0; s <= 2 * L + e; s += 1e-4) {
      let v = 0;
      for (const o of [0, e]) { const x = s - o; if (x >= 0 && x <= 2 * L) v += P * ilMB(x); }
      best = Math.min(best, v);
    }
    const f = r.memberForces(0, lmin);
    const got = f.M_major[f.x.length - 1]; // S1 at x = L
    expect(got).toBeGreaterThanOrEqual(best - 1e-6 * P);
    expect(got - best).toBeLessThan(2 * P * 0.25 * 0.025);
  });
});
