import Decimal from 'decimal.js';
import { z } from 'zod';
import { STAGES, QUOTE_TEXT_LIMITS } from '@keepstitch/shared';
import { optionalText } from '../core/validate';

const QUANTITY = /^\d{1,8}(\.\d{1,4})?$/;

const decimalText = z
  .union([z.number(), z.string().trim()], { message: 'Quantity must be a number.' })
  .transform((v) => String(v))
  .refine((s) => QUANTITY.test(s) && Number(s) > 0, 'Quantity must be a number above 0 with at most 4 decimal places.');

export const quoteLineSchema = z
  .object({
    kind: z.enum(['material', 'labour', 'extra', 'discount'], { message: 'Choose material, labour, extra or discount.' }),
    description: z.string({ message: 'Describe the line.' }).trim().min(1, 'Describe the line.').max(QUOTE_TEXT_LIMITS.lineDescription, `A line can be at most ${QUOTE_TEXT_LIMITS.lineDescription} characters.`),
    quantity: decimalText,
    unit: z.string().trim().max(QUOTE_TEXT_LIMITS.lineUnit, `A unit can be at most ${QUOTE_TEXT_LIMITS.lineUnit} characters.`).default('item'),
    unitPricePence: z.number({ message: 'Price must be an amount in pence.' }).int('Price must be whole pence.').min(-10_000_000).max(10_000_000),
    stage: z.enum(STAGES).nullable().optional(),
  })
  .strict()
  .superRefine((l, ctx) => {
    if (l.kind === 'discount' && l.unitPricePence > 0) ctx.addIssue({ code: 'custom', path: ['unitPricePence'], message: 'A discount is a negative amount.' });
    if (l.kind !== 'discount' && l.unitPricePence < 0) ctx.addIssue({ code: 'custom', path: ['unitPricePence'], message: 'Only a discount can be negative.' });
  });

/**
 * The most a quote may come to before VAT, in pence (£1,000,000): with VAT at
 * any rate offered it stays well inside the integer columns its totals are kept in.
 */
export const MAX_QUOTE_NET_PENCE = 100_000_000;
const MAX_QUOTE_WORDS = '£1,000,000';

export const quoteSchema = z
  .object({
    intro: optionalText(QUOTE_TEXT_LIMITS.intro, 'Introduction'),
    lines: z.array(quoteLineSchema).min(1, 'A quote needs at least one line.').max(200, 'At most 200 lines.'),
    depositPercent: z.number().min(0, 'Deposit must be 0 to 100 percent.').max(100, 'Deposit must be 0 to 100 percent.').optional(),
  })
  .strict()
  .superRefine((q, ctx) => {
    let charged = new Decimal(0);
    q.lines.forEach((l, i) => {
      // A line whose own quantity or price is refused is reported by its own check (zod still runs this one).
      if (!QUANTITY.test(l.quantity) || !Number.isInteger(l.unitPricePence)) return;
      const amount = new Decimal(l.quantity).times(l.unitPricePence);
      if (amount.abs().gt(MAX_QUOTE_NET_PENCE)) {
        ctx.addIssue({ code: 'custom', path: ['lines', i, 'quantity'], message: `This line comes to more than ${MAX_QUOTE_WORDS}. Check its quantity and price.` });
      } else if (amount.gt(0)) charged = charged.plus(amount);
    });
    if (charged.gt(MAX_QUOTE_NET_PENCE)) {
      ctx.addIssue({ code: 'custom', path: ['lines'], message: `A quote can come to at most ${MAX_QUOTE_WORDS} before VAT. Split the work into more than one quote.` });
    }
  });

export const acceptSchema = z.object({ name: z.string({ message: 'Type your name to accept.' }).trim().min(2, 'Type your name to accept.').max(QUOTE_TEXT_LIMITS.acceptName) }).strict();
export const declineSchema = z.object({ note: optionalText(QUOTE_TEXT_LIMITS.declineNote, 'Note') }).strict();

export type QuoteInput = z.infer<typeof quoteSchema>;
