/**
 * Generated combinations against ASCE/SEI 7-22 2.3.1, 2.3.6, 2.4.1, 2.4.5 and EN 1990
 * Eq. (6.10), (6.14b) with Table A1.1 ψ0 (all from memory). Factors compared exactly
 * (rtol 1e-9).
 */
import { describe, expect, it } from 'vitest';
import { generateCombinations } from '../../../shared/design/combinations.js';
import type { CaseCategory, Combination, LoadCase } from '../../../shared/model/types.js';

const lc = (id: string, category: CaseCategory): LoadCase => ({ id, category, title: id, selfWeight: 0, mass: false });
const cases = [lc('D', 'dead'), lc('L', 'live'), lc('S', 'snow'), lc('Wx', 'wind'), lc('Wy', 'wind'), lc('E', 'seismic')];
const factors = (c: Combination) => Object.fromEntries(c.terms.map((t) => [t.case, t.factor]));
const has = (list: Combination[], f: Record<string, number>) => list.some((c) => {
  const g = factors(c);
  return Object.keys(g).length === Object.keys(f).length && Object.entries(f).every(([k, v]) => Math.abs((g[k] ?? NaN) - v) <= 1e-9);
});

describe('ASCE/SEI 7-22 LRFD (2.3.1, 2.3.6)', () => {
  const list = generateCombinations('asce7-lrfd', cases);
  it('1: 1.4D', () => expect(has(list, { D: 1.4 })).toBe(true));
  it('2: 1.2D + 1.6L + 0.5S', () => expect(has(list, { D: 1.2, L: 1.6, S: 0.5 })).toBe(true));
  it('3: 1.2D + 1.6S + L and 1.2D + 1.6S + 0.5W per wind case', () => {
    expect(has(list, { D: 1.2, S: 1.6, L: 1.0 })).toBe(true);
    expect(has(list, { D: 1.2, S: 1.6, Wx: 0.5 })).toBe(true);
    expect(has(list, { D: 1.2, S: 1.6, Wy: 0.5 })).toBe(true);
  });
  it('4: 1.2D + 1.0W + L + 0.5S, one wind case at a time', () => {
    expect(has(list, { D: 1.2, Wx: 1.0, L: 1.0, S: 0.5 })).toBe(true);
    expect(list.some((c) => factors(c).Wx && factors(c).Wy)).toBe(false);
  });
  it('5: 0.9D + 1.0W', () => expect(has(list, { D: 0.9, Wy: 1.0 })).toBe(true));
  it('6 and 7: 1.2D ± 1.0E + L + 0.15S and 0.9D ± 1.0E (Ev, Ω0 combinations left out)', () => {
    expect(has(list, { D: 1.2, E: 1, L: 1, S: 0.15 })).toBe(true);
    expect(has(list, { D: 1.2, E: -1, L: 1, S: 0.15 })).toBe(true);
    expect(has(list, { D: 0.9, E: -1 })).toBe(true);
  });
  it('every combination names its source clause and no id collides with a case id', () => {
    for (const c of list) expect(c.source).toMatch(/ASCE\/SEI 7-22 2\.3\.[16]|service, common practice/);
    expect(list.some((c) => cases.some((k) => k.id === c.id))).toBe(false);
  });
  it('service combinations D + L (common practice) are generated with limit state service', () => {
    expect(list.some((c) => c.limitState === 'service' && has([c], { D: 1, L: 1 }))).toBe(true);
  });
});

describe('ASCE/SEI 7-22 ASD (2.4.1, 2.4.5)', () => {
  const list = generateCombinations('asce7-asd', cases);
  it('1–4: D; D + L; D + S; D + 0.75L + 0.75S', () => {
    expect(has(list, { D: 1 })).toBe(true);
    expect(has(list, { D: 1, L: 1 })).toBe(true);
    expect(has(list, { D: 1, S: 1 })).toBe(true);
    expect(has(list, { D: 1, L: 0.75, S: 0.75 })).toBe(true);
  });
  it('5–7: D + 0.6W; D + 0.75L + 0.45W + 0.75S; 0.6D + 0.6W', () => {
    expect(has(list, { D: 1, Wx: 0.6 })).toBe(true);
    expect(has(list, { D: 1, L: 0.75, Wx: 0.45, S: 0.75 })).toBe(true);
    expect(has(list, { D: 0.6, Wy: 0.6 })).toBe(true);
  });
  it('8–10: D ± 0.7E; D ± 0.525E + 0.75L + 0.1S; 0.6D ± 0.7E', () => {
    expect(has(list, { D: 1, E: 0.7 })).toBe(true);
    expect(has(list, { D: 1, E: -0.525, L: 0.75, S: 0.1 })).toBe(true);
    expect(has(list, { D: 0.6, E: 0.7 })).toBe(true);
  });
});

describe('EN 1990 (6.10) and (6.14b)', () => {
  const en = [lc('G', 'dead'), lc('Q', 'live'), lc('S', 'snow'), lc('W1', 'wind'), lc('W2', 'wind')];
  const list = generateCombinations('en1990-6.10', en);
  it('imposed leading: 1.35G + 1.5Q + 1.5·0.5S + 1.5·0.6W (ψ0 0.5 snow, 0.6 wind: Table A1.1)', () => {
    expect(has(list, { G: 1.35, Q: 1.5, S: 0.75, W1: 0.9 })).toBe(true);
  });
  it('snow leading: 1.35G + 1.5S + 1.5·0.7Q + 1.5·0.6W (ψ0 imposed 0.7)', () => {
    expect(has(list, { G: 1.35, S: 1.5, Q: 1.05, W2: 0.9 })).toBe(true);
  });
  it('wind leading, permanent favourable: 1.0G + 1.5W', () => {
    expect(has(list, { G: 1.0, W1: 1.5 })).toBe(true);
  });
  it('characteristic service combination, imposed leading: G + Q + 0.5S + 0.6W (6.14b)', () => {
    expect(list.some((c) => c.limitState === 'service' && has([c], { G: 1, Q: 1, S: 0.5, W1: 0.6 }))).toBe(true);
  });
  it('wind cases never act together; seismic and other categories are left out', () => {
    expect(list.some((c) => factors(c).W1 && factors(c).W2)).toBe(false);
    const withE = generateCombinations('en1990-6.10', [...en, lc('E', 'seismic')]);
    expect(withE.some((c) => 'E' in factors(c))).toBe(false);
  });
  it('the table rule generates nothing', () => {
    expect(generateCombinations('table', en)).toEqual([]);
  });
});
