import type { RequestHandler } from 'express';
import { HttpError } from '../http-errors';
import type { PublicUser } from './users';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport puts the deserialized user here.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends PublicUser {}
  }
}

/** Answers 401 unless somebody is signed in. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) {
    next(new HttpError(401, 'signed_out', 'You are not signed in. Sign in and try again.'));
    return;
  }
  next();
};

/** The signed-in user of a request that passed `requireUser`. */
export function currentUser(req: Express.Request): PublicUser {
  if (!req.user) throw new HttpError(401, 'signed_out', 'You are not signed in. Sign in and try again.');
  return req.user;
}
