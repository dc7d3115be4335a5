/** What a worker does for each task; kept apart from the thread plumbing so tests can call it. */
import { gunzipSync } from 'node:zlib';
import { memberMovingDetail } from '../../shared/moving/detail.js';
import type { AnalysisResult, StationForces } from '../../shared/engine/types.js';
import { checksTable, memberForceTable } from '../../shared/exports/results.js';
import type { Model } from '../../shared/model/types.js';
import type { RunPhase, Stations } from '../../shared/schemas/runs.js';
import { analyseOnly, checkMemberWithStability, checkWithStability, computeRun, packRun, type Analysed } from './run-compute.js';
import { MODEL_NEEDED, type ChecksTask, type ForcesTask, type ForcesTaskResult, type MemberTask, type MemberTaskResult, type ReadTask, type WorkerTask } from './worker-protocol.js';
import type { ReadResult } from '../../shared/model/types.js';
import { membersPayload, payloadOf, previousMembers } from './members-table.js';
import { comparePayload, geometryPayload } from './read-tasks.js';
import { exportModel, storedTable, streamTable, type ExportTask, type ExportTaskResult } from '../exports/export-task.js';
import { readCsvBytes, readWorkbook } from '../../shared/reader/index.js';
import { clean, denoise, NOISE_RELATIVE, noiseFloor } from '../../shared/design/noise.js';
import { runSuggestTask } from '../suggestions/suggest-task.js';
import { forgetPatterns } from '../../shared/engine/solverBridge.js';

/** Analyses kept per worker, newest last. */
const CACHE_SIZE = 2;
const cache = new Map<number, Analysed>();

/**
 * Solver analyses kept between tasks (shared/engine/solverBridge.ts) serve a rerun of the same
 * pattern; past this many factor entries (160 MB) they are let go after the task instead —
 * at 110k members the factor and its pattern analyses would otherwise stay in this thread
 * for as long as it lives, and a rerun of such a model repeats only its ordering.
 */
export const KEEP_PATTERNS_UP_TO = 20_000_000;

function remember(runId: number, analysed: Analysed): void {
  cache.delete(runId);
  cache.set(runId, analysed);
  while (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value as number);
  if (analysed.analysis.diagnostics.nnzFactor > KEEP_PATTERNS_UP_TO) forgetPatterns();
}

/** The model JSON of a task: given as text, or as the stored gzip blob (unzipped only when needed). */
function taskModelJson(task: Pick<MemberTask, 'modelJson' | 'modelData'>): string {
  if (task.modelJson !== undefined) return task.modelJson;
  if (task.modelData) return gunzipSync(task.modelData).toString('utf8');
  throw new Error(MODEL_NEEDED);
}

function analysedFor(task: Pick<MemberTask, 'runId' | 'modelJson' | 'modelData' | 'designCode' | 'stability'>): Analysed {
  const kept = cache.get(task.runId);
  if (kept) {
    remember(task.runId, kept);
    return kept;
  }
  const analysed = analyseOnly(taskModelJson(task), task.designCode, task.stability);
  remember(task.runId, analysed);
  return analysed;
}

export function stationsJson(s: StationForces): Stations {
  return {
    x: Array.from(s.x),
    N: Array.from(s.N),
    V_major: Array.from(s.V_major),
    V_minor: Array.from(s.V_minor),
    T: Array.from(s.T),
    M_major: Array.from(s.M_major),
    M_minor: Array.from(s.M_minor),
    d_major: Array.from(s.d_major),
    d_minor: Array.from(s.d_minor),
  };
}

/** The largest node translation of each loading, per analysis (a member page costs its member, not the model). */
const largestTranslations = new WeakMap<AnalysisResult, Map<number, number>>();
function largestTranslation(analysis: AnalysisResult, loading: number): number {
  let byLoading = largestTranslations.get(analysis);
  if (!byLoading) largestTranslations.set(analysis, (byLoading = new Map()));
  let largest = byLoading.get(loading);
  if (largest === undefined) {
    const u = analysis.displacements(loading);
    largest = 0;
    for (let i = 0; i < u.length; i += 6) largest = Math.max(largest, Math.hypot(u[i], u[i + 1], u[i + 2]) || 0);
    byLoading.set(loading, largest);
  }
  return largest;
}

/**
 * One member's diagrams with numerical noise as zero (shared/design/noise.ts): forces and
 * moments against the floor the exports use (every loading of the run); deflections against
 * NOISE_RELATIVE of the loading's largest node translation.
 */
export function memberStations(model: Model, analysis: AnalysisResult, member: number, loading: number): Stations {
  const out = stationsJson(denoise(analysis.memberForces(member, loading), noiseFloor(model, analysis)));
  const floor = NOISE_RELATIVE * largestTranslation(analysis, loading);
  out.d_major = out.d_major.map((v) => clean(v, floor));
  out.d_minor = out.d_minor.map((v) => clean(v, floor));
  return out;
}

/** The member-forces table for some loadings, through a view of the analysis limited to them. */
function memberForces(model: Model, analysis: AnalysisResult, loadings: number[]): ForcesTaskResult {
  const view = Object.create(analysis) as AnalysisResult;
  Object.defineProperty(view, 'loadings', { value: loadings.map((l) => analysis.loadings[l]) });
  Object.defineProperty(view, 'memberForces', { value: (m: number, l: number) => analysis.memberForces(m, loadings[l]) });
  return memberForceTable(model, view);
}

export function runWorkerTask(task: WorkerTask, onPhase: (phase: RunPhase) => void, onChunk: (chunk: Uint8Array) => void = () => {}): unknown {
  if (task.kind === 'read') return readFiles(task);
  if (task.kind === 'export') return exportFile(task, onChunk);
  if (task.kind === 'members') return membersPayload(task);
  if (task.kind === 'suggest') return runSuggestTask(task, analysedFor);
  if (task.kind === 'geometry') return geometryPayload(task);
  if (task.kind === 'compare') return comparePayload(task);
  switch (task.kind) {
    case 'run': {
      const { output, analysed } = computeRun(taskModelJson(task), task.designCode, onPhase);
      remember(task.runId, analysed);
      const packed = packRun(output, analysed.model);
      if (task.grid) {
        const t0 = performance.now();
        packed.gridTable = payloadOf(task.grid.meta, output.members, previousMembers(task.grid.previousData), 'table', true);
        packed.timings.packing = (packed.timings.packing ?? 0) + (performance.now() - t0);
      }
      return packed;
    }
    case 'member': {
      const { model, analysis, stability } = analysedFor(task);
      const result: MemberTaskResult = {
        stations: memberStations(model, analysis, task.member, task.loading),
        governingRecords: task.governing >= 0 ? checkMemberWithStability(model, analysis, task.member, task.governing, stability) : [],
        loadingRecords:
          analysis.loadings[task.loading]?.kind === 'combination' ? checkMemberWithStability(model, analysis, task.member, task.loading, stability) : [],
        ...(analysis.moving ? {
          moving: memberMovingDetail(analysis, task.member, model.members[task.member].type === 'truss',
            model.movingLoads.map((ml, j) => ({ movingLoad: j, vehicle: ml.vehicle, lane: ml.lane }))),
        } : {}),
      };
      return result;
    }
    case 'checks': {
      const { model, analysis, stability } = analysedFor(task);
      return checksTable(model, checkWithStability(model, analysis, stability));
    }
    case 'forces': {
      const { model, analysis } = analysedFor(task);
      return memberForces(model, analysis, task.loadings);
    }
  }
}

/** An export built in this thread and streamed out in chunks (server/exports/export-task.ts). */
export async function exportFile(task: ExportTask, onChunk: (chunk: Uint8Array) => void): Promise<ExportTaskResult> {
  const { model, json } = exportModel(task);
  let table = storedTable(task, model);
  if (!table) {
    const { model: analysedModel, analysis, stability } = analysedFor({ runId: task.runId, modelJson: json, designCode: task.designCode, stability: task.stability });
    table = task.table === 'forces'
      ? memberForces(analysedModel, analysis, task.only ?? analysis.loadings.map((_, i) => i))
      : checksTable(analysedModel, checkWithStability(analysedModel, analysis, stability));
  }
  return streamTable(table, task, model, onChunk);
}

/** An upload through the shared reader (one workbook, or CSV files). */
export async function readFiles(task: ReadTask): Promise<ReadResult> {
  if (task.format === 'xlsx') return readWorkbook(task.files[0].data, { limits: task.limits });
  return readCsvBytes(task.files);
}

/** Buffers to move rather than copy back to the HTTP thread. */
export function transferList(result: unknown): ArrayBuffer[] {
  const out: ArrayBuffer[] = [];
  if (result instanceof Uint8Array && result.byteOffset === 0 && result.byteLength === result.buffer.byteLength) return [result.buffer as ArrayBuffer];
  if (result && typeof result === 'object') {
    const parts = (result as { parts?: { loadingRows?: unknown } }).parts;
    if (parts && Array.isArray(parts.loadingRows)) {
      for (const b of parts.loadingRows as Uint8Array[]) if (b.byteOffset === 0 && b.byteLength === b.buffer.byteLength) out.push(b.buffer as ArrayBuffer);
    }
    for (const v of Object.values(result)) {
      if ((v instanceof Float64Array || v instanceof Int32Array || v instanceof Uint8Array) && v.byteOffset === 0 && v.byteLength === v.buffer.byteLength) {
        out.push(v.buffer as ArrayBuffer);
      }
    }
  }
  return out;
}
