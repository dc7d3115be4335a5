/** The `project_members` table: one row per user per project, with the project role. */
import { EntitySchema } from 'typeorm';
import type { ProjectRole } from '../../shared/schemas/membership.js';

export interface ProjectMemberRecord {
  id: number;
  projectId: number;
  userId: number;
  role: ProjectRole;
  createdAt: Date;
}

export const ProjectMemberEntity = new EntitySchema<ProjectMemberRecord>({
  name: 'ProjectMember',
  tableName: 'project_members',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    projectId: { type: 'integer' },
    userId: { type: 'integer' },
    role: { type: 'varchar', length: 16 },
    createdAt: { type: 'datetime', createDate: true },
  },
});
