import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { displacementTable, memberForceTable, reactionTable } from '../../../shared/exports/results.js';
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

  it('leave the tables unchanged without moving loads', () => {
    const { b } = simpleSpan(10, 4);
    b.loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -1e3);
    const m = b.build();
    expect(displacementTable(m, analyse(m)).header.slice(0, 2)).toEqual(['loading', 'node']);
  });
});
