import type { Database } from './client';
import { users } from './schema';

/** Demo users (invented people; demo data). Idempotent: re-seeding changes nothing. */
export const demoUsers = [
  { providerId: 'demo-1001', login: 'ada-demo', name: 'Ada Okafor (demo)', email: 'ada-demo@tapline.local' },
  { providerId: 'demo-1002', login: 'ben-demo', name: 'Ben Lindqvist (demo)', email: 'ben-demo@tapline.local' },
  { providerId: 'demo-1003', login: 'chen-demo', name: 'Chen Wei (demo)', email: 'chen-demo@tapline.local' },
] as const;

export async function seedDemo(database: Database): Promise<void> {
  await database.db
    .insert(users)
    .values(demoUsers.map((u) => ({ ...u, provider: 'github' })))
    .onConflictDoNothing();
}
