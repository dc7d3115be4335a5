/**
 * The Express app, built without listening (server/index.ts listens; tests use supertest).
 *
 * Adding a router: write `server/<noun>/<noun>.router.ts` exporting `(ctx: AppContext) => Router`
 * whose every route starts with `requireRole(...)` or `requireAuth`, then add one line to
 * `apiRouters` below (and its routes to tests/server/route-matrix.test.ts).
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express, type Router } from 'express';
import helmet from 'helmet';
import type { DataSource } from 'typeorm';
import { authRouter } from './auth/auth.router.js';
import type { AppConfig } from './config/app-config.js';
import type { Logger } from './config/logger.js';
import { apiNotFound, errorHandler } from './errors/error-handler.js';
import { authenticate } from './middleware/auth.js';
import { jsonBody } from './middleware/body.js';
import { projectsRouter } from './projects/project.router.js';
import { usersRouter } from './users/user.router.js';
import { modelsRouter, projectModelsRouter } from './models/model.router.js';
import { importsRouter } from './imports/import.router.js';
import { runsRouter } from './runs/run.router.js';
import { suggestionsRouter } from './suggestions/suggestion.router.js';
import { reportsRouter } from './reports/report.router.js';
import { closeRunPool } from './runs/worker-pool.js';
import { samplesRouter, templatesRouter } from './samples/sample.router.js';
import { accessRouter, membersRouter } from './membership/member.router.js';
import { reviewsRouter } from './reviews/review.router.js';
import { commentsRouter } from './comments/comment.router.js';
import { auditRouter } from './audit/audit.router.js';
import { auditTrail } from './audit/audit-middleware.js';
import { outboxRouter } from './mail/outbox.router.js';
import { closeMailers } from './mail/mailer.js';
import { mailConfigFromEnv } from './mail/mail-config.js';
import { accountRouter } from './security/account.router.js';
import { csrfGuard } from './security/csrf.js';
import { verificationRouter } from './verification/verification.router.js';
import { fairness } from './security/fairness.js';
import { CONTENT_SECURITY_POLICY } from './security/csp.js';

export interface AppContext {
  config: AppConfig;
  dataSource: DataSource;
  logger: Logger;
}

/** Mount path → router factory. Paths may hold parameters (use `Router({ mergeParams: true })`). */
export const apiRouters: [string, (ctx: AppContext) => Router][] = [
  ['/api/auth', authRouter],
  ['/api/users', usersRouter],
  ['/api/projects', projectsRouter],
  ['/api/projects/:projectId/models', projectModelsRouter],
  ['/api/projects/:projectId/imports', importsRouter],
  ['/api/models', modelsRouter],
  ['/api/runs', runsRouter],
  ['/api/samples', samplesRouter],
  ['/api/templates', templatesRouter],
  ['/api/projects/:projectId/members', membersRouter],
  ['/api/projects/:projectId/access', accessRouter],
  ['/api/runs/:runId/review', reviewsRouter],
  ['/api/runs/:runId/comments', commentsRouter],
  ['/api/runs/:runId/reports', reportsRouter],
  ['/api/runs/:runId/suggestions', suggestionsRouter],
  ['/api/audit', auditRouter],
  ['/api/outbox', outboxRouter],
  ['/api/account', accountRouter],
];

/**
 * Work to finish when the server stops (SIGINT/SIGTERM), run in order after the HTTP server
 * has closed and before the database closes, e.g. `shutdownHooks.push(() => pool.close())`.
 */
export const shutdownHooks: (() => Promise<void> | void)[] = [closeRunPool, closeMailers];

export const JSON_BODY_LIMIT = '5mb';

export function createApp(ctx: AppContext): Express {
  const { config, dataSource, logger } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  app.use(helmet({ contentSecurityPolicy: { useDefaults: false, directives: CONTENT_SECURITY_POLICY } }));
  app.use(cookieParser());
  app.use('/api', jsonBody(JSON_BODY_LIMIT));
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });

  app.get('/api/health', (_req, res) => {
    res.json({ status: 'ok' });
  });

  app.use('/api', csrfGuard(mailConfigFromEnv().appUrl));
  app.use('/api', authenticate(config, dataSource));
  app.use('/api', fairness());
  app.use('/api', auditTrail(dataSource, logger));
  for (const [mountPath, makeRouter] of apiRouters) app.use(mountPath, makeRouter(ctx));
  app.use('/api', apiNotFound);
  app.use('/verification', verificationRouter());

  serveClient(app, config.distDir);
  app.use(errorHandler(logger));
  return app;
}

/** The built client from `dist/`, with every other GET falling back to index.html. */
function serveClient(app: Express, distDir: string): void {
  const indexHtml = path.join(distDir, 'index.html');
  app.use(
    express.static(distDir, {
      index: false,
      setHeaders: (res, file) => {
        if (file.includes(`${path.sep}assets${path.sep}`)) res.set('Cache-Control', 'public, max-age=31536000, immutable');
      },
    }),
  );
  app.get('/{*splat}', (_req, res) => {
    if (!existsSync(indexHtml)) {
      res.status(404).type('text/plain').send('The client is not built yet: run `npm run build` (npm start does this for you).');
      return;
    }
    res.set('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
  app.use((_req, res) => {
    res.status(404).type('text/plain').send('Not found');
  });
}
