/**
 * Run results in parts (migration 1765100000000): one row per member and one per loading, so
 * the member page, the picture of one loading and the previous run's value of one member read
 * one row each instead of the whole run.
 */
import { EntitySchema } from 'typeorm';

export interface RunMemberResultRecord {
  runId: number;
  /** the member's position in the model's member list */
  memberIndex: number;
  memberId: string;
  /** JSON of StoredMemberResult (server/runs/result-parts.ts) */
  data: string;
}

export const RunMemberResultEntity = new EntitySchema<RunMemberResultRecord>({
  name: 'RunMemberResult',
  tableName: 'run_member_results',
  columns: {
    runId: { type: 'integer', primary: true },
    memberIndex: { type: 'integer', primary: true },
    memberId: { type: 'varchar', length: 64 },
    data: { type: 'text' },
  },
  indices: [{ name: 'IDX_run_member_results_member', columns: ['runId', 'memberId'] }],
});

export interface RunLoadingResultRecord {
  runId: number;
  loadingIndex: number;
  /** gzip of Float64 little-endian: nNodes*6 displacements then nNodes*6 reactions */
  nodeData: Buffer;
}

export const RunLoadingResultEntity = new EntitySchema<RunLoadingResultRecord>({
  name: 'RunLoadingResult',
  tableName: 'run_loading_results',
  columns: {
    runId: { type: 'integer', primary: true },
    loadingIndex: { type: 'integer', primary: true },
    nodeData: { type: 'blob' },
  },
});
