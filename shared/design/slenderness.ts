/**
 * Slenderness warnings (never governing). AISC 360-22: Lc/r preferably ≤ 200 for members
 * in compression (E2 user note) and L/r ≤ 300 for members in tension (D1 user note; L the
 * unbraced length, no K). Only members in compression, or in tension, in some loading get one.
 * EN 1993-1-1 gives no limit; the same 200 / 300 are applied as common practice.
 */
import type { DesignCode } from '../model/types.js';
import { inp } from './record.js';
import type { CheckRecord } from './types.js';

export function slendernessRecord(member: string, code: DesignCode, slenderness: number, compression: boolean, combination: string): CheckRecord {
  const limit = compression ? 200 : 300;
  const aisc = code !== 'en1993-1-1';
  const ratio = slenderness / limit;
  const clause = aisc ? (compression ? 'E2 user note' : 'D1 user note') : 'common practice';
  const over = ratio > 1;
  return {
    member, family: 'slenderness', code, clause, title: compression ? 'slenderness, compression member' : 'slenderness, tension member',
    equation: `${compression ? 'K·L/r' : 'L/r'} ≤ ${limit} (recommendation; warning only)`,
    inputs: [inp(compression ? 'KL/r' : 'L/r', compression ? 'largest slenderness K·L/r (both axes)' : 'largest slenderness L/r (both axes, unbraced lengths)', slenderness, 'ratio'), inp('limit', 'recommended limit', limit, 'ratio')],
    capacity: limit, demand: slenderness, quantity: 'ratio', combination, x: null, ratio,
    status: over ? 'fail' : 'pass',
    note: over ? `warning: ${compression ? 'K·L/r' : 'L/r'} = ${slenderness.toFixed(0)} exceeds the recommended ${limit}; does not govern the member` : 'warning only; does not govern the member',
  };
}
