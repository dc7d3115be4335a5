/** Models, model versions, pending imports, runs and run results (server/models, imports, runs). */
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class ModelsRuns1764640000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "models" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "projectId" integer NOT NULL REFERENCES "projects" ("id") ON DELETE CASCADE,
        "name" varchar(200) NOT NULL,
        "currentVersion" integer NOT NULL,
        "designCode" varchar(32) NOT NULL,
        "units" varchar(8) NOT NULL,
        "countsJson" text NOT NULL DEFAULT ('{}'),
        "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now')),
        "updatedAt" datetime NOT NULL DEFAULT (datetime('now'))
      )`);
    await q.query(`CREATE INDEX "IDX_models_project" ON "models" ("projectId")`);
    await q.query(`
      CREATE TABLE "model_versions" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "modelId" integer NOT NULL REFERENCES "models" ("id") ON DELETE CASCADE,
        "version" integer NOT NULL,
        "origin" varchar(16) NOT NULL CHECK ("origin" IN ('import', 'edit')),
        "message" text NOT NULL DEFAULT (''),
        "contentHash" varchar(64) NOT NULL,
        "modelData" blob NOT NULL,
        "sourceData" blob NULL,
        "editsJson" text NULL,
        "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now')),
        CONSTRAINT "UQ_model_versions" UNIQUE ("modelId", "version")
      )`);
    await q.query(`
      CREATE TABLE "pending_imports" (
        "id" varchar(36) PRIMARY KEY NOT NULL,
        "projectId" integer NOT NULL REFERENCES "projects" ("id") ON DELETE CASCADE,
        "modelId" integer NULL REFERENCES "models" ("id") ON DELETE CASCADE,
        "baseVersion" integer NULL,
        "name" varchar(200) NOT NULL,
        "previewJson" text NOT NULL,
        "modelData" blob NULL,
        "sourceData" blob NOT NULL,
        "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now')),
        "expiresAt" datetime NOT NULL
      )`);
    await q.query(`
      CREATE TABLE "runs" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "modelId" integer NOT NULL REFERENCES "models" ("id") ON DELETE CASCADE,
        "version" integer NOT NULL,
        "designCode" varchar(32) NOT NULL,
        "settingsJson" text NOT NULL,
        "status" varchar(16) NOT NULL CHECK ("status" IN ('queued', 'running', 'done', 'failed')),
        "phase" varchar(16) NULL,
        "progress" real NOT NULL DEFAULT (0),
        "message" text NOT NULL DEFAULT (''),
        "reviewStatus" varchar(16) NOT NULL DEFAULT ('draft'),
        "maxRatio" real NULL,
        "passCount" integer NULL,
        "failCount" integer NULL,
        "notCheckedCount" integer NULL,
        "timingsJson" text NOT NULL DEFAULT ('{}'),
        "diagnosticsJson" text NULL,
        "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now')),
        "startedAt" datetime NULL,
        "finishedAt" datetime NULL
      )`);
    await q.query(`CREATE INDEX "IDX_runs_model" ON "runs" ("modelId", "id")`);
    await q.query(`CREATE INDEX "IDX_runs_status" ON "runs" ("status")`);
    await q.query(`
      CREATE TABLE "run_results" (
        "runId" integer PRIMARY KEY NOT NULL REFERENCES "runs" ("id") ON DELETE CASCADE,
        "membersData" blob NOT NULL,
        "recordsData" blob NOT NULL,
        "loadingsJson" text NOT NULL,
        "nodeData" blob NOT NULL,
        "nodeCount" integer NOT NULL
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "run_results"`);
    await q.query(`DROP TABLE "runs"`);
    await q.query(`DROP TABLE "pending_imports"`);
    await q.query(`DROP TABLE "model_versions"`);
    await q.query(`DROP TABLE "models"`);
  }
}
