/**
 * The sparse solver used by the engine by default (shared/solver), with the analyses of the
 * last few sparsity patterns kept: a factorisation of a pattern seen before (second-order
 * iterations, eigen solves, a rerun after an edit of sections or loads) reuses its ordering
 * and symbolic analysis. A pattern is reused only when its colPtr and rowIdx are equal entry
 * by entry to a kept copy, so a changed connectivity always gets a fresh analysis.
 */
import { analysePattern, checkSymmetricCsc, type PatternAnalysis, type SupernodalFactorisation } from '../solver/index.js';
import type { FactorOptions, SymmetricCsc } from '../solver/types.js';

/** patterns kept (most recently used first), and at most this many matrix entries among them */
const KEPT = 4;
const KEPT_ENTRIES = 8_000_000;

interface Kept {
  ordering: NonNullable<FactorOptions['ordering']>;
  /** copies of the pattern, so that a caller reusing its arrays cannot make a stale match */
  pattern: SymmetricCsc;
  analysis: PatternAnalysis;
}

const kept: Kept[] = [];

function find(K: SymmetricCsc, ordering: Kept['ordering']): Kept | undefined {
  const i = kept.findIndex((k) => k.ordering === ordering && k.analysis.matches(K));
  if (i < 0) return undefined;
  const [hit] = kept.splice(i, 1);
  kept.unshift(hit);
  return hit;
}

export function factorise(K: SymmetricCsc, options: FactorOptions = {}): SupernodalFactorisation {
  checkSymmetricCsc(K);
  const ordering = options.ordering ?? 'auto';
  let hit = find(K, ordering);
  if (!hit) {
    const pattern: SymmetricCsc = { n: K.n, colPtr: K.colPtr.slice(0, K.n + 1), rowIdx: K.rowIdx.slice(0, K.colPtr[K.n]), values: new Float64Array(0) };
    const analysis = analysePattern(pattern, options);
    hit = { ordering, pattern, analysis };
    kept.unshift(hit);
    let entries = 0;
    for (let i = 0; i < kept.length; i++) {
      entries += kept[i].pattern.colPtr[kept[i].pattern.n];
      if (i >= KEPT || (i > 0 && entries > KEPT_ENTRIES)) {
        kept.length = i;
        break;
      }
    }
    const f = hit.analysis.factorise(K.values, options.pivotTolerance);
    f.timings.ordering = analysis.timings.ordering;
    f.timings.symbolic = analysis.timings.symbolic;
    return f;
  }
  return hit.analysis.factorise(K.values, options.pivotTolerance);
}

/** Forgets the kept analyses (tests; memory after a large model). */
export function forgetPatterns(): void {
  kept.length = 0;
}
