/**
 * One analysis result from two second-order runs of the same model that differ in what the
 * code asks of each limit state (AISC: strength loadings with reduced stiffness and, for ASD,
 * at 1.6× load; service loadings unreduced at 1.0×): the cases and strength combinations from
 * `strength`, the service combinations from `service`, combinations in the model's order.
 */
import type { AnalysisResult, Loading } from '../engine/types.js';

export function mergedAnalysis(strength: AnalysisResult, service: AnalysisResult, order: readonly string[]): AnalysisResult {
  const serviceIndex = new Map<string, number>();
  service.loadings.forEach((l, i) => { if (l.limitState === 'service') serviceIndex.set(l.id, i); });
  const strengthIndex = new Map<string, number>();
  strength.loadings.forEach((l, i) => { if (l.limitState !== 'service') strengthIndex.set(`${l.kind}:${l.id}:${l.envelope ?? ''}`, i); });
  // cases (strength run), then the combinations in the model's order (`order`: combination ids)
  const loadings: Loading[] = [];
  const from: { run: AnalysisResult; index: number }[] = [];
  for (const l of strength.loadings) {
    if (l.kind !== 'case') continue;
    loadings.push(l);
    from.push({ run: strength, index: strengthIndex.get(`case:${l.id}:${l.envelope ?? ''}`)! });
  }
  const rank = new Map(order.map((id, i) => [id, i]));
  const combos = [...strength.loadings.filter((l) => l.kind === 'combination'), ...service.loadings.filter((l) => l.limitState === 'service')]
    .map((l, i) => ({ l, i })).sort((a, b) => (rank.get(a.l.id) ?? Infinity) - (rank.get(b.l.id) ?? Infinity) || a.i - b.i).map(({ l }) => l);
  for (const l of combos) {
    loadings.push(l);
    from.push(l.limitState === 'service'
      ? { run: service, index: serviceIndex.get(l.id)! }
      : { run: strength, index: strengthIndex.get(`combination:${l.id}:${l.envelope ?? ''}`)! });
  }
  const pick = (l: number) => {
    const f = from[l];
    if (!f) throw new Error(`loading index ${l} out of range`);
    return f;
  };
  return {
    nodeIds: strength.nodeIds,
    memberIds: strength.memberIds,
    loadings,
    supportedNodes: strength.supportedNodes,
    displacements: (l) => { const f = pick(l); return f.run.displacements(f.index); },
    reactions: (l) => { const f = pick(l); return f.run.reactions(f.index); },
    memberForces: (mi, l) => { const f = pick(l); return f.run.memberForces(mi, f.index); },
    memberLength: (mi) => strength.memberLength(mi),
    diagnostics: {
      ...strength.diagnostics,
      timings: sumTimings(strength.diagnostics.timings, service.diagnostics.timings),
      equilibrium: [
        ...strength.diagnostics.equilibrium.filter((e) => !serviceIndex.has(e.loading)),
        ...service.diagnostics.equilibrium.filter((e) => serviceIndex.has(e.loading)),
      ],
    },
  };
}

function sumTimings(a: Record<string, number>, b: Record<string, number>): Record<string, number> {
  const out = { ...a };
  for (const [k, v] of Object.entries(b)) out[k] = (out[k] ?? 0) + v;
  return out;
}
