/**
 * The stability summary of a run (shared/stability) as we keep it: the numbers as JSON on the
 * run (`runs.stabilityJson`, small), the mode and buckled shapes as one gzip Float64 block in
 * `run_results.shapesData` — natural modes first, then every loading's buckled shapes in the
 * order of `critical`, each nNodes × 6 long.
 */
import type { StabilitySummary } from '../../shared/stability/types.js';
import type { RunShape, RunStability, ShapeKind } from '../../shared/schemas/runs.js';

/** JSON has no Infinity: an infinite αcr or amplifier becomes null. */
const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);

export function stabilityToJson(s: StabilitySummary, notes: string[] = []): RunStability {
  return {
    analysis: s.analysis,
    method: s.method,
    notes: [...notes],
    ...(s.subdivisions !== undefined ? { subdivisions: s.subdivisions } : {}),
    ...(s.tolerance !== undefined ? { tolerance: s.tolerance } : {}),
    secondOrder: s.secondOrder.map((l) => ({
      loading: l.loading,
      iterations: l.iterations,
      converged: l.converged,
      change: l.change,
      ...(l.amplification !== undefined && Number.isFinite(l.amplification) ? { amplification: l.amplification } : {}),
      ...(l.additions ? { additions: l.additions } : {}),
    })),
    critical: s.critical.map((c) => ({ loading: c.loading, alphaCr: c.alphaCr.map(finite), shapes: c.shapes?.length ?? 0 })),
    modes: s.modes.map((m) => ({ mode: m.mode, frequency: m.frequency, period: m.period, massRatio: [m.massRatio[0], m.massRatio[1], m.massRatio[2]] })),
    ...(s.totalMass ? { totalMass: [s.totalMass[0], s.totalMass[1], s.totalMass[2]] as [number, number, number] } : {}),
    warnings: s.warnings.map((w) => ({
      loading: w.loading,
      alphaCr: finite(w.alphaCr),
      amplifier: finite(w.amplifier),
      reasons: [...w.reasons],
      message: w.message,
    })),
  };
}

/** Every shape of the summary in one block (modes, then buckled shapes); empty when none. */
export function packShapes(s: StabilitySummary): Float64Array {
  const shapes: Float64Array[] = [...s.modes.map((m) => m.shape), ...s.critical.flatMap((c) => c.shapes ?? [])];
  const total = shapes.reduce((n, a) => n + a.length, 0);
  const out = new Float64Array(total);
  let at = 0;
  for (const a of shapes) {
    out.set(a, at);
    at += a.length;
  }
  return out;
}

function count(n: number, one: string): string {
  return `${n} ${one}${n === 1 ? '' : 's'}`;
}

/**
 * One shape out of the packed block. `index` is 1-based; buckling needs the loading (default:
 * the first loading with shapes). Throws a message naming what does not exist.
 */
export function shapeFromBlock(
  stability: RunStability,
  block: Float64Array,
  nodeCount: number,
  kind: ShapeKind,
  index: number,
  loading?: string,
): Omit<RunShape, 'runId'> {
  const size = nodeCount * 6;
  if (kind === 'mode') {
    const m = stability.modes[index - 1];
    if (!m) {
      const n = stability.modes.length;
      throw new Error(n ? `mode ${index} does not exist: this run has ${count(n, 'natural mode')}` : 'this run computed no natural modes (settings modes = 0)');
    }
    const at = (index - 1) * size;
    if (block.length < at + size) throw new Error(`the shape of mode ${index} was not kept with this run`);
    return {
      kind, index, loading: '',
      label: `mode ${index}: ${m.frequency.toPrecision(4)} Hz, period ${m.period.toPrecision(4)} s`,
      displacements: Array.from(block.subarray(at, at + size)),
    };
  }
  const withShapes = stability.critical.filter((c) => c.shapes > 0);
  if (withShapes.length === 0) throw new Error('this run kept no buckled shapes (settings buckling_modes = 0)');
  const chosen = loading ? stability.critical.find((c) => c.loading === loading) : withShapes[0];
  if (!chosen) throw new Error(`loading "${loading}" has no elastic critical load factors in this run`);
  if (index < 1 || index > chosen.shapes) {
    throw new Error(chosen.shapes ? `buckling mode ${index} of ${chosen.loading} does not exist: ${count(chosen.shapes, 'buckled shape')} kept` : `no buckled shape was kept for ${chosen.loading}`);
  }
  let at = stability.modes.length * size;
  for (const c of stability.critical) {
    if (c === chosen) break;
    at += c.shapes * size;
  }
  at += (index - 1) * size;
  if (block.length < at + size) throw new Error(`the buckled shape ${index} of ${chosen.loading} was not kept with this run`);
  const alpha = chosen.alphaCr[index - 1];
  return {
    kind, index, loading: chosen.loading,
    label: `${chosen.loading} buckling mode ${index}: αcr = ${alpha === null || alpha === undefined ? '∞' : alpha.toPrecision(4)}`,
    displacements: Array.from(block.subarray(at, at + size)),
  };
}
