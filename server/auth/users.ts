import { eq, sql } from 'drizzle-orm';
import type { Profile } from 'passport';
import type { Db } from '../db/client';
import { users, type User } from '../db/schema';

/** The signed-in person as the API shows them (`GET /api/me`). */
export interface PublicUser {
  id: number;
  login: string;
  name: string | null;
  email: string | null;
  avatarUrl: string | null;
}

export function publicUser(u: User): PublicUser {
  return { id: u.id, login: u.login, name: u.name, email: u.email, avatarUrl: u.avatarUrl };
}

/** Creates or refreshes the user row for a provider profile (login, name, e-mail and avatar may change there). */
export async function upsertUserFromProfile(db: Db, profile: Profile): Promise<User> {
  const json = ((profile as { _json?: Record<string, unknown> })._json ?? {}) as Record<string, unknown>;
  const values = {
    provider: 'github',
    providerId: String(profile.id),
    login: profile.username ?? String(json.login ?? profile.id),
    name: profile.displayName || (typeof json.name === 'string' ? json.name : null),
    email: profile.emails?.[0]?.value ?? (typeof json.email === 'string' ? json.email : null),
    avatarUrl: profile.photos?.[0]?.value ?? (typeof json.avatar_url === 'string' ? json.avatar_url : null),
  };
  const [row] = await db
    .insert(users)
    .values(values)
    .onConflictDoUpdate({
      target: [users.provider, users.providerId],
      set: {
        login: values.login,
        name: values.name,
        email: sql`coalesce(${values.email}, ${users.email})`,
        avatarUrl: values.avatarUrl,
      },
    })
    .returning();
  return row;
}

export async function findUser(db: Db, id: number): Promise<User | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, id));
  return row;
}
