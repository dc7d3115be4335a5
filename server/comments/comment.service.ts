/** Comments on a run or on one member of it. */
import type { DataSource } from 'typeorm';
import { In } from 'typeorm';
import { newCommentSchema, type Comment, type NewCommentInput } from '../../shared/schemas/comments.js';
import { UserEntity } from '../users/user.entity.js';
import type { UserRecord } from '../users/user.entity.js';
import { CommentEntity, type CommentRecord } from './comment.entity.js';

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
  const repo = ds.getRepository(CommentEntity);
  const saved = await repo.save(repo.create({ runId, member: data.member ?? null, body: data.body, userId: user.id }));
  return (await toComments(ds, [saved]))[0]!;
}
