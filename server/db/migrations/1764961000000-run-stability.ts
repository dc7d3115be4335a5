/**
 * Stability results of a run (issue 10): the summary (analysis order, method, iterations,
 * αcr per loading, natural frequencies, warnings) as JSON on `runs`; on `run_results` the mode
 * and buckled shapes as a gzip Float64 block, and the model the analysis ran on when the code
 * rules changed it (gzip JSON). Older runs keep null in all three.
 */
import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RunStability1764961000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "runs" ADD COLUMN "stabilityJson" text NULL`);
    await q.query(`ALTER TABLE "run_results" ADD COLUMN "shapesData" blob NULL`);
    await q.query(`ALTER TABLE "run_results" ADD COLUMN "analysedModelData" blob NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "run_results" DROP COLUMN "analysedModelData"`);
    await q.query(`ALTER TABLE "run_results" DROP COLUMN "shapesData"`);
    await q.query(`ALTER TABLE "runs" DROP COLUMN "stabilityJson"`);
  }
}
