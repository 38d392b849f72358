import type { ErrorRequestHandler, RequestHandler } from 'express';
import { DBError, ForeignKeyViolationError, NotFoundError, UniqueViolationError, ValidationError } from 'objection';
import { ZodError } from 'zod';
import { AppError } from './app-error';
import { fieldMessages } from './validate';

/**
 * PostgreSQL's "data exception" codes for a value the database cannot hold
 * (a number past its column, a date out of range, a NUL in text). Validation
 * refuses these first; this is the net for a value that slips past it. The
 * statement failed, so nothing it meant to write was kept.
 */
const DATA_EXCEPTION_MESSAGES: Record<string, string> = {
  '22003': 'A number in the request is too large to keep. Check the amounts and quantities and try again.',
  '22008': 'A date in the request is out of range. Check the dates and try again.',
  '22007': 'A date in the request could not be read. Enter dates as YYYY-MM-DD.',
  '22021': 'The request holds a character that cannot be kept (such as a NUL byte). Remove it and try again.',
  '22P05': 'The request holds a character that cannot be kept. Remove it and try again.',
  '22001': 'A text in the request is too long to keep. Shorten it and try again.',
};

/** busboy's own words for a multipart body it cannot read (it has no error codes). */
const MALFORMED_UPLOAD = /^(Malformed part header|Malformed urlencoded form|Unexpected end of form|Multipart: Boundary not found|Unsupported content type|Missing Content-Type|Part terminated early)/;

const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '08006', '08001', '08003']);

/** True when an error says the database cannot be reached right now. */
export function isDatabaseDown(err: unknown): boolean {
  let e: unknown = err;
  for (let depth = 0; e && depth < 4; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && DB_DOWN_CODES.has(code)) return true;
    const message = (e as { message?: unknown }).message;
    if (typeof message === 'string' && /Knex: Timeout acquiring a connection|Connection terminated/.test(message)) return true;
    e = (e as { nativeError?: unknown; cause?: unknown }).nativeError ?? (e as { cause?: unknown }).cause;
  }
  return false;
}

function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return new AppError(400, 'validation', 'The request has fields to correct.', fieldMessages(err));
  if (err instanceof NotFoundError) return AppError.notFound();
  if (err instanceof ValidationError) return new AppError(400, 'validation', err.message);
  if (err instanceof UniqueViolationError) return AppError.conflict('A record with the same value already exists.');
  if (err instanceof ForeignKeyViolationError) {
    return AppError.conflict('This record is still linked to other records, so the change was not made.');
  }
  if (isDatabaseDown(err)) {
    // A write may have reached the database just before it stopped answering: say so rather than promise nothing changed.
    return new AppError(503, 'unavailable', 'The workroom database is not answering just now. Please try again in a moment; if you were saving, check whether the change was kept before saving again.');
  }
  const e = err as { code?: string; type?: string; status?: number; name?: string; field?: string };
  // The caller went away mid-request (a closed tab, a dropped upload): nothing to answer, nothing to log.
  if ((err as Error).message === 'aborted' || e.code === 'ECONNABORTED' || e.code === 'ECONNRESET') {
    return new AppError(400, 'aborted', 'The request was cut off before it arrived whole.');
  }
  if (e.name === 'MulterError') {
    const messages: Record<string, [number, string]> = {
      LIMIT_FILE_SIZE: [413, 'Each photo can be at most 15 MB. Make it smaller and try again.'],
      LIMIT_FILE_COUNT: [400, 'Send at most 10 photos at a time.'],
      LIMIT_UNEXPECTED_FILE: [400, 'Photos must be sent in the "photos" field, at most 10 at a time.'],
      LIMIT_PART_COUNT: [400, 'The upload has too many parts.'],
      LIMIT_FIELD_VALUE: [400, 'A field of the upload is too long.'],
    };
    const [status, message] = messages[e.code ?? ''] ?? [400, 'The upload could not be read.'];
    return new AppError(status, 'upload_rejected', message);
  }
  if (e.code === 'EBADCSRFTOKEN') {
    return new AppError(403, 'csrf', 'This request was missing its security token. Reload the page and try again.');
  }
  if (e.type === 'entity.parse.failed') return new AppError(400, 'bad_json', 'The request body is not valid JSON.');
  if (e.type === 'entity.too.large') return new AppError(413, 'too_large', 'The request is too large.');
  const dbCode = (err as { nativeError?: { code?: unknown } }).nativeError?.code ?? e.code;
  if (typeof dbCode === 'string' && DATA_EXCEPTION_MESSAGES[dbCode]) return new AppError(400, 'out_of_range', DATA_EXCEPTION_MESSAGES[dbCode]);
  if (err instanceof Error && !e.code && MALFORMED_UPLOAD.test(err.message)) {
    return new AppError(400, 'upload_rejected', 'The upload could not be read. A file name may hold a character that cannot be sent (such as a control character): rename the file and try again.');
  }
  if (err instanceof DBError) return new AppError(500, 'internal', 'Something went wrong on our side. Nothing was changed.');
  if (typeof e.status === 'number' && e.status >= 400 && e.status < 500) {
    return new AppError(e.status, 'bad_request', 'The request could not be understood.');
  }
  return new AppError(500, 'internal', 'Something went wrong on our side. Please try again; if it keeps happening, tell us what you were doing.');
}

/** The one error middleware, registered last. Never sends SQL or a stack trace. */
export function errorMiddleware(log: (err: unknown) => void = (err) => console.error(err)): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    const appError = toAppError(err);
    // A 503 of a service's own (the payment service, the mail server) names that service; any other is the database.
    if (appError.status === 503) log(err instanceof AppError ? `Not answering (${appError.code}): ${appError.message}` : `Database not answering: ${(err as Error).message}`);
    else if (appError.status >= 500) log(err);
    const body: { code: string; message: string; fields?: Record<string, string> } = {
      code: appError.code,
      message: appError.message,
    };
    if (appError.fields) body.fields = appError.fields;
    res.status(appError.status).json({ error: body });
  };
}

/** 404 for any /api path no route answered. */
export const apiNotFound: RequestHandler = (_req, _res, next) => {
  next(new AppError(404, 'not_found', 'There is no such API route.'));
};
