import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import type { Model } from '../../../shared/model/types.js';
import { type Quantity, toSI } from '../../../shared/units/index.js';
import { ModelBuilder } from './builders.js';

/**
 * One portal frame described twice: with US customary input numbers converted by the units module,
 * and with SI numbers converted by hand from the exact definitions (1 ft = 0.3048 m, 1 in = 0.0254 m,
 * 1 lbf = 4.4482216152605 N — NIST SP 811 appendix B). Both must give the same SI results.
 */
const FT = 0.3048, IN = 0.0254, KIP = 4448.2216152605;
const KSI = KIP / IN ** 2;

function portal(cv: (v: number, q: Quantity) => number): Model {
  const h = cv(14, 'length'), L = cv(24, 'length');
  return new ModelBuilder({ planeNormal: 'Y' })
    .material('A992', { E: cv(29000, 'stress'), nu: 0.3 })
    .section('W', { A: cv(7.68, 'area'), I_major: cv(204, 'inertia'), I_minor: cv(17.3, 'inertia'), J: cv(0.3, 'inertia') })
    .node('A', 0, 0, 0).node('B', 0, 0, h).node('C', L, 0, h).node('D', L, 0, 0)
    .support('A', 'fixed').support('D', 'pinned')
    .member('AB', 'A', 'B', { section: 'W', material: 'A992' }).member('BC', 'B', 'C', { section: 'W', material: 'A992' })
    .member('DC', 'D', 'C', { section: 'W', material: 'A992' })
    .loadCase('D').memberLoad('D', 'BC', 'uniform', 'global_z', cv(-1.2, 'line_load'))
    .memberLoad('D', 'BC', 'point', 'global_z', cv(-8, 'force'), { a: cv(6, 'length') })
    .nodeLoad('D', 'B', { fx: cv(5, 'force'), my: cv(10, 'moment') })
    .build();
}

describe('unit systems', () => {
  it('a model given in US units gives the same SI results as the same model in SI', () => {
    const viaModule = portal((v, q) => toSI(v, q, 'us'));
    const factors: Partial<Record<Quantity, number>> = {
      length: FT, stress: KSI, area: IN ** 2, inertia: IN ** 4, line_load: KIP / FT, force: KIP, moment: KIP * FT,
    };
    const byHand = portal((v, q) => v * factors[q]!);
    const a = analyse(viaModule), b = analyse(byHand);
    // Same physical model → same results; tolerance rel 1e-9 of the largest value.
    const ua = a.displacements(0), ub = b.displacements(0);
    const umax = Math.max(...ub.map(Math.abs));
    for (let i = 0; i < ua.length; i++) expect(Math.abs(ua[i] - ub[i])).toBeLessThan(1e-9 * umax);
    for (let m = 0; m < 3; m++) {
      const fa = a.memberForces(m, 0), fb = b.memberForces(m, 0);
      expect(fa.x.length).toBe(fb.x.length);
      const scale = Math.max(...fb.M_major.map(Math.abs));
      for (let i = 0; i < fa.x.length; i++) expect(Math.abs(fa.M_major[i] - fb.M_major[i])).toBeLessThan(1e-9 * scale);
    }
    expect(a.diagnostics.equilibrium[0].residual).toBeLessThan(1e-9);
  });
});
