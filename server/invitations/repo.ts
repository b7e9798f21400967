import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { invitations, projects, users, type Invitation, type ProjectRole } from '../db/schema';
import { addOrRaiseMember } from '../members/repo';
import { hashInvitationToken } from './tokens';

export async function insertInvitation(db: Db, v: { projectId: string; email: string; role: ProjectRole; tokenHash: string; invitedBy: number; expiresAt: Date }): Promise<Invitation> {
  const [row] = await db.insert(invitations).values(v).returning();
  return row;
}

export async function deleteInvitation(db: Db, projectId: string, id: string): Promise<boolean> {
  const rows = await db.delete(invitations).where(and(eq(invitations.projectId, projectId), eq(invitations.id, id))).returning({ id: invitations.id });
  return rows.length > 0;
}

/** Invitations not yet accepted (expired ones included, marked by `expiresAt`). */
export async function listPendingInvitations(db: Db, projectId: string) {
  return db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, createdAt: invitations.createdAt, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(eq(invitations.projectId, projectId), isNull(invitations.acceptedAt)))
    .orderBy(desc(invitations.createdAt));
}

export type InvitationStatus = 'pending' | 'accepted' | 'expired';

/** What the accept page shows about a token, or null for an unknown token. */
export async function describeInvitation(db: Db, token: string) {
  const [row] = await db
    .select({ inv: invitations, projectTitle: projects.title, inviterLogin: users.login, inviterName: users.name })
    .from(invitations)
    .innerJoin(projects, eq(projects.id, invitations.projectId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, hashInvitationToken(token)));
  if (!row) return null;
  const status: InvitationStatus = row.inv.acceptedAt ? 'accepted' : row.inv.expiresAt.getTime() <= Date.now() ? 'expired' : 'pending';
  return {
    projectId: row.inv.projectId,
    projectTitle: row.projectTitle,
    role: row.inv.role,
    email: row.inv.email,
    invitedBy: row.inviterLogin ? { login: row.inviterLogin, name: row.inviterName } : null,
    expiresAt: row.inv.expiresAt,
    status,
  };
}

export type AcceptResult = { ok: true; projectId: string; role: ProjectRole } | { ok: false; reason: 'unknown' | 'accepted' | 'expired' };

/**
 * Accepts an invitation once: the row is claimed with a conditional update (not yet accepted, not
 * expired) in the same transaction that adds the membership, so a link cannot be used twice.
 */
export async function acceptInvitation(db: Db, token: string, userId: number): Promise<AcceptResult> {
  const hash = hashInvitationToken(token);
  return db.transaction(async (tx) => {
    const [claimed] = await tx
      .update(invitations)
      .set({ acceptedAt: sql`now()`, acceptedBy: userId })
      .where(and(eq(invitations.tokenHash, hash), isNull(invitations.acceptedAt), gt(invitations.expiresAt, sql`now()`)))
      .returning();
    if (!claimed) {
      const [row] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hash));
      return { ok: false, reason: !row ? 'unknown' : row.acceptedAt ? 'accepted' : 'expired' } as const;
    }
    const role = await addOrRaiseMember(tx, claimed.projectId, userId, claimed.role);
    return { ok: true, projectId: claimed.projectId, role } as const;
  });
}
