import { pgTable, serial, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';

// Tables are added here and turned into SQL migrations with `npm run db:generate`.

export const users = pgTable(
  'users',
  {
    id: serial('id').primaryKey(),
    provider: text('provider').notNull().default('github'),
    providerId: text('provider_id').notNull(),
    login: text('login').notNull(),
    name: text('name'),
    email: text('email'),
    avatarUrl: text('avatar_url'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('users_provider_id_idx').on(t.provider, t.providerId)],
);
