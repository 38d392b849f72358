import { z } from 'zod';
import { isLengthUnit, parseLength, DomainError, type LengthUnit } from '@keepstitch/shared';

export const lengthUnitSchema = z.enum(['in', 'cm', 'mm', 'm', 'yd'], { message: 'unit must be in, cm, mm, m or yd.' });

/**
 * A length typed by a maker ("19 1/2", "7½", "50 cm"), read by the shared
 * parser in the given default unit, stored as exact millimetres (a decimal string).
 */
export function lengthField(label: string) {
  return z.string({ message: `${label} is required.` }).trim().min(1, `${label} is required.`).max(40, `${label} is too long.`);
}

/** Parses a typed length to exact millimetres, or adds a field issue saying what was expected. */
export function toMillimetres(text: string, unit: LengthUnit, ctx: z.RefinementCtx, path: string): string {
  try {
    const length = parseLength(text, isLengthUnit(unit) ? unit : 'in');
    if (!length.mm.gt(0)) throw new DomainError('not-positive', 'Expected a size greater than zero.');
    return length.mm.toString();
  } catch (err) {
    ctx.addIssue({ code: 'custom', path: [path], message: err instanceof DomainError ? err.message : 'Expected a length such as 7 1/2 or 19 cm.' });
    return z.NEVER;
  }
}
