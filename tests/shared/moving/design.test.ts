/**
 * Design checks on moving-load envelopes read the extreme under an axle: the envelope loading
 * carries it at a station, so the bending check's demand and position are the true maximum and
 * the record names where the vehicle stood.
 */
import { describe, expect, it } from 'vitest';
import { checkModel } from '../../../shared/design/index.js';
import { analyse } from '../../../shared/engine/index.js';
import { IPE300 } from '../design/helpers.js';
import { member, model } from '../design/model-helpers.js';

const kN = 1e3;
// our own three-axle vehicle (as axles.test.ts): 50 kN leading, 150 kN at 4.3 m, 150 kN at 9.1 m
const vehicle = [[0, 50], [4.3, 150], [9.1, 150]] as const;

describe('design checks use the moving-load extremes under the axles', () => {
  it('EN 6.2.5 bending on a 20 m span: demand = 1.5 × the classic-rule maximum, at the axle, with the vehicle position', () => {
    const L = 20;
    const m = model([IPE300()], [member('B1', 'N1', 'N2', 'IPE300')], [['N1', 0, 0], ['N2', L, 0]], []);
    m.supports = [
      { node: 'N1', restrained: [true, true, true, true, true, false], springs: [0, 0, 0, 0, 0, 0] },
      { node: 'N2', restrained: [false, true, true, true, true, false], springs: [0, 0, 0, 0, 0, 0] },
    ];
    m.cases.push({ id: 'LM', category: 'live', title: 'LM', selfWeight: 0, mass: false });
    m.combinations = [{ id: 'ULS', limitState: 'strength', terms: [{ case: 'LM', factor: 1.5 }] }];
    vehicle.forEach(([offset, load], i) => m.vehicles.push({ vehicle: 'T3', axle: `A${i + 1}`, offset, load: load * kN }));
    m.lanes.push({ lane: 'DECK', seq: 1, member: 'B1' });
    m.movingLoads.push({ case: 'LM', vehicle: 'T3', lane: 'DECK', direction: 'both' });
    const r = checkModel(m, analyse(m));
    // classic rule (axles.test.ts): R = 350 kN, e = 1.442857 m, M = R(L/2 − e/2)²/L − 50 kN·4.3 m = 1291.608 kNm
    const R = 350 * kN, e = (150 * 4.3 + 150 * 9.1) / 350 - 4.3;
    const exact = (R * (L / 2 - e / 2) ** 2) / L - 50 * kN * 4.3;
    const bend = r.records.find((c) => c.clause === '6.2.5' && c.family === 'bending_major' && c.combination === 'ULS')!;
    // sagging in the plane's own sign convention: compare magnitudes (tolerance 1e-9 relative)
    expect(Math.abs(Math.abs(bend.demand!) - 1.5 * exact) / (1.5 * exact)).toBeLessThan(1e-9);
    // at the critical axle (x_c = L/2 ± e/2, tolerance 1e-6 m) with the leading axle 4.3 m ahead of it
    const xc = L / 2 + e / 2;
    expect([xc, L - xc].some((x) => Math.abs(bend.x! - x) < 1e-6)).toBe(true);
    expect(bend.vehiclePosition).toBeDefined();
    const lead = bend.vehiclePosition!;
    expect([bend.x! + 4.3, bend.x! - 4.3].some((s) => Math.abs(s - lead) < 1e-6)).toBe(true);
  });
});
