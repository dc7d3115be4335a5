/**
 * EN 1993-1-1 6.3.1 flexural buckling of uniform members in compression:
 * Nb,Rd = χ·A·fy/γM1 (6.47), χ = 1/(Φ + √(Φ² − λ̄²)) ≤ 1 (6.49),
 * Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²], λ̄ = √(A·fy/Ncr) (6.50), Ncr = π²EI/Lcr²;
 * class 4: Nb,Rd = χ·Aeff·fy/γM1, λ̄ = √(Aeff·fy/Ncr) (6.51), Aeff of EN 1993-1-5 4.4.
 * Imperfection factors α from Table 6.1; buckling curves from Table 6.2 (rolled I by h/b
 * and tf, with the S460 column; welded I by tf; hollow sections hot finished a (S460 a0),
 * cold formed c — a hollow section counts as hot finished only when its catalogue source
 * names EN 10210; U-, T- and solid sections c).
 */
import { inp, notCheckedHead, type RecordHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { EnContext, Resistance } from './context.js';
import { compressionArea, enCompressionScope } from './compression.js';

export type BucklingCurve = 'a0' | 'a' | 'b' | 'c' | 'd';
/** Table 6.1 imperfection factors. */
export const ALPHA: Record<BucklingCurve, number> = { a0: 0.13, a: 0.21, b: 0.34, c: 0.49, d: 0.76 };

/** Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²] (6.49). */
export function phiOf(lambda: number, alpha: number): number {
  return 0.5 * (1 + alpha * (lambda - 0.2) + lambda * lambda);
}

/** χ from λ̄ and α (6.49). */
export function chi(lambda: number, alpha: number): number {
  const phi = phiOf(lambda, alpha);
  const x = 1 / (phi + Math.sqrt(phi * phi - lambda * lambda));
  return x > 1 ? 1 : x;
}

/** Table 6.2: curves for buckling about the major (y-y) and minor (z-z) axes. */
export function bucklingCurves(g: DesignGeometry, fy: number, hotFinished: boolean): { y: BucklingCurve; z: BucklingCurve; row: string } {
  const s460 = fy >= 460e6;
  switch (g.shape) {
    case 'i': {
      if (!g.rolled) return g.tf <= 0.04 ? { y: 'b', z: 'c', row: 'welded I, tf ≤ 40 mm' } : { y: 'c', z: 'd', row: 'welded I, tf > 40 mm' };
      const hb = g.d / g.bf;
      if (hb > 1.2) {
        if (g.tf <= 0.04) return s460 ? { y: 'a0', z: 'a0', row: 'rolled I, h/b > 1.2, tf ≤ 40 mm, S460' } : { y: 'a', z: 'b', row: 'rolled I, h/b > 1.2, tf ≤ 40 mm' };
        return s460 ? { y: 'a', z: 'a', row: 'rolled I, h/b > 1.2, 40 < tf ≤ 100 mm, S460' } : { y: 'b', z: 'c', row: 'rolled I, h/b > 1.2, 40 < tf ≤ 100 mm' };
      }
      if (g.tf <= 0.1) return s460 ? { y: 'a', z: 'a', row: 'rolled I, h/b ≤ 1.2, tf ≤ 100 mm, S460' } : { y: 'b', z: 'c', row: 'rolled I, h/b ≤ 1.2, tf ≤ 100 mm' };
      return s460 ? { y: 'c', z: 'c', row: 'rolled I, h/b ≤ 1.2, tf > 100 mm, S460' } : { y: 'd', z: 'd', row: 'rolled I, h/b ≤ 1.2, tf > 100 mm' };
    }
    case 'rhs': case 'chs':
      if (hotFinished) return s460 ? { y: 'a0', z: 'a0', row: 'hollow, hot finished, S460' } : { y: 'a', z: 'a', row: 'hollow, hot finished' };
      return { y: 'c', z: 'c', row: 'hollow, cold formed (assumed unless the section source names EN 10210)' };
    case 'angle':
      return { y: 'b', z: 'b', row: 'L-section' };
    default:
      return { y: 'c', z: 'c', row: 'U-, T- and solid sections' };
  }
}

export interface FlexuralBuckling extends Resistance {
  chiY: number;
  chiZ: number;
  lambdaY: number;
  lambdaZ: number;
  /** the same with the gross area (for 6.3.3 when the section is class 1–3 under its loading) */
  chiYA: number;
  chiZA: number;
  lambdaYA: number;
  lambdaZA: number;
  /** area used (A or Aeff) */
  area: number;
}

export function flexuralBuckling(g: DesignGeometry, c: EnContext, LcrY: number, LcrZ: number): FlexuralBuckling {
  const scope = enCompressionScope(g, c);
  if (scope) return { capacity: NaN, chiY: NaN, chiZ: NaN, lambdaY: NaN, lambdaZ: NaN, chiYA: NaN, chiZA: NaN, lambdaYA: NaN, lambdaZA: NaN, area: NaN, head: notCheckedHead('compression', 'en1993-1-1', '6.3.1', 'flexural buckling', scope) };
  const area = compressionArea(g, c);
  const eff = area !== g.A;
  const NRk = area * c.fy;
  const NcrY = (Math.PI * Math.PI * c.E * g.Imaj) / (LcrY * LcrY);
  const NcrZ = (Math.PI * Math.PI * c.E * g.Imin) / (LcrZ * LcrZ);
  const lambdaY = Math.sqrt(NRk / NcrY);
  const lambdaZ = Math.sqrt(NRk / NcrZ);
  const curves = bucklingCurves(g, c.fy, c.hotFinished);
  const chiY = chi(lambdaY, ALPHA[curves.y]);
  const chiZ = chi(lambdaZ, ALPHA[curves.z]);
  const x = Math.min(chiY, chiZ);
  const lambdaYA = Math.sqrt((g.A * c.fy) / NcrY), lambdaZA = Math.sqrt((g.A * c.fy) / NcrZ);
  const head: RecordHead = {
    family: 'compression', code: 'en1993-1-1', clause: '6.3.1', title: 'flexural buckling',
    equation: eff
      ? 'class 4: Nb,Rd = χ·Aeff·fy/γM1 (6.47), χ = 1/(Φ + √(Φ² − λ̄²)) ≤ 1 (6.49), Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²], λ̄ = √(Aeff·fy/Ncr) (6.51); Aeff per EN 1993-1-5 4.4'
      : 'Nb,Rd = χ·A·fy/γM1 (6.47), χ = 1/(Φ + √(Φ² − λ̄²)) ≤ 1 (6.49), Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²], λ̄ = √(A·fy/Ncr) (6.50)',
    inputs: [
      eff ? inp('Aeff', 'effective area (class 4)', area, 'area') : inp('A', 'area', g.A, 'area'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM1', 'partial factor', c.gammaM1, 'ratio'),
      inp('Lcr,y', 'buckling length, major', LcrY, 'length'), inp('Lcr,z', 'buckling length, minor', LcrZ, 'length'),
      inp('Ncr,y', 'elastic critical force, major', NcrY, 'force'), inp('Ncr,z', 'elastic critical force, minor', NcrZ, 'force'),
      inp('λ̄y', 'non-dimensional slenderness, major', lambdaY, 'ratio'), inp('λ̄z', 'non-dimensional slenderness, minor', lambdaZ, 'ratio'),
      inp('curve y', `buckling curve (Table 6.2: ${curves.row})`, curves.y, 'text'), inp('curve z', 'buckling curve (Table 6.2)', curves.z, 'text'),
      inp('αy', 'imperfection factor (Table 6.1)', ALPHA[curves.y], 'ratio'), inp('αz', 'imperfection factor (Table 6.1)', ALPHA[curves.z], 'ratio'),
      inp('Φy', 'Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²], major', phiOf(lambdaY, ALPHA[curves.y]), 'ratio'), inp('Φz', 'Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²], minor', phiOf(lambdaZ, ALPHA[curves.z]), 'ratio'),
      inp('χy', 'reduction factor, major', chiY, 'ratio'), inp('χz', 'reduction factor, minor', chiZ, 'ratio'),
    ],
    quantity: 'force',
    axes: (['major', 'minor'] as const).map((axis) => {
      const y = axis === 'major';
      const lam = y ? lambdaY : lambdaZ, curve = y ? curves.y : curves.z, x = y ? chiY : chiZ;
      return {
        axis,
        inputs: [
          eff ? inp('Aeff', 'effective area (class 4)', area, 'area') : inp('A', 'area', g.A, 'area'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM1', 'partial factor', c.gammaM1, 'ratio'),
          inp('E', 'elastic modulus', c.E, 'stress'), inp(y ? 'Iy' : 'Iz', `second moment, ${axis}`, y ? g.Imaj : g.Imin, 'inertia'),
          inp(y ? 'Lcr,y' : 'Lcr,z', `buckling length, ${axis}`, y ? LcrY : LcrZ, 'length'), inp(y ? 'Ncr,y' : 'Ncr,z', 'elastic critical force π²EI/Lcr²', y ? NcrY : NcrZ, 'force'),
          inp(y ? 'λ̄y' : 'λ̄z', 'non-dimensional slenderness', lam, 'ratio'), inp(y ? 'curve y' : 'curve z', `buckling curve (Table 6.2: ${curves.row})`, curve, 'text'),
          inp(y ? 'αy' : 'αz', 'imperfection factor (Table 6.1)', ALPHA[curve], 'ratio'), inp(y ? 'Φy' : 'Φz', 'Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²]', phiOf(lam, ALPHA[curve]), 'ratio'),
          inp(y ? 'χy' : 'χz', 'reduction factor (6.49)', x, 'ratio'),
        ],
        capacity: (x * NRk) / c.gammaM1,
      };
    }),
  };
  return {
    capacity: (x * NRk) / c.gammaM1, chiY, chiZ, lambdaY, lambdaZ, head, area,
    chiYA: eff ? chi(lambdaYA, ALPHA[curves.y]) : chiY, chiZA: eff ? chi(lambdaZA, ALPHA[curves.z]) : chiZ, lambdaYA, lambdaZA,
  };
}
