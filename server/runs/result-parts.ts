/**
 * Run results in parts: what a worker packs per member and per loading, how the parts are
 * written (in the run's results transaction, in chunks of rows), and how one part is read.
 * Runs saved before the parts existed have none; readers then fall back to the whole-run blobs
 * of run_results (`null` from the readers below).
 */
import { gunzip, gzipSync } from 'node:zlib';
import { promisify } from 'node:util';
import type { DataSource, EntityManager } from 'typeorm';
import type { MemberUtilisation } from '../../shared/design/types.js';
import type { MemberType, Model } from '../../shared/model/types.js';
import { RunLoadingResultEntity, RunMemberResultEntity } from './result-parts.entity.js';

const gunzipAsync = promisify(gunzip);

/** One member's stored result: its grid row and what the member page needs of the model. */
export interface StoredMemberResult {
  index: number;
  start: string;
  end: string;
  type: MemberType;
  util: MemberUtilisation;
}

/** The parts as a worker hands them back (strings and bytes: a cheap structured clone). */
export interface PackedParts {
  memberIds: string[];
  /** JSON of StoredMemberResult, one per member in model order */
  memberRows: string[];
  /** gzip(Float64 displacements then reactions of one loading), one per loading */
  loadingRows: Uint8Array[];
}

export function packParts(
  model: Pick<Model, 'members'>,
  members: MemberUtilisation[],
  displacements: Float64Array,
  reactions: Float64Array,
  nodeCount: number,
  loadingCount: number,
): PackedParts {
  const memberIds: string[] = new Array(members.length);
  const memberRows: string[] = new Array(members.length);
  for (let i = 0; i < members.length; i++) {
    const m = model.members[i];
    memberIds[i] = members[i].member;
    memberRows[i] = JSON.stringify({ index: i, start: m.start, end: m.end, type: m.type, util: members[i] } satisfies StoredMemberResult);
  }
  const n = nodeCount * 6;
  const loadingRows: Uint8Array[] = [];
  for (let l = 0; l < loadingCount; l++) {
    const both = new Float64Array(2 * n);
    both.set(displacements.subarray(l * n, (l + 1) * n), 0);
    both.set(reactions.subarray(l * n, (l + 1) * n), n);
    loadingRows.push(new Uint8Array(gzipSync(Buffer.from(both.buffer), { level: 1 })));
  }
  return { memberIds, memberRows, loadingRows };
}

/** Rows per INSERT (4 parameters each, well under every database's limit). */
const CHUNK = 500;

/** Writes the parts inside the caller's transaction (nothing half-written on failure). */
export async function saveParts(m: EntityManager, runId: number, parts: PackedParts): Promise<void> {
  const members = m.getRepository(RunMemberResultEntity);
  for (let i = 0; i < parts.memberRows.length; i += CHUNK) {
    const rows = [];
    for (let j = i; j < Math.min(i + CHUNK, parts.memberRows.length); j++) {
      rows.push({ runId, memberIndex: j, memberId: parts.memberIds[j], data: parts.memberRows[j] });
    }
    await members.insert(rows);
  }
  const loadings = m.getRepository(RunLoadingResultEntity);
  for (let l = 0; l < parts.loadingRows.length; l += 50) {
    await loadings.insert(
      parts.loadingRows.slice(l, l + 50).map((b, k) => ({ runId, loadingIndex: l + k, nodeData: Buffer.from(b.buffer, b.byteOffset, b.byteLength) })),
    );
  }
}

/** One member's stored result; undefined when the run has parts but not this member; null when the run has no parts. */
export async function storedMember(ds: DataSource, runId: number, memberId: string): Promise<StoredMemberResult | undefined | null> {
  const repo = ds.getRepository(RunMemberResultEntity);
  const row = await repo.findOne({ where: { runId, memberId }, select: { data: true } });
  if (row) return JSON.parse(row.data) as StoredMemberResult;
  const any = await repo.findOne({ where: { runId }, select: { memberIndex: true } });
  return any ? undefined : null;
}

/** One loading's node displacements and reactions (nNodes*6 each); null when the run has no parts. */
export async function storedLoadingNodes(ds: DataSource, runId: number, loadingIndex: number): Promise<{ displacements: Float64Array; reactions: Float64Array } | null> {
  const row = await ds.getRepository(RunLoadingResultEntity).findOneBy({ runId, loadingIndex });
  if (!row) return null;
  const bytes = await gunzipAsync(row.nodeData);
  const all = new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
  const half = all.length / 2;
  return { displacements: all.subarray(0, half), reactions: all.subarray(half) };
}

/** Every loading's gzip node block in loading order (exports); null when the run has no parts. */
export async function storedLoadingBlocks(ds: DataSource, runId: number): Promise<Uint8Array[] | null> {
  const rows = await ds.getRepository(RunLoadingResultEntity).find({ where: { runId }, order: { loadingIndex: 'ASC' } });
  return rows.length > 0 ? rows.map((r) => new Uint8Array(r.nodeData.buffer, r.nodeData.byteOffset, r.nodeData.byteLength)) : null;
}
