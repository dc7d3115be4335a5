/**
 * Migrations of a PostgreSQL database, oldest first: the baseline (the schema of the SQLite
 * migrations written before PostgreSQL was supported), then every migration of
 * `migrations/index.ts` that came after them. Those later migrations must run on both
 * databases: write them with the QueryRunner Table API (createTable, addColumn, createIndex)
 * or branch on `q.connection.options.type` (DEVELOPERS.md, Storage).
 */
import type { MigrationInterface } from 'typeorm';
import { migrations } from '../migrations/index.js';
import { Foundation1764633600000 } from '../migrations/1764633600000-foundation.js';
import { ModelsRuns1764640000000 } from '../migrations/1764640000000-models-runs.js';
import { ReviewAudit1764700000000 } from '../migrations/1764700000000-review-audit.js';
import { RunStability1764961000000 } from '../migrations/1764961000000-run-stability.js';
import { PostgresBaseline1764961000001 } from './1764961000001-postgres-baseline.js';

/** SQLite-only migrations (hand-written SQLite SQL) that the baseline stands for. */
export const SQLITE_ONLY: ReadonlySet<new () => MigrationInterface> = new Set([
  Foundation1764633600000,
  ModelsRuns1764640000000,
  ReviewAudit1764700000000,
  RunStability1764961000000,
]);

export function postgresMigrations(): (new () => MigrationInterface)[] {
  return [PostgresBaseline1764961000001, ...migrations.filter((m) => !SQLITE_ONLY.has(m))];
}
