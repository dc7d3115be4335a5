/** Generated load combinations (contract stub: the design work implements the rules). */
import type { Combination, CombinationRule, LoadCase } from '../model/types.js';

/**
 * The basic combinations of a combination rule built from the case categories.
 * `table` returns []. Each generated combination names its published source.
 */
export function generateCombinations(rule: CombinationRule, cases: LoadCase[]): Combination[] {
  void rule; void cases;
  return [];
}
