/** /api/runs/:runId/reports — the calculation package (PDF) of a run: start, poll, download. */
import { once } from 'node:events';
import { Router } from 'express';
import { startReportSchema } from '../../shared/schemas/reports.js';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { projectGuards } from '../membership/project-access.js';
import { getReport, reportChunks, reportFileName, startReport } from './report.service.js';

/** Whoever may read a run (viewers: approved runs) may print its package. */
export const REPORT_READERS = rolesAtLeast('viewer');

export function reportsRouter({ dataSource, logger }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const guard = projectGuards(dataSource);
  const runId = (req: { params: Record<string, string | string[] | undefined> }) => parseId(req.params.runId, 'Run');

  router.post('/', requireRole(...REPORT_READERS), guard.run('runId'), async (req, res) => {
    const input = startReportSchema.parse(req.body);
    res.status(202).json(await startReport(dataSource, logger, currentUser(req).id, runId(req), input));
  });
  router.get('/:reportId', requireRole(...REPORT_READERS), guard.run('runId'), async (req, res) => {
    res.json(await getReport(runId(req), String(req.params.reportId)));
  });
  router.get('/:reportId/file', requireRole(...REPORT_READERS), guard.run('runId'), async (req, res) => {
    const id = String(req.params.reportId);
    const name = await reportFileName(runId(req), id);
    res.set('Content-Type', 'application/pdf');
    res.set('Content-Disposition', `attachment; filename="${name}"`);
    try {
      for await (const chunk of reportChunks(runId(req), id)) {
        if (!res.write(chunk)) await once(res, 'drain');
      }
      res.end();
    } catch (err) {
      // the answer has begun: it can only be cut short (the log says why)
      if (!res.headersSent) throw err;
      logger.error(`calculation package ${id}: download cut short`, err);
      res.destroy();
    }
  });
  return router;
}
