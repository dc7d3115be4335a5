/** Sign-in and own-password requests. */
import { z } from 'zod';
import { passwordSchema } from './users.js';

/** POST /api/auth/login → the signed-in user; sets the session cookie. */
export const loginSchema = z.object({
  email: z.string().trim().min(1, 'E-mail is required').max(254).transform((s) => s.toLowerCase()),
  password: z.string().min(1, 'Password is required').max(1024),
});
export type LoginInput = z.input<typeof loginSchema>;

/** POST /api/auth/password → 204; needs the current password. */
export const changePasswordSchema = z
  .object({
    currentPassword: z.string().min(1, 'Current password is required').max(1024),
    newPassword: passwordSchema,
  })
  .refine((v) => v.currentPassword !== v.newPassword, {
    path: ['newPassword'],
    message: 'The new password must differ from the current one',
  });
export type ChangePasswordInput = z.input<typeof changePasswordSchema>;
