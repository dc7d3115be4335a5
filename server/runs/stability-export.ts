/**
 * GET /api/runs/:id/exports/stability.<csv|xlsx> and modes.<csv|xlsx>: the run's elastic
 * critical load factors and natural frequencies (tables.md "Results exports"), from the
 * summary kept with the run. XLSX files carry the same header block as the other exports.
 */
import type { DataSource } from 'typeorm';
import { toCsv } from '../../shared/exports/index.js';
import type { ExportFormat, StabilityExportKind } from '../../shared/schemas/runs.js';
import { AppError } from '../errors/app-error.js';
import type { ExportFile } from '../exports/export.service.js';
import { toXlsx } from '../exports/xlsx.js';
import { findModel } from '../models/model.service.js';
import { findProject } from '../projects/project.service.js';
import { doneRun, runModel, stabilityOf } from './run.service.js';
import { modesTable, stabilityTable } from './stability-tables.js';

function safeName(text: string): string {
  return text.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'model';
}

export async function exportStability(ds: DataSource, runId: number, kind: StabilityExportKind, format: ExportFormat): Promise<ExportFile> {
  const { run } = await doneRun(ds, runId);
  const stability = stabilityOf(run);
  if (!stability) throw new AppError(409, 'conflict', `Run ${runId} kept no stability results (it ran before they existed); run the model again`);
  const table = kind === 'stability' ? stabilityTable(stability) : modesTable(stability);
  const model = await findModel(ds, run.modelId);
  const base = `${safeName(model.name)}-v${run.version}-run${run.id}-${kind}`;
  if (format === 'csv') return { fileName: `${base}.csv`, contentType: 'text/csv; charset=utf-8', body: toCsv(table) };
  const project = await findProject(ds, model.projectId);
  const { model: parsed } = await runModel(ds, run);
  const body = await toXlsx(table, {
    project: project.name,
    model: model.name,
    version: run.version,
    run: run.id,
    date: (run.finishedAt ?? run.createdAt).toISOString().slice(0, 16).replace('T', ' ') + ' UTC',
    code: run.designCode,
    units: parsed.settings.units,
    counts: { pass: run.passCount ?? 0, fail: run.failCount ?? 0, notChecked: run.notCheckedCount ?? 0 },
    reviewStatus: run.reviewStatus,
    method: stability.method,
  });
  return { fileName: `${base}.xlsx`, contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', body };
}
