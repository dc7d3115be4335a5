/** The package prints numbers exactly as the member page shows them (same rules as src/utils). */
import { describe, expect, it } from 'vitest';
import { displayQuantity as pageQuantity, formatValue as pageValue } from '../../../src/utils/diagrams.js';
import { formatRatio as pageRatio } from '../../../src/utils/ratioBand.js';
import { displayQuantity, formatRatio, formatValue } from '../../../server/reports/format.js';

const VALUES = [0, 1, -1, 0.5, 1.1123456, 355e6, 2.1e11, 1e-4, -94833.3, 123456.789, 5188e-6, Number.NaN, null, 'assumed'];
const QUANTITIES = ['force', 'moment', 'stress', 'area', 'length', 'ratio', 'text', 'unknown_kind'];

describe('package number formats', () => {
  it('formats every value, quantity and unit system as the member page does', () => {
    for (const v of VALUES) {
      expect(formatValue(v)).toBe(pageValue(v));
      for (const q of QUANTITIES) {
        for (const units of ['metric', 'us'] as const) expect(displayQuantity(v, q, units)).toEqual(pageQuantity(v, q, units));
      }
    }
  });

  it('prints ratios to three decimals and a dash for none, as the grid does', () => {
    for (const r of [0, 0.5, 1.1123456, 0.99951, null, undefined, Number.POSITIVE_INFINITY]) expect(formatRatio(r)).toBe(pageRatio(r));
  });
});
