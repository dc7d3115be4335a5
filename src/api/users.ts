/** User administration endpoints (admin only): one function per route. */
import type { CreateUserInput, UpdateUserInput, User } from '../../shared/schemas/users.js';
import { http } from './http.js';

/** GET /api/users. */
export function listUsers(): Promise<User[]> {
  return http.get<User[]>('/api/users');
}

/** POST /api/users. */
export function createUser(input: CreateUserInput): Promise<User> {
  return http.post<User>('/api/users', input);
}

/** PATCH /api/users/:id: role, active, name. */
export function updateUser(id: number, patch: UpdateUserInput): Promise<User> {
  return http.patch<User>(`/api/users/${id}`, patch);
}
