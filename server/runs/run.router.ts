/** /api/runs — status, results for the grid, member detail, picture, comparison, exports. */
import { Router, type Response } from 'express';
import {
  EXPORT_FORMATS, EXPORT_KINDS, MEMBERS_LAYOUTS, STABILITY_EXPORT_KINDS, type ExportFormat, type ExportKind, type MembersLayout, type StabilityExportKind,
} from '../../shared/schemas/runs.js';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { badRequest, notFound } from '../errors/app-error.js';
import { buildExport, planRunExport } from '../exports/export.service.js';
import { exportGate } from '../exports/export-gate.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { exportPool, resultsPool, runPool } from './worker-pool.js';
import { projectGuards } from '../membership/project-access.js';
import { compareRuns, getMemberDetail, getRun, getRunGeometry, getRunMembers, getRunShape, recoverInterruptedRuns } from './run.service.js';
import { planStabilityExport } from './stability-export.js';

export const RUN_READERS = rolesAtLeast('viewer');
export const RUN_EXPORTERS = rolesAtLeast('viewer');

const text = (v: unknown) => (typeof v === 'string' ? v : undefined);

export function runsRouter({ dataSource, logger }: AppContext): Router {
  const router = Router();
  const guard = projectGuards(dataSource);
  void recoverInterruptedRuns(dataSource, logger);
  if (process.env.NODE_ENV !== 'test') {
    // threads load their modules at boot, not on the first run, export or grid load
    void runPool().warm();
    void exportPool().warm();
    void resultsPool().warm();
  }

  router.get('/compare', requireRole(...RUN_READERS), guard.runsInQuery('a', 'b'), async (req, res) => {
    const a = text(req.query.a);
    const b = text(req.query.b);
    if (!a || !b) throw badRequest('Give two run ids: /api/runs/compare?a=<run>&b=<run>');
    sendJsonBytes(res, await compareRuns(dataSource, parseId(a, 'Run'), parseId(b, 'Run')));
  });
  router.get('/:id', requireRole(...RUN_READERS), guard.run('id'), async (req, res) => {
    res.json(await getRun(dataSource, parseId(req.params.id, 'Run')));
  });
  router.get('/:id/members', requireRole(...RUN_READERS), guard.run('id'), async (req, res) => {
    const layout = text(req.query.layout) ?? 'rows';
    if (!(MEMBERS_LAYOUTS as readonly string[]).includes(layout)) throw badRequest(`layout: choose ${MEMBERS_LAYOUTS.join(' or ')}`);
    const gzip = /\bgzip\b/.test(String(req.headers['accept-encoding'] ?? ''));
    const body = await getRunMembers(dataSource, parseId(req.params.id, 'Run'), layout as MembersLayout, gzip);
    res.set('Content-Type', 'application/json; charset=utf-8');
    res.set('Vary', 'Accept-Encoding');
    if (gzip) res.set('Content-Encoding', 'gzip');
    res.end(body);
  });
  router.get('/:id/members/:member', requireRole(...RUN_READERS), guard.run('id'), async (req, res) => {
    res.json(await getMemberDetail(dataSource, parseId(req.params.id, 'Run'), String(req.params.member), text(req.query.loading)));
  });
  router.get('/:id/model', requireRole(...RUN_READERS), guard.run('id'), async (req, res) => {
    sendJsonBytes(res, await getRunGeometry(dataSource, parseId(req.params.id, 'Run'), text(req.query.loading)));
  });
  router.get('/:id/shapes', requireRole(...RUN_READERS), guard.run('id'), async (req, res) => {
    res.json(await getRunShape(dataSource, parseId(req.params.id, 'Run'), text(req.query.kind), text(req.query.index), text(req.query.loading)));
  });
  router.get('/:id/exports/:file', requireRole(...RUN_EXPORTERS), guard.run('id'), async (req, res) => {
    const m = /^([a-z]+)\.([a-z]+)$/.exec(String(req.params.file));
    const kinds: readonly string[] = [...EXPORT_KINDS, ...STABILITY_EXPORT_KINDS];
    if (!m || !kinds.includes(m[1]) || !(EXPORT_FORMATS as readonly string[]).includes(m[2])) {
      throw notFound(`No export ${String(req.params.file)}: choose ${kinds.join(', ')} as .xlsx or .csv`);
    }
    const id = parseId(req.params.id, 'Run');
    const plan = (STABILITY_EXPORT_KINDS as readonly string[]).includes(m[1])
      ? await planStabilityExport(dataSource, id, m[1] as StabilityExportKind, m[2] as ExportFormat)
      : await planRunExport(dataSource, id, m[1] as ExportKind, m[2] as ExportFormat, text(req.query.loading));
    const release = await exportGate().enter(currentUser(req).id); // scaled mode: counted in Redis
    // headers go with the first piece, so a failure before it is still a clean JSON error
    const start = () => {
      if (res.headersSent) return;
      res.set('Content-Type', plan.contentType);
      res.set('Content-Disposition', `attachment; filename="${plan.fileName}"`);
    };
    try {
      await buildExport(plan, (chunk) => {
        start();
        if (!res.destroyed && !res.writableEnded) res.write(chunk);
      });
      start();
      res.end();
    } catch (err) {
      if (!res.headersSent) throw err;
      logger.error(`export of run ${id} failed while streaming`, err);
      res.destroy();
    } finally {
      release();
    }
  });
  return router;
}

/** JSON already serialised by a worker, sent as it is. */
function sendJsonBytes(res: Response, body: Uint8Array): void {
  res.set('Content-Type', 'application/json; charset=utf-8');
  res.end(body);
}
