import passportModule from 'passport';
import type { Db } from '../db/client';
import { findUser, publicUser } from './users';

type PassportInstance = InstanceType<typeof passportModule.Passport>;

/**
 * A passport instance of its own per app (tests build many apps in one process). The session
 * holds only the user id; the row is read on each request, so a deleted user is signed out.
 */
export function createPassport(db: Db): PassportInstance {
  const passport = new passportModule.Passport();
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: unknown, done) => {
    if (typeof id !== 'number') return done(null, false);
    findUser(db, id).then((u) => done(null, u ? publicUser(u) : false), (err: Error) => done(err));
  });
  return passport;
}

export type { PassportInstance };
