import { describe, expect, it } from 'vitest';
import { envelopeChart, influenceChart, vehicleText } from '../../src/utils/movingCharts.js';
import { buildGridRows } from '../../src/utils/resultsRows.js';
import type { MemberMoving, MemberRow } from '../../shared/schemas/runs.js';

const moving: MemberMoving = {
  movingLoad: 0, vehicle: 'TRX-4', lane: 'DECK', laneLength: 48, key: 'M_major', station: 5, x: 3,
  influence: { s: [0, 24, 48], value: [0, 1.5, 0] },
  envelope: { x: [0, 3, 6], max: [0, 250e3, 0], min: [0, -10e3, 0] },
};

describe('moving-load charts on the member detail', () => {
  it('shows an influence line of a moment as kNm per kN, positions in m (metric)', () => {
    const c = influenceChart(moving, 'metric');
    expect(c.yLabel).toBe('[kNm per kN]');
    // 1.5 N·m per N = 1.5 kNm per kN (unit conversion, exact)
    expect(c.series[0].points[1]).toEqual({ x: 24, y: expect.closeTo(1.5, 12) });
  });

  it('converts the envelope to kip-ft and ft in us units', () => {
    const c = envelopeChart(moving, 'us');
    // 250 kNm = 184.3924 kip-ft (1 kip-ft = 1.3558179 kNm, from memory); 3 m = 9.84252 ft (1 ft = 0.3048 m exactly)
    expect(c.series[0].points[1].y).toBeCloseTo(250 / 1.3558179483314, 4);
    expect(c.series[0].points[1].x).toBeCloseTo(3 / 0.3048, 9);
    expect(c.series.map((s) => s.label)).toEqual(['max', 'min']);
  });

  it('formats the vehicle position for the grid and carries it into the grid rows', () => {
    expect(vehicleText(12.4, 'metric')).toBe('12.40 m');
    expect(vehicleText(undefined, 'metric')).toBe('');
    const row = { member: 'V2', group: '', section: 'S', material: 'M', length: 6.5, ratio: 1.05, check: 'c', clause: '6.3.1', combination: 'ULS', status: 'fail', families: {}, familyStatus: {}, warnings: [], previousRatio: null, vehiclePosition: 16.4 } as MemberRow;
    const [g] = buildGridRows([row], null, (m) => m / 0.3048);
    expect(g.vehiclePosition).toBeCloseTo(16.4 / 0.3048, 9);
  });
});
