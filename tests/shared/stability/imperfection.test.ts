/**
 * EN 1993-1-1 5.3.2: global sway imperfection φ = φ0·αh·αm (5.5) and its equivalent
 * horizontal forces φ·N_Ed at the nodes (5.3.2(7), Figure 5.4), worked by hand.
 */
import { describe, expect, it } from 'vitest';
import { ModelBuilder } from '../engine/builders.js';
import { analyse } from '../../../shared/engine/index.js';
import { enSwayImperfection } from '../../../shared/stability/code-rules.js';
import { alphaH, alphaM, columnLines, columnsInRow, structureHeight, swayImperfection } from '../../../shared/stability/sway-imperfection.js';
import type { Model } from '../../../shared/model/types.js';

const close = (a: number, b: number, rtol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rtol * Math.max(1, Math.abs(a), Math.abs(b)));

describe('EN 1993-1-1 5.3.2(3) φ = φ0·αh·αm', () => {
  it('a frame 7 m high with 2 columns in a row', () => {
    const s = swayImperfection(7, 2);
    // by hand: αh = 2/√7 = 0.755929 (within 2/3 … 1); αm = √(0.5·(1 + 1/2)) = √0.75 = 0.866025;
    // φ = 1/200 · 0.755929 · 0.866025 = 0.00327327 (≈ 1/305.5)
    close(s.alphaH, 2 / Math.sqrt(7));
    close(s.alphaM, Math.sqrt(0.75));
    close(s.phi, 0.00327327, 1e-5);
    close(s.phi0, 1 / 200);
  });

  it('αh is bounded to 2/3 ≤ αh ≤ 1 and αm runs from 1 (m = 1) towards √0.5', () => {
    close(alphaH(2), 1); // 2/√2 = 1.414 → 1.0
    close(alphaH(4), 1); // 2/√4 = 1.0
    close(alphaH(9), 2 / 3); // 2/√9 = 0.667, the lower bound exactly
    close(alphaH(16), 2 / 3); // 2/√16 = 0.5 → 2/3
    close(alphaM(1), 1); // √(0.5·2)
    close(alphaM(4), Math.sqrt(0.625)); // √(0.5·1.25)
  });

  it('m counts the columns of a row carrying at least 50% of the row average', () => {
    const lines = [0, 5, 10].map((x) => ({ plan: [x, 0, 0] as [number, number, number], members: [] }));
    // average of 100, 100, 40 = 80; 40 ≥ 0.5·80 → all three count
    expect(columnsInRow(lines, [100, 100, 40], 0, 2)).toBe(3);
    // average of 100, 100, 30 = 76.7; 30 < 38.3 → two count
    expect(columnsInRow(lines, [100, 100, 30], 0, 2)).toBe(2);
    // two rows along X (y = 0 and y = 6): the smaller count governs (larger αm)
    const two = [...lines, { plan: [0, 6, 0] as [number, number, number], members: [] }, { plan: [10, 6, 0] as [number, number, number], members: [] }];
    expect(columnsInRow(two, [100, 100, 100, 100, 10], 0, 2)).toBe(1);
    // sway along Y: rows are the lines sharing x — x = 0 (two lines), x = 5 (one), x = 10 (two, 100 and 10: m = 1)
    expect(columnsInRow(two, [100, 100, 100, 100, 100], 1, 2)).toBe(1);
  });
});

/** Two-storey one-bay plane frame 7 m high (two column lines), vertical Z. */
function frame(): Model {
  const b = new ModelBuilder({ planeNormal: 'Y' })
    .node('A', 0, 0, 0).node('B', 6, 0, 0).node('C', 0, 0, 3.5).node('D', 6, 0, 3.5).node('E', 0, 0, 7).node('F', 6, 0, 7)
    .support('A', 'fixed').support('B', 'fixed')
    .member('AC', 'A', 'C').member('CE', 'C', 'E').member('BD', 'B', 'D').member('DF', 'D', 'F').member('CD', 'C', 'D').member('EF', 'E', 'F')
    .loadCase('G').loadCase('Q')
    .memberLoad('G', 'CD', 'uniform', 'global_z', -20e3).memberLoad('G', 'EF', 'uniform', 'global_z', -10e3)
    .memberLoad('Q', 'CD', 'uniform', 'global_z', -15e3)
    .combination('ULS1', { G: 1.35, Q: 1.5 }).combination('SLS1', { G: 1, Q: 1 }, 'service');
  b.model.settings.designCode = 'en1993-1-1';
  return b.build();
}

describe('EN 1993-1-1 5.3.2(7) equivalent horizontal forces', () => {
  it('counts two columns and one row; h is the vertical extent', () => {
    const m = frame();
    close(structureHeight(m), 7);
    const lines = columnLines(m);
    expect(lines.length).toBe(2);
    expect(lines.map((l) => l.members.length)).toEqual([2, 2]);
  });

  it('φ·N_Ed at each node of every strength combination, both signs, named as combinations of their own', () => {
    const m = frame();
    const plan = enSwayImperfection(m, analyse(m));
    expect(plan.model.combinations.map((c) => c.id)).toEqual(['ULS1 +X sway imperfection', 'ULS1 -X sway imperfection', 'SLS1']);
    // symmetric frame: both columns carry the same load → m = 2, h = 7 m: φ = 0.00327327 (above)
    const phi = (1 / 200) * (2 / Math.sqrt(7)) * Math.sqrt(0.75);
    // N_Ed at C = 1.35·(20·6/2) + 1.5·(15·6/2) = 81 + 67.5 = 148.5 kN; at E = 1.35·(10·6/2) = 40.5 kN
    const cb = plan.model.combinations[0];
    const added = cb.terms[cb.terms.length - 1].case;
    const f = (node: string) => plan.model.nodeLoads.find((nl) => nl.case === added && nl.node === node)!.values[0];
    close(f('C'), phi * 148.5e3, 1e-12);
    close(f('E'), phi * 40.5e3, 1e-12);
    close(f('D'), phi * 148.5e3, 1e-12);
    const cb2 = plan.model.combinations[1];
    const added2 = cb2.terms[cb2.terms.length - 1].case;
    close(plan.model.nodeLoads.find((nl) => nl.case === added2 && nl.node === 'C')!.values[0], -phi * 148.5e3, 1e-12);
    expect(plan.additions.get('ULS1 +X sway imperfection')).toMatch(/1\/200 · 0\.7559 · 0\.866 = 1\/305\.5 \(h = 7 m, m = 2\)/);
    expect(plan.strength.loadScale).toBe(1);
    expect(plan.strength.stiffness).toBeUndefined();
  });

  it('a column carrying less than half the average load does not count (m = 1 → αm = 1)', () => {
    const m = frame();
    // all load on the left column line: the right one carries nothing
    m.memberLoads = [];
    m.nodeLoads.push({ case: 'G', node: 'E', values: [0, 0, -100e3, 0, 0, 0] });
    const plan = enSwayImperfection(m, analyse(m));
    // αm = 1, αh = 2/√7: φ = 1/200 · 0.7559 = 1/264.6
    expect(plan.additions.get('ULS1 +X sway imperfection')).toMatch(/m = 1\)/);
    const cb = plan.model.combinations[0];
    const added = cb.terms[cb.terms.length - 1].case;
    close(plan.model.nodeLoads.find((nl) => nl.case === added && nl.node === 'E')!.values[0], (1 / 200) * (2 / Math.sqrt(7)) * 135e3, 1e-12);
  });
});
