import { PASSWORD_LENGTH } from '@keepstitch/shared';
import { z } from 'zod';

export const signInSchema = z
  .object({
    email: z.string({ message: 'Enter your e-mail address.' }).trim().min(1, 'Enter your e-mail address.').max(254),
    password: z.string({ message: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
  })
  .strict();

/** The rule for every password set in Keepstitch. */
export const passwordSchema = z
  .string({ message: 'Enter a password.' })
  .min(PASSWORD_LENGTH.min, `Use at least ${PASSWORD_LENGTH.min} characters for a password.`)
  .max(PASSWORD_LENGTH.max, `A password can be at most ${PASSWORD_LENGTH.max} characters.`);

export const changePasswordSchema = z
  .object({
    currentPassword: z.string({ message: 'Enter your current password.' }).min(1, 'Enter your current password.').max(200),
    newPassword: passwordSchema,
  })
  .strict()
  .refine((b) => b.newPassword !== b.currentPassword, { message: 'Choose a new password that differs from the current one.', path: ['newPassword'] });
