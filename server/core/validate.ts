import type { RequestHandler } from 'express';
import { z } from 'zod';
import { DATE_YEARS } from '@keepstitch/shared';
import { AppError } from './app-error';

/** Turns zod issues into one message per field, in words a person can act on. */
export function fieldMessages(error: z.ZodError): Record<string, string> {
  // A Map, not a plain object: a field named "__proto__" must stay a field, not become a prototype.
  const fields = new Map<string, string>();
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        fields.set([...issue.path, key].join('.'), 'This field is not accepted here.');
      }
      continue;
    }
    const key = issue.path.join('.') || '_';
    if (!fields.has(key)) fields.set(key, issue.message);
  }
  return Object.fromEntries(fields);
}

/** The largest value of a PostgreSQL `integer` column (ids, pence, counts). */
export const MAX_INT = 2_147_483_647;

/** The id of a record sent in a body or query: a whole number an `integer` column can hold. */
export const recordId = (message: string) =>
  z.number({ message }).int(message).positive(message).max(MAX_INT, message);

/** The years a date without a time may fall in, the same in the app's date fields. */
export { DATE_YEARS };

/** A date without a time, `YYYY-MM-DD`, that exists and falls in DATE_YEARS. */
export const isoDate = z
  .string({ message: 'Enter a date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'That date does not exist.')
  .refine((s) => {
    const year = Number(s.slice(0, 4));
    return year >= DATE_YEARS.min && year <= DATE_YEARS.max;
  }, `Enter a date between ${DATE_YEARS.min} and ${DATE_YEARS.max}.`);

/**
 * Characters no text field keeps: C0 controls other than tab, line feed and
 * carriage return (NUL among them, which PostgreSQL cannot store), DEL, and
 * halves of a UTF-16 surrogate pair standing alone (not text at all).
 */
const BAD_TEXT = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/** True when a text holds a character no field keeps (see BAD_TEXT). */
export const hasBadText = (s: string) => BAD_TEXT.test(s);

export const BAD_TEXT_MESSAGE = 'This text holds a control character (such as a NUL byte) or a broken character. Remove it and try again.';

/**
 * The fields of a parsed body or query that hold bad text, or a key named
 * "__proto__" (which would otherwise vanish into the object's prototype), keyed
 * by their path as zod names them ("lines.0.description").
 */
export function badTextFields(value: unknown, prefix: string[] = [], out = new Map<string, string>(), depth = 0): Map<string, string> {
  if (typeof value === 'string') {
    if (hasBadText(value)) out.set(prefix.join('.') || '_', BAD_TEXT_MESSAGE);
  } else if (value && typeof value === 'object' && depth < 32) {
    for (const [key, inner] of Object.entries(value)) {
      const path = [...prefix, key];
      if (key === '__proto__') out.set(path.join('.'), 'A field named "__proto__" is not accepted. Remove it and try again.');
      else if (hasBadText(key)) out.set(path.map((k) => k.replace(BAD_TEXT, '?')).join('.'), 'This field name holds a control character. Remove it and try again.');
      else badTextFields(inner, path, out, depth + 1);
    }
  }
  return out;
}

/**
 * Refuses, before any route sees it, a JSON body or query string holding bad
 * text or a "__proto__" key: a 400 naming each field, so nothing reaches the database.
 */
export const refuseBadText: RequestHandler = (req, _res, next) => {
  const fields = badTextFields(req.body);
  for (const [key, message] of badTextFields(req.query)) fields.set(`query.${key}`, message);
  if (fields.size === 0) return next();
  const names = [...fields.keys()];
  next(new AppError(400, 'validation', `The request has ${names.length === 1 ? 'a field' : `${names.length} fields`} to correct: ${names.slice(0, 5).join(', ')}${names.length > 5 ? '…' : ''}.`, Object.fromEntries(fields)));
};

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
  if (!/^[1-9][0-9]{0,9}$/.test(text) || Number(text) > MAX_INT) throw AppError.notFound(what);
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
