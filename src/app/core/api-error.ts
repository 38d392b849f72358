import { HttpContextToken, HttpErrorResponse } from '@angular/common/http';

/** The body the Keepstitch API sends with every error status. */
export interface ApiErrorBody {
  code: string;
  message: string;
  fields?: Record<string, string>;
}

/**
 * Set to false on a request whose errors the calling page shows itself
 * (for example the sign-in form), so no snackbar repeats them.
 */
export const REPORT_API_ERRORS = new HttpContextToken<boolean>(() => true);

/** Reads the API's error body out of a failed request, if it has one. */
export function apiErrorOf(error: unknown): ApiErrorBody | null {
  if (!(error instanceof HttpErrorResponse)) {
    return null;
  }
  const body: unknown = error.error;
  if (typeof body !== 'object' || body === null || !('error' in body)) {
    return null;
  }
  const inner: unknown = body.error;
  if (typeof inner !== 'object' || inner === null) {
    return null;
  }
  const { code, message, fields } = inner as Record<string, unknown>;
  if (typeof code !== 'string' || typeof message !== 'string') {
    return null;
  }
  const result: ApiErrorBody = { code, message };
  if (typeof fields === 'object' && fields !== null) {
    result.fields = Object.fromEntries(
      Object.entries(fields).filter((entry): entry is [string, string] => typeof entry[1] === 'string'),
    );
  }
  return result;
}

/** A sentence to show a person for a failed request. */
export function messageFor(error: unknown): string {
  const body = apiErrorOf(error);
  if (body) {
    return body.message;
  }
  if (error instanceof HttpErrorResponse) {
    if (error.status === 0) {
      return 'Keepstitch cannot reach its server. Check the connection and try again.';
    }
    if (error.status >= 500) {
      return 'The server could not finish that just now. Please try again in a moment.';
    }
    return `The request failed (${error.status}). Please try again.`;
  }
  return 'Something went wrong. Please try again.';
}
