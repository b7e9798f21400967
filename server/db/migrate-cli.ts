// `npm run db:migrate`: applies drizzle/ migrations to DATABASE_URL.
import { openDatabase } from './client';
import { applyMigrations } from './migrate';

const url = process.env.DATABASE_URL;
if (!url) {
  process.stderr.write('tapline: DATABASE_URL is not set.\n  What to do: run through `npm start`, or set DATABASE_URL=postgres://...\n');
  process.exit(1);
}
const database = openDatabase(url, 1);
try {
  await applyMigrations(database);
} catch (err) {
  process.stderr.write(`tapline: applying migrations failed: ${(err as Error).message}\n  What to do: check DATABASE_URL and that the database is reachable.\n`);
  process.exitCode = 1;
} finally {
  await database.close();
}
