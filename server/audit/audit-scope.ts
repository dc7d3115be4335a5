/** Which projects' audit events a non-admin may read: those where their effective role is lead. */
import type { DataSource } from 'typeorm';
import { ProjectMemberEntity } from '../membership/member.entity.js';
import type { UserRecord } from '../users/user.entity.js';

export async function visibleLeadProjects(ds: DataSource, user: UserRecord): Promise<number[]> {
  if (user.role !== 'lead') return [];
  const rows = await ds.getRepository(ProjectMemberEntity).findBy({ userId: user.id, role: 'lead' });
  return rows.map((r) => r.projectId);
}
