/**
 * Cross-section class under the actual stress distribution, EN 1993-1-1 Table 5.2 (internal
 * compression parts, sheet 1), for the web of I/H sections and the webs of RHS bent about
 * the major axis, from the design axial force N and major-axis moment My at a station:
 *  classes 1, 2 (plastic, α = compressed fraction of c):
 *    α > 0.5: c/t ≤ 396ε/(13α − 1) (class 1), ≤ 456ε/(13α − 1) (class 2);
 *    α ≤ 0.5: c/t ≤ 36ε/α, ≤ 41.5ε/α;
 *  class 3 (elastic, ψ = σ2/σ1, σ1 the larger compression at the edges of c):
 *    ψ > −1: c/t ≤ 42ε/(0.67 + 0.33ψ); ψ ≤ −1: c/t ≤ 62ε(1 − ψ)√(−ψ).
 * α is the plastic neutral axis of the fully plastic state with the same ratio N/My
 * (proportional loading): with the neutral axis in the web at zn from mid-depth,
 * N_R = 2·zn·tw·fy and M_R = fy(Wpl − tw·zn²), so zn = [−My + √(My² + N²·Wpl/tw)]/N and
 * α = 0.5 + zn/c, limited to [0, 1] (tw: total web thickness, 2t for RHS). For a given
 * N/My this is never less than α = 0.5(1 + N/(c·tw·fy)) (equal at the resistance), so it
 * is the conservative choice when the section is not fully used; pure compression gives
 * α = 1. ψ from the elastic stresses N/A ± My·(c/2)/Iy at the edges of c.
 * Flanges keep their class from the pure-compression rows (outstand or internal part in
 * compression). A web wholly in tension is class 1.
 */
import type { DesignGeometry } from '../geometry.js';
import { epsilon } from './context.js';
import { enElements, type EnClass } from './classification.js';

export interface StressClassPlan {
  /** web rule available ('i' web, 'rhs' webs) */
  applies: boolean;
  rhs: boolean;
  /** web c and total web thickness */
  c: number;
  tw: number;
  /** c/t of one web */
  ct: number;
  eps: number;
  A: number;
  I: number;
  Wpl: number;
  /** class of the flanges in compression */
  flange: EnClass;
  /** class of the web in pure compression (used for RHS when Mz acts) */
  webCompression: EnClass;
  /**
   * fast test for a class 1 web: when c/t ≤ 72ε every α ≤ 0.5 is class 1, and α > 0.5 is
   * class 1 up to α1 = (396ε/(c/t) + 1)/13, i.e. zn ≤ zn1 = (α1 − 0.5)·c (0 = no fast test)
   */
  zn1: number;
}

function withFastTest(p: StressClassPlan): StressClassPlan {
  if (p.ct <= 72 * p.eps) {
    const a1 = Math.min(1, ((396 * p.eps) / p.ct + 1) / 13);
    p.zn1 = (a1 - 0.5) * p.c;
  }
  return p;
}

export function stressClassPlan(g: DesignGeometry, fy: number): StressClassPlan {
  const eps = epsilon(fy);
  const base = { applies: false, rhs: false, c: 0, tw: 0, ct: 0, eps, A: g.A, I: g.Imaj, Wpl: g.Zmaj, flange: 1 as EnClass, webCompression: 1 as EnClass, zn1: 0 };
  if (!g.hasDims) return base;
  if (g.shape === 'i') {
    const el = enElements(g, fy, 'compression');
    const c = g.d - 2 * g.tf - 2 * g.r;
    return withFastTest({ ...base, applies: true, c, tw: g.tw, ct: c / g.tw, flange: el[0].cls, webCompression: el[1].cls });
  }
  if (g.shape === 'rhs') {
    const el = enElements(g, fy, 'compression');
    const c = g.h - 3 * g.t;
    return withFastTest({ ...base, applies: true, rhs: true, c, tw: 2 * g.t, ct: c / g.t, flange: el[0].cls, webCompression: el[1].cls });
  }
  return base;
}

/** α of the web for compression N (> 0; tension < 0) and |My| (see above). */
export function webAlpha(p: StressClassPlan, N: number, My: number): number {
  if (N === 0) return 0.5;
  // zn = [−My + √(My² + N²·Wpl/tw)]/N written without cancellation
  const w = p.Wpl / p.tw;
  const zn = (N * w) / (My + Math.sqrt(My * My + N * N * w));
  const a = 0.5 + zn / p.c;
  return a < 0 ? 0 : a > 1 ? 1 : a;
}

/** ψ of the web: ratio of the edge stresses, the larger compression as σ1; NaN when the web is wholly in tension. */
export function webPsi(p: StressClassPlan, N: number, My: number): number {
  const sn = N / p.A;
  const sm = (My * p.c) / 2 / p.I;
  const s1 = sn + sm, s2 = sn - sm;
  if (!(s1 > 0)) return NaN;
  return s2 / s1;
}

/** Table 5.2 class of an internal part from c/t, α and ψ. */
export function internalClass(ct: number, eps: number, alpha: number, psi: number): EnClass {
  if (alpha <= 0 || psi !== psi) return 1;
  const k = 13 * alpha - 1;
  const l1 = alpha > 0.5 ? (396 * eps) / k : (36 * eps) / alpha;
  if (ct <= l1) return 1;
  const l2 = alpha > 0.5 ? (456 * eps) / k : (41.5 * eps) / alpha;
  if (ct <= l2) return 2;
  const l3 = psi > -1 ? (42 * eps) / (0.67 + 0.33 * psi) : 62 * eps * (1 - psi) * Math.sqrt(-psi);
  return ct <= l3 ? 3 : 4;
}

/** Scratch of the last stationClass call that evaluated the web: α and ψ. */
export const lastWeb = { alpha: 0.5, psi: -1 };

/**
 * Class at a station: N compression positive, |My|, and whether a minor-axis moment acts
 * (RHS: the depth walls then count in compression, conservative).
 */
export function stationClass(p: StressClassPlan, N: number, My: number, minorActs: boolean): EnClass {
  const compressed = N > 0 || My > 0 || minorActs;
  // the limits under any α ≤ 1, ψ ≤ 1 are not below the pure-compression ones: a web of
  // class 1 in compression is class 1 under every loading (α, ψ then not needed)
  if (p.webCompression === 1) return compressed ? p.flange : 1;
  if (p.zn1 > 0 && !(minorActs && p.rhs)) {
    // zn ≤ zn1 without the square root: N·w − zn1·M ≤ zn1·√(M² + N²·w)
    const w = p.Wpl / p.tw;
    const lhs = N * w - p.zn1 * My;
    if (N <= 0 || lhs <= 0 || lhs * lhs <= p.zn1 * p.zn1 * (My * My + N * N * w)) return compressed ? p.flange : 1;
  }
  const a = webAlpha(p, N, My);
  const psi = webPsi(p, N, My);
  lastWeb.alpha = a; lastWeb.psi = psi;
  let c = internalClass(p.ct, p.eps, a, psi);
  if (minorActs && p.rhs && p.webCompression > c) c = p.webCompression;
  return compressed && p.flange > c ? p.flange : c;
}
