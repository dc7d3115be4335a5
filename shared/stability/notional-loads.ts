/**
 * AISC 360-22 Chapter C, direct analysis method: notional loads (C2.2b) and the reduced
 * stiffness (C2.3).
 *
 *   Ni = 0.002·α·Yi            (C2-1), α = 1.0 LRFD, 1.6 ASD; Yi the gravity load at node i
 *   EI* = 0.8·τb·EI, EA* = 0.8·EA   (C2.3(a), (b))
 *   τb = 1.0                          where αPr/Py ≤ 0.5   (C2-2a)
 *   τb = 4(αPr/Py)(1 − αPr/Py)        where αPr/Py > 0.5   (C2-2b), Py = Fy·Ag
 *
 * ASD combinations are analysed at 1.6 times their loads (C2.1(d)) and the results divided by
 * 1.6: the notional load added to an ASD combination is therefore 0.002·Yi at the
 * combination's level, which is 0.002·1.6·Yi = Ni within the 1.6× analysis. Likewise the
 * axial force the stiffness rule sees is that of the 1.6× analysis, i.e. αPr.
 */
import type { Combination, Model } from '../model/types.js';
import { catalogueSection } from '../sections/index.js';
import { builtInMaterial } from '../materials/index.js';
import { gravityPerNode, type NodalLoads } from './nodal-loads.js';
import type { LoadVariant, SwayDirection } from './load-variants.js';

/** C2.2b: the notional load is 0.002 of the gravity load (a nominal out-of-plumbness of 1/500). */
export const NOTIONAL_RATIO = 0.002;
/** C2.1(d) and C2.2b: α = 1.0 (LRFD), 1.6 (ASD). */
export const AISC_ALPHA = { lrfd: 1.0, asd: 1.6 } as const;

/** C2-2a/C2-2b: τb from αPr/Py (compression positive; ≤ 0 means no compression, τb = 1). */
export function tauB(alphaPrOverPy: number): number {
  const r = alphaPrOverPy;
  if (!(r > 0.5)) return 1;
  if (r >= 1) return 0;
  return 4 * r * (1 - r);
}

/** Ni = 0.002·α·Yi of one node. */
export function notionalLoad(Yi: number, alpha: number): number {
  return NOTIONAL_RATIO * alpha * Yi;
}

/**
 * Notional-load variants of one combination, per sway direction: the forces at the
 * combination's own load level (0.002·Yi; the ASD analysis at 1.6× makes them 0.002·1.6·Yi).
 */
export function notionalVariants(loads: NodalLoads, combination: Combination, directions: SwayDirection[], method: 'lrfd' | 'asd'): LoadVariant[] {
  const Y = gravityPerNode(loads, combination);
  const alpha = AISC_ALPHA[method];
  return directions.map((direction) => {
    const forces = new Float64Array(Y.length);
    for (let n = 0; n < Y.length; n++) forces[n] = direction.sign * NOTIONAL_RATIO * Y[n];
    const additions = method === 'asd'
      ? `notional loads Ni = 0.002·α·Yi along ${direction.label} (AISC 360-22 C2.2b, α = ${alpha}: 0.002·Yi at the ASD level, analysed at 1.6×)`
      : `notional loads Ni = 0.002·α·Yi along ${direction.label} (AISC 360-22 C2.2b, α = ${alpha})`;
    return { combination: combination.id, direction, forces, additions };
  });
}

/** Stiffness factors of one member for the solver (multipliers on EA and EI). */
export interface StiffnessFactors {
  EA: number;
  EI: number;
}

/**
 * The direct analysis method's stiffness rule for every member: 0.8·EA and 0.8·τb·EI, τb from
 * the member's axial force N in the analysis (tension positive, so αPr = −N) and Py = Fy·Ag.
 * A member whose material has no Fy keeps τb = 1 (listed in `withoutFy`).
 */
export function directAnalysisStiffness(model: Model): { stiffness: (memberIndex: number, N: number) => StiffnessFactors; withoutFy: string[] } {
  const withoutFy: string[] = [];
  const Py = model.members.map((m) => {
    const section = model.sections.find((s) => s.id === m.section) ?? catalogueSection(m.section);
    const material = model.materials.find((q) => q.id === m.material) ?? builtInMaterial(m.material);
    const fy = material?.fy;
    const A = section?.props.A;
    if (!(fy !== undefined && fy > 0 && A !== undefined && A > 0)) { withoutFy.push(m.id); return Infinity; }
    return fy * A;
  });
  const stiffness = (memberIndex: number, N: number): StiffnessFactors => {
    const py = Py[memberIndex];
    return { EA: 0.8, EI: 0.8 * tauB(N < 0 ? -N / py : 0) };
  };
  return { stiffness, withoutFy };
}
