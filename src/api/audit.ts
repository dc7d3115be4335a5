/** Audit trail endpoints. */
import type { AuditPage } from '../../shared/schemas/audit.js';
import { http } from './http.js';

export interface AuditFilters {
  userId?: number | null;
  action?: string | null;
  projectId?: number | null;
  from?: string | null;
  to?: string | null;
  limit?: number;
  offset?: number;
}

/** The query string of a filter set (empty values left out). */
export function auditQuery(f: AuditFilters): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== null && v !== undefined && v !== '') p.set(k, String(v));
  const s = p.toString();
  return s ? `?${s}` : '';
}

/** GET /api/audit. */
export function listAudit(f: AuditFilters): Promise<AuditPage> {
  return http.get<AuditPage>(`/api/audit${auditQuery(f)}`);
}

/** The address of GET /api/audit/export.csv for a download link. */
export function auditCsvUrl(f: AuditFilters): string {
  const { limit: _l, offset: _o, ...rest } = f;
  return `/api/audit/export.csv${auditQuery(rest)}`;
}
