/**
 * Comparing a model with the one read back from its written workbook (round-trip tests):
 * see tests/shared/reader/round-trip.test.ts for what "identical" means and why.
 */
import { expect } from 'vitest';
import type { Model } from '../../../shared/model/types.js';

/** The model without `row` fields, with what the written settings make explicit. */
export function comparable(m: Model): unknown {
  const strip = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(strip);
    if (v && typeof v === 'object') {
      return Object.fromEntries(Object.entries(v).filter(([k, x]) => k !== 'row' && x !== undefined).map(([k, x]) => [k, strip(x)]));
    }
    return v;
  };
  return strip({ ...m, inferred: { ...m.inferred, defaulted: [], verticalAxisInferred: false } });
}

/** Deep equality, numbers within 4·ε relative (round-trip.test.ts says why); names the path of a difference. */
export function expectSame(actual: unknown, expected: unknown, path = 'model'): void {
  if (typeof actual === 'number' && typeof expected === 'number') {
    if (Math.abs(actual - expected) > 4 * Number.EPSILON * Math.max(Math.abs(actual), Math.abs(expected))) {
      expect(actual, path).toBe(expected);
    }
    return;
  }
  if (actual && expected && typeof actual === 'object' && typeof expected === 'object') {
    expect(Object.keys(actual).sort(), path).toEqual(Object.keys(expected).sort());
    for (const k of Object.keys(expected)) expectSame((actual as Record<string, unknown>)[k], (expected as Record<string, unknown>)[k], `${path}.${k}`);
    return;
  }
  expect(actual, path).toEqual(expected);
}

