import { Router } from 'express';
import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';

/** How long a health check waits for the database before it answers 503, ms. */
export const HEALTH_TIMEOUT_MS = 2000;

function withTimeout<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer in ${ms} ms`)), ms);
  });
  return Promise.race([work, late]).finally(() => clearTimeout(timer));
}

/**
 * `GET /api/health`: answers `{ ok, db }` after a real query, 503 when the database is away.
 * Bounded in time, so a load balancer's probe gets an answer even when the database hangs.
 */
export function healthRouter(database: Database): Router {
  const r = Router();
  r.get('/health', async (_req, res) => {
    try {
      await withTimeout(database.db.execute(sql`select 1`), HEALTH_TIMEOUT_MS);
      res.json({ ok: true, db: true });
    } catch (err) {
      res.status(503).json({ ok: false, db: false, error: { code: 'db_unavailable', message: `Database unreachable: ${(err as Error).message}` } });
    }
  });
  return r;
}
