/**
 * What a design code asks of a second-order analysis (checks.md "Stability"), as a plan the
 * dispatcher (index.ts) hands to the second-order solver: the model to analyse (with the
 * code's horizontal load variants), the options of its strength loadings (stiffness rule,
 * load scale) and the method in words.
 *
 * - AISC 360-22 (direct analysis method, C2): notional loads on gravity-only combinations —
 *   and on every combination whose second- to first-order drift ratio exceeds 1.7, C2.2b(4),
 *   decided by the dispatcher after a first pass — 0.8·τb·EI and 0.8·EA, ASD at 1.6×.
 * - EN 1993-1-1 (5.3.2): the global sway imperfection as equivalent horizontal forces on
 *   every strength combination.
 * Service combinations keep unreduced stiffness, no additions, load scale 1.
 */
import type { AnalysisResult } from '../engine/types.js';
import type { Model } from '../model/types.js';
import { gravityOnly, nodalLoads } from './nodal-loads.js';
import { type LoadVariant, swayDirections, withVariants } from './load-variants.js';
import { AISC_ALPHA, directAnalysisStiffness, type StiffnessFactors, notionalVariants } from './notional-loads.js';
import { columnLineLoads, columnLines, imperfectionVariants, structureHeight } from './sway-imperfection.js';

/** C2.2b(4): above this ratio of second- to first-order drift, notional loads go on every combination. */
export const AISC_DRIFT_RATIO_LIMIT = 1.7;

export interface SecondOrderPlan {
  /** the model to analyse: the original with the code's variants in place of their combinations */
  model: Model;
  /** options of the strength loadings */
  strength: { loadScale: number; stiffness?: (memberIndex: number, N: number) => StiffnessFactors };
  /** the code's rule in words, for the method line ("" without a code) */
  rule: string;
  /** variant combination id → what was added */
  additions: Map<string, string>;
  /** further remarks for the summary */
  notes: string[];
}

export function isAisc(model: Model): boolean {
  return model.settings.designCode === 'aisc360-lrfd' || model.settings.designCode === 'aisc360-asd';
}

/**
 * A model without combinations analyses its cases as strength loadings; the code rules act on
 * combinations, so each case becomes a strength combination of its own (factor 1.0), named as
 * the reader names them (`1.0 D`).
 */
export function withCaseCombinations(model: Model): Model {
  if (model.combinations.length > 0 || model.cases.length === 0) return model;
  const ids = new Set(model.cases.map((c) => c.id));
  const combinations = model.cases.map((c) => {
    let id = `1.0 ${c.id}`;
    while (ids.has(id)) id += "'";
    ids.add(id);
    return { id, limitState: 'strength' as const, terms: [{ case: c.id, factor: 1 }], generated: true, source: 'each case alone with factor 1.0 (no combinations)' };
  });
  return { ...model, combinations };
}

/** No code: the model as it is, unreduced stiffness, no additions. */
export function plainPlan(model: Model): SecondOrderPlan {
  return { model, strength: { loadScale: 1 }, rule: '', additions: new Map(), notes: [] };
}

/**
 * AISC 360-22 direct analysis method. `alsoLateral`: combinations with lateral loads that get
 * notional loads too (C2.2b(4): drift ratio above 1.7 found in a first pass).
 */
export function aiscDirectAnalysis(model: Model, alsoLateral: ReadonlySet<string> = new Set()): SecondOrderPlan {
  const method = model.settings.designCode === 'aisc360-asd' ? 'asd' : 'lrfd';
  const alpha = AISC_ALPHA[method];
  const loads = nodalLoads(model);
  const directions = swayDirections(model);
  const variants: LoadVariant[] = [];
  for (const cb of model.combinations) {
    if (cb.limitState !== 'strength') continue;
    if (!gravityOnly(loads, cb) && !alsoLateral.has(cb.id)) continue;
    variants.push(...notionalVariants(loads, cb, directions, method));
  }
  const { model: analysed, additions } = withVariants(model, variants, 'notional');
  const { stiffness, withoutFy } = directAnalysisStiffness(model);
  const notes: string[] = [];
  if (withoutFy.length) notes.push(`τb = 1 for members whose material has no Fy: ${withoutFy.slice(0, 10).join(', ')}${withoutFy.length > 10 ? ', …' : ''}`);
  if (!directions.length) notes.push('no horizontal direction in which the frame can sway: no notional loads');
  const scale = method === 'asd' ? ', ASD combinations analysed at 1.6× load and forces divided by 1.6 (C2.1(d))' : '';
  const rule = `AISC 360-22 direct analysis method (C2): notional loads 0.002αYi (α = ${alpha}, C2.2b), 0.8τb EI (C2-2b), 0.8 EA${scale}; `
    + `K = 1 for member strength unless k_major/k_minor are given (C3); service combinations with unreduced stiffness and no notional loads`;
  return { model: analysed, strength: { loadScale: alpha, stiffness }, rule, additions, notes };
}

/**
 * EN 1993-1-1 5.3.2 sway imperfection on every strength combination; `firstOrder` gives a
 * first-order analysis of `model` (the column loads N_Ed that fix m), asked for only when the
 * model has columns.
 */
export function enSwayImperfection(model: Model, firstOrder: AnalysisResult | (() => AnalysisResult)): SecondOrderPlan {
  const loads = nodalLoads(model);
  const directions = swayDirections(model);
  const h = structureHeight(model);
  const lines = columnLines(model);
  const first = lines.length === 0 ? null : typeof firstOrder === 'function' ? firstOrder() : firstOrder;
  const index = new Map<string, number>();
  first?.loadings.forEach((l, i) => { if (l.kind === 'combination' && !index.has(l.id)) index.set(l.id, i); });
  const variants: LoadVariant[] = [];
  for (const cb of model.combinations) {
    if (cb.limitState !== 'strength') continue;
    const li = index.get(cb.id);
    const lineLoads = li === undefined || !first ? lines.map(() => 0) : columnLineLoads(lines, first, li);
    variants.push(...imperfectionVariants(loads, cb, directions, h, lines, lineLoads).variants);
  }
  const { model: analysed, additions } = withVariants(model, variants, 'sway imperfection');
  const notes: string[] = [];
  if (!directions.length) notes.push('no horizontal direction in which the frame can sway: no sway imperfection');
  notes.push('columns counted for αm: members within 1° of the vertical, one per plan position, in rows parallel to the sway; '
    + 'm = the fewest columns of a row carrying at least 50% of the row\'s average load (first-order N_Ed of the combination)');
  const rule = 'EN 1993-1-1 5.3.2 global sway imperfection φ = φ0·αh·αm as equivalent horizontal forces φ·N_Ed at the nodes, '
    + 'each horizontal direction and sign, on every strength combination';
  return { model: analysed, strength: { loadScale: 1 }, rule, additions, notes };
}
