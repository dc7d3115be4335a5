/**
 * Resistance factors (LRFD, φ) and safety factors (ASD, Ω) of AISC 360-22, per limit
 * state. Design strength = φ·Rn (LRFD) or Rn/Ω (ASD).
 */
export type AiscMethod = 'lrfd' | 'asd';

export interface AiscFactor {
  phi: number;
  omega: number;
}

/** AISC 360-22: D2 (tension), E1 (compression), F1 (flexure), G1 and G2.1(a) (shear). */
export const AISC_FACTORS = {
  /** D2(a) tensile yielding */
  tensionYield: { phi: 0.9, omega: 1.67 },
  /** D2(b) tensile rupture */
  tensionRupture: { phi: 0.75, omega: 2.0 },
  /** E1 */
  compression: { phi: 0.9, omega: 1.67 },
  /** F1 */
  flexure: { phi: 0.9, omega: 1.67 },
  /** G1 */
  shear: { phi: 0.9, omega: 1.67 },
  /** G2.1(a): webs of rolled I-shaped members with h/tw ≤ 2.24·√(E/Fy) */
  shearRolledI: { phi: 1.0, omega: 1.5 },
} as const satisfies Record<string, AiscFactor>;

/** The multiplier on the nominal strength: φ (LRFD) or 1/Ω (ASD). */
export function factorOn(method: AiscMethod, f: AiscFactor): number {
  return method === 'lrfd' ? f.phi : 1 / f.omega;
}

/** "φt·Pn" or "Pn/Ωt" written for an equation. */
export function factorWords(method: AiscMethod, f: AiscFactor, sym: string, nominal: string): string {
  return method === 'lrfd' ? `${sym} = ${f.phi.toFixed(2)}·${nominal}` : `${sym} = ${nominal}/${f.omega.toFixed(2)}`;
}

/** The factor as a record input: φ (LRFD) or Ω (ASD) with its subscript, e.g. "φt", "Ωv". */
export function factorInput(method: AiscMethod, f: AiscFactor, sub: string): import('../types.js').CheckInput {
  return method === 'lrfd'
    ? { symbol: `φ${sub}`, name: 'resistance factor (LRFD)', value: f.phi, quantity: 'ratio' }
    : { symbol: `Ω${sub}`, name: 'safety factor (ASD)', value: f.omega, quantity: 'ratio' };
}
