import { z } from 'zod';
import { passwordSchema } from '../users/users-schemas';

export const signInSchema = z
  .object({
    email: z.string({ message: 'Enter your e-mail address.' }).trim().min(1, 'Enter your e-mail address.').max(254),
    password: z.string({ message: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
  })
  .strict();

export const changePasswordSchema = z
  .object({
    currentPassword: z.string({ message: 'Enter your current password.' }).min(1, 'Enter your current password.').max(200),
    newPassword: passwordSchema,
  })
  .strict()
  .refine((b) => b.newPassword !== b.currentPassword, { message: 'Choose a new password that differs from the current one.', path: ['newPassword'] });
