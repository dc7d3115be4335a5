/**
 * EN 1993-1-1 6.2.3 tension: (2)a plastic resistance of the gross section
 * Npl,Rd = A·fy/γM0 (6.6); (2)b ultimate resistance of the net section
 * Nu,Rd = 0.9·Anet·fu/γM2 (6.7). Holes are not modelled: Anet = A unless given (stated).
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { EnContext, Resistance } from './context.js';

export function tensionGross(g: DesignGeometry, c: EnContext): Resistance {
  const cap = (g.A * c.fy) / c.gammaM0;
  return {
    capacity: cap,
    head: {
      family: 'tension', code: 'en1993-1-1', clause: '6.2.3(2)a', title: 'tension, gross section',
      equation: 'Npl,Rd = A·fy/γM0 (6.6)',
      inputs: [inp('A', 'area', g.A, 'area'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM0', 'partial factor', c.gammaM0, 'ratio')],
      quantity: 'force',
    },
  };
}

export function tensionNet(g: DesignGeometry, c: EnContext, Anet?: number): Resistance {
  if (c.fu === undefined) return { capacity: NaN, head: notCheckedHead('tension', 'en1993-1-1', '6.2.3(2)b', 'tension, net section', 'material gives no fu: (6.7) not evaluated') };
  const an = Anet ?? g.A;
  return {
    capacity: (0.9 * an * c.fu) / c.gammaM2,
    head: {
      family: 'tension', code: 'en1993-1-1', clause: '6.2.3(2)b', title: 'tension, net section',
      equation: 'Nu,Rd = 0.9·Anet·fu/γM2 (6.7)',
      inputs: [inp('Anet', 'net area', an, 'area'), inp('fu', 'ultimate strength', c.fu, 'stress'), inp('γM2', 'partial factor', c.gammaM2, 'ratio')],
      quantity: 'force',
      note: Anet === undefined ? 'holes not modelled: Anet = A assumed' : undefined,
    },
  };
}
