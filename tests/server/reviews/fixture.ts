/** Runs put straight into a review state (no analysis needed to test the workflow). */
import type { ReviewStatus } from '../../../shared/schemas/runs.js';
import { RunReviewEntity } from '../../../server/reviews/review.entity.js';
import { RunEntity } from '../../../server/runs/run.entity.js';
import type { TestApp } from '../helpers/test-app.js';

/** A finished run of `modelId` version `version` in `state`; `submittedBy` is recorded as its last submitter. */
export async function runInState(t: TestApp, modelId: number, state: ReviewStatus, submittedBy: number | null, version = 1, status: 'done' | 'failed' | 'running' = 'done'): Promise<number> {
  const run = await t.dataSource.getRepository(RunEntity).save({
    modelId,
    version,
    designCode: 'en1993-1-1',
    settingsJson: '{}',
    status,
    phase: null,
    progress: status === 'done' ? 1 : 0.5,
    message: '',
    reviewStatus: state,
    maxRatio: 0.5,
    passCount: 2,
    failCount: 0,
    notCheckedCount: 0,
    timingsJson: '{}',
    diagnosticsJson: null,
    createdBy: submittedBy,
    startedAt: new Date(),
    finishedAt: new Date(),
  });
  if (state !== 'draft' && submittedBy !== null) {
    await t.dataSource.getRepository(RunReviewEntity).insert({ runId: run.id, action: 'submit', fromStatus: 'draft', toStatus: 'submitted', message: 'fixture', userId: submittedBy });
  }
  return run.id;
}
