/** Users and projects. */
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Foundation1764633600000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "users" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "email" varchar(254) NOT NULL,
        "name" varchar(200) NOT NULL,
        "passwordHash" varchar(100) NOT NULL,
        "role" varchar(16) NOT NULL CHECK ("role" IN ('admin', 'lead', 'engineer', 'viewer')),
        "active" boolean NOT NULL DEFAULT (1),
        "sessionVersion" integer NOT NULL DEFAULT (0),
        "createdAt" datetime NOT NULL DEFAULT (datetime('now')),
        CONSTRAINT "UQ_users_email" UNIQUE ("email")
      )`);
    await q.query(`
      CREATE TABLE "projects" (
        "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
        "name" varchar(200) NOT NULL,
        "jobNumber" varchar(50) NOT NULL DEFAULT (''),
        "client" varchar(200) NOT NULL DEFAULT (''),
        "description" text NOT NULL DEFAULT (''),
        "designCode" varchar(32) NOT NULL,
        "units" varchar(8) NOT NULL CHECK ("units" IN ('metric', 'us')),
        "createdBy" integer NULL REFERENCES "users" ("id") ON DELETE SET NULL,
        "createdAt" datetime NOT NULL DEFAULT (datetime('now')),
        "updatedAt" datetime NOT NULL DEFAULT (datetime('now'))
      )`);
    await q.query(`CREATE INDEX "IDX_projects_name" ON "projects" ("name")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "projects"`);
    await q.query(`DROP TABLE "users"`);
  }
}
