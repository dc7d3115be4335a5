import { expect } from 'vitest';

/** |a − b| ≤ rtol · max(1e-30, |a|, |b|) */
export function close(actual: number, expected: number, rtol: number, what = ''): void {
  const tol = rtol * Math.max(1e-30, Math.abs(actual), Math.abs(expected));
  expect(Math.abs(actual - expected), `${what} ${actual} vs ${expected} (rtol ${rtol})`).toBeLessThanOrEqual(tol);
}

export const MM = 1e-3;
export const CM2 = 1e-4;
export const CM3 = 1e-6;
export const CM4 = 1e-8;
export const CM6 = 1e-12;
export const IN = 0.0254;
