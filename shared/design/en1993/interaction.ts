/**
 * EN 1993-1-1 6.3.3 uniform members in bending and axial compression, Eqs. (6.61), (6.62),
 * with the interaction factors of Annex B (method 2): Table B.1 for members not
 * susceptible to torsional deformations (hollow and solid sections), Table B.2 for
 * members susceptible to torsional deformations (open I-sections and channels).
 * Equivalent uniform moment factors Cmy, Cmz, CmLT from Table B.3, using the rows for
 * uniform load whenever the diagram is not linear (their values are not lower than the
 * concentrated-load rows), and the non-sway rows (a sway buckling mode would need
 * Cm = 0.9: the members table gives no sway information — stated in the record).
 * NEd, My,Ed, Mz,Ed are the largest magnitudes along the member (first order).
 */
import { inp, type RecordHead } from '../record.js';

/** Table B.3: Cm from end moments m0, m1, the interior moment ms of largest magnitude, and whether the diagram is linear. */
export function cmB3(m0: number, m1: number, ms: number, linear: boolean): number {
  const a0 = Math.abs(m0), a1 = Math.abs(m1);
  const Mh = a0 >= a1 ? m0 : m1;
  const other = a0 >= a1 ? m1 : m0;
  const psi = Mh === 0 ? 1 : other / Mh;
  if (linear) return Math.max(0.4, 0.6 + 0.4 * psi);
  if (Math.abs(ms) < Math.abs(Mh)) {
    const as = ms / Mh;
    if (as >= 0) return Math.max(0.4, 0.2 + 0.8 * as);
    return psi >= 0 ? Math.max(0.4, 0.1 - 0.8 * as) : Math.max(0.4, 0.1 * (1 - psi) - 0.8 * as);
  }
  const ah = ms === 0 ? 0 : Mh / ms;
  if (ah >= 0 || psi >= 0) return 0.95 + 0.05 * ah;
  return 0.95 + 0.05 * ah * (1 + 2 * psi);
}

export interface InteractionInput {
  NEd: number;
  MyEd: number;
  MzEd: number;
  NRk: number;
  MyRk: number;
  MzRk: number;
  chiY: number;
  chiZ: number;
  chiLT: number;
  lambdaY: number;
  lambdaZ: number;
  Cmy: number;
  Cmz: number;
  CmLT: number;
  gammaM1: number;
  /** class 1 or 2 (else class 3) */
  plastic: boolean;
  /** I-section (kzz of Table B.1 I-sections) */
  iSection: boolean;
  /** Table B.2 (susceptible to torsional deformations) */
  susceptible: boolean;
}

export interface InteractionFactors {
  kyy: number;
  kyz: number;
  kzy: number;
  kzz: number;
  r61: number;
  r62: number;
}

export function annexB(p: InteractionInput, out: InteractionFactors = { kyy: 0, kyz: 0, kzy: 0, kzz: 0, r61: 0, r62: 0 }): InteractionFactors {
  const ny = p.NEd / ((p.chiY * p.NRk) / p.gammaM1);
  const nz = p.NEd / ((p.chiZ * p.NRk) / p.gammaM1);
  let kyy: number, kzz: number, kyz: number, kzy: number;
  if (p.plastic) {
    kyy = p.Cmy * Math.min(1 + (p.lambdaY - 0.2) * ny, 1 + 0.8 * ny);
    kzz = p.iSection ? p.Cmz * Math.min(1 + (2 * p.lambdaZ - 0.6) * nz, 1 + 1.4 * nz) : p.Cmz * Math.min(1 + (p.lambdaZ - 0.2) * nz, 1 + 0.8 * nz);
    kyz = 0.6 * kzz;
    if (!p.susceptible) kzy = 0.6 * kyy;
    else if (p.lambdaZ >= 0.4) kzy = Math.max(1 - (0.1 * p.lambdaZ * nz) / (p.CmLT - 0.25), 1 - (0.1 * nz) / (p.CmLT - 0.25));
    else kzy = Math.min(0.6 + p.lambdaZ, 1 - (0.1 * p.lambdaZ * nz) / (p.CmLT - 0.25));
  } else {
    kyy = p.Cmy * Math.min(1 + 0.6 * p.lambdaY * ny, 1 + 0.6 * ny);
    kzz = p.Cmz * Math.min(1 + 0.6 * p.lambdaZ * nz, 1 + 0.6 * nz);
    kyz = kzz;
    kzy = p.susceptible ? Math.max(1 - (0.05 * p.lambdaZ * nz) / (p.CmLT - 0.25), 1 - (0.05 * nz) / (p.CmLT - 0.25)) : 0.8 * kyy;
  }
  const my = p.MyEd / ((p.chiLT * p.MyRk) / p.gammaM1);
  const mz = p.MzEd / (p.MzRk / p.gammaM1);
  out.kyy = kyy; out.kyz = kyz; out.kzy = kzy; out.kzz = kzz;
  out.r61 = ny + kyy * my + kyz * mz;
  out.r62 = nz + kzy * my + kzz * mz;
  return out;
}

export function interactionHead(p: InteractionInput, f: InteractionFactors): RecordHead {
  return {
    family: 'combined', code: 'en1993-1-1', clause: '6.3.3', title: 'member buckling, bending and axial compression',
    equation: `max of (6.61) NEd/(χy·NRk/γM1) + kyy·My,Ed/(χLT·My,Rk/γM1) + kyz·Mz,Ed/(Mz,Rk/γM1) and (6.62) NEd/(χz·NRk/γM1) + kzy·My,Ed/(χLT·My,Rk/γM1) + kzz·Mz,Ed/(Mz,Rk/γM1); k factors from Annex B Table ${p.susceptible ? 'B.2' : 'B.1'} (class ${p.plastic ? '1, 2' : '3'}), Cm from Table B.3`,
    inputs: [
      inp('NEd', 'compression', p.NEd, 'force'), inp('My,Ed', 'major moment', p.MyEd, 'moment'), inp('Mz,Ed', 'minor moment', p.MzEd, 'moment'),
      inp('NRk', 'A·fy', p.NRk, 'force'), inp('My,Rk', 'Wy·fy', p.MyRk, 'moment'), inp('Mz,Rk', 'Wz·fy', p.MzRk, 'moment'),
      inp('χy', 'flexural buckling, major', p.chiY, 'ratio'), inp('χz', 'flexural buckling, minor', p.chiZ, 'ratio'), inp('χLT', 'lateral-torsional buckling', p.chiLT, 'ratio'),
      inp('Cmy', 'Table B.3', p.Cmy, 'ratio'), inp('Cmz', 'Table B.3', p.Cmz, 'ratio'), inp('CmLT', 'Table B.3', p.CmLT, 'ratio'),
      inp('kyy', 'Annex B', f.kyy, 'ratio'), inp('kyz', 'Annex B', f.kyz, 'ratio'), inp('kzy', 'Annex B', f.kzy, 'ratio'), inp('kzz', 'Annex B', f.kzz, 'ratio'),
      inp('(6.61)', 'left-hand side', f.r61, 'ratio'), inp('(6.62)', 'left-hand side', f.r62, 'ratio'),
    ],
    quantity: 'ratio',
    note: 'non-sway Cm rows of Table B.3 assumed; uniform-load rows used for non-linear diagrams',
  };
}
