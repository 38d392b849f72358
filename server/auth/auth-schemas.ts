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

export const forgotPasswordSchema = z
  .object({
    email: z.string({ message: 'Enter your e-mail address.' }).trim().min(1, 'Enter your e-mail address.').max(254, 'An e-mail address can be at most 254 characters.'),
  })
  .strict();

export const setPasswordSchema = z
  .object({
    token: z.string({ message: 'This link is not complete: open it again from the e-mail.' }).min(1, 'This link is not complete: open it again from the e-mail.').max(200, 'This link is not right: open it again from the e-mail.'),
    password: passwordSchema,
  })
  .strict();
