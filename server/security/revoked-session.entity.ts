/** The `revoked_sessions` table: SHA-256 of session tokens signed out before they expired. */
import { EntitySchema } from 'typeorm';

export interface RevokedSessionRecord {
  tokenHash: string;
  expiresAt: Date;
}

export const RevokedSessionEntity = new EntitySchema<RevokedSessionRecord>({
  name: 'RevokedSession',
  tableName: 'revoked_sessions',
  columns: {
    tokenHash: { type: 'varchar', length: 64, primary: true },
    expiresAt: { type: 'datetime' },
  },
});
