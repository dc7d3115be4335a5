/**
 * Section suggestions of a run: computed in a run worker (suggest-task.ts) from the run's
 * model version; applying chosen ones is a member edit (one new version, with the edit
 * service's rules and optimistic locking on the run's version) followed by a run of it.
 */
import type { DataSource } from 'typeorm';
import { applySuggestionsSchema, suggestRequestSchema, type AppliedSuggestions, type Suggestions } from '../../shared/schemas/suggestions.js';
import { AppError } from '../errors/app-error.js';
import { editMembers } from '../models/model.service.js';
import { doneRun, runModel, startRun } from '../runs/run.service.js';
import { runPool } from '../runs/worker-pool.js';

/** Users with a suggestion being computed: one at a time each (they keep a run worker busy). */
const busy = new Set<number>();

export async function suggestForRun(ds: DataSource, runId: number, userId: number, input: unknown): Promise<Suggestions> {
  const data = suggestRequestSchema.parse(input ?? {});
  const { run } = await doneRun(ds, runId);
  const { model, json } = await runModel(ds, run);
  if (busy.has(userId)) {
    throw new AppError(429, 'rate_limited', 'Your previous suggestion is still being computed; try again when it has finished', { retryAfterSeconds: 5 });
  }
  busy.add(userId);
  try {
    const out = await runPool().run({
      kind: 'suggest', runId: run.id, modelJson: json, designCode: run.designCode, by: data.by, limits: data.limits, repeat: data.repeat,
    });
    return {
      ...out.result,
      runId: run.id,
      modelId: run.modelId,
      version: run.version,
      designCode: run.designCode,
      units: model.settings.units,
      iterations: out.iterations,
      converged: out.converged,
    };
  } finally {
    busy.delete(userId);
  }
}

export async function applySuggestions(ds: DataSource, runId: number, userId: number, input: unknown): Promise<AppliedSuggestions> {
  const data = applySuggestionsSchema.parse(input ?? {});
  const { run } = await doneRun(ds, runId);
  const n = new Set(data.changes.map((c) => c.member)).size;
  const model = await editMembers(ds, run.modelId, userId, {
    baseVersion: run.version,
    edits: data.changes.map((c) => ({ member: c.member, field: 'section', value: c.section })),
    message: data.message ?? `sections of ${n} member${n === 1 ? '' : 's'} from the suggestions of run ${run.id}`,
  });
  const started = await startRun(ds, run.modelId, userId, { designCode: run.designCode });
  return { model, run: started };
}
