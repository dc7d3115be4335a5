/**
 * EN 1993-1-1 5.3.2: global initial sway imperfection and its equivalent horizontal forces.
 *
 *   φ = φ0·αh·αm                        (5.5)
 *   φ0 = 1/200
 *   αh = 2/√h, 2/3 ≤ αh ≤ 1.0            h the height of the structure (m)
 *   αm = √(0.5·(1 + 1/m))                m the number of columns in a row
 *   equivalent horizontal force φ·N_Ed at each node, N_Ed its vertical load (5.3.2(7), Figure 5.4)
 *
 * How columns are counted (stated in the run summary): a column is a member within 1° of the
 * vertical; members at the same plan position (1 mm) form one column line, whose load N_Ed
 * is its largest compression in the combination's first-order analysis. For sway along an
 * axis, a row is the column lines sharing the other horizontal coordinate (the vertical plane
 * parallel to the sway). In each row, m counts the lines carrying at least 50% of the row's
 * average line load (5.3.2(3)); the smallest m over the rows that carry load is used (the
 * largest αm, on the safe side). A plane frame has one row. No column at all: m = 1.
 * The exemption of 5.3.2(4) (H_Ed ≥ 0.15·V_Ed) is not used: the imperfection is always applied.
 */
import type { Combination, Model } from '../model/types.js';
import type { AnalysisResult } from '../engine/types.js';
import { gravityPerNode, type NodalLoads } from './nodal-loads.js';
import type { LoadVariant, SwayDirection } from './load-variants.js';

/** 5.3.2(3) a) */
export const PHI0 = 1 / 200;
/** a member within this angle of the vertical is a column (rad) */
export const COLUMN_TOLERANCE = Math.PI / 180;

/** αh = 2/√h bounded to [2/3, 1] (h in m; h ≤ 0 gives 1). */
export function alphaH(h: number): number {
  if (!(h > 0)) return 1;
  return Math.min(1, Math.max(2 / 3, 2 / Math.sqrt(h)));
}

/** αm = √(0.5·(1 + 1/m)); m < 1 is taken as 1. */
export function alphaM(m: number): number {
  return Math.sqrt(0.5 * (1 + 1 / Math.max(1, m)));
}

export interface SwayImperfection {
  phi: number;
  phi0: number;
  alphaH: number;
  alphaM: number;
  h: number;
  m: number;
}

/** φ = φ0·αh·αm for a structure of height h (m) with m columns in a row. */
export function swayImperfection(h: number, m: number): SwayImperfection {
  const ah = alphaH(h), am = alphaM(m);
  return { phi: PHI0 * ah * am, phi0: PHI0, alphaH: ah, alphaM: am, h, m };
}

/** Height of the structure: the vertical extent of its nodes (m). */
export function structureHeight(model: Model): number {
  const key = model.settings.verticalAxis === 'Y' ? 'y' : 'z';
  let lo = Infinity, hi = -Infinity;
  for (const n of model.nodes) { lo = Math.min(lo, n[key]); hi = Math.max(hi, n[key]); }
  return model.nodes.length ? hi - lo : 0;
}

export interface ColumnLine {
  /** plan coordinates along the three global axes (the vertical one 0) */
  plan: [number, number, number];
  members: number[];
}

/** Column lines: vertical members grouped by plan position (1 mm). */
export function columnLines(model: Model): ColumnLine[] {
  const up = model.settings.verticalAxis === 'Y' ? 1 : 2;
  const nodes = new Map(model.nodes.map((n) => [n.id, n]));
  const lines = new Map<string, ColumnLine>();
  const cosTol = Math.cos(COLUMN_TOLERANCE);
  model.members.forEach((m, mi) => {
    const a = nodes.get(m.start), b = nodes.get(m.end);
    if (!a || !b) return;
    const d = [b.x - a.x, b.y - a.y, b.z - a.z];
    const L = Math.hypot(d[0], d[1], d[2]);
    if (!(L > 0) || Math.abs(d[up]) / L < cosTol) return;
    const plan: [number, number, number] = [(a.x + b.x) / 2, (a.y + b.y) / 2, (a.z + b.z) / 2];
    plan[up] = 0;
    const key = plan.map((v) => Math.round(v * 1000)).join(',');
    const line = lines.get(key) ?? { plan, members: [] };
    line.members.push(mi);
    lines.set(key, line);
  });
  return [...lines.values()];
}

/**
 * m of 5.3.2(3) for sway along `axis` given each column line's load (compression, N).
 * Rows: lines sharing the transverse horizontal coordinate (1 mm).
 */
export function columnsInRow(lines: ColumnLine[], loads: number[], axis: number, up: number): number {
  const transverse = [0, 1, 2].find((k) => k !== axis && k !== up)!;
  const rows = new Map<number, number[]>();
  lines.forEach((l, i) => {
    const key = Math.round(l.plan[transverse] * 1000);
    const row = rows.get(key) ?? [];
    row.push(loads[i]);
    rows.set(key, row);
  });
  let m = Infinity;
  for (const row of rows.values()) {
    const avg = row.reduce((s, v) => s + Math.max(0, v), 0) / row.length;
    if (!(avg > 0)) continue;
    m = Math.min(m, row.filter((v) => v >= 0.5 * avg).length);
  }
  return Number.isFinite(m) ? m : 1;
}

/** Largest compression (N, positive) of each column line in one loading of a first-order analysis. */
export function columnLineLoads(lines: ColumnLine[], analysis: AnalysisResult, loading: number): number[] {
  return lines.map((l) => {
    let c = 0;
    for (const mi of l.members) {
      const N = analysis.memberForces(mi, loading).N;
      for (let i = 0; i < N.length; i++) c = Math.max(c, -N[i]);
    }
    return c;
  });
}

/**
 * Sway-imperfection variants of one strength combination, per sway direction: φ·N_Ed at each
 * node, with φ from the combination's own column loads (m) and the structure height.
 */
export function imperfectionVariants(
  loads: NodalLoads, combination: Combination, directions: SwayDirection[],
  h: number, lines: ColumnLine[], lineLoads: number[],
): { variants: LoadVariant[]; imperfections: SwayImperfection[] } {
  const V = gravityPerNode(loads, combination);
  const imperfections: SwayImperfection[] = [];
  const variants = directions.map((direction) => {
    const m = lines.length ? columnsInRow(lines, lineLoads, direction.axis, loads.up) : 1;
    const imp = swayImperfection(h, m);
    imperfections.push(imp);
    const forces = new Float64Array(V.length);
    for (let n = 0; n < V.length; n++) forces[n] = direction.sign * imp.phi * V[n];
    const additions = `sway imperfection φ = φ0·αh·αm = 1/200 · ${fmt(imp.alphaH)} · ${fmt(imp.alphaM)} = 1/${fmt(1 / imp.phi)} `
      + `(h = ${fmt(h)} m, m = ${m}) as forces φ·N_Ed at the nodes along ${direction.label} (EN 1993-1-1 5.3.2(3), (7))`;
    return { combination: combination.id, direction, forces, additions };
  });
  return { variants, imperfections };
}

function fmt(v: number): string {
  return Number(v.toPrecision(4)).toString();
}
