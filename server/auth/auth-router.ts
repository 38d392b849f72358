import type { NextFunction, Request, Response } from 'express';
import rateLimit from 'express-rate-limit';
import { AppError } from '../core/app-error';
import { securedRouter } from '../core/secured-router';
import { parseInput } from '../core/validate';
import { changePasswordSchema, signInSchema } from './auth-schemas';
import { changeOwnPassword } from '../users/users-service';
import type { createCsrf } from './csrf';
import type { configurePassport } from './passport-setup';

interface AuthRouterOptions {
  csrf: ReturnType<typeof createCsrf>;
  signInLimit: number;
  signInWindowMs: number;
  sessionCookieName: string;
  /** The app's passport instance (server/auth/passport-setup.ts). */
  passport: ReturnType<typeof configurePassport>;
}

export function authRouter({ csrf, signInLimit, signInWindowMs, sessionCookieName, passport }: AuthRouterOptions) {
  const r = securedRouter('/api/auth');

  const limiter = rateLimit({
    windowMs: signInWindowMs,
    limit: signInLimit,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next, options) => {
      const minutes = Math.ceil(options.windowMs / 60000);
      next(
        new AppError(
          429,
          'rate_limited',
          `Too many sign-in attempts from here. Please wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`,
        ),
      );
    },
  });

  r.get('/me', (req, res) => {
    csrf.issueToken(req, res);
    res.json({ user: req.user ?? null });
  });

  r.post('/sign-in', limiter, (req: Request, res: Response, next: NextFunction) => {
    parseInput(signInSchema, req.body, 'sign-in');
    passport.authenticate('local', (err: unknown, user: Express.User | false) => {
      if (err) return next(err);
      if (!user) return next(new AppError(401, 'bad_credentials', 'That e-mail and password do not match a sign-in.'));
      // passport regenerates the session here, so the old session id cannot be reused.
      req.login(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        csrf.issueToken(req, res, true);
        res.json({ user });
      });
    })(req, res, next);
  });

  // Guessing the current password is limited like guessing at sign-in.
  r.post('/password', limiter, async (req, res, next) => {
    const { currentPassword, newPassword } = parseInput(changePasswordSchema, req.body, 'password');
    const user = req.user!;
    await changeOwnPassword(user.id, currentPassword, newPassword);
    // Every session has ended, this one too: start a new one so whoever changed it stays signed in.
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
