/**
 * EN 1993-1-1 6.2.9 bending and axial force (cross-section). Class 1 and 2 I/H sections
 * and hollow sections: reduced plastic moments of 6.2.9.1.
 *  I/H (6.36–6.38): a = min((A − 2b·tf)/A, 0.5), MN,y = Mpl,y(1 − n)/(1 − 0.5a) ≤ Mpl,y;
 *   MN,z = Mpl,z for n ≤ a, else Mpl,z[1 − ((n − a)/(1 − a))²]; α = 2, β = max(1, 5n).
 *  RHS (6.39, 6.40): aw = min((A − 2b·t)/A, 0.5), af = min((A − 2h·t)/A, 0.5);
 *   MN,y = Mpl,y(1 − n)/(1 − 0.5aw) ≤ Mpl,y, MN,z = Mpl,z(1 − n)/(1 − 0.5af) ≤ Mpl,z;
 *   α = β = 1.66/(1 − 1.13n²) ≤ 6.
 *  CHS: MN = Mpl(1 − n^1.7) (6.2.9.1(6) note, from memory), resultant moment.
 * The reported ratio is demand / capacity (checks.md):
 *  - bending about one axis (with or without N): MEd/MN,Rd of that axis (6.31 / 6.32);
 *  - CHS: √(My² + Mz²)/MN,Rd (a round section has no weak axis: the criterion with
 *    α = β = 2 is exactly this resultant ratio ≤ 1);
 *  - I/H and RHS under biaxial bending: the (6.41) criterion [My/MN,y]^α + [Mz/MN,z]^β ≤ 1,
 *    reported as the larger of its left-hand side and each single-axis ratio My/MN,y,
 *    Mz/MN,z. That never passes what (6.41) fails and never fails what it passes (each
 *    single-axis ratio ≤ 1 when (6.41) holds), and it does not drop below the uniaxial
 *    ratio when a small second moment appears. The record says which value governs.
 *  - axial force alone: n = NEd/Npl,Rd.
 * MN,Rd depends on n, so the ratio grows faster than the load when N acts with M
 * (the code's reduction, not a squared ratio).
 * Other shapes and class 3: linear sum NEd/NRd + My,Ed/My,Rd + Mz,Ed/Mz,Rd ≤ 1 (6.2.1(7)).
 * Class 4 (I/H and RHS): 6.2.9.3 (6.44) NEd/(Aeff·fy/γM0) + (My,Ed + NEd·eNy)/(Weff,y,min·fy/γM0)
 * + (Mz,Ed + NEd·eNz)/(Weff,z,min·fy/γM0) ≤ 1 with eN = 0 (doubly symmetric sections:
 * the centroid of Aeff under uniform compression does not move); a station in tension
 * uses the gross area for NEd (the effective area is a compression concept).
 * n ≥ 1: the linear sum is reported (the section is exhausted by the axial force).
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

/** Which value the 6.2.9 ratio is. */
export type AxialBendingForm = 'linear' | 'axial' | 'major' | 'minor' | 'resultant' | '6.41' | 'major of 6.41' | 'minor of 6.41';

/** The intermediate values of one evaluation (scratch of axialBendingRatio). */
export interface AxialBendingParts {
  n: number;
  MNy: number;
  MNz: number;
  /** exponents of (6.41) */
  alpha: number;
  beta: number;
  /** left-hand side of (6.41) (NaN when not biaxial) */
  lhs641: number;
  form: AxialBendingForm;
}

/** Scratch written by every axialBendingRatio call (no allocation in the evaluation loop). */
export const axialBendingLast: AxialBendingParts = { n: 0, MNy: 0, MNz: 0, alpha: 1, beta: 1, lhs641: NaN, form: 'linear' };

/** The 6.2.9 ratio for |N|, |My|, |Mz| at one station. */
export function axialBendingRatio(p: AxialBendingPlan, N: number, My: number, Mz: number): number {
  const s = axialBendingLast;
  const n = N / p.NRd;
  s.n = n; s.lhs641 = NaN; s.alpha = 1; s.beta = 1; s.MNy = p.MyRd; s.MNz = p.MzRd;
  if (p.kind === 'linear' || p.kind === 'eff' || n >= 1) { s.form = 'linear'; return n + My / p.MyRd + Mz / p.MzRd; }
  if (p.kind === 'CHS') {
    const MN = p.MyRd * (1 - n ** 1.7);
    s.MNy = MN; s.MNz = MN; s.alpha = 2; s.beta = 2;
    if (My === 0 && Mz === 0) { s.form = 'axial'; return n; }
    s.form = 'resultant';
    return Math.sqrt(My * My + Mz * Mz) / MN;
  }
  let MNy: number, MNz: number, alpha: number, beta: number;
  if (p.kind === 'I') {
    MNy = Math.min(p.MyRd, (p.MyRd * (1 - n)) / (1 - 0.5 * p.a));
    MNz = n <= p.a ? p.MzRd : p.MzRd * (1 - ((n - p.a) / (1 - p.a)) ** 2);
    alpha = 2; beta = Math.max(1, 5 * n);
  } else {
    MNy = Math.min(p.MyRd, (p.MyRd * (1 - n)) / (1 - 0.5 * p.aw));
    MNz = Math.min(p.MzRd, (p.MzRd * (1 - n)) / (1 - 0.5 * p.af));
    alpha = Math.min(6, 1.66 / (1 - 1.13 * n * n)); beta = alpha;
  }
  s.MNy = MNy; s.MNz = MNz; s.alpha = alpha; s.beta = beta;
  if (My === 0 && Mz === 0) { s.form = 'axial'; return n; }
  const ry = My / MNy, rz = Mz / MNz;
  if (Mz === 0) { s.form = 'major'; return ry; }
  if (My === 0) { s.form = 'minor'; return rz; }
  const lhs = ry ** alpha + rz ** beta;
  s.lhs641 = lhs;
  if (lhs >= ry && lhs >= rz) { s.form = '6.41'; return lhs; }
  s.form = ry >= rz ? 'major of 6.41' : 'minor of 6.41';
  return ry >= rz ? ry : rz;
}

const FORM_WORDS: Record<AxialBendingForm, string> = {
  linear: 'ratio = left-hand side of the linear criterion',
  axial: 'axial force alone: ratio = n = NEd/Npl,Rd',
  major: 'bending about the major axis only: ratio = My,Ed/MN,y,Rd (6.31)',
  minor: 'bending about the minor axis only: ratio = Mz,Ed/MN,z,Rd (6.31)',
  resultant: 'circular hollow section: ratio = √(My,Ed² + Mz,Ed²)/MN,Rd (equivalent to (6.41) with α = β = 2)',
  '6.41': 'biaxial bending: ratio = left-hand side of (6.41) (exponent criterion; pass/fail as (6.41))',
  'major of 6.41': 'biaxial bending: ratio = My,Ed/MN,y,Rd, larger than the (6.41) left-hand side; pass/fail as (6.41)',
  'minor of 6.41': 'biaxial bending: ratio = Mz,Ed/MN,z,Rd, larger than the (6.41) left-hand side; pass/fail as (6.41)',
};

export function axialBendingHead(p: AxialBendingPlan, N: number, My: number, Mz: number): RecordHead {
  axialBendingRatio(p, N, My, Mz);
  const s = { ...axialBendingLast };
  const eq: Record<AxialBendingKind, string> = {
    I: 'MN,y,Rd = Mpl,y,Rd(1 − n)/(1 − 0.5a) ≤ Mpl,y,Rd (6.36); MN,z,Rd = Mpl,z,Rd for n ≤ a, else Mpl,z,Rd[1 − ((n − a)/(1 − a))²] (6.37, 6.38); biaxial: [My/MN,y,Rd]^2 + [Mz/MN,z,Rd]^β ≤ 1, β = 5n ≥ 1 (6.41)',
    RHS: 'MN,y,Rd = Mpl,y,Rd(1 − n)/(1 − 0.5aw) ≤ Mpl,y,Rd, MN,z,Rd = Mpl,z,Rd(1 − n)/(1 − 0.5af) ≤ Mpl,z,Rd (6.39, 6.40); biaxial: [My/MN,y,Rd]^α + [Mz/MN,z,Rd]^α ≤ 1, α = 1.66/(1 − 1.13n²) ≤ 6 (6.41)',
    CHS: 'MN,Rd = Mpl,Rd(1 − n^1.7) (6.2.9.1(6)); √(My² + Mz²)/MN,Rd ≤ 1',
    linear: 'NEd/NRd + My,Ed/My,Rd + Mz,Ed/Mz,Rd ≤ 1 (6.2.1(7))',
    eff: 'class 4: NEd/(Aeff·fy/γM0) + (My,Ed + NEd·eNy)/(Weff,y,min·fy/γM0) + (Mz,Ed + NEd·eNz)/(Weff,z,min·fy/γM0) ≤ 1 (6.44), eN = 0 (doubly symmetric); in tension NRd = A·fy/γM0',
  };
  const lin = p.kind === 'linear' || p.kind === 'eff';
  const reduced = !lin && s.form !== 'linear';
  const geo = p.kind === 'I' ? [inp('a', '(A − 2b·tf)/A ≤ 0.5', p.a, 'ratio')]
    : p.kind === 'RHS' ? [inp('aw', '(A − 2b·t)/A ≤ 0.5', p.aw, 'ratio'), inp('af', '(A − 2h·t)/A ≤ 0.5', p.af, 'ratio')] : [];
  return {
    family: 'combined', code: 'en1993-1-1', clause: p.kind === 'linear' ? '6.2.1(7)' : p.kind === 'eff' ? '6.2.9.3' : '6.2.9.1', title: 'bending and axial force, cross-section',
    equation: eq[p.kind] + (!lin && s.form === 'linear' ? '; n ≥ 1: linear sum reported' : ''),
    inputs: [
      inp('NEd', 'axial force', N, 'force'), inp('NRd', 'axial resistance', p.NRd, 'force'), inp('n', 'NEd/Npl,Rd', s.n, 'ratio'),
      inp('My,Ed', 'major moment', My, 'moment'), inp('My,Rd', 'major moment resistance', p.MyRd, 'moment'),
      inp('Mz,Ed', 'minor moment', Mz, 'moment'), inp('Mz,Rd', 'minor moment resistance', p.MzRd, 'moment'),
      ...(reduced ? [...geo, inp('MN,y,Rd', 'reduced major moment resistance', s.MNy, 'moment'), inp('MN,z,Rd', 'reduced minor moment resistance', s.MNz, 'moment')] : []),
      ...(reduced && !Number.isNaN(s.lhs641) ? [inp('α', 'exponent, major (6.41)', s.alpha, 'ratio'), inp('β', 'exponent, minor (6.41)', s.beta, 'ratio'), inp('(6.41)', 'left-hand side', s.lhs641, 'ratio')] : []),
    ],
    quantity: 'ratio',
    note: FORM_WORDS[s.form],
  };
}
