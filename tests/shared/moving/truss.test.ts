import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { ModelBuilder } from '../engine/builders.js';
import { addMoving, loadingIndex } from './helpers.js';

// Determinate Pratt truss, 4 panels of a = 3 m, depth h = 4 m, pin-jointed (truss members),
// in the XZ plane (Z up). Bottom chord L0..L4 is the lane; L0 pinned, L4 on a roller.
// m + r = 13 + 3 = 2j = 16: statically determinate, so influence lines follow from statics.
const a = 3, h = 4, d = Math.hypot(a, h); // d = 5
function pratt() {
  const b = new ModelBuilder({ planeNormal: 'Y' });
  for (let i = 0; i <= 4; i++) b.node(`L${i}`, i * a, 0, 0);
  for (let i = 1; i <= 3; i++) b.node(`U${i}`, i * a, 0, h);
  b.support('L0', 'ux uz').support('L4', 'uz');
  const t = { type: 'truss' as const };
  for (let i = 0; i < 4; i++) b.member(`B${i + 1}`, `L${i}`, `L${i + 1}`, t);
  b.member('T1', 'U1', 'U2', t).member('T2', 'U2', 'U3', t);
  b.member('E1', 'L0', 'U1', t).member('E2', 'U3', 'L4', t);
  for (let i = 1; i <= 3; i++) b.member(`V${i}`, `L${i}`, `U${i}`, t);
  b.member('D1', 'U1', 'L2', t).member('D2', 'U3', 'L2', t);
  return b;
}

// Closed-form influence lines (method of sections), unit load 1 N down at x along the bottom
// chord; R_A = 1 − x/4a, R_B = x/4a; the deck members carry the load to their end nodes as
// simple spans, so every ordinate is linear between panel points.
const RA = (x: number) => 1 - x / (4 * a), RB = (x: number) => x / (4 * a);
// B2 (L1–L2): section through panel 2, moments about U1: N = M_beam(a)/h,
// M_beam(a) = R_B·3a for x ≤ a, R_A·a for x ≥ a.
const ilB2 = (x: number) => (x <= a ? RB(x) * 3 * a : RA(x) * a) / h;
// T1 (U1–U2): moments about L2: N = −M_beam(2a)/h, M_beam(2a) = R_B·2a (x ≤ 2a), R_A·2a (x ≥ 2a).
const ilT1 = (x: number) => -(x <= 2 * a ? RB(x) * 2 * a : RA(x) * 2 * a) / h;
// D1 (U1–L2): vertical equilibrium of the part left of the cut in panel 2:
// N·h/d = V_panel2, V = −R_B for x ≤ a, R_A for x ≥ 2a, linear between (deck member B2).
const shear2 = (x: number) => (x <= a ? -RB(x) : x >= 2 * a ? RA(x) : -RB(a) + ((x - a) / a) * (RA(2 * a) + RB(a)));
const ilD1 = (x: number) => (shear2(x) * d) / h;
// V1 (L1–U1): joint L1 (collinear chords): N = load at L1 = 1 − |x − a|/a within a of L1.
const ilV1 = (x: number) => Math.max(0, 1 - Math.abs(x - a) / a);

describe('determinate truss: influence lines from statics', () => {
  const cases: [string, (x: number) => number][] = [['B2', ilB2], ['T1', ilT1], ['D1', ilD1], ['V1', ilV1]];
  for (const [id, il] of cases) {
    it(`axial force of ${id} follows the method of sections at every lane position`, () => {
      const m = addMoving(pratt(), [{ offset: 0, load: 1e5 }], ['B1', 'B2', 'B3', 'B4']).build();
      const r = analyse(m);
      const mi = m.members.findIndex((x) => x.id === id);
      const line = r.moving!.influenceLine(0, { member: mi, key: 'N', station: 0 });
      expect(line.s.length).toBeGreaterThan(40);
      for (let i = 0; i < line.s.length; i++) {
        // tolerance: 1e-9 of the largest ordinate (1 N)
        expect(Math.abs(line.value[i] - il(line.s[i]))).toBeLessThan(1e-9);
      }
    });
  }

  it('envelope of one axle equals the axle load times the extreme ordinates', () => {
    const P = 1e5;
    const m = addMoving(pratt(), [{ offset: 0, load: P }], ['B1', 'B2', 'B3', 'B4'], { step: 0.35 }).build();
    const r = analyse(m);
    const lmax = loadingIndex(r, 'LM', 'max'), lmin = loadingIndex(r, 'LM', 'min');
    const N = (id: string, l: number) => r.memberForces(m.members.findIndex((x) => x.id === id), l).N[0];
    // D1: max ordinate ilD1(2a) = R_A(2a)·d/h = 0.5·5/4 = 0.625; min ilD1(a) = −0.25·5/4 = −0.3125
    expect(N('D1', lmax) / P).toBeCloseTo(0.625, 9);
    expect(N('D1', lmin) / P).toBeCloseTo(-0.3125, 9);
    // T1: min −M(2a)/h = −(0.5·6)/4 = −0.75 with the load at L2; max 0 (never in tension)
    expect(N('T1', lmin) / P).toBeCloseTo(-0.75, 9);
    expect(N('T1', lmax) / P).toBeCloseTo(0, 9);
  });

  it('reports a lane that does not connect', () => {
    const m = addMoving(pratt(), [{ offset: 0, load: 1 }], ['B1', 'B3']).build();
    expect(() => analyse(m)).toThrow(/lane deck: member B3 does not connect/);
  });

  it('walks a lane whose members point against the direction of travel', () => {
    // the same deck listed from L4 back to L0: B4 is entered at L4 (its end not shared with B3)
    const m = addMoving(pratt(), [{ offset: 0, load: 1 }], ['B4', 'B3', 'B2', 'B1']).build();
    const r = analyse(m);
    const lane = r.moving!.lanes[0];
    expect(lane.length).toBeCloseTo(4 * a, 12);
    expect(lane.segments.map((g) => g.reversed)).toEqual([true, true, true, true]);
    const mi = m.members.findIndex((x) => x.id === 'B2');
    const line = r.moving!.influenceLine(0, { member: mi, key: 'N', station: 0 });
    // path position s runs from L4: x = 4a − s
    for (let i = 0; i < line.s.length; i++) expect(Math.abs(line.value[i] - ilB2(4 * a - line.s[i]))).toBeLessThan(1e-9);
  });
});
