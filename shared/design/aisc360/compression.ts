/**
 * AISC 360-22 Chapter E compressive strength for members without slender elements:
 * E3 flexural buckling and E4 torsional buckling of doubly symmetric I-shapes. Slender
 * elements (E7), singly symmetric and unsymmetric shapes (E4 flexural-torsional: tees,
 * channels) and single angles (E5) are `not checked`.
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorOn, factorWords } from './factors.js';
import { compressionClassOf, compressionElements } from './classification.js';
import type { AiscContext, Capacity } from './context.js';

/** Critical stress from the elastic buckling stress, Eqs. E3-2 (Fy/Fe ≤ 2.25, i.e. Lc/r ≤ 4.71√(E/Fy)) and E3-3. */
export function fcrE3(Fy: number, Fe: number): number {
  return Fy / Fe <= 2.25 ? Math.pow(0.658, Fy / Fe) * Fy : 0.877 * Fe;
}

/** Reason the member cannot be checked in compression, or null. */
export function compressionScope(g: DesignGeometry, c: AiscContext): string | null {
  if (!g.hasDims) return 'custom section: element slenderness unknown, Chapter E not evaluated';
  if (g.shape === 'angle') return 'single angle in compression: E5 not implemented';
  const slender = compressionElements(g, c.E, c.Fy).filter((e) => compressionClassOf(e) === 'slender');
  if (slender.length) {
    const e = slender[0];
    return `slender-element section in compression (${e.element} ${e.symbol} = ${e.ratio.toFixed(1)} > λr = ${e.lambdaR.toFixed(1)}, Table ${e.tableCase}): E7 not implemented`;
  }
  return null;
}

/** E3 flexural buckling about both principal axes; Lc = K·L for each axis (m). */
export function compressionE3(g: DesignGeometry, c: AiscContext, LcMajor: number, LcMinor: number): Capacity {
  const reason = compressionScope(g, c);
  if (reason) return { capacity: NaN, head: notCheckedHead('compression', c.code, 'E3', 'flexural buckling', reason) };
  const sMaj = LcMajor / g.rmaj;
  const sMin = LcMinor / g.rmin;
  const s = Math.max(sMaj, sMin);
  const Fe = (Math.PI * Math.PI * c.E) / (s * s);
  const Fcr = fcrE3(c.Fy, Fe);
  const Pn = Fcr * g.A;
  const f = AISC_FACTORS.compression;
  const limit = 4.71 * Math.sqrt(c.E / c.Fy);
  const inelastic = c.Fy / Fe <= 2.25;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'compression', code: c.code, clause: 'E3', title: 'flexural buckling',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φc·Pn' : 'Pn/Ωc', 'Fcr·Ag')}; Fe = π²E/(Lc/r)²; `
        + (inelastic ? 'Lc/r ≤ 4.71√(E/Fy): Fcr = 0.658^(Fy/Fe)·Fy (Eq. E3-2)' : 'Lc/r > 4.71√(E/Fy): Fcr = 0.877·Fe (Eq. E3-3)'),
      inputs: [
        inp('Fy', 'yield stress', c.Fy, 'stress'), inp('E', 'elastic modulus', c.E, 'stress'), inp('Ag', 'gross area', g.A, 'area'),
        inp('Lc,major', 'effective length, major axis', LcMajor, 'length'), inp('r_major', 'radius of gyration, major axis', g.rmaj, 'section_dim'),
        inp('Lc,minor', 'effective length, minor axis', LcMinor, 'length'), inp('r_minor', 'radius of gyration, minor axis', g.rmin, 'section_dim'),
        inp('Lc/r', 'governing slenderness', s, 'ratio'), inp('4.71√(E/Fy)', 'inelastic/elastic limit', limit, 'ratio'),
        inp('Fe', 'elastic buckling stress', Fe, 'stress'), inp('Fcr', 'critical stress', Fcr, 'stress'), inp('Pn', 'nominal compressive strength', Pn, 'force'),
      ],
      quantity: 'force',
      note: 'nonslender elements (Table B4.1a)',
    },
  };
}

/**
 * E4 torsional buckling. Doubly symmetric I: Fe = (π²E·Cw/Lcz² + G·J)/(Ix + Iy) (Eq. E4-2)
 * with Lcz taken as the minor-axis effective length (stated). Closed and solid sections:
 * null (torsional buckling does not govern, E4 user note). Tees and channels: not checked.
 */
export function compressionE4(g: DesignGeometry, c: AiscContext, Lcz: number): Capacity | null {
  if (g.shape === 'rhs' || g.shape === 'chs' || g.shape === 'rect' || g.shape === 'round') return null;
  if (g.shape === 'tee' || g.shape === 'channel' || g.shape === 'angle' || g.shape === 'custom') {
    return { capacity: NaN, head: notCheckedHead('compression', c.code, 'E4', 'flexural-torsional buckling', `${g.shape === 'custom' ? 'custom section' : g.shape}: E4 flexural-torsional buckling of singly symmetric and unsymmetric members not implemented`) };
  }
  const reason = compressionScope(g, c);
  if (reason) return { capacity: NaN, head: notCheckedHead('compression', c.code, 'E4', 'torsional buckling', reason) };
  const Fe = ((Math.PI * Math.PI * c.E * g.Cw) / (Lcz * Lcz) + c.G * g.J) / (g.Imaj + g.Imin);
  const Fcr = fcrE3(c.Fy, Fe);
  const Pn = Fcr * g.A;
  const f = AISC_FACTORS.compression;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'compression', code: c.code, clause: 'E4', title: 'torsional buckling',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φc·Pn' : 'Pn/Ωc', 'Fcr·Ag')}; Fe = (π²E·Cw/Lcz² + G·J)/(Ix + Iy) (Eq. E4-2); Fcr by Eq. E3-2/E3-3`,
      inputs: [
        inp('Fy', 'yield stress', c.Fy, 'stress'), inp('E', 'elastic modulus', c.E, 'stress'), inp('G', 'shear modulus', c.G, 'stress'),
        inp('Cw', 'warping constant', g.Cw, 'warping'), inp('J', 'torsion constant', g.J, 'inertia'),
        inp('Ix', 'second moment, major', g.Imaj, 'inertia'), inp('Iy', 'second moment, minor', g.Imin, 'inertia'),
        inp('Lcz', 'torsional effective length', Lcz, 'length'), inp('Fe', 'elastic buckling stress', Fe, 'stress'),
        inp('Fcr', 'critical stress', Fcr, 'stress'), inp('Pn', 'nominal compressive strength', Pn, 'force'),
      ],
      quantity: 'force',
      note: 'Lcz taken equal to the minor-axis effective length',
    },
  };
}
