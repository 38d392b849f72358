import { z } from 'zod';
import { PAYMENT_TEXT_LIMITS } from '@keepstitch/shared';
import { MAX_INT, isoDate } from '../core/validate';

const requiredText = (max: number, label: string, what: string) =>
  z
    .string({ message: `Enter ${what}.` })
    .transform((s) => s.trim())
    .pipe(z.string().min(1, `Enter ${what}.`).max(max, `${label} can be at most ${max} characters.`));

/** Money the owner has received outside the card checkout. */
export const manualPaymentSchema = z
  .object({
    kind: z.enum(['deposit', 'balance'], { message: 'Choose whether this is the deposit or the balance.' }),
    amountPence: z
      .number({ message: 'Enter the amount received, in pence.' })
      .int('Enter the amount in whole pence.')
      .positive('The amount must be more than £0.00.')
      .max(MAX_INT, 'That amount is too large.'),
    method: z.enum(['cash', 'bank_transfer'], { message: 'Choose cash or bank transfer.' }),
    receivedOn: isoDate,
    reference: requiredText(PAYMENT_TEXT_LIMITS.reference, 'The reference', 'a reference (such as the bank reference, or "cash at the fitting")'),
  })
  .strict();

/** The owner takes back a payment recorded by mistake, saying why. */
export const undoPaymentSchema = z
  .object({
    note: requiredText(PAYMENT_TEXT_LIMITS.undoNote, 'The note', 'a note saying why this payment is undone'),
  })
  .strict();

export type ManualPaymentInput = z.infer<typeof manualPaymentSchema>;
