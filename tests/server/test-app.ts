import type { Express } from 'express';
import { desc } from 'drizzle-orm';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { devMail } from '../../server/db/schema';
import { startMail, type Mail } from '../../server/mail/mailer';
import { createTestDatabase, type TestDatabase } from '../support/db';

export interface TestApp {
  app: Express;
  t: TestDatabase;
  config: Config;
  mail: Mail | null;
  /** Messages the local SMTP sink received, newest first. */
  mailbox(): Promise<(typeof devMail.$inferSelect)[]>;
  close(): Promise<void>;
}

/**
 * A fresh database and an app on it, with the fake OAuth provider (no hosted app configured) and
 * the local SMTP sink. `env` overrides configuration (e.g. RATE_LIMIT_INVITATIONS).
 */
export async function startTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const t = await createTestDatabase();
  const config = loadConfig({ DATABASE_URL: t.url, NODE_ENV: 'test', RATE_LIMIT_SIGNIN: '1000', RATE_LIMIT_INVITATIONS: '1000', ...env });
  const mail = await startMail(config, t.database);
  const app = createApp({ config, database: t.database, mail });
  return {
    app,
    t,
    config,
    mail,
    mailbox: () => t.database.db.select().from(devMail).orderBy(desc(devMail.id)),
    close: async () => {
      await mail?.close();
      await t.drop();
    },
  };
}
