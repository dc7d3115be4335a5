/**
 * Effective cross-section of class 4 sections, EN 1993-1-5 4.4 (plate elements without
 * longitudinal stiffeners), for doubly symmetric I/H sections (rolled or welded) and
 * rectangular hollow sections. Widths c as in EN 1993-1-1 Table 5.2 (I: outstand
 * (bf − tw − 2r)/2, web d − 2tf − 2r; RHS walls outside − 3t).
 *
 *  λ̄p = (b̄/t)/(28.4·ε·√kσ) (4.4(2));
 *  internal parts (4.2): ρ = 1 for λ̄p ≤ 0.5 + √(0.085 − 0.055ψ), else
 *    ρ = (λ̄p − 0.055(3 + ψ))/λ̄p² ≤ 1;
 *  outstands (4.3): ρ = 1 for λ̄p ≤ 0.748, else ρ = (λ̄p − 0.188)/λ̄p² ≤ 1;
 *  kσ internal (Table 4.1): ψ = 1: 4.0; 1 > ψ > 0: 8.2/(1.05 + ψ); 0 ≥ ψ > −1:
 *    7.81 − 6.29ψ + 9.78ψ²; −1 ≥ ψ > −3: 5.98(1 − ψ)²;
 *  kσ outstand (Table 4.2, largest compression at the free edge): 0.57 − 0.21ψ + 0.07ψ²
 *    (0.43 for ψ = 1, uniform compression).
 *  Distribution of beff (Table 4.1): ψ = 1: two halves at the edges; ψ < 0: beff = ρ·bc,
 *    be1 = 0.4beff next to the compressed edge, be2 = 0.6beff next to the neutral axis.
 *
 * Aeff: every part under uniform compression; for these doubly symmetric sections the
 * centroid does not move (eN = 0). Weff,y / Weff,z for bending: the compression flange
 * first (ψ from the gross section), then the web(s) with ψ from the section with the
 * effective compression flange and the gross web (4.4(3)); one pass, no iteration.
 * Weff = Ieff / largest distance from the effective centroid to an extreme fibre
 * (Weff,min). I-sections in minor-axis bending: flange outstands with the free edge in
 * compression, ψ = (tw/2 + r)/(bf/2) from the gross section, ineffective part at the tip.
 */
import type { DesignGeometry } from '../geometry.js';
import { epsilon } from './context.js';

/** kσ of an internal compression element, EN 1993-1-5 Table 4.1. */
export function kSigmaInternal(psi: number): number {
  if (psi >= 1) return 4;
  if (psi > 0) return 8.2 / (1.05 + psi);
  if (psi > -1) return 7.81 - 6.29 * psi + 9.78 * psi * psi;
  return 5.98 * (1 - psi) * (1 - psi);
}

/** kσ of an outstand with the largest compression at its free edge, EN 1993-1-5 Table 4.2. */
export function kSigmaOutstand(psi: number): number {
  if (psi >= 1) return 0.43;
  return 0.57 - 0.21 * psi + 0.07 * psi * psi;
}

/** λ̄p = (b̄/t)/(28.4ε√kσ). */
export function plateSlenderness(bt: number, eps: number, k: number): number {
  return bt / (28.4 * eps * Math.sqrt(k));
}

/** ρ for internal compression elements (EN 1993-1-5 4.4(2), Eq. 4.2). */
export function rhoInternal(lp: number, psi: number): number {
  if (lp <= 0.5 + Math.sqrt(0.085 - 0.055 * psi)) return 1;
  const r = (lp - 0.055 * (3 + psi)) / (lp * lp);
  return r > 1 ? 1 : r;
}

/** ρ for outstand compression elements (Eq. 4.3). */
export function rhoOutstand(lp: number): number {
  if (lp <= 0.748) return 1;
  const r = (lp - 0.188) / (lp * lp);
  return r > 1 ? 1 : r;
}

export interface EffectiveBending {
  W: number;
  I: number;
  /** shift of the centroid towards the tension side (m) */
  shift: number;
  rhoFlange: number;
  rhoWeb: number;
  psiWeb: number;
}

export interface EffectiveSection {
  Aeff: number;
  rhoFlangeC: number;
  rhoWebC: number;
  major: EffectiveBending;
  minor: EffectiveBending;
  /** words for the record */
  rule: string;
}

interface Hole { a: number; z: number; i: number }

/** Ieff and Weff,min of a section symmetric about z = 0 (depth 2·half) after removing holes. */
function afterHoles(A: number, I: number, half: number, holes: Hole[]): { W: number; I: number; shift: number } {
  let a = A, s = 0, i0 = I;
  for (const h of holes) { a -= h.a; s -= h.a * h.z; i0 -= h.i + h.a * h.z * h.z; }
  const zc = s / a;
  const Ie = i0 - a * zc * zc;
  const far = half + Math.abs(zc);
  return { W: Ie / far, I: Ie, shift: -zc };
}

/**
 * Bending about an axis with a compression flange (holes of total area `flangeLoss` at
 * lever `zf`) and webs of flat depth c (total thickness tw, centred on the axis).
 */
function flangeWebBending(A: number, I: number, half: number, flangeLoss: number, zf: number, rhoF: number, c: number, tw: number, tWall: number, eps: number, flangeHoleI = 0): EffectiveBending {
  const holes: Hole[] = flangeLoss > 0 ? [{ a: flangeLoss, z: zf, i: flangeHoleI }] : [];
  const a1 = A - flangeLoss;
  const zna = -(flangeLoss * zf) / a1; // centroid with the effective flange, gross web (shift < 0: towards tension)
  const zt = c / 2, zb = -c / 2;
  const psi = (zb - zna) / (zt - zna);
  const k = kSigmaInternal(psi);
  const rhoW = rhoInternal(plateSlenderness(c / tWall, eps, k), psi);
  if (rhoW < 1) {
    const bc = zt - zna;
    const beff = rhoW * bc;
    const hh = bc - beff;
    const top = zt - 0.4 * beff;
    holes.push({ a: hh * tw, z: top - hh / 2, i: (tw * hh ** 3) / 12 });
  }
  const r = afterHoles(A, I, half, holes);
  return { W: r.W, I: r.I, shift: r.shift, rhoFlange: rhoF, rhoWeb: rhoW, psiWeb: psi };
}

/** Why the effective section of this shape is not implemented, or null. */
export function effectiveScope(g: DesignGeometry): string | null {
  if (g.shape === 'i' || g.shape === 'rhs') return null;
  if (g.shape === 'chs') return 'class 4 circular hollow section: shell buckling (EN 1993-1-6) not implemented';
  return `class 4 ${g.shape} section: effective section (EN 1993-1-5 4.4) of this shape not implemented`;
}

/** The effective section (EN 1993-1-5 4.4) of an I/H or RHS, or null for other shapes. */
export function effectiveSection(g: DesignGeometry, fy: number): EffectiveSection | null {
  const eps = epsilon(fy);
  if (g.shape === 'i') {
    const cf = (g.bf - g.tw - 2 * g.r) / 2;
    const cw = g.d - 2 * g.tf - 2 * g.r;
    const rhoF = rhoOutstand(plateSlenderness(cf / g.tf, eps, 0.43));
    const rhoW = rhoInternal(plateSlenderness(cw / g.tw, eps, 4), 1);
    const Aeff = g.A - 4 * (1 - rhoF) * cf * g.tf - (1 - rhoW) * cw * g.tw;
    // major: the two outstands of the compression flange lose (1 − ρ)c at their tips
    const lossF = 2 * (1 - rhoF) * cf * g.tf;
    const major = flangeWebBending(g.A, g.Imaj, g.d / 2, lossF, g.d / 2 - g.tf / 2, rhoF, cw, g.tw, g.tw, eps);
    // minor: outstands on the compression side of both flanges, free edge in compression
    const psiF = (g.tw / 2 + g.r) / (g.bf / 2);
    const rhoFz = rhoOutstand(plateSlenderness(cf / g.tf, eps, kSigmaOutstand(psiF)));
    const w = (1 - rhoFz) * cf;
    const holes: Hole[] = w > 0 ? [{ a: 2 * w * g.tf, z: g.bf / 2 - w / 2, i: (2 * g.tf * w ** 3) / 12 }] : [];
    const mz = afterHoles(g.A, g.Imin, g.bf / 2, holes);
    return {
      Aeff, rhoFlangeC: rhoF, rhoWebC: rhoW, major,
      minor: { W: mz.W, I: mz.I, shift: mz.shift, rhoFlange: rhoFz, rhoWeb: 1, psiWeb: psiF },
      rule: 'EN 1993-1-5 4.4: flange outstands kσ = 0.43 (Table 4.2), web kσ from ψ (Table 4.1); eN = 0 (doubly symmetric)',
    };
  }
  if (g.shape === 'rhs') {
    const t = g.t;
    const cb = g.b - 3 * t, ch = g.h - 3 * t;
    const rhoB = rhoInternal(plateSlenderness(cb / t, eps, 4), 1);
    const rhoH = rhoInternal(plateSlenderness(ch / t, eps, 4), 1);
    const Aeff = g.A - 2 * (1 - rhoB) * cb * t - 2 * (1 - rhoH) * ch * t;
    const major = flangeWebBending(g.A, g.Imaj, g.h / 2, (1 - rhoB) * cb * t, g.h / 2 - t / 2, rhoB, ch, 2 * t, t, eps);
    const minor = flangeWebBending(g.A, g.Imin, g.b / 2, (1 - rhoH) * ch * t, g.b / 2 - t / 2, rhoH, cb, 2 * t, t, eps);
    return {
      Aeff, rhoFlangeC: rhoB, rhoWebC: rhoH, major, minor,
      rule: 'EN 1993-1-5 4.4: walls as internal parts, kσ from ψ (Table 4.1); eN = 0 (doubly symmetric)',
    };
  }
  return null;
}
