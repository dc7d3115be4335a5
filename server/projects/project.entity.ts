/** The `projects` table. */
import { EntitySchema } from 'typeorm';
import type { DesignCode, UnitSystem } from '../../shared/model/types.js';

export interface ProjectRecord {
  id: number;
  name: string;
  jobNumber: string;
  client: string;
  description: string;
  designCode: DesignCode;
  units: UnitSystem;
  /** Id of the user who created it (null if that user row is gone). */
  createdBy: number | null;
  createdAt: Date;
  updatedAt: Date;
}

export const ProjectEntity = new EntitySchema<ProjectRecord>({
  name: 'Project',
  tableName: 'projects',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    name: { type: 'varchar', length: 200 },
    jobNumber: { type: 'varchar', length: 50, default: '' },
    client: { type: 'varchar', length: 200, default: '' },
    description: { type: 'text', default: '' },
    designCode: { type: 'varchar', length: 32 },
    units: { type: 'varchar', length: 8 },
    createdBy: { type: 'integer', nullable: true },
    createdAt: { type: 'datetime', createDate: true },
    updatedAt: { type: 'datetime', updateDate: true },
  },
});
