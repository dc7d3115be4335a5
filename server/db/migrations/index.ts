/**
 * Every migration, oldest first. To add one: create
 * `server/db/migrations/<ms timestamp>-<what>.ts` exporting a class whose name ends in the
 * same 13-digit timestamp (TypeORM reads it from the name), e.g. `Models1764640000000`,
 * write its SQL by hand (up and down), and append the class here. Never edit a migration
 * that has shipped; add a new one.
 */
import type { MigrationInterface } from 'typeorm';
import { Foundation1764633600000 } from './1764633600000-foundation.js';
import { ModelsRuns1764640000000 } from './1764640000000-models-runs.js';
import { ReviewAudit1764700000000 } from './1764700000000-review-audit.js';
import { RunStability1764961000000 } from './1764961000000-run-stability.js';
import { ResultParts1765100000000 } from './1765100000000-result-parts.js';
import { RunWorker1765400000000 } from './1765400000000-run-worker.js';

export const migrations: (new () => MigrationInterface)[] = [Foundation1764633600000, ModelsRuns1764640000000, ReviewAudit1764700000000, RunStability1764961000000, ResultParts1765100000000, RunWorker1765400000000];
