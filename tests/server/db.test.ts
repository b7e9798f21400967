import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { createTestDatabase, type TestDatabase } from '../support/db';
import { users } from '../../server/db/schema';
import { seedDemo, demoUsers } from '../../server/db/seed';

let t: TestDatabase;
beforeAll(async () => { t = await createTestDatabase(); });
afterAll(async () => { await t?.drop(); });

describe('database through Drizzle (real PostgreSQL)', () => {
  it('has the committed migrations applied', async () => {
    const r = await t.database.db.execute(sql`select count(*)::int as n from drizzle.__drizzle_migrations`);
    expect((r.rows[0] as { n: number }).n).toBeGreaterThan(0);
  });

  it('writes a row and reads it back', async () => {
    const [row] = await t.database.db.insert(users)
      .values({ providerId: 'test-42', login: 'probe', name: 'Probe User', email: 'probe@example.test' })
      .returning();
    const [back] = await t.database.db.select().from(users).where(eq(users.id, row.id));
    expect(back.login).toBe('probe');
    expect(back.createdAt).toBeInstanceOf(Date);
  });

  it('seeds the demo users idempotently', async () => {
    await seedDemo(t.database);
    await seedDemo(t.database);
    const rows = await t.database.db.select().from(users).where(eq(users.login, demoUsers[0].login));
    expect(rows).toHaveLength(1);
  });
});
