/**
 * Horizontal load variants of strength combinations: a combination that gets code-required
 * horizontal forces (AISC notional loads, EN sway imperfection forces) is replaced by one
 * variant per horizontal direction and sign, each a combination of its own — the original
 * terms plus a generated case holding that variant's node forces (factor 1.0).
 *
 * Names: combination `ULS2 +X notional`, its case `ULS2 +X notional loads`.
 */
import type { Combination, LoadCase, Model, NodeLoad, Six } from '../model/types.js';

/** A horizontal direction of sway: global axis index (0 = X, 1 = Y, 2 = Z) and sign. */
export interface SwayDirection {
  axis: number;
  sign: 1 | -1;
  /** "+X", "-Y", … */
  label: string;
}

/**
 * The horizontal directions in which the frame can sway, both signs: the two global axes
 * other than the vertical one, less the normal of a plane frame and any axis along which
 * every node is held by a support (nothing can lean that way).
 */
export function swayDirections(model: Model): SwayDirection[] {
  const up = model.settings.verticalAxis === 'Y' ? 1 : 2;
  const normal = model.inferred.planeFrame?.normal;
  const held = [0, 1, 2].map((axis) => {
    const nodes = new Set(model.supports.filter((s) => s.restrained[axis]).map((s) => s.node));
    return model.nodes.length > 0 && model.nodes.every((n) => nodes.has(n.id));
  });
  const out: SwayDirection[] = [];
  for (let axis = 0; axis < 3; axis++) {
    const name = 'XYZ'[axis];
    if (axis === up || normal === name || held[axis]) continue;
    out.push({ axis, sign: 1, label: `+${name}` }, { axis, sign: -1, label: `-${name}` });
  }
  return out;
}

export interface LoadVariant {
  /** the combination it replaces */
  combination: string;
  direction: SwayDirection;
  /** horizontal force per user node (N), along the direction's axis and sign */
  forces: Float64Array;
  /** what was added, in words (SecondOrderLoading.additions) */
  additions: string;
}

/** A new id not in `taken` (primes appended, as the reader does for generated combinations). */
function fresh(id: string, taken: Set<string>): string {
  while (taken.has(id)) id += "'";
  taken.add(id);
  return id;
}

export interface VariantModel {
  model: Model;
  /** variant combination id → what was added */
  additions: Map<string, string>;
}

/**
 * The model with each listed combination replaced (in place, in order) by its variants.
 * `suffix` names the rule ("notional", "sway imperfection").
 */
export function withVariants(model: Model, variants: LoadVariant[], suffix: string): VariantModel {
  const taken = new Set<string>([...model.cases.map((c) => c.id), ...model.combinations.map((c) => c.id)]);
  const byCombination = new Map<string, LoadVariant[]>();
  for (const v of variants) {
    const list = byCombination.get(v.combination) ?? [];
    list.push(v);
    byCombination.set(v.combination, list);
  }
  const cases: LoadCase[] = [...model.cases];
  const nodeLoads: NodeLoad[] = [...model.nodeLoads];
  const combinations: Combination[] = [];
  const additions = new Map<string, string>();
  for (const cb of model.combinations) {
    const list = byCombination.get(cb.id);
    if (!list) { combinations.push(cb); continue; }
    for (const v of list) {
      const id = fresh(`${cb.id} ${v.direction.label} ${suffix}`, taken);
      const caseId = fresh(`${id} loads`, taken);
      cases.push({ id: caseId, category: 'other', title: `${suffix} forces of ${cb.id} along ${v.direction.label}`, selfWeight: 0, mass: false });
      v.forces.forEach((f, n) => {
        if (f === 0) return;
        const values: Six<number> = [0, 0, 0, 0, 0, 0];
        values[v.direction.axis] = f;
        nodeLoads.push({ case: caseId, node: model.nodes[n].id, values });
      });
      combinations.push({
        id, limitState: cb.limitState, terms: [...cb.terms, { case: caseId, factor: 1 }], generated: true,
        source: `${cb.id} with ${v.additions}`,
      });
      additions.set(id, v.additions);
    }
  }
  return { model: { ...model, cases, nodeLoads, combinations }, additions };
}
