import type { Request, Response } from 'express';
import { doubleCsrf } from 'csrf-csrf';

/**
 * CSRF protection by signed double-submit: the token sits in a readable
 * XSRF-TOKEN cookie (Angular's convention), is bound to the session id by an
 * HMAC, and every state-changing request must echo it in X-XSRF-TOKEN.
 */
export function createCsrf(secret: string, secure: boolean) {
  const csrf = doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => req.session?.id ?? '',
    cookieName: 'XSRF-TOKEN',
    cookieOptions: { sameSite: 'lax', secure, httpOnly: false, path: '/' },
    getCsrfTokenFromRequest: (req) => req.get('x-xsrf-token'),
  });

  /** Issues (or re-uses) the token of this session; keeps an anonymous session so the token stays valid. */
  const issueToken = (req: Request, res: Response, fresh = false): string => {
    req.session.csrfIssued = true;
    return csrf.generateCsrfToken(req, res, { overwrite: fresh });
  };

  return { protect: csrf.doubleCsrfProtection, issueToken };
}
