import { and, desc, eq, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../db/client';
import { memberships, projects, users, type Project, type ProjectRole } from '../db/schema';

export interface ProjectListItem {
  id: string;
  title: string;
  role: ProjectRole;
  version: number;
  createdAt: Date;
  updatedAt: Date;
  updatedBy: { login: string; name: string | null } | null;
  memberCount: number;
  partCount: number;
}

const editor = alias(users, 'editor');

/** The caller's projects, most recently changed first. */
export async function listProjects(db: Db, userId: number): Promise<ProjectListItem[]> {
  const rows = await db
    .select({
      id: projects.id,
      title: projects.title,
      role: memberships.role,
      version: projects.version,
      createdAt: projects.createdAt,
      updatedAt: projects.updatedAt,
      editorLogin: editor.login,
      editorName: editor.name,
      memberCount: sql<number>`(select count(*)::int from memberships m2 where m2.project_id = ${projects.id})`,
      partCount: sql<number>`coalesce(jsonb_array_length(case when jsonb_typeof(${projects.sheet}->'parts') = 'array' then ${projects.sheet}->'parts' end), 0)`,
    })
    .from(memberships)
    .innerJoin(projects, eq(projects.id, memberships.projectId))
    .leftJoin(editor, eq(editor.id, projects.updatedBy))
    .where(eq(memberships.userId, userId))
    .orderBy(desc(projects.updatedAt));
  return rows.map(({ editorLogin, editorName, ...r }) => ({
    ...r,
    updatedBy: editorLogin ? { login: editorLogin, name: editorName } : null,
  }));
}

/** Creates a project with its creator as owner, in one transaction. */
export async function createProject(db: Db, userId: number, title: string, sheet: unknown): Promise<Project> {
  return db.transaction(async (tx) => {
    const [p] = await tx.insert(projects).values({ title, sheet, createdBy: userId, updatedBy: userId }).returning();
    await tx.insert(memberships).values({ projectId: p.id, userId, role: 'owner' });
    return p;
  });
}

export interface ProjectChange {
  title?: string;
  sheet?: unknown;
}

/**
 * Applies a change only if the project is still at `baseVersion` (optimistic concurrency); a sheet
 * change bumps the version. Returns null when someone else changed it first.
 */
export async function updateProject(db: Db, id: string, baseVersion: number, change: ProjectChange, userId: number): Promise<Project | null> {
  const [p] = await db
    .update(projects)
    .set({
      ...(change.title !== undefined ? { title: change.title } : {}),
      ...(change.sheet !== undefined ? { sheet: change.sheet, version: sql`${projects.version} + 1` } : {}),
      updatedAt: sql`now()`,
      updatedBy: userId,
    })
    .where(and(eq(projects.id, id), eq(projects.version, baseVersion)))
    .returning();
  return p ?? null;
}

export async function deleteProject(db: Db, id: string): Promise<void> {
  await db.delete(projects).where(eq(projects.id, id));
}

export async function userSummary(db: Db, userId: number | null): Promise<{ id: number; login: string; name: string | null } | null> {
  if (userId === null) return null;
  const [u] = await db.select({ id: users.id, login: users.login, name: users.name }).from(users).where(eq(users.id, userId));
  return u ?? null;
}
