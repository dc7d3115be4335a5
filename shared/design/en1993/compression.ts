/**
 * EN 1993-1-1 6.2.4 compression: Nc,Rd = A·fy/γM0 for class 1, 2, 3 (6.10);
 * Nc,Rd = Aeff·fy/γM0 for class 4 (6.11) with Aeff of EN 1993-1-5 4.4 (I/H and RHS,
 * see effective.ts; other class 4 shapes not checked).
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { EnContext, Resistance } from './context.js';
import { enClass } from './classification.js';
import { effectiveScope, effectiveSection } from './effective.js';

export function compressionResistance(g: DesignGeometry, c: EnContext): Resistance {
  const scope = enCompressionScope(g, c);
  if (scope) return { capacity: NaN, head: notCheckedHead('compression', 'en1993-1-1', '6.2.4', 'compression, cross-section', scope) };
  const cls = enClass(g, c.fy, 'compression');
  if (cls === 4) {
    const e = effectiveSection(g, c.fy)!;
    return {
      capacity: (e.Aeff * c.fy) / c.gammaM0,
      head: {
        family: 'compression', code: 'en1993-1-1', clause: '6.2.4', title: 'compression, cross-section',
        equation: `Nc,Rd = Aeff·fy/γM0 (6.11), class 4; ${e.rule}`,
        inputs: [inp('Aeff', 'effective area', e.Aeff, 'area'), inp('A', 'gross area', g.A, 'area'), inp('ρ flange', 'reduction factor, flange (EN 1993-1-5 4.4)', e.rhoFlangeC, 'ratio'),
          inp('ρ web', 'reduction factor, web (EN 1993-1-5 4.4)', e.rhoWebC, 'ratio'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM0', 'partial factor', c.gammaM0, 'ratio'), inp('class', 'class in compression (Table 5.2)', 4, 'ratio')],
        quantity: 'force',
      },
    };
  }
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

/** Area in compression resistance: A (class 1–3) or Aeff (class 4; NaN when not available). */
export function compressionArea(g: DesignGeometry, c: EnContext): number {
  if (enClass(g, c.fy, 'compression') < 4) return g.A;
  const e = effectiveSection(g, c.fy);
  return e ? e.Aeff : NaN;
}

/** Why compression cannot be checked, or null. */
export function enCompressionScope(g: DesignGeometry, c: EnContext): string | null {
  if (!g.hasDims) return 'custom section: class unknown (Table 5.2), not evaluated';
  if (g.shape === 'angle') return 'angle in compression: class and principal-axis buckling of angles not implemented';
  if (enClass(g, c.fy, 'compression') === 4) {
    const s = effectiveScope(g);
    if (s) return `${s} (compression, 6.2.2.5)`;
  }
  return null;
}
