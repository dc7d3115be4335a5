/**
 * Reading tasks of the results workers that would otherwise parse a whole run on the HTTP
 * thread: the picture's geometry of one loading, and the comparison of two runs. Each gets the
 * stored gzip blobs as they are and hands back JSON bytes that the HTTP thread sends unread.
 */
import { gunzipSync } from 'node:zlib';
import type { MemberUtilisation } from '../../shared/design/types.js';
import type { Model } from '../../shared/model/types.js';
import { withModelDefaults } from '../../shared/model/defaults.js';
import { compareMembers } from '../../shared/results/compare.js';
import { runGeometry } from '../../shared/results/geometry.js';
import type { LoadingInfo, RunComparison } from '../../shared/schemas/runs.js';

export interface GeometryTask {
  kind: 'geometry';
  runId: number;
  /** gzip JSON of the model the analysis ran on */
  modelData: Uint8Array;
  loadings: LoadingInfo[];
  loadingIndex: number;
  /** gzip Float64 block holding the loading's displacements from `offset` (nNodes*6 values) */
  nodeBlock: Uint8Array;
  offset: number;
  nodeCount: number;
  /** run_results.membersData (gzip JSON MemberUtilisation[]) for the colours by ratio */
  membersData: Uint8Array;
}

export interface CompareTask {
  kind: 'compare';
  runId: number;
  a: RunComparison['a'];
  b: RunComparison['b'];
  aData: Uint8Array;
  bData: Uint8Array;
}

const json = (value: unknown) => new Uint8Array(Buffer.from(JSON.stringify(value), 'utf8'));
const gunzipJson = <T>(b: Uint8Array): T => JSON.parse(gunzipSync(b).toString('utf8')) as T;

export function geometryPayload(task: GeometryTask): Uint8Array {
  const model = withModelDefaults(gunzipJson<Model>(task.modelData));
  const bytes = gunzipSync(task.nodeBlock);
  const all = new Float64Array(bytes.buffer, bytes.byteOffset, bytes.byteLength / 8);
  const n = task.nodeCount * 6;
  const ratios = new Map(gunzipJson<MemberUtilisation[]>(task.membersData).map((m) => [m.member, { ratio: m.ratio, status: m.status }]));
  return json(runGeometry({
    runId: task.runId, model, loadings: task.loadings, loadingIndex: task.loadingIndex,
    displacements: all.subarray(task.offset, task.offset + n), ratios,
  }));
}

export function comparePayload(task: CompareTask): Uint8Array {
  return json({ a: task.a, b: task.b, rows: compareMembers(gunzipJson<MemberUtilisation[]>(task.aData), gunzipJson<MemberUtilisation[]>(task.bData)) } satisfies RunComparison);
}
