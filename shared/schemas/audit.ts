/**
 * The audit trail: one row per state-changing action.
 *
 *   GET /api/audit[?userId=&action=&projectId=&from=&to=&limit=&offset=]  → AuditPage (lead: own projects; admin: all)
 *   GET /api/audit/export.csv[?same filters]                              → text/csv
 */
import { z } from 'zod';

export const AUDIT_ACTIONS = [
  'sign-in',
  'sign-in-failed',
  'sign-out',
  'password-change',
  'password-reset-request',
  'password-set',
  'user-invite',
  'user-create',
  'user-update',
  'project-create',
  'project-update',
  'project-delete',
  'member-add',
  'member-update',
  'member-remove',
  'import',
  'commit',
  'model-rename',
  'edit',
  'run',
  'submit',
  'return',
  'approve',
  'comment',
  'export',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

const dateText = z
  .string()
  .trim()
  .refine((s) => !Number.isNaN(Date.parse(s)), 'Give a date as YYYY-MM-DD or an ISO 8601 time');

export const auditQuerySchema = z.object({
  userId: z.coerce.number().int().positive().optional(),
  action: z.enum(AUDIT_ACTIONS).optional(),
  projectId: z.coerce.number().int().positive().optional(),
  from: dateText.optional(),
  to: dateText.optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200),
  offset: z.coerce.number().int().min(0).default(0),
});
export type AuditQuery = z.input<typeof auditQuerySchema>;

export const auditEventSchema = z.object({
  id: z.number().int(),
  at: z.string(),
  userId: z.number().int().nullable(),
  userEmail: z.string().nullable(),
  action: z.enum(AUDIT_ACTIONS),
  projectId: z.number().int().nullable(),
  modelId: z.number().int().nullable(),
  version: z.number().int().nullable(),
  runId: z.number().int().nullable(),
  /** what happened, in words */
  detail: z.string(),
  ip: z.string().nullable(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const auditPageSchema = z.object({ total: z.number().int(), events: z.array(auditEventSchema) });
export type AuditPage = z.infer<typeof auditPageSchema>;
