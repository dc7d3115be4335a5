/**
 * Users and roles. A user as the API returns it is `{ id, email, name, role, active }`;
 * the password hash never leaves the server.
 */
import { z } from 'zod';

/** Roles from least to most privileged (product.md "Who uses it"). */
export const ROLES = ['viewer', 'engineer', 'lead', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/** The given role and every more privileged one, e.g. `rolesAtLeast('engineer')` → engineer, lead, admin. */
export function rolesAtLeast(role: Role): Role[] {
  return ROLES.slice(ROLES.indexOf(role));
}

/** True when `role` is `minimum` or more privileged. */
export function hasRoleAtLeast(role: Role, minimum: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(minimum);
}

export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_LENGTH = 72; // bcrypt reads at most 72 bytes

export const emailSchema = z.email('Enter a valid e-mail address').max(254).transform((s) => s.trim().toLowerCase());
export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters`);
export const userNameSchema = z.string().trim().min(1, 'Name is required').max(200);
export const roleSchema = z.enum(ROLES);

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
});
export type User = z.infer<typeof userSchema>;

/** POST /api/users (admin). */
export const createUserSchema = z.object({
  email: emailSchema,
  name: userNameSchema,
  role: roleSchema,
  password: passwordSchema,
});
export type CreateUserInput = z.input<typeof createUserSchema>;

/** PATCH /api/users/:id (admin): any of role, active, name. */
export const updateUserSchema = z
  .object({
    name: userNameSchema.optional(),
    role: roleSchema.optional(),
    active: z.boolean().optional(),
  })
  .strict();
export type UpdateUserInput = z.input<typeof updateUserSchema>;
