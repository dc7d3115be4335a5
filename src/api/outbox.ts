/** Outbox and account (invitation, password reset) endpoints. */
import type { InviteInput, OutboxMessage, TokenInfo } from '../../shared/schemas/mail.js';
import type { User } from '../../shared/schemas/users.js';
import { http } from './http.js';

/** GET /api/outbox (admins: everything; others: messages to them). */
export function listOutbox(): Promise<OutboxMessage[]> {
  return http.get<OutboxMessage[]>('/api/outbox');
}

/** POST /api/account/invite (admin). */
export function inviteUser(input: InviteInput): Promise<User> {
  return http.post<User>('/api/account/invite', input);
}

/** POST /api/account/forgot: always 202. */
export function forgotPassword(email: string): Promise<{ message: string }> {
  return http.post<{ message: string }>('/api/account/forgot', { email });
}

/** GET /api/account/token. */
export function tokenInfo(token: string): Promise<TokenInfo> {
  return http.get<TokenInfo>(`/api/account/token?token=${encodeURIComponent(token)}`);
}

/** POST /api/account/set-password. */
export function setPassword(token: string, password: string): Promise<void> {
  return http.post<void>('/api/account/set-password', { token, password });
}
