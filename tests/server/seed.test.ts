import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { parseSheet } from '../../shared/sheet/parse';
import { memberships, projects, revisions } from '../../server/db/schema';
import { seedDemo } from '../../server/db/seed';
import { demoProjects, fallbackSheet } from '../../server/db/demo-projects';
import { createTestDatabase, type TestDatabase } from '../support/db';

let t: TestDatabase;
beforeAll(async () => { t = await createTestDatabase(); });
afterAll(async () => { await t?.drop(); });

describe('demo seed', () => {
  it('writes demo projects with valid sheets and a mix of roles, idempotently', async () => {
    await seedDemo(t.database);
    await seedDemo(t.database);
    const rows = await t.database.db.select().from(projects);
    expect(rows.map((p) => p.id).sort()).toEqual(demoProjects.map((p) => p.id).sort());
    for (const p of rows) {
      expect(p.title).toMatch(/\(demo\)$/);
      const parsed = parseSheet(p.sheet);
      expect(parsed.ok, `${p.title}: ${parsed.ok ? '' : parsed.error.message}`).toBe(true);
    }
    const roles = await t.database.db.select().from(memberships);
    expect(new Set(roles.map((m) => m.role))).toEqual(new Set(['owner', 'editor', 'viewer']));
    expect(await t.database.db.select().from(revisions).where(eq(revisions.projectId, demoProjects[0].id))).toHaveLength(1);
  });

  it('has a fallback sheet that is itself valid', () => {
    expect(parseSheet(fallbackSheet('x')).ok).toBe(true);
  });
});
