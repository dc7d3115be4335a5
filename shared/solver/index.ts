/**
 * Sparse symmetric positive definite solver: fill-reducing ordering (approximate minimum
 * degree or nested dissection), symbolic analysis with supernodes, supernodal Cholesky
 * with pivot checks, and block forward/back substitution for many load cases at once.
 */
import { analysePattern, checkPattern, checkValues, type SupernodalFactorisation } from './analysis.js';
import type { FactorOptions, SymmetricCsc } from './types.js';

export * from './types.js';
export { analysePattern, type PatternAnalysis, type SupernodalFactorisation } from './analysis.js';
export { fillReducingOrder, NESTED_DISSECTION_FROM, type Ordering } from './ordering.js';

/** Checks the shape and values of a lower-triangle CSC matrix; throws an Error naming the fault. */
export function checkSymmetricCsc(K: SymmetricCsc): void {
  checkPattern(K);
  checkValues(K, K.values);
}

/**
 * Factorises the symmetric matrix K (lower triangle) as PKPᵀ = LLᵀ: analysePattern, then
 * the numeric factorisation of K's values. The result can refactorise new values of the same
 * pattern into its own memory (`refactorise`), and its `analysis` factorises others.
 * Throws SingularMatrixError (original freedom index) for a zero, tiny or negative pivot.
 */
export function factorise(K: SymmetricCsc, options: FactorOptions = {}): SupernodalFactorisation {
  const analysis = analysePattern(K, options);
  const f = analysis.factorise(K.values);
  f.timings.ordering = analysis.timings.ordering;
  f.timings.symbolic = analysis.timings.symbolic;
  return f;
}
