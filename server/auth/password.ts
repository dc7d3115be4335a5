/** Password hashing with bcrypt (cost 10 or more). */
import bcrypt from 'bcryptjs';

export const BCRYPT_COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/** A valid hash of a random string, compared against when the e-mail is unknown so timing says nothing. */
export const UNKNOWN_USER_HASH = bcrypt.hashSync(Math.random().toString(36), BCRYPT_COST);
