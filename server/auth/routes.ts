import { Router, type NextFunction, type Request, type Response } from 'express';
import type { RateLimitRequestHandler } from 'express-rate-limit';
import { usesRealOAuth, type Config } from '../config';
import { demoLogins } from './fake-provider/directory';
import type { PassportInstance } from './passport';
import { safeReturnTo } from './return-to';
import { SESSION_COOKIE } from './session';
import type { StrategyFor } from './strategy';
import { requireUser, currentUser } from './current-user';

declare module 'express-session' {
  interface SessionData {
    returnTo?: string;
  }
}

/** Turns a failed callback into a short code the sign-in page explains. */
function failureCode(err: unknown, info: unknown): string {
  const name = (err as { name?: string } | null)?.name;
  if (name === 'TokenError' || name === 'InternalOAuthError') return 'provider';
  const message = (info as { message?: string } | undefined)?.message ?? '';
  if (/state/i.test(message)) return 'state';
  return 'failed';
}

interface AuthRouterDeps {
  config: Config;
  passport: PassportInstance;
  strategyFor: StrategyFor;
  signInLimiter: RateLimitRequestHandler;
}

/** `/auth/github`, `/auth/github/callback`, `POST /auth/logout`. */
export function authRouter({ passport, strategyFor, signInLimiter }: AuthRouterDeps): Router {
  const r = Router();

  r.get('/github', signInLimiter, (req, res, next) => {
    req.session.returnTo = safeReturnTo(req.query.returnTo);
    const login = typeof req.query.login === 'string' ? req.query.login : undefined;
    passport.authenticate(strategyFor(req), { login } as object)(req, res, next);
  });

  r.get('/github/callback', signInLimiter, (req: Request, res: Response, next: NextFunction) => {
    if (typeof req.query.error === 'string') {
      res.redirect(302, `/sign-in?error=${req.query.error === 'access_denied' ? 'cancelled' : 'provider'}`);
      return;
    }
    passport.authenticate(strategyFor(req), (err: unknown, user: Express.User | false, info: unknown) => {
      if (err || !user) {
        if (err && failureCode(err, info) === 'failed') console.error('sign-in failed:', err);
        res.redirect(302, `/sign-in?error=${failureCode(err, info)}`);
        return;
      }
      const returnTo = safeReturnTo(req.session.returnTo);
      // passport regenerates the session id here (no session fixation).
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        res.redirect(302, returnTo);
      });
    })(req, res, next);
  });

  r.post('/logout', (req, res, next) => {
    const finish = () => {
      res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure: req.secure });
      res.status(204).end();
    };
    req.logout((err) => {
      if (err) return next(err);
      if (!req.session) return finish();
      req.session.destroy((destroyErr) => (destroyErr ? next(destroyErr) : finish()));
    });
  });

  return r;
}

/** `GET /api/me` and `GET /api/auth/providers` (what the sign-in page offers). */
export function meRouter(config: Config): Router {
  const r = Router();
  r.get('/me', requireUser, (req, res) => {
    res.json(currentUser(req));
  });
  r.get('/auth/providers', (_req, res) => {
    const real = usesRealOAuth(config);
    res.json({ mode: real ? 'github' : 'fake', demoLogins: real ? [] : demoLogins() });
  });
  return r;
}
