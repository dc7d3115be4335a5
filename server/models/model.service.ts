/**
 * Models and their versions. Every change makes a new version inside one transaction that
 * also bumps `models.currentVersion` only if it still equals the version the change was
 * made against (optimistic locking): a stale change gets 409 and saves nothing.
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { Model } from '../../shared/model/types.js';
import { builtInMaterialNames } from '../../shared/materials/index.js';
import { catalogueDesignations } from '../../shared/sections/index.js';
import {
  memberEditsSchema,
  renameModelSchema,
  tableEditsSchema,
  type ModelTables,
  type TableEditsInput,
  type EditableMembers,
  type MemberEditsInput,
  type ModelDetail,
  type ModelSummary,
  type ModelVersionSummary,
  type RenameModelInput,
} from '../../shared/schemas/models.js';
import { unitOf } from '../../shared/units/index.js';
import { applyTableEditsToModel, describeTableProblem, modelTablesView } from '../../shared/reader/table-edits.js';
import { AppError, conflict, notFound } from '../errors/app-error.js';
import { findProject } from '../projects/project.service.js';
import { UserEntity } from '../users/user.entity.js';
import { applyMemberEdits, editableMembers } from './member-edits.js';
import { decodeModel, encodeModel } from './model-codec.js';
import { ModelEntity, ModelVersionEntity, type ModelRecord, type ModelVersionRecord } from './model.entity.js';
import { RunEntity } from '../runs/run.entity.js';

async function lastRuns(ds: DataSource | EntityManager, modelIds: number[]): Promise<Map<number, ModelSummary['lastRun']>> {
  const out = new Map<number, ModelSummary['lastRun']>();
  if (modelIds.length === 0) return out;
  // the newest run of each model (query builder: the same SQL on SQLite and PostgreSQL)
  const newest = ds
    .getRepository(RunEntity)
    .createQueryBuilder('n')
    .select('MAX(n.id)')
    .where('n.modelId IN (:...modelIds)')
    .groupBy('n.modelId');
  const rows = await ds
    .getRepository(RunEntity)
    .createQueryBuilder('r')
    .where(`r.id IN (${newest.getQuery()})`, { modelIds })
    .getMany();
  for (const r of rows) out.set(r.modelId, { id: r.id, status: r.status, version: r.version, maxRatio: r.maxRatio });
  return out;
}

export function toModelSummary(m: ModelRecord, lastRun: ModelSummary['lastRun'] = null): ModelSummary {
  return {
    id: m.id,
    projectId: m.projectId,
    name: m.name,
    currentVersion: m.currentVersion,
    designCode: m.designCode,
    units: m.units,
    counts: JSON.parse(m.countsJson || '{}') as Record<string, number>,
    createdBy: m.createdBy,
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
    lastRun,
  };
}

export async function summarise(ds: DataSource | EntityManager, m: ModelRecord): Promise<ModelSummary> {
  return toModelSummary(m, (await lastRuns(ds, [m.id])).get(m.id) ?? null);
}

export async function listModels(ds: DataSource, projectId: number): Promise<ModelSummary[]> {
  await findProject(ds, projectId);
  const rows = await ds.getRepository(ModelEntity).find({ where: { projectId }, order: { updatedAt: 'DESC', id: 'DESC' } });
  const runs = await lastRuns(ds, rows.map((r) => r.id));
  return rows.map((r) => toModelSummary(r, runs.get(r.id) ?? null));
}

export async function findModel(ds: DataSource | EntityManager, id: number): Promise<ModelRecord> {
  const model = await ds.getRepository(ModelEntity).findOneBy({ id });
  if (!model) throw notFound(`Model ${id} not found`);
  return model;
}

export async function findVersion(ds: DataSource | EntityManager, modelId: number, version: number): Promise<ModelVersionRecord> {
  const row = await ds.getRepository(ModelVersionEntity).findOneBy({ modelId, version });
  if (!row) throw notFound(`Model ${modelId} has no version ${version}`);
  return row;
}

/** The validated model of a version (default: the current one). */
export async function loadModel(ds: DataSource, id: number, version?: number): Promise<{ record: ModelRecord; version: number; model: Model }> {
  const record = await findModel(ds, id);
  const v = version ?? record.currentVersion;
  const row = await findVersion(ds, id, v);
  return { record, version: v, model: decodeModel(row.modelData) };
}

export async function getModelDetail(ds: DataSource, id: number): Promise<ModelDetail> {
  const { record, model } = await loadModel(ds, id);
  const groups = [...new Set(model.members.map((m) => m.group).filter((g): g is string => !!g))].sort();
  const loadings: ModelDetail['loadings'] = [
    ...model.cases.map((c) => ({ id: c.id, kind: 'case' as const, limitState: null })),
    ...model.combinations.map((c) => ({ id: c.id, kind: 'combination' as const, limitState: c.limitState, terms: c.terms.map((t) => ({ case: t.case, factor: t.factor })) })),
  ];
  return {
    ...(await summarise(ds, record)),
    settings: { ...model.settings },
    planeFrame: model.inferred.planeFrame,
    sections: model.sections.map((s) => s.id),
    materials: model.materials.map((m) => m.id),
    groups,
    loadings,
  };
}

export async function renameModel(ds: DataSource, id: number, input: RenameModelInput): Promise<ModelSummary> {
  const { name } = renameModelSchema.parse(input);
  const repo = ds.getRepository(ModelEntity);
  const model = await findModel(ds, id);
  model.name = name;
  return summarise(ds, await repo.save(model));
}

export async function listVersions(ds: DataSource, id: number): Promise<ModelVersionSummary[]> {
  await findModel(ds, id);
  const rows = await ds
    .getRepository(ModelVersionEntity)
    .createQueryBuilder('v')
    .leftJoin(UserEntity.options.name, 'u', 'u.id = v.createdBy')
    .select(['v.version AS version', 'v.message AS message', 'v.contentHash AS "contentHash"', 'v.origin AS origin', 'v.createdBy AS "createdBy"', 'u.name AS "createdByName"', 'v.createdAt AS "createdAt"'])
    .where('v.modelId = :id', { id })
    .orderBy('v.version', 'DESC')
    .getRawMany<Omit<ModelVersionSummary, 'createdAt'> & { createdAt: string | Date }>();
  // SQLite hands back its UTC text ("2026-01-02 03:04:05"), PostgreSQL a Date
  const when = (t: string | Date) => (t instanceof Date ? t : new Date(t.replace(' ', 'T') + (t.endsWith('Z') ? '' : 'Z')));
  return rows.map((r) => ({ ...r, createdAt: when(r.createdAt).toISOString() }));
}

export async function getEditableMembers(ds: DataSource, id: number, version?: number): Promise<EditableMembers> {
  const { model, version: v } = await loadModel(ds, id, version);
  return {
    modelId: id,
    version: v,
    units: model.settings.units,
    lengthUnit: unitOf('length', model.settings.units),
    members: editableMembers(model),
    sections: model.sections.map((s) => s.id),
    catalogue: catalogueDesignations(),
    materials: model.materials.map((m) => m.id),
    builtInMaterials: builtInMaterialNames(),
  };
}

async function staleMessage(m: EntityManager, record: ModelRecord, baseVersion: number): Promise<AppError> {
  const current = await m.getRepository(ModelVersionEntity).findOneBy({ modelId: record.id, version: record.currentVersion });
  const who = current?.createdBy ? (await m.getRepository(UserEntity).findOneBy({ id: current.createdBy }))?.name : undefined;
  return conflict(
    `Model "${record.name}" has changed since you loaded it: you edited version ${baseVersion} but version ${record.currentVersion}` +
      `${who ? ` was saved by ${who}` : ' was saved since'}. Reload the model and make your change again.`,
    { currentVersion: record.currentVersion, baseVersion },
  );
}

export interface NewVersion {
  model: Model;
  counts: Record<string, number>;
  origin: 'import' | 'edit';
  message: string;
  sourceData?: Buffer | null;
  edits?: unknown;
  createdBy: number | null;
}

/**
 * Inside a transaction: append version baseVersion+1 to a model, refusing (409) when the
 * model is no longer at baseVersion.
 */
export async function appendVersion(m: EntityManager, record: ModelRecord, baseVersion: number, v: NewVersion): Promise<ModelRecord> {
  const next = baseVersion + 1;
  const { data, hash } = encodeModel(v.model);
  const result = await m
    .createQueryBuilder()
    .update(ModelEntity)
    .set({
      currentVersion: next,
      designCode: v.model.settings.designCode,
      units: v.model.settings.units,
      countsJson: JSON.stringify(v.counts),
    })
    .where('id = :id AND currentVersion = :base', { id: record.id, base: baseVersion })
    .execute();
  if (result.affected !== 1) throw await staleMessage(m, await findModel(m, record.id), baseVersion);
  await m.getRepository(ModelVersionEntity).insert({
    modelId: record.id,
    version: next,
    origin: v.origin,
    message: v.message,
    contentHash: hash,
    modelData: data,
    sourceData: v.sourceData ?? null,
    editsJson: v.edits === undefined ? null : JSON.stringify(v.edits),
    createdBy: v.createdBy,
  });
  return findModel(m, record.id);
}

/** Inside a transaction: a new model with version 1. */
export async function createModelWithVersion(
  m: EntityManager,
  projectId: number,
  name: string,
  v: NewVersion,
): Promise<ModelRecord> {
  const repo = m.getRepository(ModelEntity);
  const record = await repo.save(
    repo.create({
      projectId,
      name,
      currentVersion: 0,
      designCode: v.model.settings.designCode,
      units: v.model.settings.units,
      countsJson: JSON.stringify(v.counts),
      createdBy: v.createdBy,
    }),
  );
  return appendVersion(m, record, 0, v);
}

/** PATCH /api/models/:id/members: all edits or none, as one new version. */
export async function editMembers(ds: DataSource, id: number, userId: number | null, input: MemberEditsInput): Promise<ModelSummary> {
  const data = memberEditsSchema.parse(input);
  return ds.transaction(async (m) => {
    const record = await findModel(m, id);
    if (record.currentVersion !== data.baseVersion) throw await staleMessage(m, record, data.baseVersion);
    const base = await findVersion(m, id, data.baseVersion);
    const outcome = applyMemberEdits(decodeModel(base.modelData), data.edits);
    if (!outcome.ok) {
      const first = outcome.problems[0];
      const more = outcome.problems.length > 1 ? ` (and ${outcome.problems.length - 1} more)` : '';
      throw new AppError(400, 'validation_failed', `${first.message}${more}`, { problems: outcome.problems });
    }
    const n = data.edits.length;
    const updated = await appendVersion(m, record, data.baseVersion, {
      model: outcome.model,
      counts: { ...(JSON.parse(record.countsJson || '{}') as Record<string, number>) },
      origin: 'edit',
      message: data.message ?? `${n} edit${n === 1 ? '' : 's'} to ${outcome.changed} member${outcome.changed === 1 ? '' : 's'}`,
      edits: data.edits,
      createdBy: userId,
    });
    return summarise(m, updated);
  });
}


/** GET /api/models/:id/tables: every table of a version as the Model tab shows it. */
export async function getModelTables(ds: DataSource, id: number, version?: number): Promise<ModelTables> {
  const { model, version: v } = await loadModel(ds, id, version);
  return modelTablesView(model, id, v);
}

/**
 * PATCH /api/models/:id/tables: edits of cases, node loads, member loads and combinations,
 * read again with the reader's rules; all or none, as one new version.
 */
export async function editTables(ds: DataSource, id: number, userId: number | null, input: TableEditsInput): Promise<ModelSummary> {
  const data = tableEditsSchema.parse(input);
  return ds.transaction(async (m) => {
    const record = await findModel(m, id);
    if (record.currentVersion !== data.baseVersion) throw await staleMessage(m, record, data.baseVersion);
    const base = await findVersion(m, id, data.baseVersion);
    const outcome = applyTableEditsToModel(decodeModel(base.modelData), data.edits, id, data.baseVersion);
    if (!outcome.ok) {
      const more = outcome.problems.length > 1 ? ` (and ${outcome.problems.length - 1} more)` : '';
      throw new AppError(400, 'validation_failed', `${describeTableProblem(outcome.problems[0])}${more}`, { problems: outcome.problems.slice(0, 1000) });
    }
    const counts: Record<string, number> = { ...(JSON.parse(record.countsJson || '{}') as Record<string, number>) };
    for (const t of ['cases', 'node_loads', 'member_loads', 'combinations']) if (outcome.counts[t] !== undefined) counts[t] = outcome.counts[t];
    const n = data.edits.length;
    const updated = await appendVersion(m, record, data.baseVersion, {
      model: outcome.model,
      counts,
      origin: 'edit',
      message: data.message ?? `${n} edit${n === 1 ? '' : 's'} to ${[...outcome.edited].join(', ').replace(/_/g, ' ')}`,
      edits: data.edits,
      createdBy: userId,
    });
    return summarise(m, updated);
  });
}
