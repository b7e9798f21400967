// `npm run seed`: writes the demo data (idempotent) into DATABASE_URL.
import { openDatabase } from './client';
import { seedDemo } from './seed';

const url = process.env.DATABASE_URL;
if (!url) {
  process.stderr.write('tapline: DATABASE_URL is not set.\n  What to do: run through `npm start`, or set DATABASE_URL.\n');
  process.exit(1);
}
const database = openDatabase(url, 1);
try {
  await seedDemo(database);
} catch (err) {
  process.stderr.write(`tapline: seeding failed: ${(err as Error).message}\n  What to do: run the migrations first (npm run db:migrate).\n`);
  process.exitCode = 1;
} finally {
  await database.close();
}
