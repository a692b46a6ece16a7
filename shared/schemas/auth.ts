import { z } from 'zod';
import './messages';
import { roles } from '../roles';

// Generous but bounded: a 100 kB "password" is rejected before it reaches the hasher.
const password = z.string().min(1, 'Enter your password').max(256, 'At most 256 characters');

export const signInSchema = z.object({
  email: z.string().trim().min(1, 'Enter your e-mail address').max(254).email('Enter a valid e-mail address'),
  password,
});
export type SignInInput = z.infer<typeof signInSchema>;

export const newPasswordRules = z
  .string()
  .min(12, 'Use at least 12 characters')
  .max(256, 'At most 256 characters');

export const changePasswordSchema = z
  .object({
    currentPassword: password,
    newPassword: newPasswordRules,
  })
  .refine((v) => v.newPassword !== v.currentPassword, {
    path: ['newPassword'],
    message: 'The new password must differ from the current one',
  });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

export const roleSchema = z.enum(roles);

export const createUserSchema = z.object({
  name: z.string().trim().min(2, 'Enter the full name').max(120),
  email: z.string().trim().toLowerCase().max(254).email('Enter a valid e-mail address'),
  role: roleSchema,
  crewId: z.number().int().positive().nullable(),
  temporaryPassword: newPasswordRules,
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

export const updateUserSchema = z
  .object({
    role: roleSchema.optional(),
    crewId: z.number().int().positive().nullable().optional(),
    position: z.string().regex(/^[a-z][a-z0-9_]{1,39}$/, 'Not a position key').nullable().optional(),
    version: z.number().int().nonnegative(),
  })
  .refine((v) => v.role !== undefined || v.crewId !== undefined || v.position !== undefined, { message: 'Nothing to change' });
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const userVersionSchema = z.object({ version: z.number().int().nonnegative() });

export type PublicUser = {
  id: number;
  name: string;
  email: string;
  role: (typeof roles)[number];
  crewId: number | null;
  crewName: string | null;
  position: string | null;
  active: boolean;
  mustChangePassword: boolean;
  version: number;
};
