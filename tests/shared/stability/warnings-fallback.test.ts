/** The first-order stability warning when αcr cannot be computed: the run goes on and says the check was not made. */
import { describe, expect, it, vi } from 'vitest';

vi.mock('../../../shared/stability/buckling.js', () => ({
  criticalLoadFactors: () => { throw new Error('eigen solve did not converge'); },
  lowestCriticalLoadFactors: () => { throw new Error('eigen solve did not converge'); },
}));

const { analyseModel } = await import('../../../shared/stability/index.js');
const { ModelBuilder } = await import('../engine/builders.js');

describe('first-order stability warning without αcr', () => {
  it('reports "stability not checked" with the reason instead of passing silently', () => {
    const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, 4).support('A', 'fixed').member('C', 'A', 'B')
      .loadCase('P').nodeLoad('P', 'B', { fz: -100e3 }).combination('U', { P: 1 });
    b.model.settings.designCode = 'en1993-1-1';
    const r = analyseModel(b.build());
    expect(r.stability.warnings.length).toBe(1);
    expect(r.stability.warnings[0].message).toMatch(/^stability not checked: the critical load factors could not be computed \(eigen solve did not converge\)/);
  });

  it('when the user asked for buckling modes the error is theirs to see', () => {
    const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, 4).support('A', 'fixed').member('C', 'A', 'B')
      .loadCase('P').nodeLoad('P', 'B', { fz: -100e3 }).combination('U', { P: 1 });
    b.model.settings.designCode = 'en1993-1-1';
    b.model.settings.bucklingModes = 2;
    expect(() => analyseModel(b.build())).toThrow(/did not converge/);
  });
});
