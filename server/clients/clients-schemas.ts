import { CLIENT_TEXT_LIMITS } from '@keepstitch/shared';
import { z } from 'zod';
import { optionalText } from '../core/validate';

const optionalEmail = z
  .string({ message: 'E-mail must be text.' })
  .trim()
  .max(CLIENT_TEXT_LIMITS.email, `An e-mail address can be at most ${CLIENT_TEXT_LIMITS.email} characters.`)
  .refine((s) => s === '' || z.email().safeParse(s).success, 'Enter an e-mail address like name@example.org.')
  .transform((s) => (s === '' ? null : s.toLowerCase()))
  .nullable()
  .optional();

const optionalPhone = z
  .string({ message: 'Phone must be text.' })
  .trim()
  .max(CLIENT_TEXT_LIMITS.phone, `A phone number can be at most ${CLIENT_TEXT_LIMITS.phone} characters.`)
  .refine((s) => s === '' || /^\+?[0-9][0-9 ()./-]{4,}$/.test(s), 'Enter a phone number with digits, spaces and + - ( ) only.')
  .transform((s) => (s === '' ? null : s))
  .nullable()
  .optional();

const clientFields = {
  name: z
    .string({ message: 'Name is required.' })
    .trim()
    .min(1, 'Name is required.')
    .max(CLIENT_TEXT_LIMITS.name, `A name can be at most ${CLIENT_TEXT_LIMITS.name} characters.`),
  email: optionalEmail,
  phone: optionalPhone,
  address: optionalText(CLIENT_TEXT_LIMITS.address, 'Address'),
  notes: optionalText(CLIENT_TEXT_LIMITS.notes, 'Notes'),
  portfolioConsent: z.boolean({ message: 'Portfolio consent must be yes or no.' }).optional(),
};

export const createClientSchema = z.object(clientFields).strict();
export const updateClientSchema = z
  .object(clientFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change.');

export const listClientsQuerySchema = z
  .object({
    page: z.coerce.number({ message: 'page must be a whole number from 0.' }).int('page must be a whole number from 0.').min(0, 'page must be a whole number from 0.').max(100000).default(0),
    pageSize: z.coerce.number({ message: 'pageSize must be 1 to 100.' }).int('pageSize must be 1 to 100.').min(1, 'pageSize must be 1 to 100.').max(100, 'pageSize must be 1 to 100.').default(25),
    sort: z.enum(['name', 'email', 'createdAt'], { message: 'sort must be name, email or createdAt.' }).default('name'),
    dir: z.enum(['asc', 'desc'], { message: 'dir must be asc or desc.' }).default('asc'),
    q: z.string().trim().max(CLIENT_TEXT_LIMITS.filter, `The filter can be at most ${CLIENT_TEXT_LIMITS.filter} characters.`).optional(),
  })
  .strict();

export type CreateClientInput = z.infer<typeof createClientSchema>;
export type UpdateClientInput = z.infer<typeof updateClientSchema>;
export type ListClientsQuery = z.infer<typeof listClientsQuerySchema>;
