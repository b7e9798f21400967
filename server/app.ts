import express, { type Express, type RequestHandler } from 'express';
import { usesRealOAuth, type Config } from './config';
import type { Database } from './db/client';
import { healthRouter } from './routes/health';
import { errorHandler, notFoundApi } from './http-errors';
import { mountClient } from './static';
import { createSessions } from './auth/session';
import { createPassport } from './auth/passport';
import { createStrategyFactory } from './auth/strategy';
import { authRouter, meRouter } from './auth/routes';
import { fakeProviderRouter } from './auth/fake-provider/routes';
import { createCsrf } from './security/csrf';
import { securityHeaders } from './security/headers';
import { requireBodyType } from './security/body-types';
import { invitationLimiter, signInLimiter } from './security/rate-limits';
import { projectAccessGuard } from './authz/project-access';
import { projectsRouter } from './projects/routes';
import { importExportRouter } from './projects/import-export';
import { shareRouter } from './projects/share';
import { membersRouter } from './members/routes';
import { invitationsRouter } from './invitations/routes';
import { revisionsRouter } from './revisions/routes';
import { mailboxRouter } from './mail/mailbox';
import type { Mail } from './mail/mailer';

export interface AppDeps {
  config: Config;
  database: Database;
  /** Folder of the built client; omitted in API-only tests. */
  staticDir?: string;
  /** Outgoing mail (see `startMail`); without it invitations answer 503. */
  mail?: Mail | null;
}

/** Largest JSON body the API reads; a sheet of a few hundred parts is well under 100 kB. */
export const JSON_LIMIT = '1mb';

/**
 * The session cookie → `req.user` chain of an app made by `createApp`, for reuse outside Express
 * routes, e.g. `for (const h of sessionHandlersOf(app)) io.engine.use(h)` for socket.io.
 */
export function sessionHandlersOf(app: Express): RequestHandler[] {
  return app.locals.sessionHandlers as RequestHandler[];
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const { config, database } = deps;
  const db = database.db;
  const mail = deps.mail ?? null;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(securityHeaders(config));

  // API answers are per-person: never let a shared cache keep them.
  app.use('/api', (_req, res, next) => { res.setHeader('Cache-Control', 'no-store'); next(); });
  app.use('/api', healthRouter(database));
  if (!usesRealOAuth(config)) app.use('/fake-oauth', fakeProviderRouter());
  if (mail?.toSink) app.use('/dev', mailboxRouter(db));

  const sessions = createSessions(config, database);
  const passport = createPassport(db);
  const csrf = createCsrf();
  const sessionHandlers: RequestHandler[] = [sessions.middleware, passport.initialize(), passport.session()];
  app.locals.sessionHandlers = sessionHandlers;
  app.use(sessionHandlers);
  app.use('/api', requireBodyType);
  app.use(express.json({ limit: JSON_LIMIT }));

  app.use('/auth/logout', csrf.protect);
  app.use('/auth', authRouter({ config, passport, strategyFor: createStrategyFactory(config, db), signInLimiter: signInLimiter(config) }));

  const requireProjectRole = projectAccessGuard(db);
  app.use('/api', csrf.tokenRouter);
  app.use('/api', csrf.protect);
  app.use('/api', meRouter(config));
  app.use('/api', importExportRouter(db, requireProjectRole));
  app.use('/api', projectsRouter(db, requireProjectRole));
  app.use('/api', membersRouter(db, requireProjectRole));
  app.use('/api', invitationsRouter({ config, db, mail, requireProjectRole, limiter: invitationLimiter(config) }));
  app.use('/api', revisionsRouter(db, requireProjectRole));
  app.use('/api', shareRouter(db, requireProjectRole));
  app.use('/api', notFoundApi);

  if (deps.staticDir) mountClient(app, deps.staticDir);
  app.use(errorHandler);
  return app;
}
