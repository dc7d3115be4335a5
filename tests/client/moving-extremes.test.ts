import { describe, expect, it } from 'vitest';
import { extremeRows } from '../../src/utils/movingCharts.js';
import type { MemberMoving } from '../../shared/schemas/runs.js';

const moving: MemberMoving = {
  movingLoad: 0, vehicle: 'T3', lane: 'DECK', laneLength: 20, key: 'M_major', station: 5, x: 10.7214,
  influence: { s: [0, 20], value: [0, 0] },
  envelope: { x: [0, 10.7214, 20], max: [0, 1291.608e3, 0], min: [0, 0, 0] },
  extremes: [
    { key: 'M_major', max: { value: 1291.608e3, x: 10.7214, lead: 15.0214, direction: 'forward' }, min: { value: 0, x: 0, lead: null, direction: null } },
    { key: 'V_major', max: { value: 300e3, x: 0, lead: 9.1, direction: 'forward' }, min: { value: -320e3, x: 20, lead: 20, direction: 'backward' } },
  ],
};

describe('moving-load extremes on the member detail', () => {
  it('lists each force with its unit, value, x and the leading axle position (metric)', () => {
    const rows = extremeRows(moving, 'metric');
    expect(rows.map((r) => r.force)).toEqual(['M_major', 'V_major']);
    // N·m → kNm and N → kN (unit conversion, exact)
    expect(rows[0]).toMatchObject({ unit: 'kNm', max: '1291.61', maxAt: 'x = 10.721 m, leading axle at 15.021 m (forward)', minAt: '' });
    expect(rows[1]).toMatchObject({ unit: 'kN', max: '300.00', min: '-320.00' });
  });

  it('gives no rows when the server sent none (older runs)', () => {
    expect(extremeRows({ ...moving, extremes: undefined }, 'metric')).toEqual([]);
  });
});
