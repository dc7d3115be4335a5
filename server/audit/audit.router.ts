/** /api/audit — the audit trail for leads (projects they lead) and admins (everything); CSV export. */
import { Router } from 'express';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { auditCsv, queryAudit } from './audit.service.js';

export const AUDIT_READERS = ['lead', 'admin'] as const;

export function auditRouter({ dataSource }: AppContext): Router {
  const router = Router();
  router.get('/', requireRole(...AUDIT_READERS), async (req, res) => {
    res.json(await queryAudit(dataSource, currentUser(req), req.query as Record<string, string>));
  });
  router.get('/export.csv', requireRole(...AUDIT_READERS), async (req, res) => {
    const csv = await auditCsv(dataSource, currentUser(req), req.query as Record<string, string>);
    const stamp = new Date().toISOString().slice(0, 10);
    res.set('Content-Type', 'text/csv; charset=utf-8');
    res.set('Content-Disposition', `attachment; filename="trestle-audit-${stamp}.csv"`);
    res.send(`\uFEFF${csv}`);
  });
  return router;
}
