import { describe, expect, it } from 'vitest';
import { axlePoints, pictureVehicles } from '../../shared/moving/picture.js';
import { roadBridgeTruss } from '../../scripts/samples/road-bridge.js';
import { readTables } from '../../shared/reader/index.js';

describe('vehicle in the model picture', () => {
  const res = readTables(Object.entries(roadBridgeTruss().tables).map(([name, rows]) => ({ name, rows })) as never) as { ok: true; model: import('../../shared/model/types.js').Model };
  const pv = pictureVehicles(res.model)!;

  it('draws the lane as a polyline with path positions', () => {
    expect(pv.lanes[0].lane).toBe('DECK');
    expect(pv.lanes[0].length).toBeCloseTo(48, 12); // 8 panels × 6 m (sample geometry)
    expect(pv.lanes[0].points[0]).toEqual([0, 0, 0]);
  });

  it('places the axles at lead − offset and leaves off-lane axles out', () => {
    const axles = pv.vehicles[0].axles;
    // lead 10 m: offsets 0, 3.6, 4.9, 9.2 → x = 10, 6.4, 5.1, 0.8 (straight lane along X)
    expect(axlePoints(pv.lanes[0], axles, 10).map((p) => p[0])).toEqual([10, 6.4, 5.1, expect.closeTo(0.8, 12)]);
    // lead 2 m: only the first axle is on the lane
    expect(axlePoints(pv.lanes[0], axles, 2).length).toBe(1);
  });
});
