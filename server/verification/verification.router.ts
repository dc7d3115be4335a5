/**
 * GET /verification/report.html (and .pdf, .json): the verification report, linked from About.
 * Public, like the About page: it describes the software, not anyone's data. Served outside
 * /api as a document of its own (no client, no inline scripts: it passes the app's CSP).
 */
import { Router } from 'express';
import { DEFAULT_VERIFICATION_DIR, verificationReportFile } from './verification.service.js';

const NOT_GENERATED = 'The verification report has not been generated on this server: run `npm run verify`.';

export function verificationRouter(dir: string = DEFAULT_VERIFICATION_DIR): Router {
  const router = Router();
  for (const kind of ['html', 'pdf', 'json'] as const) {
    router.get(`/report.${kind}`, (_req, res) => {
      const file = verificationReportFile(dir, kind);
      if (!file) {
        res.status(404).type('text/plain').send(NOT_GENERATED);
        return;
      }
      res.set('Cache-Control', 'no-cache');
      res.type(kind).sendFile(file);
    });
  }
  return router;
}
