/**
 * EN 1993-1-1 6.2.5 bending: Mc,Rd = Wpl·fy/γM0 (class 1, 2) or Wel,min·fy/γM0 (class 3)
 * (6.13, 6.14); class 4: Weff,min·fy/γM0 (6.15) with Weff of EN 1993-1-5 4.4 (I/H and RHS,
 * see effective.ts; other class 4 shapes not checked). 6.2.8 bending and shear: where VEd > 0.5·Vpl,Rd the
 * moment resistance is reduced with ρ = (2VEd/Vpl,Rd − 1)² (6.29): for I-sections with
 * equal flanges about the major axis (class 1, 2) My,V,Rd = (Wpl,y − ρ·Aw²/(4tw))·fy/γM0
 * (6.30), Aw = hw·tw; otherwise the reduced yield strength (1 − ρ)·fy is applied to the
 * whole section, M_V,Rd = (1 − ρ)·Mc,Rd (conservative reading of 6.2.8(3)).
 */
import { inp, notCheckedHead, type RecordHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { EnContext } from './context.js';
import { enClass, type EnClass } from './classification.js';
import { effectiveScope, effectiveSection } from './effective.js';

export interface EnBending {
  head: RecordHead;
  /** design moment resistance without shear; NaN = not checked */
  Mc: number;
  cls: EnClass;
  /** section modulus used (Wpl or Wel) */
  W: number;
  /** 6.30 applies (I-section, major axis, class 1 or 2) */
  iWeb: boolean;
  Aw: number;
  tw: number;
  fyM0: number;
  Wpl: number;
}

export function enBendingScope(g: DesignGeometry, c: EnContext, axis: 'major' | 'minor'): string | null {
  if (!g.hasDims) return 'custom section: class unknown (Table 5.2), not evaluated';
  if (g.shape === 'angle') return 'angle in bending: principal-axis bending of angles not implemented';
  if (g.shape === 'tee' && axis === 'minor') return 'tee bent about its axis of symmetry: not implemented';
  if (enClass(g, c.fy, axis) === 4) {
    const s = effectiveScope(g);
    if (s) return `${s} (${axis}-axis bending, 6.2.2.5)`;
  }
  return null;
}

export function bendingResistance(g: DesignGeometry, c: EnContext, axis: 'major' | 'minor'): EnBending {
  const family = axis === 'major' ? 'bending_major' : 'bending_minor';
  const title = `bending, ${axis} axis`;
  const fyM0 = c.fy / c.gammaM0;
  const scope = enBendingScope(g, c, axis);
  if (scope) return { head: notCheckedHead(family, 'en1993-1-1', '6.2.5', title, scope), Mc: NaN, cls: 4, W: 0, iWeb: false, Aw: 0, tw: 0, fyM0, Wpl: 0 };
  const cls = enClass(g, c.fy, axis);
  const Wpl = axis === 'major' ? g.Zmaj : g.Zmin;
  const Wel = axis === 'major' ? g.Smaj : g.Smin;
  const eff = cls === 4 ? effectiveSection(g, c.fy)! : null;
  const effB = eff ? (axis === 'major' ? eff.major : eff.minor) : null;
  const W = effB ? effB.W : cls <= 2 ? Wpl : Wel;
  const wName = cls <= 2 ? 'Wpl' : cls === 3 ? 'Wel' : 'Weff,min';
  const iWeb = axis === 'major' && g.shape === 'i' && cls <= 2;
  const Aw = (g.d - 2 * g.tf) * g.tw;
  return {
    Mc: W * fyM0, cls, W, iWeb, Aw, tw: g.tw, fyM0, Wpl,
    head: {
      family, code: 'en1993-1-1', clause: '6.2.5', title,
      equation: `Mc,Rd = ${wName}·fy/γM0 (${cls <= 2 ? '6.13' : cls === 3 ? '6.14' : '6.15'})${eff ? `; ${eff.rule}` : ''}; where VEd > 0.5·Vpl,Rd: ρ = (2VEd/Vpl,Rd − 1)² (6.29), `
        + (iWeb ? 'My,V,Rd = (Wpl,y − ρ·Aw²/(4tw))·fy/γM0 (6.30)' : 'M_V,Rd = (1 − ρ)·Mc,Rd (6.2.8(3), conservative)'),
      inputs: [inp(wName, 'section modulus', W, 'modulus'),
        ...(effB ? [inp('ρ flange', 'reduction factor, compression flange (EN 1993-1-5 4.4)', effB.rhoFlange, 'ratio'), inp('ρ web', 'reduction factor, web', effB.rhoWeb, 'ratio'), inp('ψ web', 'stress ratio of the web (effective flange, gross web)', effB.psiWeb, 'ratio')] : []), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM0', 'partial factor', c.gammaM0, 'ratio'), inp('class', `class in ${axis}-axis bending (Table 5.2)`, cls, 'ratio')],
      quantity: 'moment',
    },
  };
}

/** Moment resistance at a station with shear force V (magnitude) and Vpl,Rd (6.2.8). */
export function momentWithShear(b: EnBending, V: number, Vpl: number): number {
  if (!(V > 0.5 * Vpl)) return b.Mc;
  const q = (2 * V) / Vpl - 1;
  const rho = q >= 1 ? 1 : q * q;
  if (b.iWeb) {
    const m = (b.Wpl - (rho * b.Aw * b.Aw) / (4 * b.tw)) * b.fyM0;
    return m < 0 ? 0 : m < b.Mc ? m : b.Mc;
  }
  return (1 - rho) * b.Mc;
}
