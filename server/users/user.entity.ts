/** The `users` table. E-mails are stored lower-case. */
import { EntitySchema } from 'typeorm';
import type { Role } from '../../shared/schemas/users.js';

export interface UserRecord {
  id: number;
  email: string;
  name: string;
  passwordHash: string;
  role: Role;
  active: boolean;
  /** Bumped on password change and deactivation; sessions carrying an older value stop working. */
  sessionVersion: number;
  createdAt: Date;
}

export const UserEntity = new EntitySchema<UserRecord>({
  name: 'User',
  tableName: 'users',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    email: { type: 'varchar', length: 254, unique: true },
    name: { type: 'varchar', length: 200 },
    passwordHash: { type: 'varchar', length: 100 },
    role: { type: 'varchar', length: 16 },
    active: { type: 'boolean', default: true },
    sessionVersion: { type: 'integer', default: 0 },
    createdAt: { type: 'datetime', createDate: true },
  },
});
