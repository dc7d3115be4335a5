/**
 * Every TypeORM entity of the server. To add one: define it next to its router
 * (`server/<noun>/<noun>.entity.ts`, EntitySchema or decorators with explicit column types),
 * append it here, and add a migration that creates its table (see migrations/index.ts).
 */
import type { EntitySchema } from 'typeorm';
import { ProjectEntity } from '../projects/project.entity.js';
import { UserEntity } from '../users/user.entity.js';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const entities: (EntitySchema<any> | Function)[] = [UserEntity, ProjectEntity];
