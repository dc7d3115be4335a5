/**
 * The five export tables of a run, built with the shared result tables
 * (shared/exports/results.ts) from what the run kept: utilisation and check records,
 * node displacements and reactions (through a small AnalysisResult view over the stored
 * arrays); member forces come from a worker that holds the analysis.
 */
import type { CheckRecord, MemberUtilisation } from '../../shared/design/types.js';
import type { AnalysisResult } from '../../shared/engine/types.js';
import { checksTable, displacementTable, reactionTable, utilisationTable, type ResultTable } from '../../shared/exports/results.js';
import type { Model } from '../../shared/model/types.js';
import type { LoadingInfo } from '../../shared/schemas/runs.js';
import { noiseFloor, type NoiseFloor } from '../../shared/design/noise.js';

/** Just enough of AnalysisResult for the node tables, over stored loading-major arrays. */
export function storedNodeResults(
  model: Model,
  loadings: LoadingInfo[],
  displacements: Float64Array,
  reactions: Float64Array,
  only?: number[],
): AnalysisResult {
  const n = model.nodes.length * 6;
  const chosen = only ?? loadings.map((_, i) => i);
  const nodeIndex = new Map(model.nodes.map((x, i) => [x.id, i]));
  const supported = [...new Set(model.supports.map((s) => nodeIndex.get(s.node)).filter((i): i is number => i !== undefined))];
  const view = {
    nodeIds: model.nodes.map((x) => x.id),
    memberIds: model.members.map((m) => m.id),
    loadings: chosen.map((l) => ({ id: loadings[l].id, kind: loadings[l].kind, limitState: loadings[l].limitState, terms: [], ...(loadings[l].envelope ? { envelope: loadings[l].envelope } : {}) })),
    displacements: (l: number) => displacements.subarray(chosen[l] * n, (chosen[l] + 1) * n),
    reactions: (l: number) => reactions.subarray(chosen[l] * n, (chosen[l] + 1) * n),
    supportedNodes: supported,
  };
  return view as unknown as AnalysisResult;
}

export function utilisationExport(model: Model, members: MemberUtilisation[]): ResultTable {
  return utilisationTable(model, { members, records: [] });
}

export function checksExport(model: Model, records: CheckRecord[]): ResultTable {
  return checksTable(model, { members: [], records });
}

export function displacementsExport(model: Model, nodes: AnalysisResult): ResultTable {
  return displacementTable(model, nodes);
}

/** `floor`: the noise floor over every loading of the run (shared/design/noise.ts), even when one loading is exported. */
export function reactionsExport(model: Model, nodes: AnalysisResult, floor?: NoiseFloor): ResultTable {
  return reactionTable(model, nodes, floor);
}

/** The run's noise floor from its stored reactions (every loading). */
export function storedNoiseFloor(model: Model, loadings: LoadingInfo[], displacements: Float64Array, reactions: Float64Array): NoiseFloor {
  return noiseFloor(model, storedNodeResults(model, loadings, displacements, reactions));
}
