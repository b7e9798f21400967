import { and, asc, eq, sql } from 'drizzle-orm';
import type { Db, DbOrTx } from '../db/client';
import { memberships, users, type ProjectRole } from '../db/schema';

export interface Member {
  userId: number;
  login: string;
  name: string | null;
  avatarUrl: string | null;
  role: ProjectRole;
  joinedAt: Date;
}

export async function listMembers(db: DbOrTx, projectId: string): Promise<Member[]> {
  return db
    .select({ userId: users.id, login: users.login, name: users.name, avatarUrl: users.avatarUrl, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.projectId, projectId))
    .orderBy(asc(memberships.createdAt));
}

export type MemberChange = { ok: true; member: Member } | { ok: false; reason: 'not_member' | 'last_owner' };

/**
 * Changes a member's role, or removes them (role null), in a transaction that locks the project's
 * memberships, so two owners demoting each other at once cannot leave the project ownerless.
 */
export async function changeMember(db: Db, projectId: string, userId: number, role: ProjectRole | null): Promise<MemberChange | { ok: true; member: null }> {
  return db.transaction(async (tx) => {
    const rows = await tx.select().from(memberships).where(eq(memberships.projectId, projectId)).for('update');
    const target = rows.find((m) => m.userId === userId);
    if (!target) return { ok: false, reason: 'not_member' } as const;
    const owners = rows.filter((m) => m.role === 'owner').length;
    if (target.role === 'owner' && role !== 'owner' && owners <= 1) return { ok: false, reason: 'last_owner' } as const;
    const where = and(eq(memberships.projectId, projectId), eq(memberships.userId, userId));
    if (role === null) {
      await tx.delete(memberships).where(where);
      return { ok: true, member: null } as const;
    }
    await tx.update(memberships).set({ role }).where(where);
    const [m] = (await listMembers(tx, projectId)).filter((x) => x.userId === userId);
    return { ok: true, member: m } as const;
  });
}

/**
 * Adds a member with `role`, or raises an existing member to it; an invitation never lowers a role.
 * Returns the role the user has afterwards.
 */
export async function addOrRaiseMember(db: DbOrTx, projectId: string, userId: number, role: ProjectRole): Promise<ProjectRole> {
  const [row] = await db
    .insert(memberships)
    .values({ projectId, userId, role })
    .onConflictDoUpdate({
      target: [memberships.projectId, memberships.userId],
      set: { role: sql`case when ${memberships.role} < excluded.role then excluded.role else ${memberships.role} end` },
    })
    .returning({ role: memberships.role });
  return row.role;
}
