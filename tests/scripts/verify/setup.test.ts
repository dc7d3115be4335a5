/**
 * The verification run's setup file records the numbers of a test's comparisons in its
 * meta, and leaves the assertions' outcome unchanged.
 */
import { describe, expect, it } from 'vitest';
import '../../../scripts/verify/setup.js';
import { MAX_RECORDS, META_KEY } from '../../../scripts/verify/records.js';
import { verification } from '../../../scripts/verify/verification.js';

describe('verification setup', () => {
  it('records toBeCloseTo, numeric toBe, close-helper messages, bounds and verification() with their numbers', ({ task }) => {
    expect(1.0004).toBeCloseTo(1, 3);
    expect(42).toBe(42);
    expect('text').toBe('text'); // not a number: not recorded
    expect(Math.abs(2.001 - 2), 'Iy 2.001 vs 2 (rtol 0.001)').toBeLessThanOrEqual(0.001 * 2.001);
    expect(1e-12).toBeLessThan(1e-9);
    expect(3).not.toBe(4); // negated: not recorded
    verification({ quantity: 'M', expected: 12.5, computed: 12.5, rtol: 1e-9, source: 'wL²/8' });
    const records = (task.meta as Record<string, unknown>)[META_KEY];
    expect(records).toEqual([
      { kind: 'within', expected: 1, computed: 1.0004, difference: expect.any(Number), tolerance: '±0.0005' },
      { kind: 'within', expected: 42, computed: 42, difference: 0, tolerance: 'exact' },
      { kind: 'within', quantity: 'Iy', expected: 2, computed: 2.001, difference: expect.any(Number), tolerance: 'rtol 0.001' },
      { kind: 'bound', value: 1e-12, bound: 1e-9, relation: '<' },
      { kind: 'within', quantity: 'M', expected: 12.5, computed: 12.5, difference: 0, tolerance: 'rtol 1e-9', source: 'wL²/8' },
    ]);
  });
  it('leaves failing assertions failing', () => {
    expect(() => expect(1.1).toBeCloseTo(1, 3)).toThrow();
    expect(() => expect(2).toBeLessThanOrEqual(1)).toThrow();
    expect(() => verification({ quantity: 'x', expected: 1, computed: 2, rtol: 0.1 })).toThrow(/x: computed 2, expected 1/);
  });
  it(`keeps at most ${MAX_RECORDS} records per test and counts the rest`, ({ task }) => {
    for (let i = 0; i < MAX_RECORDS + 5; i++) expect(i).toBe(i);
    const meta = task.meta as Record<string, unknown>;
    const kept = (meta[META_KEY] as unknown[]).length;
    const omitted = meta[`${META_KEY}Omitted`];
    expect(kept).toBe(MAX_RECORDS);
    expect(omitted).toBe(5);
  });
});
