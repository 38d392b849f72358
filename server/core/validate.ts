import { z } from 'zod';
import { AppError } from './app-error';

/** Turns zod issues into one message per field, in words a person can act on. */
export function fieldMessages(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        fields[[...issue.path, key].join('.')] = 'This field is not accepted here.';
      }
      continue;
    }
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Parses input with a zod schema or throws a 400 with the message of every bad field. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown, what = 'request'): z.infer<S> {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const fields = fieldMessages(result.error);
  const count = Object.keys(fields).length;
  throw new AppError(
    400,
    'validation',
    count === 1 ? `The ${what} has a field to correct.` : `The ${what} has ${count} fields to correct.`,
    fields,
  );
}

/** A numeric route parameter (`/:id`). Anything else is "not found", like an id that does not exist. */
export function parseId(value: unknown, what = 'That record'): number {
  const text = typeof value === 'string' ? value : '';
  if (!/^[1-9][0-9]{0,9}$/.test(text) || Number(text) > 2147483647) throw AppError.notFound(what);
  return Number(text);
}

/** Optional free text from a form: trimmed; an empty string becomes null. */
export const optionalText = (max: number, label: string) =>
  z
    .string({ message: `${label} must be text.` })
    .max(max, { message: `${label} can be at most ${max} characters.` })
    .transform((s) => (s.trim() === '' ? null : s.trim()))
    .nullable()
    .optional();
