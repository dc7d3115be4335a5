/**
 * EN 1993-1-1 6.2.9 bending and axial force (cross-section). Class 1 and 2 I/H sections
 * and hollow sections: reduced plastic moments of 6.2.9.1 and the biaxial criterion (6.41)
 * [MyEd/MN,y,Rd]^α + [MzEd/MN,z,Rd]^β ≤ 1; the ratio reported is that left-hand side.
 *  I/H (6.36–6.38): a = min((A − 2b·tf)/A, 0.5), MN,y = Mpl,y(1 − n)/(1 − 0.5a) ≤ Mpl,y;
 *   MN,z = Mpl,z for n ≤ a, else Mpl,z[1 − ((n − a)/(1 − a))²]; α = 2, β = max(1, 5n).
 *  RHS (6.39, 6.40): aw = min((A − 2b·t)/A, 0.5), af = min((A − 2h·t)/A, 0.5);
 *   MN,y = Mpl,y(1 − n)/(1 − 0.5aw) ≤ Mpl,y, MN,z = Mpl,z(1 − n)/(1 − 0.5af) ≤ Mpl,z;
 *   α = β = 1.66/(1 − 1.13n²) ≤ 6.
 *  CHS: MN = Mpl(1 − n^1.7), α = β = 2 (6.2.9.1(6) note, from memory).
 * Other shapes and class 3: linear sum NEd/NRd + My,Ed/My,Rd + Mz,Ed/Mz,Rd ≤ 1 (6.2.1(7)).
 * Class 4 (I/H and RHS): 6.2.9.3 (6.44) NEd/(Aeff·fy/γM0) + (My,Ed + NEd·eNy)/(Weff,y,min·fy/γM0)
 * + (Mz,Ed + NEd·eNz)/(Weff,z,min·fy/γM0) ≤ 1 with eN = 0 (doubly symmetric sections:
 * the centroid of Aeff under uniform compression does not move); a station in tension
 * uses the gross area for NEd (the effective area is a compression concept).
 * The 6.2.9.1(4) allowance for small axial force is not used (conservative).
 */
import { inp, type RecordHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';

export type AxialBendingKind = 'I' | 'RHS' | 'CHS' | 'linear' | 'eff';

export interface AxialBendingPlan {
  kind: AxialBendingKind;
  NRd: number;
  MyRd: number;
  MzRd: number;
  a: number;
  aw: number;
  af: number;
}

export function axialBendingPlan(g: DesignGeometry, cls: number, NRd: number, MyRd: number, MzRd: number): AxialBendingPlan {
  let kind: AxialBendingKind = cls === 4 ? 'eff' : 'linear';
  if (cls <= 2) {
    if (g.shape === 'i') kind = 'I';
    else if (g.shape === 'rhs') kind = 'RHS';
    else if (g.shape === 'chs') kind = 'CHS';
  }
  return {
    kind, NRd, MyRd, MzRd,
    a: Math.min((g.A - 2 * g.bf * g.tf) / g.A, 0.5),
    aw: Math.min((g.A - 2 * g.b * g.t) / g.A, 0.5),
    af: Math.min((g.A - 2 * g.h * g.t) / g.A, 0.5),
  };
}

/** The 6.2.9 ratio for |N|, |My|, |Mz| at one station. */
export function axialBendingRatio(p: AxialBendingPlan, N: number, My: number, Mz: number): number {
  const n = N / p.NRd;
  if (p.kind === 'linear' || p.kind === 'eff' || n >= 1) return n + My / p.MyRd + Mz / p.MzRd;
  if (p.kind === 'I') {
    const MNy = Math.min(p.MyRd, (p.MyRd * (1 - n)) / (1 - 0.5 * p.a));
    const MNz = n <= p.a ? p.MzRd : p.MzRd * (1 - ((n - p.a) / (1 - p.a)) ** 2);
    const beta = Math.max(1, 5 * n);
    const ry = My / MNy;
    return ry * ry + (Mz === 0 ? 0 : beta === 1 ? Mz / MNz : (Mz / MNz) ** beta);
  }
  if (p.kind === 'RHS') {
    const MNy = Math.min(p.MyRd, (p.MyRd * (1 - n)) / (1 - 0.5 * p.aw));
    const MNz = Math.min(p.MzRd, (p.MzRd * (1 - n)) / (1 - 0.5 * p.af));
    const e = Math.min(6, 1.66 / (1 - 1.13 * n * n));
    return (My === 0 ? 0 : (My / MNy) ** e) + (Mz === 0 ? 0 : (Mz / MNz) ** e);
  }
  const MN = p.MyRd * (1 - n ** 1.7);
  return (My / MN) ** 2 + (Mz / MN) ** 2;
}

export function axialBendingHead(p: AxialBendingPlan, N: number, My: number, Mz: number): RecordHead {
  const eq: Record<AxialBendingKind, string> = {
    I: '[My/MN,y,Rd]^2 + [Mz/MN,z,Rd]^β ≤ 1 (6.41) with MN,y,Rd, MN,z,Rd of 6.2.9.1(5) I/H sections (6.36–6.38)',
    RHS: '[My/MN,y,Rd]^α + [Mz/MN,z,Rd]^α ≤ 1 (6.41), α = 1.66/(1 − 1.13n²) ≤ 6, MN of 6.2.9.1(5) hollow sections (6.39, 6.40)',
    CHS: '(My/MN,Rd)² + (Mz/MN,Rd)² ≤ 1, MN,Rd = Mpl,Rd(1 − n^1.7) (6.2.9.1)',
    linear: 'NEd/NRd + My,Ed/My,Rd + Mz,Ed/Mz,Rd ≤ 1 (6.2.1(7))',
    eff: 'class 4: NEd/(Aeff·fy/γM0) + (My,Ed + NEd·eNy)/(Weff,y,min·fy/γM0) + (Mz,Ed + NEd·eNz)/(Weff,z,min·fy/γM0) ≤ 1 (6.44), eN = 0 (doubly symmetric); in tension NRd = A·fy/γM0',
  };
  const lin = p.kind === 'linear' || p.kind === 'eff';
  return {
    family: 'combined', code: 'en1993-1-1', clause: p.kind === 'linear' ? '6.2.1(7)' : p.kind === 'eff' ? '6.2.9.3' : '6.2.9.1', title: 'bending and axial force, cross-section',
    equation: eq[p.kind] + (!lin && N / p.NRd >= 1 ? '; n ≥ 1: linear sum reported' : ''),
    inputs: [
      inp('NEd', 'axial force', N, 'force'), inp('NRd', 'axial resistance', p.NRd, 'force'), inp('n', 'NEd/Npl,Rd', N / p.NRd, 'ratio'),
      inp('My,Ed', 'major moment', My, 'moment'), inp('My,Rd', 'major moment resistance', p.MyRd, 'moment'),
      inp('Mz,Ed', 'minor moment', Mz, 'moment'), inp('Mz,Rd', 'minor moment resistance', p.MzRd, 'moment'),
    ],
    quantity: 'ratio',
    note: lin ? undefined : 'ratio = left-hand side of the criterion',
  };
}
