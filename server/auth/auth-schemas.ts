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
  .min(10, 'Use at least 10 characters for a password.')
  .max(200, 'A password can be at most 200 characters.');
