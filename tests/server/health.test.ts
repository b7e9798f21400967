import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestDatabase, type TestDatabase } from '../support/db';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { openDatabase } from '../../server/db/client';

let t: TestDatabase;
beforeAll(async () => { t = await createTestDatabase(); });
afterAll(async () => { await t?.drop(); });

describe('GET /api/health', () => {
  it('reports the database after a real query', async () => {
    const app = createApp({ config: loadConfig({ DATABASE_URL: t.url, NODE_ENV: 'test' }), database: t.database });
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: true });
  });

  it('answers 503 with a reason when the database is unreachable', async () => {
    // Port 9 (discard) on loopback: nothing listens there, so the connection is refused at once.
    const dead = openDatabase('postgres://nobody@127.0.0.1:9/none', 1);
    const app = createApp({ config: loadConfig({ DATABASE_URL: t.url, NODE_ENV: 'test' }), database: dead });
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body.db).toBe(false);
    expect(res.body.error.code).toBe('db_unavailable');
    await dead.close();
  });

  it('answers unknown API routes with a JSON 404', async () => {
    const app = createApp({ config: loadConfig({ DATABASE_URL: t.url, NODE_ENV: 'test' }), database: t.database });
    const res = await request(app).get('/api/nope');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
