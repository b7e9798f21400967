import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { projects, revisions, users, type Project, type Revision } from '../db/schema';

const summary = {
  id: revisions.id,
  label: revisions.label,
  kind: revisions.kind,
  projectVersion: revisions.projectVersion,
  restoredFrom: revisions.restoredFrom,
  createdAt: revisions.createdAt,
  createdByLogin: users.login,
  createdByName: users.name,
};

type SummaryRow = { createdByLogin: string | null; createdByName: string | null } & Omit<Revision, 'sheet' | 'projectId' | 'createdBy'>;

function present<T extends SummaryRow>({ createdByLogin, createdByName, ...r }: T) {
  return { ...r, createdBy: createdByLogin ? { login: createdByLogin, name: createdByName } : null };
}

/** A project's revisions, newest first, without their sheets. */
export async function listRevisions(db: Db, projectId: string) {
  const rows = await db.select(summary).from(revisions).leftJoin(users, eq(users.id, revisions.createdBy))
    .where(eq(revisions.projectId, projectId)).orderBy(desc(revisions.createdAt), desc(revisions.projectVersion));
  return rows.map(present);
}

/** One revision with its sheet, or null when it is not this project's. */
export async function getRevision(db: Db, projectId: string, revisionId: string) {
  const [row] = await db.select({ ...summary, sheet: revisions.sheet }).from(revisions).leftJoin(users, eq(users.id, revisions.createdBy))
    .where(and(eq(revisions.projectId, projectId), eq(revisions.id, revisionId)));
  return row ? present(row) : null;
}

/** Saves the project's current sheet under a name. */
export async function saveRevision(db: Db, project: Project, label: string, userId: number) {
  const [row] = await db.insert(revisions)
    .values({ projectId: project.id, label, kind: 'named', sheet: project.sheet, projectVersion: project.version, createdBy: userId })
    .returning();
  return row;
}

export type RestoreResult =
  | { ok: true; project: Project; revision: Revision }
  | { ok: false; reason: 'not_found' | 'conflict'; currentVersion?: number };

/**
 * Restores a revision's sheet as a new version of the project. Recorded twice, so it can itself be
 * undone: an `auto` revision of the sheet as it was just before, then a `restore` revision.
 */
export async function restoreRevision(db: Db, projectId: string, revisionId: string, userId: number, baseVersion?: number): Promise<RestoreResult> {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(projects).where(eq(projects.id, projectId)).for('update');
    const [rev] = await tx.select().from(revisions).where(and(eq(revisions.projectId, projectId), eq(revisions.id, revisionId)));
    if (!current || !rev) return { ok: false, reason: 'not_found' } as const;
    if (baseVersion !== undefined && baseVersion !== current.version) return { ok: false, reason: 'conflict', currentVersion: current.version } as const;
    await tx.insert(revisions).values({
      projectId, label: `Before restoring “${rev.label}”`, kind: 'auto', sheet: current.sheet, projectVersion: current.version, createdBy: userId,
    });
    const [updated] = await tx.update(projects)
      .set({ sheet: rev.sheet, version: current.version + 1, updatedAt: new Date(), updatedBy: userId })
      .where(eq(projects.id, projectId)).returning();
    const [record] = await tx.insert(revisions).values({
      projectId, label: `Restored “${rev.label}”`, kind: 'restore', sheet: rev.sheet, projectVersion: updated.version, restoredFrom: rev.id, createdBy: userId,
    }).returning();
    return { ok: true, project: updated, revision: record } as const;
  });
}
