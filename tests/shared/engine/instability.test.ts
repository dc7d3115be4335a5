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
