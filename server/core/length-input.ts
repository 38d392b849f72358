import { z } from 'zod';
import { isLengthUnit, parseLength, DomainError, type LengthUnit } from '@keepstitch/shared';

export const lengthUnitSchema = z.enum(['in', 'cm', 'mm', 'm', 'yd'], { message: 'unit must be in, cm, mm, m or yd.' });

/**
 * A length typed by a maker ("19 1/2", "7½", "50 cm"), read by the shared
 * parser in the given default unit, stored as exact millimetres (a decimal string).
 */
export function lengthField(label: string, options: { allowZero?: boolean } = {}) {
  return z
    .string({ message: `${label} is required.` })
    .trim()
    .min(1, `${label} is required.`)
    .max(40, `${label} is too long.`)
    .superRefine((text, ctx) => {
      // Checked here as well as on conversion so every bad field is reported in one answer.
      const problem = lengthProblem(text, 'in', options);
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    });
}

/** Why a typed length cannot be used, or null when it can. */
function lengthProblem(text: string, unit: LengthUnit, options: { allowZero?: boolean } = {}): string | null {
  try {
    const length = parseLength(text, isLengthUnit(unit) ? unit : 'in', { allowZero: options.allowZero });
    return length.mm.gt(0) || (options.allowZero && length.mm.isZero()) ? null : 'Expected a size greater than zero.';
  } catch (err) {
    return err instanceof DomainError ? err.message : 'Expected a length such as 7 1/2 or 19 cm.';
  }
}

/** Parses a typed length to exact millimetres, or adds a field issue saying what was expected. */
export function toMillimetres(
  text: string,
  unit: LengthUnit,
  ctx: z.RefinementCtx,
  path: string | (string | number)[],
  options: { allowZero?: boolean } = {},
): string {
  const problem = lengthProblem(text, unit, options);
  if (problem) {
    ctx.addIssue({ code: 'custom', path: typeof path === 'string' ? [path] : path, message: problem });
    return z.NEVER;
  }
  return parseLength(text, unit, { allowZero: options.allowZero }).mm.toString();
}
