import { z } from 'zod';
import { AGE_GROUP, COMMISSION_KIND, COMMISSION_TEXT_LIMITS as TEXT, STAGES, ALL_STAGES } from '@keepstitch/shared';
import { isoDate, MAX_INT, optionalText, recordId } from '../core/validate';
import { lengthField, lengthUnitSchema, toMillimetres } from '../core/length-input';

const commissionFields = {
  clientId: recordId('Choose the client.'),
  title: z.string({ message: 'Title is required.' }).trim().min(1, 'Title is required.').max(TEXT.title, `A title can be at most ${TEXT.title} characters.`),
  kind: z.enum(COMMISSION_KIND.values, { message: 'Choose what kind of piece it is.' }),
  recipient: optionalText(TEXT.recipient, 'Who it is for'),
  ageGroup: z.enum(AGE_GROUP.values, { message: 'Choose the age group of who it is for.' }),
  occasion: optionalText(TEXT.occasion, 'Occasion'),
  sizePreset: optionalText(TEXT.sizePreset, 'Size preset'),
  width: lengthField('Width').nullable().optional(),
  length: lengthField('Length').nullable().optional(),
  unit: lengthUnitSchema.default('in'),
  deadline: isoDate.nullable().optional(),
  budgetPence: z.number({ message: 'Budget must be an amount in pence.' }).int('Budget must be whole pence.').min(0, 'Budget cannot be negative.').max(100_000_00, 'Budget is too large.').nullable().optional(),
  notes: optionalText(TEXT.notes, 'Notes'),
};

/** Turns typed width/length into exact millimetres. */
function withSize<T extends { width?: string | null; length?: string | null; unit: 'in' | 'cm' | 'mm' | 'm' | 'yd' }>(v: T, ctx: z.RefinementCtx) {
  const { width, length, unit, ...rest } = v;
  const out: Omit<T, 'width' | 'length' | 'unit'> & { widthMm?: string | null; lengthMm?: string | null } = rest;
  if (width !== undefined) out.widthMm = width === null ? null : toMillimetres(width, unit, ctx, 'width');
  if (length !== undefined) out.lengthMm = length === null ? null : toMillimetres(length, unit, ctx, 'length');
  return out;
}

export const createCommissionSchema = z.object(commissionFields).strict().transform(withSize);
export const updateCommissionSchema = z
  .object(commissionFields)
  .omit({ clientId: true })
  .partial()
  .extend({ unit: lengthUnitSchema.default('in') })
  .strict()
  .transform(withSize);

export const listCommissionsQuerySchema = z
  .object({
    page: z.coerce.number().int().min(0, 'page must be a whole number from 0.').default(0),
    pageSize: z.coerce.number().int().min(1, 'pageSize must be 1 to 100.').max(100, 'pageSize must be 1 to 100.').default(25),
    sort: z.enum(['deadline', 'createdAt', 'title', 'stage'], { message: 'sort must be deadline, createdAt, title or stage.' }).default('deadline'),
    dir: z.enum(['asc', 'desc'], { message: 'dir must be asc or desc.' }).default('asc'),
    stage: z
      .string()
      .transform((s) => s.split(',').filter(Boolean))
      .pipe(z.array(z.enum(ALL_STAGES, { message: 'stage must be one of the commission stages.' })))
      .optional(),
    clientId: z.coerce.number().int().positive().max(MAX_INT, 'clientId must be the id of a client.').optional(),
    dueWithinDays: z.coerce.number().int().min(0).max(3650).optional(),
    q: z.string().trim().max(TEXT.filter, `The filter can be at most ${TEXT.filter} characters.`).optional(),
  })
  .strict();

export const stageMoveSchema = z
  .object({
    to: z.enum(ALL_STAGES, { message: 'Choose the stage to move to.' }),
    note: optionalText(TEXT.moveNote, 'Note'),
  })
  .strict();

export const hoursSchema = z
  .object({
    stage: z.enum(STAGES, { message: 'Choose the stage the hours were for.' }),
    hours: z.number({ message: 'Hours must be a number.' }).positive('Hours must be more than 0.').max(24, 'At most 24 hours in one entry.').multipleOf(0.25, 'Log hours in quarters (0.25).'),
    workedOn: isoDate,
    note: optionalText(TEXT.hoursNote, 'Note'),
  })
  .strict();

export type CreateCommissionInput = z.infer<typeof createCommissionSchema>;
export type UpdateCommissionInput = z.infer<typeof updateCommissionSchema>;
export type ListCommissionsQuery = z.infer<typeof listCommissionsQuerySchema>;
