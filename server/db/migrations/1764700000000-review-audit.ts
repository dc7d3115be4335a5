/**
 * Project membership, run reviews, comments, the mail outbox, the audit trail, account
 * tokens and revoked sessions (server/membership, reviews, comments, mail, audit, security).
 *
 * Existing databases: every existing user becomes a member of every existing project with
 * their account role (capped at lead), so nobody loses sight of work they could see before.
 */
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class ReviewAudit1764700000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "project_members" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "projectId" integer NOT NULL REFERENCES "projects" ("id") ON DELETE CASCADE,
        "userId" integer NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "role" varchar(16) NOT NULL CHECK ("role" IN ('viewer', 'engineer', 'lead')),
        "createdAt" datetime NOT NULL DEFAULT (datetime('now')),
        CONSTRAINT "UQ_project_members" UNIQUE ("projectId", "userId")
      )`);
    await q.query(`CREATE INDEX "IDX_project_members_user" ON "project_members" ("userId")`);
    await q.query(`
      INSERT INTO "project_members" ("projectId", "userId", "role")
      SELECT p."id", u."id", CASE u."role" WHEN 'admin' THEN 'lead' ELSE u."role" END
      FROM "projects" p CROSS JOIN "users" u`);
    await q.query(`
      CREATE TABLE "run_reviews" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "runId" integer NOT NULL REFERENCES "runs" ("id") ON DELETE CASCADE,
        "action" varchar(16) NOT NULL CHECK ("action" IN ('submit', 'return', 'approve')),
        "fromStatus" varchar(16) NOT NULL,
        "toStatus" varchar(16) NOT NULL,
        "message" text NOT NULL DEFAULT (''),
        "userId" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now'))
      )`);
    await q.query(`CREATE INDEX "IDX_run_reviews_run" ON "run_reviews" ("runId", "id")`);
    await q.query(`
      CREATE TABLE "comments" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "runId" integer NOT NULL REFERENCES "runs" ("id") ON DELETE CASCADE,
        "member" varchar(100) NULL,
        "body" text NOT NULL,
        "userId" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now'))
      )`);
    await q.query(`CREATE INDEX "IDX_comments_run" ON "comments" ("runId", "member")`);
    await q.query(`
      CREATE TABLE "mail_outbox" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "fromAddress" varchar(320) NOT NULL,
        "toJson" text NOT NULL,
        "subject" text NOT NULL,
        "text" text NOT NULL,
        "html" text NOT NULL,
        "kind" varchar(32) NOT NULL DEFAULT (''),
        "receivedAt" datetime NOT NULL DEFAULT (datetime('now'))
      )`);
    await q.query(`
      CREATE TABLE "audit_events" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "at" datetime NOT NULL,
        "userId" integer NULL,
        "userEmail" varchar(254) NULL,
        "action" varchar(32) NOT NULL,
        "projectId" integer NULL,
        "modelId" integer NULL,
        "version" integer NULL,
        "runId" integer NULL,
        "detail" text NOT NULL DEFAULT (''),
        "ip" varchar(64) NULL
      )`);
    await q.query(`CREATE INDEX "IDX_audit_at" ON "audit_events" ("at")`);
    await q.query(`CREATE INDEX "IDX_audit_project" ON "audit_events" ("projectId", "at")`);
    await q.query(`
      CREATE TABLE "account_tokens" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "userId" integer NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "kind" varchar(16) NOT NULL CHECK ("kind" IN ('invite', 'reset')),
        "tokenHash" varchar(64) NOT NULL UNIQUE,
        "expiresAt" datetime NOT NULL,
        "usedAt" datetime NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now'))
      )`);
    await q.query(`
      CREATE TABLE "revoked_sessions" (
        "tokenHash" varchar(64) PRIMARY KEY NOT NULL,
        "expiresAt" datetime NOT NULL
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['revoked_sessions', 'account_tokens', 'audit_events', 'mail_outbox', 'comments', 'run_reviews', 'project_members']) {
      await q.query(`DROP TABLE "${table}"`);
    }
  }
}
