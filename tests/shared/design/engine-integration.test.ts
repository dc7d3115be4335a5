/**
 * End to end with the real engine: a simply supported IPE 300 (S235) beam, L = 6 m, under
 * a uniform load of 10 kN/m (case D); strength combination 1.35·D and service combination
 * 1.0·D. Expectations from closed-form statics: M = 1.35·10·6²/8 = 60.75 kNm at midspan,
 * V = 1.35·10·6/2 = 40.5 kN at the supports; δ = 5wL⁴/(384EI) = 5·10000·6⁴/(384·210e9·8356e-8)
 * = 9.617 mm. Tolerance rtol 1e-4 (exact recovery at stations).
 */
import { describe, expect, it } from 'vitest';
import { analyse } from '../../../shared/engine/index.js';
import { checkModel } from '../../../shared/design/index.js';
import { close, IPE300 } from './helpers.js';
import { member, model } from './model-helpers.js';

describe('design on engine results', () => {
  it('governing demands match statics and the deflection matches 5wL⁴/(384EI)', () => {
    const m = model([IPE300()], [member('B1', 'N1', 'N2', 'IPE300')], [['N1', 0, 0], ['N2', 6, 0]], []);
    m.supports = [
      { node: 'N1', restrained: [true, true, true, true, true, false], springs: [0, 0, 0, 0, 0, 0] },
      { node: 'N2', restrained: [false, true, true, true, true, false], springs: [0, 0, 0, 0, 0, 0] },
    ];
    m.memberLoads = [{ case: 'D', member: 'B1', kind: 'uniform', direction: 'global_y', a: 0, b: 6, w1: -10e3, w2: -10e3 }];
    m.combinations = [
      { id: 'ULS1', limitState: 'strength', terms: [{ case: 'D', factor: 1.35 }] },
      { id: 'SLS1', limitState: 'service', terms: [{ case: 'D', factor: 1.0 }] },
    ];
    const a = analyse(m);
    const r = checkModel(m, a);
    const rec = (pred: (c: (typeof r.records)[number]) => boolean) => r.records.find(pred)!;
    const bend = rec((c) => c.clause === '6.2.5' && c.family === 'bending_major');
    expect(close(bend.demand!, 60.75e3, 1e-4)).toBe(true);
    expect(close(bend.x!, 3, 1e-9)).toBe(true);
    expect(close(rec((c) => c.family === 'shear_major').demand!, 40.5e3, 1e-4)).toBe(true);
    const d = rec((c) => c.family === 'deflection');
    expect(close(d.demand!, (5 * 10e3 * 6 ** 4) / (384 * 210e9 * 8356e-8), 1e-3)).toBe(true);
    // C1 from the engine's diagram: uniform load → 1.136 (F1-1 quarter points, exact for the parabola)
    const ltb = rec((c) => c.clause === '6.3.2.3');
    expect(ltb.inputs.find((i) => i.symbol === 'C1')!.value).toBeCloseTo(12.5 / 11, 3);
    expect(r.members[0].combination).toBe('ULS1');
  });
});
