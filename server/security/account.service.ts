/**
 * Invitations and password resets by e-mail. Tokens are 32 random bytes (base64url) sent
 * only in the link; the database keeps their SHA-256. A token works once, until it expires;
 * setting a password ends every session of the account.
 */
import { randomBytes } from 'node:crypto';
import { IsNull, type DataSource } from 'typeorm';
import { forgotSchema, inviteSchema, setPasswordSchema, type InviteInput, type TokenInfo } from '../../shared/schemas/mail.js';
import type { User } from '../../shared/schemas/users.js';
import { hashPassword } from '../auth/password.js';
import { conflict, notFound } from '../errors/app-error.js';
import type { Mailer } from '../mail/mailer.js';
import { inviteMessage, resetMessage } from '../mail/messages.js';
import { ensureMember } from '../membership/member.service.js';
import { projectAccess } from '../membership/project-access.js';
import { UserEntity, type UserRecord } from '../users/user.entity.js';
import { toUser } from '../users/user.service.js';
import { recordAudit } from '../audit/audit.service.js';
import { AccountTokenEntity, type AccountTokenRecord } from './account-token.entity.js';
import { tokenHash } from './session-revocation.js';

const newToken = () => randomBytes(32).toString('base64url');

async function issueToken(ds: DataSource, userId: number, kind: 'invite' | 'reset', ms: number): Promise<string> {
  const token = newToken();
  const repo = ds.getRepository(AccountTokenEntity);
  // an older unused link of the same kind stops working
  await repo.update({ userId, kind, usedAt: IsNull() }, { usedAt: new Date() });
  await repo.insert({ userId, kind, tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + ms), usedAt: null });
  return token;
}

export async function inviteUser(ds: DataSource, mailer: Mailer, admin: UserRecord, input: InviteInput): Promise<User> {
  const data = inviteSchema.parse(input);
  const users = ds.getRepository(UserEntity);
  if (await users.existsBy({ email: data.email })) {
    throw conflict(`A user with e-mail ${data.email} already exists`, { fieldErrors: { email: ['Already in use'] }, formErrors: [] });
  }
  if (data.projectId !== undefined) await projectAccess(ds, admin, data.projectId);
  // a random password nobody knows: the account is usable only through the link
  const user = await users.save(
    users.create({ email: data.email, name: data.name, role: data.role, passwordHash: await hashPassword(newToken()), active: true, sessionVersion: 0 }),
  );
  if (data.projectId !== undefined) {
    const fallback = data.role === 'admin' ? 'lead' : data.role;
    await ensureMember(ds.manager, data.projectId, user.id, data.projectRole ?? fallback);
  }
  const token = await issueToken(ds, user.id, 'invite', mailer.config.inviteHours * 3_600_000);
  mailer.send(inviteMessage(user.email, user.name, admin.name, `${mailer.config.appUrl}/set-password?token=${token}`, mailer.config.inviteHours));
  return toUser(user);
}

/** Always resolves the same way; a message goes out only for an active account. */
export async function requestReset(ds: DataSource, mailer: Mailer, input: unknown): Promise<void> {
  const { email } = forgotSchema.parse(input ?? {});
  const user = await ds.getRepository(UserEntity).findOneBy({ email: email.toLowerCase() });
  if (!user || !user.active) return;
  const token = await issueToken(ds, user.id, 'reset', mailer.config.resetMinutes * 60_000);
  mailer.send(resetMessage(user.email, user.name, `${mailer.config.appUrl}/set-password?token=${token}`, mailer.config.resetMinutes));
}

async function liveToken(ds: DataSource, token: string): Promise<{ record: AccountTokenRecord; user: UserRecord }> {
  const record = await ds.getRepository(AccountTokenEntity).findOneBy({ tokenHash: tokenHash(token) });
  const user = record ? await ds.getRepository(UserEntity).findOneBy({ id: record.userId }) : null;
  if (!record || !user || record.usedAt || record.expiresAt.getTime() <= Date.now() || !user.active) {
    throw notFound('This link is not valid any more: it was used already or has expired. Ask for a new one.');
  }
  return { record, user };
}

export async function tokenInfo(ds: DataSource, token: string): Promise<TokenInfo> {
  const { record, user } = await liveToken(ds, token);
  return { kind: record.kind, email: user.email, name: user.name, expiresAt: record.expiresAt.toISOString() };
}

export async function setPasswordWithToken(ds: DataSource, input: unknown, ip: string | null): Promise<void> {
  const data = setPasswordSchema.parse(input ?? {});
  const { record, user } = await liveToken(ds, data.token);
  const passwordHash = await hashPassword(data.password);
  await ds.transaction(async (m) => {
    const used = await m.getRepository(AccountTokenEntity).update({ id: record.id, usedAt: IsNull() }, { usedAt: new Date() });
    if (!used.affected) throw notFound('This link is not valid any more: it was used already or has expired. Ask for a new one.');
    await m.getRepository(UserEntity).update({ id: user.id }, { passwordHash, sessionVersion: user.sessionVersion + 1 });
  });
  await recordAudit(ds, { action: 'password-set', user, detail: record.kind === 'invite' ? 'accepted invitation' : 'reset by e-mail link', ip });
}
