/**
 * AISC 360-22 E7 members with slender elements: effective area Ae for Pn = Fcr·Ae (E7-1).
 * E7.1 (all elements except round HSS), with Fcr the critical stress of E3 or E4 from Ag:
 *   λ ≤ λr·√(Fy/Fcr): be = b (E7-2);
 *   λ > λr·√(Fy/Fcr): be = b·(1 − c1·√(Fel/Fcr))·√(Fel/Fcr) (E7-3), Fel = (c2·λr/λ)²·Fy (E7-5);
 *   Table E7.1: stiffened elements except walls of rectangular HSS c1 = 0.18, c2 = 1.31;
 *   walls of rectangular HSS c1 = 0.20, c2 = 1.38; all other (unstiffened) c1 = 0.22, c2 = 1.49.
 *   Ae = Ag − Σ(b − be)·t over the elements: I flanges four halves bf/2 × tf, web h × tw;
 *   channel flanges bf × tf, web h × tw; tee flange halves bf/2 × tf, stem d × tw;
 *   rectangular HSS walls (b − 3t) × t and (h − 3t) × t, two each.
 * E7.2 round HSS: D/t ≤ 0.11E/Fy: Ae = Ag; 0.11E/Fy < D/t < 0.45E/Fy:
 *   Ae = [0.038E/(Fy·(D/t)) + 2/3]·Ag (E7-7); D/t ≥ 0.45E/Fy is outside the scope (not checked).
 * Elements that are not slender keep be = b (E7-2 always holds for them, since Fcr ≤ Fy).
 */
import type { DesignGeometry } from '../geometry.js';
import { compressionClassOf, compressionElements } from './classification.js';

interface E7Element { name: string; b: number; t: number; n: number; lambda: number; lambdaR: number; c1: number; c2: number }

const STIFF = { c1: 0.18, c2: 1.31 };
const HSS = { c1: 0.2, c2: 1.38 };
const UNSTIFF = { c1: 0.22, c2: 1.49 };

/** The elements of E7.1 with widths and counts (empty for shapes E7.1 does not cover here). */
export function e7Elements(g: DesignGeometry, E: number, Fy: number): E7Element[] {
  const el = compressionElements(g, E, Fy);
  switch (g.shape) {
    case 'i':
      return [
        { name: 'flange', b: g.bf / 2, t: g.tf, n: 4, lambda: el[0].ratio, lambdaR: el[0].lambdaR, ...UNSTIFF },
        { name: 'web', b: g.hw, t: g.tw, n: 1, lambda: el[1].ratio, lambdaR: el[1].lambdaR, ...STIFF },
      ];
    case 'channel':
      return [
        { name: 'flange', b: g.bf, t: g.tf, n: 2, lambda: el[0].ratio, lambdaR: el[0].lambdaR, ...UNSTIFF },
        { name: 'web', b: g.hw, t: g.tw, n: 1, lambda: el[1].ratio, lambdaR: el[1].lambdaR, ...STIFF },
      ];
    case 'tee':
      return [
        { name: 'flange', b: g.bf / 2, t: g.tf, n: 2, lambda: el[0].ratio, lambdaR: el[0].lambdaR, ...UNSTIFF },
        { name: 'stem', b: g.d, t: g.tw, n: 1, lambda: el[1].ratio, lambdaR: el[1].lambdaR, ...UNSTIFF },
      ];
    case 'rhs':
      return [
        { name: 'wall (width)', b: g.b - 3 * g.t, t: g.t, n: 2, lambda: el[0].ratio, lambdaR: el[0].lambdaR, ...HSS },
        { name: 'wall (depth)', b: g.h - 3 * g.t, t: g.t, n: 2, lambda: el[1].ratio, lambdaR: el[1].lambdaR, ...HSS },
      ];
    default:
      return [];
  }
}

/** Effective width be of one element for the critical stress Fcr (E7-2, E7-3, E7-5). */
export function effectiveWidthE7(b: number, lambda: number, lambdaR: number, c1: number, c2: number, Fy: number, Fcr: number): number {
  if (lambda <= lambdaR * Math.sqrt(Fy / Fcr)) return b;
  const Fel = (c2 * lambdaR / lambda) ** 2 * Fy;
  const s = Math.sqrt(Fel / Fcr);
  return b * (1 - c1 * s) * s;
}

/** Whether a section has a slender element in compression (Table B4.1a). */
export function hasSlenderElement(g: DesignGeometry, E: number, Fy: number): boolean {
  return compressionElements(g, E, Fy).some((e) => compressionClassOf(e) === 'slender');
}

/** Reason E7 cannot give Ae for this section, or null. */
export function e7Scope(g: DesignGeometry, E: number, Fy: number): string | null {
  if (!hasSlenderElement(g, E, Fy)) return null;
  if (g.shape === 'chs') {
    const Dt = g.D / g.t;
    return Dt >= (0.45 * E) / Fy ? `round HSS D/t = ${Dt.toFixed(1)} ≥ 0.45E/Fy = ${((0.45 * E) / Fy).toFixed(1)}: outside the scope of E7.2` : null;
  }
  if (g.shape === 'i' || g.shape === 'channel' || g.shape === 'tee' || g.shape === 'rhs') return null;
  return `slender-element ${g.shape} in compression: E7 not implemented for this shape`;
}

/** Ae for the critical stress Fcr (= Ag without slender elements). */
export function effectiveAreaE7(g: DesignGeometry, E: number, Fy: number, Fcr: number): number {
  if (!hasSlenderElement(g, E, Fy)) return g.A;
  if (g.shape === 'chs') {
    const Dt = g.D / g.t;
    return ((0.038 * E) / (Fy * Dt) + 2 / 3) * g.A;
  }
  let Ae = g.A;
  for (const e of e7Elements(g, E, Fy)) {
    const be = effectiveWidthE7(e.b, e.lambda, e.lambdaR, e.c1, e.c2, Fy, Fcr);
    Ae -= e.n * (e.b - be) * e.t;
  }
  return Ae;
}

/** Words for the record. */
export function e7Words(g: DesignGeometry): string {
  if (g.shape === 'chs') return 'E7.2: Ae = [0.038E/(Fy·D/t) + 2/3]·Ag (E7-7)';
  return 'E7.1: be = b(1 − c1√(Fel/Fcr))√(Fel/Fcr) where λ > λr√(Fy/Fcr) (E7-3), Fel = (c2·λr/λ)²Fy (E7-5), c1, c2 of Table E7.1; Ae = Ag − Σ(b − be)t';
}
