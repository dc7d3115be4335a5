/**
 * /api/samples (the demo models in samples/, as XLSX) and /api/templates (the blank
 * import workbook). Every signed-in role may download them.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { Router } from 'express';
import type { SampleInfo } from '../../shared/schemas/imports.js';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { badRequest, notFound } from '../errors/app-error.js';
import { requireRole } from '../middleware/auth.js';
import { templateWorkbook } from './template.js';

export const SAMPLES_DIR = path.resolve('samples');
const XLSX = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** Each folder of samples/ holding an .xlsx is a sample. */
export function listSamples(dir = SAMPLES_DIR): { info: SampleInfo; file: string }[] {
  if (!existsSync(dir)) return [];
  const out: { info: SampleInfo; file: string }[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (!entry.isDirectory()) continue;
    const folder = path.join(dir, entry.name);
    const xlsx = readdirSync(folder).find((f) => f.toLowerCase().endsWith('.xlsx'));
    if (!xlsx) continue;
    const title = entry.name.replace(/[-_]+/g, ' ').replace(/^\w/, (c) => c.toUpperCase());
    out.push({ info: { name: entry.name, title, xlsx: `/api/samples/${entry.name}.xlsx` }, file: path.join(folder, xlsx) });
  }
  return out.sort((a, b) => a.info.name.localeCompare(b.info.name));
}

export function samplesRouter(_ctx: AppContext): Router {
  const router = Router();
  const readers = rolesAtLeast('viewer');
  router.get('/', requireRole(...readers), (_req, res) => {
    res.json(listSamples().map((s) => s.info));
  });
  router.get('/:file', requireRole(...readers), (req, res) => {
    const name = String(req.params.file).replace(/\.xlsx$/i, '');
    const found = listSamples().find((s) => s.info.name === name);
    if (!found) throw notFound(`No sample ${name}`);
    res.set('Content-Type', XLSX);
    res.set('Content-Disposition', `attachment; filename="${name}.xlsx"`);
    res.send(readFileSync(found.file));
  });
  return router;
}

export function templatesRouter(_ctx: AppContext): Router {
  const router = Router();
  router.get('/:file', requireRole(...rolesAtLeast('viewer')), async (req, res) => {
    if (req.params.file !== 'model.xlsx') throw notFound(`No template ${String(req.params.file)}; try model.xlsx`);
    const units = req.query.units === undefined ? 'metric' : String(req.query.units);
    if (units !== 'metric' && units !== 'us') throw badRequest('units: choose metric or us');
    res.set('Content-Type', XLSX);
    res.set('Content-Disposition', `attachment; filename="trestle-template-${units}.xlsx"`);
    res.send(await templateWorkbook(units));
  });
  return router;
}
