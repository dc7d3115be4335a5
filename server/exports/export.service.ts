/**
 * GET /api/runs/:id/exports/:kind.:format — a run's tables as CSV or formatted XLSX.
 *
 * The HTTP thread only checks the request and reads the stored blobs (no gunzip, no JSON of
 * the model); a worker thread builds the table and writes the file in chunks
 * (server/exports/export-task.ts) that the router pipes to the client. Exports of stored
 * results use the export pool; member forces and checks that were not kept need the analysis,
 * so they go to the run pool, whose workers hold it.
 */
import { readFileSync } from 'node:fs';
import type { DataSource } from 'typeorm';
import type { ExportFormat, ExportKind, LoadingInfo } from '../../shared/schemas/runs.js';
import { AppError, badRequest } from '../errors/app-error.js';
import { findModel, findVersion } from '../models/model.service.js';
import { findProject } from '../projects/project.service.js';
import { RunReviewEntity } from '../reviews/review.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { doneRun, loadingsOf, runMethod, stabilityOf } from '../runs/run.service.js';
import { storedLoadingBlocks } from '../runs/result-parts.js';
import type { RunRecord } from '../runs/run.entity.js';
import { exportPool, runPool } from '../runs/worker-pool.js';
import { sharedExports } from './export-sharing.js';
import type { ExportTask, ExportTaskResult } from './export-task.js';
import type { HeaderBlock } from './xlsx.js';

/** Member-force exports larger than this must name one loading. */
export const MAX_FORCE_ROWS = 300_000;

const CONTENT_TYPES: Record<ExportFormat, string> = {
  csv: 'text/csv; charset=utf-8',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
};

/** What to send and how to build it. */
export interface ExportPlan {
  fileName: string;
  contentType: string;
  task: ExportTask;
}

export function safeName(text: string): string {
  return text.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'model';
}

/** The file's name, the header block (units come from the model, in the worker) and the stored model. */
export async function exportFrame(ds: DataSource, run: RunRecord, suffix: string, format: ExportFormat, method: string) {
  const model = await findModel(ds, run.modelId);
  const project = await findProject(ds, model.projectId);
  const version = await findVersion(ds, run.modelId, run.version);
  const people = await runPeople(ds, run);
  const header: Omit<HeaderBlock, 'units'> = {
    project: project.name,
    model: model.name,
    version: run.version,
    run: run.id,
    date: (run.finishedAt ?? run.createdAt).toISOString().slice(0, 16).replace('T', ' ') + ' UTC',
    code: run.designCode,
    counts: { pass: run.passCount ?? 0, fail: run.failCount ?? 0, notChecked: run.notCheckedCount ?? 0 },
    reviewStatus: run.reviewStatus,
    method,
    ...people,
    software: softwareVersion(),
  };
  return {
    fileName: `${safeName(model.name)}-v${run.version}-run${run.id}-${suffix}.${format}`,
    contentType: CONTENT_TYPES[format],
    header,
    modelData: version.modelData,
  };
}

const stamp = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** Who ran the run and who approved it when (the last approval), in words for the header block. */
export async function runPeople(ds: DataSource, run: RunRecord): Promise<{ ranBy: string; approved: string }> {
  const approval = await ds.getRepository(RunReviewEntity).findOne({ where: { runId: run.id, action: 'approve' }, order: { id: 'DESC' } });
  const ids = [run.createdBy, approval?.userId ?? null].filter((id): id is number => id !== null);
  const users = ids.length ? await ds.getRepository(UserEntity).findBy(ids.map((id) => ({ id }))) : [];
  const name = (id: number | null) => (id === null ? 'unknown' : (users.find((u) => u.id === id)?.name ?? `user ${id}`));
  return {
    ranBy: `${name(run.createdBy)}, ${stamp(run.createdAt)}`,
    approved: approval && run.reviewStatus === 'approved' ? `${name(approval.userId)}, ${stamp(approval.createdAt)}` : `not approved (review status: ${run.reviewStatus})`,
  };
}

let software: string | null = null;
/** `Trestle <version>` from package.json, read once. */
export function softwareVersion(): string {
  software ??= `Trestle ${(JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version}`;
  return software;
}

function chosenLoading(loadings: LoadingInfo[], loading: string | undefined): number[] | undefined {
  if (!loading) return undefined;
  const i = loadings.findIndex((l) => l.id === loading);
  if (i < 0) throw badRequest(`loading: "${loading}" is neither a load case nor a combination of this run`);
  return [i];
}

export async function planRunExport(ds: DataSource, runId: number, kind: ExportKind, format: ExportFormat, loading?: string): Promise<ExportPlan> {
  const { run, result } = await doneRun(ds, runId);
  const loadings = loadingsOf(result);
  const only = chosenLoading(loadings, loading);
  if (kind === 'forces') {
    const members = (run.passCount ?? 0) + (run.failCount ?? 0) + (run.notCheckedCount ?? 0);
    const estimate = (only ?? loadings).length * members * 11;
    if (estimate > MAX_FORCE_ROWS) {
      throw new AppError(413, 'payload_too_large', `Member forces for every loading would be about ${estimate.toLocaleString('en')} rows; choose one loading (?loading=<case or combination>)`);
    }
  }
  const suffix = `${kind}${only ? `-${safeName(loadings[only[0]].id)}` : ''}`;
  const frame = await exportFrame(ds, run, suffix, format, runMethod(run));
  const task: ExportTask = {
    kind: 'export',
    runId: run.id,
    designCode: run.designCode,
    table: kind,
    format,
    modelData: frame.modelData,
    loadings,
    ...(only ? { only } : {}),
    header: frame.header,
    stability: stabilityOf(run),
  };
  if (kind === 'utilisation') task.membersData = result.membersData;
  if (kind === 'checks') task.recordsData = result.recordsData;
  if (kind === 'displacements' || kind === 'reactions') {
    const blocks = await storedLoadingBlocks(ds, run.id);
    if (blocks) task.nodeBlocks = blocks;
    else task.nodeData = result.nodeData;
  }
  return { fileName: frame.fileName, contentType: frame.contentType, task };
}

/**
 * Needs the analysis (member forces; checks whose records were not kept, stored as gzip
 * "null", a few dozen bytes): the run pool, whose workers hold analyses. Either pool runs the
 * same task code, so a tiny blob of no records sent there is still right.
 */
function needsAnalysis(task: ExportTask): boolean {
  if (task.prebuilt) return false;
  return task.table === 'forces' || (task.table === 'checks' && (task.recordsData?.byteLength ?? 0) < 64);
}

/** What makes two exports the same file: the name (model, version, run, table, loading, format) and the header block. */
export function exportKey(plan: ExportPlan): string {
  return `${plan.fileName}\n${plan.task.table}\n${plan.task.format}\n${JSON.stringify(plan.task.header ?? null)}`;
}

/**
 * Builds the export in a worker, or joins the same export being built for someone else
 * (export-sharing.ts); `onChunk` gets each piece of the file, in order.
 */
export function buildExport(plan: ExportPlan, onChunk: (chunk: Uint8Array) => void): Promise<ExportTaskResult> {
  const pool = needsAnalysis(plan.task) ? runPool() : exportPool();
  return sharedExports().run(exportKey(plan), (each) => pool.run(plan.task, { onChunk: each }), onChunk);
}
