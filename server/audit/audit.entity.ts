/**
 * The `audit_events` table. No foreign keys on purpose: the trail outlives deleted users,
 * projects and models (the user's e-mail is copied in).
 */
import { EntitySchema } from 'typeorm';
import type { AuditAction } from '../../shared/schemas/audit.js';

export interface AuditRecord {
  id: number;
  at: Date;
  userId: number | null;
  userEmail: string | null;
  action: AuditAction;
  projectId: number | null;
  modelId: number | null;
  version: number | null;
  runId: number | null;
  detail: string;
  ip: string | null;
}

export const AuditEntity = new EntitySchema<AuditRecord>({
  name: 'AuditEvent',
  tableName: 'audit_events',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    at: { type: 'datetime' },
    userId: { type: 'integer', nullable: true },
    userEmail: { type: 'varchar', length: 254, nullable: true },
    action: { type: 'varchar', length: 32 },
    projectId: { type: 'integer', nullable: true },
    modelId: { type: 'integer', nullable: true },
    version: { type: 'integer', nullable: true },
    runId: { type: 'integer', nullable: true },
    detail: { type: 'text', default: '' },
    ip: { type: 'varchar', length: 64, nullable: true },
  },
});
