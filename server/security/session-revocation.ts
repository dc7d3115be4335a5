/**
 * Signing out really ends the session: the token's SHA-256 is kept in `revoked_sessions`
 * until the token would have expired anyway, and `authenticate` refuses revoked tokens.
 */
import { createHash } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { LessThan, type DataSource } from 'typeorm';
import { RevokedSessionEntity } from './revoked-session.entity.js';

export const tokenHash = (token: string) => createHash('sha256').update(token).digest('hex');

export async function revokeSession(ds: DataSource, token: string): Promise<void> {
  const decoded = jwt.decode(token);
  const exp = decoded && typeof decoded === 'object' && typeof decoded.exp === 'number' ? decoded.exp * 1000 : Date.now() + 90 * 86_400_000;
  const repo = ds.getRepository(RevokedSessionEntity);
  await repo.delete({ expiresAt: LessThan(new Date()) });
  await repo.upsert({ tokenHash: tokenHash(token), expiresAt: new Date(exp) }, ['tokenHash']);
}

export async function isRevoked(ds: DataSource, token: string): Promise<boolean> {
  return ds.getRepository(RevokedSessionEntity).existsBy({ tokenHash: tokenHash(token) });
}
