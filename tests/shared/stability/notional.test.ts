/**
 * AISC 360-22 direct analysis method (Chapter C): notional loads Ni = 0.002·α·Yi (C2-1) on
 * gravity-only combinations and the stiffness reduction τb (C2-2a, C2-2b), worked by hand.
 */
import { describe, expect, it } from 'vitest';
import { ModelBuilder } from '../engine/builders.js';
import { aiscDirectAnalysis, withCaseCombinations } from '../../../shared/stability/code-rules.js';
import { directAnalysisStiffness, notionalLoad, tauB } from '../../../shared/stability/notional-loads.js';
import { nodalLoads, gravityPerNode } from '../../../shared/stability/nodal-loads.js';
import type { Model } from '../../../shared/model/types.js';

const close = (a: number, b: number, rtol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rtol * Math.max(1, Math.abs(a), Math.abs(b)));

/**
 * Two-storey, one-bay plane frame (vertical Z, in the XZ plane): columns 3.5 m per storey,
 * beam span 6 m. Dead: 20 kN/m on the first-floor beam, 10 kN/m on the roof beam, 50 kN at
 * node E. Live: 15 kN/m on the first-floor beam. Wind: 10 kN along +X at E.
 */
function twoStorey(code: Model['settings']['designCode']): Model {
  const b = new ModelBuilder({ planeNormal: 'Y' })
    .node('A', 0, 0, 0).node('B', 6, 0, 0).node('C', 0, 0, 3.5).node('D', 6, 0, 3.5).node('E', 0, 0, 7).node('F', 6, 0, 7)
    .support('A', 'fixed').support('B', 'fixed')
    .member('AC', 'A', 'C').member('CE', 'C', 'E').member('BD', 'B', 'D').member('DF', 'D', 'F').member('CD', 'C', 'D').member('EF', 'E', 'F')
    .loadCase('D').loadCase('L').loadCase('W');
  b.model.cases[1].category = 'live';
  b.model.cases[2].category = 'wind';
  b.memberLoad('D', 'CD', 'uniform', 'global_z', -20e3).memberLoad('D', 'EF', 'uniform', 'global_z', -10e3).nodeLoad('D', 'E', { fz: -50e3 })
    .memberLoad('L', 'CD', 'uniform', 'global_z', -15e3)
    .nodeLoad('W', 'E', { fx: 10e3 });
  b.model.settings.designCode = code;
  b.model.settings.analysis = 'second_order';
  if (code === 'aisc360-asd') b.combination('ASD2', { D: 1, L: 1 }).combination('ASD5', { D: 1, W: 0.6 });
  else b.combination('ULS2', { D: 1.2, L: 1.6 }).combination('ULS4', { D: 1.2, L: 1, W: 1 });
  b.combination('SLS', { D: 1, L: 1 }, 'service');
  return b.build();
}

function variantForces(m: Model, id: string): Map<string, number[]> {
  const out = new Map<string, number[]>();
  const cb = m.combinations.find((c) => c.id === id)!;
  const added = cb.terms[cb.terms.length - 1].case;
  for (const nl of m.nodeLoads) if (nl.case === added) out.set(nl.node, [...nl.values]);
  return out;
}

describe('AISC 360-22 C2.2b notional loads', () => {
  it('Ni = 0.002·α·Yi (C2-1)', () => {
    close(notionalLoad(100e3, 1.0), 200); // 0.002 · 1.0 · 100 kN = 0.2 kN
    close(notionalLoad(100e3, 1.6), 320); // 0.002 · 1.6 · 100 kN = 0.32 kN
  });

  it('lumps member loads to the end nodes: Yi of a two-storey frame worked by hand', () => {
    const m = twoStorey('aisc360-lrfd');
    const loads = nodalLoads(m);
    const Y = gravityPerNode(loads, m.combinations[0]);
    const at = (id: string) => Y[m.nodes.findIndex((n) => n.id === id)];
    // by hand, ULS2 = 1.2 D + 1.6 L; simply supported beam ends take wL/2:
    // C, D: 1.2·(20·6/2) + 1.6·(15·6/2) = 72 + 72 = 144 kN
    // E: 1.2·(50 + 10·6/2) = 96 kN;  F: 1.2·(10·6/2) = 36 kN
    close(at('C'), 144e3); close(at('D'), 144e3); close(at('E'), 96e3); close(at('F'), 36e3);
    close(at('A'), 0); close(at('B'), 0);
    expect(loads.lateral).toEqual([false, false, true]);
  });

  it('adds 0.002·Yi per level to the gravity-only LRFD combination in both in-plane directions (plane frame: X only)', () => {
    const m = twoStorey('aisc360-lrfd');
    const plan = aiscDirectAnalysis(m);
    const ids = plan.model.combinations.map((c) => c.id);
    // the gravity-only combination is replaced by its two variants; the wind one and the service one stay
    expect(ids).toEqual(['ULS2 +X notional', 'ULS2 -X notional', 'ULS4', 'SLS']);
    expect(plan.model.cases.map((c) => c.id)).toContain('ULS2 +X notional loads');
    const plus = variantForces(plan.model, 'ULS2 +X notional');
    // by hand: level 1 (C, D): 0.002 · 1.0 · 288 kN = 0.576 kN, 0.288 kN per node; level 2: E 0.002·96 = 0.192 kN, F 0.002·36 = 0.072 kN
    close(plus.get('C')![0], 288); close(plus.get('D')![0], 288);
    close(plus.get('E')![0], 192); close(plus.get('F')![0], 72);
    close(plus.get('C')![0] + plus.get('D')![0], 576);
    for (const v of plus.values()) expect(v.slice(1)).toEqual([0, 0, 0, 0, 0]);
    const minus = variantForces(plan.model, 'ULS2 -X notional');
    close(minus.get('E')![0], -192);
    // the variant keeps the combination's terms and adds its forces with factor 1
    const v = plan.model.combinations[0];
    expect(v.terms.slice(0, 2)).toEqual([{ case: 'D', factor: 1.2 }, { case: 'L', factor: 1.6 }]);
    expect(v.terms[2].factor).toBe(1);
    expect(plan.additions.get('ULS2 +X notional')).toMatch(/0\.002·α·Yi along \+X .*C2\.2b, α = 1/);
    expect(plan.strength.loadScale).toBe(1);
    expect(plan.rule).toMatch(/direct analysis method \(C2\)/);
  });

  it('C2.2b(4): a combination with lateral load gets notional loads only when its drift ratio exceeded 1.7', () => {
    const m = twoStorey('aisc360-lrfd');
    const plan = aiscDirectAnalysis(m, new Set(['ULS4']));
    expect(plan.model.combinations.map((c) => c.id)).toEqual(['ULS2 +X notional', 'ULS2 -X notional', 'ULS4 +X notional', 'ULS4 -X notional', 'SLS']);
    // ULS4 = 1.2 D + 1.0 L + 1.0 W: Yi at C = 1.2·60 + 1.0·45 = 117 kN → Ni = 0.234 kN (the wind adds no gravity)
    close(variantForces(plan.model, 'ULS4 +X notional').get('C')![0], 234);
  });

  it('ASD: notional loads 0.002·Yi at the combination level, analysed at 1.6× (α = 1.6 inside the analysis)', () => {
    const m = twoStorey('aisc360-asd');
    const plan = aiscDirectAnalysis(m);
    expect(plan.strength.loadScale).toBe(1.6);
    const plus = variantForces(plan.model, 'ASD2 +X notional');
    // ASD2 = D + L: Yi at C = 60 + 45 = 105 kN; at the 1.6× analysis Ni = 0.002·1.6·105 = 0.336 kN, i.e. 0.21 kN before scaling
    close(plus.get('C')![0], 210);
    close(plus.get('C')![0] * plan.strength.loadScale, 336);
    expect(plan.additions.get('ASD2 +X notional')).toMatch(/α = 1\.6/);
    expect(plan.rule).toMatch(/1\.6× load and forces divided by 1\.6/);
  });

  it('a space frame gets four variants: ±X and ±Y (vertical Z)', () => {
    const b = new ModelBuilder().node('A', 0, 0, 0).node('B', 0, 0, 4).node('C', 5, 3, 0).node('D', 5, 3, 4)
      .support('A', 'fixed').support('C', 'fixed').member('AB', 'A', 'B').member('CD', 'C', 'D').member('BD', 'B', 'D')
      .loadCase('D').nodeLoad('D', 'B', { fz: -100e3 }).combination('U1', { D: 1.4 });
    b.model.settings.designCode = 'aisc360-lrfd';
    const plan = aiscDirectAnalysis(b.build());
    expect(plan.model.combinations.map((c) => c.id)).toEqual(['U1 +X notional', 'U1 -X notional', 'U1 +Y notional', 'U1 -Y notional']);
    // 0.002 · 1.4 · 100 kN = 0.28 kN along Y at B
    const yb = variantForces(plan.model, 'U1 +Y notional').get('B')!;
    close(yb[1], 280);
    expect([yb[0], yb[2]]).toEqual([0, 0]);
  });
});

describe('AISC 360-22 C2.3 stiffness reduction', () => {
  it('τb = 1 where αPr/Py ≤ 0.5 (C2-2a) and 4(αPr/Py)(1 − αPr/Py) above (C2-2b)', () => {
    close(tauB(0), 1);
    close(tauB(0.3), 1);
    close(tauB(0.5), 1); // C2-2b meets C2-2a at 0.5: 4·0.5·0.5 = 1
    close(tauB(0.7), 0.84); // 4 · 0.7 · 0.3 = 0.84
    close(tauB(0.9), 0.36); // 4 · 0.9 · 0.1 = 0.36
  });

  it('0.8·τb·EI and 0.8·EA from the member axial force, Py = Fy·Ag', () => {
    const b = new ModelBuilder().node('A', 0, 0, 0).node('B', 0, 0, 4).support('A', 'fixed').member('AB', 'A', 'B');
    b.model.materials[0].fy = 345e6;
    const m = b.build();
    const { stiffness, withoutFy } = directAnalysisStiffness(m);
    expect(withoutFy).toEqual([]);
    const Py = 345e6 * 0.01; // Fy·Ag with Ag = 0.01 m² (builder section)
    const f = stiffness(0, -0.7 * Py); // compression: αPr/Py = 0.7
    close(f.EA, 0.8);
    close(f.EI, 0.8 * 0.84, 1e-12); // 0.8 τb with τb = 0.84
    expect(stiffness(0, 0.9 * Py)).toEqual({ EA: 0.8, EI: 0.8 }); // tension: τb = 1
    expect(stiffness(0, -0.4 * Py)).toEqual({ EA: 0.8, EI: 0.8 });
  });

  it('a material without Fy keeps τb = 1 and is listed', () => {
    const b = new ModelBuilder().node('A', 0, 0, 0).node('B', 0, 0, 4).support('A', 'fixed').member('AB', 'A', 'B');
    const { stiffness, withoutFy } = directAnalysisStiffness(b.build());
    expect(withoutFy).toEqual(['AB']);
    expect(stiffness(0, -1e12)).toEqual({ EA: 0.8, EI: 0.8 });
  });
});

describe('which combinations are gravity-only', () => {
  it('a case whose horizontal forces cancel (net resultant zero) counts as gravity-only; a net horizontal force is lateral', () => {
    const m = twoStorey('aisc360-lrfd');
    m.cases.push({ id: 'T', category: 'other', title: 'thrust pair', selfWeight: 0, mass: false });
    m.nodeLoads.push({ case: 'T', node: 'C', values: [5e3, 0, 0, 0, 0, 0] }, { case: 'T', node: 'D', values: [-5e3, 0, 0, 0, 0, 0] });
    m.combinations = [{ id: 'UT', limitState: 'strength', terms: [{ case: 'D', factor: 1.2 }, { case: 'T', factor: 1 }] }];
    expect(nodalLoads(m).lateral).toEqual([false, false, true, false]);
    expect(aiscDirectAnalysis(m).model.combinations.map((c) => c.id)).toEqual(['UT +X notional', 'UT -X notional']);
  });

  it('a model without combinations gets one strength combination per case (factor 1.0) before the rules apply', () => {
    const m = twoStorey('aisc360-lrfd');
    m.combinations = [];
    const withCombos = withCaseCombinations(m);
    expect(withCombos.combinations.map((c) => c.id)).toEqual(['1.0 D', '1.0 L', '1.0 W']);
    expect(aiscDirectAnalysis(withCombos).model.combinations.map((c) => c.id)).toEqual(['1.0 D +X notional', '1.0 D -X notional', '1.0 L +X notional', '1.0 L -X notional', '1.0 W']);
  });
});
