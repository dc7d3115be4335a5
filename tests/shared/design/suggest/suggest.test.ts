/**
 * Section suggestions on a simply supported beam (hand calculations below) and on the
 * portal-frame sample (groups, iteration).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Model } from '../../../../shared/model/types.js';
import { readCsvFiles } from '../../../../shared/reader/index.js';
import { analyseModel } from '../../../../shared/stability/index.js';
import { applySections, iterateSuggestions, suggestSections, type SuggestOptions } from '../../../../shared/design/suggest/index.js';

function read(tables: Record<string, string>): Model {
  const r = readCsvFiles(Object.entries(tables).map(([name, text]) => ({ name: `${name}.csv`, text })));
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join('; '));
  return r.model;
}

/**
 * Simply supported beam, L = 6 m, S235 (fy = 235 MPa, EN 1993-1-1 Table 3.1), γM0 = 1.0
 * (EN 1993-1-1 6.1 recommended), continuously braced (lb = 0: no lateral-torsional buckling),
 * uniform load w = 22 kN/m in one case checked at factor 1.0 (no combinations).
 */
function beam(section: string, extra: Partial<Record<string, string>> = {}): Model {
  return read({
    settings: 'key,value\ntitle,Beam\nunits,metric\ndesign_code,en1993-1-1\ngamma_m0,1.0\n',
    nodes: 'node,x,y\nA,0,0\nB,6,0\n',
    supports: 'node,ux,uy\nA,1,1\nB,0,1\n',
    members: `member,start,end,section,material,lb\nM1,A,B,${section},S235,0\n`,
    cases: 'case,category,self_weight\nD,dead,0\n',
    member_loads: 'case,member,kind,direction,w1\nD,M1,uniform,global_y,-22\n',
    ...extra,
  } as Record<string, string>);
}

function suggest(model: Model, options: SuggestOptions = {}) {
  const { analysis, stability, model: analysed } = analyseModel(model);
  return suggestSections(analysed, analysis, { ...options, stability });
}

describe('suggest: simply supported beam, EN 1993-1-1', () => {
  it('proposes the lightest IPE whose plastic moment resistance carries wL²/8 (hand calculation, EN 1993-1-1 6.2.5)', () => {
    // M_Ed = w·L²/8 = 22 · 6² / 8 = 99 kNm (closed form, simply supported beam under uniform load)
    // M_c,Rd = Wpl,y · fy / γM0 for class 1 and 2 sections (EN 1993-1-1 6.2.5(2), Eq. 6.13);
    // IPE in bending under S235 are class 1 (EN 1993-1-1 Table 5.2; e.g. IPE270 flange c/tf = 4.4 ≤ 9ε, web c/tw = 33.3 ≤ 72ε).
    // Wpl,y from the catalogue (EN 10365 / ArcelorMittal tables, from memory): IPE220 285.4, IPE240 366.6, IPE270 484.0 cm³
    //   IPE220: 285.4e-6 · 235e6 = 67.07 kNm < 99 → fails
    //   IPE240: 366.6e-6 · 235e6 = 86.15 kNm < 99 → fails (ratio 1.149)
    //   IPE270: 484.0e-6 · 235e6 = 113.74 kNm ≥ 99 → passes, ratio 99 / 113.74 = 0.8704
    // shear V_Ed = wL/2 = 66 kN is far below V_pl,Rd (EN 1993-1-1 6.2.6), so bending governs
    const r = suggest(beam('IPE330'));
    const p = r.proposals[0];
    expect(p.current).toEqual(['IPE330']);
    expect(p.proposed).toBe('IPE270');
    expect(p.change).toBe(true);
    expect(p.proposedRatio).toBeCloseTo(99 / 113.74, 3); // hand calculation above (EN 1993-1-1 6.2.5)
    expect(p.governing).toMatch(/6\.2\.5/);
    // mass change: (A_IPE270 − A_IPE330)·ρ·L = (45.9 − 62.6) cm² · 7850 kg/m³ · 6 m = −78.66 kg (A from EN 10365 tables, from memory; ρ of steel EN 1991-1-1 Table A.4)
    expect(p.massChange).toBeCloseTo((45.9 - 62.6) * 1e-4 * 7850 * 6, 1);
    expect(p.proposedMassPerLength).toBeCloseTo(45.9e-4 * 7850, 2);
  });

  it('starting from a failing section proposes a heavier one (IPE220 → IPE270, same hand calculation)', () => {
    // IPE220: 99 / 67.07 = 1.476 (EN 1993-1-1 6.2.5, Wpl,y 285.4 cm³ from memory)
    const p = suggest(beam('IPE220')).proposals[0];
    expect(p.currentRatio).toBeCloseTo(99 / 67.07, 2);
    expect(p.proposed).toBe('IPE270');
    expect(p.massChange).toBeGreaterThan(0);
  });

  it('a target ratio of 0.8 moves to IPE300 (99 / (628.4e-6 · 235e6) = 0.670, EN 1993-1-1 6.2.5)', () => {
    // IPE270 reaches 0.870 > 0.8; IPE300 Wpl,y = 628.4 cm³ (from memory) → 147.67 kNm
    const p = suggest(beam('IPE330'), { limits: { targetRatio: 0.8 } }).proposals[0];
    expect(p.proposed).toBe('IPE300');
    expect(p.proposedRatio).toBeCloseTo(99 / 147.674, 3);
  });

  it('maximum depth and kept width limit the candidates; none passing is reported with its reason', () => {
    const shallow = suggest(beam('IPE330'), { limits: { maxDepth: 0.25 } }).proposals[0];
    // only the 9 sizes IPE80 … IPE240 are at most 250 mm deep and IPE240 already fails (ratio 1.149, hand calculation above)
    expect(shallow.proposed).toBeNull();
    expect(shallow.reason).toMatch(/none of the 9 candidates passes.*IPE240, reaches 1\.149/);
    // bf = 160 mm belongs to IPE330 alone in the series (EN 10365 dimensions, from memory)
    const wide = suggest(beam('IPE330'), { limits: { keepWidth: true } }).proposals[0];
    expect(wide.candidates).toBe(1);
    expect(wide.proposed).toBe('IPE330');
    expect(wide.change).toBe(false);
    expect(wide.reason).toMatch(/already|lightest/);
  });

  it("the model's own sections of the same shape are candidates (welded I lighter than IPE270 that passes)", () => {
    // own section W280: d 280, bf 140, tf 10, tw 6 (no fillets): A = 2·140·10 + 260·6 = 4360 mm² < 4590 (IPE270)
    // Wpl,y = bf·tf·(d − tf) + tw·(d − 2tf)²/4 = 378 000 + 101 400 = 479 400 mm³ (closed form for a doubly symmetric I)
    // M_c,Rd = 479.4e-6 · 235e6 = 112.66 kNm → ratio 99 / 112.66 = 0.879 (EN 1993-1-1 6.2.5; class 1: c/tf = 6.7 ≤ 9ε, c/tw = 43.3 ≤ 72ε, Table 5.2)
    const model = beam('IPE330', { sections: 'section,shape,d,bf,tf,tw\nW280,i,280,140,10,6\n' });
    const p = suggest(model).proposals[0];
    expect(p.proposed).toBe('W280');
    expect(p.proposedRatio).toBeCloseTo(99 / 112.66, 2);
  });

  it('deflection: the stiffness-scaled estimate equals the rerun for a determinate beam (5wL⁴/(384EI))', () => {
    // ULS 1.35·G + 1.5·Q = 1.35·10 + 1.5·5 = 21 kN/m (EN 1990 6.10, factors as given in the table)
    //   M = 21·36/8 = 94.5 kNm: IPE270 ratio 94.5/113.74 = 0.831 passes strength (EN 1993-1-1 6.2.5)
    // SLS G + Q = 15 kN/m, limit L/360 = 16.67 mm (common practice)
    //   δ = 5·w·L⁴/(384·E·I) (closed form), E = 210 GPa (EN 1993-1-1 3.2.6):
    //   IPE270 I = 5790 cm⁴ → 20.82 mm, ratio 1.249 fails; IPE300 I = 8356 cm⁴ → 14.43 mm, ratio 0.8655 (Iy from memory, EN 10365 tables)
    const model = beam('IPE400', {
      settings: 'key,value\ntitle,Beam\nunits,metric\ndesign_code,en1993-1-1\ngamma_m0,1.0\ndeflection_limit,360\n',
      cases: 'case,category,self_weight\nG,dead,0\nQ,live,0\n',
      member_loads: 'case,member,kind,direction,w1\nG,M1,uniform,global_y,-10\nQ,M1,uniform,global_y,-5\n',
      combinations: 'combination,case,factor,limit_state\nULS,G,1.35,strength\nULS,Q,1.5,\nSLS,G,1,service\nSLS,Q,1,\n',
    });
    const p = suggest(model).proposals[0];
    expect(p.proposed).toBe('IPE300');
    expect(p.governing).toMatch(/deflection/);
    const delta = (5 * 15e3 * 6 ** 4) / (384 * 210e9 * 8356e-8); // closed form
    expect(p.proposedRatio).toBeCloseTo(delta / (6 / 360), 3);
    // the rerun with IPE300 gives the same ratio: a determinate beam's deflection scales with 1/I exactly
    const again = suggest(applySections(model, { M1: 'IPE300' })).proposals[0];
    expect(again.currentRatio).toBeCloseTo(p.proposedRatio!, 9);
    expect(again.change).toBe(false);
  });

  it('never proposes a section that could not be checked (no design code: nothing is proposed)', () => {
    const model = beam('IPE330', { settings: 'key,value\ntitle,Beam\nunits,metric\ndesign_code,none\n' });
    const p = suggest(model).proposals[0];
    expect(p.proposed).toBeNull();
    expect(p.reason).toMatch(/no design code/);
  });
});

function portal(): Model {
  const dir = join(__dirname, '../../../../samples/portal-frame-building/csv');
  return read(Object.fromEntries(readdirSync(dir).filter((f) => f.endsWith('.csv')).map((f) => [f.replace(/\.csv$/, ''), readFileSync(join(dir, f), 'utf8')])));
}

describe('suggest: portal-frame sample (AISC 360-22 LRFD)', () => {
  it('by group: one section per group, every proposal at or below 1 with the run forces', () => {
    const model = portal();
    const r = suggest(model, { by: 'group' });
    const groups = new Set(model.members.map((m) => m.group));
    expect(r.proposals.map((p) => p.key).sort()).toEqual([...groups].sort());
    for (const p of r.proposals) {
      expect(p.unit).toBe('group');
      expect(p.proposed).not.toBeNull();
      expect(p.proposedRatio!).toBeLessThanOrEqual(1);
      // the members of a group are exactly those with that group
      expect(p.members.sort()).toEqual(model.members.filter((m) => m.group === p.key).map((m) => m.id).sort());
    }
    const applied = applySections(model, Object.fromEntries(r.proposals.flatMap((p) => p.members.map((m) => [m, p.proposed!]))));
    for (const g of groups) expect(new Set(applied.members.filter((m) => m.group === g).map((m) => m.section)).size).toBe(1);
    expect(r.totals.massChange).toBeLessThan(0);
  });

  it('repeat until stable stops: converged within the cap, and the final sections pass in their own analysis', () => {
    const model = portal();
    const it1 = iterateSuggestions(model, { by: 'group' });
    expect(it1.iterations).toBeLessThanOrEqual(10);
    expect(it1.converged).toBe(true);
    expect(it1.steps[it1.steps.length - 1].changed).toBe(0);
    const final = applySections(model, it1.sections);
    const { analysis, stability, model: analysed } = analyseModel(final);
    const again = suggestSections(analysed, analysis, { by: 'group', stability });
    expect(again.totals.changes).toBe(0);
    for (const p of again.proposals) expect(p.currentRatio!).toBeLessThanOrEqual(1);
    for (const p of it1.result.proposals.filter((q) => q.change)) expect(p.proposedRatio!).toBeLessThanOrEqual(1);
  });

  it('the iteration cap is honoured: one pass with changes is reported as not converged', () => {
    const r = iterateSuggestions(portal(), { by: 'group', maxIterations: 1 });
    expect(r.iterations).toBe(1);
    expect(r.converged).toBe(false);
    expect(Object.keys(r.sections)).toEqual([]);
  });
});
