import { z } from 'zod';
import { ROLES } from '@/db/types';
import { safeText } from './text';

export const roleSchema = z.enum(ROLES);

const email = z.email('Enter a valid e-mail address.').max(254).transform((s) => s.trim().toLowerCase());
export const passwordSchema = safeText()
  
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.');

/** Call signs as written on a licence: letters, digits and /, stored upper-case. */
export const callSignSchema = safeText()
  
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9/]{3,12}$/, 'A call sign is 3–12 letters, digits or /.');

export const userBaseSchema = z.object({
  email,
  name: safeText().trim().min(1, 'Enter a name.').max(120),
  role: roleSchema,
  callSign: callSignSchema.nullable().optional(),
  active: z.boolean(),
});

export const inviteSchema = userBaseSchema.pick({ email: true, name: true, role: true });
export type InviteInput = z.input<typeof inviteSchema>;

export const userPatchSchema = userBaseSchema.pick({ role: true, active: true }).partial().refine((p) => p.role !== undefined || p.active !== undefined, {
  message: 'Change the role or the active flag.',
});

export const forgotPasswordSchema = z.object({ email });

export const setPasswordSchema = z
  .object({ token: safeText().min(20).max(200), password: passwordSchema, confirm: safeText() })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ.', path: ['confirm'] });
export type SetPasswordInput = z.input<typeof setPasswordSchema>;

export const signInSchema = z.object({ email, password: safeText().min(1, 'Enter your password.') });
export type SignInInput = z.input<typeof signInSchema>;

export const changePasswordSchema = z
  .object({ current: safeText().min(1, 'Enter your current password.').max(200), password: passwordSchema, confirm: safeText() })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ.', path: ['confirm'] });
export type ChangePasswordInput = z.input<typeof changePasswordSchema>;
