import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkModel } from '../../shared/design/index.js';
import { analyse } from '../../shared/engine/index.js';
import { readWorkbook } from '../../shared/reader/index.js';

const FILE = join(import.meta.dirname, '..', '..', 'samples', 'road-bridge-truss', 'road-bridge-truss.xlsx');

describe('road-bridge-truss sample (moving loads)', () => {
  it('reads the vehicle, the lane and the moving load; the design records carry the vehicle position', async () => {
    const res = await readWorkbook(readFileSync(FILE));
    if (!res.ok) throw new Error(JSON.stringify(res.problems));
    const model = res.model;
    expect(model.vehicles.map((v) => v.load)).toEqual([60e3, 140e3, 140e3, 110e3]); // kN → N
    expect(model.lanes.length).toBe(8);
    expect(model.movingLoads).toEqual([expect.objectContaining({ case: 'TRAFFIC', vehicle: 'TRX-4', lane: 'DECK', step: 0.2, direction: 'both' })]);
    const a = analyse(model);
    expect(a.moving!.lanes[0].length).toBeCloseTo(48, 9);
    expect(a.loadings.filter((l) => l.envelope).map((l) => `${l.id}:${l.envelope}`)).toEqual(
      ['TRAFFIC:max', 'TRAFFIC:min', 'ULS-traffic:max', 'ULS-traffic:min', 'SLS-traffic:max', 'SLS-traffic:min']);
    const d = checkModel(model, a);
    const moving = d.records.filter((r) => r.envelope);
    expect(moving.length).toBeGreaterThan(20);
    for (const r of moving) if (r.vehiclePosition !== undefined) expect(r.vehiclePosition).toBeGreaterThanOrEqual(-9.2 - 1e-9);
    // every member is governed by the traffic combination here, and reports where the vehicle stood
    const governed = d.members.filter((m) => m.vehiclePosition !== undefined);
    expect(governed.length).toBeGreaterThan(20);
    // symmetric truss, symmetric vehicle passes: mirrored members have the same ratio (statics; 1e-6)
    const ratio = (id: string) => d.members.find((m) => m.member === id)!.ratio!;
    expect(Math.abs(ratio('V2') - ratio('V6'))).toBeLessThan(1e-6);
    expect(Math.abs(ratio('TC3') - ratio('TC6'))).toBeLessThan(1e-6);
  });
});
