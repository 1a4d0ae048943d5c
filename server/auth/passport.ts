import type { Knex } from 'knex';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request } from 'express';
import { hashPassword, verifyPassword } from './passwords';
import { findUserByEmail, findUserById, toSessionUser } from './users.repo';
import type { SessionUser } from './roles';

// Verifying against a fixed hash when the account is unknown keeps the answer
// time the same for known and unknown e-mails.
let dummyHash: Promise<string> | undefined;
const dummy = () => (dummyHash ??= hashPassword('no-such-account-placeholder'));

export function configurePassport(db: Knex) {
  const p = new passport.Passport();
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const row = await findUserByEmail(db, email.trim());
        const ok = await verifyPassword(row?.password_hash ?? (await dummy()), password);
        done(null, row && ok ? toSessionUser(row) : false);
      } catch (err) {
        done(err);
      }
    }),
  );
  p.serializeUser((user, done) => done(null, (user as SessionUser).id));
  p.deserializeUser(async (id: string, done) => {
    try {
      const row = await findUserById(db, id);
      // A removed member's session simply ends.
      done(null, row ? toSessionUser(row) : false);
    } catch (err) {
      done(err);
    }
  });
  return p;
}

/** Signs the user in: passport regenerates the session id, then a fresh CSRF token is made. */
export function logIn(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => {
    req.login(user, (err) => (err ? reject(err) : resolve()));
  });
}

export function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    req.logout((err) => {
      if (err) return reject(err);
      req.session.destroy((e) => (e ? reject(e) : resolve()));
    });
  });
}

export function authenticateLocal(p: passport.Authenticator, req: Request): Promise<SessionUser | false> {
  return new Promise((resolve, reject) => {
    p.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false) => {
      if (err) reject(err);
      else resolve(user);
    })(req, req.res!, (e: unknown) => reject(e));
  });
}
