/**
 * The first-order stability warning (checks.md "Stability"): a first-order run under a design
 * code names each strength combination whose frame is too sensitive to sway for first-order
 * forces.
 *   EN 1993-1-1 5.2.1(3):  first-order analysis may be used where αcr ≥ 10 (elastic analysis)
 *   AISC 360-22 Chapter C: methods that skip a rigorous second-order analysis need the sway
 *                          amplifier 1/(1 − 1/αcr) ≤ 1.5 (the ratio of second- to first-order
 *                          drift, e.g. C2.2b(4) and Appendix 7.3's condition)
 * Each code's own limit applies; with no design code there is no warning.
 */
import type { DesignCode } from '../model/types.js';
import type { CriticalLoadFactors, StabilityWarning } from './types.js';

export const EN_ALPHA_CR_LIMIT = 10;
export const AISC_AMPLIFIER_LIMIT = 1.5;

/** 1/(1 − 1/αcr); Infinity where αcr ≤ 1 (not stable at this load level). */
export function swayAmplifier(alphaCr: number): number {
  return alphaCr > 1 ? 1 / (1 - 1 / alphaCr) : Infinity;
}

function fmt(v: number): string {
  return Number.isFinite(v) ? Number(v.toPrecision(3)).toString() : '∞';
}

/** The warning of one loading, or null when its lowest αcr is within the code's limit. */
export function stabilityWarning(code: DesignCode, loading: string, alphaCr: number): StabilityWarning | null {
  if (code === 'none' || !(alphaCr < Infinity)) return null;
  const amplifier = swayAmplifier(alphaCr);
  const reasons: StabilityWarning['reasons'] = [];
  if (code === 'en1993-1-1' && alphaCr < EN_ALPHA_CR_LIMIT) reasons.push('en1993-1-1 5.2.1(3): αcr < 10');
  if ((code === 'aisc360-lrfd' || code === 'aisc360-asd') && amplifier > AISC_AMPLIFIER_LIMIT) reasons.push('aisc360-22 C: amplifier > 1.5');
  if (!reasons.length) return null;
  const limit = code === 'en1993-1-1'
    ? `αcr = ${fmt(alphaCr)} < 10 (EN 1993-1-1 5.2.1(3))`
    : `sway amplifier 1/(1 − 1/αcr) = ${fmt(amplifier)} > 1.5 at αcr = ${fmt(alphaCr)} (AISC 360-22 Chapter C)`;
  const unstable = alphaCr <= 1 ? ' — the frame is not stable at this load level' : '';
  const message = `combination ${loading}: ${limit}${unstable}; first-order forces understate the sway effects — set analysis = second_order`;
  return { loading, alphaCr, amplifier, reasons, message };
}

/** Warnings of every loading, by its lowest αcr. */
export function stabilityWarnings(code: DesignCode, critical: CriticalLoadFactors[]): StabilityWarning[] {
  const out: StabilityWarning[] = [];
  for (const c of critical) {
    const w = stabilityWarning(code, c.loading, c.alphaCr.length ? c.alphaCr[0] : Infinity);
    if (w) out.push(w);
  }
  return out;
}
