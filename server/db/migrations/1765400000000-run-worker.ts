/**
 * Which worker process ran a run (scaled mode, issue 15): `runs.workerId`, null in the default
 * mode (runs in the server's own threads) and for runs saved before it. Tasks that need the
 * run's analysis go to that worker's own queue while it lives (server/queue/task-queue.ts).
 * Written with the Table API so it runs on SQLite and PostgreSQL alike.
 */
import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';

export class RunWorker1765400000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.addColumn('runs', new TableColumn({ name: 'workerId', type: 'varchar', length: '128', isNullable: true }));
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropColumn('runs', 'workerId');
  }
}
