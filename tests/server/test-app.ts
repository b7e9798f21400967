import type { Express } from 'express';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { createTestDatabase, type TestDatabase } from '../support/db';

export interface TestApp {
  app: Express;
  t: TestDatabase;
  config: Config;
  close(): Promise<void>;
}

/** A fresh database and an app on it, with the fake OAuth provider (no hosted app configured). */
export async function startTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const t = await createTestDatabase();
  const config = loadConfig({ DATABASE_URL: t.url, NODE_ENV: 'test', RATE_LIMIT_SIGNIN: '1000', ...env });
  const app = createApp({ config, database: t.database });
  return { app, t, config, close: () => t.drop() };
}
