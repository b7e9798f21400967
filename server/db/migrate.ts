import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import type { Database } from './client';

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

/** Applies the committed SQL migrations in drizzle/ (idempotent). */
export async function applyMigrations(database: Database): Promise<void> {
  await migrate(database.db, { migrationsFolder });
}
