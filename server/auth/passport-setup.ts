import type { Request } from 'express';
import { snakeCaseMappers } from 'objection';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { UserModel } from '../models/user-model';
import { verifyPassword } from '../users/password';
import type { SessionStore } from './session-store';
import './session-user';

// Rows read beside the session are snake_case, as PostgreSQL names the columns.
const { parse } = snakeCaseMappers();

/**
 * Configures passport once: e-mail + password sign-in, the user id in the
 * session. The user is the row the session store read with the session when
 * there is one, else it is read here.
 */
export function configurePassport(store: SessionStore) {
  // One instance per app, so each app's deserializer reads from its own session store.
  const instance = new passport.Passport();
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      UserModel.query()
        .whereRaw('lower(email) = lower(?)', [email])
        .first()
        .then(async (user) => {
          const ok = await verifyPassword(password, user?.passwordHash);
          done(null, ok && user ? user.toPublic() : false);
        })
        .catch(done);
    }),
  );
  instance.serializeUser((user, done) => done(null, { id: user.id, since: Date.now() }));
  instance.deserializeUser((req: Request, stored: { id: number; since: number }, done: (err: unknown, user?: Express.User | false) => void) => {
    const kept = store.takeUser(req.sessionID);
    const read = kept && (kept.row === null || kept.row['id'] === stored.id)
      ? Promise.resolve(kept.row ? UserModel.fromDatabaseJson(parse(kept.row)) : undefined)
      : UserModel.query().findById(stored.id);
    read
      .then((user) => {
        // A password changed after this session began ends the session.
        if (!user || user.passwordChangedAt.getTime() > stored.since) return done(null, false);
        done(null, user.toPublic());
      })
      .catch(done);
  });
  return instance;
}
