/**
 * Starts Trestle: parse the environment, open and migrate the database, seed a new one,
 * listen on PORT, and shut down cleanly on SIGINT/SIGTERM.
 */
import path from 'node:path';
import type { Server } from 'node:http';
import { createApp, shutdownHooks } from './app.js';
import { appConfigFromEnv } from './config/app-config.js';
import { loadEnvOrExit } from './config/env.js';
import { createLogger } from './config/logger.js';
import { resolveJwtSecret } from './config/secret.js';
import { DATABASE_FILE, openDatabase } from './db/data-source.js';
import { seedDemoData, seedFirstAdmin } from './db/seed.js';
import { redactUrl } from './queue/connection.js';
import { closeRateStore } from './queue/rate-store.js';
import { closeRunsQueue } from './queue/task-queue.js';

async function main(): Promise<void> {
  const env = loadEnvOrExit();
  const logger = createLogger(env.LOG_LEVEL);
  const dataDir = path.resolve(env.DATA_DIR);
  const config = appConfigFromEnv(env, resolveJwtSecret(env.JWT_SECRET, dataDir));

  const databaseFile = path.join(dataDir, DATABASE_FILE);
  const { dataSource, isNew, applied } = await openDatabase(env.DATABASE_URL ? { url: env.DATABASE_URL } : { database: databaseFile });
  const where = env.DATABASE_URL ? `PostgreSQL ${redactUrl(env.DATABASE_URL)}` : databaseFile;
  logger.info(`database ${where}${applied.length ? `; applied migrations: ${applied.join(', ')}` : ''}`);
  if (isNew && env.SEED_DEMO) {
    await seedDemoData(dataSource);
    logger.info('new database: demo accounts and demo projects seeded (password trestle-demo)');
  }
  if (env.ADMIN_EMAIL && env.ADMIN_PASSWORD && (await seedFirstAdmin(dataSource, env.ADMIN_EMAIL, env.ADMIN_PASSWORD))) {
    logger.info(`no users yet: created admin ${env.ADMIN_EMAIL}`);
  } else if (isNew && !env.SEED_DEMO && !env.ADMIN_EMAIL) {
    logger.warn('new database without demo data and no ADMIN_EMAIL/ADMIN_PASSWORD: nobody can sign in yet');
  }

  if (env.QUEUE_URL) {
    // scaled mode: runs, uploads and exports go to `npm run worker` processes; rate limits live in Redis
    logger.info(`queue ${redactUrl(env.QUEUE_URL)}: runs, uploads and exports are worked on by \`npm run worker\` processes`);
    shutdownHooks.push(closeRunsQueue, closeRateStore);
  }
  const app = createApp({ config, dataSource, logger });
  const server: Server = await new Promise((resolve, reject) => {
    const s = env.HOST ? app.listen(env.PORT, env.HOST) : app.listen(env.PORT);
    s.once('listening', () => resolve(s));
    s.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : env.PORT;
  logger.info(`Trestle listening on http://localhost:${port}`);

  let closing = false;
  const shutdown = (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info(`${signal}: shutting down`);
    const force = setTimeout(() => {
      logger.warn('shutdown timed out; closing open connections');
      server.closeAllConnections();
    }, 5000);
    force.unref();
    server.close(async () => {
      try {
        for (const hook of shutdownHooks) {
          try {
            await hook();
          } catch (err) {
            logger.error('shutdown hook failed', err);
          }
        }
        await dataSource.destroy();
      } finally {
        clearTimeout(force);
        logger.info('stopped');
        process.exit(0);
      }
    });
    server.closeIdleConnections();
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error('Trestle could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
