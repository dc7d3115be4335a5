/** The audit trail: record an event; query events with filters; CSV of a query. */
import type { DataSource } from 'typeorm';
import { auditQuerySchema, type AuditAction, type AuditEvent, type AuditPage, type AuditQuery } from '../../shared/schemas/audit.js';
import { forbidden } from '../errors/app-error.js';
import { visibleLeadProjects } from './audit-scope.js';
import { AuditEntity, type AuditRecord } from './audit.entity.js';
import type { UserRecord } from '../users/user.entity.js';

export interface AuditInput {
  action: AuditAction;
  user?: Pick<UserRecord, 'id' | 'email'> | null;
  /** e-mail to record when there is no user (a failed sign-in, a reset request) */
  email?: string | null;
  projectId?: number | null;
  modelId?: number | null;
  version?: number | null;
  runId?: number | null;
  detail?: string;
  ip?: string | null;
}

export async function recordAudit(ds: DataSource, e: AuditInput): Promise<void> {
  const repo = ds.getRepository(AuditEntity);
  await repo.insert({
    at: new Date(),
    userId: e.user?.id ?? null,
    userEmail: e.user?.email ?? e.email?.slice(0, 254) ?? null,
    action: e.action,
    projectId: e.projectId ?? null,
    modelId: e.modelId ?? null,
    version: e.version ?? null,
    runId: e.runId ?? null,
    detail: (e.detail ?? '').slice(0, 2000),
    ip: e.ip ?? null,
  });
}

export function toAuditEvent(r: AuditRecord): AuditEvent {
  return {
    id: r.id,
    at: r.at.toISOString(),
    userId: r.userId,
    userEmail: r.userEmail,
    action: r.action,
    projectId: r.projectId,
    modelId: r.modelId,
    version: r.version,
    runId: r.runId,
    detail: r.detail,
    ip: r.ip,
  };
}

/** A date-only `to` means the whole of that day (UTC). */
function endOf(text: string): Date {
  return /^\d{4}-\d{2}-\d{2}$/.test(text) ? new Date(Date.parse(text) + 86_400_000 - 1) : new Date(text);
}

/**
 * Events matching the filters, newest first. Admins see everything; leads see the events
 * of projects where they are lead (events without a project are admin-only).
 */
export async function queryAudit(ds: DataSource, viewer: UserRecord, input: AuditQuery): Promise<AuditPage> {
  const q = auditQuerySchema.parse(input);
  const qb = ds.getRepository(AuditEntity).createQueryBuilder('a');
  if (viewer.role !== 'admin') {
    const projects = await visibleLeadProjects(ds, viewer);
    if (q.projectId !== undefined && !projects.includes(q.projectId)) throw forbidden('You can read the audit trail only of projects you lead');
    if (projects.length === 0) return { total: 0, events: [] };
    qb.andWhere('a.projectId IN (:...projects)', { projects });
  }
  if (q.userId !== undefined) qb.andWhere('a.userId = :userId', { userId: q.userId });
  if (q.action !== undefined) qb.andWhere('a.action = :action', { action: q.action });
  if (q.projectId !== undefined) qb.andWhere('a.projectId = :projectId', { projectId: q.projectId });
  if (q.from !== undefined) qb.andWhere('a.at >= :from', { from: new Date(q.from) });
  if (q.to !== undefined) qb.andWhere('a.at <= :to', { to: endOf(q.to) });
  const total = await qb.getCount();
  const rows = await qb.orderBy('a.id', 'DESC').skip(q.offset).take(q.limit).getMany();
  return { total, events: rows.map(toAuditEvent) };
}

const CSV_COLUMNS: (keyof AuditEvent)[] = ['id', 'at', 'userId', 'userEmail', 'action', 'projectId', 'modelId', 'version', 'runId', 'detail', 'ip'];

/** RFC 4180 field; text starting with = + - @ (or tab/CR) is prefixed with ' so spreadsheets never run it. */
function csvField(v: unknown): string {
  if (v === null || v === undefined) return '';
  let s = String(v);
  if (typeof v === 'string' && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export async function auditCsv(ds: DataSource, viewer: UserRecord, input: AuditQuery): Promise<string> {
  const page = await queryAudit(ds, viewer, { ...input, limit: 1000, offset: 0 });
  let events = page.events;
  // more than one page: keep reading (the CSV has every matching event)
  for (let offset = 1000; offset < page.total; offset += 1000) {
    events = events.concat((await queryAudit(ds, viewer, { ...input, limit: 1000, offset })).events);
  }
  const lines = [CSV_COLUMNS.join(',')];
  for (const e of events) lines.push(CSV_COLUMNS.map((c) => csvField(e[c])).join(','));
  return `${lines.join('\r\n')}\r\n`;
}
