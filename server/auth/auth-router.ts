import { setTimeout as sleep } from 'node:timers/promises';
import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../core/app-error';
import { securedRouter, signedInUser } from '../core/secured-router';
import { parseInput } from '../core/validate';
import { changePasswordSchema, forgotPasswordSchema, setPasswordSchema, signInSchema } from './auth-schemas';
import { RESET_REQUEST_MIN_MS, requestPasswordReset } from './invitations';
import { setPasswordWithLink } from '../users/password-links';
import { changeOwnPassword } from '../users/users-service';
import type { createCsrf } from './csrf';
import type { configurePassport } from './passport-setup';
import type { SignInLimits } from './sign-in-limits';

interface AuthRouterOptions {
  csrf: ReturnType<typeof createCsrf>;
  /** Limits on guessing passwords, kept in the database (server/auth/sign-in-limits.ts). */
  limits: SignInLimits;
  sessionCookieName: string;
  /** The app's passport instance (server/auth/passport-setup.ts). */
  passport: ReturnType<typeof configurePassport>;
  /** Where the links in mails point (APP_URL). */
  appUrl: string;
  /** Starts delivering the outbox now. */
  kickMail: () => void;
}

/** The answer to "forgot password", whether or not the address has a sign-in. */
export const RESET_REQUESTED = 'If that e-mail address has a sign-in, a link to choose a new password is on its way. It works once, for an hour.';

export function authRouter({ csrf, limits, sessionCookieName, passport, appUrl, kickMail }: AuthRouterOptions) {
  const r = securedRouter('/api/auth');

  r.get('/me', (req, res) => {
    csrf.issueToken(req, res);
    res.json({ user: req.user ?? null });
  });

  r.post('/sign-in', async (req: Request, res: Response, next: NextFunction) => {
    const { email } = parseInput(signInSchema, req.body, 'sign-in');
    const checkPassword = () =>
      new Promise<Express.User | false>((resolve, reject) => {
        passport.authenticate('local', (err: unknown, user: Express.User | false) => (err ? reject(err) : resolve(user)))(req, res, next);
      });
    const user = await limits.signIn(req, res, email, checkPassword);
    if (!user) throw new AppError(401, 'bad_credentials', 'That e-mail and password do not match a sign-in.');
    // passport regenerates the session here, so the old session id cannot be reused.
    req.login(user, (loginErr) => {
      if (loginErr) return next(loginErr);
      csrf.issueToken(req, res, true);
      res.json({ user });
    });
  });

  // Guessing the current password is limited like guessing at sign-in.
  r.post('/password', async (req, res, next) => {
    const { currentPassword, newPassword } = parseInput(changePasswordSchema, req.body, 'password');
    const user = signedInUser(req);
    await limits.checkCurrentPassword(
      user.id,
      () => changeOwnPassword(user.id, currentPassword, newPassword),
      (err) => err instanceof AppError && err.fields?.['currentPassword'] !== undefined,
    );
    // Every session has ended, this one too: start a new one so whoever changed it stays signed in.
    req.login(user, (loginErr) => {
      if (loginErr) return next(loginErr);
      csrf.issueToken(req, res, true);
      res.json({ user });
    });
  });

  // The same answer, after about the same time, whether or not the address has a sign-in.
  r.post('/forgot-password', async (req, res) => {
    const started = Date.now();
    const { email } = parseInput(forgotPasswordSchema, req.body, 'request');
    await limits.resetRequest(req, email, () => requestPasswordReset(email, appUrl));
    kickMail();
    const wait = RESET_REQUEST_MIN_MS - (Date.now() - started);
    if (wait > 0) await sleep(wait);
    res.status(202).json({ message: RESET_REQUESTED });
  });

  // A one-time link from an invitation or a reset: the password is set, other sessions end, and this one begins.
  r.post('/set-password', async (req, res, next) => {
    const { token, password } = parseInput(setPasswordSchema, req.body, 'password');
    const user = (await limits.useLink(req, () => setPasswordWithLink(token, password))).toPublic();
    req.login(user, (loginErr) => {
      if (loginErr) return next(loginErr);
      csrf.issueToken(req, res, true);
      res.json({ user });
    });
  });

  r.post('/sign-out', (req, res, next) => {
    req.logout((logoutErr) => {
      if (logoutErr) return next(logoutErr);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        res.clearCookie(sessionCookieName, { path: '/' });
        res.clearCookie('XSRF-TOKEN', { path: '/' });
        res.status(204).end();
      });
    });
  });

  return r.router;
}
