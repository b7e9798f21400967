import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import type { Config } from '../config';
import type { Database } from '../db/client';

export const SESSION_COOKIE = 'tapline.sid';
const TWO_WEEKS_MS = 14 * 24 * 3600 * 1000;

export interface Sessions {
  middleware: RequestHandler;
  close(): void;
}

/**
 * Sessions in PostgreSQL (connect-pg-simple, table from our own migration). The cookie is httpOnly,
 * SameSite=Lax (sent on the top-level redirect back from the provider, not on cross-site posts)
 * and Secure in production.
 */
export function createSessions(config: Config, database: Database): Sessions {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool: database.pool,
    tableName: 'session',
    createTableIfMissing: false,
    // Tests open and drop many databases; pruning on a timer would outlive them.
    pruneSessionInterval: config.NODE_ENV === 'test' ? false : 15 * 60,
    errorLog: (...args: unknown[]) => console.error('session store:', ...args),
  });
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.NODE_ENV === 'production',
      maxAge: TWO_WEEKS_MS,
      path: '/',
    },
  });
  return { middleware, close: () => store.close() };
}
