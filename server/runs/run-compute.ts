/**
 * The work of one run, as the worker thread does it: read the model JSON, analyse every
 * loading, check every member, and pack what the server keeps. Pure apart from timing.
 */
import { exposedGc } from './garbage.js';
import { performance } from 'node:perf_hooks';
import { gzipSync } from 'node:zlib';
import { maxRatio, statusCounts } from '../../shared/results/member-rows.js';
import type { RunCounts } from '../../shared/schemas/runs.js';
import type { DesignCode, Model } from '../../shared/model/types.js';
import type { AnalysisResult } from '../../shared/engine/types.js';
import type { CheckRecord, MemberUtilisation } from '../../shared/design/types.js';
import { RUN_PHASES, type LoadingInfo, type RunPhase, type RunStability } from '../../shared/schemas/runs.js';
import { withModelDefaults } from '../../shared/model/defaults.js';
import type { AnalyseOptions } from '../../shared/engine/index.js';
import { factorise as factoriseSystem } from '../../shared/engine/solverBridge.js';
import { checkMember, checkModel, type DesignOptions } from '../../shared/design/index.js';
import { analyseModel, type StabilitySummary } from '../../shared/stability/index.js';
import { packShapes, stabilityToJson } from './stability-codec.js';
import { packParts, type PackedParts } from './result-parts.js';

export interface RunOutput {
  members: MemberUtilisation[];
  records: CheckRecord[];
  /** more records than MAX_STORED_RECORDS: `records` is empty and none are stored */
  recordsOmitted?: boolean;
  loadings: LoadingInfo[];
  nodeCount: number;
  /** loading-major, nNodes*6 per loading */
  displacements: Float64Array;
  reactions: Float64Array;
  timings: Record<string, number>;
  diagnostics: { nodes: number; members: number; freedoms: number; loadings: number; maxEquilibriumResidual: number };
  stability: StabilitySummary;
  /** remarks of the stability floor (how the code rules were applied) */
  notes: string[];
  /**
   * The model the analysis ran on when it differs from the input (second order under a design
   * code adds notional loads or sway imperfections as generated cases and combination
   * variants); null when it is the input model.
   */
  analysedModel: Model | null;
}

export interface Analysed {
  /** the model the analysis ran on: its combinations match `analysis.loadings` */
  model: Model;
  analysis: AnalysisResult;
  stability: StabilitySummary;
}

/** One member's records with the stability summary (the method, its warning) as the run had them. */
export function checkMemberWithStability(model: Model, analysis: AnalysisResult, member: number, loading: number, stability: StabilitySummary): CheckRecord[] {
  const check = checkMember as (m: Model, a: AnalysisResult, i: number, l: number, o?: { stability?: StabilitySummary }) => CheckRecord[];
  return check(model, analysis, member, loading, { stability });
}

/**
 * The design checks with the stability summary (the method, αcr, warnings) when the checks
 * take it (DesignOptions.stability); older checks ignore the extra option.
 */
export function checkWithStability(model: Model, analysis: AnalysisResult, stability: StabilitySummary, maxRecords?: number) {
  const options: DesignOptions & { stability?: StabilitySummary } = { stability, ...(maxRecords !== undefined ? { maxRecords } : {}) };
  return checkModel(model, analysis, options);
}

/** The model of a run: the stored JSON with the run's design code in force. */
export function readRunModel(modelJson: string, designCode: DesignCode): Model {
  const model = withModelDefaults(JSON.parse(modelJson) as Model);
  model.settings = { ...model.settings, designCode };
  return model;
}

export function loadingInfos(analysis: AnalysisResult): LoadingInfo[] {
  return analysis.loadings.map((l) => ({ id: l.id, kind: l.kind, limitState: l.limitState, ...(l.envelope ? { envelope: l.envelope } : {}) }));
}

/** Engine timing keys → our phase names. */
const ENGINE_PHASES: Record<string, RunPhase> = {
  assembly: 'assembling',
  ordering: 'factorising',
  factorisation: 'factorising',
  solve: 'solving',
  recovery: 'recovering',
};

/**
 * Past this many factor entries (160 MB) a factorisation is followed, before the run's next
 * one, by a collection of garbage: the first-order factor of a big model is garbage once its
 * loads are solved, but V8 would keep it until it needs room, so it would sit beside the
 * stability warning's larger factor (110k members: 135 M entries, then the warning's mesh).
 */
const COLLECT_BETWEEN_FACTORS_ABOVE = 20_000_000;
const gc = exposedGc();

/** The engine's factorise hook, reporting the solver's phases. */
function phaseReportingFactorise(onPhase: (phase: RunPhase) => void): NonNullable<AnalyseOptions['factorise']> {
  let collect = false;
  return (K, opts) => {
    onPhase('factorising');
    if (collect && gc) gc();
    const f = factoriseSystem(K, opts);
    collect = f.nnzFactor > COLLECT_BETWEEN_FACTORS_ABOVE;
    let solving = false;
    return {
      n: f.n,
      nnzFactor: f.nnzFactor,
      timings: f.timings,
      solve: (B, nrhs) => {
        if (!solving) onPhase('solving');
        solving = true;
        const x = f.solve(B, nrhs);
        onPhase('recovering');
        return x;
      },
    };
  };
}

export function computeRun(
  modelJson: string,
  designCode: DesignCode,
  report: (phase: RunPhase) => void = () => {},
): { output: RunOutput; analysed: Analysed } {
  // phases only move forward (second order and eigenvalues factorise and solve many times)
  let reached = -1;
  const onPhase = (phase: RunPhase) => {
    const i = RUN_PHASES.indexOf(phase);
    if (i > reached) report(phase);
    reached = Math.max(reached, i);
  };
  const timings: Record<string, number> = {};
  let t = performance.now();
  const lap = (phase: string) => {
    const now = performance.now();
    timings[phase] = (timings[phase] ?? 0) + (now - t);
    t = now;
  };

  onPhase('reading');
  const model = readRunModel(modelJson, designCode);
  lap('reading');

  onPhase('assembling');
  const { analysis, stability, model: analysed, notes } = analyseModel(model, { factorise: phaseReportingFactorise(onPhase) });
  const analysisMs = performance.now() - t;
  t = performance.now();
  let engineSum = 0;
  for (const [key, ms] of Object.entries(analysis.diagnostics.timings ?? {})) {
    const phase = ENGINE_PHASES[key] ?? key;
    timings[phase] = (timings[phase] ?? 0) + ms;
    engineSum += ms;
  }
  // what the engine did not time: the stability work (iterations, eigenvalues) or assembly
  const stabilityWork = stability.secondOrder.length > 0 || stability.critical.length > 0 || stability.modes.length > 0;
  const rest = stabilityWork ? 'stability' : 'assembling';
  if (engineSum < analysisMs) timings[rest] = (timings[rest] ?? 0) + (analysisMs - engineSum);

  onPhase('checking');
  // records past MAX_STORED_RECORDS are not stored (packRun): not kept either
  const design = checkWithStability(analysed, analysis, stability, MAX_STORED_RECORDS);
  lap('checking');

  const nNodes = analysis.nodeIds.length;
  const nLoadings = analysis.loadings.length;
  const displacements = new Float64Array(nNodes * 6 * nLoadings);
  const reactions = new Float64Array(nNodes * 6 * nLoadings);
  for (let l = 0; l < nLoadings; l++) {
    displacements.set(analysis.displacements(l), l * nNodes * 6);
    reactions.set(analysis.reactions(l), l * nNodes * 6);
  }
  lap('packing');

  const equilibrium = analysis.diagnostics.equilibrium ?? [];
  return {
    analysed: { model: analysed, analysis, stability },
    output: {
      members: design.members,
      records: design.records,
      recordsOmitted: design.recordsOmitted === true,
      loadings: loadingInfos(analysis),
      nodeCount: nNodes,
      displacements,
      reactions,
      timings,
      diagnostics: {
        nodes: analysis.diagnostics.nodes,
        members: analysis.diagnostics.members,
        freedoms: analysis.diagnostics.freedoms,
        loadings: nLoadings,
        maxEquilibriumResidual: equilibrium.reduce((mx, e) => Math.max(mx, e.residual), 0),
      },
      stability,
      notes,
      analysedModel: analysed === model ? null : analysed,
    },
  };
}

/** What the worker hands back: results already encoded for run_results (no big clone). */
export interface PackedRun {
  counts: RunCounts;
  maxRatio: number | null;
  /** gzip(JSON MemberUtilisation[]) */
  membersData: Uint8Array;
  /** gzip(JSON CheckRecord[]), or gzip('null') when there were more than MAX_STORED_RECORDS */
  recordsData: Uint8Array;
  /** empty: node results are kept per loading in `parts` (runs before them kept gzip(Float64 displacements then reactions) here) */
  nodeData: Uint8Array;
  /** one row per member and per loading (server/runs/result-parts.ts) */
  parts: PackedParts;
  loadings: LoadingInfo[];
  nodeCount: number;
  timings: Record<string, number>;
  diagnostics: RunOutput['diagnostics'];
  /** JSON of RunStability (shared/schemas/runs.ts) */
  stabilityJson: string;
  /** gzip(Float64 mode shapes then buckled shapes), see stability-codec.ts; empty when none */
  shapesData: Uint8Array;
  /** gzip(JSON Model) of the model the analysis ran on when it differs from the input; empty otherwise */
  analysedModelData: Uint8Array;
  /** the grid's payload (column layout, gzip) when the task asked for it (RunTask.grid) */
  gridTable?: Uint8Array;
}

/**
 * Check records are kept only up to this many; above it (large models) the detailed-checks
 * export recomputes them in a worker, which keeps a rerun close to the bare analysis time.
 * (RUN_MAX_STORED_RECORDS overrides it.)
 */
export const MAX_STORED_RECORDS = Number(process.env.RUN_MAX_STORED_RECORDS) || 20_000;

export function packRun(out: RunOutput, model: Pick<Model, 'members'>): PackedRun {
  const t0 = performance.now();
  const gz = (b: Buffer) => new Uint8Array(gzipSync(b, { level: 1 }));
  const d = out.displacements;
  const r = out.reactions;
  const packed: PackedRun = {
    counts: statusCounts(out.members),
    maxRatio: maxRatio(out.members),
    membersData: gz(Buffer.from(JSON.stringify(out.members), 'utf8')),
    recordsData: gz(Buffer.from(!out.recordsOmitted && out.records.length <= MAX_STORED_RECORDS ? JSON.stringify(out.records) : 'null', 'utf8')),
    nodeData: new Uint8Array(0),
    parts: packParts(model, out.members, d, r, out.nodeCount, out.loadings.length),
    loadings: out.loadings,
    nodeCount: out.nodeCount,
    timings: { ...out.timings },
    diagnostics: out.diagnostics,
    stabilityJson: JSON.stringify(stabilityToJson(out.stability, out.notes) satisfies RunStability),
    shapesData: packedShapes(out.stability),
    analysedModelData: out.analysedModel ? gz(Buffer.from(JSON.stringify(out.analysedModel), 'utf8')) : new Uint8Array(0),
  };
  packed.timings.packing = (packed.timings.packing ?? 0) + (performance.now() - t0);
  return packed;
}

function packedShapes(stability: StabilitySummary): Uint8Array {
  const shapes = packShapes(stability);
  if (shapes.length === 0) return new Uint8Array(0);
  return new Uint8Array(gzipSync(Buffer.from(shapes.buffer, shapes.byteOffset, shapes.byteLength), { level: 1 }));
}

/**
 * Analysis only (member detail and force exports when the worker no longer holds it): the
 * same analysis as the run (first or second order, the same code rules and αcr), so the
 * diagrams and records are the run's.
 */
export function analyseOnly(modelJson: string, designCode: DesignCode, stored?: RunStability | null): Analysed {
  const input = readRunModel(modelJson, designCode);
  // natural modes change neither forces nor checks: skip them here (the run kept them)
  input.settings = { ...input.settings, modes: 0 };
  // the first-order warning changes no force: with the run's own summary at hand, its αcr
  // (the costliest part of a big first-order run) is not computed again; the records get the
  // run's warnings and method from the summary
  const reuse = !!stored && stored.analysis === 'first_order' && input.settings.analysis === 'first_order' && input.settings.bucklingModes === 0;
  if (reuse) input.settings = { ...input.settings, stabilityWarning: false };
  const { analysis, stability, model } = analyseModel(input);
  if (reuse && stored) {
    stability.method = stored.method;
    stability.warnings = stored.warnings.map((w) => ({
      loading: w.loading, alphaCr: w.alphaCr ?? Infinity, amplifier: w.amplifier ?? Infinity, reasons: [...w.reasons], message: w.message,
    })) as StabilitySummary['warnings'];
  }
  return { model, analysis, stability };
}
