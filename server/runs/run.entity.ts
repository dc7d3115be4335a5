/** The `runs` and `run_results` tables (Storage in DEVELOPERS.md). */
import { EntitySchema } from 'typeorm';
import type { DesignCode } from '../../shared/model/types.js';
import type { ReviewStatus, RunPhase, RunStatus } from '../../shared/schemas/runs.js';

export interface RunRecord {
  id: number;
  modelId: number;
  version: number;
  designCode: DesignCode;
  /** the model settings used, JSON */
  settingsJson: string;
  status: RunStatus;
  phase: RunPhase | null;
  progress: number;
  message: string;
  reviewStatus: ReviewStatus;
  maxRatio: number | null;
  passCount: number | null;
  failCount: number | null;
  notCheckedCount: number | null;
  /** ms per phase, JSON */
  timingsJson: string;
  diagnosticsJson: string | null;
  /** RunStability JSON (analysis order, method, αcr, modes, warnings); null before it existed */
  stabilityJson: string | null;
  createdBy: number | null;
  /** scaled mode: the worker process that ran it (its task queue holds the analysis); null otherwise */
  workerId: string | null;
  createdAt: Date;
  startedAt: Date | null;
  finishedAt: Date | null;
}

export const RunEntity = new EntitySchema<RunRecord>({
  name: 'Run',
  tableName: 'runs',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    modelId: { type: 'integer' },
    version: { type: 'integer' },
    designCode: { type: 'varchar', length: 32 },
    settingsJson: { type: 'text' },
    status: { type: 'varchar', length: 16 },
    phase: { type: 'varchar', length: 16, nullable: true },
    progress: { type: 'real', default: 0 },
    message: { type: 'text', default: '' },
    reviewStatus: { type: 'varchar', length: 16, default: 'draft' },
    maxRatio: { type: 'real', nullable: true },
    passCount: { type: 'integer', nullable: true },
    failCount: { type: 'integer', nullable: true },
    notCheckedCount: { type: 'integer', nullable: true },
    timingsJson: { type: 'text', default: '{}' },
    diagnosticsJson: { type: 'text', nullable: true },
    stabilityJson: { type: 'text', nullable: true },
    createdBy: { type: 'integer', nullable: true },
    workerId: { type: 'varchar', length: 128, nullable: true },
    createdAt: { type: 'datetime', createDate: true },
    startedAt: { type: 'datetime', nullable: true },
    finishedAt: { type: 'datetime', nullable: true },
  },
});

export interface RunResultRecord {
  runId: number;
  /** gzip(JSON MemberUtilisation[]) in model member order */
  membersData: Buffer;
  /** gzip(JSON CheckRecord[]) as returned by checkModel */
  recordsData: Buffer;
  /** JSON LoadingInfo[] (cases first, then combinations) */
  loadingsJson: string;
  /** gzip of Float64 little-endian: displacements then reactions, loading-major, nNodes*6 each */
  nodeData: Buffer;
  nodeCount: number;
  /** gzip of Float64: mode shapes, then buckled shapes (server/runs/stability-codec.ts); null when none */
  shapesData: Buffer | null;
  /**
   * gzip(JSON Model) of the model the analysis ran on when it differs from the stored version
   * (generated notional-load or sway-imperfection cases and combination variants); null otherwise
   */
  analysedModelData: Buffer | null;
}

export const RunResultEntity = new EntitySchema<RunResultRecord>({
  name: 'RunResult',
  tableName: 'run_results',
  columns: {
    runId: { type: 'integer', primary: true },
    membersData: { type: 'blob' },
    recordsData: { type: 'blob' },
    loadingsJson: { type: 'text' },
    nodeData: { type: 'blob' },
    nodeCount: { type: 'integer' },
    shapesData: { type: 'blob', nullable: true },
    analysedModelData: { type: 'blob', nullable: true },
  },
});
