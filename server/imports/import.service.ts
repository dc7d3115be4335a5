/**
 * Imports: read and validate an upload with the shared reader, keep it as a pending import
 * with its preview, and commit it as a new model (or a new version of one) in one
 * transaction — refused while any error remains.
 */
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { LessThan, type DataSource } from 'typeorm';
import type { Model, Problem, ReadResult } from '../../shared/model/types.js';
import { commitImportSchema, type CommitImportInput, type CommitResult, type ImportPreview } from '../../shared/schemas/imports.js';
import { runPool } from '../runs/worker-pool.js';
import { AppError, badRequest, conflict, notFound } from '../errors/app-error.js';
import { decodeModel, encodeJson } from '../models/model-codec.js';
import { appendVersion, createModelWithVersion, findModel, summarise } from '../models/model.service.js';
import { findProject } from '../projects/project.service.js';
import { inspectWorkbook, limitOfMessage, XlsxLimitError } from '../../shared/reader/xlsx.js';
import { describeBytes, XLSX_LIMIT_VARIABLES, type ImportLimits } from './import-limits.js';
import { ImportQueue } from './import-queue.js';
import { PendingImportEntity, type PendingImportRecord } from './pending-import.entity.js';

export interface UploadedFile {
  name: string;
  buffer: Buffer;
}

export interface ImportFields {
  modelId?: string;
  name?: string;
}

function tooLarge(message: string): AppError {
  return new AppError(413, 'payload_too_large', message);
}

function countLines(bytes: Buffer): number {
  let n = 0;
  for (let i = bytes.indexOf(10); i !== -1; i = bytes.indexOf(10, i + 1)) n++;
  return n + 1;
}

let queue: ImportQueue | null = null;

/** The process-wide import queue (sized by the first limits that ask for it). */
export function importQueue(limits: ImportLimits): ImportQueue {
  queue ??= new ImportQueue(limits.concurrency, limits.queue);
  return queue;
}

/** 413 naming the limit and its variable, from a workbook refusal (this thread or a worker). */
function workbookRefusal(fileName: string, message: string): AppError | null {
  const limit = limitOfMessage(message);
  if (!limit) return null;
  return tooLarge(`${fileName}: ${message} (${XLSX_LIMIT_VARIABLES[limit]})`);
}

/** Reads the upload: one .xlsx, or one or more .csv (one file per table). */
export async function readUpload(files: UploadedFile[], limits: ImportLimits): Promise<ReadResult> {
  if (files.length === 0) throw badRequest('Choose one .xlsx workbook or one or more .csv files to upload (form field "files")');
  const total = files.reduce((s, f) => s + f.buffer.length, 0);
  if (total > limits.maxRequestBytes) {
    throw tooLarge(`The upload is ${describeBytes(total)}; the limit is ${describeBytes(limits.maxRequestBytes)} per upload (IMPORT_MAX_REQUEST_MB)`);
  }
  const ext = (f: UploadedFile) => path.extname(f.name).toLowerCase();
  const workbooks = files.filter((f) => ext(f) === '.xlsx');
  const csvs = files.filter((f) => ext(f) === '.csv');
  const other = files.filter((f) => ext(f) !== '.xlsx' && ext(f) !== '.csv');
  if (other.length > 0) throw badRequest(`${other[0].name}: only .xlsx workbooks and .csv files can be imported`);
  if (workbooks.length > 0 && (workbooks.length > 1 || csvs.length > 0)) {
    throw badRequest('Upload either one .xlsx workbook or a set of .csv files, not both or several workbooks');
  }
  let result: ReadResult;
  // the reading itself happens in a worker thread (big uploads take seconds), a bounded number at once
  const data = (f: UploadedFile) => new Uint8Array(f.buffer.buffer, f.buffer.byteOffset, f.buffer.byteLength);
  if (workbooks.length === 1) {
    const book = workbooks[0];
    try {
      // the zip's directory only: a bomb that says what it is never reaches a worker
      inspectWorkbook(data(book), limits.xlsx);
    } catch (err) {
      if (err instanceof XlsxLimitError) throw workbookRefusal(book.name, err.message)!;
      throw badRequest(`${book.name} could not be read as an .xlsx workbook${err instanceof Error ? `: ${err.message}` : ''}`);
    }
    try {
      result = await importQueue(limits).run(() =>
        runPool().run({ kind: 'read', runId: 0, format: 'xlsx', files: [{ name: book.name, data: data(book) }], limits: limits.xlsx }),
      );
    } catch (err) {
      if (err instanceof AppError) throw err;
      const message = err instanceof Error ? err.message : String(err);
      throw workbookRefusal(book.name, message) ?? badRequest(`${book.name} could not be read as an .xlsx workbook: ${message}`);
    }
  } else {
    const rows = csvs.reduce((s, f) => s + countLines(f.buffer), 0);
    if (rows > limits.maxRows) {
      throw tooLarge(`The upload has about ${rows.toLocaleString('en')} rows; the limit is ${limits.maxRows.toLocaleString('en')} (IMPORT_MAX_ROWS)`);
    }
    result = await importQueue(limits).run(() => runPool().run({ kind: 'read', runId: 0, format: 'csv', files: csvs.map((f) => ({ name: f.name, data: data(f) })) }));
  }
  const rows = Object.values(result.counts).reduce((s, n) => s + n, 0);
  if (rows > limits.maxRows) {
    throw tooLarge(`The upload has ${rows.toLocaleString('en')} rows; the limit is ${limits.maxRows.toLocaleString('en')} (IMPORT_MAX_ROWS)`);
  }
  return result;
}

/** Problems by table and column, in order of first appearance. */
function countProblems(problems: readonly Problem[]): NonNullable<ImportPreview['problemCounts']> {
  const byKey = new Map<string, { table: string; column: string | null; errors: number; warnings: number }>();
  for (const p of problems) {
    const key = `${p.table}\u0000${p.column ?? ''}`;
    let c = byKey.get(key);
    if (!c) byKey.set(key, (c = { table: p.table, column: p.column ?? null, errors: 0, warnings: 0 }));
    if (p.severity === 'error') c.errors++;
    else c.warnings++;
  }
  return [...byKey.values()];
}

export function buildPreview(
  result: ReadResult,
  base: { id: string; projectId: number; modelId: number | null; baseVersion: number | null; name: string; fileNames: string[]; createdAt: Date; expiresAt: Date },
  maxListed = 1000,
): ImportPreview {
  const problems = result.ok ? result.warnings : result.problems;
  // the reader lists the first problems and counts them all when a file holds very many
  const problemCounts = result.problemCounts ?? countProblems(problems);
  const errorCount = problemCounts.reduce((n, c) => n + c.errors, 0);
  const total = problemCounts.reduce((n, c) => n + c.errors + c.warnings, 0);
  // errors first, each group in reading order; the list is capped, the counts are not
  const listed = problems.length <= maxListed ? problems : [...problems.filter((p) => p.severity === 'error'), ...problems.filter((p) => p.severity !== 'error')].slice(0, maxListed);
  const model: Model | null = result.ok ? result.model : null;
  return {
    id: base.id,
    projectId: base.projectId,
    modelId: base.modelId,
    baseVersion: base.baseVersion,
    name: base.name,
    fileNames: base.fileNames,
    counts: result.counts,
    settings: model
      ? {
          title: model.settings.title,
          units: model.settings.units,
          verticalAxis: model.settings.verticalAxis,
          designCode: model.settings.designCode,
          combinationRule: model.settings.combinationRule,
          deflectionLimit: model.settings.deflectionLimit,
          gammaM0: model.settings.gammaM0,
          gammaM1: model.settings.gammaM1,
          gammaM2: model.settings.gammaM2,
          stations: model.settings.stations,
          analysis: model.settings.analysis,
          bucklingModes: model.settings.bucklingModes,
          modes: model.settings.modes,
          stabilityWarning: model.settings.stabilityWarning,
        }
      : null,
    inferences: {
      verticalAxisInferred: model?.inferred.verticalAxisInferred ?? false,
      planeFrame: model?.inferred.planeFrame ?? null,
      defaulted: model?.inferred.defaulted ?? [],
      generatedCombinations: model?.combinations.filter((c) => c.generated).length ?? 0,
    },
    problems: listed.map((p) => ({ ...p })),
    problemCounts,
    problemsTruncated: listed.length < total,
    errorCount,
    warningCount: total - errorCount,
    canCommit: result.ok && errorCount === 0,
    createdAt: base.createdAt.toISOString(),
    expiresAt: base.expiresAt.toISOString(),
  };
}

function defaultName(files: UploadedFile[], model: Model | null): string {
  const title = model?.settings.title?.trim();
  if (title) return title.slice(0, 200);
  const first = files[0]?.name ?? 'model';
  return (files.length === 1 ? path.basename(first, path.extname(first)) : 'Imported model').slice(0, 200);
}

export async function previewImport(
  ds: DataSource,
  projectId: number,
  userId: number | null,
  files: UploadedFile[],
  fields: ImportFields,
  limits: ImportLimits,
): Promise<ImportPreview> {
  await findProject(ds, projectId);
  let modelId: number | null = null;
  let baseVersion: number | null = null;
  if (fields.modelId !== undefined && fields.modelId.trim() !== '') {
    if (!/^[1-9][0-9]{0,14}$/.test(fields.modelId.trim())) throw badRequest(`modelId: "${fields.modelId}" is not a model id`);
    const target = await findModel(ds, Number(fields.modelId));
    if (target.projectId !== projectId) throw notFound(`Model ${target.id} not found in project ${projectId}`);
    modelId = target.id;
    baseVersion = target.currentVersion;
  }
  const result = await readUpload(files, limits);
  const model = result.ok ? result.model : null;
  const now = new Date();
  const preview = buildPreview(result, {
    id: randomUUID(),
    projectId,
    modelId,
    baseVersion,
    name: fields.name?.trim().slice(0, 200) || defaultName(files, model),
    fileNames: files.map((f) => f.name),
    createdAt: now,
    expiresAt: new Date(now.getTime() + limits.ttlMs),
  }, limits.maxListedProblems);
  const repo = ds.getRepository(PendingImportEntity);
  await repo.delete({ expiresAt: LessThan(now) });
  await repo.insert({
    id: preview.id,
    projectId,
    modelId,
    baseVersion,
    name: preview.name,
    previewJson: JSON.stringify(preview),
    modelData: preview.canCommit && model ? encodeJson(model) : null,
    sourceData: encodeJson(files.map((f) => ({ name: f.name, base64: f.buffer.toString('base64') }))),
    createdBy: userId,
    expiresAt: preview.expiresAt ? new Date(preview.expiresAt) : now,
  });
  return preview;
}

async function findPending(ds: DataSource, projectId: number, importId: string): Promise<PendingImportRecord> {
  const row = await ds.getRepository(PendingImportEntity).findOneBy({ id: importId.slice(0, 36) });
  if (!row || row.projectId !== projectId) throw notFound(`Import ${importId} not found (it may have been committed or expired)`);
  if (row.expiresAt.getTime() < Date.now()) throw notFound(`Import ${importId} has expired; upload the files again`);
  return row;
}

export async function getPreview(ds: DataSource, projectId: number, importId: string): Promise<ImportPreview> {
  return JSON.parse((await findPending(ds, projectId, importId)).previewJson) as ImportPreview;
}

export async function commitImport(
  ds: DataSource,
  projectId: number,
  importId: string,
  userId: number | null,
  input: CommitImportInput,
): Promise<CommitResult> {
  const data = commitImportSchema.parse(input);
  const pending = await findPending(ds, projectId, importId);
  const preview = JSON.parse(pending.previewJson) as ImportPreview;
  if (!preview.canCommit || !pending.modelData) {
    throw new AppError(400, 'validation_failed', `The import still has ${preview.errorCount} error${preview.errorCount === 1 ? '' : 's'}; fix the files and upload them again. Nothing was saved.`, {
      problems: preview.problems.filter((p) => p.severity === 'error'),
    });
  }
  const model = decodeModel(pending.modelData);
  const message = data.message ?? `Imported from ${preview.fileNames.join(', ')}`;
  return ds.transaction(async (m) => {
    // single use: of two commits of one upload at once (two servers), only one deletes it
    const taken = await m.getRepository(PendingImportEntity).delete({ id: pending.id });
    if (taken.affected !== 1) throw notFound(`Import ${importId} was committed already or has expired; upload the files again`);
    const version = { model, counts: preview.counts, origin: 'import' as const, message, sourceData: pending.sourceData, createdBy: userId };
    let record;
    if (pending.modelId !== null) {
      const target = await findModel(m, pending.modelId);
      if (target.currentVersion !== pending.baseVersion) {
        throw conflict(
          `Model "${target.name}" has changed since this import was uploaded (version ${pending.baseVersion} then, ${target.currentVersion} now). Upload the files again.`,
          { currentVersion: target.currentVersion, baseVersion: pending.baseVersion },
        );
      }
      record = await appendVersion(m, target, target.currentVersion, version);
      if (data.name) {
        record.name = data.name;
        await m.getRepository('Model').save(record);
      }
    } else {
      record = await createModelWithVersion(m, projectId, data.name ?? pending.name, version);
    }
    return { model: await summarise(m, record), version: record.currentVersion };
  });
}
