/**
 * Runs: queue a run of one model version on the worker pool, follow its phases, keep its
 * results (run_results), and answer the grid, the member detail, the picture, history and
 * comparison from what was kept. Member station forces and check records of one member are
 * recomputed in a worker on demand (the worker that ran the model usually still holds its
 * analysis, so this costs no re-solve).
 */
import { gunzip } from 'node:zlib';
import { promisify } from 'node:util';
import { performance } from 'node:perf_hooks';
import { In, type DataSource, type FindOptionsSelect } from 'typeorm';
import type { CheckRecord, MemberUtilisation } from '../../shared/design/types.js';
import type { DesignCode, Model } from '../../shared/model/types.js';
import { memberRows } from '../../shared/results/member-rows.js';
import {
  startRunSchema,
  type LoadingInfo,
  type MemberDetail,
  type Run,
  type MembersLayout,
  type RunPhase,
  type RunShape,
  type RunStability,
  type RunSummary,
  type ShapeKind,
  type StartRunInput,
} from '../../shared/schemas/runs.js';
import type { Logger } from '../config/logger.js';
import { AppError, badRequest, notFound } from '../errors/app-error.js';
import { decodeJson, decodeText } from '../models/model-codec.js';
import { findModel, findVersion } from '../models/model.service.js';
import type { PackedRun } from './run-compute.js';
import { RunEntity, RunResultEntity, type RunRecord, type RunResultRecord } from './run.entity.js';
import { resultsPool, runPool, WorkerPool } from './worker-pool.js';
import { gridPayloads } from './payload-cache.js';
import { MODEL_NEEDED, type MemberTask, type MemberTaskResult, type RunTask } from './worker-protocol.js';
import { shapeFromBlock } from './stability-codec.js';
import { UserEntity } from '../users/user.entity.js';
import { queueUrl } from '../queue/connection.js';
import { enqueueRun } from '../queue/task-queue.js';
import { RunLoadingResultEntity } from './result-parts.entity.js';
import { saveParts, storedMember, type StoredMemberResult } from './result-parts.js';

const gunzipAsync = promisify(gunzip);

export const PHASE_PROGRESS: Record<RunPhase, number> = {
  reading: 0.05, assembling: 0.15, factorising: 0.3, solving: 0.45, recovering: 0.55, checking: 0.65, saving: 0.9,
};

export const INTERRUPTED_MESSAGE = 'Interrupted by a server restart; start the run again';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

async function userNames(ds: DataSource, ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((i): i is number => i !== null))];
  if (wanted.length === 0) return new Map();
  const rows = await ds.getRepository(UserEntity).find({ select: { id: true, name: true }, where: { id: In(wanted) } });
  return new Map(rows.map((r) => [r.id, r.name]));
}

function analysisOrderOf(settingsJson: string): 'first_order' | 'second_order' {
  try {
    return (JSON.parse(settingsJson) as { analysis?: string }).analysis === 'second_order' ? 'second_order' : 'first_order';
  } catch {
    return 'first_order';
  }
}

export function toRunSummary(r: RunRecord, names: Map<number, string>): RunSummary {
  const done = r.passCount !== null;
  return {
    id: r.id,
    modelId: r.modelId,
    version: r.version,
    designCode: r.designCode,
    status: r.status,
    reviewStatus: r.reviewStatus,
    phase: r.phase,
    progress: r.status === 'done' ? 1 : r.progress,
    message: r.message,
    maxRatio: r.maxRatio,
    counts: done ? { pass: r.passCount!, fail: r.failCount!, notChecked: r.notCheckedCount! } : null,
    analysis: analysisOrderOf(r.settingsJson),
    durationMs: r.startedAt && r.finishedAt ? r.finishedAt.getTime() - r.startedAt.getTime() : null,
    createdBy: r.createdBy,
    createdByName: r.createdBy !== null ? names.get(r.createdBy) ?? null : null,
    createdAt: r.createdAt.toISOString(),
    startedAt: iso(r.startedAt),
    finishedAt: iso(r.finishedAt),
  };
}

export async function findRun(ds: DataSource, id: number): Promise<RunRecord> {
  const run = await ds.getRepository(RunEntity).findOneBy({ id });
  if (!run) throw notFound(`Run ${id} not found`);
  return run;
}

export async function getRun(ds: DataSource, id: number): Promise<Run> {
  const r = await findRun(ds, id);
  return {
    ...toRunSummary(r, await userNames(ds, [r.createdBy])),
    settings: JSON.parse(r.settingsJson) as Record<string, unknown>,
    timings: JSON.parse(r.timingsJson || '{}') as Record<string, number>,
    diagnostics: r.diagnosticsJson ? (JSON.parse(r.diagnosticsJson) as Run['diagnostics']) : null,
    stability: stabilityOf(r),
  };
}

/** The run's stability summary (null until done, and for runs from before it was kept). */
export function stabilityOf(r: RunRecord): RunStability | null {
  if (r.status !== 'done' || !r.stabilityJson) return null;
  // fields added after the first stability runs get their empty value
  return { notes: [], secondOrder: [], critical: [], modes: [], warnings: [], ...(JSON.parse(r.stabilityJson) as Partial<RunStability>) } as RunStability;
}

export async function listRuns(ds: DataSource, modelId: number): Promise<RunSummary[]> {
  await findModel(ds, modelId);
  const rows = await ds.getRepository(RunEntity).find({ where: { modelId }, order: { id: 'DESC' } });
  const names = await userNames(ds, rows.map((r) => r.createdBy));
  return rows.map((r) => toRunSummary(r, names));
}

/** On start-up: runs left queued or running by a previous process can never finish. */
export async function markInterruptedRuns(ds: DataSource): Promise<number> {
  const result = await ds
    .createQueryBuilder()
    .update(RunEntity)
    .set({ status: 'failed', message: INTERRUPTED_MESSAGE, finishedAt: new Date() })
    .where('status IN (:...s)', { s: ['queued', 'running'] })
    .execute();
  return result.affected ?? 0;
}

const recovered = new WeakMap<DataSource, Promise<void>>();
const loggers = new WeakMap<DataSource, Logger>();

/**
 * Start-up recovery, once per database: runs a previous process left queued or running are
 * marked failed. `startRun` waits for it so a new run is never caught by it.
 */
export function recoverInterruptedRuns(ds: DataSource, logger?: Logger): Promise<void> {
  if (logger) loggers.set(ds, logger);
  let p = recovered.get(ds);
  if (!p) {
    // scaled mode (QUEUE_URL): other servers' runs are in the queue; only the queue fails them
    p = (queueUrl() ? Promise.resolve(0) : markInterruptedRuns(ds)).then(
      (n) => {
        if (n > 0) logger?.warn(`${n} run${n === 1 ? '' : 's'} interrupted by a restart marked failed`);
      },
      (err: unknown) => logger?.error('could not mark interrupted runs', err),
    );
    recovered.set(ds, p);
  }
  return p;
}

/** Runs this process is working on → promise settled when the run is done or failed. */
const active = new Map<number, Promise<void>>();

/** Resolves when the run has finished (done or failed); at once if it is not in progress. */
export function whenSettled(runId: number): Promise<void> {
  return active.get(runId) ?? Promise.resolve();
}

export async function startRun(ds: DataSource, modelId: number, userId: number | null, input: StartRunInput): Promise<RunSummary> {
  const data = startRunSchema.parse(input);
  await recoverInterruptedRuns(ds);
  const record = await findModel(ds, modelId);
  const version = data.version ?? record.currentVersion;
  const row = await findVersion(ds, modelId, version);
  const modelJson = decodeText(row.modelData);
  const settings = (JSON.parse(modelJson) as Model).settings;
  const designCode: DesignCode = data.designCode ?? settings.designCode;
  const repo = ds.getRepository(RunEntity);
  const run = await repo.save(
    repo.create({
      modelId,
      version,
      designCode,
      settingsJson: JSON.stringify({ ...settings, designCode }),
      status: 'queued',
      phase: null,
      progress: 0,
      message: '',
      reviewStatus: 'draft',
      timingsJson: '{}',
      createdBy: userId,
    }),
  );
  dispatch(ds, run.id, modelJson, designCode, queueUrl() ? undefined : await gridOfRun(ds, run, settings.units));
  return toRunSummary(run, await userNames(ds, [userId]));
}

/**
 * What a failed run tells the user. Engine, reader and stability messages name nodes,
 * members and loadings ("combination ULS-3 is not stable at this load level: αcr = 0.83") and
 * are shown as they are; anything that names our files or looks like a programming error is
 * internal and only logged.
 */
export function runFailureText(err: unknown): { text: string; internal: boolean } {
  const raw = (err instanceof Error ? err.message : String(err)).trim();
  const internal = raw === '' || /\.(ts|js|mjs)\b|Cannot find module|is not a function|undefined|Cannot read properties|\n\s+at /.test(raw);
  return { text: internal ? 'an internal error stopped the analysis (the server log has the details)' : raw, internal };
}

/**
 * What the run's worker needs to build the grid's payload with the results (RunTask.grid):
 * the previous done run of the model now, and its members. Should another run finish first
 * and become the previous one, the payload built here is simply not the one asked for.
 */
async function gridOfRun(ds: DataSource, run: RunRecord, units: 'metric' | 'us' | undefined): Promise<NonNullable<RunTask['grid']>> {
  const prev = await previousDone(ds, run, ['membersData']);
  return {
    meta: { runId: run.id, previousRunId: prev?.run.id ?? null, units: units ?? 'metric', designCode: run.designCode },
    ...(prev ? { previousData: prev.result.membersData } : {}),
  };
}

/** The cache key of a run's grid payload (payload-cache.ts): it changes with nothing but the previous done run. */
const gridKey = (runId: number, previousRunId: number | null, layout: MembersLayout, gzip: boolean) =>
  `${runId}|${previousRunId ?? '-'}|${layout}|${gzip ? 'gzip' : 'plain'}`;

function dispatch(ds: DataSource, runId: number, modelJson: string, designCode: DesignCode, grid?: RunTask['grid']): void {
  const logger = loggers.get(ds);
  const url = queueUrl();
  if (url) {
    // scaled mode: a worker process analyses it and writes its row (server/queue/run-job.ts)
    enqueueRun(url, runId).catch(async (err: unknown) => {
      logger?.error(`run ${runId} could not be queued`, err);
      await ds
        .getRepository(RunEntity)
        .update({ id: runId, status: 'queued' }, { status: 'failed', message: 'The run failed: the job queue could not be reached; start the run again', finishedAt: new Date() })
        .catch(() => undefined);
    });
    return;
  }
  // writes about one run happen in order, one after the other
  let chain: Promise<unknown> = Promise.resolve();
  const write = (patch: Partial<RunRecord>) => {
    chain = chain.then(() => ds.getRepository(RunEntity).update({ id: runId }, patch)).catch(() => undefined);
    return chain;
  };
  const done = runPool()
    .run(
      { kind: 'run', runId, modelJson, designCode, ...(grid ? { grid } : {}) },
      {
        onStart: () => void write({ status: 'running', startedAt: new Date(), phase: 'reading', progress: PHASE_PROGRESS.reading }),
        onPhase: (phase) => void write({ phase, progress: PHASE_PROGRESS[phase] }),
      },
    )
    .then(async (output) => {
      await chain;
      // the grid's payload came with the results: whoever opens the grid first gets it as it is
      if (output.gridTable && grid) gridPayloads(ds).put(gridKey(runId, grid.meta.previousRunId, 'table', true), output.gridTable);
      await saveResults(ds, runId, output);
    })
    .catch(async (err: unknown) => {
      await chain;
      const { text, internal } = runFailureText(err);
      if (internal) logger?.error(`run ${runId} failed`, err);
      await ds
        .getRepository(RunEntity)
        .update({ id: runId }, { status: 'failed', message: `The run failed: ${text}`, finishedAt: new Date() })
        .catch(() => undefined);
    })
    .finally(() => active.delete(runId));
  active.set(runId, done);
}

const blobOrNull = (b: Uint8Array) => (b.byteLength > 0 ? Buffer.from(b.buffer, b.byteOffset, b.byteLength) : null);

export async function saveResults(ds: DataSource, runId: number, out: PackedRun): Promise<void> {
  const t0 = performance.now();
  const result: RunResultRecord = {
    runId,
    membersData: Buffer.from(out.membersData.buffer, out.membersData.byteOffset, out.membersData.byteLength),
    recordsData: Buffer.from(out.recordsData.buffer, out.recordsData.byteOffset, out.recordsData.byteLength),
    loadingsJson: JSON.stringify(out.loadings),
    nodeData: Buffer.from(out.nodeData.buffer, out.nodeData.byteOffset, out.nodeData.byteLength),
    nodeCount: out.nodeCount,
    shapesData: blobOrNull(out.shapesData),
    analysedModelData: blobOrNull(out.analysedModelData),
  };
  const counts = out.counts;
  await ds.transaction(async (m) => {
    await m.getRepository(RunResultEntity).insert(result);
    await saveParts(m, runId, out.parts);
    const timings = { ...out.timings, saving: performance.now() - t0 };
    await m.getRepository(RunEntity).update(
      { id: runId },
      {
        status: 'done',
        phase: 'saving',
        progress: 1,
        message: counts.fail > 0 ? `${counts.fail} member${counts.fail === 1 ? '' : 's'} over capacity` : '',
        maxRatio: out.maxRatio,
        passCount: counts.pass,
        failCount: counts.fail,
        notCheckedCount: counts.notChecked,
        timingsJson: JSON.stringify(timings),
        diagnosticsJson: JSON.stringify(out.diagnostics),
        stabilityJson: out.stabilityJson,
        finishedAt: new Date(),
      },
    );
  });
}

/* ---------- reading results ---------- */

export interface RunData {
  run: RunRecord;
  result: RunResultRecord;
}

/**
 * A finished run and its stored results; `columns` limits what is read of run_results (the
 * member page needs only the loadings, not the whole run's blobs).
 */
export async function doneRun(ds: DataSource, id: number, columns?: (keyof RunResultRecord)[]): Promise<RunData> {
  const run = await findRun(ds, id);
  if (run.status !== 'done') {
    const why = run.status === 'failed' ? `it failed: ${run.message}` : `it is ${run.status}`;
    throw new AppError(409, 'conflict', `Run ${id} has no results because ${why}`);
  }
  const result = columns
    ? await ds.getRepository(RunResultEntity).findOne({ where: { runId: id }, select: selectOf(columns) })
    : await ds.getRepository(RunResultEntity).findOneBy({ runId: id });
  if (!result) throw new AppError(409, 'conflict', `Run ${id} has no stored results`);
  return { run, result };
}

export function membersOf(result: RunResultRecord): MemberUtilisation[] {
  return decodeJson<MemberUtilisation[]>(result.membersData);
}

/** The stored check records, or null when the run had too many to keep (recompute them). */
export function recordsOf(result: RunResultRecord): CheckRecord[] | null {
  return decodeJson<CheckRecord[] | null>(result.recordsData);
}

export function loadingsOf(result: RunResultRecord): LoadingInfo[] {
  return JSON.parse(result.loadingsJson) as LoadingInfo[];
}

export async function runModel(ds: DataSource, run: RunRecord): Promise<{ model: Model; json: string }> {
  const row = await findVersion(ds, run.modelId, run.version);
  const json = decodeText(row.modelData);
  const model = JSON.parse(json) as Model;
  model.settings = { ...model.settings, designCode: run.designCode };
  return { model, json };
}

/** A TypeORM select of run_results: the run id and the columns given. */
function selectOf(columns: (keyof RunResultRecord)[]): FindOptionsSelect<RunResultRecord> {
  return Object.fromEntries(['runId', ...columns].map((c) => [c, true])) as FindOptionsSelect<RunResultRecord>;
}

async function previousDone(ds: DataSource, run: RunRecord, columns?: (keyof RunResultRecord)[]): Promise<RunData | null> {
  const prev = await ds
    .getRepository(RunEntity)
    .createQueryBuilder('r')
    .where('r.modelId = :m AND r.id < :id AND r.status = :s', { m: run.modelId, id: run.id, s: 'done' })
    .orderBy('r.id', 'DESC')
    .getOne();
  if (!prev) return null;
  // no columns wanted: the run alone (a done run has its results row)
  if (columns?.length === 0) return { run: prev, result: { runId: prev.id } as RunResultRecord };
  const result = columns
    ? await ds.getRepository(RunResultEntity).findOne({ where: { runId: prev.id }, select: selectOf(columns) })
    : await ds.getRepository(RunResultEntity).findOneBy({ runId: prev.id });
  return result ? { run: prev, result } : null;
}

/**
 * The grid's payload as JSON bytes, built in a worker from the stored blobs (this thread
 * neither unzips nor parses them): rows, or column by column with `layout: 'table'`.
 */
export async function getRunMembers(ds: DataSource, id: number, layout: MembersLayout = 'rows', gzip = false): Promise<Uint8Array> {
  const { run } = await doneRun(ds, id, []);
  const prevRun = await previousDone(ds, run, []);
  const key = gridKey(run.id, prevRun?.run.id ?? null, layout, gzip);
  return gridPayloads(ds).get(key, async () => {
    const { result } = await doneRun(ds, id, ['membersData']);
    const prev = prevRun ? await ds.getRepository(RunResultEntity).findOne({ where: { runId: prevRun.run.id }, select: selectOf(['membersData']) }) : null;
    const settings = JSON.parse(run.settingsJson) as { units?: 'metric' | 'us' };
    return resultsPool().run({
      kind: 'members',
      runId: run.id,
      meta: { runId: run.id, previousRunId: prevRun?.run.id ?? null, units: settings.units ?? 'metric', designCode: run.designCode },
      layout,
      gzip,
      membersData: result.membersData,
      ...(prev ? { previousData: prev.membersData } : {}),
    });
  });
}

/** A loading's key in `?loading=`: its id, with `@max` / `@min` for a moving-load envelope. */
export function loadingKey(l: LoadingInfo): string {
  return l.envelope ? `${l.id}@${l.envelope}` : l.id;
}

function loadingIndex(loadings: LoadingInfo[], wanted: string | undefined, fallback: number): number {
  if (wanted === undefined || wanted === '') return fallback;
  let i = loadings.findIndex((l) => loadingKey(l) === wanted);
  if (i < 0) i = loadings.findIndex((l) => l.id === wanted);
  if (i < 0) throw badRequest(`loading: "${wanted}" is neither a load case nor a combination of this run`);
  return i;
}

/**
 * One member's result: its stored row (one row read), or for runs saved before rows were kept,
 * from the whole-run blob and the model.
 */
async function memberResultOf(ds: DataSource, run: RunRecord, result: RunResultRecord, memberId: string): Promise<StoredMemberResult | undefined> {
  const stored = await storedMember(ds, run.id, memberId);
  if (stored !== null) return stored;
  const { model } = await runModel(ds, run);
  const index = model.members.findIndex((m) => m.id === memberId);
  const whole = result.membersData ? result : (await doneRun(ds, run.id)).result;
  const util = membersOf(whole).find((m) => m.member === memberId);
  if (index < 0 || !util) return undefined;
  const m = model.members[index];
  return { index, start: m.start, end: m.end, type: m.type, util };
}

/** The previous done run's row of one member (for the change columns). */
async function previousMember(ds: DataSource, run: RunRecord, memberId: string): Promise<MemberUtilisation | undefined> {
  const prev = await previousDone(ds, run, []);
  if (!prev) return undefined;
  const stored = await storedMember(ds, prev.run.id, memberId);
  if (stored !== null) return stored?.util;
  return membersOf((await doneRun(ds, prev.run.id)).result).find((m) => m.member === memberId);
}

/**
 * A member task on the worker holding the run's analysis. When a thread of this server holds
 * it the task goes without the model (neither read from the database nor copied to the
 * thread, 2 MB at 110k members); should another thread take it, it answers MODEL_NEEDED and
 * the task goes again with the stored blob, which a worker unzips only when it must analyse.
 */
async function memberTask(ds: DataSource, run: RunRecord, task: MemberTask): Promise<MemberTaskResult> {
  const pool = runPool();
  if (pool instanceof WorkerPool && pool.holds(run.id)) {
    try {
      return await pool.run(task);
    } catch (err) {
      if (!(err instanceof Error) || err.message !== MODEL_NEEDED) throw err;
    }
  }
  const version = await findVersion(ds, run.modelId, run.version);
  return pool.run({ ...task, modelData: version.modelData });
}

export async function getMemberDetail(ds: DataSource, id: number, memberId: string, loading?: string): Promise<MemberDetail> {
  const { run, result } = await doneRun(ds, id, ['loadingsJson']);
  const stored = await memberResultOf(ds, run, result, memberId);
  if (!stored) throw notFound(`Member ${memberId} not found in run ${id}`);
  const { util, index } = stored;
  const loadings = loadingsOf(result);
  // a moving-load combination appears twice (max and min envelope): take the one that governed
  const governing = loadings.findIndex((l) => l.id === util.combination && l.kind === 'combination' && (!util.envelope || !l.envelope || l.envelope === util.envelope));
  const firstCombo = loadings.findIndex((l) => l.kind === 'combination');
  const chosen = loadingIndex(loadings, loading, governing >= 0 ? governing : Math.max(0, firstCombo));
  const task: MemberTask = { kind: 'member', runId: run.id, designCode: run.designCode, member: index, loading: chosen, governing, stability: stabilityOf(run) };
  const detail = await memberTask(ds, run, task);
  const before = await previousMember(ds, run, memberId);
  const [row] = memberRows([util], before ? new Map([[memberId, { ratio: before.ratio, section: before.section }]]) : undefined);
  const settings = JSON.parse(run.settingsJson) as { units?: 'metric' | 'us' };
  return {
    runId: run.id,
    units: settings.units ?? 'metric',
    row,
    start: stored.start,
    end: stored.end,
    type: stored.type,
    loadings,
    loading: loadings[chosen] ? loadingKey(loadings[chosen]) : '',
    governing: governing >= 0 ? loadingKey(loadings[governing]) : '',
    stations: detail.stations,
    governingRecords: detail.governingRecords as MemberDetail['governingRecords'],
    loadingRecords: detail.loadingRecords as MemberDetail['loadingRecords'],
    ...(detail.moving ? { moving: detail.moving } : {}),
    ...analysisOf(run),
  };
}

/** The analysis method in words, for export headers (runs from before the summary were first order). */
export function runMethod(run: RunRecord): string {
  return stabilityOf(run)?.method ?? 'first-order elastic';
}

/** The analysis order and method of a run (from its stability summary, else its settings). */
function analysisOf(run: RunRecord): Pick<MemberDetail, 'analysis' | 'method'> {
  const s = stabilityOf(run);
  if (s) return { analysis: s.analysis, method: s.method };
  const settings = JSON.parse(run.settingsJson) as { analysis?: 'first_order' | 'second_order' };
  return settings.analysis ? { analysis: settings.analysis } : {};
}

/** Every kept shape as floats (gzip Float64 block of run_results.shapesData), unzipped off the event loop. */
async function shapesBlock(result: RunResultRecord): Promise<Float64Array> {
  if (!result.shapesData || result.shapesData.byteLength === 0) return new Float64Array(0);
  const bytes = await gunzipAsync(result.shapesData);
  return new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
}

/** One natural mode shape or buckled shape of a run, for the picture. */
export async function getRunShape(ds: DataSource, id: number, kind: string | undefined, index: string | undefined, loading?: string): Promise<RunShape> {
  if (kind !== 'mode' && kind !== 'buckling') throw badRequest('kind: choose mode (natural modes) or buckling (buckled shapes)');
  const i = Number(index ?? '1');
  if (!Number.isInteger(i) || i < 1) throw badRequest(`index: "${index}" is not a mode number (1, 2, …)`);
  const { run, result } = await doneRun(ds, id);
  const stability = stabilityOf(run);
  if (!stability) throw badRequest(`Run ${id} kept no stability results; run the model again`);
  try {
    return { runId: run.id, ...shapeFromBlock(stability, await shapesBlock(result), result.nodeCount, kind as ShapeKind, i, loading || undefined) };
  } catch (err) {
    throw notFound((err as Error).message);
  }
}

/** The picture of one loading, built in a results worker from the stored blobs and that loading's row. */
export async function getRunGeometry(ds: DataSource, id: number, loading?: string): Promise<Uint8Array> {
  const { run, result } = await doneRun(ds, id);
  const loadings = loadingsOf(result);
  const firstCombo = loadings.findIndex((l) => l.kind === 'combination');
  const chosen = loadingIndex(loadings, loading, Math.max(0, firstCombo));
  const part = await ds.getRepository(RunLoadingResultEntity).findOneBy({ runId: run.id, loadingIndex: chosen });
  const modelData = result.analysedModelData && result.analysedModelData.byteLength > 0
    ? result.analysedModelData
    : (await findVersion(ds, run.modelId, run.version)).modelData;
  return resultsPool().run({
    kind: 'geometry',
    runId: run.id,
    modelData,
    loadings,
    loadingIndex: chosen,
    nodeBlock: part ? part.nodeData : result.nodeData,
    offset: part ? 0 : chosen * result.nodeCount * 6,
    nodeCount: result.nodeCount,
    membersData: result.membersData,
  });
}

/** Two runs of one model side by side, compared in a results worker. */
export async function compareRuns(ds: DataSource, a: number, b: number): Promise<Uint8Array> {
  const A = await doneRun(ds, a);
  const B = await doneRun(ds, b);
  if (A.run.modelId !== B.run.modelId) throw badRequest(`Runs ${a} and ${b} belong to different models`);
  const names = await userNames(ds, [A.run.createdBy, B.run.createdBy]);
  return resultsPool().run({
    kind: 'compare',
    runId: A.run.id,
    a: toRunSummary(A.run, names),
    b: toRunSummary(B.run, names),
    aData: A.result.membersData,
    bData: B.result.membersData,
  });
}
