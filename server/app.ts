import express, { type Express } from 'express';
import type { Config } from './config';
import type { Database } from './db/client';
import { healthRouter } from './routes/health';
import { errorHandler, notFoundApi } from './http-errors';
import { mountClient } from './static';

export interface AppDeps {
  config: Config;
  database: Database;
  /** Folder of the built client; omitted in API-only tests. */
  staticDir?: string;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(express.json({ limit: '2mb' }));

  app.use('/api', healthRouter(deps.database));
  app.use('/api', notFoundApi);

  if (deps.staticDir) mountClient(app, deps.staticDir);
  app.use(errorHandler);
  return app;
}
