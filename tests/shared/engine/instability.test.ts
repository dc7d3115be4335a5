import { describe, expect, it } from 'vitest';
import { analyse, InstabilityError } from '../../../shared/engine/index.js';
import { ModelBuilder } from './builders.js';

function catchIt(fn: () => unknown): InstabilityError {
  try {
    fn();
  } catch (e) {
    if (e instanceof InstabilityError) return e;
    throw e;
  }
  throw new Error('expected an InstabilityError');
}

describe('instability in an engineer\'s words', () => {
  it('a node connected to nothing can translate freely', () => {
    const m = new ModelBuilder().node('A', 0, 0, 0).node('B', 3, 0, 0).node('N12', 9, 9, 9)
      .support('A', 'fixed').member('M1', 'A', 'B').loadCase('D').build();
    const e = catchIt(() => analyse(m));
    expect(e.node).toBe('N12');
    expect(e.freedom).toBe('ux');
    expect(e.message).toBe('node N12 can translate freely along X: add a support or connect it');
  });

  it('a beam on two rollers with no horizontal restraint slides along X', () => {
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 6, 0, 0)
      .support('A', 'uz').support('B', 'uz').member('M1', 'A', 'B')
      .loadCase('D').memberLoad('D', 'M1', 'uniform', 'global_z', -1e3).build();
    const e = catchIt(() => analyse(m));
    expect(['A', 'B']).toContain(e.node);
    expect(e.freedom).toBe('ux');
    expect(e.message).toMatch(/^node [AB] can translate freely along X: add a support or connect it$/);
  });

  it('a 3D beam on pins at both ends can spin about its axis', () => {
    const m = new ModelBuilder().node('A', 0, 0, 0).node('B', 6, 0, 0)
      .support('A', 'pinned').support('B', 'pinned').member('M1', 'A', 'B').loadCase('D').build();
    const e = catchIt(() => analyse(m));
    expect(e.freedom).toBe('rx');
    expect(e.message).toMatch(/^node [AB] can rotate freely about X: /);
  });

  it('a moment on a node that only trusses meet cannot be carried', () => {
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 4, 0, 0).node('C', 2, 0, 2)
      .support('A', 'pinned').support('B', 'uz')
      .member('AB', 'A', 'B', { type: 'truss' }).member('AC', 'A', 'C', { type: 'truss' }).member('BC', 'B', 'C', { type: 'truss' })
      .loadCase('D').nodeLoad('D', 'C', { my: 1e3 }).build();
    const e = catchIt(() => analyse(m));
    expect(e.message).toBe('node C can rotate freely about Y: add a rotational restraint or connect a member that resists it');
  });

  it('the same truss without the moment is stable (truss-only node rotations are removed)', () => {
    const m = new ModelBuilder().node('A', 0, 0, 0).node('B', 4, 0, 0).node('C', 2, 0, 2).node('D', 2, 2, 0)
      .support('A', 'pinned').support('B', 'pinned').support('D', 'pinned')
      .member('AC', 'A', 'C', { type: 'truss' }).member('BC', 'B', 'C', { type: 'truss' }).member('DC', 'D', 'C', { type: 'truss' })
      .loadCase('D').nodeLoad('D', 'C', { fz: -1e3 }).build();
    const r = analyse(m);
    expect(r.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });
});

describe('nodes where only pinned members meet', () => {
  // Tripod: apex O(0,0,3) on three legs to A(2,0,0), B(−1,1.8,0), C(−1,−1.8,0), all pinned at the base.
  const tripod = (legs: 'truss' | 'pinned frame', withMoment = false) => {
    const b = new ModelBuilder().node('O', 0, 0, 3).node('A', 2, 0, 0).node('B', -1, 1.8, 0).node('C', -1, -1.8, 0)
      .support('A', 'pinned').support('B', 'pinned').support('C', 'pinned');
    const opts = legs === 'truss' ? { type: 'truss' as const } : { releaseStart: 'pinned' as const, releaseEnd: 'pinned' as const };
    // one leg stays a truss so that the apex has only two torsion axes: its rotation block is singular
    b.member('LA', 'A', 'O', opts).member('LB', 'B', 'O', opts).member('LC', 'C', 'O', { type: 'truss' });
    b.loadCase('P').nodeLoad('P', 'O', { fx: 3e3, fy: -2e3, fz: -20e3, ...(withMoment ? { mz: 1e3 } : {}) });
    return b.build();
  };

  it('solves like a truss: the free spin of the apex carries nothing', () => {
    const a = analyse(tripod('truss')), b = analyse(tripod('pinned frame'));
    // Statics of a determinate tripod: the pinned frame legs carry the same axial forces as truss legs
    // (bending released at both ends, no span load). Tolerance rel 1e-9.
    for (let m = 0; m < 3; m++) expect(b.memberForces(m, 0).N[0] / a.memberForces(m, 0).N[0]).toBeCloseTo(1, 9);
    expect(b.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });

  it('refuses a node moment about the free spin axis, naming the node', () => {
    const e = catchIt(() => analyse(tripod('pinned frame', true)));
    expect(e.node).toBe('O');
    expect(e.message).toMatch(/^node O can rotate freely about [XYZ]: /);
  });
});

describe('a rotation left free by a release about a skewed axis', () => {
  it('is removed without changing the member forces', () => {
    // Cantilever A→O along X, minor bending released at O: rotation of O about local z carries nothing.
    // With roll = 45° that axis is skewed; with roll = 0 it is global Z. Loading each with the same
    // local components (P along local z and Q along local y) must give the same member forces
    // (statics of the member in its own axes). Tolerance rel 1e-9.
    const P = 5e3, Q = 2e3;
    const mk = (roll: number) => {
      const b = new ModelBuilder().node('A', 0, 0, 0).node('O', 4, 0, 0).support('A', 'fixed')
        .member('M', 'A', 'O', { roll, releaseEnd: 'pinned_minor' }).loadCase('P');
      // local y = cos(roll)·Y + sin(roll)·Z, local z = −sin(roll)·Y + cos(roll)·Z
      const cs = Math.cos(roll), sn = Math.sin(roll);
      return b.nodeLoad('P', 'O', { fy: Q * cs - P * sn, fz: Q * sn + P * cs }).build();
    };
    const a = analyse(mk(0)), b = analyse(mk(Math.PI / 4));
    const fa = a.memberForces(0, 0), fb = b.memberForces(0, 0);
    expect(fb.M_major[0] / fa.M_major[0]).toBeCloseTo(1, 9);
    expect(fb.M_minor[0] / fa.M_minor[0]).toBeCloseTo(1, 9);
    expect(Math.abs(fb.M_minor[fb.x.length - 1])).toBeLessThan(1e-6);
  });
});
