/**
 * Project membership. A user sees and works on a project only as its member (admins: every
 * project). The effective role on a project is the lower of the member's project role and
 * their account role (admins are admin everywhere).
 *
 *   GET    /api/projects/:projectId/members           → ProjectMember[]
 *   POST   /api/projects/:projectId/members           AddMemberInput → 201 ProjectMember (admin, project lead)
 *   PATCH  /api/projects/:projectId/members/:userId   { role } → ProjectMember (admin, project lead)
 *   DELETE /api/projects/:projectId/members/:userId   → 204 (admin, project lead)
 *   GET    /api/projects/:projectId/access            → ProjectAccess (the caller's effective role)
 */
import { z } from 'zod';
import { emailSchema } from './users.js';

export const PROJECT_ROLES = ['viewer', 'engineer', 'lead'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];
export const projectRoleSchema = z.enum(PROJECT_ROLES);

export const projectMemberSchema = z.object({
  projectId: z.number().int(),
  userId: z.number().int(),
  email: z.string(),
  name: z.string(),
  /** the role given on this project */
  role: projectRoleSchema,
  /** the account role (caps the project role) */
  accountRole: z.string(),
  active: z.boolean(),
  addedAt: z.string(),
});
export type ProjectMember = z.infer<typeof projectMemberSchema>;

/** Add by user id or by e-mail of an existing account. */
export const addMemberSchema = z
  .object({ userId: z.number().int().positive().optional(), email: emailSchema.optional(), role: projectRoleSchema })
  .strict()
  .refine((v) => v.userId !== undefined || v.email !== undefined, { path: ['email'], message: 'Give the e-mail of an existing user' });
export type AddMemberInput = z.input<typeof addMemberSchema>;

export const updateMemberSchema = z.object({ role: projectRoleSchema }).strict();
export type UpdateMemberInput = z.input<typeof updateMemberSchema>;

export const projectAccessSchema = z.object({
  projectId: z.number().int(),
  /** effective role on the project: viewer, engineer, lead or admin */
  role: z.enum(['viewer', 'engineer', 'lead', 'admin']),
});
export type ProjectAccess = z.infer<typeof projectAccessSchema>;
