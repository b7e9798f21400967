import { rateLimit, type RateLimitRequestHandler } from 'express-rate-limit';
import type { Config } from '../config';
import { HttpError } from '../http-errors';

const FIFTEEN_MINUTES_MS = 15 * 60 * 1000;
const HOUR_MS = 60 * 60 * 1000;

/** Sign-in attempts per client address (the start and the callback both count). */
export function signInLimiter(config: Config): RateLimitRequestHandler {
  return rateLimit({
    windowMs: FIFTEEN_MINUTES_MS,
    limit: config.RATE_LIMIT_SIGNIN,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).type('text').send('Too many sign-in attempts from this address. Wait 15 minutes and try again.');
    },
  });
}

/** Invitations per signed-in user: e-mail is the one thing here that reaches outsiders. */
export function invitationLimiter(config: Config): RateLimitRequestHandler {
  return rateLimit({
    windowMs: HOUR_MS,
    limit: config.RATE_LIMIT_INVITATIONS,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `user:${req.user?.id ?? 'none'}`,
    handler: (_req, _res, next) => {
      next(new HttpError(429, 'rate_limited', `You have sent ${config.RATE_LIMIT_INVITATIONS} invitations in the last hour, the limit. Try again later.`));
    },
  });
}
