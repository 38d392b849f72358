import { randomBytes } from 'node:crypto';
import type { CookieOptions, Request, Response } from 'express';
import { doubleCsrf } from 'csrf-csrf';

/** A random id of an anonymous browser, so its CSRF token is its own without storing a session for it. */
export const ANONYMOUS_COOKIE = 'ks.anon';

/**
 * CSRF protection by signed double-submit: the token sits in a readable
 * XSRF-TOKEN cookie (Angular's convention), is bound by an HMAC to who is
 * asking, and every state-changing request must echo it in X-XSRF-TOKEN.
 * A signed-in request is bound to its session id. An anonymous one (the
 * sign-in form) has no stored session, since one is stored only once someone
 * signs in: its token is bound to a random id in an http-only cookie instead.
 */
export function createCsrf(secret: string, secure: boolean) {
  const csrf = doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => (req.user ? `session:${req.sessionID}` : `anonymous:${anonymousId(req) ?? ''}`),
    cookieName: 'XSRF-TOKEN',
    cookieOptions: { sameSite: 'lax', secure, httpOnly: false, path: '/' },
    getCsrfTokenFromRequest: (req) => req.get('x-xsrf-token'),
  });
  const anonymousCookie: CookieOptions = { sameSite: 'lax', secure, httpOnly: true, path: '/' };

  /** Issues (or re-uses) the token of this session, or of this anonymous browser. */
  const issueToken = (req: Request, res: Response, fresh = false): string => {
    if (!req.user && !anonymousId(req)) {
      const id = randomBytes(18).toString('base64url');
      res.cookie(ANONYMOUS_COOKIE, id, anonymousCookie);
      // The token made below is bound to it already.
      req.cookies[ANONYMOUS_COOKIE] = id;
    }
    return csrf.generateCsrfToken(req, res, { overwrite: fresh });
  };

  return { protect: csrf.doubleCsrfProtection, issueToken };
}

function anonymousId(req: Request): string | undefined {
  const id: unknown = req.cookies?.[ANONYMOUS_COOKIE];
  return typeof id === 'string' && /^[\w-]{24}$/.test(id) ? id : undefined;
}
