/**
 * AISC 360-22 F6: I-shaped members and channels bent about their minor axis. Yielding
 * Mn = Mp = Fy·Zy ≤ 1.6·Fy·Sy (F6-1); flange local buckling for noncompact (F6-2) and
 * slender flanges (F6-3, Fcr = 0.69E/λ²), λ = b/tf (b = bf/2 for I, bf for channels).
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorOn } from './factors.js';
import { flexureClassOf, flexureElements } from './classification.js';
import type { AiscContext } from './context.js';
import type { FlexureCapacity } from './flexure.js';

export function flexureMinorF6(g: DesignGeometry, cx: AiscContext): FlexureCapacity {
  const { E, Fy } = cx;
  const factor = factorOn(cx.method, AISC_FACTORS.flexure);
  if (g.shape !== 'i' && g.shape !== 'channel') {
    return { head: notCheckedHead('bending_minor', cx.code, 'F6', 'flexure, minor axis', 'F6 applies to I-shapes and channels only'), factor, Mcap: NaN, M1: Infinity, ltb: '' };
  }
  const [flange] = flexureElements(g, E, Fy, 'minor');
  const cls = flexureClassOf(flange);
  const Mp = Math.min(Fy * g.Zmin, 1.6 * Fy * g.Smin);
  let Mn = Mp;
  let words = 'Mn = Mp = Fy·Zy ≤ 1.6·Fy·Sy (Eq. F6-1)';
  const lam = flange.ratio;
  if (cls === 'noncompact') {
    Mn = Mp - (Mp - 0.7 * Fy * g.Smin) * ((lam - flange.lambdaP) / (flange.lambdaR - flange.lambdaP));
    words += '; flange local buckling Mn = Mp − (Mp − 0.7FySy)(λ − λpf)/(λrf − λpf) (Eq. F6-2)';
  } else if (cls === 'slender') {
    Mn = ((0.69 * E) / (lam * lam)) * g.Smin;
    words += '; flange local buckling Mn = Fcr·Sy, Fcr = 0.69E/λ² (Eqs. F6-3, F6-4)';
  }
  Mn = Math.min(Mn, Mp);
  const phiWords = cx.method === 'lrfd' ? `φb·Mn, φb = ${AISC_FACTORS.flexure.phi}` : `Mn/Ωb, Ωb = ${AISC_FACTORS.flexure.omega}`;
  return {
    factor, Mcap: Mn, M1: Infinity, ltb: '',
    head: {
      family: 'bending_minor', code: cx.code, clause: 'F6', title: 'flexure, minor axis',
      equation: `${phiWords}; ${words}`,
      inputs: [
        inp('Fy', 'yield stress', Fy, 'stress'), inp('E', 'elastic modulus', E, 'stress'), inp('Zy', 'plastic modulus, minor', g.Zmin, 'modulus'), inp('Sy', 'elastic modulus, minor', g.Smin, 'modulus'),
        inp('λ', `flange slenderness ${flange.symbol}`, lam, 'ratio'), inp('λpf', 'compact limit', flange.lambdaP, 'ratio'), inp('λrf', 'noncompact limit', flange.lambdaR, 'ratio'),
        inp('flange', 'flange class (Table B4.1b)', cls, 'text'),
      ],
      quantity: 'moment',
    },
  };
}
