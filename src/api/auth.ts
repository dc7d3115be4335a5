/** Sign-in endpoints: one function per route. */
import type { ChangePasswordInput, LoginInput } from '../../shared/schemas/auth.js';
import type { User } from '../../shared/schemas/users.js';
import { http } from './http.js';

/** POST /api/auth/login → the signed-in user (the server sets the session cookie). */
export function login(input: LoginInput): Promise<User> {
  return http.post<User>('/api/auth/login', input);
}

/** POST /api/auth/logout. */
export function logout(): Promise<void> {
  return http.post<void>('/api/auth/logout');
}

/** GET /api/auth/me → the signed-in user; rejects with status 401 when signed out. */
export function me(): Promise<User> {
  return http.get<User>('/api/auth/me');
}

/** POST /api/auth/password: change one's own password. */
export function changePassword(input: ChangePasswordInput): Promise<void> {
  return http.post<void>('/api/auth/password', input);
}
