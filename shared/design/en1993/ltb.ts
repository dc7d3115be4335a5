/**
 * EN 1993-1-1 6.3.2 lateral-torsional buckling of members in major-axis bending.
 * Mcr from the closed-form expression for a doubly symmetric section, load at the shear
 * centre, k = kw = 1 (end fork supports; the "3-factor" formula with C2, C3 terms zero):
 *   Mcr = C1·(π²·E·Iz/L²)·√(Iw/Iz + L²·G·It/(π²·E·Iz)).
 * C1 from the moment diagram of the unbraced segment: linear diagrams
 * C1 = 1.88 − 1.40ψ + 0.52ψ² ≤ 2.70 (ψ = ratio of end moments, from memory of the
 * commonly published approximation), other diagrams the quarter-point expression of
 * AISC 360-22 Eq. F1-1 (an approximation; gives 1.136 for a uniformly loaded simple span
 * against the commonly tabulated C1 = 1.13), limited to 2.70.
 * Rolled I-sections: 6.3.2.3 (λ̄LT,0 = 0.4, β = 0.75, Table 6.5 curves b for h/b ≤ 2,
 * c above); welded I, channels and rectangular bars: 6.3.2.2 general case (Table 6.4:
 * welded I c/d, other sections d). The factor f of 6.3.2.3(2) is taken as 1 (conservative).
 * Hollow sections, round bars and minor-axis bending are not susceptible (not evaluated,
 * common practice for hollow sections); tees, cantilevers and custom sections: not checked.
 */
import { inp, notCheckedHead, type RecordHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { EnContext } from './context.js';
import { ALPHA, type BucklingCurve } from './buckling.js';
import type { EnBending } from './bending.js';

export interface LtbPlan {
  /** null: not susceptible (no LTB check) */
  applies: boolean;
  /** not checked reason head (Mb NaN) */
  head: RecordHead;
  /** Mcr for C1 = 1 (N·m) */
  Mcr1: number;
  /** W·fy (N·m) */
  MRk: number;
  gammaM1: number;
  alpha: number;
  lambda0: number;
  beta: number;
  curve: BucklingCurve;
  method: string;
  Lcr: number;
}

/** C1 for a linear moment diagram with end-moment ratio ψ (−1 ≤ ψ ≤ 1). */
export function c1Linear(psi: number): number {
  const c = 1.88 - 1.4 * psi + 0.52 * psi * psi;
  return c > 2.7 ? 2.7 : c;
}

/** Mcr (closed form above) for a given C1. */
export function mcr(E: number, G: number, Iz: number, Iw: number, It: number, L: number, C1: number): number {
  const pe = (Math.PI * Math.PI * E * Iz) / (L * L);
  return C1 * pe * Math.sqrt(Iw / Iz + (L * L * G * It) / (Math.PI * Math.PI * E * Iz));
}

/** χLT from λ̄LT (6.56 / 6.57). */
export function chiLT(lam: number, alpha: number, lambda0: number, beta: number): number {
  if (lam <= lambda0) return 1;
  const phi = 0.5 * (1 + alpha * (lam - lambda0) + beta * lam * lam);
  let x = 1 / (phi + Math.sqrt(phi * phi - beta * lam * lam));
  if (x > 1) x = 1;
  if (beta !== 1) {
    const cap = 1 / (lam * lam);
    if (x > cap) x = cap;
  }
  return x;
}

export function ltbPlan(g: DesignGeometry, c: EnContext, bend: EnBending, Lcr: number, cantilever: boolean): LtbPlan {
  const base = { Mcr1: NaN, MRk: NaN, gammaM1: c.gammaM1, alpha: 0, lambda0: 0.4, beta: 1, curve: 'd' as BucklingCurve, method: '', Lcr };
  const nc = (reason: string): LtbPlan => ({ ...base, applies: true, head: notCheckedHead('bending_major', 'en1993-1-1', '6.3.2', 'lateral-torsional buckling', reason) });
  if (g.shape === 'rhs' || g.shape === 'chs' || g.shape === 'round') return { ...base, applies: false, head: notCheckedHead('bending_major', 'en1993-1-1', '6.3.2', 'lateral-torsional buckling', 'not susceptible') };
  if (g.shape === 'rect' && !(g.h > g.b)) return { ...base, applies: false, head: notCheckedHead('bending_major', 'en1993-1-1', '6.3.2', 'lateral-torsional buckling', 'not susceptible') };
  if (Number.isNaN(bend.Mc)) return nc(bend.head.note ?? 'bending resistance not available');
  if (Lcr === 0) return braced(g, c, bend, base);
  if (g.shape === 'tee' || g.shape === 'angle' || g.shape === 'custom') return nc(`${g.shape} section: Mcr of monosymmetric or unsymmetric sections not implemented`);
  if (cantilever) return nc('cantilever: Mcr of cantilevers (k ≠ 1, free end) not implemented');
  if (!(Lcr > 0)) return nc(`unbraced length ${Lcr} m is not usable`);
  const Iw = g.shape === 'rect' ? 0 : g.Cw;
  const Mcr1 = mcr(c.E, c.G, g.Imin, Iw, g.J, Lcr, 1);
  let method: string, curve: BucklingCurve, lambda0: number, beta: number;
  const hb = g.d / g.bf;
  if (g.shape === 'i' && g.rolled) {
    method = '6.3.2.3'; lambda0 = 0.4; beta = 0.75; curve = hb <= 2 ? 'b' : 'c';
  } else {
    method = '6.3.2.2'; lambda0 = 0.2; beta = 1;
    curve = g.shape === 'i' ? (hb <= 2 ? 'c' : 'd') : 'd';
  }
  const MRk = bend.W * c.fy;
  return {
    applies: true, Mcr1, MRk, gammaM1: c.gammaM1, alpha: ALPHA[curve], lambda0, beta, curve, method, Lcr,
    head: {
      family: 'bending_major', code: 'en1993-1-1', clause: method, title: 'lateral-torsional buckling',
      equation: 'Mb,Rd = χLT·Wy·fy/γM1 (6.55); λ̄LT = √(Wy·fy/Mcr); '
        + (method === '6.3.2.3' ? 'χLT = 1/(ΦLT + √(ΦLT² − 0.75λ̄LT²)) ≤ 1, ≤ 1/λ̄LT² (6.57), ΦLT = 0.5[1 + αLT(λ̄LT − 0.4) + 0.75λ̄LT²], f = 1' : 'χLT = 1/(ΦLT + √(ΦLT² − λ̄LT²)) ≤ 1 (6.56), ΦLT = 0.5[1 + αLT(λ̄LT − 0.2) + λ̄LT²]')
        + '; Mcr = C1·π²EIz/L²·√(Iw/Iz + L²GIt/(π²EIz)), k = kw = 1, load at the shear centre',
      inputs: [
        inp('Wy', `section modulus (${bend.cls <= 2 ? 'Wpl' : bend.cls === 3 ? 'Wel' : 'Weff'})`, bend.W, 'modulus'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM1', 'partial factor', c.gammaM1, 'ratio'),
        inp('E', 'elastic modulus', c.E, 'stress'), inp('G', 'shear modulus', c.G, 'stress'),
        inp('L', 'unbraced length', Lcr, 'length'), inp('Iz', 'second moment, minor', g.Imin, 'inertia'), inp('Iw', 'warping constant', Iw, 'warping'), inp('It', 'torsion constant', g.J, 'inertia'),
        inp('curve', `LTB curve (${method === '6.3.2.3' ? 'Table 6.5' : 'Table 6.4'})`, curve, 'text'), inp('αLT', 'imperfection factor (Table 6.3)', ALPHA[curve], 'ratio'),
      ],
      quantity: 'moment',
    },
  };
}

/**
 * lb = 0: continuously braced. No lateral-torsional buckling: Mcr = ∞, λ̄LT = 0, χLT = 1
 * (6.3.2.2(4) with λ̄LT ≤ λ̄LT,0), Mb,Rd = Wy·fy/γM1 — stated in the record.
 */
function braced(g: DesignGeometry, c: EnContext, bend: EnBending, base: Omit<LtbPlan, 'applies' | 'head'>): LtbPlan {
  const MRk = bend.W * c.fy;
  return {
    ...base, applies: true, Mcr1: Infinity, MRk, alpha: 0, lambda0: 0.4, beta: 1, method: 'braced', Lcr: 0,
    head: {
      family: 'bending_major', code: 'en1993-1-1', clause: '6.3.2', title: 'lateral-torsional buckling',
      equation: 'lb = 0, continuously braced: no lateral-torsional buckling, χLT = 1; Mb,Rd = χLT·Wy·fy/γM1 (6.55)',
      inputs: [inp('Wy', `section modulus (${bend.cls <= 2 ? 'Wpl' : bend.cls === 3 ? 'Wel' : 'Weff'})`, bend.W, 'modulus'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM1', 'partial factor', c.gammaM1, 'ratio'),
        inp('L', 'unbraced length (lb = 0: continuously braced)', 0, 'length')],
      quantity: 'moment',
      note: 'lb = 0: continuously braced, χLT = 1 (no lateral-torsional buckling)',
    },
  };
}

/** Mb,Rd for a given C1 (numbers only; χLT written to chiOut[0] when given). */
export function ltbMb(p: LtbPlan, C1: number, chiOut?: Float64Array): number {
  const lam = Math.sqrt(p.MRk / (p.Mcr1 * C1));
  const x = chiLT(lam, p.alpha, p.lambda0, p.beta);
  if (chiOut) chiOut[0] = x;
  return (x * p.MRk) / p.gammaM1;
}

/** Mb,Rd for a given C1. */
export function ltbResistance(p: LtbPlan, C1: number): { Mb: number; lam: number; chi: number; Mcr: number } {
  const Mcr = p.Mcr1 * C1;
  const lam = Math.sqrt(p.MRk / Mcr);
  const x = chiLT(lam, p.alpha, p.lambda0, p.beta);
  return { Mb: (x * p.MRk) / p.gammaM1, lam, chi: x, Mcr };
}

export function ltbHead(p: LtbPlan, C1: number, c1Source: string): RecordHead {
  const r = ltbResistance(p, C1);
  if (p.method === 'braced') return { ...p.head, inputs: [...p.head.inputs, inp('χLT', 'reduction factor (continuously braced)', 1, 'ratio')] };
  return {
    ...p.head,
    inputs: [...p.head.inputs, inp('C1', `moment-diagram factor (${c1Source})`, C1, 'ratio'), inp('Mcr', 'elastic critical moment', r.Mcr, 'moment'),
      inp('λ̄LT', 'non-dimensional slenderness', r.lam, 'ratio'), inp('λ̄LT,0', 'plateau length', p.lambda0, 'ratio'), inp('β', 'β (6.3.2.3; 1 for 6.3.2.2)', p.beta, 'ratio'),
      inp('ΦLT', '0.5[1 + αLT(λ̄LT − λ̄LT,0) + β·λ̄LT²]', 0.5 * (1 + p.alpha * (r.lam - p.lambda0) + p.beta * r.lam * r.lam), 'ratio'), inp('χLT', 'reduction factor', r.chi, 'ratio')],
  };
}
