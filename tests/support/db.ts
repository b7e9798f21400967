import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { inject } from 'vitest';
import { openDatabase, type Database } from '../../server/db/client';
import { applyMigrations } from '../../server/db/migrate';

export interface TestDatabase {
  url: string;
  database: Database;
  /** Closes the pool and drops the database. */
  drop(): Promise<void>;
}

function withDb(adminUrl: string, name: string): string {
  const u = new URL(adminUrl);
  u.pathname = `/${name}`;
  return u.toString();
}

/** A fresh, migrated database of its own for one test file (real PostgreSQL, never a mock). */
export async function createTestDatabase(): Promise<TestDatabase> {
  const adminUrl = inject('adminUrl');
  const name = `tapline_t_${process.pid}_${randomBytes(4).toString('hex')}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  await admin.end();
  const url = withDb(adminUrl, name);
  const database = openDatabase(url, 5);
  await applyMigrations(database);
  return {
    url,
    database,
    async drop() {
      await database.close();
      const a = new pg.Client({ connectionString: adminUrl });
      await a.connect();
      await a.query(`drop database if exists "${name}" with (force)`);
      await a.end();
    },
  };
}
