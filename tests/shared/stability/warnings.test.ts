/**
 * The first-order stability warning (checks.md "Stability"): EN 1993-1-1 5.2.1(3) allows a
 * first-order analysis where αcr ≥ 10; AISC 360-22 Chapter C methods without a rigorous
 * second-order analysis need the sway amplifier 1/(1 − 1/αcr) ≤ 1.5.
 */
import { describe, expect, it } from 'vitest';
import { stabilityWarning, stabilityWarnings, swayAmplifier } from '../../../shared/stability/stability-warnings.js';

const close = (a: number, b: number, rtol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rtol * Math.max(1, Math.abs(a), Math.abs(b)));

describe('sway amplifier 1/(1 − 1/αcr)', () => {
  it('is the closed form above 1 and infinite at or below 1', () => {
    close(swayAmplifier(10), 10 / 9); // 1/(1 − 0.1)
    close(swayAmplifier(3), 1.5); // 1/(1 − 1/3): the AISC limit sits at αcr = 3
    expect(swayAmplifier(1)).toBe(Infinity);
    expect(swayAmplifier(0.8)).toBe(Infinity);
  });
});

describe('first-order stability warning', () => {
  it('EN 1993-1-1: warns below αcr = 10 (5.2.1(3)), names the combination and suggests second order', () => {
    const w = stabilityWarning('en1993-1-1', 'ULS3', 6.2)!;
    expect(w.reasons).toEqual(['en1993-1-1 5.2.1(3): αcr < 10']);
    expect(w.message).toMatch(/^combination ULS3: αcr = 6\.2 < 10 \(EN 1993-1-1 5\.2\.1\(3\)\).*analysis = second_order/);
    close(w.amplifier, 1 / (1 - 1 / 6.2));
    expect(stabilityWarning('en1993-1-1', 'ULS3', 10)).toBeNull();
    expect(stabilityWarning('en1993-1-1', 'ULS3', 25)).toBeNull();
  });

  it('AISC 360-22: warns where the amplifier exceeds 1.5 (αcr < 3), not at αcr = 6.2', () => {
    const w = stabilityWarning('aisc360-lrfd', 'LC2', 2.5)!;
    // 1/(1 − 1/2.5) = 1.667
    expect(w.reasons).toEqual(['aisc360-22 C: amplifier > 1.5']);
    expect(w.message).toMatch(/combination LC2: sway amplifier 1\/\(1 − 1\/αcr\) = 1\.67 > 1\.5 at αcr = 2\.5/);
    expect(stabilityWarning('aisc360-asd', 'LC2', 6.2)).toBeNull();
    expect(stabilityWarning('aisc360-asd', 'LC2', 2.9)).not.toBeNull();
  });

  it('a frame at or beyond its critical load says it is not stable', () => {
    expect(stabilityWarning('en1993-1-1', 'U', 0.83)!.message).toMatch(/not stable at this load level/);
  });

  it('no warning without a design code or without compression (αcr = ∞)', () => {
    expect(stabilityWarning('none', 'U', 1.2)).toBeNull();
    expect(stabilityWarning('en1993-1-1', 'U', Infinity)).toBeNull();
  });

  it('one warning per warned loading, from its lowest αcr', () => {
    const ws = stabilityWarnings('en1993-1-1', [
      { loading: 'A', alphaCr: [4, 9] }, { loading: 'B', alphaCr: [12, 20] }, { loading: 'C', alphaCr: [] },
    ]);
    expect(ws.map((w) => w.loading)).toEqual(['A']);
  });
});
