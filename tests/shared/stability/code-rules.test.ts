/**
 * The pieces the code rules share: sway directions, load variants (named combinations of
 * their own), lumped node loads (simply supported member reactions, statics).
 */
import { describe, expect, it } from 'vitest';
import { ModelBuilder } from '../engine/builders.js';
import { swayDirections, withVariants } from '../../../shared/stability/load-variants.js';
import { nodalLoads } from '../../../shared/stability/nodal-loads.js';
import { plainPlan } from '../../../shared/stability/code-rules.js';

const close = (a: number, b: number, rtol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rtol * Math.max(1, Math.abs(a), Math.abs(b)));

describe('sway directions', () => {
  it('plane frame: the in-plane horizontal axis only, both signs', () => {
    const m = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, 3).build();
    expect(swayDirections(m).map((d) => d.label)).toEqual(['+X', '-X']);
  });

  it('space frame, vertical Z: ±X and ±Y; vertical Y: ±X and ±Z', () => {
    const z = new ModelBuilder().node('A', 0, 0, 0).node('B', 0, 0, 3).build();
    expect(swayDirections(z).map((d) => d.label)).toEqual(['+X', '-X', '+Y', '-Y']);
    const y = new ModelBuilder({ vertical: 'Y' }).node('A', 0, 0, 0).node('B', 0, 3, 0).build();
    expect(swayDirections(y).map((d) => d.label)).toEqual(['+X', '-X', '+Z', '-Z']);
  });

  it('an axis held by a support at every node is left out', () => {
    const m = new ModelBuilder().node('A', 0, 0, 0).node('B', 0, 0, 3).support('A', 'fixed').support('B', 'uy').build();
    expect(swayDirections(m).map((d) => d.label)).toEqual(['+X', '-X']);
  });
});

describe('load variants', () => {
  it('replace their combination in place, keep its terms, add their own case with factor 1, and never reuse an id', () => {
    const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, 3).loadCase('D')
      .combination('U1', { D: 1.4 }).combination('U1 +X notional', { D: 1 }).combination('S', { D: 1 }, 'service');
    const m = b.build();
    const [plus, minus] = swayDirections(m);
    const f = Float64Array.of(0, 50);
    const out = withVariants(m, [
      { combination: 'U1', direction: plus, forces: f, additions: 'a' },
      { combination: 'U1', direction: minus, forces: f.map((v) => -v), additions: 'b' },
    ], 'notional');
    // "U1 +X notional" is taken by the user's own combination: the variant gets a prime
    expect(out.model.combinations.map((c) => c.id)).toEqual(["U1 +X notional'", 'U1 -X notional', 'U1 +X notional', 'S']);
    const v = out.model.combinations[0];
    expect(v.terms).toEqual([{ case: 'D', factor: 1.4 }, { case: "U1 +X notional' loads", factor: 1 }]);
    expect(v.limitState).toBe('strength');
    expect(out.model.nodeLoads).toEqual([
      { case: "U1 +X notional' loads", node: 'B', values: [50, 0, 0, 0, 0, 0] },
      { case: 'U1 -X notional loads', node: 'B', values: [-50, 0, 0, 0, 0, 0] },
    ]);
    expect(out.additions.get('U1 -X notional')).toBe('b');
    // the input model is left as it was
    expect(m.combinations.length).toBe(3);
    expect(m.cases.length).toBe(1);
  });

  it('no code: the plain plan analyses the model as it is', () => {
    const m = new ModelBuilder().node('A', 0, 0, 0).build();
    const p = plainPlan(m);
    expect(p.model).toBe(m);
    expect(p.strength).toEqual({ loadScale: 1 });
    expect(p.rule).toBe('');
  });
});

describe('lumped node loads', () => {
  it('a member load reaches its end nodes as simply supported reactions (lever rule)', () => {
    // beam A–B 6 m along X: 12 kN at 2 m from A → A takes 12·4/6 = 8 kN, B 12·2/6 = 4 kN (statics);
    // linearly varying 0 → 9 kN/m over the span: total 27 kN, A takes 1/3 = 9 kN, B 2/3 = 18 kN
    const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 6, 0, 0).member('AB', 'A', 'B')
      .loadCase('P').loadCase('T')
      .memberLoad('P', 'AB', 'point', 'global_z', -12e3, { a: 2 })
      .memberLoad('T', 'AB', 'linear', 'global_z', 0, { w2: -9e3 });
    const loads = nodalLoads(b.build());
    const fz = (c: number, n: number) => loads.forces[(c * 2 + n) * 3 + 2];
    close(fz(0, 0), -8e3); close(fz(0, 1), -4e3);
    close(fz(1, 0), -9e3); close(fz(1, 1), -18e3);
  });

  it('self weight of a column goes half to each end; an inclined member keeps its load vertical', () => {
    // density 7850 kg/m³ · A 0.01 m² · g 9.80665 m/s² · 4 m = 3079.3 N, half to each end
    const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, 4).node('C', 3, 0, 8).member('AB', 'A', 'B').member('BC', 'B', 'C')
      .loadCase('SW', 1);
    b.model.materials[0].density = 7850;
    const loads = nodalLoads(b.build());
    const w = 7850 * 0.01 * 9.80665;
    close(loads.forces[0 * 3 + 2], -w * 4 / 2, 1e-12); // A: half the column
    close(loads.forces[1 * 3 + 2], -w * 4 / 2 - w * 5 / 2, 1e-12); // B: half the column, half the 5 m rafter
    close(loads.forces[2 * 3 + 2], -w * 5 / 2, 1e-12);
    close(loads.forces[1 * 3 + 0], 0, 1e-12); // no horizontal part from self weight
    expect(loads.lateral).toEqual([false]);
  });
});
