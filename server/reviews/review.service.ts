/**
 * The review workflow of a run (shared/schemas/reviews.ts):
 *
 *   draft ──submit──▶ submitted ──approve──▶ approved (final; locks the model version)
 *   returned ──submit──▶ submitted ──return──▶ returned
 *
 * submit: engineer or above on the project, run finished (`done`), with a message.
 * return: lead or above, with a message.  approve: lead or above, not the submitter
 * (an admin may approve their own). Any other move is 409 naming the current state.
 */
import type { DataSource } from 'typeorm';
import { In } from 'typeorm';
import { approveSchema, reviewMessageSchema, type ReviewAction, type ReviewEvent, type RunReview } from '../../shared/schemas/reviews.js';
import type { ReviewStatus } from '../../shared/schemas/runs.js';
import { hasRoleAtLeast, type Role } from '../../shared/schemas/users.js';
import { conflict, forbidden } from '../errors/app-error.js';
import { ModelEntity } from '../models/model.entity.js';
import { ProjectEntity } from '../projects/project.entity.js';
import { RunEntity, type RunRecord } from '../runs/run.entity.js';
import { UserEntity, type UserRecord } from '../users/user.entity.js';
import { projectLeads } from '../membership/member.service.js';
import { runAccess } from '../membership/project-access.js';
import type { Mailer } from '../mail/mailer.js';
import { approvedMessage, returnedMessage, submittedMessage, type RunMailFacts } from '../mail/messages.js';
import { approvedRunOf } from './lock.js';
import { RunReviewEntity, type RunReviewRecord } from './review.entity.js';

interface Transition {
  from: readonly ReviewStatus[];
  to: ReviewStatus;
  minRole: Role;
}

export const TRANSITIONS: Record<ReviewAction, Transition> = {
  submit: { from: ['draft', 'returned'], to: 'submitted', minRole: 'engineer' },
  return: { from: ['submitted'], to: 'returned', minRole: 'lead' },
  approve: { from: ['submitted'], to: 'approved', minRole: 'lead' },
};

const VERB: Record<ReviewAction, string> = { submit: 'submitted', return: 'returned', approve: 'approved' };

async function lastSubmitter(ds: DataSource, runId: number): Promise<number | null> {
  const ev = await ds.getRepository(RunReviewEntity).findOne({ where: { runId, action: 'submit' }, order: { id: 'DESC' } });
  return ev?.userId ?? null;
}

/** Why `user` (with `role` on the project) may not take `action` now, or null when they may. */
export function refusal(action: ReviewAction, run: Pick<RunRecord, 'id' | 'status' | 'reviewStatus'>, user: Pick<UserRecord, 'id' | 'role'>, role: Role, submittedBy: number | null): { status: 403 | 409; message: string } | null {
  const t = TRANSITIONS[action];
  if (!hasRoleAtLeast(role, t.minRole)) return { status: 403, message: `Only a ${t.minRole} or above on this project can ${action} a run` };
  if (!t.from.includes(run.reviewStatus)) {
    return { status: 409, message: `Run ${run.id} is ${run.reviewStatus}; only a ${t.from.join(' or ')} run can be ${VERB[action]}` };
  }
  if (action === 'submit' && run.status !== 'done') return { status: 409, message: `Run ${run.id} is ${run.status}; only a finished run can be submitted` };
  if (action === 'approve' && submittedBy === user.id && user.role !== 'admin') {
    return { status: 403, message: 'You submitted this run; another lead must approve it' };
  }
  return null;
}

async function toEvents(ds: DataSource, rows: RunReviewRecord[]): Promise<ReviewEvent[]> {
  const ids = [...new Set(rows.map((r) => r.userId).filter((x): x is number => x !== null))];
  const users = ids.length ? await ds.getRepository(UserEntity).findBy({ id: In(ids) }) : [];
  const names = new Map(users.map((u) => [u.id, u.name]));
  return rows.map((r) => ({
    id: r.id,
    action: r.action,
    fromStatus: r.fromStatus,
    toStatus: r.toStatus,
    message: r.message,
    userId: r.userId,
    userName: r.userId !== null ? (names.get(r.userId) ?? null) : null,
    createdAt: r.createdAt.toISOString(),
  }));
}

export async function getReview(ds: DataSource, user: UserRecord, runId: number): Promise<RunReview> {
  const { run, role } = await runAccess(ds, user, runId);
  const rows = await ds.getRepository(RunReviewEntity).find({ where: { runId }, order: { id: 'ASC' } });
  const submittedBy = [...rows].reverse().find((r) => r.action === 'submit')?.userId ?? null;
  const allowed = (Object.keys(TRANSITIONS) as ReviewAction[]).filter((a) => refusal(a, run, user, role, submittedBy) === null);
  return {
    runId,
    status: run.reviewStatus,
    submittedBy,
    role,
    allowed,
    locked: (await approvedRunOf(ds, run.modelId, run.version)) !== null,
    events: await toEvents(ds, rows),
  };
}

async function mailFacts(ds: DataSource, mailer: Mailer, run: RunRecord, actor: UserRecord, message: string): Promise<RunMailFacts> {
  const model = await ds.getRepository(ModelEntity).findOneByOrFail({ id: run.modelId });
  const project = await ds.getRepository(ProjectEntity).findOneByOrFail({ id: model.projectId });
  return {
    runId: run.id,
    projectName: project.name,
    modelName: model.name,
    version: run.version,
    actorName: actor.name,
    message,
    link: `${mailer.config.appUrl}/runs/${run.id}`,
  };
}

/** Takes a review step; returns the review as it now stands. E-mails go out after the change is saved. */
export async function reviewRun(ds: DataSource, mailer: Mailer, user: UserRecord, runId: number, action: ReviewAction, input: unknown): Promise<RunReview> {
  const message = action === 'approve' ? approveSchema.parse(input ?? {}).message : reviewMessageSchema.parse(input ?? {}).message;
  const { run, role, projectId } = await runAccess(ds, user, runId);
  const submittedBy = await lastSubmitter(ds, runId);
  const why = refusal(action, run, user, role, submittedBy);
  if (why) throw why.status === 403 ? forbidden(why.message) : conflict(why.message);
  const t = TRANSITIONS[action];
  await ds.transaction(async (m) => {
    const res = await m.getRepository(RunEntity).update({ id: runId, reviewStatus: run.reviewStatus }, { reviewStatus: t.to });
    if (!res.affected) throw conflict(`Run ${runId} changed while you were looking at it; reload and try again`);
    await m.getRepository(RunReviewEntity).insert({ runId, action, fromStatus: run.reviewStatus, toStatus: t.to, message, userId: user.id });
  });

  const facts = await mailFacts(ds, mailer, run, user, message);
  if (action === 'submit') {
    const leads = (await projectLeads(ds, projectId)).filter((u) => u.id !== user.id);
    const to = leads.length ? leads : await ds.getRepository(UserEntity).findBy({ role: 'admin', active: true });
    if (to.length) mailer.send(submittedMessage(to.map((u) => u.email), facts));
  } else if (submittedBy !== null) {
    const submitter = await ds.getRepository(UserEntity).findOneBy({ id: submittedBy });
    if (submitter?.active) mailer.send(action === 'return' ? returnedMessage(submitter.email, facts) : approvedMessage(submitter.email, facts));
  }
  return getReview(ds, user, runId);
}
