import { Router } from 'express';
import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';

/** `GET /api/health`: answers `{ ok, db }` after a real query, 503 when the database is away. */
export function healthRouter(database: Database): Router {
  const r = Router();
  r.get('/health', async (_req, res) => {
    try {
      await database.db.execute(sql`select 1`);
      res.json({ ok: true, db: true });
    } catch (err) {
      res.status(503).json({ ok: false, db: false, error: { code: 'db_unavailable', message: `Database unreachable: ${(err as Error).message}` } });
    }
  });
  return r;
}
