/** Signing in and changing one's own password. */
import type { DataSource } from 'typeorm';
import { changePasswordSchema, loginSchema, type ChangePasswordInput, type LoginInput } from '../../shared/schemas/auth.js';
import { AppError, unauthorized } from '../errors/app-error.js';
import { UserEntity, type UserRecord } from '../users/user.entity.js';
import { hashPassword, UNKNOWN_USER_HASH, verifyPassword } from './password.js';

/** The user whose e-mail and password match, else 401 (same message whether e-mail or password is wrong). */
export async function login(ds: DataSource, input: LoginInput): Promise<UserRecord> {
  const { email, password } = loginSchema.parse(input);
  const user = await ds.getRepository(UserEntity).findOneBy({ email });
  const ok = await verifyPassword(password, user?.passwordHash ?? UNKNOWN_USER_HASH);
  if (!user || !ok) throw unauthorized('E-mail or password is wrong');
  if (!user.active) throw unauthorized('This account is deactivated; ask an admin');
  return user;
}

/** Sets a new password after checking the current one; ends every other session. */
export async function changePassword(ds: DataSource, user: UserRecord, input: ChangePasswordInput): Promise<UserRecord> {
  const data = changePasswordSchema.parse(input);
  if (!(await verifyPassword(data.currentPassword, user.passwordHash))) {
    throw new AppError(400, 'validation_failed', 'The current password is wrong', {
      fieldErrors: { currentPassword: ['The current password is wrong'] },
      formErrors: [],
    });
  }
  const repo = ds.getRepository(UserEntity);
  user.passwordHash = await hashPassword(data.newPassword);
  user.sessionVersion += 1;
  return repo.save(user);
}
