/**
 * The worker side of an export: build the table from what the run kept (or, for member
 * forces and recomputed checks, from the analysis the worker holds) and write it as CSV or
 * XLSX in chunks that the worker posts to the HTTP thread, which only pipes them to the client.
 */
import { Writable } from 'node:stream';
import { gunzipSync } from 'node:zlib';
import type { CheckRecord, MemberUtilisation } from '../../shared/design/types.js';
import { csvChunks, type ResultTable } from '../../shared/exports/index.js';
import type { DesignCode, Model } from '../../shared/model/types.js';
import type { ExportFormat, LoadingInfo, RunStability } from '../../shared/schemas/runs.js';
import { checksExport, displacementsExport, reactionsExport, storedNodeResults, storedNoiseFloor, utilisationExport } from './tables.js';
import { settingLines } from '../../shared/reader/settings-summary.js';
import { cleanTableNoise } from './noise.js';
import { writeXlsx, type HeaderBlock } from './xlsx.js';

/** Which table an export writes. */
export type ExportTable = 'utilisation' | 'checks' | 'displacements' | 'reactions' | 'forces' | 'stability' | 'modes';

export interface ExportTask {
  kind: 'export';
  runId: number;
  designCode: DesignCode;
  table: ExportTable;
  format: ExportFormat;
  /** the model version the run analysed (gzip JSON, as stored) */
  modelData: Uint8Array;
  /** run_results blobs as stored (gzip) */
  membersData?: Uint8Array;
  recordsData?: Uint8Array;
  /** the run's stability summary (a worker analysing again takes the first-order warning from it) */
  stability?: RunStability | null;
  /** runs before per-loading rows: gzip(Float64 displacements then reactions, loading-major) */
  nodeData?: Uint8Array;
  /** gzip(Float64 displacements then reactions) of each loading, in loading order */
  nodeBlocks?: Uint8Array[];
  loadings: LoadingInfo[];
  /** loading indices to export (every loading when absent) */
  only?: number[];
  /** a table built on the HTTP thread because it is a few rows (stability, modes) */
  prebuilt?: ResultTable;
  /** the XLSX header block; `units` comes from the model */
  header: Omit<HeaderBlock, 'units'>;
}

export interface ExportTaskResult {
  rows: number;
  bytes: number;
}

const gunzipJson = <T>(b: Uint8Array): T => JSON.parse(gunzipSync(b).toString('utf8')) as T;

/** The model as the run saw it (its design code), from the stored blob. */
export function exportModel(task: ExportTask): { model: Model; json: string } {
  const json = gunzipSync(task.modelData).toString('utf8');
  const model = JSON.parse(json) as Model;
  model.settings = { ...model.settings, designCode: task.designCode };
  return { model, json };
}

function nodeArrays(task: ExportTask): { displacements: Float64Array; reactions: Float64Array } {
  if (task.nodeBlocks) {
    // one block per loading (displacements then reactions): back to loading-major arrays
    const parts = task.nodeBlocks.map((b) => {
      const bytes = gunzipSync(b);
      return new Float64Array(bytes.buffer, bytes.byteOffset, bytes.byteLength / 8);
    });
    const n = parts.length > 0 ? parts[0].length / 2 : 0;
    const displacements = new Float64Array(n * parts.length);
    const reactions = new Float64Array(n * parts.length);
    parts.forEach((p, l) => {
      displacements.set(p.subarray(0, n), l * n);
      reactions.set(p.subarray(n), l * n);
    });
    return { displacements, reactions };
  }
  const bytes = gunzipSync(task.nodeData!);
  const all = new Float64Array(bytes.buffer, bytes.byteOffset, bytes.byteLength / 8);
  const half = all.length / 2;
  return { displacements: all.subarray(0, half), reactions: all.subarray(half) };
}

/** The table from stored results, or null when it needs the analysis (forces, checks not kept). */
export function storedTable(task: ExportTask, model: Model): ResultTable | null {
  if (task.prebuilt) return task.prebuilt;
  switch (task.table) {
    case 'utilisation':
      return utilisationExport(model, gunzipJson<MemberUtilisation[]>(task.membersData!));
    case 'checks': {
      const records = gunzipJson<CheckRecord[] | null>(task.recordsData!);
      return records ? checksExport(model, records) : null;
    }
    case 'displacements': {
      const { displacements, reactions } = nodeArrays(task);
      return displacementsExport(model, storedNodeResults(model, task.loadings, displacements, reactions, task.only));
    }
    case 'reactions': {
      const { displacements, reactions } = nodeArrays(task);
      const view = storedNodeResults(model, task.loadings, displacements, reactions, task.only);
      return reactionsExport(model, view, storedNoiseFloor(model, task.loadings, displacements, reactions));
    }
    default:
      return null;
  }
}

/** Bytes gathered into pieces of about `size` before each is handed to `emit` (fewer messages between threads). */
export class ChunkSink extends Writable {
  private parts: Buffer[] = [];
  private held = 0;
  bytes = 0;
  constructor(private readonly deliver: (chunk: Uint8Array) => void, private readonly size = 256 * 1024) {
    super();
  }
  override _write(chunk: Buffer | string, _enc: BufferEncoding, cb: (err?: Error | null) => void): void {
    const b = typeof chunk === 'string' ? Buffer.from(chunk, 'utf8') : chunk;
    this.parts.push(b);
    this.held += b.byteLength;
    this.bytes += b.byteLength;
    if (this.held >= this.size) this.flushParts();
    cb();
  }
  override _final(cb: (err?: Error | null) => void): void {
    this.flushParts();
    cb();
  }
  private flushParts(): void {
    if (this.held === 0) return;
    // a fresh buffer of its own, so it can be transferred rather than copied
    const out = new Uint8Array(this.held);
    let at = 0;
    for (const p of this.parts) {
      out.set(p, at);
      at += p.byteLength;
    }
    this.parts = [];
    this.held = 0;
    this.deliver(out);
  }
}

/**
 * The settings lines of the header block: those that apply to the run's code, less the ones
 * the block names on its own rows (title, design code, units, analysis).
 */
export function exportSettingLines(model: Model): [string, string][] {
  const own = new Set(['title', 'design_code', 'units', 'analysis']);
  return settingLines(model.settings).filter((l) => !own.has(l.key)).map((l) => [l.label, l.value]);
}

/** Writes the table as the task's format into chunks (noise written as 0, ./noise.ts); resolves when the last one was emitted. */
export async function streamTable(table: ResultTable, task: ExportTask, model: Model, emit: (chunk: Uint8Array) => void): Promise<ExportTaskResult> {
  cleanTableNoise(table);
  const sink = new ChunkSink(emit);
  const finished = new Promise<void>((resolve, reject) => {
    sink.on('finish', resolve);
    sink.on('error', reject);
  });
  if (task.format === 'csv') {
    for (const piece of csvChunks(table)) sink.write(piece);
    sink.end();
  } else {
    await writeXlsx(table, { ...task.header, units: model.settings.units, settings: exportSettingLines(model) }, sink);
  }
  await finished;
  return { rows: table.rows.length, bytes: sink.bytes };
}
