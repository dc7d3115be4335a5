/**
 * `verification(...)`: an assertion a test can call to register a named comparison with the
 * report (quantity, expected, computed, tolerance, source):
 *
 *   verification({ quantity: 'midspan moment', expected: wL²/8, computed: M, rtol: 1e-9,
 *                  source: 'closed form wL²/8' });
 *
 * It asserts |computed − expected| ≤ rtol·max(1, |expected|, |computed|) like the tests'
 * `close` helpers, and records the comparison when run by `npm run verify`.
 */
import { assert } from 'vitest';
import { register } from './records.js';

export interface VerificationInput {
  quantity: string;
  expected: number;
  computed: number;
  rtol: number;
  source?: string;
}

export function verification(v: VerificationInput): void {
  const difference = Math.abs(v.computed - v.expected);
  register({
    kind: 'within',
    quantity: v.quantity,
    expected: v.expected,
    computed: v.computed,
    difference,
    tolerance: `rtol ${v.rtol}`,
    source: v.source,
  });
  const tol = v.rtol * Math.max(1, Math.abs(v.expected), Math.abs(v.computed));
  // asserted without expect(), so that the setup file does not record the comparison twice
  if (!(difference <= tol)) assert.fail(`${v.quantity}: computed ${v.computed}, expected ${v.expected}, rtol ${v.rtol}`);
}
