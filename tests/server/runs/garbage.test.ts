/** Collection on purpose after long worker tasks (server/runs/garbage.ts). */
import { describe, expect, it } from 'vitest';
import { COLLECT_AFTER_MS, exposedGc } from '../../../server/runs/garbage.js';

describe('exposedGc', () => {
  it('gives a callable collector on this runtime, used only after tasks longer than a second', () => {
    const gc = exposedGc();
    expect(typeof gc).toBe('function');
    expect(() => gc!()).not.toThrow();
    expect(COLLECT_AFTER_MS).toBe(1000);
  });
});
