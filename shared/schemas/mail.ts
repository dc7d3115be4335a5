/**
 * E-mail: the outbox of the built-in capture server (development and tests), account
 * invitations and password resets.
 *
 *   GET  /api/outbox                 → OutboxMessage[] newest first (admin)
 *   POST /api/account/invite         InviteInput → 201 User (admin)
 *   POST /api/account/forgot         { email } → 202 always (rate-limited)
 *   GET  /api/account/token?token=   → TokenInfo (404 when unknown, used or expired)
 *   POST /api/account/set-password   { token, password } → 204 (rate-limited)
 */
import { z } from 'zod';
import { emailSchema, passwordSchema, roleSchema, userNameSchema } from './users.js';
import { projectRoleSchema } from './membership.js';

export const outboxMessageSchema = z.object({
  id: z.number().int(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  kind: z.string(),
  receivedAt: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export const inviteSchema = z
  .object({
    email: emailSchema,
    name: userNameSchema,
    role: roleSchema,
    /** optionally add the new user to a project at once */
    projectId: z.number().int().positive().optional(),
    projectRole: projectRoleSchema.optional(),
  })
  .strict();
export type InviteInput = z.input<typeof inviteSchema>;

export const forgotSchema = z.object({ email: z.string().trim().max(254) }).strict();
export const setPasswordSchema = z.object({ token: z.string().min(10).max(200), password: passwordSchema }).strict();
export type SetPasswordInput = z.input<typeof setPasswordSchema>;

export const tokenInfoSchema = z.object({ kind: z.enum(['invite', 'reset']), email: z.string(), name: z.string(), expiresAt: z.string() });
export type TokenInfo = z.infer<typeof tokenInfoSchema>;
