/**
 * Locks from approval. An approved run locks its model version: the model cannot be edited
 * (member edits or a new version by import, both of which build on the current version)
 * while its current version has an approved run, and a project holding any approved run
 * cannot be deleted. Refusals are 423 `locked` with a message that says why.
 */
import type { DataSource, EntityManager } from 'typeorm';
import { AppError, notFound } from '../errors/app-error.js';
import { ModelEntity } from '../models/model.entity.js';
import { RunEntity } from '../runs/run.entity.js';

export const locked = (message: string) => new AppError(423, 'locked', message);

export async function approvedRunOf(ds: DataSource | EntityManager, modelId: number, version: number): Promise<number | null> {
  const run = await ds.getRepository(RunEntity).findOne({ where: { modelId, version, reviewStatus: 'approved' }, select: { id: true }, order: { id: 'ASC' } });
  return run?.id ?? null;
}

/** 423 when the model's current version is approved (edits would build on a signed-off version). */
export async function assertModelEditable(ds: DataSource | EntityManager, modelId: number): Promise<void> {
  const model = await ds.getRepository(ModelEntity).findOneBy({ id: modelId });
  if (!model) throw notFound(`Model ${modelId} not found`);
  const runId = await approvedRunOf(ds, modelId, model.currentVersion);
  if (runId !== null) {
    throw locked(
      `Version ${model.currentVersion} of model "${model.name}" is approved (run ${runId}) and locked: it cannot be edited or replaced. Import the changed model as a new model instead.`,
    );
  }
}

/** 423 when any run of the project is approved. */
export async function assertProjectDeletable(ds: DataSource | EntityManager, projectId: number): Promise<void> {
  const row = await ds
    .getRepository(RunEntity)
    .createQueryBuilder('r')
    .innerJoin('models', 'm', 'm.id = r.modelId')
    .where('m.projectId = :projectId AND r.reviewStatus = :approved', { projectId, approved: 'approved' })
    .select('r.id', 'id')
    .getRawOne<{ id: number }>();
  if (row) throw locked(`This project holds approved run ${row.id}; approved work cannot be deleted`);
}
