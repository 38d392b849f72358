import express, { type Express } from 'express';
import session from 'express-session';
import cookieParser from 'cookie-parser';
import helmet from 'helmet';
import { Model } from 'objection';
import type { Knex } from 'knex';
import type { Pool } from 'pg';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { AppConfig } from './core/config';
import { apiNotFound, errorMiddleware } from './core/error-middleware';
import { refuseBadText } from './core/validate';
import { assertPolicyCovered } from './core/secured-router';
import { configurePassport } from './auth/passport-setup';
import { createCsrf } from './auth/csrf';
import { authRouter } from './auth/auth-router';
import { invitationsRouter } from './auth/invitations-router';
import { SessionStore } from './auth/session-store';
import { SignInLimits, signedCookieSecret } from './auth/sign-in-limits';
import { healthRouter } from './health/health-router';
import { clientsRouter } from './clients/clients-router';
import { usersRouter } from './users/users-router';
import { commissionsRouter } from './commissions/commissions-router';
import { workroomRouter } from './workroom/workroom-router';
import { garmentsRouter } from './garments/garments-router';
import { photosRouter } from './photos/photos-router';
import { stockRouter } from './stock/stock-router';
import { designsRouter } from './designs/designs-router';
import { settingsRouter } from './settings/settings-router';
import { quotesRouter } from './quotes/quotes-router';
import { mailRouter } from './mail/mail-router';
import { dueRouter } from './due/due-router';
import { paymentsRouter, paymentsWebhookRouter } from './payments/payments-router';
import { createPaymentProvider } from './payments/payment-provider';
import type Stripe from 'stripe';

export const SESSION_COOKIE = 'ks.sid';

export interface AppDeps {
  config: AppConfig;
  knex: Knex;
  /** pg pool the session store and the sign-in limits use. */
  sessionPool: Pool;
  log?: (err: unknown) => void;
  /** Asks the outbox worker to deliver now (mail was just queued). */
  kickMail?: () => void;
  /** The payment provider's SDK; by default built from the configuration. */
  paymentProvider?: Stripe;
}

/** Builds the Express app (API and, when built, the Angular app) without listening. */
export function createApp({ config, knex, sessionPool, log, kickMail = () => undefined, paymentProvider }: AppDeps): Express {
  const provider = paymentProvider ?? createPaymentProvider(config);
  Model.knex(knex);
  const csrf = createCsrf(config.sessionSecret, config.secureCookies);

  const app = express();
  app.disable('x-powered-by');
  // Which proxies may name the client's address (X-Forwarded-For): req.ip, which the sign-in limits count by.
  app.set('trust proxy', config.trustProxy);

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Angular inserts component styles as <style> elements.
          styleSrc: ["'self'", "'unsafe-inline'"],
          fontSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          ...(config.secureCookies ? { upgradeInsecureRequests: [] } : {}),
        },
      },
      strictTransportSecurity: config.secureCookies,
      // The same answer as frame-ancestors 'none' above, for browsers that only read X-Frame-Options.
      xFrameOptions: { action: 'deny' },
    }),
  );

  // Health answers even when sessions cannot be read (the database is down).
  app.use(healthRouter(knex));
  // The payment provider signs its webhooks; they need the raw body and no session or CSRF token.
  app.use(paymentsWebhookRouter(provider, config, knex, kickMail));

  app.use('/api', express.json({ limit: '200kb' }));
  // Signs the known-browser cookie of the sign-in limits.
  app.use(cookieParser(signedCookieSecret(config.sessionSecret)));
  const sessionStore = new SessionStore({ pool: sessionPool, pruneSeconds: config.nodeEnv === 'test' ? false : 15 * 60, touchSeconds: config.sessionTouchSeconds });
  const passport = configurePassport(sessionStore);
  app.use(
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store: sessionStore,
      resave: false,
      saveUninitialized: false,
      // A session ends after this long without a request.
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, maxAge: config.sessionIdleMinutes * 60 * 1000, path: '/' },
    }),
  );
  app.use(passport.session());
  app.use('/api', csrf.protect);
  app.use('/api', refuseBadText);

  app.use(
    authRouter({
      csrf,
      limits: new SignInLimits({
        pool: sessionPool,
        secret: config.sessionSecret,
        secureCookies: config.secureCookies,
        accountLimit: config.signInLimit,
        addressLimit: config.signInAddressLimit,
        windowMs: config.signInWindowMs,
        delayMs: config.signInDelayMs,
      }),
      sessionCookieName: SESSION_COOKIE,
      passport,
      appUrl: config.appUrl,
      kickMail,
    }),
  );
  app.use(clientsRouter());
  app.use(invitationsRouter(config.appUrl, kickMail));
  app.use(usersRouter());
  app.use(commissionsRouter());
  app.use(workroomRouter(config, kickMail));
  app.use(garmentsRouter());
  app.use(photosRouter(config.uploadDir));
  app.use(stockRouter());
  app.use(designsRouter());
  app.use(settingsRouter(config));
  app.use(quotesRouter(config, kickMail));
  app.use(paymentsRouter(provider, config, kickMail));
  app.use(mailRouter(config, kickMail));
  app.use(dueRouter(config.appUrl));
  assertPolicyCovered();

  app.use('/api', apiNotFound);

  if (existsSync(path.join(config.webRoot, 'index.html'))) {
    app.use(express.static(config.webRoot, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(config.webRoot, 'index.html'));
    });
  }

  app.use(errorMiddleware(log));
  return app;
}
