/**
 * AISC 360-22 D2 tensile strength: (a) yielding on the gross section, Pn = Fy·Ag;
 * (b) rupture on the effective net area, Pn = Fu·Ae with Ae = U·An. Connections are not
 * modelled, so An = Ag and U = 1.0 unless given (stated in the record).
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorOn, factorWords } from './factors.js';
import type { AiscContext, Capacity } from './context.js';

export function tensionYieldD2a(g: DesignGeometry, c: AiscContext): Capacity {
  const f = AISC_FACTORS.tensionYield;
  const Pn = c.Fy * g.A;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'tension', code: c.code, clause: 'D2(a)', title: 'tensile yielding',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φt·Pn' : 'Pn/Ωt', 'Fy·Ag')} (Eq. D2-1)`,
      inputs: [inp('Fy', 'yield stress', c.Fy, 'stress'), inp('Ag', 'gross area', g.A, 'area'), inp('Pn', 'nominal tensile strength', Pn, 'force')],
      quantity: 'force',
    },
  };
}

export function tensionRuptureD2b(g: DesignGeometry, c: AiscContext, An?: number, U?: number): Capacity {
  if (c.Fu === undefined) {
    return { capacity: NaN, head: notCheckedHead('tension', c.code, 'D2(b)', 'tensile rupture', 'material gives no Fu: D2(b) rupture not evaluated') };
  }
  const f = AISC_FACTORS.tensionRupture;
  const an = An ?? g.A;
  const u = U ?? 1;
  const Ae = an * u;
  const Pn = c.Fu * Ae;
  const assumed = An === undefined || U === undefined;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'tension', code: c.code, clause: 'D2(b)', title: 'tensile rupture',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φt·Pn' : 'Pn/Ωt', 'Fu·Ae')}, Ae = U·An (Eq. D2-2, D3-1)`,
      inputs: [
        inp('Fu', 'tensile strength', c.Fu, 'stress'), inp('An', 'net area', an, 'area'), inp('U', 'shear lag factor', u, 'ratio'),
        inp('Ae', 'effective net area', Ae, 'area'), inp('Pn', 'nominal tensile strength', Pn, 'force'),
      ],
      quantity: 'force',
      note: assumed ? 'connections not modelled: An = Ag and U = 1.0 assumed' : undefined,
    },
  };
}
