/** The `account_tokens` table: invitation and password-reset links (only a SHA-256 of the token is kept). */
import { EntitySchema } from 'typeorm';

export interface AccountTokenRecord {
  id: number;
  userId: number;
  kind: 'invite' | 'reset';
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Date;
}

export const AccountTokenEntity = new EntitySchema<AccountTokenRecord>({
  name: 'AccountToken',
  tableName: 'account_tokens',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    userId: { type: 'integer' },
    kind: { type: 'varchar', length: 16 },
    tokenHash: { type: 'varchar', length: 64, unique: true },
    expiresAt: { type: 'datetime' },
    usedAt: { type: 'datetime', nullable: true },
    createdAt: { type: 'datetime', createDate: true },
  },
});
