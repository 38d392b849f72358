import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { UserModel } from '../users/user-model';
import { verifyPassword } from './password';
import './session-user';

/** Configures passport once: e-mail + password sign-in, the user id in the session. */
export function configurePassport(): passport.PassportStatic {
  passport.use(
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
  passport.serializeUser((user, done) => done(null, { id: user.id, since: Date.now() }));
  passport.deserializeUser((stored: { id: number; since: number }, done) => {
    UserModel.query()
      .findById(stored.id)
      .then((user) => {
        // A password changed after this session began ends the session.
        if (!user || user.passwordChangedAt.getTime() > stored.since) return done(null, false);
        done(null, user.toPublic());
      })
      .catch(done);
  });
  return passport;
}
