/** GET /api/runs/:id/exports/:kind.:format — a run's tables as CSV or formatted XLSX. */
import type { DataSource } from 'typeorm';
import type { ExportFormat, ExportKind } from '../../shared/schemas/runs.js';
import { AppError, badRequest } from '../errors/app-error.js';
import { findModel } from '../models/model.service.js';
import { findProject } from '../projects/project.service.js';
import { doneRun, loadingsOf, membersOf, nodeResultsOf, recordsOf, runMethod, runModel } from '../runs/run.service.js';
import { runPool } from '../runs/worker-pool.js';
import { toCsv, type ResultTable } from '../../shared/exports/index.js';
import { checksExport, displacementsExport, reactionsExport, storedNodeResults, storedNoiseFloor, utilisationExport } from './tables.js';
import { toXlsx } from './xlsx.js';

/** Member-force exports larger than this must name one loading. */
export const MAX_FORCE_ROWS = 300_000;

export interface ExportFile {
  fileName: string;
  contentType: string;
  body: Buffer | string;
}

function safeName(text: string): string {
  return text.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'model';
}

export async function exportRun(ds: DataSource, runId: number, kind: ExportKind, format: ExportFormat, loading?: string): Promise<ExportFile> {
  const { run, result } = await doneRun(ds, runId);
  const { model, json } = await runModel(ds, run);
  const loadings = loadingsOf(result);
  let only: number[] | undefined;
  if (loading) {
    const i = loadings.findIndex((l) => l.id === loading);
    if (i < 0) throw badRequest(`loading: "${loading}" is neither a load case nor a combination of this run`);
    only = [i];
  }
  const nodes = () => {
    const { displacements, reactions } = nodeResultsOf(result);
    return storedNodeResults(model, loadings, displacements, reactions, only);
  };
  let table: ResultTable;
  switch (kind) {
    case 'utilisation':
      table = utilisationExport(model, membersOf(result));
      break;
    case 'checks': {
      const records = recordsOf(result);
      table = records
        ? checksExport(model, records)
        : await runPool().run({ kind: 'checks', runId: run.id, modelJson: json, designCode: run.designCode });
      break;
    }
    case 'displacements':
      table = displacementsExport(model, nodes());
      break;
    case 'reactions': {
      const { displacements, reactions } = nodeResultsOf(result);
      const view = storedNodeResults(model, loadings, displacements, reactions, only);
      table = reactionsExport(model, view, storedNoiseFloor(model, loadings, displacements, reactions));
      break;
    }
    case 'forces': {
      const chosen = only ?? loadings.map((_, i) => i);
      const estimate = chosen.length * model.members.length * 11;
      if (estimate > MAX_FORCE_ROWS) {
        throw new AppError(413, 'payload_too_large', `Member forces for every loading would be about ${estimate.toLocaleString('en')} rows; choose one loading (?loading=<case or combination>)`);
      }
      table = await runPool().run({ kind: 'forces', runId: run.id, modelJson: json, designCode: run.designCode, loadings: chosen });
      break;
    }
  }
  const model_ = await findModel(ds, run.modelId);
  const base = `${safeName(model_.name)}-v${run.version}-run${run.id}-${kind}${only ? `-${safeName(loadings[only[0]].id)}` : ''}`;
  if (format === 'csv') return { fileName: `${base}.csv`, contentType: 'text/csv; charset=utf-8', body: toCsv(table) };
  const project = await findProject(ds, model_.projectId);
  const body = await toXlsx(table, {
    project: project.name,
    model: model_.name,
    version: run.version,
    run: run.id,
    date: (run.finishedAt ?? run.createdAt).toISOString().slice(0, 16).replace('T', ' ') + ' UTC',
    code: run.designCode,
    units: model.settings.units,
    counts: { pass: run.passCount ?? 0, fail: run.failCount ?? 0, notChecked: run.notCheckedCount ?? 0 },
    reviewStatus: run.reviewStatus,
    method: runMethod(run),
  });
  return { fileName: `${base}.xlsx`, contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', body };
}
