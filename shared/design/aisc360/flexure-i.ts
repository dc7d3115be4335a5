/**
 * AISC 360-22 F2 (doubly symmetric compact I-shaped members and channels, major axis) and
 * F3 (doubly symmetric I-shaped members with compact webs and noncompact or slender
 * flanges, major axis). Noncompact or slender webs of doubly symmetric I-shapes: F4 / F5
 * (flexure-i-web.ts); channels outside F2 are `not checked`.
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorOn } from './factors.js';
import { flexureClassOf, flexureElements, kcOf } from './classification.js';
import type { AiscContext } from './context.js';
import type { FlexureCapacity } from './flexure.js';
import { flexureWebF4F5 } from './flexure-i-web.js';

export interface LtbLengths {
  Lp: number;
  Lr: number;
  rts: number;
  c: number;
  ho: number;
}

/** Lp (F2-5), rts (F2-7), c (F2-8a/b), Lr (F2-6). */
export function ltbLengthsF2(g: DesignGeometry, cx: AiscContext): LtbLengths {
  const { E, Fy } = cx;
  const Lp = 1.76 * g.rmin * Math.sqrt(E / Fy);
  const rts = Math.sqrt(Math.sqrt(g.Imin * g.Cw) / g.Smaj);
  const ho = g.ho;
  const c = g.shape === 'channel' ? (ho / 2) * Math.sqrt(g.Imin / g.Cw) : 1;
  const jc = (g.J * c) / (g.Smaj * ho);
  const Lr = 1.95 * rts * (E / (0.7 * Fy)) * Math.sqrt(jc + Math.sqrt(jc * jc + 6.76 * Math.pow((0.7 * Fy) / E, 2)));
  return { Lp, Lr, rts, c, ho };
}

/** Major-axis flexure of I-shapes (F2/F3) and channels (F2); Lb the unbraced length (m). */
export function flexureMajorI(g: DesignGeometry, cx: AiscContext, Lb: number): FlexureCapacity {
  const { E, Fy } = cx;
  const factor = factorOn(cx.method, AISC_FACTORS.flexure);
  const [flange, web] = flexureElements(g, E, Fy, 'major');
  const fl = flexureClassOf(flange);
  const wc = flexureClassOf(web);
  const nc = (clause: string, reason: string): FlexureCapacity => ({ head: notCheckedHead('bending_major', cx.code, clause, 'flexure, major axis', reason), factor, Mcap: NaN, M1: Infinity, ltb: '' });
  if (wc !== 'compact') {
    if (g.shape === 'i') return flexureWebF4F5(g, cx, Lb, flange, web, nc);
    return nc(wc === 'noncompact' ? 'F4' : 'F5', `channel with a ${wc} web (h/tw = ${web.ratio.toFixed(1)}): outside F2, not implemented`);
  }
  if (g.shape === 'channel' && fl !== 'compact') return nc('F2', `channel with ${fl} flanges (bf/tf = ${flange.ratio.toFixed(1)}): outside F2, not implemented`);
  const clause = fl === 'compact' ? 'F2' : 'F3';
  const Mp = Fy * g.Zmaj;
  const Sx = g.Smaj;
  const { Lp, Lr, rts, c, ho } = ltbLengthsF2(g, cx);
  let M1 = Infinity;
  let ltb = 'Lb ≤ Lp';
  if (Lb > Lp && Lb <= Lr) {
    M1 = Mp - (Mp - 0.7 * Fy * Sx) * ((Lb - Lp) / (Lr - Lp));
    ltb = 'Lp < Lb ≤ Lr: Mn = Cb[Mp − (Mp − 0.7FySx)(Lb − Lp)/(Lr − Lp)] ≤ Mp (Eq. F2-2)';
  } else if (Lb > Lr) {
    const s = Lb / rts;
    const Fcr1 = ((Math.PI * Math.PI * E) / (s * s)) * Math.sqrt(1 + ((0.078 * g.J * c) / (Sx * ho)) * s * s);
    M1 = Fcr1 * Sx;
    ltb = 'Lb > Lr: Mn = Fcr·Sx ≤ Mp, Fcr = Cb·π²E/(Lb/rts)²·√(1 + 0.078·Jc/(Sx·ho)·(Lb/rts)²) (Eqs. F2-3, F2-4)';
  }
  let Mcap = Mp;
  let flb = '';
  const lam = flange.ratio;
  if (fl === 'noncompact') {
    Mcap = Mp - (Mp - 0.7 * Fy * Sx) * ((lam - flange.lambdaP) / (flange.lambdaR - flange.lambdaP));
    flb = '; flange local buckling Mn = Mp − (Mp − 0.7FySx)(λ − λpf)/(λrf − λpf) (Eq. F3-1)';
  } else if (fl === 'slender') {
    Mcap = (0.9 * E * kcOf(g) * Sx) / (lam * lam);
    flb = '; flange local buckling Mn = 0.9·E·kc·Sx/λ² (Eq. F3-2)';
  }
  const phiWords = cx.method === 'lrfd' ? `φb·Mn, φb = ${AISC_FACTORS.flexure.phi}` : `Mn/Ωb, Ωb = ${AISC_FACTORS.flexure.omega}`;
  return {
    factor, Mcap, M1, ltb,
    head: {
      family: 'bending_major', code: cx.code, clause, title: 'flexure, major axis',
      equation: `${phiWords}; yielding Mn = Mp = Fy·Zx (Eq. F2-1); lateral-torsional buckling: ${ltb}${flb}`,
      inputs: [
        inp('Fy', 'yield stress', Fy, 'stress'), inp('E', 'elastic modulus', E, 'stress'), inp('Zx', 'plastic modulus, major', g.Zmaj, 'modulus'), inp('Sx', 'elastic modulus, major', Sx, 'modulus'),
        inp('Mp', 'plastic moment', Mp, 'moment'), inp('bf/2tf', 'flange slenderness', lam, 'ratio'), inp('flange', 'flange class (Table B4.1b)', fl, 'text'),
        inp('h/tw', 'web slenderness', web.ratio, 'ratio'), inp('Lb', 'unbraced length', Lb, 'length'), inp('Lp', 'limiting length, yielding (Eq. F2-5)', Lp, 'length'),
        inp('Lr', 'limiting length, inelastic LTB (Eq. F2-6)', Lr, 'length'), inp('rts', 'effective radius of gyration (Eq. F2-7)', rts, 'section_dim'),
        inp('c', 'c (Eq. F2-8)', c, 'ratio'), inp('ho', 'distance between flange centroids', ho, 'section_dim'), inp('J', 'torsion constant', g.J, 'inertia'),
      ],
      quantity: 'moment',
    },
  };
}
