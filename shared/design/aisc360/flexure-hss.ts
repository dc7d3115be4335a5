/**
 * AISC 360-22 F7 (square and rectangular HSS) and F8 (round HSS) flexure.
 * F7: yielding Mp = Fy·Z (F7-1); flange local buckling of noncompact flanges (F7-2);
 * web local buckling of noncompact webs (F7-6); lateral-torsional buckling of rectangular
 * HSS about the major axis (F7-10, F7-11, Lp F7-12, Lr F7-13); slender flanges: Mn = Fy·Se
 * (F7-3), Se from the effective width of the compression flange
 * be = 1.92·t·√(E/Fy)·[1 − 0.38/(b/t)·√(E/Fy)] ≤ b (F7-4, from memory), the ineffective
 * strip (b − be) removed at the middle of the flange, Se = Ieff / largest distance from the
 * shifted centroid. Slender webs (F7.3(c)) are `not checked`.
 * F8: D/t < 0.45E/Fy; yielding (F8-1), local buckling of noncompact (F8-2) and slender
 * walls (F8-3, F8-4).
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorOn } from './factors.js';
import { flexureClassOf, flexureElements } from './classification.js';
import type { AiscContext } from './context.js';
import type { FlexureCapacity } from './flexure.js';

function phiWords(cx: AiscContext): string {
  return cx.method === 'lrfd' ? `φb·Mn, φb = ${AISC_FACTORS.flexure.phi}` : `Mn/Ωb, Ωb = ${AISC_FACTORS.flexure.omega}`;
}

export function flexureF7(g: DesignGeometry, cx: AiscContext, axis: 'major' | 'minor', Lb: number): FlexureCapacity {
  const { E, Fy } = cx;
  const family = axis === 'major' ? 'bending_major' : 'bending_minor';
  const title = `flexure, ${axis} axis`;
  const factor = factorOn(cx.method, AISC_FACTORS.flexure);
  const [flange, web] = flexureElements(g, E, Fy, axis);
  const fc = flexureClassOf(flange);
  const wc = flexureClassOf(web);
  if (wc === 'slender') return { head: notCheckedHead(family, cx.code, 'F7', title, `slender HSS web (h/t = ${web.ratio.toFixed(1)}): F7.3(c) not implemented`), factor, Mcap: NaN, M1: Infinity, ltb: '' };
  const Z = axis === 'major' ? g.Zmaj : g.Zmin;
  const S = axis === 'major' ? g.Smaj : g.Smin;
  const Mp = Fy * Z;
  let Mcap = Mp;
  const words = ['yielding Mn = Mp = Fy·Z (Eq. F7-1)'];
  const root = Math.sqrt(Fy / E);
  if (fc === 'noncompact') {
    Mcap = Math.min(Mcap, Mp - (Mp - Fy * S) * (3.57 * flange.ratio * root - 4.0));
    words.push('flange local buckling Mn = Mp − (Mp − Fy·S)(3.57·(b/t)·√(Fy/E) − 4.0) ≤ Mp (Eq. F7-2)');
  }
  let Se = NaN;
  if (fc === 'slender') {
    Se = effectiveModulusF7(g, axis, E, Fy);
    Mcap = Math.min(Mcap, Fy * Se);
    words.push('flange local buckling Mn = Fy·Se (Eq. F7-3), be = 1.92t√(E/Fy)[1 − 0.38/(b/t)·√(E/Fy)] ≤ b (Eq. F7-4)');
  }
  if (wc === 'noncompact') {
    Mcap = Math.min(Mcap, Mp - (Mp - Fy * S) * (0.305 * web.ratio * root - 0.738));
    words.push('web local buckling Mn = Mp − (Mp − Fy·S)(0.305·(h/t)·√(Fy/E) − 0.738) ≤ Mp (Eq. F7-6)');
  }
  Mcap = Math.min(Mcap, Mp);
  let M1 = Infinity;
  let ltb = 'not applicable';
  const inputs = [
    inp('Fy', 'yield stress', Fy, 'stress'), inp('E', 'elastic modulus', E, 'stress'), inp('Z', 'plastic modulus', Z, 'modulus'), inp('S', 'elastic modulus', S, 'modulus'),
    inp('b/t', 'flange slenderness', flange.ratio, 'ratio'), inp('flange', 'flange class (Table B4.1b)', fc, 'text'),
    inp('h/t', 'web slenderness', web.ratio, 'ratio'), inp('web', 'web class (Table B4.1b)', wc, 'text'),
    ...(fc === 'slender' ? [inp('Se', 'effective section modulus (F7.2(c))', Se, 'modulus')] : []),
  ];
  if (axis === 'major' && g.h > g.b) {
    const ry = g.rmin;
    const rja = Math.sqrt(g.J * g.A);
    const Lp = (0.13 * E * ry * rja) / Mp;
    const Lr = (2 * E * ry * rja) / (0.7 * Fy * S);
    inputs.push(inp('Lb', 'unbraced length', Lb, 'length'), inp('Lp', 'limiting length (Eq. F7-12)', Lp, 'length'), inp('Lr', 'limiting length (Eq. F7-13)', Lr, 'length'), inp('J', 'torsion constant', g.J, 'inertia'));
    if (Lb <= Lp) ltb = 'Lb ≤ Lp';
    else if (Lb <= Lr) {
      M1 = Mp - (Mp - 0.7 * Fy * S) * ((Lb - Lp) / (Lr - Lp));
      ltb = 'Lp < Lb ≤ Lr: Mn = Cb[Mp − (Mp − 0.7FyS)(Lb − Lp)/(Lr − Lp)] ≤ Mp (Eq. F7-10)';
    } else {
      M1 = (2 * E * rja) / (Lb / ry);
      ltb = 'Lb > Lr: Mn = 2E·Cb·√(J·Ag)/(Lb/ry) ≤ Mp (Eq. F7-11)';
    }
    words.push(`lateral-torsional buckling: ${ltb}`);
  }
  return {
    factor, Mcap, M1, ltb,
    head: { family, code: cx.code, clause: 'F7', title, equation: `${phiWords(cx)}; ${words.join('; ')}`, inputs, quantity: 'moment', note: 'flat widths b − 3t, h − 3t (corner radius unknown, B4.1b(d))' },
  };
}

/** Se of a rectangular HSS with the effective compression flange of F7-4 (see above). */
export function effectiveModulusF7(g: DesignGeometry, axis: 'major' | 'minor', E: number, Fy: number): number {
  const t = g.t;
  const outF = axis === 'major' ? g.b : g.h; // flange: the wall parallel to the axis of bending
  const depth = axis === 'major' ? g.h : g.b;
  const I = axis === 'major' ? g.Imaj : g.Imin;
  const b = outF - 3 * t;
  const r = Math.sqrt(E / Fy);
  const be = Math.min(b, 1.92 * t * r * (1 - (0.38 / (b / t)) * r));
  const a = (b - be) * t;
  const z = depth / 2 - t / 2;
  const Ae = g.A - a;
  const zc = (-a * z) / Ae;
  const Ie = I - a * z * z - Ae * zc * zc;
  return Ie / (depth / 2 + Math.abs(zc));
}

export function flexureF8(g: DesignGeometry, cx: AiscContext, axis: 'major' | 'minor'): FlexureCapacity {
  const { E, Fy } = cx;
  const family = axis === 'major' ? 'bending_major' : 'bending_minor';
  const title = `flexure, ${axis} axis`;
  const factor = factorOn(cx.method, AISC_FACTORS.flexure);
  const Dt = g.D / g.t;
  if (Dt >= (0.45 * E) / Fy) return { head: notCheckedHead(family, cx.code, 'F8', title, `D/t = ${Dt.toFixed(1)} ≥ 0.45E/Fy: outside F8`), factor, Mcap: NaN, M1: Infinity, ltb: '' };
  const [wall] = flexureElements(g, E, Fy, axis);
  const cls = flexureClassOf(wall);
  const Z = axis === 'major' ? g.Zmaj : g.Zmin;
  const S = axis === 'major' ? g.Smaj : g.Smin;
  let Mn = Fy * Z;
  let words = 'yielding Mn = Mp = Fy·Z (Eq. F8-1)';
  if (cls === 'noncompact') {
    Mn = Math.min(Mn, ((0.021 * E) / Dt + Fy) * S);
    words += '; local buckling Mn = (0.021E/(D/t) + Fy)·S (Eq. F8-2)';
  } else if (cls === 'slender') {
    Mn = Math.min(Mn, ((0.33 * E) / Dt) * S);
    words += '; local buckling Mn = Fcr·S, Fcr = 0.33E/(D/t) (Eqs. F8-3, F8-4)';
  }
  return {
    factor, Mcap: Mn, M1: Infinity, ltb: '',
    head: {
      family, code: cx.code, clause: 'F8', title, equation: `${phiWords(cx)}; ${words}`,
      inputs: [inp('Fy', 'yield stress', Fy, 'stress'), inp('E', 'elastic modulus', E, 'stress'), inp('Z', 'plastic modulus', Z, 'modulus'), inp('S', 'elastic modulus', S, 'modulus'), inp('D/t', 'wall slenderness', Dt, 'ratio'), inp('wall', 'wall class (Table B4.1b)', cls, 'text')],
      quantity: 'moment',
    },
  };
}
