/**
 * Result stations (issue 11 item 1): `settings.stations` equally spaced stations, every
 * concentrated load position, and the member's `result_points`, so that a value the engineer
 * asks for is read exactly at its position rather than interpolated.
 */
import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { memberStations } from '../../../shared/engine/recovery.js';
import { ModelBuilder } from './builders.js';

// |a − b| ≤ rtol · max(1, |a|, |b|) with rtol = 1e-9: the forces are statics of the free body, exact
const RTOL = 1e-9;
const close = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(RTOL * Math.max(1, Math.abs(a), Math.abs(b)));
const indexOf = (xs: ArrayLike<number>, x: number) => Array.prototype.indexOf.call(xs, x) as number;

// Beams along X, Z up, plane frame in X–Z; L = 4 m.
const L = 4;
const beam = () => new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', L, 0, 0).member('M1', 'A', 'B');

describe('memberStations', () => {
  it('gives n equally spaced stations with both ends, plus load positions and result points, sorted', () => {
    const xs = memberStations(L, [], 5, [1.0, 3.5]);
    expect(Array.from(xs)).toEqual([0, 1, 2, 3, 3.5, 4]);
  });

  it('keeps an exact position over an equally spaced one it merges with', () => {
    // 3·1/10 and 0.1·3 differ by one ulp (0.3 vs 0.30000000000000004): one station, the exact one
    const xs = memberStations(3, [], 11, [0.1 * 3]);
    expect(xs.length).toBe(11);
    expect(xs[1]).toBe(0.1 * 3);
  });
});

describe('stations in the analysis', () => {
  it('reads a cantilever moment at x = 1.0 m exactly: M = −P(L − x) for a tip load P', () => {
    // Statics of the free body beyond x (closed form): M(x) = −P(L − x), hogging; V = +P.
    const P = 10e3;
    const b = beam().support('A', 'fixed').loadCase('D').nodeLoad('D', 'B', { fz: -P });
    const without = analyse(b.build()).memberForces(0, 0);
    expect(indexOf(without.x, 1.0)).toBe(-1); // 11 stations on 4 m: 0, 0.4, 0.8, 1.2, …
    b.model.resultPoints.push({ member: 'M1', x: 1.0 });
    const f = analyse(b.build()).memberForces(0, 0);
    expect(f.x.length).toBe(12);
    const i = indexOf(f.x, 1.0);
    expect(i).toBeGreaterThan(0);
    close(f.M_major[i], -P * (L - 1.0));
    close(f.V_major[i], P);
  });

  it('reads a propped cantilever maximum 9qL²/128 at 3L/8 from the prop under uniform q', () => {
    // Prop at A (x = 0), fixed at B. Closed form (statics with the prop reaction R = 3qL/8,
    // from memory, any beam table): M(x) = 3qLx/8 − qx²/2, maximum 9qL²/128 at x = 3L/8, and −qL²/8 at the fixed end.
    const q = 5e3;
    const b = beam().support('A', 'uz').support('B', 'fixed').loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -q);
    b.model.resultPoints.push({ member: 'M1', x: (3 * L) / 8 });
    const f = analyse(b.build()).memberForces(0, 0);
    const i = indexOf(f.x, (3 * L) / 8);
    expect(i).toBeGreaterThan(0);
    close(f.M_major[i], (9 * q * L * L) / 128);
    close(Math.max(...f.M_major), (9 * q * L * L) / 128);
    close(f.M_major[f.x.length - 1], (-q * L * L) / 8);
    f.x.forEach((x, k) => close(f.M_major[k], (3 * q * L * x) / 8 - (q * x * x) / 2));
  });

  it('reads a simply supported triangular load maximum qL²/(9√3) at x = L/√3', () => {
    // Load rising linearly from 0 at A to q at B. Closed form (statics, R_A = qL/6, from memory):
    // M(x) = qLx/6 − qx³/(6L); dM/dx = 0 at x = L/√3, M_max = qL²/(9√3).
    const q = 6e3;
    const b = beam().support('A', 'pinned').support('B', 'uz').loadCase('D')
      .memberLoad('D', 'M1', 'linear', 'global_z', 0, { w2: -q });
    const xm = L / Math.sqrt(3);
    b.model.resultPoints.push({ member: 'M1', x: xm });
    const f = analyse(b.build()).memberForces(0, 0);
    const i = indexOf(f.x, xm);
    expect(i).toBeGreaterThan(0);
    close(f.M_major[i], (q * L * L) / (9 * Math.sqrt(3)));
    close(Math.max(...f.M_major), (q * L * L) / (9 * Math.sqrt(3)));
    f.x.forEach((x, k) => close(f.M_major[k], (q * L * x) / 6 - (q * x ** 3) / (6 * L)));
  });

  it('uses settings.stations: 3 and 201 stations work, with a point load position added', () => {
    // Simply supported, point load P at a = 1.31 m (not on a station of either set): M(x) = P(L − a)x/L for x ≤ a, Pa(L − x)/L beyond (statics).
    const P = 8e3, a = 1.31;
    for (const n of [3, 201]) {
      const b = beam().support('A', 'pinned').support('B', 'uz').loadCase('D').memberLoad('D', 'M1', 'point', 'global_z', -P, { a });
      b.model.settings.stations = n;
      const f = analyse(b.build()).memberForces(0, 0);
      expect(f.x.length).toBe(n + 1);
      expect(f.x[0]).toBe(0);
      expect(f.x[f.x.length - 1]).toBe(L);
      expect(indexOf(f.x, a)).toBeGreaterThan(0);
      f.x.forEach((x, k) => close(f.M_major[k], x <= a ? (P * (L - a) * x) / L : (P * a * (L - x)) / L));
    }
  });

  it('refuses 2 and 202 stations with a message naming the setting', () => {
    for (const n of [2, 202]) {
      const b = beam().support('A', 'fixed').loadCase('D').nodeLoad('D', 'B', { fz: -1 });
      b.model.settings.stations = n;
      expect(() => analyse(b.build())).toThrow(`settings stations must be a whole number from 3 to 201 (got ${n})`);
    }
  });
});
