/**
 * GET /api/runs/:id/exports/stability.<csv|xlsx> and modes.<csv|xlsx>: the run's elastic
 * critical load factors and natural frequencies (tables.md "Results exports"), from the
 * summary kept with the run. XLSX files carry the same header block as the other exports.
 * The table is a few rows, built here; the file is written in an export worker like the others.
 */
import type { DataSource } from 'typeorm';
import type { ExportFormat, StabilityExportKind } from '../../shared/schemas/runs.js';
import { AppError } from '../errors/app-error.js';
import { exportFrame, type ExportPlan } from '../exports/export.service.js';
import { doneRun, loadingsOf, stabilityOf } from './run.service.js';
import { modesTable, stabilityTable } from './stability-tables.js';

export async function planStabilityExport(ds: DataSource, runId: number, kind: StabilityExportKind, format: ExportFormat): Promise<ExportPlan> {
  const { run, result } = await doneRun(ds, runId);
  const stability = stabilityOf(run);
  if (!stability) throw new AppError(409, 'conflict', `Run ${runId} kept no stability results (it ran before they existed); run the model again`);
  const table = kind === 'stability' ? stabilityTable(stability) : modesTable(stability);
  const frame = await exportFrame(ds, run, kind, format, stability.method);
  return {
    fileName: frame.fileName,
    contentType: frame.contentType,
    task: { kind: 'export', runId: run.id, designCode: run.designCode, table: kind, format, modelData: frame.modelData, loadings: loadingsOf(result), prebuilt: table, header: frame.header },
  };
}
