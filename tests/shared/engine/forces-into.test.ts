/**
 * memberForcesInto (the design checks' fast path, shared/engine/memberResults.ts) gives
 * exactly the values of memberForces — the same operations in the same order — for every
 * member and loading, whatever the buffer held before (members with point loads have more
 * stations than the others, so the buffer is refitted). Reference: memberForces itself.
 */
import { describe, expect, it } from 'vitest';
import { buildFrameModel } from '../../../bench/engine.js';
import { analyse } from '../../../shared/engine/index.js';
import { FORCE_KEYS, type StationForces } from '../../../shared/engine/types.js';

describe('memberForcesInto', () => {
  it('equals memberForces bit for bit, with the buffer reused across members of different station counts', () => {
    const r = analyse(buildFrameModel(3, 2, 4, 'none'));
    const buf: StationForces = {
      x: new Float64Array(3), N: new Float64Array(3), V_major: new Float64Array(3), V_minor: new Float64Array(3), T: new Float64Array(3),
      M_major: new Float64Array(3), M_minor: new Float64Array(3), d_major: new Float64Array(3), d_minor: new Float64Array(3),
    };
    const counts = new Set<number>();
    // members in a scrambled order and loadings backwards: the kept case rows are switched often
    const order = r.memberIds.map((_, i) => (i * 37) % r.memberIds.length);
    expect(new Set(order).size).toBe(r.memberIds.length);
    for (const m of order) {
      for (let l = r.loadings.length - 1; l >= 0; l--) {
        const got = r.memberForcesInto!(m, l, buf);
        expect(got).toBe(buf);
        const want = r.memberForces(m, l);
        counts.add(want.x.length);
        expect(Array.from(got.x)).toEqual(Array.from(want.x));
        for (const k of FORCE_KEYS) expect(Array.from(got[k])).toEqual(Array.from(want[k]));
      }
    }
    expect(counts.size).toBeGreaterThan(1);
  });
});
