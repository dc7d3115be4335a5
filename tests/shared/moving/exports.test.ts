import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { displacementTable, memberForceTable, movingExtremesTable, reactionTable } from '../../../shared/exports/results.js';
import { addMoving, simpleSpan } from './helpers.js';

describe('result exports with moving loads', () => {
  it('add an envelope column: max/min on moving loadings, blank on the others', () => {
    const { b, members } = simpleSpan(10, 4);
    b.loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -1e3);
    b.combination('ULS', { D: 1.35, LM: 1.5 });
    const m = addMoving(b, [{ offset: 0, load: 1e5 }], members).build();
    const r = analyse(m);
    for (const t of [displacementTable(m, r), reactionTable(m, r), memberForceTable(m, r)]) {
      expect(t.header.slice(0, 2)).toEqual(['loading', 'envelope']);
      const pairs = new Set(t.rows.map((row) => `${row[0]}|${row[1]}`));
      expect([...pairs]).toEqual(['D|', 'LM|max', 'LM|min', 'ULS|max', 'ULS|min']);
    }
    // reactions (kN): the max envelope of R_A under one 100 kN axle is 100 kN (axle over A, statics)
    const rt = reactionTable(m, r);
    const fz = rt.header.indexOf('fz [kN]');
    const row = rt.rows.find((x) => x[0] === 'LM' && x[1] === 'max' && x[2] === 'N0')!;
    expect(row[fz] as number).toBeCloseTo(100, 9);
  });

  it('list each member force\'s absolute max and min under the vehicle with x and the vehicle position', () => {
    const { b, members } = simpleSpan(10, 1);
    const m = addMoving(b, [{ offset: 0, load: 1e5 }], members).build();
    const r = analyse(m);
    const t = movingExtremesTable(m, r)!;
    expect(t.header).toEqual(['case', 'vehicle', 'lane', 'member', 'force', 'extreme', 'unit', 'value', 'x [m]', 'direction', 'vehicle_position [m]']);
    // one 100 kN axle on a 10 m simple span: M_max = P·L/4 = 250 kNm at midspan with the axle there (statics, 1e-9 relative)
    const row = t.rows.find((x) => x[4] === 'M_major' && x[5] === 'max')!;
    expect(row.slice(0, 4)).toEqual(['LM', 'V', 'deck', 'M1']);
    expect(row[6]).toBe('kNm');
    expect(Math.abs((row[7] as number) - 250) / 250).toBeLessThan(1e-9);
    expect(Math.abs((row[8] as number) - 5)).toBeLessThan(1e-6);
    expect(Math.abs((row[10] as number) - 5)).toBeLessThan(1e-6);
    expect(movingExtremesTable(simpleSpan(10, 1).b.build(), analyse(simpleSpan(10, 1).b.build()))).toBeUndefined();
  });

  it('leave the tables unchanged without moving loads', () => {
    const { b } = simpleSpan(10, 4);
    b.loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -1e3);
    const m = b.build();
    expect(displacementTable(m, analyse(m)).header.slice(0, 2)).toEqual(['loading', 'node']);
  });
});
