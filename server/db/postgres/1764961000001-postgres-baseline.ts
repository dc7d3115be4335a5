/**
 * PostgreSQL baseline: the schema that the four SQLite migrations up to RunStability1764961000000
 * build (server/db/migrations/), written once for PostgreSQL. A PostgreSQL database starts here
 * and then runs the dialect-neutral migrations that came after (postgres/index.ts).
 * Types: SERIAL for SQLite's INTEGER PRIMARY KEY AUTOINCREMENT, bytea for blob, timestamptz
 * for datetime, double precision for real; the same names, CHECKs, foreign keys, uniques and
 * indexes. `tests/scaled/` checks that TypeORM sees no difference from the entities.
 */
import type { MigrationInterface, QueryRunner } from 'typeorm';

const TABLES = [
  `CREATE TABLE "users" (
    "id" SERIAL PRIMARY KEY,
    "email" varchar(254) NOT NULL,
    "name" varchar(200) NOT NULL,
    "passwordHash" varchar(100) NOT NULL,
    "role" varchar(16) NOT NULL CHECK ("role" IN ('admin', 'lead', 'engineer', 'viewer')),
    "active" boolean NOT NULL DEFAULT true,
    "sessionVersion" integer NOT NULL DEFAULT 0,
    "createdAt" timestamptz NOT NULL DEFAULT now(),
    CONSTRAINT "UQ_users_email" UNIQUE ("email")
  )`,
  `CREATE TABLE "projects" (
    "id" SERIAL PRIMARY KEY,
    "name" varchar(200) NOT NULL,
    "jobNumber" varchar(50) NOT NULL DEFAULT '',
    "client" varchar(200) NOT NULL DEFAULT '',
    "description" text NOT NULL DEFAULT '',
    "designCode" varchar(32) NOT NULL,
    "units" varchar(8) NOT NULL CHECK ("units" IN ('metric', 'us')),
    "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now(),
    "updatedAt" timestamptz NOT NULL DEFAULT now()
  )`,
  `CREATE INDEX "IDX_projects_name" ON "projects" ("name")`,
  `CREATE TABLE "models" (
    "id" SERIAL PRIMARY KEY,
    "projectId" integer NOT NULL REFERENCES "projects" ("id") ON DELETE CASCADE,
    "name" varchar(200) NOT NULL,
    "currentVersion" integer NOT NULL,
    "designCode" varchar(32) NOT NULL,
    "units" varchar(8) NOT NULL,
    "countsJson" text NOT NULL DEFAULT '{}',
    "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now(),
    "updatedAt" timestamptz NOT NULL DEFAULT now()
  )`,
  `CREATE INDEX "IDX_models_project" ON "models" ("projectId")`,
  `CREATE TABLE "model_versions" (
    "id" SERIAL PRIMARY KEY,
    "modelId" integer NOT NULL REFERENCES "models" ("id") ON DELETE CASCADE,
    "version" integer NOT NULL,
    "origin" varchar(16) NOT NULL CHECK ("origin" IN ('import', 'edit')),
    "message" text NOT NULL DEFAULT '',
    "contentHash" varchar(64) NOT NULL,
    "modelData" bytea NOT NULL,
    "sourceData" bytea NULL,
    "editsJson" text NULL,
    "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now(),
    CONSTRAINT "UQ_model_versions" UNIQUE ("modelId", "version")
  )`,
  `CREATE TABLE "pending_imports" (
    "id" varchar(36) PRIMARY KEY,
    "projectId" integer NOT NULL REFERENCES "projects" ("id") ON DELETE CASCADE,
    "modelId" integer NULL REFERENCES "models" ("id") ON DELETE CASCADE,
    "baseVersion" integer NULL,
    "name" varchar(200) NOT NULL,
    "previewJson" text NOT NULL,
    "modelData" bytea NULL,
    "sourceData" bytea NOT NULL,
    "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now(),
    "expiresAt" timestamptz NOT NULL
  )`,
  `CREATE TABLE "runs" (
    "id" SERIAL PRIMARY KEY,
    "modelId" integer NOT NULL REFERENCES "models" ("id") ON DELETE CASCADE,
    "version" integer NOT NULL,
    "designCode" varchar(32) NOT NULL,
    "settingsJson" text NOT NULL,
    "status" varchar(16) NOT NULL CHECK ("status" IN ('queued', 'running', 'done', 'failed')),
    "phase" varchar(16) NULL,
    "progress" double precision NOT NULL DEFAULT 0,
    "message" text NOT NULL DEFAULT '',
    "reviewStatus" varchar(16) NOT NULL DEFAULT 'draft',
    "maxRatio" double precision NULL,
    "passCount" integer NULL,
    "failCount" integer NULL,
    "notCheckedCount" integer NULL,
    "timingsJson" text NOT NULL DEFAULT '{}',
    "diagnosticsJson" text NULL,
    "stabilityJson" text NULL,
    "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now(),
    "startedAt" timestamptz NULL,
    "finishedAt" timestamptz NULL
  )`,
  `CREATE INDEX "IDX_runs_model" ON "runs" ("modelId", "id")`,
  `CREATE INDEX "IDX_runs_status" ON "runs" ("status")`,
  `CREATE TABLE "run_results" (
    "runId" integer PRIMARY KEY REFERENCES "runs" ("id") ON DELETE CASCADE,
    "membersData" bytea NOT NULL,
    "recordsData" bytea NOT NULL,
    "loadingsJson" text NOT NULL,
    "nodeData" bytea NOT NULL,
    "nodeCount" integer NOT NULL,
    "shapesData" bytea NULL,
    "analysedModelData" bytea NULL
  )`,
  `CREATE TABLE "project_members" (
    "id" SERIAL PRIMARY KEY,
    "projectId" integer NOT NULL REFERENCES "projects" ("id") ON DELETE CASCADE,
    "userId" integer NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
    "role" varchar(16) NOT NULL CHECK ("role" IN ('viewer', 'engineer', 'lead')),
    "createdAt" timestamptz NOT NULL DEFAULT now(),
    CONSTRAINT "UQ_project_members" UNIQUE ("projectId", "userId")
  )`,
  `CREATE INDEX "IDX_project_members_user" ON "project_members" ("userId")`,
  `CREATE TABLE "run_reviews" (
    "id" SERIAL PRIMARY KEY,
    "runId" integer NOT NULL REFERENCES "runs" ("id") ON DELETE CASCADE,
    "action" varchar(16) NOT NULL CHECK ("action" IN ('submit', 'return', 'approve')),
    "fromStatus" varchar(16) NOT NULL,
    "toStatus" varchar(16) NOT NULL,
    "message" text NOT NULL DEFAULT '',
    "userId" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now()
  )`,
  `CREATE INDEX "IDX_run_reviews_run" ON "run_reviews" ("runId", "id")`,
  `CREATE TABLE "comments" (
    "id" SERIAL PRIMARY KEY,
    "runId" integer NOT NULL REFERENCES "runs" ("id") ON DELETE CASCADE,
    "member" varchar(100) NULL,
    "body" text NOT NULL,
    "userId" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now()
  )`,
  `CREATE INDEX "IDX_comments_run" ON "comments" ("runId", "member")`,
  `CREATE TABLE "mail_outbox" (
    "id" SERIAL PRIMARY KEY,
    "fromAddress" varchar(320) NOT NULL,
    "toJson" text NOT NULL,
    "subject" text NOT NULL,
    "text" text NOT NULL,
    "html" text NOT NULL,
    "kind" varchar(32) NOT NULL DEFAULT '',
    "receivedAt" timestamptz NOT NULL DEFAULT now()
  )`,
  `CREATE TABLE "audit_events" (
    "id" SERIAL PRIMARY KEY,
    "at" timestamptz NOT NULL,
    "userId" integer NULL,
    "userEmail" varchar(254) NULL,
    "action" varchar(32) NOT NULL,
    "projectId" integer NULL,
    "modelId" integer NULL,
    "version" integer NULL,
    "runId" integer NULL,
    "detail" text NOT NULL DEFAULT '',
    "ip" varchar(64) NULL
  )`,
  `CREATE INDEX "IDX_audit_at" ON "audit_events" ("at")`,
  `CREATE INDEX "IDX_audit_project" ON "audit_events" ("projectId", "at")`,
  `CREATE TABLE "account_tokens" (
    "id" SERIAL PRIMARY KEY,
    "userId" integer NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
    "kind" varchar(16) NOT NULL CHECK ("kind" IN ('invite', 'reset')),
    "tokenHash" varchar(64) NOT NULL UNIQUE,
    "expiresAt" timestamptz NOT NULL,
    "usedAt" timestamptz NULL,
    "createdAt" timestamptz NOT NULL DEFAULT now()
  )`,
  `CREATE TABLE "revoked_sessions" (
    "tokenHash" varchar(64) PRIMARY KEY,
    "expiresAt" timestamptz NOT NULL
  )`,
];

const DROP_ORDER = [
  'revoked_sessions', 'account_tokens', 'audit_events', 'mail_outbox', 'comments', 'run_reviews', 'project_members',
  'run_results', 'runs', 'pending_imports', 'model_versions', 'models', 'projects', 'users',
];

export class PostgresBaseline1764961000001 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    for (const sql of TABLES) await q.query(sql);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of DROP_ORDER) await q.query(`DROP TABLE "${table}"`);
  }
}
