/**
 * The analysis of a run as the settings ask for it: first or second order (`analysis`),
 * elastic critical load factors (`buckling_modes`, and the lowest αcr of every strength
 * combination for the first-order stability warning) and natural modes (`modes`), with the
 * design code's rules for each (checks.md "Stability", code-rules.ts).
 * Built on the engine; the server, the command line and the benchmarks call this.
 *
 *   first_order            the engine's analysis; under a design code (and stability_warning on)
 *                          the lowest αcr of every strength combination and a warning per
 *                          combination beyond the code's limit (stability-warnings.ts)
 *   second_order           every loading on its own with geometric stiffness (second-order.ts);
 *                          AISC: direct analysis method; EN: sway imperfection and αcr reported;
 *                          moving loads are refused (an envelope over vehicle positions is a
 *                          superposition, which second order does not allow)
 *   buckling_modes = n     n αcr per strength combination with buckled shapes
 *   modes = n              n natural modes
 */
import { analyse, type AnalyseOptions } from '../engine/index.js';
import type { AnalysisResult } from '../engine/types.js';
import type { Model } from '../model/types.js';
import type { CriticalLoadFactors, SecondOrderLoading, StabilitySummary, StabilityWarning } from './types.js';
import { criticalLoadFactors, lowestCriticalLoadFactors } from './buckling.js';
import { naturalModes } from './modes.js';
import { analyseSecondOrder, MOVING_LOADS_REFUSED, SECOND_ORDER_DEFAULTS, type SecondOrderOptions } from './second-order.js';
import { AISC_DRIFT_RATIO_LIMIT, aiscDirectAnalysis, enSwayImperfection, isAisc, plainPlan, type SecondOrderPlan, withCaseCombinations } from './code-rules.js';
import { stabilityWarnings } from './stability-warnings.js';

export type { StabilitySummary, StabilityWarning } from './types.js';
export { SecondOrderInstabilityError } from './second-order-instability.js';

export interface AnalyseModelOptions extends AnalyseOptions {
  /** second order: sub-elements per prismatic frame member (P-δ); default SECOND_ORDER_DEFAULTS (second-order.ts) */
  subdivisions?: number;
  /** second order: convergence of the axial forces, relative to the largest; default 1e-6 */
  tolerance?: number;
  /** second order: factorisations per loading at most; default SECOND_ORDER_DEFAULTS */
  maxIterations?: number;
}

export interface ModelAnalysis {
  analysis: AnalysisResult;
  stability: StabilitySummary;
  /**
   * The model the analysis ran on: the input model, or — second order under a design code —
   * the input with each combination that got the code's horizontal forces replaced by its
   * variants (`ULS2 +X notional`, `ULS2 -X sway imperfection`) and their generated cases.
   * Its combinations match `analysis.loadings`.
   */
  model: Model;
  /** remarks for the run summary: how the code rules were applied, what was checked */
  notes: string[];
}

export function analyseModel(model: Model, options: AnalyseModelOptions = {}): ModelAnalysis {
  const s = model.settings;
  const code = s.designCode;
  const bucklingModes = wholeCount('buckling_modes', s.bucklingModes);
  const modeCount = wholeCount('modes', s.modes);
  const notes: string[] = [];
  let analysis: AnalysisResult;
  let analysed = model;
  let method: string;
  let secondOrder: SecondOrderLoading[] = [];
  let extra: Pick<StabilitySummary, 'subdivisions' | 'tolerance'> = {};

  if (s.analysis === 'second_order') {
    if (model.movingLoads.length > 0) {
      throw new Error(MOVING_LOADS_REFUSED);
    }
    const run = secondOrderRun(model, options, notes);
    analysis = run.analysis;
    analysed = run.model;
    secondOrder = run.loadings;
    method = run.method;
    extra = { subdivisions: run.subdivisions, tolerance: run.tolerance };
  } else {
    analysis = analyse(model, options);
    method = 'first-order elastic';
  }

  // critical load factors: requested modes, the first-order warning, EN's αcr report
  const warn = s.analysis === 'first_order' && code !== 'none' && s.stabilityWarning;
  const enReport = s.analysis === 'second_order' && code === 'en1993-1-1';
  let critical: CriticalLoadFactors[] = [];
  let warnings: StabilityWarning[] = [];
  if (bucklingModes > 0 || warn || enReport) {
    const staticModel = model.movingLoads.length ? { ...model, movingLoads: [], vehicles: [], lanes: [] } : model;
    if (model.movingLoads.length) notes.push('critical load factors from the static loads only: the moving loads are not included');
    try {
      // the warning alone needs only the lowest αcr of each loading against its limit: its cheaper
      // mesh and tolerance (WARNING_BUCKLING_OPTIONS); modes asked for, and EN's report, get the full ones
      critical = bucklingModes === 0 && !enReport
        ? lowestCriticalLoadFactors(staticModel, solverOptions(options)).critical
        : criticalLoadFactors(staticModel, Math.max(1, bucklingModes), { ...solverOptions(options), shapes: bucklingModes > 0 });
    } catch (err) {
      // asked for by the user: their error; only for the warning: the run goes on, saying it was not checked
      if (bucklingModes > 0 || !warn) throw err;
      const message = `stability not checked: the critical load factors could not be computed (${(err as Error).message}); `
        + 'first-order forces may understate the sway effects — check αcr, or set analysis = second_order';
      warnings = [{ loading: '', alphaCr: NaN, amplifier: NaN, reasons: [], message }];
      return finish(model, analysis, analysed, notes, { analysis: s.analysis, method, ...extra, secondOrder, critical: [], modes: [], warnings }, modeCount, options);
    }
    notes.push('αcr: elastic critical load factors of (K + α·K_G(N))·φ = 0 with the unreduced stiffness and the first-order axial forces of each strength combination (no notional loads or imperfections)');
    if (warn) {
      warnings = stabilityWarnings(code, critical);
      method += code === 'en1993-1-1'
        ? '; lowest αcr of every strength combination checked against 10 (EN 1993-1-1 5.2.1(3))'
        : '; lowest αcr of every strength combination checked: sway amplifier 1/(1 − 1/αcr) ≤ 1.5 (AISC 360-22 Chapter C)';
    } else if (s.analysis === 'first_order' && code !== 'none') {
      notes.push('stability warning turned off (stability_warning = off): first-order forces are used without checking αcr');
    }
  } else if (s.analysis === 'first_order' && code !== 'none') {
    notes.push('stability warning turned off (stability_warning = off): first-order forces are used without checking αcr');
  }

  return finish(model, analysis, analysed, notes, { analysis: s.analysis, method, ...extra, secondOrder, critical, modes: [], warnings }, modeCount, options);
}

/** Natural modes when asked for, then the result. */
function finish(
  model: Model, analysis: AnalysisResult, analysed: Model, notes: string[], stability: StabilitySummary, modeCount: number, options: AnalyseModelOptions,
): ModelAnalysis {
  if (modeCount > 0) {
    const m = naturalModes(model, modeCount, solverOptions(options));
    stability.modes = m.modes;
    stability.totalMass = m.totalMass;
  }
  return { analysis, stability, model: analysed, notes };
}

/** The options every floor shares: tapered sub-elements and the solver. */
function solverOptions(o: AnalyseModelOptions): Pick<AnalyseOptions, 'taperSegments' | 'solver' | 'factorise'> {
  return {
    ...(o.taperSegments !== undefined ? { taperSegments: o.taperSegments } : {}),
    ...(o.solver ? { solver: o.solver } : {}),
    ...(o.factorise ? { factorise: o.factorise } : {}),
  };
}

function wholeCount(key: string, v: number): number {
  if (!(Number.isInteger(v) && v >= 0)) throw new Error(`settings ${key} = ${v}: must be a whole number of at least 0`);
  return v;
}

interface SecondOrderRun {
  analysis: AnalysisResult;
  model: Model;
  loadings: SecondOrderLoading[];
  method: string;
  subdivisions: number;
  tolerance: number;
}

/** The code's plan, then the second-order runs it needs (strength and service apart when they differ). */
function secondOrderRun(model: Model, options: AnalyseModelOptions, notes: string[]): SecondOrderRun {
  const subdivisions = options.subdivisions ?? SECOND_ORDER_DEFAULTS.subdivisions;
  const tolerance = options.tolerance ?? SECOND_ORDER_DEFAULTS.tolerance;
  const maxIterations = options.maxIterations ?? SECOND_ORDER_DEFAULTS.maxIterations;
  const base: SecondOrderBase = {
    subdivisions, tolerance, maxIterations,
    ...(options.taperSegments !== undefined ? { taperSegments: options.taperSegments } : {}),
    ...(options.solver ? { solver: options.solver } : {}),
    ...(options.clock ? { clock: options.clock } : {}),
  };
  const code = model.settings.designCode;

  let plan: SecondOrderPlan;
  if (code !== 'none') model = withCaseCombinations(model);
  if (isAisc(model)) plan = aiscDirectAnalysis(model);
  else if (code === 'en1993-1-1') { const m = model; plan = enSwayImperfection(m, () => analyse(m, options)); }
  else plan = plainPlan(model);

  let run = runPlan(plan, base);
  if (isAisc(model)) {
    // C2.2b(4): drift ratio of the combinations with lateral load (those without notional loads)
    const over: string[] = [];
    let worst = 0, worstId = '';
    for (const l of run.loadings) {
      const cb = plan.model.combinations.find((c) => c.id === l.loading);
      if (!cb || cb.limitState !== 'strength' || plan.additions.has(cb.id)) continue;
      const ratio = l.amplification ?? 1;
      if (ratio > worst) { worst = ratio; worstId = cb.id; }
      if (ratio > AISC_DRIFT_RATIO_LIMIT) over.push(cb.id);
    }
    // the ratio: largest horizontal node translation, second order with the reduced stiffness over first order
    // with the unreduced one (SecondOrderLoading.amplification) — at least the ratio C2.2b(4) asks
    // for (both reduced), so the rule errs on the safe side
    const ratio = 'ratio of second- to first-order drift (largest horizontal node translation; first order with unreduced stiffness, on the safe side)';
    if (over.length) {
      plan = aiscDirectAnalysis(model, new Set(over));
      run = runPlan(plan, base);
      notes.push(`AISC 360-22 C2.2b(4): ${ratio} above 1.7 in ${over.join(', ')}: notional loads added to ${over.length === 1 ? 'that combination' : 'those combinations'} too`);
    } else if (worstId) {
      notes.push(`AISC 360-22 C2.2b(4) checked: ${ratio} at most ${worst.toFixed(2)} (${worstId}) ≤ 1.7: notional loads on gravity-only combinations only`);
    } else {
      notes.push('AISC 360-22 C2.2b(4) checked: no strength combination with lateral load');
    }
  }
  notes.push(...plan.notes);
  const loadings = run.loadings.map((l) => (plan.additions.has(l.loading) && !l.additions ? { ...l, additions: plan.additions.get(l.loading)! } : l));
  const order = `second-order elastic (P-Δ and P-δ, ${subdivisions} sub-elements per member, axial forces converged to ${tolerance < 1e-3 ? tolerance.toExponential() : tolerance})`;
  return { analysis: run.analysis, model: plan.model, loadings, method: plan.rule ? `${order} — ${plan.rule}` : order, subdivisions, tolerance };
}

type SecondOrderBase = SecondOrderOptions & { subdivisions: number; tolerance: number; maxIterations: number };

/**
 * One second-order run: the strength loadings with the plan's stiffness rule and load scale,
 * the service combinations (and the cases, first order) with unreduced stiffness at 1.0×.
 */
function runPlan(plan: SecondOrderPlan, base: SecondOrderBase): { analysis: AnalysisResult; loadings: SecondOrderLoading[] } {
  const noCombinations = plan.model.combinations.length === 0;
  const own = { loadScale: plan.strength.loadScale, ...(plan.strength.stiffness ? { stiffness: plan.strength.stiffness } : {}) };
  return analyseSecondOrder(plan.model, {
    ...base,
    loadingOptions: (ld) => (ld.limitState === 'strength' || (noCombinations && ld.kind === 'case') ? own : undefined),
  });
}
