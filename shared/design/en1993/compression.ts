/** EN 1993-1-1 6.2.4 compression: Nc,Rd = A·fy/γM0 for class 1, 2, 3 (6.10); class 4 not checked. */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { EnContext, Resistance } from './context.js';
import { enClass } from './classification.js';

export function compressionResistance(g: DesignGeometry, c: EnContext): Resistance {
  const scope = enCompressionScope(g, c);
  if (scope) return { capacity: NaN, head: notCheckedHead('compression', 'en1993-1-1', '6.2.4', 'compression, cross-section', scope) };
  const cls = enClass(g, c.fy, 'compression');
  return {
    capacity: (g.A * c.fy) / c.gammaM0,
    head: {
      family: 'compression', code: 'en1993-1-1', clause: '6.2.4', title: 'compression, cross-section',
      equation: 'Nc,Rd = A·fy/γM0 (6.10), class 1, 2 or 3',
      inputs: [inp('A', 'area', g.A, 'area'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM0', 'partial factor', c.gammaM0, 'ratio'), inp('class', 'class in compression (Table 5.2)', cls, 'ratio')],
      quantity: 'force',
    },
  };
}

/** Why compression cannot be checked, or null. */
export function enCompressionScope(g: DesignGeometry, c: EnContext): string | null {
  if (!g.hasDims) return 'custom section: class unknown (Table 5.2), not evaluated';
  if (g.shape === 'angle') return 'angle in compression: class and principal-axis buckling of angles not implemented';
  if (enClass(g, c.fy, 'compression') === 4) return 'class 4 cross-section in compression: effective section (6.2.2.5, EN 1993-1-5) not implemented';
  return null;
}
