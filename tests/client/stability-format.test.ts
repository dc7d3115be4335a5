/** αcr bands and formatting, sway amplifier, modes table numbers, shape choices for the picture. */
import { describe, expect, it } from 'vitest';
import {
  ALPHA_CR_LIMIT, alphaCrBand, analysisOrderLabel, criticalRows, cumulativeMass, diagramsFrom, formatAlphaCr, formatFrequency,
  formatMassRatio, formatPeriod, iterationsText, parseShapeChoice, shapeChoices, shapeDrawScale, swayAmplifier, swingFactor,
} from '../../src/utils/stability.js';
import type { RunStability } from '../../shared/schemas/runs.js';

// invented numbers (demo data)
const STABILITY: RunStability = {
  analysis: 'first_order',
  method: 'first-order elastic',
  notes: [],
  secondOrder: [],
  critical: [
    { loading: 'ULS-2', alphaCr: [14.2, 30], shapes: 2 },
    { loading: 'ULS-1', alphaCr: [6.25, 19], shapes: 0 },
    { loading: 'ULS-3', alphaCr: [null], shapes: 0 },
  ],
  modes: [
    { mode: 1, frequency: 2.4137, period: 1 / 2.4137, massRatio: [0.81, 0, 0.002] },
    { mode: 2, frequency: 9.8, period: 1 / 9.8, massRatio: [0.12, 0.05, 0.7] },
  ],
  warnings: [],
};

describe('αcr against 10', () => {
  it('colours below 10 as a warning, 10 and above (and no buckling) as fine, 1 and below as unstable', () => {
    expect(ALPHA_CR_LIMIT).toBe(10);
    expect(alphaCrBand(9.99)).toBe('low');
    expect(alphaCrBand(10)).toBe('ok');
    expect(alphaCrBand(250)).toBe('ok');
    expect(alphaCrBand(null)).toBe('ok');
    expect(alphaCrBand(1)).toBe('unstable');
    expect(alphaCrBand(0.83)).toBe('unstable');
    expect(alphaCrBand(1.01)).toBe('low');
  });

  it('formats αcr with two decimals, ∞ when nothing buckles, — when missing', () => {
    expect(formatAlphaCr(8.3333)).toBe('8.33');
    expect(formatAlphaCr(null)).toBe('∞');
    expect(formatAlphaCr(Infinity)).toBe('∞');
    expect(formatAlphaCr(undefined)).toBe('—');
    expect(formatAlphaCr(123456)).toBe('1.23e+5');
  });

  it('gives the sway amplifier 1/(1 − 1/αcr) (EN 1993-1-1 5.2.2(5)B, from memory), none at or below 1', () => {
    // αcr = 3: 1/(1 − 1/3) = 1.5 exactly (closed form), the AISC limit of 1.5 the warning uses
    expect(swayAmplifier(3)).toBeCloseTo(1.5, 12);
    expect(swayAmplifier(10)).toBeCloseTo(10 / 9, 12);
    expect(swayAmplifier(1)).toBeNull();
    expect(swayAmplifier(null)).toBeNull();
  });

  it('lists the combinations lowest αcr first, those that do not buckle last', () => {
    const rows = criticalRows(STABILITY.critical);
    expect(rows.map((r) => r.loading)).toEqual(['ULS-1', 'ULS-2', 'ULS-3']);
    expect(rows.map((r) => r.band)).toEqual(['low', 'ok', 'ok']);
    expect(rows[0]).toMatchObject({ lowest: 6.25, all: [6.25, 19], shapes: 0 });
  });
});

describe('analysis and modes text', () => {
  it('names the order and the iterations', () => {
    expect(analysisOrderLabel('second_order')).toBe('Second order');
    expect(analysisOrderLabel('first_order')).toBe('First order');
    expect(iterationsText([])).toBe('—');
    expect(iterationsText([{ loading: 'A', iterations: 3, converged: true, change: 0 }])).toBe('3 iterations');
    expect(iterationsText([
      { loading: 'A', iterations: 2, converged: true, change: 0 },
      { loading: 'B', iterations: 5, converged: true, change: 0 },
    ])).toBe('2 to 5 iterations');
    expect(diagramsFrom('second_order')).toMatch(/^Forces and deflections from the second-order analysis/);
    expect(diagramsFrom('first_order', 'first-order elastic')).toBe('Forces and deflections from the first-order analysis. Method: first-order elastic.');
  });

  it('formats frequency and period with four significant digits, mass ratios as percentages, and sums them', () => {
    expect(formatFrequency(2.4137)).toBe('2.414');
    expect(formatPeriod(1 / 2.4137)).toBe('0.4143');
    expect(formatMassRatio(0.8034)).toBe('80.3 %');
    const sum = cumulativeMass(STABILITY.modes);
    expect(sum[0]).toBeCloseTo(0.93, 12);
    expect(sum[2]).toBeCloseTo(0.702, 12);
  });
});

describe('shapes for the picture', () => {
  it('offers every mode and every kept buckled shape, and reads the choice back', () => {
    const items = shapeChoices(STABILITY);
    expect(items.map((i) => i.value)).toEqual(['mode:1', 'mode:2', 'buckling:1:ULS-2', 'buckling:2:ULS-2']);
    expect(items[0].title).toBe('Mode 1 — 2.414 Hz');
    expect(items[3].title).toBe('ULS-2 buckling 2 — αcr 30.00');
    expect(parseShapeChoice('buckling:2:ULS 2:a')).toEqual({ kind: 'buckling', index: 2, loading: 'ULS 2:a' });
    expect(parseShapeChoice('mode:3')).toEqual({ kind: 'mode', index: 3, loading: null });
    expect(parseShapeChoice('wobble:1')).toBeNull();
    expect(shapeChoices(null)).toEqual([]);
  });

  it('draws the largest movement at the chosen share of the model size and swings it', () => {
    expect(shapeDrawScale(20, 10)).toBe(2);
    expect(shapeDrawScale(0, 10)).toBe(0);
    expect(swingFactor(0)).toBe(0);
    expect(swingFactor(400, 1600)).toBeCloseTo(1, 12);
    expect(swingFactor(1200, 1600)).toBeCloseTo(-1, 12);
  });
});

describe('a failed run on screen', () => {
  it('shows the analysis message once, without doubling "The run failed"', async () => {
    const { runFailureMessage } = await import('../../src/utils/runFormat.js');
    expect(runFailureMessage('The run failed: combination ULS-3 is not stable at this load level: αcr = 0.83')).toBe(
      'The run failed: combination ULS-3 is not stable at this load level: αcr = 0.83',
    );
    expect(runFailureMessage('Interrupted by a server restart; start the run again')).toBe('The run failed: Interrupted by a server restart; start the run again');
    expect(runFailureMessage('')).toBe('The run failed: no reason given');
  });
});
