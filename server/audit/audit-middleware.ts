/**
 * Records every state-changing API call (and every export) in the audit trail, in one place,
 * so routers stay free of audit code. Mounted on /api after `authenticate`: when a response
 * finishes with a success status (or a failed sign-in), the matching rule below names the
 * action; ids come from the project guards (`req.access`), the route and the JSON answer.
 */
import type { Request, RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditAction } from '../../shared/schemas/audit.js';
import type { Logger } from '../config/logger.js';
import { recordAudit, type AuditInput } from './audit.service.js';

type Body = Record<string, unknown> | undefined;

interface Rule {
  method: string;
  path: RegExp;
  action: AuditAction;
  /** also record this status (a failed sign-in is 401) */
  onStatus?: number;
  describe?: (req: Request, body: Body, m: RegExpExecArray) => Partial<AuditInput>;
}

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : typeof v === 'string' && /^\d+$/.test(v) ? Number(v) : null);
const str = (v: unknown): string => (typeof v === 'string' ? v : '');
const reqBody = (req: Request): Record<string, unknown> => (req.body && typeof req.body === 'object' ? (req.body as Record<string, unknown>) : {});
const changed = (req: Request) => Object.keys(reqBody(req)).filter((k) => k !== 'password' && k !== 'token').map((k) => `${k}=${JSON.stringify(reqBody(req)[k])}`).join(', ');

const RULES: Rule[] = [
  { method: 'POST', path: /^\/api\/auth\/login$/, action: 'sign-in', describe: (_r, b) => ({ user: { id: num(b?.id)!, email: str(b?.email) } }) },
  { method: 'POST', path: /^\/api\/auth\/login$/, action: 'sign-in-failed', onStatus: 401, describe: (r) => ({ email: str(reqBody(r).email).toLowerCase(), detail: 'wrong e-mail or password, or deactivated' }) },
  { method: 'POST', path: /^\/api\/auth\/logout$/, action: 'sign-out' },
  { method: 'POST', path: /^\/api\/auth\/password$/, action: 'password-change' },
  { method: 'POST', path: /^\/api\/account\/forgot$/, action: 'password-reset-request', describe: (r) => ({ email: str(reqBody(r).email).toLowerCase() }) },
  { method: 'POST', path: /^\/api\/account\/invite$/, action: 'user-invite', describe: (r, b) => ({ detail: `invited ${str(b?.email)} as ${str(b?.role)}`, projectId: num(reqBody(r).projectId) }) },
  { method: 'POST', path: /^\/api\/users$/, action: 'user-create', describe: (_r, b) => ({ detail: `created user ${num(b?.id)} ${str(b?.email)} as ${str(b?.role)}` }) },
  { method: 'PATCH', path: /^\/api\/users\/(\d+)$/, action: 'user-update', describe: (r, _b, m) => ({ detail: `user ${m[1]}: ${changed(r)}` }) },
  { method: 'POST', path: /^\/api\/projects$/, action: 'project-create', describe: (_r, b) => ({ projectId: num(b?.id), detail: `created project "${str(b?.name)}"` }) },
  { method: 'PATCH', path: /^\/api\/projects\/(\d+)$/, action: 'project-update', describe: (r, _b, m) => ({ projectId: Number(m[1]), detail: changed(r) }) },
  { method: 'DELETE', path: /^\/api\/projects\/(\d+)$/, action: 'project-delete', describe: (_r, _b, m) => ({ projectId: Number(m[1]) }) },
  { method: 'POST', path: /^\/api\/projects\/(\d+)\/members$/, action: 'member-add', describe: (_r, b, m) => ({ projectId: Number(m[1]), detail: `${str(b?.email)} as ${str(b?.role)}` }) },
  { method: 'PATCH', path: /^\/api\/projects\/(\d+)\/members\/(\d+)$/, action: 'member-update', describe: (_r, b, m) => ({ projectId: Number(m[1]), detail: `user ${m[2]} ${str(b?.email)} now ${str(b?.role)}` }) },
  { method: 'DELETE', path: /^\/api\/projects\/(\d+)\/members\/(\d+)$/, action: 'member-remove', describe: (_r, _b, m) => ({ projectId: Number(m[1]), detail: `user ${m[2]} removed` }) },
  { method: 'POST', path: /^\/api\/projects\/(\d+)\/imports$/, action: 'import', describe: (_r, b, m) => ({ projectId: Number(m[1]), detail: `upload ${str(b?.id)} (${str(b?.name)})` }) },
  {
    method: 'POST',
    path: /^\/api\/projects\/(\d+)\/imports\/([^/]+)\/commit$/,
    action: 'commit',
    describe: (_r, b, m) => {
      const model = (b?.model ?? {}) as Record<string, unknown>;
      return { projectId: Number(m[1]), modelId: num(model.id), version: num(b?.version), detail: `upload ${m[2]} committed as "${str(model.name)}" version ${num(b?.version) ?? '?'}` };
    },
  },
  { method: 'PATCH', path: /^\/api\/models\/(\d+)$/, action: 'model-rename', describe: (r) => ({ detail: changed(r) }) },
  {
    method: 'PATCH',
    path: /^\/api\/models\/(\d+)\/members$/,
    action: 'edit',
    describe: (r, b) => {
      const edits = Array.isArray(reqBody(r).edits) ? (reqBody(r).edits as unknown[]).length : 0;
      return { version: num(b?.currentVersion) ?? undefined, detail: `${edits} member edit(s) on version ${num(reqBody(r).baseVersion) ?? '?'}` };
    },
  },
  {
    method: 'PATCH',
    path: /^\/api\/models\/(\d+)\/tables$/,
    action: 'edit',
    describe: (r, b) => {
      const edits = Array.isArray(reqBody(r).edits) ? (reqBody(r).edits as unknown[]).length : 0;
      return { version: num(b?.currentVersion) ?? undefined, detail: `${edits} table edit(s) on version ${num(reqBody(r).baseVersion) ?? '?'}` };
    },
  },
  {
    method: 'POST',
    path: /^\/api\/runs\/(\d+)\/suggestions\/apply$/,
    action: 'edit',
    describe: (r, b, m) => {
      const changes = Array.isArray(reqBody(r).changes) ? (reqBody(r).changes as unknown[]).length : 0;
      const model = (b?.model ?? {}) as Record<string, unknown>;
      const run = (b?.run ?? {}) as Record<string, unknown>;
      return { version: num(model.currentVersion) ?? undefined, detail: `${changes} section suggestion(s) of run ${m[1]} applied as version ${num(model.currentVersion) ?? '?'}; run ${num(run.id) ?? '?'} started` };
    },
  },
  { method: 'POST', path: /^\/api\/models\/(\d+)\/runs$/, action: 'run', describe: (_r, b) => ({ runId: num(b?.id), version: num(b?.version) ?? undefined, detail: `run ${num(b?.id)} of version ${num(b?.version)}` }) },
  { method: 'POST', path: /^\/api\/runs\/(\d+)\/review\/submit$/, action: 'submit', describe: (r) => ({ detail: str(reqBody(r).message) }) },
  { method: 'POST', path: /^\/api\/runs\/(\d+)\/review\/return$/, action: 'return', describe: (r) => ({ detail: str(reqBody(r).message) }) },
  { method: 'POST', path: /^\/api\/runs\/(\d+)\/review\/approve$/, action: 'approve', describe: (r) => ({ detail: str(reqBody(r).message) }) },
  { method: 'POST', path: /^\/api\/runs\/(\d+)\/comments$/, action: 'comment', describe: (r) => ({ detail: `${reqBody(r).member ? `member ${str(reqBody(r).member)}: ` : ''}${str(reqBody(r).body)}` }) },
  { method: 'GET', path: /^\/api\/runs\/(\d+)\/exports\/([^/]+)$/, action: 'export', describe: (r, _b, m) => ({ detail: `${m[2]}${typeof r.query.loading === 'string' ? ` (loading ${r.query.loading})` : ''}` }) },
];

/** Writes still in flight (tests await `auditIdle()` before reading the trail). */
const pending = new Set<Promise<void>>();

export async function auditIdle(): Promise<void> {
  while (pending.size > 0) await Promise.all([...pending]);
}

export function auditTrail(ds: DataSource, logger: Logger): RequestHandler {
  return (req, res, next) => {
    const path = req.originalUrl.split('?')[0]!;
    const candidates = RULES.filter((r) => r.method === req.method && r.path.test(path));
    if (candidates.length === 0) return next();
    let body: Body;
    const json = res.json.bind(res);
    res.json = (b: unknown) => {
      body = b && typeof b === 'object' ? (b as Record<string, unknown>) : undefined;
      return json(b);
    };
    // Who was signed in when the request arrived (sign-out clears nothing on req, but be explicit).
    const before = req.user ? { id: req.user.id, email: req.user.email } : null;
    res.on('finish', () => {
      const ok = res.statusCode >= 200 && res.statusCode < 300;
      const rule = candidates.find((r) => (r.onStatus ? res.statusCode === r.onStatus : ok));
      if (!rule) return;
      if (rule.action === 'sign-out' && !before) return; // no valid session: nothing was signed out
      const m = rule.path.exec(path)!;
      const access = req.access;
      const extra = rule.describe?.(req, body, m) ?? {};
      const event: AuditInput = {
        action: rule.action,
        user: before,
        projectId: access?.projectId ?? null,
        modelId: access?.modelId ?? null,
        version: access?.version ?? null,
        runId: access?.runId ?? null,
        ip: req.ip ?? null,
      };
      for (const [k, v] of Object.entries(extra)) if (v !== undefined && v !== null) (event as unknown as Record<string, unknown>)[k] = v;
      const p = recordAudit(ds, event)
        .catch((err: unknown) => logger.error('could not write the audit trail', err))
        .finally(() => pending.delete(p));
      pending.add(p);
    });
    next();
  };
}
