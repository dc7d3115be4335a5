/**
 * The loads of every case as forces at the user's nodes (global X, Y, Z), for the code rules
 * that act on "the gravity load at each node": AISC 360-22 C2.2b notional loads (Yi) and
 * EN 1993-1-1 5.3.2(7) equivalent sway forces (φ·N_Ed).
 *
 * Node loads count as given. Member loads and self weight are lumped to the member's two
 * end nodes as the end reactions of a simply supported member (lever rule along the member:
 * the end node takes ∫ s·q ds / L, the start node the rest), so a member's total load reaches
 * its nodes unchanged. Concentrated member moments, temperature and settlements carry no
 * vertical or horizontal force and are left out.
 */
import type { Combination, Model } from '../model/types.js';
import { toGlobal3 } from '../engine/axes.js';
import { buildMesh } from '../engine/discretise.js';
import { buildLoadSets } from '../engine/memberLoads.js';

export interface NodalLoads {
  /** user nodes */
  nNodes: number;
  /** [case][node][X, Y, Z] forces (N): nCases × nNodes × 3 */
  forces: Float64Array;
  /**
   * per case: true when the case's forces have a net horizontal resultant (above 1e-6 of the
   * sum of its force magnitudes). Horizontal parts that cancel (a pitched roof loaded normal
   * to its slopes symmetrically, a pair of thrusts) leave the case gravity-only: notional
   * loads are then added, on the safe side.
   */
  lateral: boolean[];
  /** index of the vertical axis (1 = Y, 2 = Z) */
  up: number;
  caseIndex: Map<string, number>;
}

/** Lumped node forces of every case. */
export function nodalLoads(model: Model): NodalLoads {
  const nNodes = model.nodes.length, nCases = model.cases.length;
  const up = model.settings.verticalAxis === 'Y' ? 1 : 2;
  const caseIndex = new Map(model.cases.map((c, i) => [c.id, i]));
  const nodeIndex = new Map(model.nodes.map((n, i) => [n.id, i]));
  const forces = new Float64Array(nCases * nNodes * 3);
  // net force per case (X, Y, Z) and sum of magnitudes, for the "lateral" test
  const net = new Float64Array(nCases * 3), magnitude = new Float64Array(nCases);
  const add = (c: number, n: number, f: ArrayLike<number>) => {
    const o = (c * nNodes + n) * 3;
    for (let k = 0; k < 3; k++) {
      forces[o + k] += f[k];
      net[c * 3 + k] += f[k];
      magnitude[c] += Math.abs(f[k]);
    }
  };
  for (const nl of model.nodeLoads) {
    const c = caseIndex.get(nl.case), n = nodeIndex.get(nl.node);
    if (c === undefined) throw new Error(`node load on node ${nl.node}: case ${nl.case} does not exist`);
    if (n === undefined) throw new Error(`node load in case ${nl.case}: node ${nl.node} does not exist`);
    add(c, n, nl.values);
  }
  const mesh = buildMesh(model, { taperSegments: 1 });
  const sets = buildLoadSets(model, mesh.members, caseIndex);
  const F = [0, 0, 0], G = [0, 0, 0], fs = [0, 0, 0], fe = [0, 0, 0], gs = [0, 0, 0], ge = [0, 0, 0];
  mesh.members.forEach((m, mi) => {
    const L = m.L;
    for (let c = 0; c < nCases; c++) {
      const ls = sets[mi * nCases + c];
      if (!ls) continue;
      F[0] = F[1] = F[2] = G[0] = G[1] = G[2] = 0;
      for (let i = 0; i < ls.dist.length; i += 8) {
        const a = ls.dist[i], b = ls.dist[i + 1], len = b - a;
        if (!(len > 0)) continue;
        for (let k = 0; k < 3; k++) {
          const q1 = ls.dist[i + 2 + k], q2 = ls.dist[i + 5 + k];
          F[k] += ((q1 + q2) / 2) * len;
          G[k] += (q1 * (b * b - a * a)) / 2 + ((q2 - q1) * ((b * b * b - a * a * a) / 3 - (a * (b * b - a * a)) / 2)) / len;
        }
      }
      for (let i = 0; i < ls.point.length; i += 4) {
        for (let k = 0; k < 3; k++) { F[k] += ls.point[i + 1 + k]; G[k] += ls.point[i] * ls.point[i + 1 + k]; }
      }
      for (let k = 0; k < 3; k++) { fe[k] = G[k] / L; fs[k] = F[k] - fe[k]; }
      toGlobal3(m.R, fs, 0, gs, 0);
      toGlobal3(m.R, fe, 0, ge, 0);
      add(c, m.start, gs);
      add(c, m.end, ge);
    }
  });
  const h = [0, 1, 2].filter((k) => k !== up);
  const lateral = model.cases.map((_, c) => Math.hypot(net[c * 3 + h[0]], net[c * 3 + h[1]]) > 1e-6 * Math.max(1, magnitude[c]));
  return { nNodes, forces, lateral, up, caseIndex };
}

/** Node forces of a combination (nNodes × 3). */
export function combinationForces(loads: NodalLoads, combination: Combination): Float64Array {
  const n3 = loads.nNodes * 3;
  const out = new Float64Array(n3);
  for (const t of combination.terms) {
    const c = loads.caseIndex.get(t.case);
    if (c === undefined) throw new Error(`combination ${combination.id}: case ${t.case} does not exist`);
    const o = c * n3;
    for (let i = 0; i < n3; i++) out[i] += t.factor * loads.forces[o + i];
  }
  return out;
}

/** True when no case of the combination (with a non-zero factor) carries a horizontal force. */
export function gravityOnly(loads: NodalLoads, combination: Combination): boolean {
  return combination.terms.every((t) => t.factor === 0 || !loads.lateral[loads.caseIndex.get(t.case) ?? -1]);
}

/** Gravity load per node of a combination: the downward force (N), negative where the node is lifted. */
export function gravityPerNode(loads: NodalLoads, combination: Combination): Float64Array {
  const f = combinationForces(loads, combination);
  const out = new Float64Array(loads.nNodes);
  for (let n = 0; n < loads.nNodes; n++) out[n] = -f[n * 3 + loads.up];
  return out;
}
