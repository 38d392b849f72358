import { PASSWORD_LENGTH, USER_TEXT_LIMITS } from '@keepstitch/shared';
import { z } from 'zod';
import { recordId } from '../core/validate';

/** The rule for every password set in Keepstitch. */
export const passwordSchema = z
  .string({ message: 'Enter a password.' })
  .min(PASSWORD_LENGTH.min, `Use at least ${PASSWORD_LENGTH.min} characters for a password.`)
  .max(PASSWORD_LENGTH.max, `A password can be at most ${PASSWORD_LENGTH.max} characters.`);

export const createUserSchema = z
  .object({
    email: z
      .string({ message: 'E-mail is required.' })
      .trim()
      .toLowerCase()
      .max(USER_TEXT_LIMITS.email, `An e-mail address can be at most ${USER_TEXT_LIMITS.email} characters.`)
      .pipe(z.email('Enter an e-mail address like name@example.org.')),
    name: z.string({ message: 'Name is required.' }).trim().min(1, 'Name is required.').max(USER_TEXT_LIMITS.name, `A name can be at most ${USER_TEXT_LIMITS.name} characters.`),
    role: z.enum(['workroom', 'client'], { message: 'Role must be workroom or client.' }),
    clientId: recordId('Choose the client record this sign-in belongs to.').optional(),
    password: passwordSchema,
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.role === 'client' && v.clientId === undefined) {
      ctx.addIssue({ code: 'custom', path: ['clientId'], message: 'Choose the client record this sign-in belongs to.' });
    }
    if (v.role !== 'client' && v.clientId !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['clientId'], message: 'Only a client sign-in belongs to a client record.' });
    }
  });

export const resetPasswordSchema = z.object({ password: passwordSchema }).strict();

export type CreateUserInput = z.infer<typeof createUserSchema>;
