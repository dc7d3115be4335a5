/**
 * A second-order loading at or above its critical load: its own error, and the load factor
 * at which the linearised stiffness K + α·K_G(N) stops being positive definite, found by
 * bisection on the factorisation (each trial one numeric factorisation).
 */
import { type Factorisation, SingularMatrixError, type SymmetricCsc } from '../solver/types.js';
import { lowestEigenpairs } from './eigen.js';
import type { Refactorisation } from './refactorisation.js';

export class SecondOrderInstabilityError extends Error {
  constructor(
    /** the loading's id */
    readonly loading: string,
    /** elastic critical load factor of the loading at the analysed load level (≤ 1 here) */
    readonly alphaCr: number,
    /** true when αcr comes from a bisection (to 1 %) rather than the eigen solution */
    readonly approximate: boolean,
    message: string,
  ) {
    super(message);
    this.name = 'SecondOrderInstabilityError';
  }
}

/** `combination ULS-3 is not stable at this load level: αcr ≈ 0.83` */
export function instabilityMessage(kind: 'case' | 'combination', id: string, alphaCr: number, approximate: boolean, loadScale: number): string {
  const at = loadScale !== 1 ? ` (loads × ${loadScale})` : '';
  return `${kind} ${id} is not stable at this load level${at}: αcr ${approximate ? '≈' : '='} ${alphaCr.toFixed(2)}`;
}

/**
 * The lowest α of (K + α·K_G) φ = 0 by the project's eigen solver (eigen.ts, subspace iteration
 * on the factorisation of K), exact to its tolerance; by bisection (1 %, `approximate`) when that
 * finds nothing or does not converge. K must be positive definite.
 */
export function criticalFactor(refac: Refactorisation, pattern: SymmetricCsc, K: Float64Array, KG: Float64Array): { alpha: number; approximate: boolean } {
  try {
    const f = refac.factor(K);
    const fact: Factorisation = { n: pattern.n, nnzFactor: refac.nnzFactor, timings: { ordering: 0, symbolic: 0, numeric: 0 }, solve: (B, n) => f.solve(B, n) };
    const minusKG = new Float64Array(KG.length);
    for (let i = 0; i < KG.length; i++) minusKG[i] = -KG[i];
    const eig = lowestEigenpairs(fact, { ...pattern, values: K }, { ...pattern, values: minusKG }, 1);
    if (eig.converged && eig.values.length > 0 && Number.isFinite(eig.values[0])) return { alpha: eig.values[0], approximate: false };
  } catch {
    // whatever stopped the eigen solve (a singular K, no convergence), the bisection still answers
  }
  return { alpha: bisectCriticalFactor(refac, K, KG), approximate: true };
}

/**
 * The lowest α with K + α·K_G singular, relative accuracy `rtol` (default 1 %). K must be
 * positive definite (α = 0). Searches upwards from 1 when K + K_G is still positive definite;
 * returns Infinity when nothing up to `maxAlpha` (default 1e6) fails (no compression).
 */
export function bisectCriticalFactor(
  refac: Refactorisation, K: Float64Array, KG: Float64Array, rtol = 0.01, maxAlpha = 1e6,
): number {
  const A = new Float64Array(K.length);
  const positive = (alpha: number): boolean => {
    for (let i = 0; i < A.length; i++) A[i] = K[i] + alpha * KG[i];
    try {
      refac.factor(A);
      return true;
    } catch (err) {
      if (err instanceof SingularMatrixError) return false;
      throw err;
    }
  };
  let lo = 0, hi = 1;
  while (positive(hi)) {
    lo = hi;
    hi *= 2;
    if (hi > maxAlpha) return Infinity;
  }
  while (hi - lo > rtol * hi) {
    const mid = (lo + hi) / 2;
    if (positive(mid)) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
