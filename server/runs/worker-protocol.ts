/** Messages between the HTTP thread and the run workers. */
import type { MemberMovingDetail } from '../../shared/moving/detail.js';
import type { DesignCode, ReadResult } from '../../shared/model/types.js';
import type { XlsxLimits } from '../../shared/reader/xlsx.js';
import type { CheckRecord } from '../../shared/design/types.js';
import type { RunPhase, RunStability, Stations } from '../../shared/schemas/runs.js';
import type { ResultTable } from '../../shared/exports/results.js';
import type { PackedRun } from './run-compute.js';
import type { ExportTask, ExportTaskResult } from '../exports/export-task.js';

export type { ExportTask } from '../exports/export-task.js';
import type { MembersMeta, MembersTask } from './members-table.js';

export type { MembersTask } from './members-table.js';
import type { SuggestTask, SuggestTaskResult } from '../suggestions/suggest-task.js';
import type { CompareTask, GeometryTask } from './read-tasks.js';

export type { CompareTask, GeometryTask } from './read-tasks.js';

interface TaskBase {
  /** the run whose analysis the task needs (workers keep the last few analyses) */
  runId: number;
  /** the model as JSON text, or `modelData`: its stored gzip blob (unzipped in the worker only when it must analyse) */
  modelJson?: string;
  modelData?: Uint8Array;
  designCode: DesignCode;
  /** the run's stability summary: a worker that must analyse again takes the first-order warning from it */
  stability?: RunStability | null;
}

export interface RunTask extends TaskBase {
  kind: 'run';
  /**
   * The grid's payload is built with the run (from the members in hand, nothing to unzip or
   * parse) when this is given: its fixed fields and the previous done run's members.
   */
  grid?: { meta: MembersMeta; previousData?: Uint8Array };
}

export interface MemberTask extends TaskBase {
  kind: 'member';
  member: number;
  loading: number;
  /** the governing combination's loading index, -1 when none */
  governing: number;
}

export interface ForcesTask extends TaskBase {
  kind: 'forces';
  /** loading indices to export */
  loadings: number[];
}

/** The detailed-checks export table, recomputed (runs whose records were not kept). */
export interface ChecksTask extends TaskBase {
  kind: 'checks';
}

/** Read and validate an upload (imports), off the HTTP thread. */
export interface ReadTask {
  kind: 'read';
  /** 0: no run */
  runId: 0;
  format: 'xlsx' | 'csv';
  files: { name: string; data: Uint8Array }[];
  /** XLSX limits (server/imports/import-limits.ts) */
  limits?: Partial<XlsxLimits>;
}

export type WorkerTask = RunTask | MemberTask | ForcesTask | ChecksTask | ReadTask | ExportTask | MembersTask | GeometryTask | CompareTask | SuggestTask;

export interface MemberTaskResult {
  stations: Stations;
  governingRecords: CheckRecord[];
  loadingRecords: CheckRecord[];
  /** moving loads (shared/moving/detail.ts) */
  moving?: MemberMovingDetail[];
}

/** The member-forces export table (shared/exports/results.ts) for the requested loadings. */
export type ForcesTaskResult = ResultTable;

export type TaskResult<T extends WorkerTask> = T extends RunTask
  ? PackedRun
  : T extends MemberTask
    ? MemberTaskResult
    : T extends ReadTask
      ? ReadResult
      : T extends ExportTask
        ? ExportTaskResult
        : T extends MembersTask | GeometryTask | CompareTask
          ? Uint8Array
          : T extends SuggestTask
            ? SuggestTaskResult
            : ResultTable;

export type WorkerRequest = { id: number; task: WorkerTask };

export type WorkerReply =
  | { id: 0; type: 'ready' }
  | { id: number; type: 'progress'; phase: RunPhase }
  /** a piece of an export's file (export tasks stream their bytes) */
  | { id: number; type: 'chunk'; data: Uint8Array }
  | { id: number; type: 'done'; result: unknown }
  | { id: number; type: 'error'; message: string };

/**
 * The answer to a task sent without its model (the sender expected this worker to hold the
 * run's analysis) when it does not: the sender sends it again with the model.
 */
export const MODEL_NEEDED = 'the worker does not hold this run\'s analysis: send the model';
