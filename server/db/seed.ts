import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Database } from './client';
import { memberships, projects, revisions, users, type ProjectRole } from './schema';
import { demoProjects, fallbackSheet } from './demo-projects';

/** Demo users (invented people; demo data). Idempotent: re-seeding changes nothing. */
export const demoUsers = [
  { providerId: 'demo-1001', login: 'ada-demo', name: 'Ada Okafor (demo)', email: 'ada-demo@tapline.local' },
  { providerId: 'demo-1002', login: 'ben-demo', name: 'Ben Lindqvist (demo)', email: 'ben-demo@tapline.local' },
  { providerId: 'demo-1003', login: 'chen-demo', name: 'Chen Wei (demo)', email: 'chen-demo@tapline.local' },
] as const;

const examplesDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../examples');

/** The example sheet file, or a small divider of our own when examples/ does not have it. */
function exampleSheet(file: string, title: string): Record<string, unknown> {
  try {
    return JSON.parse(fs.readFileSync(path.join(examplesDir, file), 'utf8')) as Record<string, unknown>;
  } catch {
    return fallbackSheet(title);
  }
}

/** Writes the demo users and demo projects (fixed ids, so re-seeding changes nothing). */
export async function seedDemo(database: Database): Promise<void> {
  const db = database.db;
  await db.insert(users).values(demoUsers.map((u) => ({ ...u, provider: 'github' }))).onConflictDoNothing();
  const rows = await db.select({ id: users.id, login: users.login }).from(users);
  const idOf = (login: string) => rows.find((r) => r.login === login)?.id;

  for (const demo of demoProjects) {
    const owner = idOf(demo.members.find((m) => m.role === 'owner')!.login);
    const sheet = exampleSheet(demo.example, demo.title);
    const inserted = await db.insert(projects)
      .values({ id: demo.id, title: demo.title, sheet, createdBy: owner, updatedBy: owner })
      .onConflictDoNothing()
      .returning({ id: projects.id });
    if (inserted.length === 0) continue;
    const members = demo.members
      .map((m) => ({ projectId: demo.id, userId: idOf(m.login), role: m.role as ProjectRole }))
      .filter((m): m is { projectId: string; userId: number; role: ProjectRole } => m.userId !== undefined);
    await db.insert(memberships).values(members).onConflictDoNothing();
    for (const label of demo.revisions ?? []) {
      await db.insert(revisions).values({ projectId: demo.id, label, kind: 'named', sheet, projectVersion: 1, createdBy: owner });
    }
  }
}
