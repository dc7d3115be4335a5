/**
 * The model picture's data for one loading: nodes, members with their governing ratio,
 * supports, the loads of that loading (factored and summed for a combination) and node
 * displacements. Pure.
 */
import { pictureVehicles } from '../moving/picture.js';
import type { CheckStatus } from '../design/types.js';
import type { Model } from '../model/types.js';
import type { LoadingInfo, RunGeometry } from '../schemas/runs.js';

export interface GeometryInput {
  runId: number;
  model: Model;
  loadings: LoadingInfo[];
  loadingIndex: number;
  /** nNodes*6 for the chosen loading, in model node order */
  displacements: Float64Array;
  ratios: Map<string, { ratio: number | null; status: CheckStatus }>;
}

/** case id → factor for a loading (a case is itself with factor 1). */
export function loadingFactors(model: Model, loading: LoadingInfo): Map<string, number> {
  if (loading.kind === 'case') return new Map([[loading.id, 1]]);
  const combo = model.combinations.find((c) => c.id === loading.id);
  const out = new Map<string, number>();
  for (const t of combo?.terms ?? []) out.set(t.case, (out.get(t.case) ?? 0) + t.factor);
  return out;
}

export function runGeometry(input: GeometryInput): RunGeometry {
  const { model, loadings, loadingIndex, displacements, ratios } = input;
  const nodeIndex = new Map(model.nodes.map((n, i) => [n.id, i]));
  const memberIndex = new Map(model.members.map((m, i) => [m.id, i]));
  const loading = loadings[loadingIndex];
  const factors = loadingFactors(model, loading);

  const nodeLoadSums = new Map<number, number[]>();
  for (const nl of model.nodeLoads) {
    const f = factors.get(nl.case);
    const n = nodeIndex.get(nl.node);
    if (!f || n === undefined) continue;
    const sum = nodeLoadSums.get(n) ?? [0, 0, 0, 0, 0, 0];
    nl.values.forEach((v, i) => (sum[i] += f * v));
    nodeLoadSums.set(n, sum);
  }
  const memberLoads: RunGeometry['memberLoads'] = [];
  for (const ml of model.memberLoads) {
    const f = factors.get(ml.case);
    const m = memberIndex.get(ml.member);
    if (!f || m === undefined) continue;
    memberLoads.push({ member: m, kind: ml.kind, direction: ml.direction, a: ml.a, b: ml.b, w1: f * ml.w1, w2: f * ml.w2 });
  }
  let maxDisplacement = 0;
  for (let i = 0; i < model.nodes.length; i++) {
    const d = Math.hypot(displacements[i * 6] ?? 0, displacements[i * 6 + 1] ?? 0, displacements[i * 6 + 2] ?? 0);
    if (d > maxDisplacement) maxDisplacement = d;
  }
  const moving = pictureVehicles(model);
  return {
    runId: input.runId,
    units: model.settings.units,
    verticalAxis: model.settings.verticalAxis,
    planeFrame: model.inferred.planeFrame,
    loadings,
    loading: loading.envelope ? `${loading.id}@${loading.envelope}` : loading.id,
    nodes: model.nodes.map((n) => [n.id, n.x, n.y, n.z] as [string, number, number, number]),
    members: model.members.map((m) => {
      const r = ratios.get(m.id);
      return {
        id: m.id,
        start: nodeIndex.get(m.start) ?? -1,
        end: nodeIndex.get(m.end) ?? -1,
        ratio: r?.ratio ?? null,
        status: r?.status ?? 'not checked',
      };
    }),
    supports: model.supports
      .filter((s) => nodeIndex.has(s.node))
      .map((s) => ({ node: nodeIndex.get(s.node)!, restrained: [...s.restrained] })),
    nodeLoads: [...nodeLoadSums].map(([node, values]) => ({ node, values })),
    memberLoads,
    displacements: Array.from(displacements.subarray(0, model.nodes.length * 6)),
    maxDisplacement,
    ...(moving ? { moving } : {}),
  };
}
