/** Comments on a run or on one member of it. */
import type { DataSource } from 'typeorm';
import { In } from 'typeorm';
import { newCommentSchema, type Comment, type NewCommentInput } from '../../shared/schemas/comments.js';
import { UserEntity } from '../users/user.entity.js';
import type { UserRecord } from '../users/user.entity.js';
import { CommentEntity, type CommentRecord } from './comment.entity.js';
import { notFound } from '../errors/app-error.js';
import { decodeModel } from '../models/model-codec.js';
import { ModelVersionEntity } from '../models/model.entity.js';
import { RunEntity } from '../runs/run.entity.js';
import { storedMember } from '../runs/result-parts.js';

/** Member ids of the last few model versions commented on (a version never changes). */
const memberIds = new Map<string, Set<string>>();

/** 404 unless the run's model version has this member. */
async function assertMemberOfRun(ds: DataSource, runId: number, member: string): Promise<void> {
  const run = await ds.getRepository(RunEntity).findOneBy({ id: runId });
  if (!run) throw notFound(`Run ${runId} not found`);
  // a finished run keeps one row per member: one row read answers it
  const stored = await storedMember(ds, runId, member);
  if (stored) return;
  if (stored === undefined) throw notFound(`Member ${member} not found in run ${runId}`);
  const key = `${run.modelId}/${run.version}`;
  let ids = memberIds.get(key);
  if (!ids) {
    const version = await ds.getRepository(ModelVersionEntity).findOneBy({ modelId: run.modelId, version: run.version });
    ids = new Set(version ? decodeModel(version.modelData).members.map((m) => m.id) : []);
    memberIds.set(key, ids);
    if (memberIds.size > 4) memberIds.delete(memberIds.keys().next().value!);
  }
  if (!ids.has(member)) throw notFound(`Member ${member} not found in run ${runId}`);
}

async function toComments(ds: DataSource, rows: CommentRecord[]): Promise<Comment[]> {
  const ids = [...new Set(rows.map((r) => r.userId).filter((x): x is number => x !== null))];
  const users = ids.length ? await ds.getRepository(UserEntity).findBy({ id: In(ids) }) : [];
  const names = new Map(users.map((u) => [u.id, u.name]));
  return rows.map((r) => ({
    id: r.id,
    runId: r.runId,
    member: r.member,
    body: r.body,
    userId: r.userId,
    userName: r.userId !== null ? (names.get(r.userId) ?? null) : null,
    createdAt: r.createdAt.toISOString(),
  }));
}

/** Oldest first; `member` narrows to one member's thread ('' = comments on the whole run). */
export async function listComments(ds: DataSource, runId: number, member?: string): Promise<Comment[]> {
  const qb = ds.getRepository(CommentEntity).createQueryBuilder('c').where('c.runId = :runId', { runId });
  if (member === '') qb.andWhere('c.member IS NULL');
  else if (member !== undefined) qb.andWhere('c.member = :member', { member });
  return toComments(ds, await qb.orderBy('c.id', 'ASC').getMany());
}

export async function addComment(ds: DataSource, user: UserRecord, runId: number, input: NewCommentInput): Promise<Comment> {
  const data = newCommentSchema.parse(input);
  if (data.member) await assertMemberOfRun(ds, runId, data.member);
  const repo = ds.getRepository(CommentEntity);
  const saved = await repo.save(repo.create({ runId, member: data.member ?? null, body: data.body, userId: user.id }));
  return (await toComments(ds, [saved]))[0]!;
}
