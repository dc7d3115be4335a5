/**
 * Run results kept in parts, so that reading one member or one loading reads one row
 * (issue 12): `run_member_results` (a member's utilisation row, its end nodes and type) and
 * `run_loading_results` (one loading's node displacements and reactions). Written with the
 * Table API so it runs on SQLite and PostgreSQL alike. Runs saved before this keep their
 * whole-run blobs in `run_results`; readers fall back to them.
 */
import { Table, TableIndex, type MigrationInterface, type QueryRunner } from 'typeorm';

const binary = (q: QueryRunner) => (q.connection.options.type === 'postgres' ? 'bytea' : 'blob');

export class ResultParts1765100000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.createTable(
      new Table({
        name: 'run_member_results',
        columns: [
          { name: 'runId', type: 'integer', isPrimary: true },
          { name: 'memberIndex', type: 'integer', isPrimary: true },
          { name: 'memberId', type: 'varchar', length: '64' },
          { name: 'data', type: 'text' },
        ],
        foreignKeys: [{ columnNames: ['runId'], referencedTableName: 'runs', referencedColumnNames: ['id'], onDelete: 'CASCADE' }],
      }),
    );
    await q.createIndex('run_member_results', new TableIndex({ name: 'IDX_run_member_results_member', columnNames: ['runId', 'memberId'] }));
    await q.createTable(
      new Table({
        name: 'run_loading_results',
        columns: [
          { name: 'runId', type: 'integer', isPrimary: true },
          { name: 'loadingIndex', type: 'integer', isPrimary: true },
          { name: 'nodeData', type: binary(q) },
        ],
        foreignKeys: [{ columnNames: ['runId'], referencedTableName: 'runs', referencedColumnNames: ['id'], onDelete: 'CASCADE' }],
      }),
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropTable('run_loading_results');
    await q.dropTable('run_member_results');
  }
}
