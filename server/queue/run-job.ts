/**
 * A run, analysed by a worker process (scaled mode): claim the queued run (conditional
 * UPDATE, so a run is analysed once; the claim records `workerId`), analyse it in this process's threads, write phase and
 * progress to its row as they come, then its results and `done` in one transaction
 * (saveResults), or `failed` with the reason. A worker that dies writes nothing more: the
 * stalled-job check fails the job and `markRunFailed` (any worker's listener) fails the run.
 */
import { In, type DataSource } from 'typeorm';
import type { Logger } from '../config/logger.js';
import { decodeText } from '../models/model-codec.js';
import { findVersion } from '../models/model.service.js';
import { RunEntity, type RunRecord } from '../runs/run.entity.js';
import { PHASE_PROGRESS, runFailureText, saveResults } from '../runs/run.service.js';
import type { TaskRunner } from '../runs/worker-pool.js';

export async function executeRun(ds: DataSource, runId: number, pool: TaskRunner, logger?: Logger, workerId: string | null = null): Promise<'done' | 'failed' | 'skipped'> {
  const repo = ds.getRepository(RunEntity);
  const run = await repo.findOneBy({ id: runId });
  if (!run) return 'skipped'; // deleted meanwhile
  const claimed = await repo.update(
    { id: runId, status: 'queued' },
    { status: 'running', startedAt: new Date(), phase: 'reading', progress: PHASE_PROGRESS.reading, workerId },
  );
  if (!claimed.affected) return 'skipped'; // failed or taken meanwhile
  // writes about one run happen in order, one after the other
  let chain: Promise<unknown> = Promise.resolve();
  const write = (patch: Partial<RunRecord>) => {
    chain = chain.then(() => repo.update({ id: runId, status: 'running' }, patch)).catch(() => undefined);
    return chain;
  };
  try {
    const version = await findVersion(ds, run.modelId, run.version);
    const output = await pool.run(
      { kind: 'run', runId, modelJson: decodeText(version.modelData), designCode: run.designCode },
      { onPhase: (phase) => void write({ phase, progress: PHASE_PROGRESS[phase] }) },
    );
    await chain;
    await saveResults(ds, runId, output);
    return 'done';
  } catch (err) {
    await chain;
    const { text, internal } = runFailureText(err);
    if (internal) logger?.error(`run ${runId} failed`, err);
    await markRunFailed(ds, runId, `The run failed: ${text}`);
    return 'failed';
  }
}

/** Marks a run failed unless it already finished (idempotent: several listeners may call it). */
export async function markRunFailed(ds: DataSource, runId: number, message: string): Promise<boolean> {
  const res = await ds
    .getRepository(RunEntity)
    .update({ id: runId, status: In(['queued', 'running']) }, { status: 'failed', message, finishedAt: new Date() });
  return !!res.affected;
}
