/**
 * The suggestions worker task: runs in a run worker (server/runs/worker-tasks.ts) so the HTTP
 * thread never checks hundreds of candidates. A single pass reuses the worker's analysis of
 * the run when it still holds it; `repeat` analyses again after each pass.
 */
import type { DesignCode } from '../../shared/model/types.js';
import { iterateSuggestions, suggestSections, type SuggestBy, type SuggestLimits, type SuggestResult } from '../../shared/design/suggest/index.js';
import { readRunModel, type Analysed } from '../runs/run-compute.js';

export interface SuggestTask {
  kind: 'suggest';
  runId: number;
  modelJson: string;
  designCode: DesignCode;
  by: SuggestBy;
  limits: SuggestLimits;
  repeat: boolean;
}

export interface SuggestTaskResult {
  result: SuggestResult;
  iterations: number | null;
  converged: boolean | null;
}

export function runSuggestTask(task: SuggestTask, analysed: (task: SuggestTask) => Analysed): SuggestTaskResult {
  if (task.repeat) {
    const it = iterateSuggestions(readRunModel(task.modelJson, task.designCode), { by: task.by, limits: task.limits });
    return { result: it.result, iterations: it.iterations, converged: it.converged };
  }
  const { model, analysis, stability } = analysed(task);
  return { result: suggestSections(model, analysis, { by: task.by, limits: task.limits, stability }), iterations: null, converged: null };
}
