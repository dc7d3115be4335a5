/**
 * Stability results of a run (issue 10): the summary (analysis order, method, iterations,
 * αcr per loading, natural frequencies, warnings) as JSON on `runs`, and the mode and buckled
 * shapes as a gzip Float64 block on `run_results`. Older runs keep null in both.
 */
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RunStability1764961000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "runs" ADD COLUMN "stabilityJson" text NULL`);
    await q.query(`ALTER TABLE "run_results" ADD COLUMN "shapesData" blob NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "run_results" DROP COLUMN "shapesData"`);
    await q.query(`ALTER TABLE "runs" DROP COLUMN "stabilityJson"`);
  }
}
