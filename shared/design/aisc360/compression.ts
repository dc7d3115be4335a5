/**
 * AISC 360-22 Chapter E compressive strength for members without slender elements:
 * E3 flexural buckling; E4 torsional buckling of doubly symmetric I-shapes and
 * flexural-torsional buckling of singly symmetric tees and channels; members with slender
 * elements by E7 (Pn = Fcr·Ae, effective-area.ts) for I-shapes, channels, tees,
 * rectangular and round HSS. Unsymmetric shapes and single angles (E5) are `not checked`.
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorInput, factorOn, factorWords } from './factors.js';
import { e7Scope, e7Words, effectiveAreaE7, hasSlenderElement } from './effective-area.js';
import type { AiscContext, Capacity } from './context.js';

/** Critical stress from the elastic buckling stress, Eqs. E3-2 (Fy/Fe ≤ 2.25, i.e. Lc/r ≤ 4.71√(E/Fy)) and E3-3. */
export function fcrE3(Fy: number, Fe: number): number {
  return Fy / Fe <= 2.25 ? Math.pow(0.658, Fy / Fe) * Fy : 0.877 * Fe;
}

/** Reason the member cannot be checked in compression, or null. */
export function compressionScope(g: DesignGeometry, c: AiscContext): string | null {
  if (!g.hasDims) return 'custom section: element slenderness unknown, Chapter E not evaluated';
  if (g.shape === 'angle') return 'single angle in compression: E5 not implemented';
  return e7Scope(g, c.E, c.Fy);
}

/** E3 about one axis: slenderness, Fe, Fcr, Ae (E7 when slender), Pn and the design strength. */
function e3Axis(g: DesignGeometry, c: AiscContext, Lc: number, r: number, slender: boolean) {
  const s = Lc / r;
  const Fe = (Math.PI * Math.PI * c.E) / (s * s);
  const Fcr = fcrE3(c.Fy, Fe);
  const Ae = slender ? effectiveAreaE7(g, c.E, c.Fy, Fcr) : g.A;
  const Pn = Fcr * Ae;
  return { s, Fe, Fcr, Ae, Pn, capacity: factorOn(c.method, AISC_FACTORS.compression) * Pn };
}

/**
 * E3 flexural buckling about both principal axes; Lc = K·L for each axis (m). The record
 * holds the governing (larger) slenderness; `axes` holds each axis's own Fe, Fcr and
 * strength (exports write a row per axis).
 */
export function compressionE3(g: DesignGeometry, c: AiscContext, LcMajor: number, LcMinor: number): Capacity {
  const reason = compressionScope(g, c);
  if (reason) return { capacity: NaN, head: notCheckedHead('compression', c.code, 'E3', 'flexural buckling', reason) };
  const slender = hasSlenderElement(g, c.E, c.Fy);
  const maj = e3Axis(g, c, LcMajor, g.rmaj, slender);
  const min = e3Axis(g, c, LcMinor, g.rmin, slender);
  const gov = maj.s > min.s ? maj : min;
  const { s, Fe, Fcr, Ae, Pn } = gov;
  const f = AISC_FACTORS.compression;
  const limit = 4.71 * Math.sqrt(c.E / c.Fy);
  const inelastic = c.Fy / Fe <= 2.25;
  const axisInputs = (name: 'major' | 'minor', a: ReturnType<typeof e3Axis>, Lc: number, r: number) => [
    inp('Fy', 'yield stress', c.Fy, 'stress'), inp('E', 'elastic modulus', c.E, 'stress'), inp('Ag', 'gross area', g.A, 'area'),
    inp(`Lc,${name}`, `effective length, ${name} axis`, Lc, 'length'), inp(`r_${name}`, `radius of gyration, ${name} axis`, r, 'section_dim'),
    inp('Lc/r', `slenderness, ${name} axis`, a.s, 'ratio'), inp('Fe', 'elastic buckling stress π²E/(Lc/r)²', a.Fe, 'stress'),
    inp('Fcr', c.Fy / a.Fe <= 2.25 ? 'critical stress 0.658^(Fy/Fe)·Fy (Eq. E3-2)' : 'critical stress 0.877·Fe (Eq. E3-3)', a.Fcr, 'stress'),
    ...(slender ? [inp('Ae', 'effective area (E7)', a.Ae, 'area')] : []), inp('Pn', 'nominal compressive strength', a.Pn, 'force'),
    factorInput(c.method, f, 'c'),
  ];
  return {
    capacity: gov.capacity,
    head: {
      family: 'compression', code: c.code, clause: slender ? 'E7' : 'E3', title: slender ? 'flexural buckling, slender elements' : 'flexural buckling',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φc·Pn' : 'Pn/Ωc', slender ? 'Fcr·Ae (E7-1)' : 'Fcr·Ag')}; Fe = π²E/(Lc/r)²; `
        + (inelastic ? 'Lc/r ≤ 4.71√(E/Fy): Fcr = 0.658^(Fy/Fe)·Fy (Eq. E3-2)' : 'Lc/r > 4.71√(E/Fy): Fcr = 0.877·Fe (Eq. E3-3)')
        + (slender ? `; ${e7Words(g)}` : ''),
      inputs: [
        inp('Fy', 'yield stress', c.Fy, 'stress'), inp('E', 'elastic modulus', c.E, 'stress'), inp('Ag', 'gross area', g.A, 'area'),
        inp('Lc,major', 'effective length, major axis', LcMajor, 'length'), inp('r_major', 'radius of gyration, major axis', g.rmaj, 'section_dim'),
        inp('Lc,minor', 'effective length, minor axis', LcMinor, 'length'), inp('r_minor', 'radius of gyration, minor axis', g.rmin, 'section_dim'),
        inp('Lc/r', 'governing slenderness', s, 'ratio'), inp('4.71√(E/Fy)', 'inelastic/elastic limit', limit, 'ratio'),
        inp('Fe', 'elastic buckling stress', Fe, 'stress'), inp('Fcr', 'critical stress', Fcr, 'stress'),
        ...(slender ? [inp('Ae', 'effective area (E7)', Ae, 'area')] : []), inp('Pn', 'nominal compressive strength', Pn, 'force'), factorInput(c.method, f, 'c'),
      ],
      quantity: 'force',
      note: slender ? 'slender elements (Table B4.1a): effective area per E7' : 'nonslender elements (Table B4.1a)',
      axes: [
        { axis: 'major', inputs: axisInputs('major', maj, LcMajor, g.rmaj), capacity: maj.capacity },
        { axis: 'minor', inputs: axisInputs('minor', min, LcMinor, g.rmin), capacity: min.capacity },
      ],
    },
  };
}

/**
 * E4 torsional buckling. Doubly symmetric I: Fe = (π²E·Cw/Lcz² + G·J)/(Ix + Iy) (Eq. E4-2)
 * with Lcz taken as the minor-axis effective length (stated). Tees and channels: E4(b)
 * below. Closed and solid sections: null (torsional buckling does not govern, E4 user
 * note). Angles and custom sections: not checked.
 */
export function compressionE4(g: DesignGeometry, c: AiscContext, Lcz: number, LcMajor = Lcz, LcMinor = Lcz): Capacity | null {
  if (g.shape === 'rhs' || g.shape === 'chs' || g.shape === 'rect' || g.shape === 'round') return null;
  if (g.shape === 'angle' || g.shape === 'custom') {
    return { capacity: NaN, head: notCheckedHead('compression', c.code, 'E4', 'flexural-torsional buckling', `${g.shape === 'custom' ? 'custom section' : 'single angle'}: E4 flexural-torsional buckling of unsymmetric members not implemented`) };
  }
  const reason = compressionScope(g, c);
  if (reason) return { capacity: NaN, head: notCheckedHead('compression', c.code, 'E4', 'torsional buckling', reason) };
  if (g.shape === 'tee' || g.shape === 'channel') return compressionE4Singly(g, c, Lcz, LcMajor, LcMinor);
  const Fe = ((Math.PI * Math.PI * c.E * g.Cw) / (Lcz * Lcz) + c.G * g.J) / (g.Imaj + g.Imin);
  const Fcr = fcrE3(c.Fy, Fe);
  const slender = hasSlenderElement(g, c.E, c.Fy);
  const Ae = slender ? effectiveAreaE7(g, c.E, c.Fy, Fcr) : g.A;
  const Pn = Fcr * Ae;
  const f = AISC_FACTORS.compression;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'compression', code: c.code, clause: 'E4', title: 'torsional buckling',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φc·Pn' : 'Pn/Ωc', slender ? 'Fcr·Ae (E7-1)' : 'Fcr·Ag')}; Fe = (π²E·Cw/Lcz² + G·J)/(Ix + Iy) (Eq. E4-2); Fcr by Eq. E3-2/E3-3${slender ? `; ${e7Words(g)}` : ''}`,
      inputs: [
        inp('Fy', 'yield stress', c.Fy, 'stress'), inp('E', 'elastic modulus', c.E, 'stress'), inp('G', 'shear modulus', c.G, 'stress'),
        inp('Cw', 'warping constant', g.Cw, 'warping'), inp('J', 'torsion constant', g.J, 'inertia'),
        inp('Ix', 'second moment, major', g.Imaj, 'inertia'), inp('Iy', 'second moment, minor', g.Imin, 'inertia'),
        inp('Lcz', 'torsional effective length', Lcz, 'length'), inp('Fe', 'elastic buckling stress', Fe, 'stress'),
        inp('Fcr', 'critical stress', Fcr, 'stress'), ...(slender ? [inp('Ae', 'effective area (E7)', Ae, 'area')] : []), inp('Pn', 'nominal compressive strength', Pn, 'force'), factorInput(c.method, f, 'c'),
      ],
      quantity: 'force',
      note: 'Lcz taken equal to the minor-axis effective length',
    },
  };
}

/**
 * Distance from the centroid to the shear centre of a tee (along the stem) or a channel
 * (along the flanges), thin-walled and without fillets (stated approximation).
 * Tee: shear centre at the intersection of the flange and stem mid-planes.
 * Channel: shear centre at e = 3b'²tf/(6b'tf + h'tw) behind the web mid-plane, with
 * b' = bf − tw/2 and h' = d − tf (the classical thin-walled result).
 */
export function shearCentreOffset(g: DesignGeometry): number {
  if (g.shape === 'tee') {
    const af = g.bf * g.tf, aw = (g.d - g.tf) * g.tw;
    const zc = (af * (g.d - g.tf / 2) + aw * ((g.d - g.tf) / 2)) / (af + aw); // from the stem tip
    return g.d - g.tf / 2 - zc;
  }
  const af = 2 * g.bf * g.tf, aw = (g.d - 2 * g.tf) * g.tw;
  const xc = (af * (g.bf / 2) + aw * (g.tw / 2)) / (af + aw); // from the back of the web
  const b = g.bf - g.tw / 2, h = g.d - g.tf;
  const e = (3 * b * b * g.tf) / (6 * b * g.tf + h * g.tw);
  return xc - g.tw / 2 + e;
}

/**
 * E4(b) singly symmetric members (tees: axis of symmetry is the minor axis; channels: the
 * major axis): Fe = (Fes + Fez)/(2H)·[1 − √(1 − 4·Fes·Fez·H/(Fes + Fez)²)] (Eq. E4-3) with
 * Fes the flexural buckling stress about the axis of symmetry, Fez = (π²E·Cw/Lcz² + G·J)/(Ag·ro²)
 * (Eq. E4-9), ro² = x0² + y0² + (Ix + Iy)/Ag (Eq. E4-11), H = 1 − (x0² + y0²)/ro² (Eq. E4-10).
 */
export function compressionE4Singly(g: DesignGeometry, c: AiscContext, Lcz: number, LcMajor: number, LcMinor: number): Capacity {
  const tee = g.shape === 'tee';
  const s = tee ? LcMinor / g.rmin : LcMajor / g.rmaj;
  const Fes = (Math.PI * Math.PI * c.E) / (s * s);
  const y0 = shearCentreOffset(g);
  const ro2 = y0 * y0 + (g.Imaj + g.Imin) / g.A;
  const H = 1 - (y0 * y0) / ro2;
  const Fez = ((Math.PI * Math.PI * c.E * g.Cw) / (Lcz * Lcz) + c.G * g.J) / (g.A * ro2);
  const sum = Fes + Fez;
  const Fe = (sum / (2 * H)) * (1 - Math.sqrt(1 - (4 * Fes * Fez * H) / (sum * sum)));
  const Fcr = fcrE3(c.Fy, Fe);
  const slender = hasSlenderElement(g, c.E, c.Fy);
  const Ae = slender ? effectiveAreaE7(g, c.E, c.Fy, Fcr) : g.A;
  const Pn = Fcr * Ae;
  const f = AISC_FACTORS.compression;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'compression', code: c.code, clause: 'E4', title: 'flexural-torsional buckling',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φc·Pn' : 'Pn/Ωc', slender ? 'Fcr·Ae (E7-1)' : 'Fcr·Ag')}; Fe = (Fes + Fez)/(2H)·[1 − √(1 − 4FesFezH/(Fes + Fez)²)] (Eq. E4-3); Fcr by Eq. E3-2/E3-3${slender ? `; ${e7Words(g)}` : ''}`,
      inputs: [
        inp('Fy', 'yield stress', c.Fy, 'stress'), inp('Fes', `flexural buckling stress about the axis of symmetry (${tee ? 'minor' : 'major'})`, Fes, 'stress'),
        inp('Fez', 'torsional buckling stress (Eq. E4-9)', Fez, 'stress'), inp('ro', 'polar radius of gyration about the shear centre (Eq. E4-11)', Math.sqrt(ro2), 'section_dim'),
        inp('y0', 'centroid to shear centre', y0, 'section_dim'), inp('H', 'flexural constant (Eq. E4-10)', H, 'ratio'),
        inp('Cw', 'warping constant', g.Cw, 'warping'), inp('J', 'torsion constant', g.J, 'inertia'), inp('Lcz', 'torsional effective length', Lcz, 'length'),
        inp('Fe', 'elastic buckling stress', Fe, 'stress'), inp('Fcr', 'critical stress', Fcr, 'stress'),
        ...(slender ? [inp('Ae', 'effective area (E7)', Ae, 'area')] : []), inp('Pn', 'nominal compressive strength', Pn, 'force'), factorInput(c.method, f, 'c'),
      ],
      quantity: 'force',
      note: 'Lcz taken equal to the minor-axis effective length; shear centre from thin-walled dimensions without fillets',
    },
  };
}
