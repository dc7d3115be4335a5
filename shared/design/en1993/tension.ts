/**
 * EN 1993-1-1 6.2.3 tension: (2)a plastic resistance of the gross section
 * Npl,Rd = A·fy/γM0 (6.6); (2)b ultimate resistance of the net section
 * Nu,Rd = 0.9·Anet·fu/γM2 (6.7). Holes are not modelled: Anet = A unless given (stated).
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { NetArea } from '../../model/types.js';
import { netAreaProblem } from '../net-area.js';
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

/**
 * (2)b net section with Anet = An (sections or members table). Anet = A where not given,
 * stated as an assumption. U and Ae (AISC D3 shear lag) are not part of 6.2.3: when given
 * they are refused in the record (not used), never silently dropped.
 */
export function tensionNet(g: DesignGeometry, c: EnContext, net: NetArea = {}, source = ''): Resistance {
  if (c.fu === undefined) return { capacity: NaN, head: notCheckedHead('tension', 'en1993-1-1', '6.2.3(2)b', 'tension, net section', 'material gives no fu: (6.7) not evaluated') };
  const bad = netAreaProblem(g.A, { An: net.An });
  if (bad) return { capacity: NaN, head: notCheckedHead('tension', 'en1993-1-1', '6.2.3(2)b', 'tension, net section', `${bad}${source ? ` (${source})` : ''}`) };
  const an = net.An ?? g.A;
  const notes: string[] = [];
  if (net.An === undefined) notes.push('Anet = A assumed (no net area given; holes not modelled)');
  if (net.U !== undefined || net.Ae !== undefined) notes.push(`${[net.U !== undefined ? 'U' : '', net.Ae !== undefined ? 'Ae' : ''].filter(Boolean).join(' and ')} given but not used: EN 1993-1-1 6.2.3 uses Anet only (shear lag of angles: EN 1993-1-8 3.10.3, not implemented)`);
  return {
    capacity: (0.9 * an * c.fu) / c.gammaM2,
    head: {
      family: 'tension', code: 'en1993-1-1', clause: '6.2.3(2)b', title: 'tension, net section',
      equation: 'Nu,Rd = 0.9·Anet·fu/γM2 (6.7)',
      inputs: [
        inp('Anet', net.An === undefined ? 'net area (assumed = A)' : `net area (given${source ? `, ${source}` : ''})`, an, 'area'), inp('fu', 'ultimate strength', c.fu, 'stress'), inp('γM2', 'partial factor', c.gammaM2, 'ratio'),
        ...(notes.length ? [inp('assumed', 'assumptions', notes.join('; '), 'text')] : []),
      ],
      quantity: 'force',
      note: notes.length ? notes.join('; ') : undefined,
    },
  };
}
